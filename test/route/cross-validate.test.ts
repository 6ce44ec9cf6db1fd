import { describe, expect, it } from 'vitest';
import { crossValidateSteps } from '../../server/route/cross-validate.js';
import { fitNaiveBayes } from '../../server/route/naive-bayes.js';
import { classPosteriors } from '../../server/route/class-posteriors.js';
import { drain } from '../../server/common/step.js';
import type { Step } from '../../server/common/step.js';
import { csrFromRows } from './csr-from-rows.js';

describe('crossValidateSteps', () => {
  // Six documents, two labels, two folds; column 4 appears only in document 5.
  const rows = [
    [3, 1, 0, 0, 0],
    [2, 0, 1, 0, 0],
    [1, 1, 0, 1, 0],
    [0, 1, 3, 1, 0],
    [0, 0, 2, 2, 0],
    [1, 0, 1, 3, 4],
  ];
  const y = Int32Array.from([0, 0, 0, 1, 1, 1]);
  const foldOf = Int32Array.from([0, 1, 0, 1, 0, 1]);
  const plan = { foldOf, foldCount: 2, rule: { minDf: 1, maxDf: 1, maxTerms: 0 }, model: { alpha: 1, variant: 'multinomial' as const } };

  it('scores each document with a model fitted on the other folds only, over their vocabulary', () => {
    const post = drain(crossValidateSteps(csrFromRows(rows), y, 2, plan));
    // Fold 1 held out (docs 1, 3, 5): a model on docs 0, 2, 4 knows columns 0–3 only.
    const m = fitNaiveBayes(csrFromRows([rows[0], rows[2], rows[4]].map((r) => r.slice(0, 4))), Int32Array.from([0, 0, 1]), 2);
    const expected = classPosteriors(m.jointLogScores(csrFromRows([rows[5].slice(0, 4)])), 2);
    expect(post[5 * 2]).toBeCloseTo(expected[0], 12);
    expect(post[5 * 2 + 1]).toBeCloseTo(expected[1], 12);
  });

  it('is unaffected by a word that only the held-out document contains (no leakage)', () => {
    const without = rows.map((r, i) => (i === 5 ? [...r.slice(0, 4), 0] : r));
    const a = drain(crossValidateSteps(csrFromRows(rows), y, 2, plan));
    const b = drain(crossValidateSteps(csrFromRows(without, 5), y, 2, plan));
    // Documents of fold 1 (1, 3, 5) are scored by the model of fold 0's rows, which never saw column 4.
    for (const i of [1, 3, 5]) expect([a[2 * i], a[2 * i + 1]]).toEqual([b[2 * i], b[2 * i + 1]]);
  });

  it('yields one step per fold on the cross-validate stage', () => {
    const gen = crossValidateSteps(csrFromRows(rows), y, 2, plan);
    const steps: Step[] = [];
    for (let r = gen.next(); !r.done; r = gen.next()) steps.push(r.value);
    expect(steps).toEqual([{ stage: 'cross-validate', done: 1, total: 2 }, { stage: 'cross-validate', done: 2, total: 2 }]);
  });
});
