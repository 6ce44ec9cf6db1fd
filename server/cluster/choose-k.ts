/**
 * Choosing the number of clusters: sweep k over a range, score each k by mean cosine silhouette
 * (Rousseeuw 1987), and pick k from the whole curve.
 *
 * The rule. On text the raw silhouette keeps rising with k (WordNet glosses of 8 topics: 0.04 at
 * k = 2, 0.13 at k = 16, no peak), so its argmax picks the top of whatever range is swept. Part of
 * that rise is what k-means achieves on any data of that shape. So each k is also scored on a
 * structureless reference — the same rows with every LSA coordinate shuffled independently
 * across documents, then re-normalised (same per-coordinate distribution, no joint structure) —
 * and k is the first one where the gain over the reference's trend, s(k) − ŝ₀(k), stops growing:
 * its first local maximum that neither of the next two k beats (see {@link PATIENCE}; ŝ₀ is a
 * smooth fit of the reference, see {@link referenceTrend}). That is the stopping rule of the gap
 * statistic (Tibshirani, Walther & Hastie, "Estimating the number of clusters in a data set via
 * the gap statistic", JRSS B 63, 2001) applied to silhouettes, without its standard-error margin
 * (we draw one reference, not many), with the Kneedle knee (see {@link kneeOf}) taken instead
 * when it comes earlier. On WordNet glosses of 8 lexicographer files this gives k = 7, 7 and 9 for
 * seeds 1–3 (ARI 0.31, 0.33, 0.35 against the files; scikit-learn's raw argmax: k = 16, ARI 0.16);
 * on the invented demo (11 themes written) k = 12, ARI 0.69 (Ward linkage: k = 12, ARI 0.55); on
 * the bench's 12 planted themes, k = 12. With no reference curve, the raw argmax is used.
 * Each k keeps the better of two k-means runs (one warm from k − 1, one fresh greedy
 * k-means++), so that a poor local optimum does not dent the curve.
 */
import type { Dense } from '../common/matrix.js';
import { sampleIndices, type Random } from '../common/random.js';
import type { Step, Stepwise } from '../common/step.js';
import type { DenseView, Dendrogram } from './api.js';
import { cutDendrogram } from './agglomerate.js';
import { restageSteps } from './restage.js';
import { sharedFloat64, type Pending, type Spare } from '../common/spare.js';
import { CLUSTER_INLINE } from './spare-tasks.js';
import { cosineSilhouette, sampledCosineSilhouette } from './silhouette.js';
import { referenceCurveSteps, type FreshInput, type FreshRun, type KScore } from './sweep-runs.js';
import { DEFAULT_SPHERICAL_KMEANS_OPTIONS, sphericalKmeansSteps, type SphericalKmeansResult } from './spherical-kmeans.js';

export type { KScore } from './sweep-runs.js';

/**
 * How many following values of k must not beat a gain for it to count as the peak. With 1 (a plain
 * first local maximum) a flat step in real curves stopped the rule early: WordNet glosses of 8
 * files, k = 4 where the gain rose again from k = 6 on. Waiting for two more k is a patience rule
 * (common practice in early stopping).
 */
export const PATIENCE = 2;

/**
 * Picks k from a silhouette curve and, when given, the reference curve of structureless data
 * (see the file comment).
 * @param curve scores in any order (at least one)
 * @param reference silhouettes of the shuffled reference at the same k values
 * @returns the chosen k and a sentence saying why
 */
export function chooseK(curve: readonly KScore[], reference?: readonly KScore[]): { k: number; rule: string } {
  if (curve.length === 0) throw new RangeError('the silhouette curve is empty; sweep at least one k');
  const sorted = [...curve].sort((a, b) => a.k - b.k);
  const range = `k = ${sorted[0].k}..${sorted[sorted.length - 1].k}`;
  let best = sorted[0];
  for (const p of sorted) if (p.silhouette > best.silhouette) best = p;
  if (!reference) return { k: best.k, rule: `k = ${best.k} has the highest mean silhouette (${best.silhouette.toFixed(3)}) over ${range}` };
  const base = new Map(reference.map((p) => [p.k, p.silhouette]));
  const ks = sorted.map((p) => p.k);
  const raw = ks.map((k) => {
    const b = base.get(k);
    if (b === undefined) throw new RangeError(`the reference curve has no score for k = ${k}`);
    return b;
  });
  const trend = referenceTrend(ks, raw);
  const gain = sorted.map((p, i) => p.silhouette - trend[i]);
  let peak = sorted.length - 1;
  for (let i = 0; i + 1 < sorted.length; i++) {
    let top = true;
    for (let j = i + 1; j <= i + PATIENCE && j < sorted.length; j++) if (gain[j] > gain[i]) top = false;
    if (top) { peak = i; break; }
  }
  const knee = kneeOf(ks, gain);
  const pick = knee !== null && knee < peak ? knee : peak;
  const p = sorted[pick];
  const why = pick === peak && pick < sorted.length - 1
    ? 'the first k where it stops growing'
    : pick === knee
      ? 'the knee of that gain, where more clusters start to add little'
      : 'it grows up to the end of the range';
  return {
    k: p.k,
    rule: `k = ${p.k}: mean silhouette ${p.silhouette.toFixed(3)}, ${gain[pick].toFixed(3)} above shuffled data with no structure; ${why} over ${range} (raw best ${best.silhouette.toFixed(3)} at k = ${best.k})`,
  };
}

