/**
 * The hot loops of LSA over typed arrays, each over a range of rows (or of Gram rows) so that a
 * spare thread can take part of the work (see spare-tasks.ts); a range computes exactly what the
 * whole loop would there, so results do not depend on the split.
 */
import { PLAIN_ALLOC, type Csr, type CsrAlloc } from '../common/matrix.js';

// The product below reads the dense factor as Float32 (half the memory traffic of the
// hottest loops; the products accumulate in Float64, so each stays accurate to ~1e-7 relative,
// far inside what the randomised method itself guarantees) and takes eight stored entries per
// pass over the output row (measured on the bench corpus: X·D 15 %, Xᵀ·Y 25 % less CPU than four),
// then four, then one.

export function multiplyRange(x: Csr, dense: Float32Array, w: number, out: Float64Array, r0: number, r1: number): void {
  const { indptr, indices, values } = x;
  for (let r = r0; r < r1; r++) {
    const base = r * w;
    const end = indptr[r + 1];
    let p = indptr[r];
    for (; p + 7 < end; p += 8) {
      const v1 = values[p], v2 = values[p + 1], v3 = values[p + 2], v4 = values[p + 3];
      const v5 = values[p + 4], v6 = values[p + 5], v7 = values[p + 6], v8 = values[p + 7];
      const s1 = indices[p] * w, s2 = indices[p + 1] * w, s3 = indices[p + 2] * w, s4 = indices[p + 3] * w;
      const s5 = indices[p + 4] * w, s6 = indices[p + 5] * w, s7 = indices[p + 6] * w, s8 = indices[p + 7] * w;
      for (let c = 0; c < w; c++) {
        out[base + c] += (v1 * dense[s1 + c] + v2 * dense[s2 + c]) + (v3 * dense[s3 + c] + v4 * dense[s4 + c])
          + ((v5 * dense[s5 + c] + v6 * dense[s6 + c]) + (v7 * dense[s7 + c] + v8 * dense[s8 + c]));
      }
    }
    for (; p + 3 < end; p += 4) {
      const v1 = values[p], v2 = values[p + 1], v3 = values[p + 2], v4 = values[p + 3];
      const s1 = indices[p] * w, s2 = indices[p + 1] * w, s3 = indices[p + 2] * w, s4 = indices[p + 3] * w;
      for (let c = 0; c < w; c++) out[base + c] += v1 * dense[s1 + c] + v2 * dense[s2 + c] + v3 * dense[s3 + c] + v4 * dense[s4 + c];
    }
    for (; p < end; p++) {
      const v = values[p];
      const src = indices[p] * w;
      for (let c = 0; c < w; c++) out[base + c] += v * dense[src + c];
    }
  }
}

/** Xᵀ as a CSR matrix (columns become rows), so Xᵀ·D runs through the same gather kernel as X·D. */
export function transposeCsr(x: Csr, alloc: CsrAlloc = PLAIN_ALLOC): Csr {
  const { rows, cols, indptr, indices, values } = x;
  const nnz = indptr[rows];
  const tIndptr = alloc.u32(cols + 1);
  for (let p = 0; p < nnz; p++) tIndptr[indices[p] + 1]++;
  for (let c = 0; c < cols; c++) tIndptr[c + 1] += tIndptr[c];
  const fill = tIndptr.slice(0, cols);
  const tIndices = alloc.u32(nnz);
  const tValues = alloc.f32(nnz);
  for (let r = 0; r < rows; r++) {
    for (let p = indptr[r]; p < indptr[r + 1]; p++) {
      const at = fill[indices[p]]++;
      tIndices[at] = r;
      tValues[at] = values[p];
    }
  }
  return { rows: cols, cols: rows, indptr: tIndptr, indices: tIndices, values: tValues };
}

/**
 * Adds rows r0..r1 of A (rows×w) to Gram rows i0..i1 of `out` (upper triangle). Each entry sums
 * the rows in the same order whatever the Gram-row range, so splitting by Gram rows changes nothing.
 */
export function gramRange(a: Float64Array, w: number, out: Float64Array, r0: number, r1: number, i0 = 0, i1 = w): void {
  // Eight rows, then four, per pass over the upper triangle: an eighth of the read-modify-writes
  // of `out`.
  let r = r0;
  for (; r + 7 < r1; r += 8) {
    const b0 = r * w, b1 = b0 + w, b2 = b1 + w, b3 = b2 + w, b4 = b3 + w, b5 = b4 + w, b6 = b5 + w, b7 = b6 + w;
    for (let i = i0; i < i1; i++) {
      const v0 = a[b0 + i], v1 = a[b1 + i], v2 = a[b2 + i], v3 = a[b3 + i];
      const v4 = a[b4 + i], v5 = a[b5 + i], v6 = a[b6 + i], v7 = a[b7 + i];
      const oi = i * w;
      for (let j = i; j < w; j++) {
        out[oi + j] += (v0 * a[b0 + j] + v1 * a[b1 + j]) + (v2 * a[b2 + j] + v3 * a[b3 + j])
          + ((v4 * a[b4 + j] + v5 * a[b5 + j]) + (v6 * a[b6 + j] + v7 * a[b7 + j]));
      }
    }
  }
  for (; r + 3 < r1; r += 4) {
    const b0 = r * w, b1 = b0 + w, b2 = b1 + w, b3 = b2 + w;
    for (let i = i0; i < i1; i++) {
      const v0 = a[b0 + i], v1 = a[b1 + i], v2 = a[b2 + i], v3 = a[b3 + i];
      const oi = i * w;
      for (let j = i; j < w; j++) out[oi + j] += v0 * a[b0 + j] + v1 * a[b1 + j] + v2 * a[b2 + j] + v3 * a[b3 + j];
    }
  }
  for (; r < r1; r++) {
    const base = r * w;
    for (let i = i0; i < i1; i++) {
      const v = a[base + i];
      if (v === 0) continue;
      const oi = i * w;
      for (let j = i; j < w; j++) out[oi + j] += v * a[base + j];
    }
  }
}

/** Solves q·R = a_i in place for rows r0..r1 (R upper triangular). */
export function solveRange(a: Float64Array, w: number, r: Float64Array, r0: number, r1: number): void {
  for (let i = r0; i < r1; i++) {
    const base = i * w;
    for (let c = 0; c < w; c++) {
      let s = a[base + c];
      for (let k = 0; k < c; k++) s -= a[base + k] * r[k * w + c];
      a[base + c] = s / r[c * w + c];
    }
  }
}


/** Rows of A per Gram block: the blocks fix the order in which rows are summed into each entry. */
export function gramBlockRows(w: number): number {
  return Math.max(64, Math.floor(4e6 / Math.max(1, (w * w) / 2)));
}

/** Gram rows i0..i1 of AᵀA over all rows of A, block by block as the stepwise caller does. */
export function gramRows(a: Float64Array, rows: number, w: number, out: Float64Array, i0: number, i1: number): void {
  const block = gramBlockRows(w);
  for (let r0 = 0; r0 < rows; r0 += block) gramRange(a, w, out, r0, Math.min(rows, r0 + block), i0, i1);
}
