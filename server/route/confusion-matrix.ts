/**
 * Counts of (actual, predicted) label pairs — the table every per-label measure is read from.
 */

/**
 * Builds the confusion matrix, rows actual and columns predicted.
 * @param actual true label index per document, in [0, classCount).
 * @param predicted predicted label index per document.
 * @param classCount number of labels.
 * @returns `classCount × classCount` counts, row-major.
 */
export function confusionMatrix(actual: Int32Array, predicted: Int32Array, classCount: number): Uint32Array {
  if (actual.length !== predicted.length) throw new RangeError(`Got ${actual.length} actual and ${predicted.length} predicted labels`);
  const m = new Uint32Array(classCount * classCount);
  for (let i = 0; i < actual.length; i++) {
    const a = actual[i], p = predicted[i];
    if (!(a >= 0 && a < classCount && p >= 0 && p < classCount)) throw new RangeError(`Label index out of range at document ${i}`);
    m[a * classCount + p]++;
  }
  return m;
}
