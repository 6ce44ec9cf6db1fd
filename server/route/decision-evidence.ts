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
  if (pushes.length < limit) {
    pushes = new Float64Array(limit);
    columns = new Int32Array(limit);
  }
  const size = evidenceInto(features.indices, features.values, features.indptr[row], features.indptr[row + 1], weights, classCount, chosen, rival, limit, columns, pushes);
  return Array.from(columns.subarray(0, size));
}

let pushes = new Float64Array(8);
let columns = new Int32Array(8);

/**
 * {@link decisionEvidence} over the stored entries `start … end − 1` of a sparse row, into caller
 * buffers: a short sorted list kept by insertion, since `limit` is a handful and rows are short, so
 * no sort of the whole row and nothing allocated.
 * @param indices column of each stored entry.
 * @param values feature value of each stored entry.
 * @param start first entry of the row.
 * @param end one past its last entry.
 * @param weights feature-major weights, `weights[j * classCount + c]`.
 * @param classCount number of classes.
 * @param chosen the decided class.
 * @param rival the runner-up class.
 * @param limit at most this many columns.
 * @param outColumns receives the columns, strongest first (at least `limit` long).
 * @param outPushes scratch for their pushes (at least `limit` long).
 * @returns how many columns were written.
 */
export function evidenceInto(
  indices: ArrayLike<number>,
  values: ArrayLike<number>,
  start: number,
  end: number,
  weights: Float64Array,
  classCount: number,
  chosen: number,
  rival: number,
  limit: number,
  outColumns: Int32Array,
  outPushes: Float64Array,
): number {
  let size = 0;
  for (let p = start; p < end; p++) {
    const j = indices[p];
    const d = values[p] * (weights[j * classCount + chosen] - weights[j * classCount + rival]);
    if (d <= 0 || (size === limit && d <= outPushes[size - 1])) continue;
    let k = size < limit ? size++ : size - 1;
    while (k > 0 && outPushes[k - 1] < d) {
      outPushes[k] = outPushes[k - 1];
      outColumns[k] = outColumns[k - 1];
      k--;
    }
    outPushes[k] = d;
    outColumns[k] = j;
  }
  return size;
}
