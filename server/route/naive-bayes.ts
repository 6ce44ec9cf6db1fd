/**
 * Naive Bayes over sparse term counts, in log space, with Lidstone smoothing.
 *
 * Multinomial model: McCallum & Nigam (1998), "A comparison of event models for naive Bayes text
 * classification"; worked example in Manning, Raghavan & Schütze (2008), *Introduction to Information
 * Retrieval*, §13.2. Complement model and count transforms: Rennie, Shih, Teevan & Karger (2003),
 * "Tackling the poor assumptions of naive Bayes text classifiers", ICML.
 */
import type { Csr } from '../common/matrix.js';
import { assertCsr, assertUnreachable } from '../common/matrix.js';
import type { NaiveBayesState, NaiveBayesVariant } from './api.js';
import { transformCounts, documentFrequencyIdf } from './transform-counts.js';

/** Every valid variant name, in the order they are compared. */
export const NAIVE_BAYES_VARIANTS: readonly NaiveBayesVariant[] = ['multinomial', 'complement', 'tfidf', 'tfidf-complement'];

/** Options of {@link fitNaiveBayes}. */
export interface NaiveBayesOptions {
  /** Lidstone smoothing (> 0). @default 1 */
  alpha: number;
  /** Scoring variant. @default 'multinomial' */
  variant: NaiveBayesVariant;
}

/** Defaults of {@link NaiveBayesOptions}. */
export const DEFAULT_NAIVE_BAYES_OPTIONS: Readonly<NaiveBayesOptions> = { alpha: 1, variant: 'multinomial' };

function usesTfidf(v: NaiveBayesVariant): boolean {
  switch (v) {
    case 'multinomial':
    case 'complement':
      return false;
    case 'tfidf':
    case 'tfidf-complement':
      return true;
    default:
      return assertUnreachable(v);
  }
}

function usesComplement(v: NaiveBayesVariant): boolean {
  return v === 'complement' || v === 'tfidf-complement';
}

/**
 * A fitted naive-Bayes model. Weights are stored feature-major (`weights[j * classCount + c]`) so
 * that scoring a sparse row touches one contiguous block per term.
 */
export class NaiveBayesModel {
  private constructor(
    readonly variant: NaiveBayesVariant,
    readonly alpha: number,
    readonly classCount: number,
    readonly featureCount: number,
    /** Training documents per class. */
    readonly classDocs: Float64Array,
    /** Per-column idf of the tf-idf variants (length 0 otherwise). */
    readonly idf: Float64Array,
    readonly logPrior: Float64Array,
    readonly weights: Float64Array,
  ) {}

  /** @internal Builds a model from validated parts. */
  static fromParts(
    variant: NaiveBayesVariant,
    alpha: number,
    classCount: number,
    featureCount: number,
    classDocs: Float64Array,
    idf: Float64Array,
    logPrior: Float64Array,
    weights: Float64Array,
  ): NaiveBayesModel {
    return new NaiveBayesModel(variant, alpha, classCount, featureCount, classDocs, idf, logPrior, weights);
  }

  /** Whether {@link NaiveBayesModel.features} transforms the counts (the tf-idf variants). */
  get usesTransform(): boolean {
    return usesTfidf(this.variant);
  }

  /** The feature values the model scores: raw counts, or Rennie's transformed counts. */
  features(counts: Csr): Csr {
    return usesTfidf(this.variant) ? transformCounts(counts, this.idf) : counts;
  }

  /**
   * Joint log score of every (row, class): log P(c) + Σ_j x_j · w_cj.
   * @param counts raw term counts, `featureCount` columns.
   * @param out `rows × classCount`, row-major; allocated when absent.
   */
  jointLogScores(counts: Csr, out?: Float64Array): Float64Array {
    if (counts.cols !== this.featureCount) {
      throw new RangeError(`The count matrix has ${counts.cols} columns; this model was fitted on ${this.featureCount}`);
    }
    return this.featureScores(this.features(counts), out);
  }

  /**
   * Joint log scores of rows already passed through {@link NaiveBayesModel.features}, so that a
   * caller who also needs the features (for evidence) transforms them once.
   * @param x feature rows.
   * @param out `rows × classCount`, row-major; allocated when absent.
   */
  featureScores(x: Csr, out?: Float64Array): Float64Array {
    const C = this.classCount;
    const res = out ?? new Float64Array(x.rows * C);
    if (res.length < x.rows * C) throw new RangeError(`out holds ${res.length} values; ${x.rows * C} are needed`);
    const { indptr, indices, values } = x;
    const w = this.weights;
    const prior = this.logPrior;
    for (let r = 0; r < x.rows; r++) {
      const o = r * C;
      for (let c = 0; c < C; c++) res[o + c] = prior[c];
      for (let p = indptr[r]; p < indptr[r + 1]; p++) {
        const v = values[p];
        const base = indices[p] * C;
        for (let c = 0; c < C; c++) res[o + c] += v * w[base + c];
      }
    }
    return res;
  }

  /** Serialisable form. */
  toJSON(): NaiveBayesState {
    return {
      kind: 'sheaf.naive-bayes',
      version: 1,
      variant: this.variant,
      alpha: this.alpha,
      classCount: this.classCount,
      featureCount: this.featureCount,
      classDocs: Array.from(this.classDocs),
      idf: Array.from(this.idf),
      logPrior: Array.from(this.logPrior),
      weights: Array.from(this.weights),
    };
  }

