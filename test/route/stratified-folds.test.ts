import { describe, expect, it } from 'vitest';
import { stratifiedFolds } from '../../server/route/stratified-folds.js';
import { seededRandom } from '../../server/common/random.js';

describe('stratifiedFolds', () => {
  const y = Int32Array.from({ length: 103 }, (_, i) => (i < 60 ? 0 : i < 95 ? 1 : 2));

  it('puts every label in every fold in nearly its overall proportion', () => {
    const f = stratifiedFolds(y, 3, 5, seededRandom(1));
    for (let c = 0; c < 3; c++) {
      const perFold = [0, 0, 0, 0, 0];
      y.forEach((l, i) => { if (l === c) perFold[f[i]]++; });
      expect(Math.max(...perFold) - Math.min(...perFold)).toBeLessThanOrEqual(1);
      expect(Math.min(...perFold)).toBeGreaterThan(0);
    }
  });

  it('makes folds whose sizes differ by at most one', () => {
    const f = stratifiedFolds(y, 3, 5, seededRandom(3));
    const sizes = [0, 0, 0, 0, 0];
    f.forEach((k) => sizes[k]++);
    expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
  });

  it('gives the same folds for the same seed and different ones for another', () => {
    expect(stratifiedFolds(y, 3, 5, seededRandom(9))).toEqual(stratifiedFolds(y, 3, 5, seededRandom(9)));
    expect(stratifiedFolds(y, 3, 5, seededRandom(9))).not.toEqual(stratifiedFolds(y, 3, 5, seededRandom(10)));
  });

  it('rejects fewer than 2 folds or more folds than documents', () => {
    expect(() => stratifiedFolds(y, 3, 1, seededRandom(1))).toThrow(/≥ 2/);
    expect(() => stratifiedFolds(Int32Array.from([0, 1]), 2, 3, seededRandom(1))).toThrow(/folds/);
  });
});
