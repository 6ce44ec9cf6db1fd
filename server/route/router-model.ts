/**
 * A trained router: the fitted vocabulary, the naive-Bayes weights and the abstain threshold.
 * It vectorises new text exactly as the training text was vectorised.
 */
import type { VectorizerState } from '../text/api.js';
import { TfidfVectorizer } from '../text/index.js';
import type { NaiveBayesState, RouteResult } from './api.js';
import { NaiveBayesModel } from './naive-bayes.js';
import { classPosteriors } from './class-posteriors.js';
import { decisionEvidence } from './decision-evidence.js';

/** Serialised router, as stored by the server. */
export interface RouterState {
  kind: 'sheaf.router';
  version: 1;
  labels: string[];
  abstainThreshold: number;
  vectorizer: VectorizerState;
  model: NaiveBayesState;
}

/** Options of {@link RouterModel.route}. */
export interface RouteOptions {
  /** Evidence words listed per decision (0 for none). @default 5 */
  evidence: number;
}

/** Defaults of {@link RouteOptions}. */
export const DEFAULT_ROUTE_OPTIONS: Readonly<RouteOptions> = { evidence: 5 };

/** Texts routed per batch, so that a huge request does not build one huge count matrix. */
const BATCH = 4096;

/** Routes text to labels; built by `trainRouter` or {@link RouterModel.fromJSON}. */
export class RouterModel {
  /**
   * @param labels label names, in class-index order.
   * @param abstainThreshold decisions with confidence below it are flagged for a person.
   * @param vectorizer the fitted vocabulary (its `counts` feed the model).
   * @param model naive-Bayes weights over the vectoriser's columns.
   */
  constructor(
    readonly labels: string[],
    public abstainThreshold: number,
    readonly vectorizer: TfidfVectorizer,
    readonly model: NaiveBayesModel,
  ) {
    if (labels.length !== model.classCount) throw new RangeError(`${labels.length} labels for a model of ${model.classCount} classes`);
    if (vectorizer.terms.length !== model.featureCount) throw new RangeError(`Vocabulary of ${vectorizer.terms.length} terms for a model of ${model.featureCount}`);
    if (!(abstainThreshold >= 0 && abstainThreshold <= 1)) throw new RangeError(`abstainThreshold must be in [0, 1]; got ${abstainThreshold}`);
  }

  /**
   * Routes each text, in input order. Never throws on content: an empty text or one without any
   * known word gets the most common training label, `abstained: true` and a `reason`.
   * @param texts the texts to route.
   * @param opts evidence length, merged over {@link DEFAULT_ROUTE_OPTIONS}.
   */
  route(texts: readonly string[], opts: Partial<RouteOptions> = {}): RouteResult[] {
    const o: RouteOptions = { ...DEFAULT_ROUTE_OPTIONS, ...opts };
    if (!Number.isInteger(o.evidence) || o.evidence < 0) throw new RangeError(`evidence must be a whole number ≥ 0; got ${o.evidence}`);
    for (let i = 0; i < texts.length; i++) {
      if (typeof texts[i] !== 'string') throw new TypeError(`Text ${i} is ${typeof texts[i]}; every text must be a string`);
    }
    const out: RouteResult[] = [];
    const C = this.labels.length;
    let probs = new Float64Array(0);
    for (let start = 0; start < texts.length; start += BATCH) {
      const batch = texts.slice(start, start + BATCH);
      const x = this.model.features(this.vectorizer.counts(batch));
      if (probs.length < x.rows * C) probs = new Float64Array(x.rows * C);
      const view = probs.subarray(0, x.rows * C);
      classPosteriors(this.model.featureScores(x, view), C);
      for (let r = 0; r < x.rows; r++) {
        const o0 = r * C;
        let best = 0, second = -1;
        for (let c = 1; c < C; c++) {
          if (view[o0 + c] > view[o0 + best]) {
            second = best;
            best = c;
          } else if (second < 0 || view[o0 + c] > view[o0 + second]) second = c;
        }
        if (second < 0) second = best === 0 ? 1 : 0;
        const scores: Record<string, number> = {};
        for (let c = 0; c < C; c++) scores[this.labels[c]] = view[o0 + c];
        const confidence = view[o0 + best];
        const empty = x.indptr[r + 1] === x.indptr[r];
        const result: RouteResult = {
          label: this.labels[best],
          confidence,
          abstained: empty || confidence < this.abstainThreshold,
          scores,
          evidence: empty || o.evidence === 0
            ? []
            : decisionEvidence(x, r, this.model.weights, C, best, second, o.evidence).map((j) => this.vectorizer.labels[j]),
        };
        if (empty) result.reason = batch[r].trim() === '' ? 'empty text' : 'no known words';
        out.push(result);
      }
    }
    return out;
  }

  /** Serialisable form, vocabulary included. */
  toJSON(): RouterState {
    return {
      kind: 'sheaf.router',
      version: 1,
      labels: this.labels.slice(),
      abstainThreshold: this.abstainThreshold,
      vectorizer: this.vectorizer.toJSON(),
      model: this.model.toJSON(),
    };
  }

  /** Rebuilds a router from {@link RouterModel.toJSON}, checking every field. */
  static fromJSON(x: unknown): RouterModel {
    const s = x as Partial<RouterState> | null;
    if (s === null || typeof s !== 'object' || s.kind !== 'sheaf.router') throw new TypeError('Not a sheaf router (kind must be "sheaf.router")');
    if (s.version !== 1) throw new TypeError(`Unsupported router version ${String(s.version)}; this build reads version 1`);
    if (!Array.isArray(s.labels) || !s.labels.every((l) => typeof l === 'string')) throw new TypeError('Router labels must be an array of strings');
    if (typeof s.abstainThreshold !== 'number') throw new TypeError('Router abstainThreshold must be a number');
    return new RouterModel(s.labels.slice(), s.abstainThreshold, TfidfVectorizer.fromJSON(s.vectorizer), NaiveBayesModel.fromJSON(s.model));
  }
}