/**
 * The knee of an increasing-then-flattening curve by the Kneedle method (Satopää, Albrecht, Irwin
 * & Raghavan, "Finding a 'Kneedle' in a haystack: detecting knee points in system behavior",
 * ICDCS Workshops 2011): scale k and the values to [0, 1] and take the largest distance above
 * the diagonal. On text the gain often keeps creeping up with k (WordNet glosses of 8 files: up
 * to k = 16 with no peak), and the knee is where that creep begins (k = 7–9 there, by seed).
 * @returns the index of the knee, or null when the curve never rises above its diagonal (or has
 *   fewer than 3 points)
 */
export function kneeOf(ks: readonly number[], values: readonly number[]): number | null {
  const n = ks.length;
  if (n < 3) return null;
  let lo = Infinity, hi = -Infinity;
  for (const v of values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const span = ks[n - 1] - ks[0];
  if (!(hi > lo) || !(span > 0)) return null;
  let best = -1, bestAt: number | null = null;
  for (let i = 0; i < n; i++) {
    const d = (values[i] - lo) / (hi - lo) - (ks[i] - ks[0]) / span;
    if (d > best + 1e-12) { best = d; bestAt = i; }
  }
  return best > 0 ? bestAt : null;
}

/**
 * The trend of the reference curve: a least-squares fit of a + b·ln k + c·(ln k)² (a line in ln k
 * below 5 points; the points themselves below 3). The reference is one draw of k-means on
 * structureless data, and its wiggles from k to k (±0.02 seen on 300 points) are local optima, not
 * a property of k; compared point by point they stopped the rule at k = 2 on planted data with 6
 * clusters. The fitted form is our choice ("common practice" for smoothing a curve): it follows
 * the rise-then-flatten shape the references show on our fixtures and bench corpora.
 * @param ks values of k, ascending
 * @param values reference silhouettes at those k
 */
export function referenceTrend(ks: readonly number[], values: readonly number[]): number[] {
  const n = ks.length;
  if (n < 3) return [...values];
  const degree = n < 5 ? 1 : 2;
  const basis = (k: number): number[] => { const t = Math.log(k); return degree === 1 ? [1, t] : [1, t, t * t]; };
  const w = degree + 1;
  // Normal equations (w ≤ 3, well conditioned for k in 2..a few hundred), solved by elimination.
  const a = Array.from({ length: w }, () => new Array<number>(w + 1).fill(0));
  for (let i = 0; i < n; i++) {
    const b = basis(ks[i]);
    for (let r = 0; r < w; r++) {
      for (let c = 0; c < w; c++) a[r][c] += b[r] * b[c];
      a[r][w] += b[r] * values[i];
    }
  }
  for (let c = 0; c < w; c++) {
    let piv = c;
    for (let r = c + 1; r < w; r++) if (Math.abs(a[r][c]) > Math.abs(a[piv][c])) piv = r;
    [a[c], a[piv]] = [a[piv], a[c]];
    if (Math.abs(a[c][c]) < 1e-300) return [...values];
    for (let r = 0; r < w; r++) {
      if (r === c) continue;
      const f = a[r][c] / a[c][c];
      for (let j = c; j <= w; j++) a[r][j] -= f * a[c][j];
    }
  }
  const coef = a.map((row, r) => row[w] / row[r]);
  return ks.map((k) => basis(k).reduce((s, b, j) => s + b * coef[j], 0));
}

/**
 * The structureless reference for a set of unit rows: each coordinate shuffled independently
 * across rows, rows re-normalised.
 * @param data unit rows
 * @param random source of the shuffles
 */
export function shuffledReference(data: Dense, random: Random): Dense {
  const { rows: n, cols: d } = data;
  const out: Dense = { rows: n, cols: d, data: new Float32Array(n * d) };
  const perm = new Int32Array(n);
  for (let c = 0; c < d; c++) {
    for (let i = 0; i < n; i++) perm[i] = i;
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      const t = perm[i];
      perm[i] = perm[j];
      perm[j] = t;
    }
    for (let i = 0; i < n; i++) out.data[i * d + c] = data.data[perm[i] * d + c];
  }
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let c = 0; c < d; c++) s += out.data[i * d + c] * out.data[i * d + c];
    const inv = s > 0 ? 1 / Math.sqrt(s) : 0;
    for (let c = 0; c < d; c++) out.data[i * d + c] *= inv;
  }
  return out;
}

