/**
 * NN-descent's local join (Dong, Moses & Li 2011) in slices: the candidate pairs of a slice of
 * points, their distances (measured by the SIMD kernel in row-kernel.ts), then the offers to the
 * neighbour lists. Candidates are fixed for a whole round, so the next slice can be measured while
 * the current one is offered, and the offers split by list: one thread offers to one part of the
 * lists, the other to the rest (runs of 32 lists, alternately), each in pair order, so every list sees the
 * very offers of the one-thread loop in the same order: same lists, same graph, with or without a
 * spare.
 *
 * Who does what is claimed at run time on shared counters (a slice's "ticket"), not fixed in
 * advance: distances in blocks of {@link BLOCK} pairs, the second part's offers as one claim. So
 * this thread takes over whatever the spare has not reached, as when it is still building trees
 * (measured at 50,000 documents: a fixed 60/40 split of the distances left this thread waiting
 * 90–190 ms in the first tree's join, and idle spare time in every round).
 */
import type { Pending, Spare } from '../common/spare.js';
import { sharedInt32 } from '../common/spare.js';
import type { NeighborHeap } from './neighbor-heap.js';
import { offerKernel } from './offer-kernel.js';
import { pairDistances, type KernelSpace } from './row-kernel.js';

/** Pairs measured per claim: small enough that neither thread waits long for the other's last block. */
const BLOCK = 1024;

/** Words of a slice's ticket. */
const CURSOR = 0; // first pair not yet claimed for measuring
const MEASURED = 1; // pairs measured so far
const COUNT = 2; // pairs in the slice, set once listed
const SECOND = 3; // the offers to the second part of the lists: FREE, TAKEN or DONE
const SECOND_CHANGES = 4; // list changes those offers made
const TICKET = 5;
const FREE = 0;
const TAKEN = 1;
const DONE = 2;

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

/** Lists are dealt to the two threads in runs of 2^LIST_RUN, so they rarely write the same cache line. */
const LIST_RUN = 5;
/** A `part` of {@link offerPairs}: every list. */
export const ALL_LISTS = -1;

/**
 * Offers every measured pair (p, q) to p's list and to q's, in pair order; returns the number of
 * list changes. With `part` 0 or 1 only the lists of that part are offered to: runs of 32 lists
 * alternate between the parts, so both parts have about the same work in any slice. A distance
 * not below a list's farthest neighbour is rejected by one comparison before the list is scanned
 * (most pairs of the later rounds end there), and a pair whose points already list each other
 * changes neither list. A list's part is tested before its root, which is then read only for
 * this thread's lists (6% off the search). Runs in the kernel of offer-kernel.ts: the heap, the
 * pairs and `out` (where the kernel leaves the count) must be views on `memory`.
 * Measured (2026-12-02, bench glosses, 50,000 points): the offers were 1.07 s of the search's
 * 2.7 s of CPU as a TypeScript loop.
 */
export function offerPairs(memory: WebAssembly.Memory, heap: NeighborHeap, pairs: Int32Array, distances: Float64Array, count: number, part: number, out: Int32Array): number {
  if (heap.indices.buffer.byteLength !== memory.buffer.byteLength || pairs.buffer.byteLength !== memory.buffer.byteLength) {
    throw new RangeError("offerPairs needs the lists and pairs in the kernel's memory");
  }
  if (count > pairs.length / 2 || count > distances.length) throw new RangeError(`${count} pairs exceed the buffer`);
  // The kernel skips a list whose part, (l >> LIST_RUN) & 1, is `other`: never, for every list.
  const other = part === ALL_LISTS ? 2 : 1 - part;
  offerKernel(memory)(heap.indices.byteOffset, heap.distances.byteOffset, heap.flags.byteOffset, heap.k, pairs.byteOffset, distances.byteOffset, count, other, out.byteOffset);
  return out[0];
}

/** What a run of joins needs. */
export interface JoinRound {
  /** The kernel's memory, which holds `data` and the buffers. */
  memory: WebAssembly.Memory;
  data: Float32Array;
  cols: number;
  heap: NeighborHeap;
  /** Two i32s on `memory` where each part's offers leave their count of changes. */
  counts: Int32Array;
  /** Two buffers: one being offered while the other is measured. */
  buffers: [PairBuffer, PairBuffer];
  spare: Spare;
  /**
   * Tasks started on the spare and not waited for: the caller waits for them once the spare has
   * surely reached them (they find their claims taken and return at once if this thread did it all).
   */
  started: Pending<unknown>[];
}

/** Input of the spare task `knn.join-share`: its share of one slice's offers and of the next one's distances. */
export interface JoinShareInput {
  memory: WebAssembly.Memory;
  data: Float32Array;
  cols: number;
  heap: NeighborHeap;
  counts: Int32Array;
  tickets: Int32Array;
  /** The slice to offer to the second part of the lists, or −1. */
  offer: number;
  offerPairs: Int32Array;
  offerDistances: Float64Array;
  /** The slice to help measure, or −1. */
  measure: number;
  measurePairs: Int32Array;
  measureDistances: Float64Array;
}

