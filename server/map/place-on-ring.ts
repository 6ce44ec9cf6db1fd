/**
 * Puts the `empty` points on a small ring to the right of the `placed` points, in `positions`
 * (n×2 interleaved, written in place). The ring's radius is 5% of the placed points' width (at
 * least 0.5) and its centre lies one radius plus 10% of the width past their right edge, at their
 * vertical middle; with nothing placed, the ring is centred on the origin with radius 1.
 * Points go round the ring in index order, starting at the top.
 * @param positions n×2 positions, interleaved
 * @param placed indices of points already laid out
 * @param empty indices of points to put on the ring
 */
export function placeOnRing(positions: Float32Array, placed: readonly number[], empty: readonly number[]): void {
  let cx = 0;
  let cy = 0;
  let radius = 1;
  if (placed.length > 0) {
    let minX = Infinity;
    let maxX = -Infinity;
    let minY = Infinity;
    let maxY = -Infinity;
    for (const i of placed) {
      const px = positions[2 * i];
      const py = positions[2 * i + 1];
      if (px < minX) minX = px;
      if (px > maxX) maxX = px;
      if (py < minY) minY = py;
      if (py > maxY) maxY = py;
    }
    const width = Math.max(maxX - minX, maxY - minY);
    radius = Math.max(0.5, 0.05 * width);
    cx = maxX + 0.1 * width + radius;
    cy = (minY + maxY) / 2;
  }
  const m = empty.length;
  for (let t = 0; t < m; t++) {
    const angle = Math.PI / 2 - (2 * Math.PI * t) / m;
    positions[2 * empty[t]] = cx + (m === 1 ? 0 : radius * Math.cos(angle));
    positions[2 * empty[t] + 1] = cy + (m === 1 ? 0 : radius * Math.sin(angle));
  }
}