/** Options of the k sweeps. */
export interface SweepOptions {
  /** Smallest k. */
  kMin: number;
  /** Largest k (at most the number of rows). */
  kMax: number;
  /** Rows scored (k-means also clusters only these during the sweep). */
  sampleSize: number;
  /** k-means runs per k: the first continues from k − 1's centroids, the rest seed afresh. */
  restarts: number;
  /** Source of randomness. */
  random: Random;
  /** A thread for the fresh runs; the curve is the same without one. @default the calling thread */
  spare?: Spare;
}

/** Result of {@link kmeansSweepSteps}. */
export interface KmeansSweep {
  curve: KScore[];
  /** Silhouettes of k-means on the shuffled reference of the same sample. */
  reference: KScore[];
  /** Centroids found for each k of the curve (same order), to start the final clustering from. */
  centroids: Float32Array[];
  /** Rows clustered during the sweep. */
  sample: Int32Array;
}

/** A seeded sample of `size` distinct row indices from 0..n−1 (all of them when size ≥ n), ascending. */
export const sampleRows = sampleIndices;

/** The same rows in Float64, the form the k-means and silhouette loops compute in (on shared memory when a spare reads them). */
function widen(data: Dense, shared: boolean): DenseView {
  const out = shared ? sharedFloat64(data.data.length) : new Float64Array(data.data.length);
  out.set(data.data);
  return { rows: data.rows, cols: data.cols, data: out };
}

/** The listed rows of `data` as a new dense matrix. */
export function takeRows(data: Dense, rows: Int32Array): Dense {
  const d = data.cols;
  const out: Dense = { rows: rows.length, cols: d, data: new Float32Array(rows.length * d) };
  for (let s = 0; s < rows.length; s++) out.data.set(data.data.subarray(rows[s] * d, (rows[s] + 1) * d), s * d);
  return out;
}

/** A seed for the sweep's independent parts, drawn once from the sweep's stream. */
function drawSeed(random: Random): number {
  return Math.floor(random() * 4294967296) | 0;
}

/** How many fresh runs are handed out ahead of the warm chain. */
const FRESH_AHEAD = 2;

/**
 * k-means sweep: clusters a seeded sample of rows for each k in kMin..kMax and scores each
 * clustering by the exact mean cosine silhouette of the sample. Stage `"sweep-k"`.
 * Warm chain: k starts from the k − 1 centroids plus one k-means++ pick, so each k needs few
 * iterations. Beside it, fresh seedings per k (on the spare thread when there is one) guard
 * against a poor chain; each k keeps the lower objective of the two. The reference curve is
 * computed last, here (the fresh runs keep the spare as busy as this thread).
 * @param data unit-length rows with content
 * @param opts see {@link SweepOptions}
 */
