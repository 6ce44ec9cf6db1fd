/**
 * NN-descent's local join (Dong, Moses & Li 2011) in two halves: the candidate pairs of a slice
 * of points and their distances (measured by the SIMD kernel in row-kernel.ts), then
 * the offers to the neighbour lists. Candidates are fixed for a whole round, so the next slice can
 * be measured, mostly by a spare thread, while this thread offers the current one in the very
 * order of the one-thread loop: same lists, same graph, with or without it.
 */
import type { Pending, Spare } from '../common/spare.js';
import { heapPush, type NeighborHeap } from './neighbor-heap.js';
import { pairDistances, type DistancesInput, type KernelSpace } from './row-kernel.js';

/**
 * Share of each slice's pairs whose distances the spare measures; this thread, which also lists
 * the pairs and makes every offer, measures the rest.
 */
const SPARE_SHARE = 0.6;

/** Candidate pairs of one slice and their distances. */
export interface PairBuffer {
  /** p, q of each pair. */
  pairs: Int32Array;
  distances: Float64Array;
  count: number;
}

/** Room for `most` pairs, taken from the kernel's memory. */
export function pairBuffer(most: number, space: KernelSpace): PairBuffer {
  return { pairs: space.int32(2 * most), distances: space.float64(most), count: 0 };
}

/** Bytes of a {@link pairBuffer} for `most` pairs, as {@link kernelBytes} counts them. */
export function pairBufferBytes(most: number): number[] {
  return [8 * most, 8 * most];
}

/**
 * Lists the pairs the join of points [start, end) compares, in the one-thread order: new×new,
 * then new×old. Pairs with an empty slot or a point paired with itself never count.
 */
export function listPairs(fresh: NeighborHeap, old: NeighborHeap, start: number, end: number, out: PairBuffer): void {
  const S = fresh.k;
  const fi = fresh.indices;
  const oi = old.indices;
  const pairs = out.pairs;
  let c = 0;
  for (let i = start; i < end; i++) {
    const base = i * S;
    for (let a = base; a < base + S; a++) {
      const p = fi[a];
      if (p < 0) continue;
      for (let b = a + 1; b < base + S; b++) {
        const q = fi[b];
        if (q < 0) continue;
        pairs[2 * c] = p;
        pairs[2 * c + 1] = q;
        c++;
      }
      for (let b = base; b < base + S; b++) {
        const q = oi[b];
        if (q < 0 || q === p) continue;
        pairs[2 * c] = p;
        pairs[2 * c + 1] = q;
        c++;
      }
    }
  }
  out.count = c;
}

/**
 * Offers every measured pair (p, q) to p's list and to q's, in pair order; returns the number of
 * list changes. A distance not below a list's farthest neighbour is rejected by one comparison
 * before the list is scanned (most pairs of the later rounds end there), and a pair whose points
 * already list each other changes neither list.
 */
export function offerPairs(heap: NeighborHeap, buf: PairBuffer): number {
  const { pairs, distances } = buf;
  const roots = heap.distances;
  const k = heap.k;
  let changes = 0;
  for (let c = 0; c < buf.count; c++) {
    const p = pairs[2 * c];
    const q = pairs[2 * c + 1];
    const d = distances[c];
    if (d < roots[p * k]) changes += heapPush(heap, p, q, d, 1);
    if (d < roots[q * k]) changes += heapPush(heap, q, p, d, 1);
  }
  return changes;
}

/** What a run of joins needs. */
export interface JoinRound {
  /** The kernel's memory, which holds `data` and the buffers. */
  memory: WebAssembly.Memory;
  data: Float32Array;
  cols: number;
  heap: NeighborHeap;
  /** Two buffers: one being offered while the other is measured. */
  buffers: [PairBuffer, PairBuffer];
  spare: Spare;
}

/**
 * Joins `slices` slices of candidate pairs, `list(s, buffer)` filling slice s's pairs in the
 * one-thread order, yielding after each slice; returns the number of list changes. While this
 * thread offers one slice, the spare measures (most of) the next one.
 */
export function* joinSlices(r: JoinRound, slices: number, list: (slice: number, out: PairBuffer) => void): Generator<void, number, void> {
  if (slices === 0) return 0;
  const threads = r.spare.threads > 0;
  // The spare measures the first SPARE_SHARE of a slice's pairs, this thread the rest (all of
  // them without a spare).
  const cutOf = (buf: PairBuffer) => (threads ? Math.floor(buf.count * SPARE_SHARE) : 0);
  const distances = (buf: PairBuffer, from: number, to: number): DistancesInput => ({ memory: r.memory, data: r.data, cols: r.cols, pairs: buf.pairs, distances: buf.distances, from, to });
  const measure = (buf: PairBuffer): Pending<unknown> | null => (cutOf(buf) > 0 ? r.spare.start('knn.distances', distances(buf, 0, cutOf(buf))) : null);
  let changes = 0;
  list(0, r.buffers[0]);
  let far = measure(r.buffers[0]);
  for (let slice = 0; slice < slices; slice++) {
    const buf = r.buffers[slice % 2];
    pairDistances(distances(buf, far ? cutOf(buf) : 0, buf.count));
    far?.wait();
    if (slice + 1 < slices) {
      const other = r.buffers[(slice + 1) % 2];
      list(slice + 1, other);
      far = measure(other);
    }
    changes += offerPairs(r.heap, buf);
    yield;
  }
  return changes;
}

/** Lists the pairs within the leaves `order[bounds[l] .. bounds[l+1])` for leaves l0..l1. */
export function listLeafPairs(order: Int32Array, bounds: Int32Array, l0: number, l1: number, out: PairBuffer): void {
  const pairs = out.pairs;
  let c = 0;
  for (let l = l0; l < l1; l++) {
    const start = bounds[l], end = bounds[l + 1];
    for (let a = start; a < end; a++) {
      const p = order[a];
      for (let b = a + 1; b < end; b++) {
        pairs[2 * c] = p;
        pairs[2 * c + 1] = order[b];
        c++;
      }
    }
  }
  out.count = c;
}
