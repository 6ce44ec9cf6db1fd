// Test helper: a dense array of rows → CSR, so hand-computed fixtures stay readable.
import type { Csr } from '../../server/common/matrix.js';

export function csrFromRows(rows: readonly (readonly number[])[], cols = rows[0]?.length ?? 0): Csr {
  const indptr = new Uint32Array(rows.length + 1);
  const indices: number[] = [];
  const values: number[] = [];
  rows.forEach((row, r) => {
    row.forEach((v, j) => {
      if (v !== 0) {
        indices.push(j);
        values.push(v);
      }
    });
    indptr[r + 1] = indices.length;
  });
  return { rows: rows.length, cols, indptr, indices: Uint32Array.from(indices), values: Float32Array.from(values) };
}
