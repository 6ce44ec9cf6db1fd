/**
 * Spherical k-means: k-means on unit vectors with cosine similarity, centroids re-normalised to
 * the sphere (Dhillon & Modha, "Concept decompositions for large sparse text data using
 * clustering", Machine Learning 42, 2001). Seeded by greedy k-means++ (Arthur & Vassilvitskii,
 * SODA 2007), with several restarts keeping the lowest objective.
 *
 * Assignment skips most distance computations with Hamerly's bounds (Hamerly, "Making k-means
 * even faster", SDM 2010): on the unit sphere the chord length ‖x − c‖ = √(2 − 2·x·c) is a metric,
 * so the triangle inequality applies to it and the result is exactly that of plain Lloyd steps.
 * Where n·k is moderate, Elkan's per-centroid bounds (elkan-bounds.ts) replace Hamerly's single
 * one: they keep rows settled while only a few centroids move, which is most of a long run.
 */
import type { Random } from '../common/random.js';
import { seededRandom } from '../common/random.js';
import type { Step, Stepwise } from '../common/step.js';
import { drain } from '../common/step.js';
import type { DenseView } from './api.js';
import { hamerlyAssignRange, hamerlyGaps, hamerlyShift, type HamerlyBounds } from './hamerly-bounds.js';
import { chord, dot } from './unit-sphere.js';
import { seedSteps, sliceOf } from './kmeans-plus-plus.js';
import { ELKAN_MAX_PAIRS, elkanAssignRange, elkanBounds, elkanCentroidGaps, elkanFits, elkanShift, elkanStartFromLabels } from './elkan-bounds.js';

/** Options of {@link sphericalKmeansSteps}. */
export interface SphericalKmeansOptions {
  /** Independent seedings; the run with the lowest objective is kept. @default 4 */
  restarts: number;
  /** Cap on Lloyd iterations per run. @default 100 */
  maxIterations: number;
  /** Candidates tried per k-means++ pick; 0 means 2 + ⌊ln k⌋ (the greedy variant). @default 0 */
  seedTrials: number;
  /** Starting centroids (rows of length `cols`, unit length) for the first run; fewer than k rows are completed by k-means++. @default null */
  initial: Float32Array | null;
  /**
   * For each row, its nearest centroid among `initial` (the labels of a converged run that
   * produced those centroids). The seeding of the remaining centroids then measures one distance
   * per row instead of one per given centroid, and the first assignment pass starts from these
   * labels instead of scanning every centroid. Leave null when unsure: a wrong label makes
   * k-means++ draw from wrong distances (the assignments stay exact). @default null
   */
  initialLabels: Int32Array | null;
  /**
   * Largest rows × k for which Elkan's per-centroid bounds are kept (n·k Float64 numbers);
   * above it Hamerly's single bound per row is used. Both give the same assignments; 0 forces
   * the single bound. @default ELKAN_MAX_PAIRS (8,000,000: 64 MB)
   */
  maxBoundPairs: number;
  /** Source of randomness. @default seededRandom(1) */
  random: Random;
  /** Stage name used in progress steps. @default 'kmeans' */
  stage: string;
}

/** Defaults of {@link SphericalKmeansOptions}. */
export const DEFAULT_SPHERICAL_KMEANS_OPTIONS: Readonly<Omit<SphericalKmeansOptions, 'random'>> = Object.freeze({
  restarts: 4,
  maxIterations: 100,
  seedTrials: 0,
  initial: null,
  initialLabels: null,
  maxBoundPairs: ELKAN_MAX_PAIRS,
  stage: 'kmeans',
});

/** Result of {@link sphericalKmeansSteps}. */
export interface SphericalKmeansResult {
  /** Cluster per row, 0..k-1. */
  labels: Int32Array;
  /** Unit centroids, k×cols row-major. */
  centroids: Float32Array;
  /** Σ (1 − x·c) over rows: the cosine distance to the own centroid, summed. */
  objective: number;
  /** Lloyd iterations of the kept run. */
  iterations: number;
}

/**
 * Clusters the rows of `data` (unit length expected) into `k` groups.
 * @param data rows to cluster
 * @param k number of clusters, 1 ≤ k ≤ rows
 * @param opts see {@link SphericalKmeansOptions}
 */
