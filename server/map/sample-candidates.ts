/**
 * NN-descent's candidate sampling (Dong, Moses & Li 2011): for every point, up to S "new" and S
 * "old" candidates drawn from its neighbours and its reverse neighbours. A random priority per
 * edge keeps a uniform sample of each list without building the reverse lists in full; new
 * neighbours that made it into a sample become old.
 *
 * The points are split in two halves so that a spare thread can sample one while this thread
 * samples the other: each half offers its edges to its own points' samples at once and keeps the
 * offers meant for the other half's points in a list, which the other half takes in afterwards.
 * The one-thread path runs exactly this schedule, so the sample is the same either way.
 */
import { sharedFloat64, sharedInt32, sharedUint8 } from '../common/spare.js';
import { heapPush, type NeighborHeap } from './neighbor-heap.js';

/** Offers one half keeps for the other half's points, in the order it made them. */
export interface Deferred {
  /** Receiving point, offered point, 1 for the new list / 0 for the old, per offer. */
  to: Int32Array;
  from: Int32Array;
  fresh: Uint8Array;
  priority: Float64Array;
  /** [0]: offers kept. */
  count: Int32Array;
}

/** Room for the offers of `points` points with k neighbours each. */
export function deferred(points: number, k: number, shared: boolean): Deferred {
  const cap = points * k;
  return shared
    ? { to: sharedInt32(cap), from: sharedInt32(cap), fresh: sharedUint8(cap), priority: sharedFloat64(cap), count: sharedInt32(1) }
    : { to: new Int32Array(cap), from: new Int32Array(cap), fresh: new Uint8Array(cap), priority: new Float64Array(cap), count: new Int32Array(1) };
}

/** Everything a half reads and writes. */
export interface SampleState {
  heap: NeighborHeap;
  fresh: NeighborHeap;
  old: NeighborHeap;
}

/** One half: its points [lo, hi), the seed of its priorities, its own and the other's offer lists. */
export interface SampleHalf {
  lo: number;
  hi: number;
  seed: number;
  keep: Deferred;
  take: Deferred;
}

/**
 * First pass of a half: clears its points' samples, then offers each of its edges (i, j) to i's
 * sample and to j's, keeping the offers for the other half's points.
 */
export function sampleOwn(st: SampleState, h: SampleHalf): void {
  const { heap, fresh, old } = st;
  const { k, indices, flags } = heap;
  const S = fresh.k;
  const { lo, hi, keep } = h;
  fresh.indices.fill(-1, lo * S, hi * S);
  fresh.distances.fill(Infinity, lo * S, hi * S);
  old.indices.fill(-1, lo * S, hi * S);
  old.distances.fill(Infinity, lo * S, hi * S);
  // Priorities come from an inline xorshift32 seeded once per round and half: the same seed
  // gives the same sample, without a closure call for each of the n·k edges.
  let rng = h.seed >>> 0;
  let kept = 0;
  for (let i = lo; i < hi; i++) {
    for (let s = i * k; s < i * k + k; s++) {
      const j = indices[s];
      if (j < 0) continue;
      rng ^= rng << 13;
      rng ^= rng >>> 17;
      rng ^= rng << 5;
      const priority = (rng >>> 0) / 4294967296;
      const isFresh = flags[s] === 1;
      const target = isFresh ? fresh : old;
      heapPush(target, i, j, priority, 0);
      if (j >= lo && j < hi) {
        heapPush(target, j, i, priority, 0);
      } else {
        keep.to[kept] = j;
        keep.from[kept] = i;
        keep.fresh[kept] = isFresh ? 1 : 0;
        keep.priority[kept] = priority;
        kept++;
      }
    }
  }
  keep.count[0] = kept;
}

/**
 * Second pass of a half (after both first passes): takes in the other half's offers for its
 * points, then marks as old its new neighbours that made it into their point's new sample.
 */
export function settleOwn(st: SampleState, h: SampleHalf): void {
  const { heap, fresh, old } = st;
  const { k, indices, flags } = heap;
  const S = fresh.k;
  const take = h.take;
  for (let c = 0, end = take.count[0]; c < end; c++) heapPush(take.fresh[c] === 1 ? fresh : old, take.to[c], take.from[c], take.priority[c], 0);
  for (let i = h.lo; i < h.hi; i++) {
    for (let s = i * k; s < i * k + k; s++) {
      if (flags[s] !== 1) continue;
      const j = indices[s];
      for (let c = i * S; c < i * S + S; c++) {
        if (fresh.indices[c] === j) {
          flags[s] = 0;
          break;
        }
      }
    }
  }
}

/** Input of the spare tasks `knn.sample-own` and `knn.settle-own`. */
export interface SampleInput {
  state: SampleState;
  half: SampleHalf;
}
