/**
 * NN-descent's candidate sampling (Dong, Moses & Li 2011): for every point, up to S "new" and S
 * "old" candidates drawn from its neighbours and its reverse neighbours. A random priority per
 * edge keeps a uniform sample of each list without building the reverse lists in full; new
 * neighbours that made it into a sample become old.
 *
 * The points are split in two halves so that a spare thread can sample one while this thread
 * samples the other: each half offers its edges to its own points' samples at once and keeps the
 * offers meant for the other half's points in a list, which the other half takes in afterwards.
 * The one-thread path runs exactly this schedule, so the sample is the same either way. Both passes
 * run in the kernel of sample-kernel.ts, on arrays in the search's kernel memory.
 */
import type { NeighborHeap } from './neighbor-heap.js';
import type { KernelSpace } from './row-kernel.js';
import { sampleKernel } from './sample-kernel.js';

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

/** Room for the offers of `points` points with k neighbours each, in a kernel's memory. */
export function deferred(points: number, k: number, space: KernelSpace): Deferred {
  const cap = points * k;
  return { to: space.int32(cap), from: space.int32(cap), fresh: space.uint8(cap), priority: space.float64(cap), count: space.int32(1) };
}

/** Bytes of a {@link deferred} list, as kernelBytes counts them. */
export function deferredBytes(points: number, k: number): number[] {
  const cap = points * k;
  return [4 * cap, 4 * cap, cap, 8 * cap, 4];
}

/** Everything a half reads and writes: views on `memory`. */
export interface SampleState {
  memory: WebAssembly.Memory;
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

/** The addresses both passes start with (see sample-kernel.ts). */
function heads(st: SampleState, h: SampleHalf): number[] {
  const { heap, fresh, old } = st;
  return [heap.indices.byteOffset, heap.flags.byteOffset, heap.k, fresh.indices.byteOffset, fresh.distances.byteOffset, fresh.flags.byteOffset,
    old.indices.byteOffset, old.distances.byteOffset, old.flags.byteOffset, fresh.k, h.lo, h.hi];
}

const lists = (d: Deferred): number[] => [d.to.byteOffset, d.from.byteOffset, d.fresh.byteOffset, d.priority.byteOffset, d.count.byteOffset];

/**
 * First pass of a half: clears its points' samples, then offers each of its edges (i, j) to i's
 * sample and to j's, keeping the offers for the other half's points. Priorities come from an
 * inline xorshift32 seeded once per round and half: the same seed gives the same sample.
 */
export function sampleOwn(st: SampleState, h: SampleHalf): void {
  sampleKernel(st.memory).sampleOwn(...heads(st, h), h.seed | 0, ...lists(h.keep));
}

/**
 * Second pass of a half (after both first passes): takes in the other half's offers for its
 * points, then marks as old its new neighbours that made it into their point's new sample.
 */
export function settleOwn(st: SampleState, h: SampleHalf): void {
  sampleKernel(st.memory).settleOwn(...heads(st, h), ...lists(h.take));
}

/** Input of the spare tasks `knn.sample-own` and `knn.settle-own`. */
export interface SampleInput {
  state: SampleState;
  half: SampleHalf;
}
