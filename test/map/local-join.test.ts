import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import { ALL_LISTS, offerPairs } from '../../server/map/local-join.js';
import { heapPush, neighborHeap, neighborHeapBytes, type NeighborHeap } from '../../server/map/neighbor-heap.js';
import { KernelSpace, kernelBytes } from '../../server/map/row-kernel.js';

/**
 * The offers as the kernel (server/map/offer-kernel.ts) must make them, written out in TypeScript:
 * this was the loop itself before the kernel replaced it.
 */
function referenceOffers(heap: NeighborHeap, pairs: Int32Array, distances: Float64Array, count: number, part: number): number {
  const roots = heap.distances;
  const k = heap.k;
  const other = part === ALL_LISTS ? 2 : 1 - part;
  let changes = 0;
  for (let c = 0; c < count; c++) {
    const p = pairs[2 * c];
    const q = pairs[2 * c + 1];
    const d = distances[c];
    if (((p >> 5) & 1) !== other && d < roots[p * k]) changes += heapPush(heap, p, q, d, 1);
    if (((q >> 5) & 1) !== other && d < roots[q * k]) changes += heapPush(heap, q, p, d, 1);
  }
  return changes;
}

/** Lists and `count` random pairs among n points (self-pairs left out), all in one kernel memory. */
function setup(n: number, k: number, count: number) {
  const space = new KernelSpace(kernelBytes(...neighborHeapBytes(n, k), 8 * count, 8 * count, 8));
  const heap = neighborHeap(n, k, false, space);
  return { space, heap, pairs: space.int32(2 * count), distances: space.float64(count), out: space.int32(2) };
}

function randomPairs(pairs: Int32Array, distances: Float64Array, n: number, seed: number, ties = false): void {
  const random = seededRandom(seed);
  for (let c = 0; c < distances.length; c++) {
    const p = Math.floor(random() * n);
    let q = Math.floor(random() * (n - 1));
    if (q >= p) q++;
    pairs[2 * c] = p;
    pairs[2 * c + 1] = q;
    // With ties, distances from a few values, so equal distances meet in the sift.
    distances[c] = ties ? Math.floor(random() * 8) / 8 : random();
  }
}

const copy = (h: NeighborHeap) => ({ indices: Array.from(h.indices), distances: Array.from(h.distances), flags: Array.from(h.flags) });

describe('offering measured pairs to the neighbour lists', () => {
  it('changes the lists bit for bit as the TypeScript loop does, every list or one part, with repeated pairs and tied distances', () => {
    const n = 300;
    const count = 2000;
    for (const [k, part, ties] of [[6, ALL_LISTS, false], [15, 0, false], [7, 1, true], [1, ALL_LISTS, true]] as const) {
      const kernel = setup(n, k, count);
      const script = neighborHeap(n, k);
      let kernelChanges = 0;
      let scriptChanges = 0;
      for (let batch = 0; batch < 5; batch++) {
        randomPairs(kernel.pairs, kernel.distances, n, batch + 1, ties);
        // Some pairs again: a point already listed changes nothing.
        kernel.pairs.copyWithin(0, 2 * (count - 100));
        kernel.distances.copyWithin(0, count - 100);
        kernelChanges += offerPairs(kernel.space.memory, kernel.heap, kernel.pairs, kernel.distances, count, part, kernel.out);
        scriptChanges += referenceOffers(script, kernel.pairs, kernel.distances, count, part);
      }
      expect(copy(kernel.heap)).toEqual(copy(script));
      expect(kernelChanges).toBe(scriptChanges);
      expect(kernelChanges).toBeGreaterThan(0);
    }
  });

  it('gives the same lists and the same count of changes whether one call offers to every list or two calls each offer to one part', () => {
    const n = 300;
    const whole = setup(n, 6, 2000);
    const split = setup(n, 6, 2000);
    let wholeChanges = 0;
    let splitChanges = 0;
    // Several batches, so later ones meet full lists and most offers are turned away at the root.
    for (let batch = 0; batch < 5; batch++) {
      for (const s of [whole, split]) randomPairs(s.pairs, s.distances, n, batch + 1);
      wholeChanges += offerPairs(whole.space.memory, whole.heap, whole.pairs, whole.distances, 2000, ALL_LISTS, whole.out);
      // The second part before the first: the parts touch different lists, so order between them does not matter.
      splitChanges += offerPairs(split.space.memory, split.heap, split.pairs, split.distances, 2000, 1, split.out.subarray(1));
      splitChanges += offerPairs(split.space.memory, split.heap, split.pairs, split.distances, 2000, 0, split.out);
    }
    expect(copy(split.heap)).toEqual(copy(whole.heap));
    expect(splitChanges).toBe(wholeChanges);
    // Every list was filled: the comparison covered lists of both parts.
    expect(whole.heap.indices.every((j) => j >= 0)).toBe(true);
  });

  it('offers to only the lists of its part: runs of 32 lists, alternately', () => {
    const n = 128;
    const s = setup(n, 3, 3000);
    randomPairs(s.pairs, s.distances, n, 9);
    offerPairs(s.space.memory, s.heap, s.pairs, s.distances, 3000, 1, s.out);
    for (let i = 0; i < n; i++) expect(s.heap.indices[3 * i] >= 0).toBe(Math.floor(i / 32) % 2 === 1);
  });

  it('refuses lists outside the kernel memory', () => {
    const s = setup(10, 3, 4);
    expect(() => offerPairs(s.space.memory, neighborHeap(10, 3), s.pairs, s.distances, 4, ALL_LISTS, s.out)).toThrow(/kernel's memory/);
  });
});
