/**
 * Rennie, Shih, Teevan & Karger (2003), "Tackling the poor assumptions of naive Bayes text
 * classifiers", §4: damp repeated words, weight rare words up, and stop long documents from
 * dominating the estimates.
 */
import type { Csr } from '../common/matrix.js';

/**
 * Smoothed inverse document frequency of every column, ln((1 + n) / (1 + df)) + 1 — the same form
 * as the text pipeline's `smoothIdf`, so that no kept term gets a zero weight.
 * @param counts documents × terms, raw counts.
 */
export function documentFrequencyIdf(counts: Csr): Float64Array {
  const df = new Float64Array(counts.cols);
  const nnz = counts.indptr[counts.rows];
  for (let p = 0; p < nnz; p++) if (counts.values[p] > 0) df[counts.indices[p]]++;
  const idf = new Float64Array(counts.cols);
  for (let j = 0; j < idf.length; j++) idf[j] = Math.log((1 + counts.rows) / (1 + df[j])) + 1;
  return idf;
}

/** ln(1 + k) for the small whole counts that make up nearly every entry. */
const LOG1P_TABLE = Float64Array.from({ length: 256 }, (_, k) => Math.log1p(k));

/**
 * ln(1 + v), from a table for small whole counts.
 * @param v a count (≥ 0).
 */
export function log1pCount(v: number): number {
  return v < LOG1P_TABLE.length && v === (v | 0) ? LOG1P_TABLE[v] : Math.log1p(v);
}

/**
 * Transformed counts: t = ln(1 + tf) · idf, then each row scaled to unit Euclidean length and
 * multiplied by √(its number of distinct terms). Rennie et al. scale to unit length only (§4.3);
 * that shrinks every document to the weight of about one word, so the class prior outweighs the
 * text. Measured with 5-fold CV, every word kept (minDf 1), held-out
 * accuracy of the multinomial model on these features, unit length → √k: SpamAssassin (every 2nd
 * message) 0.858 → 0.966, WordNet noun glosses (26 labels) 0.548 → 0.644. Long documents still
 * weigh less than linearly.
 * @param counts documents × terms, raw counts.
 * @param idf per column, from {@link documentFrequencyIdf} on the training counts.
 * @returns a new matrix with the same structure.
 */
export function transformCounts(counts: Csr, idf: Float64Array): Csr {
  if (idf.length !== counts.cols) throw new RangeError(`idf has ${idf.length} entries for ${counts.cols} columns`);
  const { rows, indptr, indices } = counts;
  const values = new Float32Array(indptr[rows]);
  for (let r = 0; r < rows; r++) {
    const a = indptr[r], b = indptr[r + 1];
    let sq = 0;
    for (let p = a; p < b; p++) {
      const v = counts.values[p];
      const t = log1pCount(v) * idf[indices[p]];
      values[p] = t;
      sq += t * t;
    }
    if (sq > 0) {
      const scale = Math.sqrt(b - a) / Math.sqrt(sq);
      for (let p = a; p < b; p++) values[p] *= scale;
    }
  }
  return { rows, cols: counts.cols, indptr, indices, values };
}
