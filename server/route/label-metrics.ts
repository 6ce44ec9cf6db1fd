/**
 * One-vs-rest measures of each label read off a confusion matrix (rows actual, columns predicted).
 * Definitions (common practice): precision = TP/(TP+FP), recall = sensitivity = TP/P,
 * specificity = TN/N, F1 = 2PR/(P+R), accuracy = (TP+TN)/(P+N) summed over the diagonal.
 * A ratio with a zero denominator is reported as 0, as scikit-learn's `zero_division` default does.
 */

/** Measures of one label. */
export interface LabelCounts {
  precision: number;
  recall: number;
  specificity: number;
  f1: number;
  support: number;
}

function ratio(a: number, b: number): number {
  return b === 0 ? 0 : a / b;
}

/**
 * Per-label precision, recall, specificity, F1 and support.
 * @param confusion `classCount × classCount` counts, rows actual, columns predicted.
 * @param classCount number of labels.
 */
export function labelMetrics(confusion: ArrayLike<number>, classCount: number): LabelCounts[] {
  let total = 0;
  for (let i = 0; i < classCount * classCount; i++) total += confusion[i];
  const out: LabelCounts[] = [];
  for (let c = 0; c < classCount; c++) {
    let rowSum = 0, colSum = 0;
    for (let k = 0; k < classCount; k++) {
      rowSum += confusion[c * classCount + k];
      colSum += confusion[k * classCount + c];
    }
    const tp = confusion[c * classCount + c];
    const fp = colSum - tp;
    const negatives = total - rowSum;
    const tn = negatives - fp;
    const precision = ratio(tp, tp + fp);
    const recall = ratio(tp, rowSum);
    out.push({
      precision,
      recall,
      specificity: ratio(tn, negatives),
      f1: precision + recall === 0 ? 0 : (2 * precision * recall) / (precision + recall),
      support: rowSum,
    });
  }
  return out;
}

/**
 * Share of documents on the diagonal.
 * @param confusion `classCount × classCount` counts.
 * @param classCount number of labels.
 */
export function accuracyOf(confusion: ArrayLike<number>, classCount: number): number {
  let total = 0, right = 0;
  for (let a = 0; a < classCount; a++) {
    for (let p = 0; p < classCount; p++) total += confusion[a * classCount + p];
    right += confusion[a * classCount + a];
  }
  return ratio(right, total);
}
