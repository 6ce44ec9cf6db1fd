/**
 * Sub-matrices of a CSR matrix: chosen rows, and columns renumbered through a map. Used to give
 * each cross-validation fold only the vocabulary its training part could have seen.
 */
import type { Csr } from '../common/matrix.js';

/**
 * Copies the rows `rows` (in that order) keeping only columns with `columnMap[j] ≥ 0`, renumbered
 * to `columnMap[j]`. Column order within a row stays increasing when `columnMap` is increasing on
 * the kept columns.
 * @param m source matrix.
 * @param rows row indices to keep.
 * @param columnMap new index of each source column, or -1 to drop it.
 * @param cols number of columns of the result.
 */
export function csrSelect(m: Csr, rows: ArrayLike<number>, columnMap: Int32Array, cols: number): Csr {
  if (columnMap.length !== m.cols) throw new RangeError(`columnMap has ${columnMap.length} entries for ${m.cols} columns`);
  let nnz = 0;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    for (let p = m.indptr[r]; p < m.indptr[r + 1]; p++) if (columnMap[m.indices[p]] >= 0) nnz++;
  }
  const indptr = new Uint32Array(rows.length + 1);
  const indices = new Uint32Array(nnz);
  const values = new Float32Array(nnz);
  let q = 0;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    for (let p = m.indptr[r]; p < m.indptr[r + 1]; p++) {
      const j = columnMap[m.indices[p]];
      if (j < 0) continue;
      indices[q] = j;
      values[q] = m.values[p];
      q++;
    }
    indptr[i + 1] = q;
  }
  return { rows: rows.length, cols, indptr, indices, values };
}

/**
 * Document frequency and total occurrences of each column over the given rows.
 * @param m source matrix (raw counts; values > 0 count as present).
 * @param rows rows to count over.
 * @param df per-column document counts, zeroed here.
 * @param tf per-column sums of values, zeroed here.
 */
export function columnTotals(m: Csr, rows: ArrayLike<number>, df: Uint32Array, tf: Float64Array): void {
  if (df.length !== m.cols || tf.length !== m.cols) throw new RangeError(`df and tf need ${m.cols} entries`);
  df.fill(0);
  tf.fill(0);
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    for (let p = m.indptr[r]; p < m.indptr[r + 1]; p++) {
      const v = m.values[p];
      if (v > 0) {
        df[m.indices[p]]++;
        tf[m.indices[p]] += v;
      }
    }
  }
}
