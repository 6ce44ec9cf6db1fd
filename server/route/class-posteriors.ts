/**
 * Turns joint log scores into posteriors: the softmax of each row, computed with the row maximum
 * subtracted so that scores of −1000 do not underflow to 0/0.
 */

/**
 * In-place softmax of every row of a `rows × classCount` row-major matrix.
 * @param scores log scores; overwritten with probabilities.
 * @param classCount row width.
 * @returns `scores`.
 */
export function classPosteriors(scores: Float64Array, classCount: number): Float64Array {
  const rows = scores.length / classCount;
  for (let r = 0; r < rows; r++) {
    const o = r * classCount;
    let max = -Infinity;
    for (let c = 0; c < classCount; c++) if (scores[o + c] > max) max = scores[o + c];
    let sum = 0;
    for (let c = 0; c < classCount; c++) {
      const e = Math.exp(scores[o + c] - max);
      scores[o + c] = e;
      sum += e;
    }
    for (let c = 0; c < classCount; c++) scores[o + c] /= sum;
  }
  return scores;
}

/**
 * In-place log-softmax (log posteriors) of every row, as scikit-learn's `predict_log_proba`:
 * score − logsumexp(row).
 * @param scores log scores; overwritten with log probabilities.
 * @param classCount row width.
 */
export function classLogPosteriors(scores: Float64Array, classCount: number): Float64Array {
  const rows = scores.length / classCount;
  for (let r = 0; r < rows; r++) {
    const o = r * classCount;
    let max = -Infinity;
    for (let c = 0; c < classCount; c++) if (scores[o + c] > max) max = scores[o + c];
    let sum = 0;
    for (let c = 0; c < classCount; c++) sum += Math.exp(scores[o + c] - max);
    const lse = max + Math.log(sum);
    for (let c = 0; c < classCount; c++) scores[o + c] -= lse;
  }
  return scores;
}

/**
 * The best class of each row (the first on ties) and its value.
 * @param probs `rows × classCount` row-major.
 * @param classCount row width.
 * @param outLabel best class per row.
 * @param outValue its value per row.
 */
export function rowArgmax(probs: Float64Array, classCount: number, outLabel: Int32Array, outValue: Float64Array): void {
  const rows = probs.length / classCount;
  for (let r = 0; r < rows; r++) {
    const o = r * classCount;
    let best = 0;
    for (let c = 1; c < classCount; c++) if (probs[o + c] > probs[o + best]) best = c;
    outLabel[r] = best;
    outValue[r] = probs[o + best];
  }
}
