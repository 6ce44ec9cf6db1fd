/**
 * Spherical k-means: k-means on unit vectors with cosine similarity, centroids re-normalised to
 * the sphere (Dhillon & Modha, "Concept decompositions for large sparse text data using
 * clustering", Machine Learning 42, 2001). Seeded by greedy k-means++ (Arthur & Vassilvitskii,
 * SODA 2007), with several restarts keeping the lowest objective.
 *
 * Assignment skips most distance computations with Hamerly's bounds (Hamerly, "Making k-means
 * even faster", SDM 2010): on the unit sphere the chord length ‖x − c‖ = √(2 − 2·x·c) is a metric,
 * so the triangle inequality applies to it and the result is exactly that of plain Lloyd steps.
 */
import type { Random } from '../common/random.js';
import { seededRandom } from '../common/random.js';
import type { Step, Stepwise } from '../common/step.js';
import { drain } from '../common/step.js';
import type { DenseView } from './api.js';

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
  const step: Step = { stage: o.stage, done: 0, total: o.restarts * (o.maxIterations + 1) };
  const n = data.rows;
  const d = data.cols;
  // One Float64 copy keeps every hot loop on a single array type (and full precision).
  const x = data.data instanceof Float64Array ? data.data : Float64Array.from(data.data);
  let best: SphericalKmeansResult | null = null;
  for (let r = 0; r < o.restarts; r++) {
    const seeds = yield* seedSteps(x, n, d, k, r === 0 ? o.initial : null, o.seedTrials, o.random, step);
    const run = yield* lloydSteps(x, n, d, k, seeds, o.maxIterations, step);
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

/** x[i..i+d) · c[j..j+d), four partial sums so the multiplies need not wait on one another. */
function dot(x: Float64Array, i: number, c: Float64Array, j: number, d: number): number {
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let a = 0;
  for (; a + 3 < d; a += 4) {
    s0 += x[i + a] * c[j + a];
    s1 += x[i + a + 1] * c[j + a + 1];
    s2 += x[i + a + 2] * c[j + a + 2];
    s3 += x[i + a + 3] * c[j + a + 3];
  }
  for (; a < d; a++) s0 += x[i + a] * c[j + a];
  return s0 + s1 + (s2 + s3);
}

/** Chord distance between unit vectors with the given cosine, clamped against rounding. */
function chord(cos: number): number {
  return Math.sqrt(Math.max(0, 2 - 2 * cos));
}

/** Rows per progress slice for work of `perRow` multiply-adds per row. */
function sliceOf(perRow: number): number {
  return Math.max(32, Math.floor(3e6 / Math.max(1, perRow)));
}

/** Lowers closest[i] to the squared chord distance to centroid c, rows i0..i1. */
function absorbRange(x: Float64Array, d: number, centroids: Float64Array, c: number, closest: Float64Array, i0: number, i1: number): void {
  for (let i = i0; i < i1; i++) {
    const dist2 = Math.max(0, 2 - 2 * dot(x, i * d, centroids, c * d, d));
    if (dist2 < closest[i]) closest[i] = dist2;
  }
}

/** Potential (Σ D²) over rows i0..i1 if row `cand` became a centre; trial[i] gets the new D². */
function candidateRange(x: Float64Array, d: number, cand: number, closest: Float64Array, trial: Float64Array, i0: number, i1: number): number {
  let potential = 0;
  for (let i = i0; i < i1; i++) {
    const dist2 = Math.max(0, 2 - 2 * dot(x, i * d, x, cand * d, d));
    const v = dist2 < closest[i] ? dist2 : closest[i];
    trial[i] = v;
    potential += v;
  }
  return potential;
}

/**
 * Greedy k-means++ on squared chord distance, continuing from `initial` rows if given.
 * Each pick draws `trials` candidates ∝ D² and keeps the one that lowers the potential most.
 */
function* seedSteps(x: Float64Array, n: number, d: number, k: number, initial: Float32Array | null, seedTrials: number, random: Random, step: Step): Generator<Step, Float64Array, void> {
  const centroids = new Float64Array(k * d);
  const closest = new Float64Array(n).fill(Infinity);
  const trial = new Float64Array(n);
  const trials = seedTrials > 0 ? seedTrials : 2 + Math.floor(Math.log(k));
  const given = initial ? Math.min(k, initial.length / d) : 0;
  const chosen: number[] = [];
  const block = sliceOf(d);
  for (let c = 0; c < given; c++) {
    for (let a = 0; a < d; a++) centroids[c * d + a] = initial![c * d + a];
    // Distances to given centres matter only when more centres are still to be picked.
    if (given === k) continue;
    for (let i0 = 0; i0 < n; i0 += block) {
      absorbRange(x, d, centroids, c, closest, i0, Math.min(n, i0 + block));
      yield { ...step };
    }
  }
  for (let c = given; c < k; c++) {
    let pick = -1;
    if (c === 0) {
      pick = Math.floor(random() * n);
    } else {
      let potential = 0;
      for (let i = 0; i < n; i++) potential += closest[i];
      if (!(potential > 0)) {
        // Every row coincides with a chosen centre (duplicates): take any row not yet chosen.
        pick = Math.floor(random() * n);
        for (let tries = 0; tries < n && chosen.includes(pick); tries++) pick = (pick + 1) % n;
      } else {
        let bestPotential = Infinity;
        for (let t = 0; t < trials; t++) {
          let target = random() * potential;
          let cand = n - 1;
          for (let i = 0; i < n; i++) {
            target -= closest[i];
            if (target < 0) { cand = i; break; }
          }
          let candPotential = 0;
          for (let i0 = 0; i0 < n; i0 += block) {
            candPotential += candidateRange(x, d, cand, closest, trial, i0, Math.min(n, i0 + block));
            yield { ...step };
          }
          if (candPotential < bestPotential) { bestPotential = candPotential; pick = cand; }
        }
      }
    }
    chosen.push(pick);
    for (let a = 0; a < d; a++) centroids[c * d + a] = x[pick * d + a];
    for (let i0 = 0; i0 < n; i0 += block) {
      absorbRange(x, d, centroids, c, closest, i0, Math.min(n, i0 + block));
      yield { ...step };
    }
  }
  return centroids;
}

/** Bound state of one Lloyd run. */
interface Bounds {
  labels: Int32Array;
  upper: Float64Array;
  lower: Float64Array;
  half: Float64Array;
}

/** Assigns rows i0..i1 to their nearest centroid, skipping rows Hamerly's bounds settle; returns rows that moved. */
function assignRange(x: Float64Array, d: number, k: number, centroids: Float64Array, b: Bounds, i0: number, i1: number): number {
  const { labels, upper, lower, half } = b;
  let moved = 0;
  for (let i = i0; i < i1; i++) {
    const own = labels[i];
    if (own >= 0) {
      const bound = Math.max(half[own], lower[i]);
      if (upper[i] <= bound) continue;
      upper[i] = chord(dot(x, i * d, centroids, own * d, d));
      if (upper[i] <= bound) continue;
    }
    // Nearest two by cosine (the chord is monotone in it), converted to chords once.
    let b1 = -1;
    let c1 = -Infinity;
    let c2 = -Infinity;
    for (let c = 0; c < k; c++) {
      const cos = dot(x, i * d, centroids, c * d, d);
      if (cos > c1) { c2 = c1; c1 = cos; b1 = c; } else if (cos > c2) c2 = cos;
    }
    const d1 = chord(c1);
    const d2 = c2 === -Infinity ? Infinity : chord(c2);
    if (b1 !== own) moved++;
    labels[i] = b1;
    upper[i] = d1;
    lower[i] = d2;
  }
  return moved;
}

/**
 * Moves centroids to the normalised sums of their members and updates the bounds by how far each
 * centroid moved. An emptied cluster takes the worst-fitting row of a cluster with others left.
 */
function updateCentroids(x: Float64Array, n: number, d: number, k: number, centroids: Float64Array, b: Bounds, sums: Float64Array, counts: Int32Array, shift: Float64Array): void {
  const { labels, upper, lower } = b;
  sums.fill(0);
  counts.fill(0);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    const ci = c * d;
    const xi = i * d;
    for (let a = 0; a < d; a++) sums[ci + a] += x[xi + a];
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
    reset = true;
  }
  let maxShift = 0;
  for (let c = 0; c < k; c++) {
    let norm = 0;
    for (let a = 0; a < d; a++) norm += sums[c * d + a] * sums[c * d + a];
    if (!(norm > 0)) { shift[c] = 0; continue; }
    const inv = 1 / Math.sqrt(norm);
    let cos = 0;
    for (let a = 0; a < d; a++) cos += centroids[c * d + a] * sums[c * d + a] * inv;
    for (let a = 0; a < d; a++) centroids[c * d + a] = sums[c * d + a] * inv;
    shift[c] = chord(cos);
    if (shift[c] > maxShift) maxShift = shift[c];
  }
  for (let i = 0; i < n; i++) {
    // Hamerly uses the largest shift among the other centroids; the overall largest is a safe bound.
    upper[i] = reset ? Infinity : upper[i] + shift[labels[i]];
    lower[i] = reset ? 0 : lower[i] - maxShift;
  }
}

