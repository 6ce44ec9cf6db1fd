/**
 * A fitted vocabulary with its idf weights: turns new text into rows with the same columns as
 * the training matrix, and persists as a plain JSON object.
 */
import type { Csr } from '../common/matrix.js';
import { drain, type Step, type Stepwise } from '../common/step.js';
import type { TfidfOptions, VectorizerState } from './api.js';
import { IdBuffer, growInt32 } from './id-buffer.js';
import { TermEncoder } from './term-encoder.js';
import { resolveTfidfOptions } from './tfidf-options.js';
import { RowScratch, weighRow, type RowWeighting } from './weigh-row.js';

/** A transform yields a Step after this many documents, or this many characters, whichever first. */
const SLICE_DOCS = 2000;
const SLICE_CHARS = 1_000_000;
/** The encoder used for new text starts over past this many spellings, bounding a long-lived router's memory. */
const ENCODER_LIMIT = 1_000_000;

/** Throws a TypeError unless `texts` is an array of strings, naming the first bad entry. */
export function checkTexts(texts: readonly string[]): void {
  if (!Array.isArray(texts)) throw new TypeError(`Texts must be an array of strings, not ${typeof texts}`);
  for (let i = 0; i < texts.length; i++) {
    if (typeof texts[i] !== 'string') throw new TypeError(`Text ${i} is ${texts[i] === null ? 'null' : typeof texts[i]}, not a string`);
  }
}

/**
 * The fitted TF-IDF vocabulary. Make one with `fitTfidf`/`fitCounts`, or load one with
 * {@link TfidfVectorizer.fromJSON}.
 */
export class TfidfVectorizer {
  /** Term of each column (a stem, a placeholder, or two terms joined by `_`), sorted. */
  readonly terms: string[];
  /** A readable spelling of each column: its most frequent unstemmed form. */
  readonly labels: string[];
  /** Inverse document frequency of each column. */
  readonly idf: Float64Array;
  /** Number of training documents. */
  readonly documentCount: number;
  /** The options it was fitted with; new text is tokenised and weighed the same way. */
  readonly options: Readonly<TfidfOptions>;

  private readonly columnIndex: Map<string, number>;
  private encoder: TermEncoder | null = null;
  /** Column of each id of `encoder`, -1 if out of the vocabulary; covers ids below `mapped`. */
  private columnOfId = new Int32Array(0);
  private mapped = 0;
  private scratch: RowScratch | null = null;

  /**
   * @param options validated options the vocabulary was fitted with.
   * @param terms column terms, distinct. @param labels readable label per column.
   * @param idf per column. @param documentCount training documents.
   */
  constructor(options: TfidfOptions, terms: string[], labels: string[], idf: Float64Array, documentCount: number) {
    if (labels.length !== terms.length || idf.length !== terms.length) {
      throw new RangeError(`Vectorizer has ${terms.length} terms, ${labels.length} labels and ${idf.length} idf values; they must match`);
    }
    this.options = Object.freeze({ ...options });
    this.terms = terms;
    this.labels = labels;
    this.idf = idf;
    this.documentCount = documentCount;
    this.columnIndex = new Map();
    for (let j = 0; j < terms.length; j++) {
      if (this.columnIndex.has(terms[j])) throw new TypeError(`Vectorizer term "${terms[j]}" appears twice`);
      this.columnIndex.set(terms[j], j);
    }
  }

  /** Number of columns (terms). */
  get cols(): number {
    return this.terms.length;
  }

  /** Column of a term (as in {@link terms}), or -1. */
  columnOf(term: string): number {
    return this.columnIndex.get(term) ?? -1;
  }

  /** TF-IDF rows of `texts`, weighed with the fitted idf and options; unknown terms are ignored. */
  transform(texts: readonly string[]): Csr {
    return drain(this.transformSteps(texts));
  }

  /** {@link transform}, yielding a Step (stage `"vectorise"`) every few thousand documents. */
  transformSteps(texts: readonly string[]): Stepwise<Csr> {
    checkTexts(texts);
    const o = this.options;
    return this.rows(texts, { idf: this.idf, sublinearTf: o.sublinearTf, normalize: o.normalize });
  }

  /** Raw term counts of `texts` over the fitted columns (for naive Bayes). */
  counts(texts: readonly string[]): Csr {
    return drain(this.countsSteps(texts));
  }

  /** {@link counts}, yielding a Step (stage `"vectorise"`) every few thousand documents. */
  countsSteps(texts: readonly string[]): Stepwise<Csr> {
    checkTexts(texts);
    return this.rows(texts, { idf: null, sublinearTf: false, normalize: false });
  }

