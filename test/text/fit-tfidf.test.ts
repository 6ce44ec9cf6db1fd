// Fitting: invariants of the TF-IDF matrix, vocabulary choice, labels, progress and errors.
// Weights are defined in Manning, Raghavan & Schütze, Introduction to Information Retrieval (2008),
// §6.2–6.4 (tf-idf, sublinear tf, cosine length normalisation); the smoothed idf ln((1+n)/(1+df))+1
// is scikit-learn's (checked numerically in tfidf-reference.test.ts).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { drain, type Step } from '../../server/common/step.js';
import type { Csr } from '../../server/common/matrix.js';
import { DEFAULT_TFIDF_OPTIONS, fitCounts, fitCountsSteps, fitTfidf, fitTfidfSteps } from '../../server/text/index.js';

function rowNorm(m: Csr, r: number): number {
  let s = 0;
  for (let p = m.indptr[r]; p < m.indptr[r + 1]; p++) s += m.values[p] * m.values[p];
  return Math.sqrt(s);
}

function expectWellFormed(m: Csr): void {
  expect(m.indptr.length).toBe(m.rows + 1);
  expect(m.indptr[0]).toBe(0);
  expect(m.indices.length).toBe(m.indptr[m.rows]);
  expect(m.values.length).toBe(m.indptr[m.rows]);
  for (let r = 0; r < m.rows; r++) {
    for (let p = m.indptr[r]; p < m.indptr[r + 1]; p++) {
      expect(m.indices[p]).toBeLessThan(m.cols);
      if (p > m.indptr[r]) expect(m.indices[p]).toBeGreaterThan(m.indices[p - 1]);
      expect(Number.isFinite(m.values[p])).toBe(true);
    }
  }
}

const TICKETS = [
  'Parcel arrived late again, late parcels every week',
  'The parcel was damaged and the box was wet',
  'Refund for the damaged parcel please',
  'Refund not received after two weeks',
  'Password reset link does not work',
  'Cannot reset my password, the link expired',
  'App crashes after the update',
  'The update made the app slow',
];

