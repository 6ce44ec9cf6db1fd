/**
 * Choosing the number of clusters: sweep k over a range, score each k by mean cosine silhouette
 * (Rousseeuw 1987), and pick k from the whole curve.
 *
 * The rule. On text the raw silhouette keeps rising with k (WordNet glosses of 8 topics: 0.04 at
 * k = 2, 0.13 at k = 16, no peak), so its argmax picks the top of whatever range is swept. Part of
 * that rise is what k-means achieves on any data of that shape. So each k is also scored on a
 * structureless reference — the same rows with every LSA coordinate shuffled independently
 * across documents, then re-normalised (same per-coordinate distribution, no joint structure) —
 * and k is the first one where the gain over the reference, s(k) − s₀(k), stops growing: its
 * first local maximum. That is the stopping rule of the gap statistic (Tibshirani, Walther &
 * Hastie, "Estimating the number of clusters in a data set via the gap statistic", JRSS B 63,
 * 2001) applied to silhouettes, without its standard-error margin (we draw one reference, not
 * many). On the glosses of 8 lexicographer files this gives k = 9 (ARI against the files 0.30,
 * versus 0.16 for scikit-learn's raw argmax at k = 16; the gain is nearly flat from k = 8 to 11,
 * so the exact pick moves with sampling); on corpora with clear themes the gain peaks where the
 * raw silhouette does (the bench's 12 planted themes: k = 12). With no reference curve, the raw
 * argmax is used. A dip from a poor local optimum early in the sweep would stop the rule too
 * soon; two runs per k (one warm, one fresh greedy k-means++) keep the curve smooth.
 */
import type { Dense } from '../common/matrix.js';
import { seededRandom, type Random } from '../common/random.js';
import type { Step, Stepwise } from '../common/step.js';
import type { DenseView, Dendrogram } from './api.js';
import { cutDendrogram } from './agglomerate.js';
import { restageSteps } from './restage.js';
import { cosineSilhouette, sampledCosineSilhouette } from './silhouette.js';
import { DEFAULT_SPHERICAL_KMEANS_OPTIONS, sphericalKmeansSteps, type SphericalKmeansResult } from './spherical-kmeans.js';

/** One point of the silhouette curve. */
export interface KScore {
  k: number;
  silhouette: number;
}

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
  const gain = sorted.map((p) => {
    const b = base.get(p.k);
    if (b === undefined) throw new RangeError(`the reference curve has no score for k = ${p.k}`);
    return p.silhouette - b;
  });
  let pick = sorted.length - 1;
  for (let i = 0; i + 1 < sorted.length; i++) {
    if (gain[i] >= gain[i + 1]) { pick = i; break; }
  }
  const p = sorted[pick];
  const why = pick < sorted.length - 1
    ? 'the first k where it stops growing'
    : 'it grows up to the end of the range';
  return {
    k: p.k,
    rule: `k = ${p.k}: mean silhouette ${p.silhouette.toFixed(3)}, ${gain[pick].toFixed(3)} above shuffled data with no structure; ${why} over ${range} (raw best ${best.silhouette.toFixed(3)} at k = ${best.k})`,
  };
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
  /** k-means restarts per k: the first continues from k − 1's centroids, the rest seed afresh. */
  restarts: number;
  /** Source of randomness. */
  random: Random;
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
export function sampleRows(n: number, size: number, random: Random = seededRandom(1)): Int32Array {
  if (size >= n) return Int32Array.from({ length: n }, (_, i) => i);
  const all = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < size; i++) {
    const j = i + Math.floor(random() * (n - i));
    const t = all[i];
    all[i] = all[j];
    all[j] = t;
  }
  return all.slice(0, size).sort();
}

/** The same rows in Float64, the form the k-means and silhouette loops compute in. */
function widen(data: Dense): DenseView {
  return { rows: data.rows, cols: data.cols, data: new Float64Array(data.data) };
}

/** The listed rows of `data` as a new dense matrix. */
export function takeRows(data: Dense, rows: Int32Array): Dense {
  const d = data.cols;
  const out: Dense = { rows: rows.length, cols: d, data: new Float32Array(rows.length * d) };
  for (let s = 0; s < rows.length; s++) out.data.set(data.data.subarray(rows[s] * d, (rows[s] + 1) * d), s * d);
  return out;
}

/**
 * k-means sweep: clusters a seeded sample of rows for each k in kMin..kMax and scores each
 * clustering by the exact mean cosine silhouette of the sample. Stage `"sweep-k"`.
 * Warm start: k starts from the k − 1 centroids plus one k-means++ pick, so each k needs few
 * iterations; a fresh seeding per extra restart guards against a poor chain.
 * @param data unit-length rows with content
 * @param opts see {@link SweepOptions}
 */
