import type { Dense } from '../common/matrix.js';
import type { Stepwise } from '../common/step.js';
import { drain } from '../common/step.js';
import type { KnnGraph } from './api.js';
import { heapPush, neighborHeap, rowCosineDistance, sortHeapRows, type NeighborHeap } from './neighbor-heap.js';

/** Dot products computed between progress steps of the exact search (≈ 0.05 s at 100 dims). */
const PAIRS_PER_SLICE = 500_000;

/**
 * Exact k nearest neighbours by cosine distance on unit rows, by brute force over all pairs.
 * Used for small n (where it beats the approximate search) and as ground truth in tests.
 * Yields `{stage: "knn"}` steps.
 * @param x unit-length rows
 * @param k neighbours per point, self excluded; lists have empty slots (-1) when n - 1 < k
 */
export function* exactNeighborsSteps(x: Dense, k: number): Stepwise<KnnGraph> {
  if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a positive integer; got ${k}`);
  const n = x.rows;
  const heap = neighborHeap(n, k);
  const rowsPerSlice = Math.max(1, Math.floor(PAIRS_PER_SLICE / Math.max(1, n)));
  for (let start = 0; start < n; start += rowsPerSlice) {
    const end = Math.min(n, start + rowsPerSlice);
    for (let i = start; i < end; i++) {
      for (let j = i + 1; j < n; j++) {
        const d = rowCosineDistance(x.data, x.cols, i, j);
        heapPush(heap, i, j, d, 0);
        heapPush(heap, j, i, d, 0);
      }
    }
    yield { stage: 'knn', done: end, total: n };
  }
  return heapToGraph(heap);
}

/** The plain form of {@link exactNeighborsSteps}. */
export function exactNeighbors(x: Dense, k: number): KnnGraph {
  return drain(exactNeighborsSteps(x, k));
}

/** Sorts the lists of a neighbour heap and hands them out as a {@link KnnGraph}. */
export function heapToGraph(heap: NeighborHeap): KnnGraph {
  sortHeapRows(heap);
  const distances = new Float32Array(heap.n * heap.k);
  for (let s = 0; s < distances.length; s++) {
    distances[s] = heap.indices[s] < 0 ? Infinity : heap.distances[s];
  }
  return { n: heap.n, k: heap.k, indices: heap.indices, distances };
}
