/**
 * Shade of a heat-map cell: white to the palette's blue (Okabe–Ito #0072B2) by the share of the
 * true label's documents in the cell, so rows of different sizes compare fairly.
 * @param share fraction of the row, 0..1
 */
export function heatColour(share: number): [number, number, number] {
  const t = Math.max(0, Math.min(1, share));
  const to = [0, 114, 178];
  return [255 + (to[0] - 255) * t, 255 + (to[1] - 255) * t, 255 + (to[2] - 255) * t].map(Math.round) as [number, number, number];
}

/** One point of the abstain trade-off. */
export interface ThresholdPoint {
  threshold: number;
  precision: number;
  coverage: number;
}

/**
 * The point of a curve closest to a threshold (the curve's own thresholds are the only ones with
 * measured values).
 * @param curve points in any order
 * @param t threshold
 */
export function nearestThresholdPoint(curve: readonly ThresholdPoint[], t: number): ThresholdPoint | null {
  let best: ThresholdPoint | null = null;
  for (const p of curve) if (!best || Math.abs(p.threshold - t) < Math.abs(best.threshold - t)) best = p;
  return best;
}
