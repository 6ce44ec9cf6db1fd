import type { Dense } from '../common/matrix.js';
import { seededRandom } from '../common/random.js';
import type { TrustworthinessOptions } from './api.js';

/** Defaults of {@link trustworthiness}; see {@link TrustworthinessOptions}. */
export const DEFAULT_TRUSTWORTHINESS_OPTIONS: Readonly<Omit<TrustworthinessOptions, 'random'>> = Object.freeze({
  metric: 'euclidean',
  maxQueries: 2000,
});

/**
 * Trustworthiness of a low-dimensional embedding (Venna & Kaski 2001, "Neighborhood preservation in
 * nonlinear projection methods: an experimental study"):
 *
 *   T(k) = 1 − 2 / (n·k·(2n − 3k − 1)) · Σᵢ Σ_{j ∈ Uᵢ} (r(i, j) − k)
 *
 * where Uᵢ are the points among i's k nearest neighbours in the embedding that are not among its
 * k nearest in the original space, and r(i, j) is j's rank among i's neighbours in the original
 * space (1 = nearest). 1 means every map neighbourhood is a true neighbourhood. Follows the
 * definition as scikit-learn's `sklearn.manifold.trustworthiness` computes it (self excluded,
 * euclidean distances in the map), including its requirement k < n/2.
 *
 * Exact when n ≤ `maxQueries`; otherwise a seeded sample of `maxQueries` query points is ranked
 * against all n points and the sum is scaled by n / maxQueries. Cost: O(queries · n · d).
 * @param high original rows (n×d)
 * @param low embedding: a Dense n×c matrix, or a Float32Array n×2 interleaved
 * @param k neighbourhood size, 1 ≤ k < n/2
 * @param opts see {@link TrustworthinessOptions}
 */
export function trustworthiness(high: Dense, low: Dense | Float32Array, k: number, opts: Partial<TrustworthinessOptions> = {}): number {
  const o: TrustworthinessOptions = { ...DEFAULT_TRUSTWORTHINESS_OPTIONS, random: seededRandom(1), ...opts };
  const n = high.rows;
  const lowDense: Dense = low instanceof Float32Array ? { rows: low.length / 2, cols: 2, data: low } : low;
  if (lowDense.rows !== n) throw new RangeError(`the embedding has ${lowDense.rows} points but the data has ${n} rows`);
  if (high.data.length !== n * high.cols || lowDense.data.length !== n * lowDense.cols) throw new RangeError('matrix data length does not match rows × cols');
  if (!Number.isInteger(k) || k < 1 || k >= n / 2) throw new RangeError(`k must be an integer with 1 ≤ k < n/2 = ${n / 2}; got ${k}`);
  if (o.metric !== 'euclidean' && o.metric !== 'cosine') throw new RangeError(`metric must be "euclidean" or "cosine"; got ${String(o.metric)}`);
  if (!Number.isInteger(o.maxQueries) || o.maxQueries < 1) throw new RangeError(`maxQueries must be a positive integer; got ${o.maxQueries}`);

  let queries: Int32Array;
  if (n <= o.maxQueries) {
    queries = new Int32Array(n);
    for (let i = 0; i < n; i++) queries[i] = i;
  } else {
    // Partial Fisher–Yates: a uniform sample without replacement.
    const all = new Int32Array(n);
    for (let i = 0; i < n; i++) all[i] = i;
    for (let t = 0; t < o.maxQueries; t++) {
      const r = t + Math.floor(o.random() * (n - t));
      const tmp = all[t];
      all[t] = all[r];
      all[r] = tmp;
    }
    queries = all.slice(0, o.maxQueries);
  }

  const d = high.cols;
  const hd = high.data;
  const norms = new Float64Array(n);
  if (o.metric === 'cosine') {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let c = i * d; c < i * d + d; c++) s += hd[c] * hd[c];
      norms[i] = Math.sqrt(s);
    }
  }
  const distHigh = new Float64Array(n);
  const lowNeighbors = new Int32Array(k);
  const lowDist = new Float64Array(k);
  let penalty = 0;
  for (const i of queries) {
    highDistances(high, i, o.metric, norms, distHigh);
    nearestInLow(lowDense, i, k, lowNeighbors, lowDist);
    for (let t = 0; t < k; t++) {
      const j = lowNeighbors[t];
      const dj = distHigh[j];
      // Rank of j around i in the original space; ties go to the lower index.
      let rank = 1;
      for (let l = 0; l < n; l++) {
        if (l === i) continue;
        const dl = distHigh[l];
        if (dl < dj || (dl === dj && l < j)) rank++;
      }
      if (rank > k) penalty += rank - k;
    }
  }
  const scale = n / queries.length;
  return 1 - (2 / (n * k * (2 * n - 3 * k - 1))) * penalty * scale;
}

function highDistances(x: Dense, i: number, metric: 'euclidean' | 'cosine', norms: Float64Array, out: Float64Array): void {
  const { rows: n, cols: d, data } = x;
  const a = i * d;
  for (let j = 0; j < n; j++) {
    const b = j * d;
    if (metric === 'euclidean') {
      let s = 0;
      for (let c = 0; c < d; c++) {
        const diff = data[a + c] - data[b + c];
        s += diff * diff;
      }
      out[j] = s;
    } else {
      let s = 0;
      for (let c = 0; c < d; c++) s += data[a + c] * data[b + c];
      const denom = norms[i] * norms[j];
      // scikit-learn leaves zero rows at zero after normalising, so their cosine is 0.
      out[j] = 1 - (denom > 0 ? s / denom : 0);
    }
  }
}

/** The k nearest points to i in the embedding (self excluded), by squared euclidean distance. */
function nearestInLow(y: Dense, i: number, k: number, idx: Int32Array, dist: Float64Array): void {
  const { rows: n, cols: c, data } = y;
  dist.fill(Infinity);
  idx.fill(-1);
  for (let j = 0; j < n; j++) {
    if (j === i) continue;
    let s = 0;
    for (let e = 0; e < c; e++) {
      const diff = data[i * c + e] - data[j * c + e];
      s += diff * diff;
    }
    if (s >= dist[k - 1]) continue;
    let p = k - 1;
    while (p > 0 && dist[p - 1] > s) {
      dist[p] = dist[p - 1];
      idx[p] = idx[p - 1];
      p--;
    }
    dist[p] = s;
    idx[p] = j;
  }
}
