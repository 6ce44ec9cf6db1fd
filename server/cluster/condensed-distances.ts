/**
 * Pairwise distances in condensed form: the upper triangle of the n × n distance matrix, row by
 * row, n(n−1)/2 Float64 values — the layout of SciPy's `pdist`, and the working matrix that
 * linkage.ts updates in place.
 */
import { drain, type Stepwise } from '../common/step.js';
import { dot } from './unit-sphere.js';

/** Rows of numbers in any typed or plain array: element (r, c) is `data[r * cols + c]`. */
export interface NumericRows {
  rows: number;
  cols: number;
  data: ArrayLike<number>;
}

/** The distances `linkageFromCondensed` knows how to start from. */
export type PointMetric = 'euclidean' | 'cosine';

/**
 * Position of the pair (i, j), i ≠ j, in a condensed distance array of `n` points
 * (the upper triangle, row by row, as SciPy's `pdist` lays it out).
 */
export function condensedIndex(n: number, i: number, j: number): number {
  if (i > j) {
    const t = i;
    i = j;
    j = t;
  }
  return n * i - (i * (i + 1)) / 2 + (j - i - 1);
}

/**
 * All pairwise distances of the rows of `x`, in Float64, as a condensed array of n(n−1)/2 entries,
 * yielding a `"distances"` step after each slice of about two million pair terms.
 * Cosine distance is 1 − u·v / (|u| |v|) (clamped at 0); a zero row is at distance 1 from everything.
 * @param x the points, one per row.
 * @param metric `'euclidean'` or `'cosine'`.
 */
export function* condensedDistancesSteps(x: NumericRows, metric: PointMetric): Stepwise<Float64Array> {
  const { rows: n, cols: d } = x;
  const pairs = (n * (n - 1)) / 2;
  if (pairs > 2 ** 30) throw new RangeError(`${n} points need ${pairs} pairwise distances, too many for the exact path; use agglomerate(), which groups large inputs first`);
  const out = new Float64Array(pairs);
  // One Float64 copy (cosine: of the unit rows) keeps the inner loop monomorphic and branch-free.
  const data = Float64Array.from(x.data as ArrayLike<number>);
  const zero = new Uint8Array(n);
  if (metric === 'cosine') {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let c = 0; c < d; c++) s += data[i * d + c] * data[i * d + c];
      if (s > 0) {
        const inv = 1 / Math.sqrt(s);
        for (let c = 0; c < d; c++) data[i * d + c] *= inv;
      } else {
        zero[i] = 1;
      }
    }
  }
  let p = 0;
  let work = 0;
  for (let i = 0; i < n; i++) {
    const oi = i * d;
    if (metric === 'euclidean') {
      for (let j = i + 1; j < n; j++, p++) out[p] = Math.sqrt(squaredDistance(data, oi, j * d, d));
    } else {
      for (let j = i + 1; j < n; j++, p++) out[p] = zero[i] || zero[j] ? 1 : Math.max(0, 1 - dot(data, oi, data, j * d, d));
    }
    work += (n - i - 1) * (d + 1);
    if (work >= 2_000_000 || i === n - 1) {
      work = 0;
      yield { stage: 'distances', done: p, total: pairs };
    }
  }
  return out;
}

/** Σ (a[i+c] − a[j+c])² over c < d, four accumulators. */
function squaredDistance(a: Float64Array, i: number, j: number, d: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let c = 0;
  for (; c + 3 < d; c += 4) {
    const t0 = a[i + c] - a[j + c];
    const t1 = a[i + c + 1] - a[j + c + 1];
    const t2 = a[i + c + 2] - a[j + c + 2];
    const t3 = a[i + c + 3] - a[j + c + 3];
    s0 += t0 * t0;
    s1 += t1 * t1;
    s2 += t2 * t2;
    s3 += t3 * t3;
  }
  for (; c < d; c++) {
    const t = a[i + c] - a[j + c];
    s0 += t * t;
  }
  return s0 + s1 + (s2 + s3);
}

/** `condensedDistancesSteps` run to the end. */
export function condensedDistances(x: NumericRows, metric: PointMetric): Float64Array {
  return drain(condensedDistancesSteps(x, metric));
}
