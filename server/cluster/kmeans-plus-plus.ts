/**
 * Greedy k-means++ seeding on the unit sphere (Arthur & Vassilvitskii, "k-means++: the advantages
 * of careful seeding", SODA 2007; the greedy variant tries several candidates per pick and keeps
 * the one that lowers the potential most), D² measured as the squared chord 2 − 2·x·c.
 */
import type { Random } from '../common/random.js';
import type { Step } from '../common/step.js';
import { dot, dotRows } from './unit-sphere.js';

/** Rows per progress slice for work of `perRow` multiply-adds per row. */
export function sliceOf(perRow: number): number {
  return Math.max(32, Math.floor(3e6 / Math.max(1, perRow)));
}

/** Lowers closest[i] to the squared chord distance to centroid c, rows i0..i1. */
function absorbRange(x: Float64Array, d: number, centroids: Float64Array, c: number, closest: Float64Array, i0: number, i1: number): void {
  for (let i = i0; i < i1; i++) {
    const dist2 = Math.max(0, 2 - 2 * dot(x, i * d, centroids, c * d, d));
    if (dist2 < closest[i]) closest[i] = dist2;
  }
}

/**
 * For rows i0..i1, the D² each candidate centre (rows of `cands`, t of them) would leave:
 * trial[c·n + i] = min(closest[i], chord²(x_i, cand c)), and each candidate's potential summed
 * into potentials[c]. All candidates in one pass over the rows: each row is read once.
 */
function candidatesRange(x: Float64Array, n: number, d: number, cands: Float64Array, t: number, closest: Float64Array, trial: Float64Array, potentials: Float64Array, dots: Float64Array, i0: number, i1: number): void {
  for (let i = i0; i < i1; i++) {
    dotRows(x, i * d, cands, 0, t, d, dots);
    const ci = closest[i];
    for (let c = 0; c < t; c++) {
      const dist2 = Math.max(0, 2 - 2 * dots[c]);
      const v = dist2 < ci ? dist2 : ci;
      trial[c * n + i] = v;
      potentials[c] += v;
    }
  }
}

/**
 * Greedy k-means++ on squared chord distance, continuing from `initial` rows if given.
 * Each pick draws `trials` candidates ∝ D² and keeps the one that lowers the potential most.
 */
export function* seedSteps(x: Float64Array, n: number, d: number, k: number, initial: Float32Array | null, initialLabels: Int32Array | null, seedTrials: number, random: Random, step: Step): Generator<Step, Float64Array, void> {
  const centroids = new Float64Array(k * d);
  const closest = new Float64Array(n).fill(Infinity);
  const trials = seedTrials > 0 ? seedTrials : 2 + Math.floor(Math.log(k));
  // Each candidate's D² per row, t rows of n: the winner's row becomes `closest`.
  const trial = new Float64Array(trials * n);
  const cands = new Float64Array(trials * d);
  const candIndex = new Int32Array(trials);
  const potentials = new Float64Array(trials);
  const dots = new Float64Array(trials);
  const candBlock = sliceOf(d * trials);
  let kept = false;
  const given = initial ? Math.min(k, initial.length / d) : 0;
  const chosen: number[] = [];
  const block = sliceOf(d);
  for (let c = 0; c < given; c++) for (let a = 0; a < d; a++) centroids[c * d + a] = initial![c * d + a];
  // Distances to given centres matter only when more centres are still to be picked.
  if (given < k && initialLabels) {
    for (let i0 = 0; i0 < n; i0 += block) {
      for (let i = i0, i1 = Math.min(n, i0 + block); i < i1; i++) closest[i] = Math.max(0, 2 - 2 * dot(x, i * d, centroids, initialLabels[i] * d, d));
      yield { ...step };
    }
  }
  for (let c = 0; c < given && given < k && !initialLabels; c++) {
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
        // Draw every candidate first (the draws do not depend on the evaluations), then measure
        // them together in one pass; the first of equal potentials wins, as one by one.
        for (let t = 0; t < trials; t++) {
          let target = random() * potential;
          let cand = n - 1;
          for (let i = 0; i < n; i++) {
            target -= closest[i];
            if (target < 0) { cand = i; break; }
          }
          candIndex[t] = cand;
          for (let a = 0; a < d; a++) cands[t * d + a] = x[cand * d + a];
        }
        potentials.fill(0);
        for (let i0 = 0; i0 < n; i0 += candBlock) {
          candidatesRange(x, n, d, cands, trials, closest, trial, potentials, dots, i0, Math.min(n, i0 + candBlock));
          yield { ...step };
        }
        let best = 0;
        for (let t = 1; t < trials; t++) if (potentials[t] < potentials[best]) best = t;
        pick = candIndex[best];
        // The winner's distances are exactly what absorbing it would compute.
        closest.set(trial.subarray(best * n, (best + 1) * n));
        kept = true;
      }
    }
    chosen.push(pick);
    for (let a = 0; a < d; a++) centroids[c * d + a] = x[pick * d + a];
    if (kept) {
      kept = false;
      continue;
    }
    for (let i0 = 0; i0 < n; i0 += block) {
      absorbRange(x, d, centroids, c, closest, i0, Math.min(n, i0 + block));
      yield { ...step };
    }
  }
  return centroids;
}

