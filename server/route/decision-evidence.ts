/**
 * Why a text went where it went: the terms whose weight, times their (transformed) count, separates
 * the chosen label from the runner-up the most — each term's share of the log-odds between the two.
 */
import type { Csr } from '../common/matrix.js';

/**
 * Columns of row `row` that pushed most toward class `chosen` against class `rival`, strongest first.
 * Only terms that pushed toward `chosen` are listed.
 * @param features the model's feature rows (see `NaiveBayesModel.features`).
 * @param row row index.
 * @param weights feature-major weights, `weights[j * classCount + c]`.
 * @param classCount number of classes.
 * @param chosen the decided class.
 * @param rival the runner-up class.
 * @param limit at most this many columns.
 */
export function decisionEvidence(
  features: Csr,
  row: number,
  weights: Float64Array,
  classCount: number,
  chosen: number,
  rival: number,
  limit: number,
): number[] {
  // A short sorted list kept in two small typed buffers: `limit` is a handful, rows are short.
  if (pushes.length < limit) {
    pushes = new Float64Array(limit);
    columns = new Int32Array(limit);
  }
  let size = 0;
  for (let p = features.indptr[row]; p < features.indptr[row + 1]; p++) {
    const j = features.indices[p];
    const d = features.values[p] * (weights[j * classCount + chosen] - weights[j * classCount + rival]);
    if (d <= 0 || (size === limit && d <= pushes[size - 1])) continue;
    let k = size < limit ? size++ : size - 1;
    while (k > 0 && pushes[k - 1] < d) {
      pushes[k] = pushes[k - 1];
      columns[k] = columns[k - 1];
      k--;
    }
    pushes[k] = d;
    columns[k] = j;
  }
  return Array.from(columns.subarray(0, size));
}

let pushes = new Float64Array(8);
let columns = new Int32Array(8);
