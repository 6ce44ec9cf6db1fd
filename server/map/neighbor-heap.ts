/**
 * Fixed-size neighbour lists kept as max-heaps in flat typed arrays: list `i` owns slots
 * `i*k .. i*k+k-1`, its root (slot `i*k`) is its farthest neighbour, so a candidate is rejected
 * with one comparison. Shared by the exact and the approximate nearest-neighbour searches.
 */
import { sharedFloat64, sharedInt32, sharedUint8 } from '../common/spare.js';
import type { KernelSpace } from './row-kernel.js';

/** n neighbour lists of capacity k. `flags[s]` is 1 while slot `s` is "new" in NN-descent's sense. */
export interface NeighborHeap {
  n: number;
  k: number;
  indices: Int32Array;
  distances: Float64Array;
  flags: Uint8Array;
}

/**
 * Makes n empty lists of capacity k (index -1, distance +∞).
 * @param n number of lists
 * @param k capacity of each list
 * @param shared on shared memory, for a spare thread to work on
 * @param space a kernel's memory to take the arrays from instead (see {@link neighborHeapBytes})
 */
export function neighborHeap(n: number, k: number, shared = false, space?: KernelSpace): NeighborHeap {
  const indices = (space ? space.int32(n * k) : shared ? sharedInt32(n * k) : new Int32Array(n * k)).fill(-1);
  const distances = (space ? space.float64(n * k) : shared ? sharedFloat64(n * k) : new Float64Array(n * k)).fill(Infinity);
  const flags = space ? space.uint8(n * k) : shared ? sharedUint8(n * k) : new Uint8Array(n * k);
  return { n, k, indices, distances, flags };
}

/** Bytes of a {@link neighborHeap} taken from a kernel's memory, as kernelBytes counts them. */
export function neighborHeapBytes(n: number, k: number): number[] {
  return [4 * n * k, 8 * n * k, n * k];
}

/**
 * Offers neighbour `j` at distance `d` to list `i`. Keeps the k nearest, ignores a `j` already present.
 * @returns 1 if the list changed, else 0
 */
export function heapPush(h: NeighborHeap, i: number, j: number, d: number, flag: number): number {
  const k = h.k;
  const base = i * k;
  const dist = h.distances;
  const idx = h.indices;
  if (!(d < dist[base])) return 0;
  for (let s = base; s < base + k; s++) if (idx[s] === j) return 0;
  // Sift the new entry down from the root.
  let pos = 0;
  for (;;) {
    const left = 2 * pos + 1;
    if (left >= k) break;
    const right = left + 1;
    let child = left;
    if (right < k && dist[base + right] > dist[base + left]) child = right;
    if (dist[base + child] <= d) break;
    dist[base + pos] = dist[base + child];
    idx[base + pos] = idx[base + child];
    h.flags[base + pos] = h.flags[base + child];
    pos = child;
  }
  dist[base + pos] = d;
  idx[base + pos] = j;
  h.flags[base + pos] = flag;
  return 1;
}

/**
 * Sorts every list nearest first (empty slots last), in place. The heap property is lost afterwards.
 */
export function sortHeapRows(h: NeighborHeap): void {
  const { n, k, indices, distances } = h;
  for (let i = 0; i < n; i++) {
    const base = i * k;
    // Insertion sort: k is small (≈ 15), and this runs once.
    for (let a = base + 1; a < base + k; a++) {
      const d = distances[a];
      const j = indices[a];
      let b = a - 1;
      while (b >= base && (distances[b] > d || (distances[b] === d && indices[b] > j))) {
        distances[b + 1] = distances[b];
        indices[b + 1] = indices[b];
        b--;
      }
      distances[b + 1] = d;
      indices[b + 1] = j;
    }
  }
}

/**
 * Dot product of rows `i` and `j` of a row-major matrix with `cols` columns.
 * Unrolled by four: this is the innermost loop of every neighbour search.
 */
export function rowDot(data: Float32Array, cols: number, i: number, j: number): number {
  let a = i * cols;
  let b = j * cols;
  const end = a + cols - 3;
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  for (; a < end; a += 4, b += 4) {
    s0 += data[a] * data[b];
    s1 += data[a + 1] * data[b + 1];
    s2 += data[a + 2] * data[b + 2];
    s3 += data[a + 3] * data[b + 3];
  }
  const stop = i * cols + cols;
  for (; a < stop; a++, b++) s0 += data[a] * data[b];
  return s0 + s1 + s2 + s3;
}

/** Cosine distance of two unit rows, clamped at 0 against rounding. */
export function rowCosineDistance(data: Float32Array, cols: number, i: number, j: number): number {
  const d = 1 - rowDot(data, cols, i, j);
  return d > 0 ? d : 0;
}
