/**
 * Points grouped by draw style with a counting sort, so the map issues one fill per style per
 * frame instead of one per point.
 * @param styleOf style index of each point (≥ 0)
 * @param styleCount number of styles
 * @returns `order` (point indices grouped by style) and `start` (style s occupies order[start[s]..start[s+1]))
 */
export function bucketByStyle(styleOf: Int32Array, styleCount: number): { order: Uint32Array; start: Uint32Array } {
  const start = new Uint32Array(styleCount + 1);
  for (let i = 0; i < styleOf.length; i++) {
    const s = styleOf[i];
    if (s < 0 || s >= styleCount) throw new RangeError(`point ${i} has style ${s}, outside 0..${styleCount - 1}`);
    start[s + 1]++;
  }
  for (let s = 0; s < styleCount; s++) start[s + 1] += start[s];
  const fill = start.slice(0, styleCount);
  const order = new Uint32Array(styleOf.length);
  for (let i = 0; i < styleOf.length; i++) order[fill[styleOf[i]]++] = i;
  return { order, start };
}
