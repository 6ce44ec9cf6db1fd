/**
 * Held-out posteriors by k-fold cross-validation: every document is scored by a model that never
 * saw it, with a vocabulary chosen from that model's training rows only (no leakage).
 */
import type { Csr } from '../common/matrix.js';
import type { Stepwise } from '../common/step.js';
import type { NaiveBayesOptions } from './naive-bayes.js';
import { fitNaiveBayes } from './naive-bayes.js';
import { columnTotals, csrSelect } from './csr-select.js';
import type { VocabularyRule } from './fold-vocabulary.js';
import { foldVocabulary } from './fold-vocabulary.js';
import { classPosteriors } from './class-posteriors.js';

/** What one cross-validation needs besides the data. */
export interface CrossValidationPlan {
  /** Fold index of each document, in [0, foldCount). */
  foldOf: Int32Array;
  foldCount: number;
  /** Which terms a fold's training rows keep. */
  rule: VocabularyRule;
  /** Model options. */
  model: NaiveBayesOptions;
  /** Stage name reported in the steps. @default 'cross-validate' */
  stage?: string;
  /** Steps already done before this run, and the stage total, when several runs share a stage. */
  offset?: number;
  total?: number;
}

/**
 * Scores every document with the model trained on the other folds; yields after each fold.
 * @param counts documents × all terms, raw counts.
 * @param y label index of each document.
 * @param classCount number of labels.
 * @param plan folds, vocabulary rule, model options.
 * @returns held-out posteriors, `documents × classCount`, row-major.
 */
export function* crossValidateSteps(counts: Csr, y: Int32Array, classCount: number, plan: CrossValidationPlan): Stepwise<Float64Array> {
  const n = counts.rows;
  const C = classCount;
  const stage = plan.stage ?? 'cross-validate';
  const offset = plan.offset ?? 0;
  const total = plan.total ?? plan.foldCount;
  const posteriors = new Float64Array(n * C);
  // Totals over every row once; each fold subtracts its held-out rows (a fifth of the work).
  const allRows = new Uint32Array(n);
  for (let i = 0; i < n; i++) allRows[i] = i;
  const dfAll = new Uint32Array(counts.cols), tfAll = new Float64Array(counts.cols);
  columnTotals(counts, allRows, dfAll, tfAll);
  const df = new Uint32Array(counts.cols);
  const tf = new Float64Array(counts.cols);
  for (let f = 0; f < plan.foldCount; f++) {
    let testCount = 0;
    for (let i = 0; i < n; i++) if (plan.foldOf[i] === f) testCount++;
    const train = new Uint32Array(n - testCount), test = new Uint32Array(testCount);
    for (let i = 0, a = 0, b = 0; i < n; i++) {
      if (plan.foldOf[i] === f) test[b++] = i;
      else train[a++] = i;
    }
    df.set(dfAll);
    tf.set(tfAll);
    for (const r of test) {
      for (let p = counts.indptr[r]; p < counts.indptr[r + 1]; p++) {
        const v = counts.values[p];
        if (v > 0) {
          df[counts.indices[p]]--;
          tf[counts.indices[p]] -= v;
        }
      }
    }
    const { columnMap, kept } = foldVocabulary(df, tf, train.length, plan.rule);
    const yTrain = new Int32Array(train.length);
    for (let k = 0; k < train.length; k++) yTrain[k] = y[train[k]];
    const model = fitNaiveBayes(csrSelect(counts, train, columnMap, kept), yTrain, C, plan.model);
    const scores = classPosteriors(model.jointLogScores(csrSelect(counts, test, columnMap, kept)), C);
    for (let k = 0; k < test.length; k++) {
      const to = test[k] * C, from = k * C;
      for (let c = 0; c < C; c++) posteriors[to + c] = scores[from + c];
    }
    yield { stage, done: offset + f + 1, total };
  }
  return posteriors;
}
