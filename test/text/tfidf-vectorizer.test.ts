// The fitted vectorizer: new text is weighed exactly as the training text was, and the state
// survives JSON. Expected weights follow the definitions in Manning, Raghavan & Schütze,
// Introduction to Information Retrieval (2008), §6.2–6.4, worked by hand below.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitCounts, fitTfidf, TfidfVectorizer } from '../../server/text/index.js';

const TRAIN = [
  'Parcel arrived late again, late parcels every week',
  'The parcel was damaged and the box was wet',
  'Refund for the damaged parcel please',
  'Refund not received after two weeks',
  'Password reset link does not work, see https://help.example.com',
  'Cannot reset my password, the link expired after 24 hours',
  'App crashes after the update 東京',
  'The update made the app slow',
];
const OPTS = { minDf: 1, maxDf: 1, bigrams: true };

describe('TfidfVectorizer.transform', () => {
  it('reproduces the fitted matrix on the training texts', () => {
    const { vectorizer, matrix } = fitTfidf(TRAIN, OPTS);
    expect(vectorizer.transform(TRAIN)).toEqual(matrix);
  });

  it('weighs a new text by hand-checkable rule: (1 + ln tf) · idf, then unit length (IIR §6.2–6.4)', () => {
    const { vectorizer } = fitTfidf(TRAIN, { minDf: 1, maxDf: 1 });
    const m = vectorizer.transform(['refund refund refund wet']);
    const n = TRAIN.length;
    const idf = (df: number): number => Math.log((1 + n) / (1 + df)) + 1;
    const refund = (1 + Math.log(3)) * idf(2), wet = 1 * idf(1);
    const len = Math.hypot(refund, wet);
    const got = Object.fromEntries(Array.from(m.indices, (c, p) => [vectorizer.terms[c], m.values[p]]));
    expect(Object.keys(got).sort()).toEqual(['refund', 'wet']);
    expect(got.refund).toBeCloseTo(refund / len, 6);
    expect(got.wet).toBeCloseTo(wet / len, 6);
  });

  it('ignores terms it has never seen and gives an empty row for a text with none it knows', () => {
    const { vectorizer } = fitTfidf(TRAIN, OPTS);
    const m = vectorizer.transform(['zebra quantum', 'zebra parcel']);
    expect(m.indptr[1]).toBe(0);
    expect(m.indptr[2]).toBe(1);
    expect(vectorizer.terms[m.indices[0]]).toBe('parcel');
    expect(m.values[0]).toBeCloseTo(1, 6);
  });

  it('finds a known bigram even when it was met in a different spelling', () => {
    const { vectorizer } = fitTfidf(TRAIN, OPTS);
    const m = vectorizer.transform(['PASSWORD RESETS']);
    const terms = Array.from(m.indices, (c) => vectorizer.terms[c]);
    expect(terms).toEqual(['password', 'password_reset', 'reset']);
  });

  it('lets a word outside the vocabulary keep its neighbours apart: no bigram across it', () => {
    const { vectorizer } = fitTfidf(['refund parcel', 'refund parcel courier', 'late parcel'], { minDf: 2, maxDf: 1, bigrams: true });
    expect(vectorizer.terms).toContain('refund_parcel');
    const terms = (text: string): string[] => Array.from(vectorizer.counts([text]).indices, (c) => vectorizer.terms[c]);
    expect(terms('refund parcel')).toEqual(['parcel', 'refund', 'refund_parcel']);
    // "zebra" was never seen: it is a kept word all the same, so "refund" and "parcel" are not adjacent.
    expect(terms('refund zebra parcel')).toEqual(['parcel', 'refund']);
    // "courier" was seen once and pruned by minDf 2: the same holds for a word the fit met and dropped.
    expect(vectorizer.terms).not.toContain('courier');
    expect(terms('refund courier parcel')).toEqual(['parcel', 'refund']);
    // A stop word is dropped before bigrams are formed, as in fitting.
    expect(terms('refund the parcel')).toEqual(['parcel', 'refund', 'refund_parcel']);
  });

  it('reproduces the fitted weights and counts on the training texts for pruned vocabularies (property)', () => {
    // The fit names every word it meets; the vectorizer knows only its columns. Both must agree,
    // bigrams included (placeholders too), whatever minDf and maxTerms prune: a bigram column can
    // outlive one of its words, as "parcel_wet" does when maxTerms drops "wet".
    const word = fc.constantFrom('parcel', 'parcels', 'late', 'refund', 'the', 'box', 'wet', 'reset', 'link', 'a', 'crashes', '42', 'app', 'über', '東京', 'www.example.com', 'me@example.org');
    const text = fc.array(word, { maxLength: 12 }).map((ws) => ws.join(' '));
    fc.assert(fc.property(fc.array(text, { minLength: 1, maxLength: 20 }), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 0, max: 8 }), (texts, minDf, maxTerms) => {
      const opts = { minDf, maxDf: 1, maxTerms, bigrams: true };
      const fitted = fitTfidf(texts, opts);
      expect(fitted.vectorizer.transform(texts)).toEqual(fitted.matrix);
      const counted = fitCounts(texts, opts);
      expect(counted.vectorizer.counts(texts)).toEqual(counted.counts);
    }), { numRuns: 300, seed: 20261201 });
  });

  it('keeps a bigram column whose word was pruned (maxTerms kept "parcel_wet" but not "wet")', () => {
    const texts = ['parcel parcel link parcel wet'];
    const { vectorizer, matrix } = fitTfidf(texts, { minDf: 1, maxDf: 1, maxTerms: 6, bigrams: true });
    expect(vectorizer.terms).toEqual(['link', 'link_parcel', 'parcel', 'parcel_link', 'parcel_parcel', 'parcel_wet']);
    expect(vectorizer.transform(texts)).toEqual(matrix);
  });

  it('gives raw counts with counts()', () => {
    const { vectorizer } = fitTfidf(TRAIN, { minDf: 1, maxDf: 1 });
    const m = vectorizer.counts(['late late late parcel']);
    expect(Object.fromEntries(Array.from(m.indices, (c, p) => [vectorizer.terms[c], m.values[p]]))).toEqual({ late: 3, parcel: 1 });
  });

  it('yields vectorise steps ending at the number of texts', () => {
    const { vectorizer } = fitTfidf(TRAIN, OPTS);
    const texts = Array.from({ length: 5000 }, (_, i) => TRAIN[i % TRAIN.length]);
    const gen = vectorizer.transformSteps(texts);
    const steps = [];
    let r = gen.next();
    while (!r.done) { steps.push(r.value); r = gen.next(); }
    expect(steps.length).toBeGreaterThanOrEqual(3);
    expect(steps.every((s) => s.stage === 'vectorise' && s.done <= s.total)).toBe(true);
    expect(steps.at(-1)).toEqual({ stage: 'vectorise', done: 5000, total: 5000 });
    expect(r.value.rows).toBe(5000);
  });

  it('rejects a non-string text at the call', () => {
    const { vectorizer } = fitTfidf(TRAIN, OPTS);
    expect(() => vectorizer.transformSteps([null as unknown as string])).toThrow(/Text 0 is null/);
  });
});

