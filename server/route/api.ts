/**
 * Types of the router engine: labelled text → naive-Bayes model → cross-validated evaluation →
 * routed decisions with a confidence, an abstain flag and the words that decided.
 */
import type { TfidfOptions } from '../text/api.js';

/**
 * How term counts are turned into class scores.
 * - `multinomial`: multinomial naive Bayes on raw term counts (McCallum & Nigam 1998).
 * - `complement`: complement naive Bayes on raw counts, each class weighted by the counts of all
 *   other classes (Rennie, Shih, Teevan & Karger 2003, §3.1), with the class prior added.
 * - `tfidf`: multinomial naive Bayes on Rennie et al.'s transformed counts: log(1 + tf), times idf,
 *   length-normalised (§4.1–4.3), rescaled by √(distinct terms) (see `transformCounts`).
 * - `tfidf-complement`: complement naive Bayes on the same transformed counts.
 */
export type NaiveBayesVariant = 'multinomial' | 'complement' | 'tfidf' | 'tfidf-complement';

/** Every knob of one router training. The HTTP layer passes the request's params through here. */
export interface RouterOptions {
  /** Lidstone smoothing added to every term count (1 = Laplace); must be > 0. @default 1 */
  alpha: number;
  /** Folds of the stratified cross-validation (≥ 2); reduced, and said so, when a label is smaller. @default 5 */
  folds: number;
  /** Precision the decisions taken without a person must reach (0 < x ≤ 1). @default 0.9 */
  targetPrecision: number;
  /** Seed of the fold assignment; the same seed gives the same evaluation. @default 1 */
  seed: number;
  /**
   * Scoring variant, or `'auto'` to cross-validate every variant on the same folds and keep the one
   * with the best held-out accuracy (the comparison is reported in `evaluation.variants`).
   * @default 'tfidf' — best or within 0.002 of best held-out accuracy (5-fold CV, default vocabulary)
   *   on both real sets we measured: SpamAssassin ham/spam, every 2nd message: multinomial 0.920,
   *   complement 0.920, tfidf 0.974, tfidf-complement 0.974; WordNet noun glosses, 26 labels:
   *   multinomial 0.653, complement 0.571, tfidf 0.652, tfidf-complement 0.572 (printed by
   *   test/route/spam-assassin.test.ts and train-router.test.ts, which also check that the default
   *   stays within 0.005 of the best; the figures move a little as the tokeniser changes).
   */
  variant: NaiveBayesVariant | 'auto';
  /** Tokenising and vocabulary options, merged over {@link DEFAULT_ROUTER_TEXT_OPTIONS}. @default {} */
  text: Partial<TfidfOptions>;
}

/** One routed text. */
export interface RouteResult {
  /** The most probable label (also when `abstained`: the flag says a person should check it). */
  label: string;
  /** Posterior probability of `label` (softmax of the class log scores). */
  confidence: number;
  /** True when `confidence` is below the model's abstain threshold, or the text gave no evidence. */
  abstained: boolean;
  /** Posterior probability of every label. */
  scores: Record<string, number>;
  /** Words of the text that pushed most toward `label` against the runner-up, strongest first. */
  evidence: string[];
  /** Why the text gave no evidence at all: `'empty text'` or `'no known words'`. */
  reason?: string;
}

/** Quality of one label, counted one-vs-rest over the held-out predictions. */
export interface LabelEvaluation {
  label: string;
  /** TP / (TP + FP); 0 when the label was never predicted. */
  precision: number;
  /** Sensitivity, TP / P. */
  recall: number;
  /** TN / N. */
  specificity: number;
  /** Harmonic mean of precision and recall; 0 when both are 0. */
  f1: number;
  /** Documents that carry this label. */
  support: number;
  /** Area under the one-vs-rest ROC curve of this label's posterior. */
  auc: number;
}

/** The abstain threshold chosen from cross-validated posteriors. */
export interface AbstainThreshold {
  /** Decisions with confidence ≥ value are taken alone; the others go to a person. */
  value: number;
  /** The precision that was asked for. */
  targetPrecision: number;
  /** The held-out precision of the decisions at or above `value`. */
  precision: number;
  /** The fraction of documents decided at or above `value`. */
  coverage: number;
  /** False when no threshold reaches the target; then `value` is the highest confidence seen. */
  reached: boolean;
}

/** One point of the precision-versus-coverage trade-off. */
export interface ThresholdPoint {
  threshold: number;
  precision: number;
  coverage: number;
}

/** Honest held-out quality of a router. */
export interface Evaluation {
  /** Folds actually used. */
  folds: number;
  /** Folds asked for, when fewer were used because a label is small; absent otherwise. */
  foldsRequested?: number;
  /** A sentence explaining any adjustment (fewer folds), for display. */
  note?: string;
  /** The scoring variant evaluated and kept. */
  variant: NaiveBayesVariant;
  accuracy: number;
  errorRate: number;
  macroF1: number;
  documentCount: number;
  perLabel: LabelEvaluation[];
  /** Rows actual, columns predicted, both in `labels` order. */
  confusion: { labels: string[]; matrix: number[][] };
  /** One-vs-rest ROC per label, (false positive rate, true positive rate), at most ~200 points. */
  roc: { label: string; points: [fpr: number, tpr: number][] }[];
  threshold: AbstainThreshold;
  /** Precision and coverage by threshold, at most ~100 points, thresholds descending. */
  thresholdCurve: ThresholdPoint[];
  /**
   * Held-out decisions that were wrong, most confident first (at most 100). A confident mistake is
   * often a mislabelled training text, so this is the list to review first. `index` is the text's
   * position in the training input.
   */
  mistakes: { index: number; actual: string; predicted: string; confidence: number }[];
  /** Held-out comparison of the variants when `variant: 'auto'` chose among them. */
  variants?: { name: NaiveBayesVariant; accuracy: number; macroF1: number }[];
}

/** Serialised naive-Bayes parameters (plain arrays so that JSON round-trips them). */
export interface NaiveBayesState {
  kind: 'sheaf.naive-bayes';
  version: 1;
  variant: NaiveBayesVariant;
  alpha: number;
  classCount: number;
  featureCount: number;
  /** Training documents per class. */
  classDocs: number[];
  /** Per-column idf used by the tf-idf variants (empty for raw-count variants). */
  idf: number[];
  /** Class log prior. */
  logPrior: number[];
  /** classCount × featureCount weights, row-major. */
  weights: number[];
}
