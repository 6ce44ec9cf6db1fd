import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rocAuc, rocCurve, thinCurve, trapezoidArea } from '../../server/route/roc-curve.js';
import { seededRandom } from '../../server/common/random.js';

interface RocCase { truth: number[]; scores: number[]; auc: number; fpr: number[]; tpr: number[] }
const fixture = JSON.parse(readFileSync(new URL('../fixtures/route-sklearn.json', import.meta.url), 'utf8')) as { roc: RocCase[] };

describe('rocCurve', () => {
  // Source: scikit-learn 1.2 roc_curve / roc_auc_score on tied scores (test/reference/route-sklearn.py).
  it.each(fixture.roc.map((c, i) => [i, c] as const))('matches scikit-learn on tied scores within 1e-9 (case %i)', (_i, c) => {
    expect(Math.abs(rocAuc(c.scores, c.truth) - c.auc)).toBeLessThan(1e-9);
    const curve = rocCurve(c.scores, c.truth);
    expect(Array.from(curve.fpr).length).toBe(c.fpr.length);
    c.fpr.forEach((v, i) => expect(Math.abs(curve.fpr[i] - v)).toBeLessThan(1e-9));
    c.tpr.forEach((v, i) => expect(Math.abs(curve.tpr[i] - v)).toBeLessThan(1e-9));
  });

  // Common practice: a scorer that ignores the truth has the diagonal as ROC and AUC 0.5.
  it('gives a random scorer an AUC close to 0.5', () => {
    const random = seededRandom(7);
    const n = 20000;
    const scores = new Float64Array(n), truth = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      scores[i] = random();
      truth[i] = random() < 0.3 ? 1 : 0;
    }
    // Standard error of AUC here is about 0.0045 (Hanley & McNeil 1982, from memory); 0.02 is over 4 of them.
    expect(Math.abs(rocAuc(scores, truth) - 0.5)).toBeLessThan(0.02);
  });

  it('gives AUC 1 to a perfect scorer, 0 to an inverted one and 0.5 to a constant one (common practice)', () => {
    expect(rocAuc([0.9, 0.8, 0.2, 0.1], [1, 1, 0, 0])).toBe(1);
    expect(rocAuc([0.1, 0.2, 0.8, 0.9], [1, 1, 0, 0])).toBe(0);
    expect(rocAuc([0.5, 0.5, 0.5, 0.5], [1, 0, 1, 0])).toBe(0.5);
  });

  it('refuses a truth with no positives or no negatives', () => {
    expect(() => rocCurve([0.1, 0.2], [0, 0])).toThrow(/positive and one negative/);
    expect(() => rocCurve([0.1, 0.2], [1, 1])).toThrow(RangeError);
  });

  it('thins a long curve to the asked number of points, keeping both ends', () => {
    const x = Array.from({ length: 1001 }, (_, i) => i / 1000);
    const pts = thinCurve(x, x, 200);
    expect(pts.length).toBeLessThanOrEqual(200);
    expect(pts[0]).toEqual([0, 0]);
    expect(pts[pts.length - 1]).toEqual([1, 1]);
    expect(trapezoidArea(pts.map((p) => p[0]), pts.map((p) => p[1]))).toBeCloseTo(0.5, 12);
  });
});

describe('rocAuc properties', () => {
  // Hanley & McNeil (1982), from memory: the area under the ROC curve equals the probability that a random
  // positive scores above a random negative, ties counting one half (the Mann–Whitney statistic).
  it('equals the pairwise Mann–Whitney estimate on arbitrary tied scores', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 6 }), fc.boolean()), { minLength: 2, maxLength: 60 }),
        (pairs) => {
          const pos = pairs.filter((p) => p[1]).map((p) => p[0]);
          const neg = pairs.filter((p) => !p[1]).map((p) => p[0]);
          fc.pre(pos.length > 0 && neg.length > 0);
          let wins = 0;
          for (const a of pos) for (const b of neg) wins += a > b ? 1 : a === b ? 0.5 : 0;
          const auc = rocAuc(pairs.map((p) => p[0] / 6), pairs.map((p) => (p[1] ? 1 : 0)));
          expect(auc).toBeCloseTo(wins / (pos.length * neg.length), 12);
        },
      ),
      { seed: 42, numRuns: 300 },
    );
  });
});
