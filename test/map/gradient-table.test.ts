import { findABParams } from 'umap-js/dist/umap.js';
import { describe, expect, it } from 'vitest';
import { CELLS, CELL_BASE, CELL_SHIFT, DOUBLINGS, LOW_EXPONENT, gradientTables } from '../../server/map/gradient-table.js';

// The exact coefficients are UMAP's gradients of the fuzzy cross-entropy (McInnes, Healy &
// Melville 2018, §3.2 and the reference implementation's 0.001 guard), as functions of d².
const attraction = (a: number, b: number, d2: number) => (-2 * a * b * Math.pow(d2, b - 1)) / (a * Math.pow(d2, b) + 1);
const repulsion = (a: number, b: number, gamma: number, d2: number) => (2 * gamma * b) / ((0.001 + d2) * (a * Math.pow(d2, b) + 1));

function cellOf(d2: number): number {
  const bits = new Float64Array([d2]);
  return (new Uint32Array(bits.buffer)[1] >>> CELL_SHIFT) - CELL_BASE;
}

describe('gradient tables', () => {
  it('give both coefficients within 1e-3 relative error across the tabulated range, for several curves', () => {
    // Our own tolerance (the previous repulsion table was within 1.7e-3).
    for (const [spread, minDist, gamma] of [[1, 0.1, 1], [1, 0, 1], [1, 0.5, 2], [2, 1, 1]]) {
      const { a, b } = findABParams(spread, minDist);
      const t = gradientTables(a, b, gamma);
      let worstRep = 0;
      let worstAtt = 0;
      for (let e = LOW_EXPONENT; e < LOW_EXPONENT + DOUBLINGS; e += 1 / 512) {
        const d2 = Math.pow(2, e) * (1 + 1e-9);
        const c = cellOf(d2);
        expect(c).toBeGreaterThanOrEqual(0);
        expect(c).toBeLessThan(CELLS);
        const rep = t[2 * c] + t[2 * c + 1] * d2;
        const att = t[2 * CELLS + 2 * c] + t[2 * CELLS + 2 * c + 1] * d2;
        worstRep = Math.max(worstRep, Math.abs(rep / repulsion(a, b, gamma, d2) - 1));
        worstAtt = Math.max(worstAtt, Math.abs(att / attraction(a, b, d2) - 1));
      }
      expect(worstRep).toBeLessThan(1e-3);
      expect(worstAtt).toBeLessThan(1e-3);
      expect(worstRep).toBeGreaterThan(0);
    }
  });

  it('puts d² outside the range outside the cells, so the layout computes those exactly', () => {
    expect(cellOf(Math.pow(2, LOW_EXPONENT) * 0.99)).toBeLessThan(0);
    expect(cellOf(Math.pow(2, LOW_EXPONENT))).toBe(0);
    expect(cellOf(Math.pow(2, LOW_EXPONENT + DOUBLINGS))).toBe(CELLS);
    expect(cellOf(1e300)).toBeGreaterThanOrEqual(CELLS);
  });
});
