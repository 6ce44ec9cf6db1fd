import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import type { FuzzyGraph } from '../../server/map/api.js';
import { fillFromSample } from '../../server/map/fill-from-sample.js';

/** A symmetric CSR graph from undirected weighted edges. */
function graphOf(n: number, edges: [number, number, number][]): FuzzyGraph {
  const lists: [number, number][][] = Array.from({ length: n }, () => []);
  for (const [i, j, w] of edges) {
    lists[i].push([j, w]);
    lists[j].push([i, w]);
  }
  const indptr = new Uint32Array(n + 1);
  const indices: number[] = [];
  const weights: number[] = [];
  for (let i = 0; i < n; i++) {
    for (const [j, w] of lists[i].sort((a, b) => a[0] - b[0])) {
      indices.push(j);
      weights.push(w);
    }
    indptr[i + 1] = indices.length;
  }
  return { n, indptr, indices: Int32Array.from(indices), weights: Float32Array.from(weights) };
}

describe('fillFromSample (starting layout from a laid-out sample)', () => {
  // Expected positions below are worked by hand from the rule (weighted mean of neighbours placed
  // in earlier rings); the jitter is at most 0.4% of the sample's RMS radius per axis, so 0.01
  // bounds it for these layouts of radius ≤ 2.
  const jitterBound = 0.01;

  it('keeps sampled points in place and puts the others at the weighted mean of placed neighbours, ring by ring', () => {
    // 0 and 1 sampled at (0, 0) and (2, 0). Ring 1: 2 joins 0 (weight 1) and 1 (weight 3), so it
    // goes to (0·1 + 2·3) / 4 = 1.5; 4 joins 1 and 3 (weight 1 each), but 3 is not placed yet, so 4
    // goes to 1's place, 2. Ring 2: 3 joins 2 (weight 0.5) and 4 (weight 1): (1.5·0.5 + 2·1) / 1.5.
    const g = graphOf(5, [
      [0, 2, 1],
      [1, 2, 3],
      [2, 3, 0.5],
      [3, 4, 1],
      [1, 4, 1],
    ]);
    const pos = fillFromSample(g, Int32Array.of(0, 1), Float64Array.of(0, 0, 2, 0), new Float64Array(10), seededRandom(1));
    expect([pos[0], pos[1], pos[2], pos[3]]).toEqual([0, 0, 2, 0]);
    expect(pos[4]).toBeCloseTo(1.5, 1);
    expect(Math.abs(pos[4] - 1.5)).toBeLessThan(jitterBound);
    expect(Math.abs(pos[5])).toBeLessThan(jitterBound);
    expect(Math.abs(pos[8] - 2)).toBeLessThan(jitterBound);
    expect(Math.abs(pos[6] - (1.5 * 0.5 + 2) / 1.5)).toBeLessThan(2 * jitterBound);
    for (const c of [5, 7, 9]) expect(Math.abs(pos[c])).toBeLessThan(2 * jitterBound);
    // Jittered, so a point does not sit exactly on the neighbour it copies.
    expect(pos[8]).not.toBe(2);
  });

  it('places a component the sample never reaches through the affine map fitted on the sample', () => {
    // Sample layout = 2·fallback + (3, −1) exactly, so the least-squares affine map is that map
    // (a plain identity of the fit), and the unreached pair 3–4 lands at 2·fallback + (3, −1).
    const g = graphOf(5, [
      [0, 1, 1],
      [1, 2, 1],
      [3, 4, 1],
    ]);
    const fallback = Float64Array.of(0, 0, 1, 0, 0, 1, 1, 1, 0.5, -1);
    const sample = Int32Array.of(0, 1, 2);
    const laid = new Float64Array(6);
    for (let s = 0; s < 3; s++) {
      laid[2 * s] = 2 * fallback[2 * sample[s]] + 3;
      laid[2 * s + 1] = 2 * fallback[2 * sample[s] + 1] - 1;
    }
    const pos = fillFromSample(g, sample, laid, fallback, seededRandom(2));
    expect(Math.abs(pos[6] - 5)).toBeLessThan(jitterBound);
    expect(Math.abs(pos[7] - 1)).toBeLessThan(jitterBound);
    expect(Math.abs(pos[8] - 4)).toBeLessThan(jitterBound);
    expect(Math.abs(pos[9] + 3)).toBeLessThan(jitterBound);
  });

  it('falls back to a shift when the sample lies on one line (no affine map to fit)', () => {
    const g = graphOf(4, [[0, 1, 1]]);
    const fallback = Float64Array.of(0, 0, 1, 0, 5, 5, 6, 5);
    const pos = fillFromSample(g, Int32Array.of(0, 1), Float64Array.of(10, 10, 11, 10), fallback, seededRandom(3));
    expect(pos.every((v) => Number.isFinite(v))).toBe(true);
    expect(Math.abs(pos[4] - 15)).toBeLessThan(jitterBound);
    expect(Math.abs(pos[5] - 15)).toBeLessThan(jitterBound);
  });

  it('gives the same positions for the same seed', () => {
    const edges: [number, number, number][] = [];
    const r = seededRandom(9);
    for (let i = 1; i < 200; i++) edges.push([i, Math.floor(r() * i), 0.2 + r()]);
    const g = graphOf(200, edges);
    const sample = Int32Array.of(0, 10, 50, 120);
    const laid = Float64Array.of(0, 0, 1, 0, 0, 1, 1, 1);
    const a = fillFromSample(g, sample, laid, new Float64Array(400), seededRandom(4));
    const b = fillFromSample(g, sample, laid, new Float64Array(400), seededRandom(4));
    expect(a).toEqual(b);
    expect(a.every((v) => Number.isFinite(v))).toBe(true);
  });
});
