import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import { ALL_LISTS, offerPairs } from '../../server/map/local-join.js';
import { neighborHeap, type NeighborHeap } from '../../server/map/neighbor-heap.js';

/** `count` random pairs among n points (self-pairs left out) with random distances. */
function randomPairs(n: number, count: number, seed: number): { pairs: Int32Array; distances: Float64Array } {
  const random = seededRandom(seed);
  const pairs = new Int32Array(2 * count);
  const distances = new Float64Array(count);
  for (let c = 0; c < count; c++) {
    const p = Math.floor(random() * n);
    let q = Math.floor(random() * (n - 1));
    if (q >= p) q++;
    pairs[2 * c] = p;
    pairs[2 * c + 1] = q;
    distances[c] = random();
  }
  return { pairs, distances };
}

const copy = (h: NeighborHeap) => ({ indices: Array.from(h.indices), distances: Array.from(h.distances), flags: Array.from(h.flags) });

describe('offering measured pairs to the neighbour lists', () => {
  it('gives the same lists and the same count of changes whether one call offers to every list or two calls each offer to one part', () => {
    const n = 300;
    const k = 6;
    const whole = neighborHeap(n, k);
    const split = neighborHeap(n, k);
    let wholeChanges = 0;
    let splitChanges = 0;
    // Several batches, so later ones meet full lists and most offers are turned away at the root.
    for (let batch = 0; batch < 5; batch++) {
      const { pairs, distances } = randomPairs(n, 2000, batch + 1);
      wholeChanges += offerPairs(whole, pairs, distances, pairs.length / 2, ALL_LISTS);
      // The second part before the first: the parts touch different lists, so order between them does not matter.
      splitChanges += offerPairs(split, pairs, distances, pairs.length / 2, 1);
      splitChanges += offerPairs(split, pairs, distances, pairs.length / 2, 0);
    }
    expect(copy(split)).toEqual(copy(whole));
    expect(splitChanges).toBe(wholeChanges);
    // Every list was filled: the comparison covered lists of both parts.
    expect(whole.indices.every((j) => j >= 0)).toBe(true);
  });

  it('offers to only the lists of its part: runs of 32 lists, alternately', () => {
    const n = 128;
    const heap = neighborHeap(n, 3);
    const { pairs, distances } = randomPairs(n, 3000, 9);
    offerPairs(heap, pairs, distances, pairs.length / 2, 1);
    for (let i = 0; i < n; i++) {
      const filled = heap.indices[3 * i] >= 0;
      expect(filled).toBe(Math.floor(i / 32) % 2 === 1);
    }
  });
});
