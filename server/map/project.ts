import { sharedFloat32, type Spare } from '../common/spare.js';
import { MAP_INLINE } from './spare-tasks.js';
import { seededRandom } from '../common/random.js';
import type { Dense } from '../common/matrix.js';
import type { Step, Stepwise } from '../common/step.js';
import { drain } from '../common/step.js';
import { findABParams } from 'umap-js/dist/umap.js';
import type { MapOptions } from './api.js';
import { fuzzyGraphSteps } from './fuzzy-graph.js';
import { randomLayout } from './initial-layout.js';
import { nearestNeighborsSteps } from './nearest-neighbors.js';
import { optimizeLayoutSteps } from './optimize-layout.js';
import { placeOnRing } from './place-on-ring.js';
import { sampleStartSteps } from './sample-start.js';

/** Defaults of {@link projectSteps}; see {@link MapOptions} for each field. */
export const DEFAULT_MAP_OPTIONS: Readonly<MapOptions> = Object.freeze({
  neighbors: 15,
  minDist: 0.1,
  spread: 1,
  epochs: 'auto',
  learningRate: 1,
  learningRateFall: 2,
  negativeSampleRate: 5,
  repulsionStrength: 1,
  nearbyShare: 0.25,
  nearbyReach: 3000,
  init: 'auto',
  sampleFrom: 20_000,
  sampleSize: 5_000,
  sampleEpochs: 25,
  knn: {},
  sliceEdges: 100_000,
  halvesFrom: 5_000,
  // Replaced by a fresh seededRandom(1) on every call, so the default is repeatable too.
  random: Math.random,
});

/** The last curve fit, kept because umap-js's least-squares fit took 50–120 ms here and options rarely change. */
let lastCurve: { spread: number; minDist: number; a: number; b: number } | null = null;

/**
 * The a, b of the low-dimensional similarity 1 / (1 + a·d^(2b)) fitted to spread and minDist,
 * by umap-js's `findABParams` (the least-squares fit UMAP uses for its min_dist and spread;
 * McInnes, Healy & Melville 2018).
 */
function curveParams(spread: number, minDist: number): { a: number; b: number } {
  if (!lastCurve || lastCurve.spread !== spread || lastCurve.minDist !== minDist) {
    lastCurve = { spread, minDist, ...findABParams(spread, minDist) };
  }
  return { a: lastCurve.a, b: lastCurve.b };
}

/** A row whose squared norm is below this counts as empty (a document with no content). */
const EMPTY_NORM2 = 1e-12;

/**
 * The epoch count `"auto"` stands for: 2,000,000 / n clamped to [40, 500] up to 10,000 points,
 * 1,500,000 / n with a floor of 30 beyond (see {@link MapOptions.epochs}).
 * @param n number of points laid out
 */
export function autoEpochs(n: number): number {
  const m = Math.max(1, n);
  return m <= 10_000 ? Math.min(500, Math.max(40, Math.round(2_000_000 / m))) : Math.max(30, Math.round(1_500_000 / m));
}