  /** Rebuilds a model from {@link NaiveBayesModel.toJSON}, checking every field. */
  static fromJSON(x: unknown): NaiveBayesModel {
    const s = x as Partial<NaiveBayesState> | null;
    if (s === null || typeof s !== 'object' || s.kind !== 'sheaf.naive-bayes') throw new TypeError('Not a sheaf naive-Bayes model (kind must be "sheaf.naive-bayes")');
    if (s.version !== 1) throw new TypeError(`Unsupported naive-Bayes model version ${String(s.version)}; this build reads version 1`);
    if (!NAIVE_BAYES_VARIANTS.includes(s.variant as NaiveBayesVariant)) throw new TypeError(`Unknown naive-Bayes variant ${String(s.variant)}`);
    const variant = s.variant as NaiveBayesVariant;
    const C = s.classCount, F = s.featureCount;
    if (!Number.isInteger(C) || (C as number) < 1 || !Number.isInteger(F) || (F as number) < 0) throw new TypeError('Naive-Bayes model has invalid classCount/featureCount');
    const num = (a: unknown, n: number, name: string): Float64Array => {
      if (!Array.isArray(a) || a.length !== n || !a.every((v) => typeof v === 'number' && !Number.isNaN(v))) {
        throw new TypeError(`Naive-Bayes model field ${name} must be ${n} numbers`);
      }
      return Float64Array.from(a as number[]);
    };
    if (typeof s.alpha !== 'number' || !(s.alpha > 0)) throw new TypeError('Naive-Bayes model alpha must be a positive number');
    return new NaiveBayesModel(
      variant,
      s.alpha,
      C as number,
      F as number,
      num(s.classDocs, C as number, 'classDocs'),
      num(s.idf, usesTfidf(variant) ? (F as number) : 0, 'idf'),
      num(s.logPrior, C as number, 'logPrior'),
      num(s.weights, (C as number) * (F as number), 'weights'),
    );
  }
}

/**
 * Fits naive Bayes on raw term counts.
 * @param counts documents × terms, raw counts (the tf-idf variants transform them here).
 * @param y class index of each row, in [0, classCount).
 * @param classCount number of classes (≥ 1).
 * @param opts smoothing and variant, merged over {@link DEFAULT_NAIVE_BAYES_OPTIONS}.
 */
export function fitNaiveBayes(counts: Csr, y: Int32Array, classCount: number, opts: Partial<NaiveBayesOptions> = {}): NaiveBayesModel {
  const o: NaiveBayesOptions = { ...DEFAULT_NAIVE_BAYES_OPTIONS, ...opts };
  if (!(o.alpha > 0) || !Number.isFinite(o.alpha)) throw new RangeError(`alpha must be a positive number (1 = Laplace smoothing); got ${o.alpha}`);
  if (!NAIVE_BAYES_VARIANTS.includes(o.variant)) throw new RangeError(`variant must be one of ${NAIVE_BAYES_VARIANTS.join(', ')}; got ${String(o.variant)}`);
  assertCsr(counts);
  if (y.length !== counts.rows) throw new RangeError(`Got ${y.length} labels for ${counts.rows} documents`);
  const C = classCount, F = counts.cols;
  const classDocs = new Float64Array(C);
  for (let r = 0; r < y.length; r++) {
    const c = y[r];
    if (!(c >= 0 && c < C)) throw new RangeError(`Label index ${c} of row ${r} is outside [0, ${C})`);
    classDocs[c]++;
  }
  const idf = usesTfidf(o.variant) ? documentFrequencyIdf(counts) : new Float64Array(0);
  const x = usesTfidf(o.variant) ? transformCounts(counts, idf) : counts;

  // Feature mass per (term, class), feature-major like the weights.
  const mass = new Float64Array(F * C);
  for (let r = 0; r < x.rows; r++) {
    const c = y[r];
    for (let p = x.indptr[r]; p < x.indptr[r + 1]; p++) mass[x.indices[p] * C + c] += x.values[p];
  }
  const classMass = new Float64Array(C);
  for (let j = 0; j < F; j++) for (let c = 0; c < C; c++) classMass[c] += mass[j * C + c];

  const n = y.length;
  const logPrior = new Float64Array(C);
  for (let c = 0; c < C; c++) logPrior[c] = Math.log(classDocs[c] / n);

  const weights = new Float64Array(F * C);
  if (usesComplement(o.variant)) {
    // θ̃_cj: the smoothed term distribution of every class except c; a term is evidence for c
    // when it is rare elsewhere (Rennie et al. 2003, eq. 4–6), which helps small classes.
    let total = 0;
    for (let c = 0; c < C; c++) total += classMass[c];
    const denom = new Float64Array(C);
    for (let c = 0; c < C; c++) denom[c] = Math.log(total - classMass[c] + o.alpha * F);
    for (let j = 0; j < F; j++) {
      let all = 0;
      for (let c = 0; c < C; c++) all += mass[j * C + c];
      for (let c = 0; c < C; c++) weights[j * C + c] = -(Math.log(all - mass[j * C + c] + o.alpha) - denom[c]);
    }
  } else {
    const denom = new Float64Array(C);
    for (let c = 0; c < C; c++) denom[c] = Math.log(classMass[c] + o.alpha * F);
    for (let j = 0; j < F; j++) {
      for (let c = 0; c < C; c++) weights[j * C + c] = Math.log(mass[j * C + c] + o.alpha) - denom[c];
    }
  }
  return NaiveBayesModel.fromParts(o.variant, o.alpha, C, F, classDocs, idf, logPrior, weights);
}