describe('fitTfidf', () => {
  it('gives every non-empty row unit Euclidean length (IIR §6.3.1 cosine normalisation)', () => {
    const { matrix } = fitTfidf(TICKETS, { minDf: 1, maxDf: 1 });
    expectWellFormed(matrix);
    for (let r = 0; r < matrix.rows; r++) expect(Math.abs(rowNorm(matrix, r) - 1)).toBeLessThan(1e-6);
  });

  it('keeps rows unit-length or empty and well formed for arbitrary text (property)', () => {
    const text = fc.array(fc.constantFrom('parcel', 'late', 'the', 'refund', 'é', '東京', '42', 'x', '👍', 'https://a.example', '-', "don't", 'Crème'), { maxLength: 12 }).map((w) => w.join(' '));
    fc.assert(fc.property(fc.array(fc.oneof(text, fc.string()), { minLength: 1, maxLength: 12 }), (texts) => {
      const { matrix, vectorizer } = fitTfidf(texts, { minDf: 1, maxDf: 1 });
      expectWellFormed(matrix);
      for (let r = 0; r < matrix.rows; r++) {
        const n = rowNorm(matrix, r);
        expect(matrix.indptr[r + 1] === matrix.indptr[r] ? n === 0 : Math.abs(n - 1) < 1e-6).toBe(true);
      }
      expect(vectorizer.transform(texts)).toEqual(matrix);
    }), { numRuns: 150, seed: 7 });
  });

  it('gives empty rows, not NaN, when every document is stop words', () => {
    const { matrix, vectorizer, df } = fitTfidf(['the and of', 'it was the', 'and'], { minDf: 1, maxDf: 1 });
    expect(matrix.rows).toBe(3);
    expect(matrix.cols).toBe(0);
    expect(Array.from(matrix.indptr)).toEqual([0, 0, 0, 0]);
    expect(vectorizer.terms).toEqual([]);
    expect(df.length).toBe(0);
    expect(vectorizer.transform(['the parcel'])).toEqual({ rows: 1, cols: 0, indptr: new Uint32Array([0, 0]), indices: new Uint32Array(0), values: new Float32Array(0) });
  });

  it('gives an empty row for an empty document among others', () => {
    const { matrix } = fitTfidf(['parcel late', '', 'parcel refund'], { minDf: 1, maxDf: 1 });
    expect(matrix.indptr[2] - matrix.indptr[1]).toBe(0);
    expect(matrix.indptr[1]).toBeGreaterThan(0);
  });

  it('handles an empty corpus', () => {
    const { matrix, vectorizer } = fitTfidf([]);
    expect(matrix.rows).toBe(0);
    expect(vectorizer.documentCount).toBe(0);
  });

  it('sorts columns by term and reports document frequencies by column', () => {
    const { vectorizer, df } = fitTfidf(TICKETS, { minDf: 1, maxDf: 1 });
    expect([...vectorizer.terms].sort()).toEqual(vectorizer.terms);
    expect(df[vectorizer.columnOf('parcel')]).toBe(3);
    expect(df[vectorizer.columnOf('refund')]).toBe(2);
  });

  it('prunes by document count and by fraction (minDf 2 drops singletons; maxDf 0.3 drops terms in over 30% of documents)', () => {
    const { vectorizer } = fitTfidf(TICKETS, { minDf: 2, maxDf: 0.3 });
    // parcel is in 3/8 > 0.3 of the documents; every kept term is in 2 ("week": docs 1 and 4).
    expect(vectorizer.terms).toEqual(['app', 'damag', 'link', 'password', 'refund', 'reset', 'updat', 'week']);
  });

  it('caps the vocabulary at maxTerms, most frequent first, ties broken by term', () => {
    const { vectorizer } = fitTfidf(TICKETS, { minDf: 1, maxDf: 1, maxTerms: 2 });
    // parcel: 4 occurrences; late: 2, app: 2, … — the tie at 2 goes to the alphabetically first.
    expect(vectorizer.terms).toEqual(['app', 'parcel']);
  });

  it('leaves an empty vocabulary when the number of documents makes minDf and maxDf contradict', () => {
    const { matrix } = fitTfidf(['parcel late', 'parcel late', 'refund'], { minDf: 2, maxDf: 0.5 });
    expect(matrix.cols).toBe(0);
  });

  it('labels each column with its most frequent spelling; bigram labels join their parts', () => {
    const { vectorizer } = fitTfidf(['Deliveries late', 'late deliveries', 'a late delivery', 'refund 12'], { minDf: 1, maxDf: 1, bigrams: true });
    const label = (t: string): string => vectorizer.labels[vectorizer.columnOf(t)];
    expect(label('deliveri')).toBe('deliveries');
    expect(label('late_deliveri')).toBe('late deliveries');
    expect(label('__number__')).toBe('[number]');
  });

  it('labels words that are also names of object properties like any other word', () => {
    const { vectorizer } = fitTfidf(['constructor tostring', 'constructor hasownproperty'], { minDf: 1, maxDf: 1, stem: false });
    expect(vectorizer.labels).toEqual(['constructor', 'hasownproperty', 'tostring']);
  });

  it('yields tokenise then weigh steps with done never above total, ending at total', () => {
    const texts = Array.from({ length: 4500 }, (_, i) => `ticket ${i} about parcel ${i % 7} and refund ${i % 11}`);
    const steps: Step[] = [];
    const gen = fitTfidfSteps(texts);
    let r = gen.next();
    while (!r.done) { steps.push(r.value); r = gen.next(); }
    const stages = [...new Set(steps.map((s) => s.stage))];
    expect(stages).toEqual(['tokenise', 'weigh']);
    for (const s of steps) expect(s.done).toBeLessThanOrEqual(s.total);
    expect(steps.filter((s) => s.stage === 'tokenise').length).toBeGreaterThanOrEqual(3);
    expect(steps.at(-1)).toEqual({ stage: 'weigh', done: 4500, total: 4500 });
    expect(r.value.matrix.rows).toBe(4500);
  });

  it('gives the same result drained as stepped, and the same on a second run', () => {
    const a = fitTfidf(TICKETS, { minDf: 1, maxDf: 1 });
    const b = drain(fitTfidfSteps(TICKETS, { minDf: 1, maxDf: 1 }));
    expect(b.matrix).toEqual(a.matrix);
    expect(b.vectorizer.toJSON()).toEqual(a.vectorizer.toJSON());
  });

  it('refuses bad input at the call, naming what is wrong', () => {
    expect(() => fitTfidfSteps(['ok', 7 as unknown as string])).toThrow(/Text 1 is number/);
    expect(() => fitTfidfSteps('one text' as unknown as string[])).toThrow(/array of strings/);
    expect(() => fitTfidfSteps([], { minDf: 0 })).toThrow(RangeError);
    expect(() => fitTfidfSteps([], { minDf: 2.5 })).toThrow(/minDf/);
    expect(() => fitTfidfSteps([], { maxDf: 1.5 })).toThrow(/maxDf/);
    expect(() => fitTfidfSteps([], { minDf: 5, maxDf: 3 })).toThrow(/exceeds maxDf/);
    expect(() => fitTfidfSteps([], { minDf: 0.6, maxDf: 0.5 })).toThrow(/exceeds maxDf/);
    expect(() => fitTfidfSteps([], { maxTerms: -1 })).toThrow(/maxTerms/);
    expect(() => fitTfidfSteps([], { max_df: 0.5 } as never)).toThrow(/Unknown text option "max_df"/);
  });

  it('documents its defaults', () => {
    expect(DEFAULT_TFIDF_OPTIONS).toEqual({ stopWords: true, stem: true, bigrams: false, minTokenLength: 2, minDf: 2, maxDf: 0.5, maxTerms: 0, sublinearTf: true, smoothIdf: true, normalize: true });
  });
});

describe('fitCounts', () => {
  it('gives raw term counts over the same vocabulary as fitTfidf', () => {
    const { vectorizer, counts } = fitCounts(TICKETS, { minDf: 1, maxDf: 1 });
    const tfidf = fitTfidf(TICKETS, { minDf: 1, maxDf: 1 });
    expect(vectorizer.terms).toEqual(tfidf.vectorizer.terms);
    expect(counts.indices).toEqual(tfidf.matrix.indices);
    // Row 0 says "late" and "parcel" twice each (parcels → parcel).
    const row0 = new Map<string, number>();
    for (let p = counts.indptr[0]; p < counts.indptr[1]; p++) row0.set(vectorizer.terms[counts.indices[p]], counts.values[p]);
    expect(Object.fromEntries(row0)).toEqual({ late: 2, parcel: 2, arriv: 1, week: 1 });
  });

  it('matches the vectorizer\'s counts() on the training texts and yields steps', () => {
    const gen = fitCountsSteps(TICKETS, { minDf: 1, maxDf: 1 });
    let r = gen.next();
    let steps = 0;
    while (!r.done) { steps++; r = gen.next(); }
    expect(steps).toBeGreaterThan(1);
    expect(r.value.vectorizer.counts(TICKETS)).toEqual(r.value.counts);
  });
});
