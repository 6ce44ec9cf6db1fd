import { describe, expect, it } from 'vitest';
import type { FuzzyGraph } from '../../server/map/api.js';
import { localityOrder } from '../../server/map/locality-order.js';

/** A symmetric graph from undirected edges, weights 1. */
function graphOf(n: number, edges: [number, number][]): FuzzyGraph {
  const rows: number[][] = Array.from({ length: n }, () => []);
  for (const [i, j] of edges) {
    rows[i].push(j);
    rows[j].push(i);
  }
  const indptr = new Uint32Array(n + 1);
  for (let i = 0; i < n; i++) indptr[i + 1] = indptr[i] + rows[i].length;
  return { n, indptr, indices: Int32Array.from(rows.flat()), weights: new Float32Array(indptr[n]).fill(1) };
}

describe('locality order', () => {
  it('walks each component breadth-first from its lowest point, components one after another (hand-built)', () => {
    // Two paths, 0–5–2 and 1–4–3–6, interleaved in numbering; point 7 alone.
    const g = graphOf(8, [[0, 5], [5, 2], [1, 4], [4, 3], [3, 6]]);
    expect(Array.from(localityOrder(g))).toEqual([0, 5, 2, 1, 4, 3, 6, 7]);
  });

  it('visits a star hub before its leaves and the leaves in edge order', () => {
    const g = graphOf(5, [[3, 0], [3, 4], [3, 1], [3, 2]]);
    expect(Array.from(localityOrder(g))).toEqual([0, 3, 4, 1, 2]);
  });

  it('is a permutation of all points on a larger random graph', () => {
    const n = 2000;
    const edges: [number, number][] = [];
    let s = 12345;
    for (let t = 0; t < 3 * n; t++) {
      s = (s * 1103515245 + 12345) >>> 0;
      const i = s % n;
      s = (s * 1103515245 + 12345) >>> 0;
      edges.push([i, s % n]);
    }
    const order = localityOrder(graphOf(n, edges));
    const seen = new Uint8Array(n);
    for (const p of order) seen[p]++;
    expect(seen.every((c) => c === 1)).toBe(true);
  });
});