function validate(o: MapOptions): void {
  if (!Number.isInteger(o.neighbors) || o.neighbors < 2) throw new RangeError(`neighbors must be an integer ≥ 2; got ${o.neighbors}`);
  if (!(o.spread > 0 && Number.isFinite(o.spread))) throw new RangeError(`spread must be a positive number; got ${o.spread}`);
  if (!(o.minDist >= 0 && o.minDist <= o.spread)) throw new RangeError(`minDist must be in [0, spread = ${o.spread}]; got ${o.minDist}`);
  if (o.epochs !== 'auto' && !(Number.isInteger(o.epochs) && o.epochs >= 1)) throw new RangeError(`epochs must be "auto" or a positive integer; got ${o.epochs}`);
  if (!(o.learningRate > 0 && Number.isFinite(o.learningRate))) throw new RangeError(`learningRate must be a positive number; got ${o.learningRate}`);
  if (!(o.learningRateFall > 0 && o.learningRateFall <= 10)) throw new RangeError(`learningRateFall must be a number in (0, 10]; got ${o.learningRateFall}`);
  if (!(o.negativeSampleRate > 0 && Number.isFinite(o.negativeSampleRate))) throw new RangeError(`negativeSampleRate must be a positive number; got ${o.negativeSampleRate}`);
  if (!(o.repulsionStrength >= 0 && Number.isFinite(o.repulsionStrength))) throw new RangeError(`repulsionStrength must be a non-negative number; got ${o.repulsionStrength}`);
  if (!(o.nearbyShare >= 0 && o.nearbyShare < 1)) throw new RangeError(`nearbyShare must be a number in [0, 1); got ${o.nearbyShare}`);
  if (!Number.isInteger(o.nearbyReach) || o.nearbyReach < 0) throw new RangeError(`nearbyReach must be an integer ≥ 0; got ${o.nearbyReach}`);
  if (!['auto', 'pca', 'random', 'sample'].includes(o.init)) throw new RangeError(`init must be "auto", "pca", "random" or "sample"; got ${String(o.init)}`);
  if (!Number.isInteger(o.sampleFrom) || o.sampleFrom < 3) throw new RangeError(`sampleFrom must be an integer ≥ 3; got ${o.sampleFrom}`);
  if (!Number.isInteger(o.sampleSize) || o.sampleSize < 3) throw new RangeError(`sampleSize must be an integer ≥ 3; got ${o.sampleSize}`);
  if (!Number.isInteger(o.sampleEpochs) || o.sampleEpochs < 1) throw new RangeError(`sampleEpochs must be a positive integer; got ${o.sampleEpochs}`);
  if (!Number.isInteger(o.sliceEdges) || o.sliceEdges < 1) throw new RangeError(`sliceEdges must be a positive integer; got ${o.sliceEdges}`);
  if (!Number.isInteger(o.halvesFrom) || o.halvesFrom < 2) throw new RangeError(`halvesFrom must be an integer ≥ 2; got ${o.halvesFrom}`);
  if (typeof o.random !== 'function') throw new TypeError('random must be a function returning numbers in [0, 1)');
}

function checkInput(x: Dense): void {
  if (!x || !(x.data instanceof Float32Array)) throw new TypeError('the map needs a Dense matrix with Float32Array data');
  if (!Number.isInteger(x.rows) || x.rows < 0 || !Number.isInteger(x.cols) || x.cols < 1) {
    throw new RangeError(`the map needs rows ≥ 0 and cols ≥ 1; got ${x.rows}×${x.cols}`);
  }
  if (x.data.length !== x.rows * x.cols) throw new RangeError(`matrix data has ${x.data.length} numbers; ${x.rows}×${x.cols} needs ${x.rows * x.cols}`);
}

/**
 * Each row's squared norm, checking that every value is finite on the way (one pass, in a plain
 * function rather than the generator, which V8 optimised less: 0.1 s of the map at n = 50,000).
 */
function squaredNorms(x: Dense): Float64Array {
  const { rows: n, cols: d, data } = x;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let c = i * d; c < i * d + d; c++) s += data[c] * data[c];
    if (!Number.isFinite(s)) {
      for (let c = i * d; c < i * d + d; c++) {
        if (!Number.isFinite(data[c])) throw new RangeError(`row ${i} holds a non-finite value (${data[c]}); the map needs finite numbers`);
      }
    }
    out[i] = s;
  }
  return out;
}

/** The rows `keep` of x, scaled to unit length by their `norms` (as they are without), on shared memory if `shared`. */
function keptRows(x: Dense, keep: number[], norms: Float64Array | null, shared: boolean): Dense {
  const d = x.cols;
  const m = keep.length;
  const data = shared ? sharedFloat32(m * d) : new Float32Array(m * d);
  for (let r = 0; r < m; r++) {
    const src = keep[r] * d;
    const inv = norms ? 1 / Math.sqrt(norms[keep[r]]) : 1;
    for (let c = 0; c < d; c++) data[r * d + c] = x.data[src + c] * inv;
  }
  return { rows: m, cols: d, data };
}

/**
 * Places every row on a 2-D map with UMAP (McInnes, Healy & Melville 2018): cosine kNN graph
 * (random-projection trees + NN-descent), fuzzy simplicial set, then SGD layout from a PCA start
 * or, for many points, from a laid-out sample (see {@link MapOptions.init}).
 *
 * Rows should be unit length (LSA rows are); others are normalised on a copy, since only their
 * direction matters for cosine neighbourhoods. Rows that are all zero (documents with no content)
 * have no direction: they are left out of the layout and placed on a small ring just to the right
 * of the map (radius 5% of the map's width, at least 0.5, centred that radius plus 10% of the width
 * past its right edge), so they are visible and never mixed with real neighbourhoods. With fewer than three non-empty rows
 * there is nothing to optimise: one row goes to (0, 0); two go to (−1, 0) and (1, 0), or both to
 * (0, 0) when identical. Identical rows are allowed anywhere: they become each other's nearest
 * neighbours and end up side by side.
 *
 * Yields steps with stages `"knn"`, `"graph"`, `"sketch"` (only when the start is a laid-out
 * sample: see {@link MapOptions.init}) and `"layout"`. The same `random` sequence (e.g.
 * `seededRandom(seed)`) gives the same map.
 * @param x n×d rows, normally the LSA-reduced documents
 * @param opts see {@link MapOptions}
 * @param spare a thread to share the work with (neighbour search, fuzzy graph, principal axes,
 *   sketch and layout); the map is the same without one
 * @returns n×2 positions, interleaved `[x0, y0, x1, y1, …]`, in row order
 */
