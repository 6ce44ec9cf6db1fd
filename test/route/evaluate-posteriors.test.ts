import { describe, expect, it } from 'vitest';
import { evaluatePosteriors } from '../../server/route/evaluate-posteriors.js';

describe('evaluatePosteriors', () => {
  // Hand-computed: four documents, two labels; posteriors of (A, B) per row.
  const y = Int32Array.from([0, 0, 1, 1]);
  const post = Float64Array.from([0.9, 0.1, 0.4, 0.6, 0.3, 0.7, 0.2, 0.8]);
  const e = evaluatePosteriors(y, post, ['A', 'B'], 2, 'multinomial', 0.9);

  it('counts decisions into the confusion matrix, rows actual and columns predicted', () => {
    expect(e.confusion).toEqual({ labels: ['A', 'B'], matrix: [[1, 1], [0, 2]] });
    expect(e.accuracy).toBe(0.75);
    expect(e.errorRate).toBe(0.25);
  });

  it('reads per-label measures off the table (common practice definitions)', () => {
    const [a, b] = e.perLabel;
    expect(a).toMatchObject({ label: 'A', precision: 1, recall: 0.5, specificity: 1, support: 2 });
    expect(b).toMatchObject({ label: 'B', precision: 2 / 3, recall: 1, specificity: 0.5, support: 2 });
    expect(e.macroF1).toBeCloseTo((2 / 3 + 0.8) / 2, 15);
  });

  it('scores each label one-vs-rest by its own posterior', () => {
    // A's posterior ranks both A documents above both B documents: AUC 1; the same for B.
    expect(e.perLabel.map((l) => l.auc)).toEqual([1, 1]);
  });

  it('chooses the threshold from the confidences of the decisions', () => {
    // Confidences 0.9 ✓, 0.8 ✓, 0.7 ✓, 0.6 ✗ → lowest reaching 0.9 is 0.7, covering 3 of 4.
    expect(e.threshold).toEqual({ value: 0.7, targetPrecision: 0.9, precision: 1, coverage: 0.75, reached: true });
  });

  it('lists the wrong held-out decisions, most confident first', () => {
    expect(e.mistakes).toEqual([{ index: 1, actual: 'A', predicted: 'B', confidence: 0.6 }]);
  });
});