describe('TfidfVectorizer JSON', () => {
  it('round-trips through JSON text with identical transforms and state', () => {
    const { vectorizer } = fitTfidf(TRAIN, OPTS);
    const state = JSON.parse(JSON.stringify(vectorizer));
    const loaded = TfidfVectorizer.fromJSON(state);
    expect(loaded.toJSON()).toEqual(vectorizer.toJSON());
    const probe = [...TRAIN, 'late refund for a damaged box', '', 'résumé 東京都 https://x.example 12'];
    expect(loaded.transform(probe)).toEqual(vectorizer.transform(probe));
    expect(loaded.counts(probe)).toEqual(vectorizer.counts(probe));
    expect(state.kind).toBe('sheaf.tfidf');
    expect(state.version).toBe(1);
  });

  it('refuses a wrong or damaged state with a message saying what is wrong', () => {
    const good = fitTfidf(TRAIN, OPTS).vectorizer.toJSON();
    const bad = (patch: object): unknown => ({ ...JSON.parse(JSON.stringify(good)), ...patch });
    expect(() => TfidfVectorizer.fromJSON(null)).toThrow(/expected an object/);
    expect(() => TfidfVectorizer.fromJSON(bad({ kind: 'other' }))).toThrow(/kind is "other"/);
    expect(() => TfidfVectorizer.fromJSON(bad({ version: 2 }))).toThrow(/version 2 is not supported/);
    expect(() => TfidfVectorizer.fromJSON(bad({ terms: good.terms.slice(1) }))).toThrow(/labels for/);
    expect(() => TfidfVectorizer.fromJSON(bad({ idf: good.idf.map(() => -1) }))).toThrow(/idf\[0\]/);
    expect(() => TfidfVectorizer.fromJSON(bad({ idf: good.idf.slice(1) }))).toThrow(/idf must be an array/);
    expect(() => TfidfVectorizer.fromJSON(bad({ terms: good.terms.map(() => 'same') }))).toThrow(/appears twice/);
    expect(() => TfidfVectorizer.fromJSON(bad({ documentCount: -3 }))).toThrow(/documentCount/);
    expect(() => TfidfVectorizer.fromJSON(bad({ options: { ...good.options, stem: undefined } }))).toThrow(/options.stem is missing/);
    expect(() => TfidfVectorizer.fromJSON(bad({ options: { ...good.options, minDf: -1 } }))).toThrow(/minDf/);
  });
});
