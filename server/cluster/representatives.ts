/**
 * Representative documents: the members nearest their cluster's centroid, skipping near-copies
 * of one already chosen, so a cluster with many identical texts does not show one text five times.
 */
import type { Dense } from '../common/matrix.js';

/**
 * Picks up to `count` representatives per cluster.
 * @param reduced unit-norm rows (zero rows for documents without content).
 * @param labels cluster index per row (rows labelled outside 0..k−1 are ignored).
 * @param k number of clusters.
 * @param closeness per row, a score that orders a cluster's members by nearness to its centroid
 *   (x · mean of the cluster, which orders them as cosine to the centroid does); NaN excludes the row.
 * @param count representatives wanted per cluster.
 * @param duplicateCosine a candidate whose cosine to a chosen one exceeds this is skipped.
 * @returns per cluster, row indices, nearest first. Fewer than `count` when the cluster has fewer
 *   members that are not near-copies of each other.
 */
export function representatives(
  reduced: Dense,
  labels: Int32Array,
  k: number,
  closeness: Float64Array,
  count: number,
  duplicateCosine: number,
): number[][] {
  const n = labels.length;
  const d = reduced.cols;
  const x = reduced.data;
  // Counting sort of the eligible rows by cluster, then each cluster's slice by closeness.
  const start = new Int32Array(k + 1);
  for (let i = 0; i < n; i++) if (labels[i] >= 0 && labels[i] < k && !Number.isNaN(closeness[i])) start[labels[i] + 1]++;
  for (let c = 0; c < k; c++) start[c + 1] += start[c];
  const members = new Int32Array(start[k]);
  const fill = start.slice(0, k);
  for (let i = 0; i < n; i++) if (labels[i] >= 0 && labels[i] < k && !Number.isNaN(closeness[i])) members[fill[labels[i]]++] = i;
  const out: number[][] = [];
  for (let c = 0; c < k; c++) {
    const slice = members.subarray(start[c], start[c + 1]);
    slice.sort((a, b) => closeness[b] - closeness[a] || a - b);
    const chosen: number[] = [];
    for (let p = 0; p < slice.length && chosen.length < count; p++) {
      const i = slice[p];
      let nearCopy = false;
      for (const j of chosen) {
        let dot = 0;
        for (let t = 0; t < d; t++) dot += x[i * d + t] * x[j * d + t];
        if (dot > duplicateCosine) {
          nearCopy = true;
          break;
        }
      }
      if (!nearCopy) chosen.push(i);
    }
    out.push(chosen);
  }
  return out;
}
