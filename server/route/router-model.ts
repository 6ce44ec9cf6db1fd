/**
 * A trained router: the fitted vocabulary, the naive-Bayes weights and the abstain threshold.
 * It vectorises new text exactly as the training text was vectorised.
 */
import type { VectorizerState } from '../text/api.js';
import { TfidfVectorizer } from '../text/index.js';
import type { NaiveBayesState, RouteResult } from './api.js';
import { NaiveBayesModel } from './naive-bayes.js';
import { evidenceInto } from './decision-evidence.js';
import type { RouteScoreModel } from './route-scores.js';
import { routeScores } from './route-scores.js';

/** Scratch of {@link RouterModel.route}, sized to the largest batch seen. */
interface RouteKernel {
  scoring: RouteScoreModel;
  values: Float32Array;
  probs: Float64Array;
  best: Int32Array;
  second: Int32Array;
  columns: Int32Array;
  pushes: Float64Array;
}

/** The idf that turns the transform on for the tf-idf variants, or none for raw counts. */
function scoringIdf(model: NaiveBayesModel): Float64Array {
  return model.usesTransform ? model.idf : new Float64Array(0);
}

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

/**
 * Largest feature buffer a router keeps between calls (4 MB): a batch of ordinary texts fits many
 * times over (4096 texts of 60 words hold about 125,000 entries).
 */
const KEPT_VALUES = 1 << 20;

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
    const out: RouteResult[] = new Array(texts.length);
    const C = this.labels.length;
    const { labels, vectorizer, model } = this;
    const terms = vectorizer.labels;
    const limit = o.evidence;
    const k = this.kernel();
    if (k.columns.length < limit) {
      k.columns = new Int32Array(limit);
      k.pushes = new Float64Array(limit);
    }
    for (let start = 0; start < texts.length; start += BATCH) {
      const batch = texts.slice(start, start + BATCH);
      const counts = vectorizer.counts(batch);
      const rows = counts.rows, nnz = counts.indptr[rows];
      let values = k.values;
      if (values.length < nnz) {
        // A batch of very long texts gets a buffer of its own, so the model does not keep it.
        const keep = nnz <= KEPT_VALUES;
        values = new Float32Array(keep ? Math.min(KEPT_VALUES, Math.max(nnz, 2 * values.length)) : nnz);
        if (keep) k.values = values;
      }
      if (k.probs.length < rows * C) k.probs = new Float64Array(rows * C);
      if (k.best.length < rows) {
        k.best = new Int32Array(rows);
        k.second = new Int32Array(rows);
      }
      const { probs, best, second, columns, pushes } = k;
      routeScores(counts, k.scoring, values, probs, best, second);
      const { indptr, indices } = counts;
      for (let r = 0; r < rows; r++) {
        const o0 = r * C;
        const b = best[r];
        // Same keys in the same order every time, so every scores object shares one shape.
        const scores: Record<string, number> = {};
        for (let c = 0; c < C; c++) scores[labels[c]] = probs[o0 + c];
        const confidence = probs[o0 + b];
        const empty = indptr[r + 1] === indptr[r];
        let evidence: string[];
        if (empty || limit === 0) evidence = [];
        else {
          const size = evidenceInto(indices, values, indptr[r], indptr[r + 1], model.weights, C, b, second[r], limit, columns, pushes);
          evidence = new Array<string>(size);
          for (let i = 0; i < size; i++) evidence[i] = terms[columns[i]];
        }
        const result: RouteResult = { label: labels[b], confidence, abstained: empty || confidence < this.abstainThreshold, scores, evidence };
        if (empty) result.reason = batch[r].trim() === '' ? 'empty text' : 'no known words';
        out[start + r] = result;
      }
    }
    return out;
  }

  /** Buffers reused from batch to batch and call to call; routing allocates only its results. */
  private kernel(): RouteKernel {
    return (this.buffers ??= {
      scoring: {
        classCount: this.model.classCount,
        featureCount: this.model.featureCount,
        idf: scoringIdf(this.model),
        logPrior: this.model.logPrior,
        weights: this.model.weights,
      },
      values: new Float32Array(0),
      probs: new Float64Array(0),
      best: new Int32Array(0),
      second: new Int32Array(0),
      columns: new Int32Array(8),
      pushes: new Float64Array(8),
    });
  }

  private buffers: RouteKernel | undefined;

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
