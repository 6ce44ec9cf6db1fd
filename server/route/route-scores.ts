/**
 * The routing hot path in one pass per row: Rennie's count transform (when the variant uses it),
 * length scaling, class scoring, softmax and the two best classes — the same arithmetic, in the same
 * order and at the same Float32 rounding, as `transformCounts` → `featureScores` → `classPosteriors`
 * composed, so the results are bit-for-bit those of the step-by-step path; only the intermediate
 * matrices and the second and third passes over the batch are gone.
 */
import type { Csr } from '../common/matrix.js';
import { log1pCount } from './transform-counts.js';

/** What {@link routeScores} needs of a fitted naive-Bayes model. */
export interface RouteScoreModel {
  readonly classCount: number;
  readonly featureCount: number;
  /** Per-column idf; length 0 scores the raw counts (no transform). */
  readonly idf: Float64Array;
  readonly logPrior: Float64Array;
  /** Feature-major, `weights[j * classCount + c]`. */
  readonly weights: Float64Array;
}

/**
 * Scores every row of a count matrix.
 * @param counts raw term counts, `model.featureCount` columns.
 * @param model the weights; a non-empty `idf` turns the transform on.
 * @param outValues the feature value of each stored entry (transformed or raw), for evidence;
 *   at least `counts.indptr[counts.rows]` long.
 * @param outProbs `rows × classCount` posteriors, row-major.
 * @param outBest best class per row (the first on ties).
 * @param outSecond runner-up per row (the first of the rest on ties; with one class, the best).
 */
export function routeScores(
  counts: Csr,
  model: RouteScoreModel,
  outValues: Float32Array,
  outProbs: Float64Array,
  outBest: Int32Array,
  outSecond: Int32Array,
): void {
  const { rows, indptr, indices } = counts;
  const src = counts.values;
  const C = model.classCount;
  const { idf, logPrior: prior, weights: w } = model;
  const transform = idf.length > 0;
  if (counts.cols !== model.featureCount) throw new RangeError(`The count matrix has ${counts.cols} columns; the model was fitted on ${model.featureCount}`);
  if (outValues.length < indptr[rows] || outProbs.length < rows * C || outBest.length < rows || outSecond.length < rows) {
    throw new RangeError('routeScores: an out buffer is too short for this batch');
  }
  for (let r = 0; r < rows; r++) {
    const a = indptr[r], b = indptr[r + 1];
    const o = r * C;
    for (let c = 0; c < C; c++) outProbs[o + c] = prior[c];
    if (transform) {
      let sq = 0;
      for (let p = a; p < b; p++) {
        const t = log1pCount(src[p]) * idf[indices[p]];
        outValues[p] = t;
        sq += t * t;
      }
      const scale = sq > 0 ? Math.sqrt(b - a) / Math.sqrt(sq) : 1;
      for (let p = a; p < b; p++) {
        // Read back from the Float32 buffer: the step-by-step path scores the rounded value.
        if (sq > 0) outValues[p] *= scale;
        const v = outValues[p];
        const base = indices[p] * C;
        for (let c = 0; c < C; c++) outProbs[o + c] += v * w[base + c];
      }
    } else {
      for (let p = a; p < b; p++) {
        const v = src[p];
        outValues[p] = v;
        const base = indices[p] * C;
        for (let c = 0; c < C; c++) outProbs[o + c] += v * w[base + c];
      }
    }
    // Softmax with the row maximum subtracted, exactly as classPosteriors.
    let max = -Infinity;
    for (let c = 0; c < C; c++) if (outProbs[o + c] > max) max = outProbs[o + c];
    let sum = 0;
    for (let c = 0; c < C; c++) {
      const e = Math.exp(outProbs[o + c] - max);
      outProbs[o + c] = e;
      sum += e;
    }
    for (let c = 0; c < C; c++) outProbs[o + c] /= sum;
    let best = 0, second = -1;
    for (let c = 1; c < C; c++) {
      if (outProbs[o + c] > outProbs[o + best]) {
        second = best;
        best = c;
      } else if (second < 0 || outProbs[o + c] > outProbs[o + second]) second = c;
    }
    if (second < 0) second = C > 1 ? (best === 0 ? 1 : 0) : best;
    outBest[r] = best;
    outSecond[r] = second;
  }
}
