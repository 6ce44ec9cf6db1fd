import { describe, expect, it } from 'vitest';
import { condensedDistances, condensedDistancesSteps, condensedIndex } from '../../server/cluster/condensed-distances.js';

describe('condensedDistances', () => {
  it('lays pairs out as SciPy pdist does and measures cosine as 1 − cos', () => {
    const x = { rows: 3, cols: 2, data: new Float64Array([1, 0, 0, 2, 3, 3]) };
    const d = condensedDistances(x, 'cosine');
    expect(d[condensedIndex(3, 0, 1)]).toBeCloseTo(1, 12);
    expect(d[condensedIndex(3, 2, 0)]).toBeCloseTo(1 - Math.SQRT1_2, 12);
    expect(d[condensedIndex(3, 1, 2)]).toBeCloseTo(1 - Math.SQRT1_2, 12);
    const e = condensedDistances(x, 'euclidean');
    expect(Array.from(e)).toEqual([Math.sqrt(5), Math.sqrt(13), Math.sqrt(10)]);
  });

  it('gives a zero row cosine distance 1 to everything and reports "distances" progress to the last pair', () => {
    const x = { rows: 3, cols: 2, data: new Float32Array([0, 0, 1, 0, 0, 1]) };
    const gen = condensedDistancesSteps(x, 'cosine');
    let next = gen.next();
    let last = { stage: '', done: 0, total: 0 };
    for (; !next.done; next = gen.next()) last = next.value;
    expect(last).toEqual({ stage: 'distances', done: 3, total: 3 });
    expect(Array.from(next.value)).toEqual([1, 1, 1]);
  });

  it('matches the index formula of SciPy squareform for every pair', () => {
    // SciPy's condensed layout: pair (i, j), i < j, sits at n·i − i(i+1)/2 + (j − i − 1).
    const n = 7;
    let p = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++, p++) {
      expect(condensedIndex(n, i, j)).toBe(p);
      expect(condensedIndex(n, j, i)).toBe(p);
    }
  });
});
