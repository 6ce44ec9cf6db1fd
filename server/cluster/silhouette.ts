/**
 * Silhouettes (Rousseeuw, "Silhouettes: a graphical aid to the interpretation and validation of
 * cluster analysis", J. Comput. Appl. Math. 20, 1987): for row i in cluster A,
 * a(i) = mean distance to the other members of A, b(i) = the smallest mean distance to the members
 * of another cluster, s(i) = (b − a) / max(a, b), and s(i) = 0 when A has one member.
 * Rows labelled −1 belong to no cluster: they are skipped and get s = 0.
 */
import type { DenseView } from './api.js';
import { dot, dotRows } from './unit-sphere.js';

/** Distances the silhouette can be measured in. */
export type SilhouetteMetric = 'cosine' | 'euclidean';

/** Per-row silhouettes and their mean over clustered rows. */
export interface Silhouettes {
  samples: Float64Array;
  mean: number;
}

function checkLabels(data: DenseView, labels: Int32Array, k: number): Int32Array {
  if (labels.length !== data.rows) throw new RangeError(`labels has ${labels.length} entries for ${data.rows} rows`);
  const counts = new Int32Array(k);
  for (let i = 0; i < labels.length; i++) {
    const c = labels[i];
    if (c >= k) throw new RangeError(`label ${c} at row ${i} is outside 0..${k - 1}`);
    if (c >= 0) counts[c]++;
  }
  return counts;
}

function finish(a: number, b: number, ownCount: number): number {
  if (ownCount <= 1) return 0;
  const m = Math.max(a, b);
  return m > 0 ? (b - a) / m : 0;
}

function meanOf(samples: Float64Array, labels: Int32Array): number {
  let sum = 0;
  let count = 0;
  for (let i = 0; i < samples.length; i++) {
    if (labels[i] < 0) continue;
    sum += samples[i];
    count++;
  }
  return count > 0 ? sum / count : 0;
}

/**
 * Silhouettes straight from the definition, O(n²·d): the reference the fast form is checked
 * against, and the way to get euclidean silhouettes. Cosine distance is 1 − x·y/(‖x‖‖y‖).
 * @param data rows
 * @param labels cluster per row (−1: not clustered)
 * @param k number of clusters
 * @param metric distance
 */
export function silhouetteSamples(data: DenseView, labels: Int32Array, k: number, metric: SilhouetteMetric): Silhouettes {
  const counts = checkLabels(data, labels, k);
  const { rows: n, cols: d, data: x } = data;
  const norms = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let a = 0; a < d; a++) s += x[i * d + a] * x[i * d + a];
    norms[i] = Math.sqrt(s);
  }
  const samples = new Float64Array(n);
  const sums = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const own = labels[i];
    if (own < 0) continue;
    sums.fill(0);
    for (let j = 0; j < n; j++) {
      const c = labels[j];
      if (c < 0 || j === i) continue;
      let dist: number;
      if (metric === 'cosine') {
        let s = 0;
        for (let a = 0; a < d; a++) s += x[i * d + a] * x[j * d + a];
        const denom = norms[i] * norms[j];
        dist = Math.min(2, Math.max(0, 1 - (denom > 0 ? s / denom : 0)));
      } else {
        let s = 0;
        for (let a = 0; a < d; a++) {
          const t = x[i * d + a] - x[j * d + a];
          s += t * t;
        }
        dist = Math.sqrt(s);
      }
      sums[c] += dist;
    }
    const a = counts[own] > 1 ? sums[own] / (counts[own] - 1) : 0;
    let b = Infinity;
    for (let c = 0; c < k; c++) if (c !== own && counts[c] > 0) b = Math.min(b, sums[c] / counts[c]);
    samples[i] = b === Infinity ? 0 : finish(a, b, counts[own]);
  }
  return { samples, mean: meanOf(samples, labels) };
}

