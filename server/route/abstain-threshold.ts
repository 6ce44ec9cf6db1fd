/**
 * Chooses how sure the router must be before it decides alone, from held-out decisions: the lowest
 * confidence at which the decisions at or above it reach the target precision.
 */
import type { AbstainThreshold, ThresholdPoint } from './api.js';

/** The chosen threshold and the whole trade-off it was chosen from. */
export interface ThresholdChoice {
  threshold: AbstainThreshold;
  /** Every distinct confidence, highest first, with the precision and coverage at or above it. */
  curve: ThresholdPoint[];
}

/**
 * Sweeps the distinct confidences from the highest down.
 * @param confidence held-out confidence of each decision.
 * @param correct 1 where the decision was right.
 * @param targetPrecision precision the kept decisions must reach, in (0, 1].
 */
export function abstainThreshold(confidence: ArrayLike<number>, correct: ArrayLike<number>, targetPrecision: number): ThresholdChoice {
  const n = confidence.length;
  if (n === 0) throw new RangeError('Cannot choose a threshold without any held-out decision');
  if (!(targetPrecision > 0 && targetPrecision <= 1)) throw new RangeError(`targetPrecision must be in (0, 1]; got ${targetPrecision}`);
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => confidence[b] - confidence[a] || a - b);
  const curve: ThresholdPoint[] = [];
  let right = 0;
  let best: ThresholdPoint | undefined;
  for (let k = 0; k < n; k++) {
    const i = order[k];
    right += correct[i] ? 1 : 0;
    if (k < n - 1 && confidence[order[k + 1]] === confidence[i]) continue;
    const point = { threshold: confidence[i], precision: right / (k + 1), coverage: (k + 1) / n };
    curve.push(point);
    // Lowest threshold reaching the target; the last one seen in a descending sweep.
    if (point.precision >= targetPrecision) best = point;
  }
  const chosen = best ?? curve[0];
  return {
    threshold: { value: chosen.threshold, targetPrecision, precision: chosen.precision, coverage: chosen.coverage, reached: best !== undefined },
    curve,
  };
}

/**
 * At most `maxPoints` points of a threshold curve for a chart, evenly spread over coverage; the
 * first and last points and the chosen one are always kept.
 * @param curve from {@link abstainThreshold}, thresholds descending.
 * @param maxPoints upper bound (≥ 3).
 * @param keep a threshold value that must stay on the curve.
 */
export function thinThresholdCurve(curve: ThresholdPoint[], maxPoints: number, keep?: number): ThresholdPoint[] {
  if (curve.length <= maxPoints) return curve.slice();
  const out: ThresholdPoint[] = [];
  const slots = Math.max(2, maxPoints - 2); // first, last and `keep` may each add one
  let nextCoverage = 0;
  for (let k = 0; k < curve.length; k++) {
    const p = curve[k];
    const isEnd = k === 0 || k === curve.length - 1;
    if (isEnd || p.threshold === keep || p.coverage >= nextCoverage) {
      out.push(p);
      while (nextCoverage <= p.coverage) nextCoverage += 1 / (slots - 1);
    }
  }
  return out;
}
