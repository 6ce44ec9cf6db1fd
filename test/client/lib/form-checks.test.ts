import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_REQUEST, analysisRequestProblem, trainOptionsProblem } from '../../../client/lib/form-checks.js';

describe('analysis form checks', () => {
  it('accepts the contract defaults', () => {
    expect(DEFAULT_ANALYSIS_REQUEST).toEqual({ method: 'kmeans', k: 'auto', kMin: 2, kMax: 30, linkage: 'ward', seed: 1, mapEpochs: 'auto' });
    expect(analysisRequestProblem(DEFAULT_ANALYSIS_REQUEST, 500)).toBeNull();
  });

  it('says what to change for impossible numbers of themes', () => {
    expect(analysisRequestProblem({ ...DEFAULT_ANALYSIS_REQUEST, kMin: 1 }, 500)).toMatch(/at least 2/);
    expect(analysisRequestProblem({ ...DEFAULT_ANALYSIS_REQUEST, kMin: 9, kMax: 4 }, 500)).toMatch(/no smaller than the smallest/);
    expect(analysisRequestProblem({ ...DEFAULT_ANALYSIS_REQUEST, k: 12 }, 10)).toMatch(/10 documents/);
    expect(analysisRequestProblem({ ...DEFAULT_ANALYSIS_REQUEST, k: 2.5 }, 10)).toMatch(/whole number/);
    expect(analysisRequestProblem({ ...DEFAULT_ANALYSIS_REQUEST, seed: 0.5 }, 10)).toMatch(/seed/);
  });
});

describe('router form checks', () => {
  it('accepts the usual options and refuses out-of-range ones', () => {
    expect(trainOptionsProblem(5, 1, 0.9)).toBeNull();
    expect(trainOptionsProblem(1, 1, 0.9)).toMatch(/Folds/);
    expect(trainOptionsProblem(5, 0, 0.9)).toMatch(/alpha/);
    expect(trainOptionsProblem(5, 1, 1.2)).toMatch(/precision/);
  });
});
