/**
 * Defaults and validation for {@link TfidfOptions}.
 */
import type { TfidfOptions } from './api.js';
import { checkBoolean, DEFAULT_TOKEN_OPTIONS, resolveTokenOptions } from './token-options.js';

/**
 * Default weighting: terms in at least 2 documents and at most half of them, no cap on the
 * vocabulary, sublinear tf, smooth idf, unit-length rows (see {@link TfidfOptions} for each field).
 */
export const DEFAULT_TFIDF_OPTIONS: Readonly<TfidfOptions> = Object.freeze({
  ...DEFAULT_TOKEN_OPTIONS,
  minDf: 2,
  maxDf: 0.5,
  maxTerms: 0,
  sublinearTf: true,
  smoothIdf: true,
  normalize: true,
});

/**
 * Merges `opts` over {@link DEFAULT_TFIDF_OPTIONS} and validates the result.
 * @throws TypeError for an unknown option or a value of the wrong type; RangeError for a value out of range.
 */
export function resolveTfidfOptions(opts: Partial<TfidfOptions> = {}): TfidfOptions {
  const t = resolveTokenOptions(opts);
  const o: TfidfOptions = {
    ...t,
    minDf: opts.minDf ?? DEFAULT_TFIDF_OPTIONS.minDf,
    maxDf: opts.maxDf ?? DEFAULT_TFIDF_OPTIONS.maxDf,
    maxTerms: opts.maxTerms ?? DEFAULT_TFIDF_OPTIONS.maxTerms,
    sublinearTf: opts.sublinearTf ?? DEFAULT_TFIDF_OPTIONS.sublinearTf,
    smoothIdf: opts.smoothIdf ?? DEFAULT_TFIDF_OPTIONS.smoothIdf,
    normalize: opts.normalize ?? DEFAULT_TFIDF_OPTIONS.normalize,
  };
  const { minDf, maxDf, maxTerms } = o;
  if (typeof minDf !== 'number' || !(minDf > 0) || (minDf >= 1 && !Number.isInteger(minDf)) || !Number.isFinite(minDf)) {
    throw new RangeError(`Option minDf must be a document count (a whole number ≥ 1) or a fraction of the documents between 0 and 1, not ${JSON.stringify(minDf)}`);
  }
  if (typeof maxDf !== 'number' || !(maxDf > 0) || (maxDf > 1 && !Number.isInteger(maxDf)) || !Number.isFinite(maxDf)) {
    throw new RangeError(`Option maxDf must be a fraction of the documents in (0, 1] or a document count (a whole number > 1), not ${JSON.stringify(maxDf)}`);
  }
  // Only a contradiction visible without the data is refused here; one that depends on the
  // number of documents leaves an empty vocabulary (see fitTfidfSteps).
  const minIsCount = minDf >= 1, maxIsCount = maxDf > 1;
  if (minIsCount === maxIsCount && minDf > maxDf) {
    throw new RangeError(`Option minDf (${minDf}) exceeds maxDf (${maxDf}), so no term could be kept; lower minDf or raise maxDf`);
  }
  if (!Number.isInteger(maxTerms) || maxTerms < 0) {
    throw new RangeError(`Option maxTerms must be a whole number ≥ 0 (0 = no cap), not ${JSON.stringify(maxTerms)}`);
  }
  checkBoolean('sublinearTf', o.sublinearTf);
  checkBoolean('smoothIdf', o.smoothIdf);
  checkBoolean('normalize', o.normalize);
  return o;
}