/** s(j): half the chord from centroid j to its nearest other centroid. */
function halfGaps(d: number, k: number, centroids: Float64Array, half: Float64Array): void {
  half.fill(Infinity);
  for (let a = 0; a < k; a++) {
    for (let c = a + 1; c < k; c++) {
      const h = chord(dot(centroids, a * d, centroids, c * d, d)) / 2;
      if (h < half[a]) half[a] = h;
      if (h < half[c]) half[c] = h;
    }
  }
}

/** Lloyd iterations with Hamerly bounds from the given centroids until no row moves. */
function* lloydSteps(x: Float64Array, n: number, d: number, k: number, centroids: Float64Array, maxIterations: number, step: Step): Generator<Step, SphericalKmeansResult, void> {
  const bounds: Bounds = { labels: new Int32Array(n).fill(-1), upper: new Float64Array(n), lower: new Float64Array(n), half: new Float64Array(k) };
  const sums = new Float64Array(k * d);
  const counts = new Int32Array(k);
  const shift = new Float64Array(k);
  const block = sliceOf(k * d);
  const base = step.done;
  let iterations = 0;
  for (let it = 0; it < maxIterations; it++) {
    iterations = it + 1;
    halfGaps(d, k, centroids, bounds.half);
    let moved = 0;
    for (let i0 = 0; i0 < n; i0 += block) {
      moved += assignRange(x, d, k, centroids, bounds, i0, Math.min(n, i0 + block));
      yield { ...step };
    }
    if (moved === 0) break;
    updateCentroids(x, n, d, k, centroids, bounds, sums, counts, shift);
    step.done = base + iterations;
    yield { ...step };
  }
  let objective = 0;
  for (let i = 0; i < n; i++) objective += 1 - dot(x, i * d, centroids, bounds.labels[i] * d, d);
  return { labels: bounds.labels, centroids: Float32Array.from(centroids), objective, iterations };
}
