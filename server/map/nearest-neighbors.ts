import { seededRandom } from '../common/random.js';
import type { Dense } from '../common/matrix.js';
import type { Stepwise } from '../common/step.js';
import { drain } from '../common/step.js';
import type { KnnGraph, KnnOptions } from './api.js';
import { exactNeighborsSteps, heapToGraph } from './exact-neighbors.js';
import type { Pending, Spare } from '../common/spare.js';
import { neighborHeap, neighborHeapBytes } from './neighbor-heap.js';
import { deferred, deferredBytes, sampleOwn, settleOwn, type SampleHalf, type SampleInput, type SampleState } from './sample-candidates.js';
import { joinSlices, listLeafPairs, listPairs, pairBuffer, pairBufferBytes, type PairBuffer } from './local-join.js';
import { KernelSpace, kernelBytes } from './row-kernel.js';
import { MAP_INLINE } from './spare-tasks.js';
import { randomProjectionTreeSteps, treeSpace, treeSpaceBytes, type TreeInput, type TreeLeaves } from './random-projection-tree.js';

/** Defaults of {@link nearestNeighborsSteps}; see {@link KnnOptions} for each field. */
export const DEFAULT_KNN_OPTIONS: Readonly<KnnOptions> = Object.freeze({
  k: 14,
  trees: 6,
  leafSize: 48,
  maxRounds: 6,
  delta: 0.01,
  sampleSize: 5,
  exactBelow: 2000,
  sliceSize: 2048,
  // Replaced by a fresh seededRandom(1) on every call, so the default is repeatable too.
  random: Math.random,
});

function validate(o: KnnOptions): void {
  const positiveInt = (name: keyof KnnOptions, v: number) => {
    if (!Number.isInteger(v) || v < 1) throw new RangeError(`knn option ${name} must be a positive integer; got ${v}`);
  };
  positiveInt('k', o.k);
  positiveInt('trees', o.trees);
  positiveInt('sampleSize', o.sampleSize);
  positiveInt('sliceSize', o.sliceSize);
  if (!Number.isInteger(o.leafSize) || o.leafSize < 2) throw new RangeError(`knn option leafSize must be an integer ≥ 2; got ${o.leafSize}`);
  if (!Number.isInteger(o.maxRounds) || o.maxRounds < 0) throw new RangeError(`knn option maxRounds must be a non-negative integer; got ${o.maxRounds}`);
  if (!Number.isInteger(o.exactBelow) || o.exactBelow < 0) throw new RangeError(`knn option exactBelow must be a non-negative integer; got ${o.exactBelow}`);
  if (!(o.delta >= 0 && o.delta < 1)) throw new RangeError(`knn option delta must be in [0, 1); got ${o.delta}`);
  if (typeof o.random !== 'function') throw new TypeError('knn option random must be a function returning numbers in [0, 1)');
}

/**
 * Approximate k nearest neighbours by cosine distance on unit rows: a few random-projection trees
 * give every point candidate neighbours from its leaves, then NN-descent (Dong, Moses & Li 2011,
 * "Efficient k-nearest neighbor graph construction for generic similarity measures", with their
 * sampling and new/old flags) refines the lists by comparing each point's neighbours with one another.
 * Up to `exactBelow` points the search is exact instead.
 *
 * Row dot products (tree splits and candidate distances), once most of the time, run in a
 * WebAssembly SIMD kernel on a memory of its own (row-kernel.ts). Candidate priorities come from
 * an inline generator rather than a call per edge, an offer farther than a list's farthest
 * neighbour is turned away before the list is scanned, and rounds stop once fewer than
 * `delta`·n·k list entries change.
 *
 * Yields `{stage: "knn"}` after every tree and every `sliceSize` points of a round; the same
 * `random` sequence gives the same graph.
 * @param x unit-length rows (zero rows should be removed beforehand: they have no direction)
 * @param opts see {@link KnnOptions}
 * @param spare a thread to build the later trees and measure candidate pairs on; the graph is the same without one
 */