  private *rows(texts: readonly string[], weighting: RowWeighting): Generator<Step, Csr, void> {
    const n = texts.length;
    const indptr = new Uint32Array(n + 1);
    let indices = new Uint32Array(Math.max(16, n * 8));
    let values = new Float32Array(indices.length);
    const ids = new IdBuffer(256);
    const scratch = (this.scratch ??= new RowScratch(this.cols));
    let at = 0, chars = 0, sliceStart = 0;
    for (let d = 0; d < n; d++) {
      let enc = this.encoder;
      if (enc === null || enc.surfaceCount > ENCODER_LIMIT || enc.termCount > ENCODER_LIMIT) {
        enc = this.encoder = new TermEncoder(this.options, this.terms);
        this.mapped = 0;
      }
      ids.clear();
      enc.encode(texts[d], ids);
      this.mapNewIds(enc);
      if (at + ids.length > indices.length) {
        const cap = Math.max(at + ids.length, indices.length * 2);
        const ni = new Uint32Array(cap); ni.set(indices.subarray(0, at)); indices = ni;
        const nv = new Float32Array(cap); nv.set(values.subarray(0, at)); values = nv;
      }
      at = weighRow(ids.data, 0, ids.length, this.columnOfId, weighting, scratch, indices, values, at);
      indptr[d + 1] = at;
      chars += texts[d].length;
      if (d + 1 - sliceStart >= SLICE_DOCS || chars >= SLICE_CHARS) {
        yield { stage: 'vectorise', done: d + 1, total: n };
        sliceStart = d + 1;
        chars = 0;
      }
    }
    yield { stage: 'vectorise', done: n, total: n };
    return { rows: n, cols: this.cols, indptr, indices: indices.slice(0, at), values: values.slice(0, at) };
  }

  /** Looks up the column of every term id the encoder created since the last call. */
  private mapNewIds(enc: TermEncoder): void {
    const count = enc.termCount;
    if (count <= this.mapped) return;
    this.columnOfId = growInt32(this.columnOfId, count);
    for (let t = this.mapped; t < count; t++) this.columnOfId[t] = this.columnIndex.get(enc.termString(t)) ?? -1;
    this.mapped = count;
  }

  /** The serialisable state (`kind: "sheaf.tfidf"`, `version: 1`). */
  toJSON(): VectorizerState {
    return {
      kind: 'sheaf.tfidf',
      version: 1,
      options: { ...this.options },
      terms: this.terms.slice(),
      labels: this.labels.slice(),
      idf: Array.from(this.idf),
      documentCount: this.documentCount,
    };
  }

  /**
   * Rebuilds a vectorizer from {@link toJSON} output, checking every field.
   * @throws TypeError (wrong kind or shape) or RangeError (unsupported version, bad values) saying what is wrong.
   */
  static fromJSON(x: unknown): TfidfVectorizer {
    const where = 'Saved vectorizer';
    if (x === null || typeof x !== 'object' || Array.isArray(x)) throw new TypeError(`${where}: expected an object`);
    const s = x as Record<string, unknown>;
    if (s.kind !== 'sheaf.tfidf') throw new TypeError(`${where}: kind is ${JSON.stringify(s.kind)}, expected "sheaf.tfidf"`);
    if (s.version !== 1) throw new RangeError(`${where}: version ${JSON.stringify(s.version)} is not supported; this build reads version 1`);
    if (s.options === null || typeof s.options !== 'object') throw new TypeError(`${where}: options must be an object`);
    const keys = ['stopWords', 'stem', 'bigrams', 'minTokenLength', 'minDf', 'maxDf', 'maxTerms', 'sublinearTf', 'smoothIdf', 'normalize'];
    for (const k of keys) if ((s.options as Record<string, unknown>)[k] === undefined) throw new TypeError(`${where}: options.${k} is missing`);
    let options: TfidfOptions;
    try {
      options = resolveTfidfOptions(s.options as Partial<TfidfOptions>);
    } catch (e) {
      throw new TypeError(`${where}: ${(e as Error).message}`);
    }
    const terms = stringArray(s.terms, 'terms', where);
    const labels = stringArray(s.labels, 'labels', where);
    if (labels.length !== terms.length) throw new TypeError(`${where}: ${labels.length} labels for ${terms.length} terms`);
    if (!Array.isArray(s.idf) || s.idf.length !== terms.length) throw new TypeError(`${where}: idf must be an array of ${terms.length} numbers`);
    const idf = new Float64Array(terms.length);
    for (let j = 0; j < idf.length; j++) {
      const v = s.idf[j];
      if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) throw new RangeError(`${where}: idf[${j}] is ${JSON.stringify(v)}, expected a positive number`);
      idf[j] = v;
    }
    const n = s.documentCount;
    if (typeof n !== 'number' || !Number.isInteger(n) || n < 0) throw new TypeError(`${where}: documentCount must be a whole number ≥ 0`);
    return new TfidfVectorizer(options, terms, labels, idf, n);
  }
}

function stringArray(v: unknown, name: string, where: string): string[] {
  if (!Array.isArray(v)) throw new TypeError(`${where}: ${name} must be an array of strings`);
  for (let j = 0; j < v.length; j++) {
    if (typeof v[j] !== 'string') throw new TypeError(`${where}: ${name}[${j}] is not a string`);
  }
  return v.slice() as string[];
}