export function* projectSteps(x: Dense, opts: Partial<MapOptions> = {}, spare: Spare = MAP_INLINE): Stepwise<Float32Array> {
  const o: MapOptions = { ...DEFAULT_MAP_OPTIONS, random: seededRandom(1), ...opts };
  validate(o);
  checkInput(x);
  const n = x.rows;
  const d = x.cols;
  const out = new Float32Array(2 * n);

  // Keep the rows with content, normalised if they are not unit length already; on shared
  // memory when there is a spare, which finds the principal axes on them.
  const norms = squaredNorms(x);
  const keep: number[] = [];
  const empty: number[] = [];
  let normalise = false;
  for (let i = 0; i < n; i++) {
    if (norms[i] < EMPTY_NORM2) {
      empty.push(i);
      normalise = true;
    } else {
      keep.push(i);
      if (Math.abs(norms[i] - 1) > 1e-4) normalise = true;
    }
  }
  const m = keep.length;
  const shared = spare.threads > 0;
  const rows: Dense = normalise || shared ? keptRows(x, keep, normalise ? norms : null, shared) : x;

  let placed: Float64Array;
  if (m < 3) {
    placed = new Float64Array(2 * m);
    if (m === 2) {
      let same = true;
      for (let c = 0; c < d && same; c++) same = rows.data[c] === rows.data[d + c];
      if (!same) {
        placed[0] = -1;
        placed[2] = 1;
      }
    }
  } else {
    const k = Math.min(o.neighbors - 1, m - 1);
    const knn = yield* nearestNeighborsSteps(rows, { ...o.knn, k, random: o.random }, spare);
    const init = o.init === 'auto' ? (m >= o.sampleFrom ? 'sample' : 'pca') : o.init;
    const pcaSeed = (Math.floor(o.random() * 4294967296) | 1) >>> 0;
    let last: Step = { stage: 'graph', done: 0, total: 0 };
    const graphSteps = fuzzyGraphSteps(knn, k + 1, spare);
    let g = graphSteps.next();
    // The fuzzy graph has handed the spare its half of the rows by its first step: the principal
    // axes go to the spare after it, while this thread symmetrises the graph.
    const axes = init === 'random' ? null : spare.start<Float64Array>('map.pca', { rows, seed: pcaSeed });
    for (; !g.done; g = graphSteps.next()) yield (last = g.value);
    const graph = g.value;
    const epochs = o.epochs === 'auto' ? autoEpochs(m) : o.epochs;
    const { a, b } = curveParams(o.spread, o.minDist);
    let start = axes ? axes.wait() : randomLayout(m, o.random);
    // The starting layout is a slice of work of its own: report it as the end of the graph stage.
    yield last;
    const layout = {
      a,
      b,
      learningRate: o.learningRate,
      learningRateFall: o.learningRateFall,
      negativeSampleRate: o.negativeSampleRate,
      repulsionStrength: o.repulsionStrength,
      nearbyShare: o.nearbyShare,
      nearbyReach: o.nearbyReach,
      sliceEdges: o.sliceEdges,
      halvesFrom: o.halvesFrom,
      random: o.random,
      spare,
    };
    if (init === 'sample' && m > o.sampleSize) {
      start = yield* sampleStartSteps(rows, graph, start, { ...layout, size: o.sampleSize, epochs: o.sampleEpochs, k, knn: o.knn });
    }
    placed = yield* optimizeLayoutSteps(graph, start, { ...layout, epochs });
  }
  for (let r = 0; r < m; r++) {
    out[2 * keep[r]] = placed[2 * r];
    out[2 * keep[r] + 1] = placed[2 * r + 1];
  }
  if (empty.length > 0) placeOnRing(out, keep, empty);
  return out;
}

/** The plain form of {@link projectSteps}. */
export function project(x: Dense, opts: Partial<MapOptions> = {}, spare: Spare = MAP_INLINE): Float32Array {
  return drain(projectSteps(x, opts, spare));
}
