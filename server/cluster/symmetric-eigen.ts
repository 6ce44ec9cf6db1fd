/**
 * Eigen-decomposition of a small symmetric matrix by the cyclic Jacobi method
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., §8.5). Used on the l×l Gram matrices of
 * the randomised SVD, where l is about 110: accurate to machine precision and fast enough.
 */

/** Eigenvalues (descending) and the matching unit eigenvectors as columns of `vectors` (n×n, row-major). */
export interface SymmetricEigen {
  values: Float64Array;
  vectors: Float64Array;
}

/**
 * Eigen-decomposition of the symmetric n×n matrix `a` (row-major; only read, never changed).
 * @param a symmetric matrix, row-major, length n·n
 * @param n order of the matrix
 * @param maxSweeps safety cap on Jacobi sweeps (convergence is quadratic; 10 is typical for n≈100)
 */
export function symmetricEigen(a: Float64Array, n: number, maxSweeps = 60): SymmetricEigen {
  if (a.length !== n * n) throw new RangeError(`symmetricEigen: expected ${n * n} entries, got ${a.length}`);
  const m = Float64Array.from(a);
  const v = new Float64Array(n * n);
  for (let i = 0; i < n; i++) v[i * n + i] = 1;
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale += m[i] * m[i];
  const tiny = 1e-30 * scale;
  for (let sweep = 0; sweep < maxSweeps; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += m[p * n + q] * m[p * n + q];
    if (off <= tiny || off === 0) break;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = m[p * n + q];
        if (apq === 0) continue;
        const app = m[p * n + p];
        const aqq = m[q * n + q];
        // Rotation angle chosen so the (p,q) entry vanishes; the smaller root keeps it stable.
        const theta = (aqq - app) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const mkp = m[k * n + p];
          const mkq = m[k * n + q];
          m[k * n + p] = c * mkp - s * mkq;
          m[k * n + q] = s * mkp + c * mkq;
        }
        for (let k = 0; k < n; k++) {
          const mpk = m[p * n + k];
          const mqk = m[q * n + k];
          m[p * n + k] = c * mpk - s * mqk;
          m[q * n + k] = s * mpk + c * mqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k * n + p];
          const vkq = v[k * n + q];
          v[k * n + p] = c * vkp - s * vkq;
          v[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => m[j * n + j] - m[i * n + i]);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  for (let c = 0; c < n; c++) {
    const src = order[c];
    values[c] = m[src * n + src];
    for (let r = 0; r < n; r++) vectors[r * n + c] = v[r * n + src];
  }
  return { values, vectors };
}
