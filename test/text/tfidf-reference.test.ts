// Our TF-IDF weights against scikit-learn's TfidfVectorizer (source: scikit-learn 1.2 from Debian's
// python3-sklearn, run by test/reference/tfidf.py on the terms in test/fixtures/tfidf-tokens.json).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeText, fitTfidf, type TfidfOptions } from '../../server/text/index.js';

interface TokenFixture { corpus: string[]; tokens: string[][]; tokensWithBigrams: string[][] }
interface Case { name: string; options: Partial<TfidfOptions>; vocabulary: string[]; idf: number[]; matrix: number[][] }

const tokens = JSON.parse(readFileSync('test/fixtures/tfidf-tokens.json', 'utf8')) as TokenFixture;
const reference = JSON.parse(readFileSync('test/fixtures/tfidf.json', 'utf8')) as { source: string; cases: Case[] };

describe('tokens fed to the reference', () => {
  it('analyzeText still gives exactly the terms the fixtures were made from', () => {
    expect(tokens.corpus.map((t) => analyzeText(t).terms)).toEqual(tokens.tokens);
    expect(tokens.corpus.map((t) => analyzeText(t, { bigrams: true }).terms)).toEqual(tokens.tokensWithBigrams);
  });
});

describe(`TF-IDF equals ${reference.source}`, () => {
  it('covers every option set the reference script writes', () => {
    expect(reference.cases.map((c) => c.name)).toEqual(['all-terms', 'pruned', 'pruned-counts', 'raw-tf-plain-idf-unnormalised', 'bigrams', 'capped']);
  });

  for (const c of reference.cases) {
    it(`${c.name}: same vocabulary, idf within 1e-9 and weights within 1e-6 (source: scikit-learn)`, () => {
      const { vectorizer, matrix } = fitTfidf(tokens.corpus, c.options);
      expect(vectorizer.terms).toEqual(c.vocabulary);
      expect(vectorizer.idf.length).toBe(c.idf.length);
      vectorizer.idf.forEach((v, j) => expect(Math.abs(v - c.idf[j])).toBeLessThan(1e-9));
      expect(matrix.rows).toBe(c.matrix.length);
      let compared = 0;
      for (let r = 0; r < matrix.rows; r++) {
        const dense = new Float64Array(matrix.cols);
        for (let p = matrix.indptr[r]; p < matrix.indptr[r + 1]; p++) dense[matrix.indices[p]] = matrix.values[p];
        for (let j = 0; j < matrix.cols; j++) {
          expect(Math.abs(dense[j] - c.matrix[r][j])).toBeLessThan(1e-6);
          if (c.matrix[r][j] !== 0) compared++;
        }
      }
      // Guards against a vacuous comparison of two empty matrices.
      expect(compared).toBeGreaterThan(20);
    });
  }
});
