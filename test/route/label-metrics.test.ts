import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { accuracyOf, labelMetrics } from '../../server/route/label-metrics.js';
import { confusionMatrix } from '../../server/route/confusion-matrix.js';

interface MetricCase {
  classCount: number; actual: number[]; predicted: number[]; confusion: number[][];
  precision: number[]; recall: number[]; f1: number[]; support: number[]; macroF1: number;
}
const fixture = JSON.parse(readFileSync(new URL('../fixtures/route-sklearn.json', import.meta.url), 'utf8')) as { metrics: MetricCase[] };

describe('labelMetrics', () => {
  // Source: scikit-learn 1.2 confusion_matrix and precision_recall_fscore_support(zero_division=0).
  it.each(fixture.metrics.map((c, i) => [i, c] as const))('matches scikit-learn, a never-predicted label included (case %i)', (_i, c) => {
    const k = c.classCount;
    const cm = confusionMatrix(Int32Array.from(c.actual), Int32Array.from(c.predicted), k);
    expect(Array.from({ length: k }, (_, a) => Array.from(cm.subarray(a * k, (a + 1) * k)))).toEqual(c.confusion);
    const m = labelMetrics(cm, k);
    for (let j = 0; j < k; j++) {
      expect(Math.abs(m[j].precision - c.precision[j])).toBeLessThan(1e-9);
      expect(Math.abs(m[j].recall - c.recall[j])).toBeLessThan(1e-9);
      expect(Math.abs(m[j].f1 - c.f1[j])).toBeLessThan(1e-9);
      expect(m[j].support).toBe(c.support[j]);
    }
    expect(Math.abs(m.reduce((s, x) => s + x.f1, 0) / k - c.macroF1)).toBeLessThan(1e-9);
  });

  // Common practice: accuracy = (TP+TN)/(P+N), error rate = 1 − accuracy, sensitivity = TP/P, specificity = TN/N.
  it('follows the textbook definitions on a two-label table', () => {
    // Rows actual (pos, neg), columns predicted: TP=40, FN=10, FP=5, TN=45.
    const cm = Uint32Array.from([40, 10, 5, 45]);
    const [pos, neg] = labelMetrics(cm, 2);
    expect(accuracyOf(cm, 2)).toBe((40 + 45) / 100);
    expect(1 - accuracyOf(cm, 2)).toBeCloseTo(0.15, 15);
    expect(pos.recall).toBe(40 / 50);
    expect(pos.specificity).toBe(45 / 50);
    expect(pos.precision).toBe(40 / 45);
    expect(pos.f1).toBeCloseTo((2 * (40 / 45) * 0.8) / (40 / 45 + 0.8), 15);
    // One-vs-rest for the other label swaps the roles.
    expect(neg.recall).toBe(pos.specificity);
    expect(neg.specificity).toBe(pos.recall);
  });

  it('rejects label indices outside the table', () => {
    expect(() => confusionMatrix(Int32Array.from([0, 3]), Int32Array.from([0, 1]), 2)).toThrow(/out of range/);
    expect(() => confusionMatrix(Int32Array.from([0]), Int32Array.from([0, 1]), 2)).toThrow(RangeError);
  });
});
