/**
 * The numeric containers shared by the engine modules (text, cluster, map, route).
 * Documents are referred to by row index inside the engine, and by id only at the edges.
 */

/**
 * A sparse matrix in compressed sparse row form.
 * Row `r` holds columns `indices[indptr[r] .. indptr[r+1])` with values at the same positions.
 * Column indices within a row are strictly increasing.
 */
export interface Csr {
  rows: number;
  cols: number;
  indptr: Uint32Array;
  indices: Uint32Array;
  values: Float32Array;
}

/** A dense row-major matrix: element (r, c) is `data[r * cols + c]`. */
export interface Dense {
  rows: number;
  cols: number;
  data: Float32Array;
}

/** Makes a zero-filled dense matrix. */
export function denseZeros(rows: number, cols: number): Dense {
  return { rows, cols, data: new Float32Array(rows * cols) };
}

/** The view of row `r` of a dense matrix (no copy). */
export function denseRow(m: Dense, r: number): Float32Array {
  return m.data.subarray(r * m.cols, (r + 1) * m.cols);
}

/** Number of stored entries of a CSR matrix. */
export function csrNnz(m: Csr): number {
  return m.indptr[m.rows];
}

/**
 * Throws unless `m` is a well-formed CSR matrix. Cheap enough to call at module boundaries.
 */
export function assertCsr(m: Csr): void {
  if (m.indptr.length !== m.rows + 1) throw new RangeError(`CSR indptr has ${m.indptr.length} entries; expected rows + 1 = ${m.rows + 1}`);
  const nnz = m.indptr[m.rows];
  if (m.indices.length < nnz || m.values.length < nnz) throw new RangeError('CSR indices/values are shorter than indptr says');
}

/** Exhaustiveness guard for switches over union types. */
export function assertUnreachable(x: never): never {
  throw new TypeError(`Unexpected value: ${String(x)}`);
}

/** Where the typed arrays of a new CSR matrix come from (plain, or shared memory). */
export interface CsrAlloc {
  u32: (n: number) => Uint32Array;
  f32: (n: number) => Float32Array;
}

/** Plain (unshared) typed arrays for CSR parts. */
export const PLAIN_ALLOC: CsrAlloc = { u32: (n: number) => new Uint32Array(n), f32: (n: number) => new Float32Array(n) };

/** The rows `rows` of `x` as a new CSR matrix. */
export function subRows(x: Csr, rows: Int32Array, alloc: CsrAlloc = PLAIN_ALLOC): Csr {
  let nnz = 0;
  for (const r of rows) nnz += x.indptr[r + 1] - x.indptr[r];
  const indptr = alloc.u32(rows.length + 1);
  const indices = alloc.u32(nnz);
  const values = alloc.f32(nnz);
  let p = 0;
  for (let s = 0; s < rows.length; s++) {
    const a = x.indptr[rows[s]], b = x.indptr[rows[s] + 1];
    indices.set(x.indices.subarray(a, b), p);
    values.set(x.values.subarray(a, b), p);
    p += b - a;
    indptr[s + 1] = p;
  }
  return { rows: rows.length, cols: x.cols, indptr, indices, values };
}
