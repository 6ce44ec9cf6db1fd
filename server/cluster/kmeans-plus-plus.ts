/**
 * Greedy k-means++ seeding on the unit sphere (Arthur & Vassilvitskii, "k-means++: the advantages
 * of careful seeding", SODA 2007; the greedy variant tries several candidates per pick and keeps
 * the one that lowers the potential most), D² measured as the squared chord 2 − 2·x·c.
 */
import type { Random } from '../common/random.js';
import type { Step } from '../common/step.js';
import { dot } from './unit-sphere.js';

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
export function* seedSteps(x: Float64Array, n: number, d: number, k: number, initial: Float32Array | null, initialLabels: Int32Array | null, seedTrials: number, random: Random, step: Step): Generator<Step, Float64Array, void> {
  const centroids = new Float64Array(k * d);
  const closest = new Float64Array(n).fill(Infinity);
  let trial = new Float64Array(n);
  let bestTrial = new Float64Array(n);
  let kept = false;
  const trials = seedTrials > 0 ? seedTrials : 2 + Math.floor(Math.log(k));
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
        let bestPotential = Infinity;
        kept = false;
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
          if (candPotential < bestPotential) {
            bestPotential = candPotential;
            pick = cand;
            // Keep the winner's distances: they are exactly what absorbing it would compute.
            const t0 = bestTrial;
            bestTrial = trial;
            trial = t0;
            kept = true;
          }
        }
      }
    }
    chosen.push(pick);
    for (let a = 0; a < d; a++) centroids[c * d + a] = x[pick * d + a];
    if (kept) {
      closest.set(bestTrial);
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

