import type { Dense } from '../common/matrix.js';
import { sampleIndices } from '../common/random.js';
import type { Step, Stepwise } from '../common/step.js';
import type { FuzzyGraph, KnnOptions } from './api.js';
import { fillFromSample } from './fill-from-sample.js';
import { fuzzyGraphSteps } from './fuzzy-graph.js';
import { nearestNeighborsSteps } from './nearest-neighbors.js';
import { optimizeLayoutSteps, type LayoutSettings } from './optimize-layout.js';

/** Settings of {@link sampleStartSteps}, already merged and validated by the caller. */
export interface SampleStartSettings extends Omit<LayoutSettings, 'epochs'> {
  /** Points in the sample. */
  size: number;
  /** Layout epochs of the sample. */
  epochs: number;
  /** Neighbours per point in the sample's own kNN graph, self excluded. */
  k: number;
  /** Options of the sample's neighbour search. */
  knn: Partial<Omit<KnnOptions, 'k' | 'random'>>;
}

/** Shares of the "sketch" stage's progress: the sample's neighbour search, then its layout. */
const KNN_SHARE = 0.3;
const SCALE = 1000;

/**
 * A starting layout for many points from a laid-out sample: a seeded sample of `size` points gets
 * its own kNN graph, fuzzy graph and UMAP layout (from its rows of `start`), scaled by
 * √(n / size) to leave room for the points filled in between (on the bench data the scale made no
 * clear difference: 1, 1.25, 1.6 and √10 gave the same maps); the other points are then filled in
 * over the whole graph (see fillFromSample). The full layout that follows only
 * has to settle neighbourhoods, not find the map's global arrangement from the principal axes,
 * which a few dozen passes over 50,000 points often fail to do on real text.
 * Yields `{stage: "sketch"}` steps.
 * @param rows the n unit rows
 * @param graph the fuzzy graph over all n rows
 * @param start n×2 starting positions (the principal axes): the sample starts from its rows, and
 *   points the graph never connects to the sample are placed through them
 * @param s settings
 * @returns n×2 positions, interleaved
 */
export function* sampleStartSteps(rows: Dense, graph: FuzzyGraph, start: Float64Array, s: SampleStartSettings): Stepwise<Float64Array> {
  const n = rows.rows;
  const d = rows.cols;
  const m = Math.min(n, s.size);
  const sample = sampleIndices(n, m, s.random);
  const sub: Dense = { rows: m, cols: d, data: new Float32Array(m * d) };
  const subStart = new Float64Array(2 * m);
  for (let t = 0; t < m; t++) {
    sub.data.set(rows.data.subarray(sample[t] * d, sample[t] * d + d), t * d);
    subStart[2 * t] = start[2 * sample[t]];
    subStart[2 * t + 1] = start[2 * sample[t] + 1];
  }
  yield { stage: 'sketch', done: 0, total: SCALE };
  const k = Math.min(s.k, m - 1);
  const knn = yield* within(nearestNeighborsSteps(sub, { ...s.knn, k, random: s.random }, s.spare), 0, KNN_SHARE);
  const subGraph = yield* within(fuzzyGraphSteps(knn, k + 1), KNN_SHARE, KNN_SHARE);
  const laid = yield* within(optimizeLayoutSteps(subGraph, subStart, { ...s, epochs: s.epochs }), KNN_SHARE, 1);
  const scale = Math.sqrt(n / m);
  for (let t = 0; t < 2 * m; t++) laid[t] *= scale;
  const out = fillFromSample(graph, sample, laid, start, s.random);
  yield { stage: 'sketch', done: SCALE, total: SCALE };
  return out;
}

/** Passes an inner phase's steps on as "sketch" progress between the fractions `from` and `to`. */
function* within<R>(inner: Stepwise<R>, from: number, to: number): Stepwise<R> {
  let r = inner.next();
  for (; !r.done; r = inner.next()) {
    const step: Step = r.value;
    const f = step.total > 0 ? Math.min(1, step.done / step.total) : 0;
    yield { stage: 'sketch', done: Math.round(SCALE * (from + (to - from) * f)), total: SCALE };
  }
  return r.value;
}