export function* nearestNeighborsSteps(x: Dense, opts: Partial<KnnOptions> = {}, spare: Spare = MAP_INLINE): Stepwise<KnnGraph> {
  const o: KnnOptions = { ...DEFAULT_KNN_OPTIONS, random: seededRandom(1), ...opts };
  validate(o);
  const n = x.rows;
  if (n <= o.exactBelow || n <= o.k + 1) return yield* exactNeighborsSteps(x, o.k);

  const chunks = Math.ceil(n / o.sliceSize);
  const total = o.trees * (1 + chunks) + o.maxRounds * chunks;
  let done = 0;
  let xs: Dense = x;
  let perm: Int32Array | null = null;
  const shared = spare.threads > 0;
  // A leaf of L points gives L(L − 1)/2 pairs; a slice holds leaves of up to sliceSize + leafSize points.
  const leafPairs = Math.ceil(((o.sliceSize + o.leafSize) * o.leafSize) / 2);
  const S = o.sampleSize;
  // Each point pairs up to S new candidates among themselves and with up to S old ones.
  const roundPairs = o.sliceSize * ((S * (S - 1)) / 2 + S * S);
  // The SIMD kernels read rows and write results in a memory of their own (row-kernel.ts): the
  // rows as given (for the trees), the trees' buffers, the rows in leaf order and the four pair
  // buffers are all made there.
  const rowBytes = 4 * n * x.cols;
  const space = new KernelSpace(kernelBytes(
    rowBytes, rowBytes,
    ...Array.from({ length: o.trees }, () => treeSpaceBytes(n, x.cols)).flat(),
    ...pairBufferBytes(leafPairs), ...pairBufferBytes(leafPairs), ...pairBufferBytes(roundPairs), ...pairBufferBytes(roundPairs),
    ...neighborHeapBytes(n, o.k), 8,
    // The samples and the halves' offer lists (sample-kernel.ts).
    ...neighborHeapBytes(n, S), ...neighborHeapBytes(n, S), ...deferredBytes(n - (n >> 1), o.k), ...deferredBytes(n - (n >> 1), o.k),
  ));
  // The lists live there too, for the offers' kernel (offer-kernel.ts), with two counts of changes.
  const heap = neighborHeap(n, o.k, shared, space);
  const counts = space.int32(2);
  const xRows: Dense = { rows: n, cols: x.cols, data: space.float32(n * x.cols) };
  xRows.data.set(x.data);
  const trees = Array.from({ length: o.trees }, () => treeSpace(space, xRows));
  // Trees after the first draw from seeded streams of their own, so the spare thread can build
  // them while this thread builds the first; their leaves are then mapped into the first tree's order.
  const later = trees.slice(1).map((t) => {
    const seed = (Math.floor(o.random() * 4294967296) | 1) >>> 0;
    return spare.start<TreeLeaves>('knn.tree', { space: t, leafSize: o.leafSize, seed } satisfies TreeInput);
  });
  let inverse: Int32Array | null = null;
  let data = x.data;
  const leafBuffers: [PairBuffer, PairBuffer] = [pairBuffer(leafPairs, space), pairBuffer(leafPairs, space)];
  const started: Pending<unknown>[] = [];
  for (let t = 0; t < o.trees; t++) {
    let order: Int32Array;
    let bounds: Int32Array;
    if (t === 0) {
      const tree = randomProjectionTreeSteps(trees[0], o.leafSize, o.random);
      let r = tree.next();
      for (; !r.done; r = tree.next()) yield { stage: 'knn', done, total };
      bounds = r.value.bounds;
      // Work on a copy of the rows stored in the first tree's leaf order: neighbours then get
      // nearby numbers, so the lists, samples and rows a slice touches sit close together in memory.
      perm = r.value.order;
      xs = permuteRows(x, perm, space.float32(n * x.cols));
      inverse = new Int32Array(n);
      for (let i = 0; i < n; i++) inverse[perm[i]] = i;
      order = new Int32Array(n);
      for (let i = 0; i < n; i++) order[i] = i;
      data = xs.data;
    } else {
      const leaves = later[t - 1].wait();
      bounds = leaves.bounds;
      order = leaves.order;
      for (let i = 0; i < n; i++) order[i] = inverse![order[i]];
    }
    yield { stage: 'knn', done: ++done, total };
    // Leaves are joined in slices of about sliceSize points: leafStarts[c] is slice c's first leaf.
    const leafStarts = [0];
    const leaves = bounds.length - 1;
    for (let c = 0, leaf = 0; c < chunks; c++) {
      const stop = c === chunks - 1 ? n : Math.min(n, (c + 1) * o.sliceSize);
      while (leaf < leaves && bounds[leaf] < stop) leaf++;
      leafStarts.push(leaf);
    }
    const join = joinSlices({ memory: space.memory, data, cols: xs.cols, heap, counts, buffers: leafBuffers, spare, started }, chunks, (c, out) => listLeafPairs(order, bounds, leafStarts[c], leafStarts[c + 1], out));
    for (let j = join.next(); !j.done; j = join.next()) yield { stage: 'knn', done: ++done, total };
  }

  const fresh = neighborHeap(n, S, shared, space);
  const old = neighborHeap(n, S, shared, space);
  const sample: SampleState = { memory: space.memory, heap, fresh, old };
  const mid = n >> 1;
  const lists = [deferred(n - mid, o.k, space), deferred(n - mid, o.k, space)];
  const buffers: [PairBuffer, PairBuffer] = [pairBuffer(roundPairs, space), pairBuffer(roundPairs, space)];
  for (let round = 0; round < o.maxRounds; round++) {
    // The two halves of the sampling (see sample-candidates.ts): the second on the spare.
    const seeds = [0, 1].map(() => (Math.floor(o.random() * 4294967296) | 1) >>> 0);
    const halves: SampleHalf[] = [
      { lo: 0, hi: mid, seed: seeds[0], keep: lists[0], take: lists[1] },
      { lo: mid, hi: n, seed: seeds[1], keep: lists[1], take: lists[0] },
    ];
    let far = spare.start('knn.sample-own', { state: sample, half: halves[1] } satisfies SampleInput);
    sampleOwn(sample, halves[0]);
    far.wait();
    far = spare.start('knn.settle-own', { state: sample, half: halves[1] } satisfies SampleInput);
    settleOwn(sample, halves[0]);
    far.wait();
    yield { stage: 'knn', done, total };
    const join = joinSlices({ memory: space.memory, data, cols: xs.cols, heap, counts, buffers, spare, started }, chunks, (c, out) => listPairs(fresh, old, c * o.sliceSize, Math.min(n, (c + 1) * o.sliceSize), out));
    let j = join.next();
    for (; !j.done; j = join.next()) yield { stage: 'knn', done: ++done, total };
    if (j.value <= o.delta * n * o.k) break;
  }
  if (done < total) yield { stage: 'knn', done: total, total };
  // The spare has long reached its join tasks: they did their share or found it taken.
  for (const p of started) p.wait();
  const graph = heapToGraph(heap);
  return perm ? unpermute(graph, perm) : graph;
}

/** The rows of x in the order `perm` (row r of the result is row perm[r] of x), written into `data`. */
function permuteRows(x: Dense, perm: Int32Array, data: Float32Array): Dense {
  const d = x.cols;
  for (let r = 0; r < x.rows; r++) data.set(x.data.subarray(perm[r] * d, perm[r] * d + d), r * d);
  return { rows: x.rows, cols: d, data };
}

/** Maps a graph over permuted rows back to the original row numbers. */
function unpermute(g: KnnGraph, perm: Int32Array): KnnGraph {
  const { n, k } = g;
  const indices = new Int32Array(n * k);
  const distances = new Float32Array(n * k);
  for (let r = 0; r < n; r++) {
    const to = perm[r] * k;
    for (let s = 0; s < k; s++) {
      const j = g.indices[r * k + s];
      indices[to + s] = j < 0 ? -1 : perm[j];
      distances[to + s] = g.distances[r * k + s];
    }
  }
  return { n, k, indices, distances };
}

/** The plain form of {@link nearestNeighborsSteps}. */
export function nearestNeighbors(x: Dense, opts: Partial<KnnOptions> = {}, spare: Spare = MAP_INLINE): KnnGraph {
  return drain(nearestNeighborsSteps(x, opts, spare));
}
