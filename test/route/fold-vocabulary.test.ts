import { describe, expect, it } from 'vitest';
import { foldVocabulary } from '../../server/route/fold-vocabulary.js';

describe('foldVocabulary', () => {
  const df = Uint32Array.from([0, 1, 2, 5, 9, 10, 3]);
  const tf = Float64Array.from([0, 1, 2, 5, 12, 10, 3]);

  it('keeps every seen term when minDf is 1 and maxDf is 1', () => {
    const { columnMap, kept } = foldVocabulary(df, tf, 10, { minDf: 1, maxDf: 1, maxTerms: 0 });
    expect(kept).toBe(6);
    expect(Array.from(columnMap)).toEqual([-1, 0, 1, 2, 3, 4, 5]);
  });

  it('reads minDf and maxDf as counts or fractions, like the text pipeline', () => {
    expect(Array.from(foldVocabulary(df, tf, 10, { minDf: 2, maxDf: 0.5, maxTerms: 0 }).columnMap)).toEqual([-1, -1, 0, 1, -1, -1, 2]);
    expect(Array.from(foldVocabulary(df, tf, 10, { minDf: 0.25, maxDf: 9, maxTerms: 0 }).columnMap)).toEqual([-1, -1, -1, 0, 1, -1, 2]);
  });

  it('caps the vocabulary at maxTerms by occurrences, keeping column order', () => {
    const { columnMap, kept } = foldVocabulary(df, tf, 10, { minDf: 1, maxDf: 1, maxTerms: 3 });
    expect(kept).toBe(3);
    expect(Array.from(columnMap)).toEqual([-1, -1, -1, 0, 1, 2, -1]);
  });
});