export function* kmeansSweepSteps(data: Dense, opts: SweepOptions): Stepwise<KmeansSweep> {
  const sample = sampleRows(data.rows, opts.sampleSize, opts.random);
  const sub = takeRows(data, sample);
  const quarterRows = sub.rows >= 4 * opts.kMax ? takeRows(sub, sampleRows(sub.rows, Math.max(4 * opts.kMax, Math.ceil(sub.rows / 4)), opts.random)) : sub;
  // Widened once here rather than by each of the ~90 k-means runs and silhouettes below.
  const sub64 = widen(sub);
  const quarter = quarterRows === sub ? sub64 : widen(quarterRows);
  const step: Step = { stage: 'sweep-k', done: 0, total: 2 * (opts.kMax - opts.kMin + 1) };
  const curve: KScore[] = [];
  const centroids: Float32Array[] = [];
  let previous: Float32Array | null = null;
  let previousLabels: Int32Array | null = null;
  for (let k = opts.kMin; k <= opts.kMax; k++) {
    // Greedy k-means++ even here: with one candidate per pick (plain k-means++) the curve got
    // noisy enough to stop the rule early (WordNet glosses: k = 4 instead of 8).
    let run: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(sub64, k, { restarts: 1, initial: previous, initialLabels: previousLabels, random: opts.random }), 'sweep-k', step);
    // Fresh restarts converge on a quarter of the sample first, then finish on all of it from
    // there: a few Lloyd passes instead of a full run. (Capping fresh runs at 15 iterations
    // instead made the curve noisy enough to stop the rule early: WordNet glosses, k = 4.)
    for (let r = 1; r < opts.restarts; r++) {
      const rough: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(quarter, k, { restarts: 1, random: opts.random }), 'sweep-k', step);
      const fresh: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(sub64, k, { restarts: 1, initial: rough.centroids, random: opts.random }), 'sweep-k', step);
      if (fresh.objective < run.objective) run = fresh;
    }
    previous = run.centroids;
    previousLabels = convergedLabels(run, DEFAULT_SPHERICAL_KMEANS_OPTIONS.maxIterations);
    centroids.push(run.centroids);
    curve.push({ k, silhouette: cosineSilhouette(sub64, run.labels, k).mean });
    step.done++;
    yield { ...step };
  }
  const reference = yield* referenceSweepSteps(sub, opts, step);
  return { curve, reference, centroids, sample };
}

/** Lloyd iterations of a reference run (see {@link referenceSweepSteps}). */
const REFERENCE_ITERATIONS = 20;

/**
 * The labels of a run that stopped because no row moved: each row is then at its nearest
 * centroid, which lets the next k's seeding skip a pass per centroid. Null after a capped run.
 */
function convergedLabels(run: SphericalKmeansResult, maxIterations: number): Int32Array | null {
  return run.iterations < maxIterations ? run.labels : null;
}

/** Rows scored for the shuffled reference (our choice: its curve is smooth in k; 2,000 rows keep 66 per cluster at k = 30). */
export const REFERENCE_ROWS = 2000;

/**
 * The silhouette curve of k-means on the shuffled reference of `sub`: one warm-started run per k
 * (structureless data has no better optimum to find), capped at 20 Lloyd iterations because on
 * such data k-means creeps on for dozens of iterations while the silhouette has long settled
 * (our measurement: 0.001 or less change after 20 on the bench corpora).
 */
export function* referenceSweepSteps(sub: Dense, opts: SweepOptions, step: Step): Stepwise<KScore[]> {
  // Structureless data needs fewer rows for a steady silhouette: at most REFERENCE_ROWS of them.
  const rows = sub.rows > REFERENCE_ROWS ? takeRows(sub, sampleRows(sub.rows, REFERENCE_ROWS, opts.random)) : sub;
  const shuffled = widen(shuffledReference(rows, opts.random));
  const reference: KScore[] = [];
  let previous: Float32Array | null = null;
  let previousLabels: Int32Array | null = null;
  for (let k = opts.kMin; k <= opts.kMax; k++) {
    const run: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(shuffled, k, { restarts: 1, maxIterations: REFERENCE_ITERATIONS, initial: previous, initialLabels: previousLabels, random: opts.random }), 'sweep-k', step);
    previous = run.centroids;
    previousLabels = convergedLabels(run, REFERENCE_ITERATIONS);
    reference.push({ k, silhouette: cosineSilhouette(shuffled, run.labels, k).mean });
    step.done++;
    yield { ...step };
  }
  return reference;
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
