/**
 * Everything a person needs to judge a router, computed from held-out posteriors: accuracy, the
 * confusion matrix, per-label measures, one-vs-rest ROC curves and the abstain threshold.
 */
import type { Evaluation, LabelEvaluation, NaiveBayesVariant } from './api.js';
import { rowArgmax } from './class-posteriors.js';
import { confusionMatrix } from './confusion-matrix.js';
import { accuracyOf, labelMetrics } from './label-metrics.js';
import { rocCurve, thinCurve, trapezoidArea } from './roc-curve.js';
import { abstainThreshold, thinThresholdCurve } from './abstain-threshold.js';

/** Display limits of the curves. */
const ROC_POINTS = 200;
const THRESHOLD_POINTS = 100;
const MISTAKES = 100;

/**
 * Builds the evaluation.
 * @param y true label index per document.
 * @param posteriors held-out posteriors, `documents × labels.length`, row-major.
 * @param labels label names, in class-index order.
 * @param folds folds used.
 * @param variant variant evaluated.
 * @param targetPrecision precision the abstain threshold must reach.
 */
export function evaluatePosteriors(
  y: Int32Array,
  posteriors: Float64Array,
  labels: readonly string[],
  folds: number,
  variant: NaiveBayesVariant,
  targetPrecision: number,
): Evaluation {
  const n = y.length, C = labels.length;
  const predicted = new Int32Array(n);
  const confidence = new Float64Array(n);
  rowArgmax(posteriors, C, predicted, confidence);
  const confusion = confusionMatrix(y, predicted, C);
  const measures = labelMetrics(confusion, C);
  const accuracy = accuracyOf(confusion, C);

  const column = new Float64Array(n);
  const positive = new Uint8Array(n);
  const perLabel: LabelEvaluation[] = [];
  const roc: Evaluation['roc'] = [];
  for (let c = 0; c < C; c++) {
    for (let i = 0; i < n; i++) {
      column[i] = posteriors[i * C + c];
      positive[i] = y[i] === c ? 1 : 0;
    }
    const curve = rocCurve(column, positive);
    perLabel.push({ label: labels[c], ...measures[c], auc: trapezoidArea(curve.fpr, curve.tpr) });
    roc.push({ label: labels[c], points: thinCurve(curve.fpr, curve.tpr, ROC_POINTS) });
  }

  const correct = new Uint8Array(n);
  for (let i = 0; i < n; i++) correct[i] = predicted[i] === y[i] ? 1 : 0;
  const choice = abstainThreshold(confidence, correct, targetPrecision);

  const wrong: number[] = [];
  for (let i = 0; i < n; i++) if (!correct[i]) wrong.push(i);
  wrong.sort((a, b) => confidence[b] - confidence[a] || a - b);
  const mistakes = wrong.slice(0, MISTAKES).map((i) => ({ index: i, actual: labels[y[i]], predicted: labels[predicted[i]], confidence: confidence[i] }));

  const matrix: number[][] = [];
  for (let a = 0; a < C; a++) matrix.push(Array.from(confusion.subarray(a * C, (a + 1) * C)));
  return {
    folds,
    variant,
    accuracy,
    errorRate: 1 - accuracy,
    macroF1: perLabel.reduce((s, l) => s + l.f1, 0) / C,
    documentCount: n,
    perLabel,
    confusion: { labels: labels.slice(), matrix },
    roc,
    threshold: choice.threshold,
    thresholdCurve: thinThresholdCurve(choice.curve, THRESHOLD_POINTS, choice.threshold.value),
    mistakes,
  };
}
