/**
 * NN-descent's local join (Dong, Moses & Li 2011) in two halves: the candidate pairs of a slice
 * of points and their distances (the dot products, nearly all of the cost), then the offers to
 * the neighbour lists in the very order of the one-thread loop. Candidates are fixed for a whole
 * round, so a spare thread can measure the next slice's pairs while this thread offers the
 * current one's: same lists, same graph, with or without it.
 */
import type { Pending, Spare } from '../common/spare.js';
import { sharedFloat64, sharedInt32 } from '../common/spare.js';
import { heapPush, rowCosineDistance, type NeighborHeap } from './neighbor-heap.js';

/**
 * Share of each slice's pairs the spare thread measures; this thread also makes every offer and
 * draws the candidates. Measured on the bench data (n = 50,000), this thread waited for the spare
 * 0.24–0.64 s per search at 0.6 and 0.28–0.69 s at 0.65 (the machine's noise is larger than the
 * difference); before offers rejected far pairs early, 0.7 balanced best.
 */
const SPARE_SHARE = 0.6;

/** Candidate pairs of one slice and their distances. */
export interface PairBuffer {
  /** p, q of each pair. */
  pairs: Int32Array;
  distances: Float64Array;
  count: number;
}

/** Room for `most` pairs. */
export function pairBuffer(most: number, shared: boolean): PairBuffer {
  return {
    pairs: shared ? sharedInt32(2 * most) : new Int32Array(2 * most),
    distances: shared ? sharedFloat64(most) : new Float64Array(most),
    count: 0,
  };
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

/** Input of the spare task `knn.distances`: distances of pairs [from, to). */
export interface DistancesInput { data: Float32Array; cols: number; pairs: Int32Array; distances: Float64Array; from: number; to: number }

/** Cosine distances of pairs [from, to) of a buffer. */
export function pairDistances(i: DistancesInput): void {
  const { data, cols, pairs, distances } = i;
  for (let c = i.from; c < i.to; c++) distances[c] = rowCosineDistance(data, cols, pairs[2 * c], pairs[2 * c + 1]);
}

/**
 * Offers every measured pair to both lists, skipping pairs that already list each other (their
 * distance could change neither list); returns the number of list changes.
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
    // A pair neither list would take (not nearer than either farthest neighbour) changes nothing,
    // linked or not: most pairs of the later rounds end here, before the list scans.
    if (!(d < roots[p * k]) && !(d < roots[q * k])) continue;
    if (linked(heap, p, q)) continue;
    changes += heapPush(heap, p, q, d, 1) + heapPush(heap, q, p, d, 1);
  }
  return changes;
}

/**
 * Whether p and q already list each other. Their distance then cannot change either list, and
 * scanning two lists of k integers costs far less than a dot product of two rows. On the bench
 * data at n = 50,000 this skips about one candidate pair in seven (1.3 of 9.7 million), with the
 * same graph as without the check.
 */
export function linked(heap: NeighborHeap, p: number, q: number): boolean {
  const k = heap.k;
  const idx = heap.indices;
  let found = false;
  for (let s = p * k, end = s + k; s < end; s++) {
    if (idx[s] === q) {
      found = true;
      break;
    }
  }
  if (!found) return false;
  for (let s = q * k, end = s + k; s < end; s++) if (idx[s] === p) return true;
  return false;
}

/** What a run of joins needs. */
export interface JoinRound {
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
 * thread offers one slice, the spare measures the next one.
 */
export function* joinSlices(r: JoinRound, slices: number, list: (slice: number, out: PairBuffer) => void): Generator<void, number, void> {
  const threads = r.spare.threads > 0;
  let changes = 0;
  // The spare takes the first SPARE_SHARE of a slice's pairs, this thread the rest (all of them
  // without a spare).
  const cutOf = (buf: PairBuffer) => (threads ? Math.floor(buf.count * SPARE_SHARE) : 0);
  const measure = (buf: PairBuffer): Pending<unknown> | null => {
    const cut = cutOf(buf);
    return cut > 0 ? r.spare.start('knn.distances', { data: r.data, cols: r.cols, pairs: buf.pairs, distances: buf.distances, from: 0, to: cut } satisfies DistancesInput) : null;
  };
  if (slices === 0) return 0;
  list(0, r.buffers[0]);
  let far = measure(r.buffers[0]);
  for (let slice = 0; slice < slices; slice++) {
    const buf = r.buffers[slice % 2];
    pairDistances({ data: r.data, cols: r.cols, pairs: buf.pairs, distances: buf.distances, from: far ? cutOf(buf) : 0, to: buf.count });
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