/**
 * Exact cosine silhouettes in O(n·k·d) instead of O(n²·d).
 *
 * Identity: for unit rows, the mean cosine distance from x to the members of C is
 * (1/|C|)·Σ_{y∈C} (1 − x·y) = 1 − x·m_C, with m_C the (unnormalised) mean of C. With x itself in
 * C and excluded (x·x = 1): a(x) = (|C| − x·S_C)/(|C| − 1) = |C|(1 − x·m_C)/(|C| − 1), S_C = Σ_{y∈C} y.
 * Rows are normalised here first (in Float64), so any non-zero rows may be passed; zero rows are
 * treated as not clustered.
 * @param data rows
 * @param labels cluster per row (−1: not clustered)
 * @param k number of clusters
 */
export function cosineSilhouette(data: DenseView, labels: Int32Array, k: number): Silhouettes {
  checkLabels(data, labels, k);
  const { rows: n, cols: d, data: x } = data;
  const inv = new Float64Array(n);
  const use = Int32Array.from(labels);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let a = 0; a < d; a++) s += x[i * d + a] * x[i * d + a];
    inv[i] = s > 0 ? 1 / Math.sqrt(s) : 0;
    if (s === 0) use[i] = -1;
  }
  const counts = new Int32Array(k);
  const sums = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const c = use[i];
    if (c < 0) continue;
    counts[c]++;
    for (let a = 0; a < d; a++) sums[c * d + a] += x[i * d + a] * inv[i];
  }
  const samples = new Float64Array(n);
  // One Float64 copy of the rows, and each row's products with all cluster sums in one pass:
  // the k-means sweep calls this at every k.
  const x64 = x instanceof Float64Array ? x : new Float64Array(x);
  const dots = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const own = use[i];
    if (own < 0 || counts[own] <= 1) continue;
    let a = 0;
    let b = Infinity;
    dotRows(x64, i * d, sums, 0, k, d, dots);
    for (let c = 0; c < k; c++) {
      if (counts[c] === 0) continue;
      const s = dots[c] * inv[i];
      if (c === own) a = Math.max(0, (counts[c] - s) / (counts[c] - 1));
      else b = Math.min(b, Math.max(0, 1 - s / counts[c]));
    }
    samples[i] = b === Infinity ? 0 : finish(a, b, counts[own]);
  }
  return { samples, mean: meanOf(samples, use) };
}

/**
 * Exact cosine silhouettes of the rows listed in `sample`, each measured against the full
 * clusters (all rows), by the same centroid identity as {@link cosineSilhouette}: O(n·d + s·k·d).
 * Their mean is an unbiased estimate of the mean silhouette over all rows, which is how a k
 * sweep scores a large corpus without clustering cost growing with n².
 * @param data unit-length rows (zero rows count as not clustered)
 * @param labels cluster per row (−1: not clustered)
 * @param k number of clusters
 * @param sample row indices to score
 * @returns the mean over the sampled rows that are clustered
 */
export function sampledCosineSilhouette(data: DenseView, labels: Int32Array, k: number, sample: Int32Array): number {
  checkLabels(data, labels, k);
  const { rows: n, cols: d, data: x } = data;
  const counts = new Int32Array(k);
  const sums = new Float64Array(k * d);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    if (c < 0) continue;
    let s = 0;
    for (let a = 0; a < d; a++) s += x[i * d + a] * x[i * d + a];
    if (s === 0) continue;
    const inv = 1 / Math.sqrt(s);
    counts[c]++;
    for (let a = 0; a < d; a++) sums[c * d + a] += x[i * d + a] * inv;
  }
  let total = 0;
  let scored = 0;
  for (const i of sample) {
    const own = labels[i];
    let norm = 0;
    for (let a = 0; a < d; a++) norm += x[i * d + a] * x[i * d + a];
    if (own < 0 || norm === 0) continue;
    scored++;
    if (counts[own] <= 1) continue;
    const inv = 1 / Math.sqrt(norm);
    let a = 0;
    let b = Infinity;
    for (let c = 0; c < k; c++) {
      if (counts[c] === 0) continue;
      let s = 0;
      for (let t = 0; t < d; t++) s += x[i * d + t] * sums[c * d + t];
      s *= inv;
      if (c === own) a = Math.max(0, (counts[c] - s) / (counts[c] - 1));
      else b = Math.min(b, Math.max(0, 1 - s / counts[c]));
    }
    if (b !== Infinity) total += finish(a, b, counts[own]);
  }
  return scored > 0 ? total / scored : 0;
}
