import { describe, expect, it } from 'vitest';
import { documentFrequencyIdf, transformCounts } from '../../server/route/transform-counts.js';
import { csrFromRows } from './csr-from-rows.js';

describe('transformCounts', () => {
  const counts = csrFromRows([
    [3, 1, 0],
    [0, 2, 0],
    [0, 0, 0],
  ]);

  it('computes the smoothed idf ln((1 + n) / (1 + df)) + 1', () => {
    const idf = documentFrequencyIdf(counts);
    expect(idf[0]).toBeCloseTo(Math.log(4 / 2) + 1, 15);
    expect(idf[1]).toBeCloseTo(Math.log(4 / 3) + 1, 15);
    expect(idf[2]).toBeCloseTo(Math.log(4 / 1) + 1, 15);
  });

  it('damps counts by ln(1 + tf) · idf and gives each row the length √(distinct terms)', () => {
    const idf = Float64Array.from([2, 1, 1]);
    const x = transformCounts(counts, idf);
    // Row 0 before scaling: (ln 4 · 2, ln 2 · 1); length √2 after.
    const a = Math.log(4) * 2, b = Math.log(2);
    const s = Math.SQRT2 / Math.hypot(a, b);
    expect(x.values[0]).toBeCloseTo(a * s, 6);
    expect(x.values[1]).toBeCloseTo(b * s, 6);
    expect(Math.hypot(x.values[0], x.values[1])).toBeCloseTo(Math.SQRT2, 6);
    // Row 1: one term, length 1.
    expect(x.values[2]).toBeCloseTo(1, 6);
    expect(Array.from(x.indptr)).toEqual(Array.from(counts.indptr));
  });

  it('rejects an idf of the wrong length', () => {
    expect(() => transformCounts(counts, new Float64Array(2))).toThrow(/idf/);
  });
});
