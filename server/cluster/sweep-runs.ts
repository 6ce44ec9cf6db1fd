/**
 * The parts of the k sweep that do not depend on one another, as plain functions a spare thread
 * can run (see spare-tasks.ts): a fresh k-means run at one k, and the silhouette curve of the
 * shuffled reference. Each draws from its own seeded stream, so the curve is the same whether
 * they run here or on another core, and in whatever order.
 */
import { seededRandom } from '../common/random.js';
import { drain, type Step, type Stepwise } from '../common/step.js';
import { restageSteps } from './restage.js';
import type { DenseView } from './api.js';
import { cosineSilhouette } from './silhouette.js';
import { sphericalKmeansSteps, type SphericalKmeansResult } from './spherical-kmeans.js';

/** One point of a silhouette curve. */
export interface KScore {
  k: number;
  silhouette: number;
}

/** A seed for a part of the sweep, mixed from the sweep's seed and the part's number. */
export function partSeed(seed: number, part: number): number {
  return (Math.imul(seed ^ 0x5bd1e995, 0x9e3779b1) + Math.imul(part + 1, 0x85ebca6b)) | 0;
}

/** Input of {@link freshRuns}. */
export interface FreshInput {
  /** The sample the sweep clusters (unit rows). */
  sub: DenseView;
  /** A subsample of it where fresh seedings converge first. */
  quarter: DenseView;
  k: number;
  /** Fresh runs to make; the best objective is kept. */
  runs: number;
  seed: number;
}

/** The best of `runs` fresh k-means runs at one k. */
export interface FreshRun {
  centroids: Float32Array;
  labels: Int32Array;
  objective: number;
}

/**
 * Fresh runs at one k: each converges on the quarter sample first, then finishes on the whole
 * sample from there (a few Lloyd passes instead of a full run). Capping fresh runs at 15
 * iterations instead made the curve noisy enough to stop the k rule early (WordNet glosses, k = 4).
 */
export function freshRuns(i: FreshInput): FreshRun | null {
  if (i.runs < 1) return null;
  const random = seededRandom(partSeed(i.seed, i.k));
  let best: SphericalKmeansResult | null = null;
  for (let r = 0; r < i.runs; r++) {
    const rough = drain(sphericalKmeansSteps(i.quarter, i.k, { restarts: 1, random }));
    const run = drain(sphericalKmeansSteps(i.sub, i.k, { restarts: 1, initial: rough.centroids, random }));
    if (!best || run.objective < best.objective) best = run;
  }
  return { centroids: best!.centroids, labels: best!.labels, objective: best!.objective };
}

/** Lloyd iterations of a reference run (see {@link referenceCurveSteps}). */
export const REFERENCE_ITERATIONS = 20;

/** Input of {@link referenceCurveSteps}. */
export interface ReferenceInput {
  /** Shuffled, re-normalised rows with no structure. */
  shuffled: DenseView;
  kMin: number;
  kMax: number;
  seed: number;
}

/**
 * The silhouette curve of k-means on the shuffled reference: one warm-started run per k
 * (structureless data has no better optimum to find), capped at 20 Lloyd iterations because on
 * such data k-means creeps on for dozens of iterations while the silhouette has long settled
 * (our measurement: 0.001 or less change after 20 on the bench corpora).
 */
export function* referenceCurveSteps(i: ReferenceInput, step: Step = { stage: 'sweep-k', done: 0, total: i.kMax - i.kMin + 1 }): Stepwise<KScore[]> {
  const random = seededRandom(partSeed(i.seed, -1));
  const out: KScore[] = [];
  let previous: Float32Array | null = null;
  let previousLabels: Int32Array | null = null;
  for (let k = i.kMin; k <= i.kMax; k++) {
    const run: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(i.shuffled, k, { restarts: 1, maxIterations: REFERENCE_ITERATIONS, initial: previous, initialLabels: previousLabels, random }), step.stage, step);
    previous = run.centroids;
    previousLabels = run.iterations < REFERENCE_ITERATIONS ? run.labels : null;
    out.push({ k, silhouette: cosineSilhouette(i.shuffled, run.labels, k).mean });
    step.done++;
    yield { ...step };
  }
  return out;
}
