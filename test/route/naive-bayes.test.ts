import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { NaiveBayesModel, fitNaiveBayes } from '../../server/route/naive-bayes.js';
import { classLogPosteriors } from '../../server/route/class-posteriors.js';
import { documentFrequencyIdf } from '../../server/route/transform-counts.js';
import { csrFromRows } from './csr-from-rows.js';

interface NbCase {
  alpha: number;
  classCount: number;
  xTrain: number[][];
  yTrain: number[];
  xTest: number[][];
  multinomial: { classLogPrior: number[]; featureLogProb: number[][]; predictLogProba: number[][] };
  complement: { featureLogProb: number[][]; jointScores: number[][] };
  idf: number[];
}
const fixture = JSON.parse(readFileSync(new URL('../fixtures/route-sklearn.json', import.meta.url), 'utf8')) as { naiveBayes: NbCase[] };

function weight(m: NaiveBayesModel, term: number, cls: number): number {
  return m.weights[term * m.classCount + cls];
}

describe('multinomial naive Bayes', () => {
  // Source: Manning, Raghavan & Schütze (2008), Introduction to Information Retrieval, Example 13.1 / Table 13.1.
  // Columns: chinese, beijing, shanghai, macao, tokyo, japan. Class 0 = China (c), class 1 = not China (c̄).
  const train = csrFromRows([
    [2, 1, 0, 0, 0, 0], // d1 Chinese Beijing Chinese
    [2, 0, 1, 0, 0, 0], // d2 Chinese Chinese Shanghai
    [1, 0, 0, 1, 0, 0], // d3 Chinese Macao
    [1, 0, 0, 0, 1, 1], // d4 Tokyo Japan Chinese
  ]);
  const y = Int32Array.from([0, 0, 0, 1]);
  const model = fitNaiveBayes(train, y, 2, { alpha: 1, variant: 'multinomial' });
  const d5 = csrFromRows([[3, 0, 0, 0, 1, 1]]); // Chinese Chinese Chinese Tokyo Japan

  it('reproduces the priors and conditional probabilities of IIR Example 13.1', () => {
    expect(Math.exp(model.logPrior[0])).toBeCloseTo(3 / 4, 12);
    expect(Math.exp(model.logPrior[1])).toBeCloseTo(1 / 4, 12);
    expect(Math.exp(weight(model, 0, 0))).toBeCloseTo(3 / 7, 12);
    expect(Math.exp(weight(model, 4, 0))).toBeCloseTo(1 / 14, 12);
    expect(Math.exp(weight(model, 5, 0))).toBeCloseTo(1 / 14, 12);
    expect(Math.exp(weight(model, 0, 1))).toBeCloseTo(2 / 9, 12);
    expect(Math.exp(weight(model, 4, 1))).toBeCloseTo(2 / 9, 12);
    expect(Math.exp(weight(model, 5, 1))).toBeCloseTo(2 / 9, 12);
  });

  it('scores d5 ≈ 0.0003 for China and ≈ 0.0001 for not-China, so China wins (IIR Example 13.1)', () => {
    const s = model.jointLogScores(d5);
    const pc = Math.exp(s[0]), pn = Math.exp(s[1]);
    expect(pc).toBeCloseTo((3 / 4) * (3 / 7) ** 3 * (1 / 14) * (1 / 14), 15);
    expect(pn).toBeCloseTo((1 / 4) * (2 / 9) ** 3 * (2 / 9) * (2 / 9), 15);
    expect(Number(pc.toFixed(4))).toBe(0.0003);
    expect(Number(pn.toFixed(4))).toBe(0.0001);
    expect(pc).toBeGreaterThan(pn);
  });

  // Source: scikit-learn 1.2 MultinomialNB (fixtures from test/reference/route-sklearn.py).
  it.each(fixture.naiveBayes.map((c, i) => [i, c] as const))('matches scikit-learn MultinomialNB predict_log_proba within 1e-9 (case %i)', (_i, c) => {
    const m = fitNaiveBayes(csrFromRows(c.xTrain), Int32Array.from(c.yTrain), c.classCount, { alpha: c.alpha, variant: 'multinomial' });
    for (let k = 0; k < c.classCount; k++) expect(m.logPrior[k]).toBeCloseTo(c.multinomial.classLogPrior[k], 9);
    c.multinomial.featureLogProb.forEach((row, k) => row.forEach((v, j) => expect(Math.abs(weight(m, j, k) - v)).toBeLessThan(1e-9)));
    const lp = classLogPosteriors(m.jointLogScores(csrFromRows(c.xTest)), c.classCount);
    c.multinomial.predictLogProba.forEach((row, r) => row.forEach((v, k) => expect(Math.abs(lp[r * c.classCount + k] - v)).toBeLessThan(1e-9)));
  });

  // Source: scikit-learn 1.2 ComplementNB(norm=False); Rennie et al. (2003) add the class prior, which we do.
  it.each(fixture.naiveBayes.map((c, i) => [i, c] as const))('matches scikit-learn ComplementNB weights and scores, plus the prior (case %i)', (_i, c) => {
    const m = fitNaiveBayes(csrFromRows(c.xTrain), Int32Array.from(c.yTrain), c.classCount, { alpha: c.alpha, variant: 'complement' });
    c.complement.featureLogProb.forEach((row, k) => row.forEach((v, j) => expect(Math.abs(weight(m, j, k) - v)).toBeLessThan(1e-9)));
    const s = m.jointLogScores(csrFromRows(c.xTest));
    c.complement.jointScores.forEach((row, r) => row.forEach((v, k) => expect(Math.abs(s[r * c.classCount + k] - m.logPrior[k] - v)).toBeLessThan(1e-9)));
  });

  // Source: scikit-learn 1.2 TfidfTransformer(smooth_idf=True).idf_.
  it.each(fixture.naiveBayes.map((c, i) => [i, c] as const))('computes the smoothed idf scikit-learn computes (case %i)', (_i, c) => {
    const idf = documentFrequencyIdf(csrFromRows(c.xTrain));
    c.idf.forEach((v, j) => expect(Math.abs(idf[j] - v)).toBeLessThan(1e-12));
  });

  it('round-trips through JSON with identical scores for every variant', () => {
    const c = fixture.naiveBayes[1];
    for (const variant of ['multinomial', 'complement', 'tfidf', 'tfidf-complement'] as const) {
      const m = fitNaiveBayes(csrFromRows(c.xTrain), Int32Array.from(c.yTrain), c.classCount, { alpha: c.alpha, variant });
      const back = NaiveBayesModel.fromJSON(JSON.parse(JSON.stringify(m)));
      expect(back.variant).toBe(variant);
      expect(Array.from(back.jointLogScores(csrFromRows(c.xTest)))).toEqual(Array.from(m.jointLogScores(csrFromRows(c.xTest))));
    }
  });

  it('refuses malformed JSON with a message naming the problem', () => {
    const good = fitNaiveBayes(train, y, 2).toJSON();
    expect(() => NaiveBayesModel.fromJSON(null)).toThrow(/kind/);
    expect(() => NaiveBayesModel.fromJSON({ ...good, version: 2 })).toThrow(/version/);
    expect(() => NaiveBayesModel.fromJSON({ ...good, variant: 'bogus' })).toThrow(/variant/);
    expect(() => NaiveBayesModel.fromJSON({ ...good, weights: good.weights.slice(1) })).toThrow(/weights/);
  });

  it('rejects a non-positive alpha, an unknown variant and out-of-range labels', () => {
    expect(() => fitNaiveBayes(train, y, 2, { alpha: 0 })).toThrow(RangeError);
    expect(() => fitNaiveBayes(train, y, 2, { variant: 'x' as never })).toThrow(/variant/);
    expect(() => fitNaiveBayes(train, Int32Array.from([0, 0, 0, 2]), 2)).toThrow(/outside/);
    expect(() => model.jointLogScores(csrFromRows([[1, 2]]))).toThrow(/columns/);
  });
});
