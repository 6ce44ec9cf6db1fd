import { describe, expect, it } from 'vitest';
import { columnTotals, csrSelect } from '../../server/route/csr-select.js';
import { csrFromRows } from './csr-from-rows.js';

describe('csrSelect', () => {
  const m = csrFromRows([
    [1, 0, 2, 0],
    [0, 3, 0, 4],
    [5, 6, 0, 0],
  ]);

  it('copies chosen rows in the given order and renumbers kept columns', () => {
    const s = csrSelect(m, [2, 0], Int32Array.from([0, -1, 1, -1]), 2);
    expect(s.rows).toBe(2);
    expect(s.cols).toBe(2);
    expect(Array.from(s.indptr)).toEqual([0, 1, 3]);
    expect(Array.from(s.indices)).toEqual([0, 0, 1]);
    expect(Array.from(s.values)).toEqual([5, 1, 2]);
  });

  it('counts document frequency and occurrences over the chosen rows only', () => {
    const df = new Uint32Array(4), tf = new Float64Array(4);
    columnTotals(m, [0, 2], df, tf);
    expect(Array.from(df)).toEqual([2, 1, 1, 0]);
    expect(Array.from(tf)).toEqual([6, 6, 2, 0]);
  });

  it('rejects a column map of the wrong length', () => {
    expect(() => csrSelect(m, [0], Int32Array.from([0]), 1)).toThrow(/columnMap/);
  });
});