export function* sphericalKmeansSteps(data: DenseView, k: number, opts: Partial<SphericalKmeansOptions> = {}): Stepwise<SphericalKmeansResult> {
  const o: SphericalKmeansOptions = { ...DEFAULT_SPHERICAL_KMEANS_OPTIONS, random: seededRandom(1), ...opts };
  if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a positive integer; got ${k}`);
  if (k > data.rows) throw new RangeError(`k = ${k} exceeds the ${data.rows} rows to cluster; choose k ≤ ${data.rows}`);
  if (!Number.isInteger(o.restarts) || o.restarts < 1) throw new RangeError(`restarts must be a positive integer; got ${o.restarts}`);
  if (!Number.isInteger(o.maxIterations) || o.maxIterations < 1) throw new RangeError(`maxIterations must be a positive integer; got ${o.maxIterations}`);
  if (o.initial && o.initial.length % data.cols !== 0) throw new RangeError('initial centroids must be whole rows of the data width');
  if (!(o.maxBoundPairs >= 0)) throw new RangeError(`maxBoundPairs must be a number ≥ 0; got ${o.maxBoundPairs}`);
  if (o.initialLabels) {
    const given = o.initial ? o.initial.length / data.cols : 0;
    if (o.initialLabels.length !== data.rows) throw new RangeError(`initialLabels has ${o.initialLabels.length} entries for ${data.rows} rows`);
    for (const c of o.initialLabels) if (!(c >= 0 && c < given)) throw new RangeError(`initialLabels must name one of the ${given} initial centroids; found ${c}`);
  }
  const step: Step = { stage: o.stage, done: 0, total: o.restarts * (o.maxIterations + 1) };
  const n = data.rows;
  const d = data.cols;
  // One Float64 copy keeps every hot loop on a single array type (and full precision).
  const x = data.data instanceof Float64Array ? data.data : Float64Array.from(data.data);
  let best: SphericalKmeansResult | null = null;
  for (let r = 0; r < o.restarts; r++) {
    const seeds = yield* seedSteps(x, n, d, k, r === 0 ? o.initial : null, r === 0 ? o.initialLabels : null, o.seedTrials, o.random, step);
    const run = yield* lloydSteps(x, n, d, k, seeds, o.maxIterations, r === 0 ? o.initialLabels : null, o.maxBoundPairs, step);
    if (!best || run.objective < best.objective) best = run;
    step.done = (r + 1) * (o.maxIterations + 1);
    yield { ...step };
  }
  return best!;
}

/** Plain form of {@link sphericalKmeansSteps}. */
export function sphericalKmeans(data: DenseView, k: number, opts: Partial<SphericalKmeansOptions> = {}): SphericalKmeansResult {
  return drain(sphericalKmeansSteps(data, k, opts));
}

/**
 * Moves centroids to the normalised sums of their members and returns whether an emptied cluster
 * had to be refilled (all bounds are then void); `shift` gets each centroid's move. An emptied
 * cluster takes the worst-fitting row of a cluster with others left.
 *
 * The sums are kept between iterations (`prev` holds the labels they were summed for; `first`
 * sums from scratch) and only rows that changed cluster are moved between them: late in a run a
 * handful of rows move, and a centroid whose members did not change keeps a shift of exactly 0,
 * so the bounds of its rows stay tight.
 */
function updateCentroids(x: Float64Array, n: number, d: number, k: number, centroids: Float64Array, labels: Int32Array, upper: Float64Array, sums: Float64Array, counts: Int32Array, shift: Float64Array, prev: Int32Array, first: boolean, changed: Uint8Array): boolean {
  changed.fill(first ? 1 : 0);
  shift.fill(0);
  if (first) {
    sums.fill(0);
    counts.fill(0);
    for (let i = 0; i < n; i++) {
      const c = labels[i];
      counts[c]++;
      const ci = c * d;
      const xi = i * d;
      for (let a = 0; a < d; a++) sums[ci + a] += x[xi + a];
    }
  } else {
    for (let i = 0; i < n; i++) {
      const c = labels[i];
      const was = prev[i];
      if (c === was) continue;
      counts[was]--;
      counts[c]++;
      changed[was] = 1;
      changed[c] = 1;
      const wi = was * d;
      const ci = c * d;
      const xi = i * d;
      for (let a = 0; a < d; a++) {
        sums[wi + a] -= x[xi + a];
        sums[ci + a] += x[xi + a];
      }
    }
  }
  let reset = false;
  for (let c = 0; c < k; c++) {
    if (counts[c] > 0) continue;
    let worst = -1;
    let worstDist = -1;
    for (let i = 0; i < n; i++) {
      if (counts[labels[i]] > 1 && upper[i] > worstDist) { worstDist = upper[i]; worst = i; }
    }
    if (worst < 0) continue;
    const from = labels[worst];
    counts[from]--;
    for (let a = 0; a < d; a++) sums[from * d + a] -= x[worst * d + a];
    labels[worst] = c;
    counts[c] = 1;
    for (let a = 0; a < d; a++) sums[c * d + a] = x[worst * d + a];
    changed[from] = 1;
    changed[c] = 1;
    reset = true;
  }
  prev.set(labels);
  for (let c = 0; c < k; c++) {
    // An emptied cluster that found no row keeps its centroid (its sum is only rounding residue).
    if (changed[c] === 0 || counts[c] === 0) continue;
    let norm = 0;
    for (let a = 0; a < d; a++) norm += sums[c * d + a] * sums[c * d + a];
    if (!(norm > 0)) { shift[c] = 0; continue; }
    const inv = 1 / Math.sqrt(norm);
    let cos = 0;
    for (let a = 0; a < d; a++) cos += centroids[c * d + a] * sums[c * d + a] * inv;
    for (let a = 0; a < d; a++) centroids[c * d + a] = sums[c * d + a] * inv;
    shift[c] = chord(cos);
  }
  return reset;
}

/** Lloyd iterations with Elkan or Hamerly bounds from the given centroids until no row moves. */
function* lloydSteps(x: Float64Array, n: number, d: number, k: number, centroids: Float64Array, maxIterations: number, hint: Int32Array | null, maxBoundPairs: number, step: Step): Generator<Step, SphericalKmeansResult, void> {
  // Per-pair bounds (Elkan) where n·k allows, one bound per row (Hamerly) otherwise; both give
  // exactly the assignments of a plain scan.
  const elkan = elkanFits(n, k, maxBoundPairs) ? elkanBounds(n, k) : null;
  const bounds: HamerlyBounds = elkan ?? { labels: new Int32Array(n).fill(-1), upper: new Float64Array(n), lower: new Float64Array(n), half: new Float64Array(k) };
  const sums = new Float64Array(k * d);
  const counts = new Int32Array(k);
  const shift = new Float64Array(k);
  const prev = new Int32Array(n);
  const changed = new Uint8Array(k);
  const block = sliceOf(k * d);
  const base = step.done;
  let iterations = 0;
  for (let it = 0; it < maxIterations; it++) {
    iterations = it + 1;
    if (elkan) elkanCentroidGaps(d, k, centroids, elkan);
    else hamerlyGaps(d, k, centroids, bounds.half);
    let moved = 0;
    for (let i0 = 0; i0 < n; i0 += block) {
      const i1 = Math.min(n, i0 + block);
      if (elkan && hint && it === 0) {
        // Every row counts as placed on the first pass, as after a full scan, so the centroids
        // are always moved to their members' means at least once.
        elkanStartFromLabels(x, d, k, centroids, elkan, hint, i0, i1);
        elkanAssignRange(x, d, k, centroids, elkan, i0, i1);
        moved += i1 - i0;
      } else {
        moved += elkan ? elkanAssignRange(x, d, k, centroids, elkan, i0, i1) : hamerlyAssignRange(x, d, k, centroids, bounds, i0, i1);
      }
      yield { ...step };
    }
    if (moved === 0) break;
    const reset = updateCentroids(x, n, d, k, centroids, bounds.labels, bounds.upper, sums, counts, shift, prev, it === 0, changed);
    if (elkan) elkanShift(n, k, shift, elkan, reset);
    else hamerlyShift(n, k, shift, bounds, reset);
    step.done = base + iterations;
    yield { ...step };
  }
  let objective = 0;
  for (let i = 0; i < n; i++) objective += 1 - dot(x, i * d, centroids, bounds.labels[i] * d, d);
  return { labels: bounds.labels, centroids: Float32Array.from(centroids), objective, iterations };
}
