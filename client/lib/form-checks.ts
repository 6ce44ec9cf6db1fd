import type { AnalysisRequest } from '../api/types.js';

/** Form defaults: the contract's defaults for `POST /corpora/:cid/analyses`. */
// The form offers Ward first: on text it gives the most even themes (average linkage, the API's
// default, tends to make one large theme and many tiny ones).
export const DEFAULT_ANALYSIS_REQUEST: AnalysisRequest = { method: 'kmeans', k: 'auto', kMin: 2, kMax: 30, linkage: 'ward', seed: 1, mapEpochs: 'auto' };

/**
 * Checks the form's numbers before anything is sent and says what to change.
 * @param r the request
 * @param documentCount documents in the corpus (k cannot exceed it)
 * @returns a sentence, or null when the request is fine
 */
export function analysisRequestProblem(r: AnalysisRequest, documentCount: number): string | null {
  const whole = (v: number) => Number.isInteger(v);
  if (r.k === 'auto') {
    if (!whole(r.kMin) || r.kMin < 2) return 'The smallest number of themes must be a whole number of at least 2.';
    if (!whole(r.kMax) || r.kMax < r.kMin) return 'The largest number of themes must be a whole number no smaller than the smallest.';
    if (documentCount > 0 && r.kMin >= documentCount) return `This corpus has ${documentCount} documents; the smallest number of themes must be below that.`;
  } else {
    if (!whole(r.k) || r.k < 2) return 'The number of themes must be a whole number of at least 2.';
    if (documentCount > 0 && r.k >= documentCount) return `This corpus has ${documentCount} documents; ask for fewer themes than that.`;
  }
  if (!whole(r.seed)) return 'The seed must be a whole number.';
  return null;
}

/**
 * Checks router options before sending and says what to change.
 * @param folds cross-validation folds
 * @param alpha smoothing
 * @param target target precision for the abstain threshold
 * @returns a sentence, or null when fine
 */
export function trainOptionsProblem(folds: number, alpha: number, target: number): string | null {
  if (!Number.isInteger(folds) || folds < 2 || folds > 20) return 'Folds must be a whole number from 2 to 20.';
  if (!(alpha > 0)) return 'Smoothing (alpha) must be above 0; 1 is the usual choice.';
  if (!(target > 0 && target <= 1)) return 'Target precision must be above 0 and at most 1, e.g. 0.9.';
  return null;
}