export function* kmeansSweepSteps(data: Dense, opts: SweepOptions): Stepwise<KmeansSweep> {
  const spare = opts.spare ?? CLUSTER_INLINE;
  const shared = spare.threads > 0;
  const sample = sampleRows(data.rows, opts.sampleSize, opts.random);
  const sub = takeRows(data, sample);
  const quarterRows = sub.rows >= 4 * opts.kMax ? takeRows(sub, sampleRows(sub.rows, Math.max(4 * opts.kMax, Math.ceil(sub.rows / 4)), opts.random)) : sub;
  // Widened once here rather than by each of the ~90 k-means runs and silhouettes below.
  const sub64 = widen(sub, shared);
  const quarter = quarterRows === sub ? sub64 : widen(quarterRows, shared);
  const shuffled = referenceRows(sub, opts.random, shared);
  const freshSeed = drawSeed(opts.random);
  const referenceSeed = drawSeed(opts.random);
  const step: Step = { stage: 'sweep-k', done: 0, total: 2 * (opts.kMax - opts.kMin + 1) };
  const pending = new Map<number, Pending<FreshRun | null>>();
  const hand = (k: number) => {
    if (k <= opts.kMax && !pending.has(k)) pending.set(k, spare.start<FreshRun | null>('sweep.fresh', { sub: sub64, quarter, k, runs: opts.restarts - 1, seed: freshSeed } satisfies FreshInput));
  };
  const curve: KScore[] = [];
  const centroids: Float32Array[] = [];
  let previous: Float32Array | null = null;
  let previousLabels: Int32Array | null = null;
  for (let k = opts.kMin; k <= opts.kMax; k++) {
    if (shared) for (let a = k; a < k + FRESH_AHEAD; a++) hand(a);
    // Greedy k-means++ even here: with one candidate per pick (plain k-means++) the curve got
    // noisy enough to stop the rule early (WordNet glosses: k = 4 instead of 8).
    const warm: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(sub64, k, { restarts: 1, initial: previous, initialLabels: previousLabels, random: opts.random }), 'sweep-k', step);
    previous = warm.centroids;
    previousLabels = convergedLabels(warm, DEFAULT_SPHERICAL_KMEANS_OPTIONS.maxIterations);
    hand(k);
    const fresh = pending.get(k)!.wait();
    pending.delete(k);
    const best = fresh !== null && fresh.objective < warm.objective ? fresh : warm;
    centroids.push(best.centroids);
    curve.push({ k, silhouette: cosineSilhouette(sub64, best.labels, k).mean });
    step.done++;
    yield { ...step };
  }
  // The reference runs here once the chain is done: the fresh runs keep the spare busier.
  const scores = yield* referenceCurveSteps({ shuffled, kMin: opts.kMin, kMax: opts.kMax, seed: referenceSeed }, step);
  return { curve, reference: scores, centroids, sample };
}

/**
 * The labels of a run that stopped because no row moved: each row is then at its nearest
 * centroid, which lets the next k's seeding skip a pass per centroid. Null after a capped run.
 */
function convergedLabels(run: SphericalKmeansResult, maxIterations: number): Int32Array | null {
  return run.iterations < maxIterations ? run.labels : null;
}

/** Rows scored for the shuffled reference (our choice: its curve is smooth in k; 2,000 rows keep 66 per cluster at k = 30). */
export const REFERENCE_ROWS = 2000;

/** The structureless reference of at most REFERENCE_ROWS rows of `sub`. */
function referenceRows(sub: Dense, random: Random, shared: boolean): DenseView {
  // Structureless data needs fewer rows for a steady silhouette.
  const rows = sub.rows > REFERENCE_ROWS ? takeRows(sub, sampleRows(sub.rows, REFERENCE_ROWS, random)) : sub;
  return widen(shuffledReference(rows, random), shared);
}

/** The silhouette curve of k-means on the shuffled reference of `sub` (see {@link referenceCurveSteps}). */
export function* referenceSweepSteps(sub: Dense, opts: SweepOptions, step: Step): Stepwise<KScore[]> {
  const shuffled = referenceRows(sub, opts.random, false);
  return yield* referenceCurveSteps({ shuffled, kMin: opts.kMin, kMax: opts.kMax, seed: drawSeed(opts.random) }, step);
}

/**
 * Agglomerative sweep: cuts one tree at each k and scores the exact silhouettes of a sample of
 * rows against the full clusters. Stage `"sweep-k"`.
 * @param data unit-length rows with content (the rows the tree was built on)
 * @param tree from `dendrogramSteps`
 * @param opts see {@link SweepOptions} (`restarts` unused)
 * @returns the curve and the shuffled reference curve
 */
export function* treeSweepSteps(data: Dense, tree: Dendrogram, opts: SweepOptions): Stepwise<{ curve: KScore[]; reference: KScore[] }> {
  const sample = sampleRows(data.rows, opts.sampleSize, opts.random);
  const step: Step = { stage: 'sweep-k', done: 0, total: 2 * (opts.kMax - opts.kMin + 1) };
  const curve: KScore[] = [];
  for (let k = opts.kMin; k <= opts.kMax; k++) {
    const labels = cutDendrogram(tree, k);
    curve.push({ k, silhouette: sampledCosineSilhouette(data, labels, k, sample) });
    step.done++;
    yield { ...step };
  }
  // The reference is scored with k-means on the sample: building a second tree would double the
  // cost, and on structureless data the two methods reach similar silhouettes.
  const reference = yield* referenceSweepSteps(takeRows(data, sample), opts, step);
  return { curve, reference };
}
