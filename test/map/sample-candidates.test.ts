import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import { heapPush, neighborHeap, neighborHeapBytes, type NeighborHeap } from '../../server/map/neighbor-heap.js';
import { KernelSpace, kernelBytes } from '../../server/map/row-kernel.js';
import { deferred, deferredBytes, sampleOwn, settleOwn, type SampleHalf, type SampleState } from '../../server/map/sample-candidates.js';

/*
 * The two passes as the kernel (server/map/sample-kernel.ts) must make them, written out in
 * TypeScript: these were the passes themselves before the kernel replaced them.
 */
function referenceSampleOwn(st: SampleState, h: SampleHalf): void {
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

function referenceSettleOwn(st: SampleState, h: SampleHalf): void {
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


/** A search's lists mid-way (random neighbours, some slots empty, some flags new), samples and offer lists, in one kernel memory. */
function setup(n: number, k: number, S: number, seed: number) {
  const mid = n >> 1;
  const space = new KernelSpace(kernelBytes(...neighborHeapBytes(n, k), ...neighborHeapBytes(n, S), ...neighborHeapBytes(n, S), ...deferredBytes(n - mid, k), ...deferredBytes(n - mid, k)));
  const heap = neighborHeap(n, k, false, space);
  const random = seededRandom(seed);
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < k; t++) {
      if (random() < 0.1) continue;
      const j = Math.floor(random() * n);
      if (j !== i) heapPush(heap, i, j, random(), random() < 0.6 ? 1 : 0);
    }
  }
  const state: SampleState = { memory: space.memory, heap, fresh: neighborHeap(n, S, false, space), old: neighborHeap(n, S, false, space) };
  const lists = [deferred(n - mid, k, space), deferred(n - mid, k, space)];
  return { state, lists, mid };
}

const copy = (h: NeighborHeap) => ({ indices: Array.from(h.indices), distances: Array.from(h.distances), flags: Array.from(h.flags) });

describe('candidate sampling', () => {
  it('samples and marks bit for bit as the TypeScript passes do, over several rounds and both halves', () => {
    const n = 400;
    const k = 9;
    const S = 4;
    const kernel = setup(n, k, S, 3);
    const script = setup(n, k, S, 3);
    const seeds = seededRandom(8);
    for (let round = 0; round < 4; round++) {
      const seed = [0, 1].map(() => (Math.floor(seeds() * 4294967296) | 1) >>> 0);
      const halves = (s: ReturnType<typeof setup>): SampleHalf[] => [
        { lo: 0, hi: s.mid, seed: seed[0], keep: s.lists[0], take: s.lists[1] },
        { lo: s.mid, hi: n, seed: seed[1], keep: s.lists[1], take: s.lists[0] },
      ];
      const [k0, k1] = halves(kernel);
      const [s0, s1] = halves(script);
      sampleOwn(kernel.state, k1);
      sampleOwn(kernel.state, k0);
      referenceSampleOwn(script.state, s1);
      referenceSampleOwn(script.state, s0);
      expect(kernel.lists[0].count[0]).toBe(script.lists[0].count[0]);
      expect(kernel.lists[0].count[0]).toBeGreaterThan(0);
      expect(Array.from(kernel.lists[1].priority.subarray(0, kernel.lists[1].count[0]))).toEqual(Array.from(script.lists[1].priority.subarray(0, script.lists[1].count[0])));
      settleOwn(kernel.state, k0);
      settleOwn(kernel.state, k1);
      referenceSettleOwn(script.state, s0);
      referenceSettleOwn(script.state, s1);
      for (const key of ['heap', 'fresh', 'old'] as const) expect(copy(kernel.state[key])).toEqual(copy(script.state[key]));
    }
    // Some new neighbours were marked old, and the samples hold both kinds.
    expect(Array.from(kernel.state.heap.flags).filter((f) => f === 1).length).toBeLessThan(Array.from(setup(n, k, S, 3).state.heap.flags).filter((f) => f === 1).length);
    expect(kernel.state.fresh.indices.some((j) => j >= 0) && kernel.state.old.indices.some((j) => j >= 0)).toBe(true);
  });
});
