import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import type { FuzzyGraph, KnnGraph } from '../../server/map/api.js';
import { fuzzyGraph } from '../../server/map/fuzzy-graph.js';
import { nearestNeighbors } from '../../server/map/nearest-neighbors.js';

function weight(g: FuzzyGraph, i: number, j: number): number {
  for (let t = g.indptr[i]; t < g.indptr[i + 1]; t++) if (g.indices[t] === j) return g.weights[t];
  return 0;
}

// The checks below follow the definitions of McInnes, Healy & Melville (2018), §3.1 and Algorithm 3:
// ρᵢ = distance to the nearest neighbour, Σⱼ exp(−(dᵢⱼ − ρᵢ)/σᵢ) = log₂(k + 1) over the k neighbours
// (self excluded, n_neighbors = k + 1), and the fuzzy union a + b − a·b.
const C = Math.log2(3) - 1; // weight of the farther of two neighbours: 1 + C = log₂ 3

describe('fuzzy graph', () => {
  it('gives each point weight 1 to its nearest neighbour and solves Σ weights = log₂(k + 1) (hand-built, no reciprocal edges)', () => {
    // Seven points, each pointing at the next two (mod 7): no edge is reciprocated, so the union
    // leaves every directed weight as it is.
    const n = 7;
    const k = 2;
    const indices = new Int32Array(n * k);
    const distances = new Float32Array(n * k);
    for (let i = 0; i < n; i++) {
      indices[i * k] = (i + 1) % n;
      indices[i * k + 1] = (i + 2) % n;
      distances[i * k] = 0.1 * (1 + (i % 3));
      distances[i * k + 1] = 0.5 + 0.05 * i;
    }
    const g = fuzzyGraph({ n, k, indices, distances });
    for (let i = 0; i < n; i++) {
      expect(weight(g, i, (i + 1) % n)).toBe(1);
      // σ is searched to |Σ − log₂ 3| < 1e-5 (the reference tolerance), hence 4 digits.
      expect(weight(g, i, (i + 2) % n)).toBeCloseTo(C, 4);
      expect(weight(g, (i + 1) % n, i)).toBe(1);
    }
    expect(g.indices.length).toBe(2 * n * k);
  });

  it('combines the two directions with the fuzzy union a + b − ab (hand-computed)', () => {
    // Three points; each one's neighbours are the other two. Directed weights: 1 to the nearer,
    // C to the farther. Pairs: (0,1) both nearest → 1; (1,2): 1 and C → 1; (0,2): C and C → 2C − C².
    const knn: KnnGraph = {
      n: 3,
      k: 2,
      indices: Int32Array.from([1, 2, 0, 2, 1, 0]),
      distances: Float32Array.from([0.1, 0.3, 0.1, 0.2, 0.2, 0.3]),
    };
    const g = fuzzyGraph(knn);
    expect(weight(g, 0, 1)).toBe(1);
    expect(weight(g, 1, 2)).toBe(1);
    expect(weight(g, 0, 2)).toBeCloseTo(2 * C - C * C, 5);
    expect(weight(g, 2, 0)).toBe(weight(g, 0, 2));
  });

  it('is symmetric, free of self loops, with weights in (0, 1], on real neighbour lists', () => {
    const f = JSON.parse(readFileSync(new URL('../fixtures/map-knn.json', import.meta.url), 'utf8')) as {
      cases: { n: number; d: number; X: number[] }[];
    };
    const c = f.cases[1];
    const knn = nearestNeighbors({ rows: c.n, cols: c.d, data: Float32Array.from(c.X) }, { k: 14, random: seededRandom(1) });
    const g = fuzzyGraph(knn);
    const faults: string[] = [];
    for (let i = 0; i < g.n; i++) {
      for (let t = g.indptr[i]; t < g.indptr[i + 1]; t++) {
        const j = g.indices[t];
        const w = g.weights[t];
        if (j === i || !(w > 0 && w <= 1) || weight(g, j, i) !== w) faults.push(`${i}→${j}: ${w} vs ${weight(g, j, i)}`);
      }
    }
    expect(g.indices.length).toBeGreaterThanOrEqual(c.n * 14);
    expect(faults).toEqual([]);
  });

  it('keeps identical points (all distances zero) finite, fully connected to each other', () => {
    const n = 5;
    const k = 4;
    const indices = new Int32Array(n * k);
    for (let i = 0; i < n; i++) for (let s = 0; s < k; s++) indices[i * k + s] = (i + 1 + s) % n;
    const g = fuzzyGraph({ n, k, indices, distances: new Float32Array(n * k) });
    expect(Array.from(g.weights).every((w) => w === 1)).toBe(true);
    expect(g.indices.length).toBe(n * k);
  });
});