/** Measures blocks of slice s's pairs until none is left unclaimed. */
function measureClaimed(memory: WebAssembly.Memory, data: Float32Array, cols: number, pairs: Int32Array, distances: Float64Array, tickets: Int32Array, s: number): void {
  const t = s * TICKET;
  const count = Atomics.load(tickets, t + COUNT);
  for (;;) {
    const from = Atomics.add(tickets, t + CURSOR, BLOCK);
    if (from >= count) return;
    const to = Math.min(count, from + BLOCK);
    pairDistances({ memory, data, cols, pairs, distances, from, to });
    if (Atomics.add(tickets, t + MEASURED, to - from) + to - from === count) Atomics.notify(tickets, t + MEASURED);
  }
}

/** Offers slice s to the second part of the lists if no thread has claimed that yet. */
function offerSecondClaimed(memory: WebAssembly.Memory, heap: NeighborHeap, counts: Int32Array, pairs: Int32Array, distances: Float64Array, tickets: Int32Array, s: number): void {
  const t = s * TICKET;
  if (Atomics.compareExchange(tickets, t + SECOND, FREE, TAKEN) !== FREE) return;
  const changes = offerPairs(memory, heap, pairs, distances, Atomics.load(tickets, t + COUNT), 1, counts.subarray(1, 2));
  Atomics.store(tickets, t + SECOND_CHANGES, changes);
  Atomics.store(tickets, t + SECOND, DONE);
  Atomics.notify(tickets, t + SECOND);
}

/** Blocks until word `at` of `tickets` holds `value` (the other thread is finishing its last claim). */
function awaitWord(tickets: Int32Array, at: number, value: number): void {
  for (let now = Atomics.load(tickets, at); now !== value; now = Atomics.load(tickets, at)) Atomics.wait(tickets, at, now, 1);
}

/** The spare's share of a join step (see {@link JoinShareInput}): the offers first, since this thread waits for them. */
export function joinShare(i: JoinShareInput): void {
  if (i.offer >= 0) offerSecondClaimed(i.memory, i.heap, i.counts, i.offerPairs, i.offerDistances, i.tickets, i.offer);
  if (i.measure >= 0) measureClaimed(i.memory, i.data, i.cols, i.measurePairs, i.measureDistances, i.tickets, i.measure);
}

/**
 * Joins `slices` slices of candidate pairs, `list(s, buffer)` filling slice s's pairs in the
 * one-thread order, yielding after each slice; returns the number of list changes. While this
 * thread lists the next slice and offers the current one to the first part of the lists, the
 * spare offers it to the second part and measures the next; both then measure what is left.
 */
export function* joinSlices(r: JoinRound, slices: number, list: (slice: number, out: PairBuffer) => void): Generator<void, number, void> {
  if (slices === 0) return 0;
  const threads = r.spare.threads > 0;
  const tickets = threads ? sharedInt32(slices * TICKET) : new Int32Array(slices * TICKET);
  const { memory, data, cols, heap, counts } = r;
  const listed = (s: number) => {
    const buf = r.buffers[s % 2];
    list(s, buf);
    Atomics.store(tickets, s * TICKET + COUNT, buf.count);
  };
  const share = (offer: number, measure: number) => {
    if (!threads) return;
    const o = r.buffers[(offer + 2) % 2];
    const m = r.buffers[(measure + 2) % 2];
    const input: JoinShareInput = { memory, data, cols, heap, counts, tickets, offer, offerPairs: o.pairs, offerDistances: o.distances, measure, measurePairs: m.pairs, measureDistances: m.distances };
    r.started.push(r.spare.start('knn.join-share', input));
  };
  let changes = 0;
  listed(0);
  share(-1, 0);
  for (let s = 0; s < slices; s++) {
    const buf = r.buffers[s % 2];
    const t = s * TICKET;
    measureClaimed(memory, data, cols, buf.pairs, buf.distances, tickets, s);
    awaitWord(tickets, t + MEASURED, buf.count);
    const next = s + 1 < slices ? s + 1 : -1;
    if (next >= 0) listed(next);
    share(s, next);
    changes += offerPairs(memory, heap, buf.pairs, buf.distances, buf.count, threads ? 0 : ALL_LISTS, counts.subarray(0, 1));
    if (next >= 0) {
      const other = r.buffers[next % 2];
      measureClaimed(memory, data, cols, other.pairs, other.distances, tickets, next);
    }
    if (threads) {
      offerSecondClaimed(memory, heap, counts, buf.pairs, buf.distances, tickets, s);
      awaitWord(tickets, t + SECOND, DONE);
      changes += Atomics.load(tickets, t + SECOND_CHANGES);
    }
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
