/**
 * Fitting: tokenise a corpus, choose the vocabulary, weigh every document.
 */
import type { Csr } from '../common/matrix.js';
import { drain, type Step, type Stepwise } from '../common/step.js';
import type { FittedCounts, FittedTfidf, TfidfOptions } from './api.js';
import { IdBuffer, growInt32, growUint32 } from './id-buffer.js';
import { PLACEHOLDER_LABELS, TermEncoder } from './term-encoder.js';
import { resolveTfidfOptions } from './tfidf-options.js';
import { checkTexts, TfidfVectorizer } from './tfidf-vectorizer.js';
import { RowScratch, weighRow, type RowWeighting } from './weigh-row.js';

/** Tokenising yields after this many documents or characters, whichever first (~10–30 ms of work). */
const TOKENISE_DOCS = 2000;
const TOKENISE_CHARS = 1_000_000;
/** …or after this many new spellings, each of which costs a stem (the first slices meet most of them). */
const TOKENISE_NEW_SPELLINGS = 3000;
/** Weighing yields after this many documents or tokens. */
const WEIGH_DOCS = 5000;
const WEIGH_TOKENS = 2_000_000;

/** Everything known about a corpus after tokenising, before the vocabulary is chosen. */
interface Tokenised {
  encoder: TermEncoder;
  /** Term ids of all documents, back to back. */
  ids: Uint32Array;
  /** Document d's ids are `ids[starts[d] .. starts[d+1])`. */
  starts: Uint32Array;
  /** Documents containing each term id. */
  df: Uint32Array;
  /** Occurrences of each term id in the corpus. */
  tf: Uint32Array;
}

function* tokenise(texts: readonly string[], options: TfidfOptions): Stepwise<Tokenised> {
  const n = texts.length;
  const encoder = new TermEncoder(options);
  const ids = new IdBuffer(1 << 16);
  const starts = new Uint32Array(n + 1);
  let df = new Uint32Array(4096), tf = new Uint32Array(4096), lastDoc = new Int32Array(4096).fill(-1);
  let chars = 0, sliceStart = 0, surfaces = 0;
  yield { stage: 'tokenise', done: 0, total: n };
  for (let d = 0; d < n; d++) {
    const from = ids.length;
    encoder.encode(texts[d], ids);
    const terms = encoder.termCount;
    if (terms > df.length) {
      df = growUint32(df, terms);
      tf = growUint32(tf, terms);
      lastDoc = growInt32(lastDoc, terms, -1);
    }
    const data = ids.data;
    for (let k = from; k < ids.length; k++) {
      const t = data[k];
      tf[t]++;
      if (lastDoc[t] !== d) { lastDoc[t] = d; df[t]++; }
    }
    starts[d + 1] = ids.length;
    chars += texts[d].length;
    if (d + 1 - sliceStart >= TOKENISE_DOCS || chars >= TOKENISE_CHARS || encoder.surfaceCount - surfaces >= TOKENISE_NEW_SPELLINGS) {
      yield { stage: 'tokenise', done: d + 1, total: n };
      sliceStart = d + 1;
      chars = 0;
      surfaces = encoder.surfaceCount;
    }
  }
  yield { stage: 'tokenise', done: n, total: n };
  return { encoder, ids: ids.data, starts, df, tf };
}

/**
 * Term ids kept by the minDf/maxDf bounds and the maxTerms cap, sorted by term string (their
 * column order). Bounds follow the usual reading: a whole number ≥ 1 (minDf) or > 1 (maxDf) counts
 * documents, anything else is a fraction of them; the cap keeps the terms with most occurrences,
 * ties broken by term. When the number of documents makes the bounds contradict, nothing is kept.
 * Terms sort by UTF-16 code units, which is code point order except that characters above U+FFFF
 * sort before U+E000–U+FFFF.
 */
function* chooseVocabulary(tok: Tokenised, n: number, o: TfidfOptions): Stepwise<{ keep: number[]; strings: string[] }> {
  // Big vocabularies (bigrams) take a while to filter, name and sort: pause between the phases.
  const pause: Step = { stage: 'weigh', done: 0, total: n };
  const minCount = o.minDf >= 1 ? o.minDf : o.minDf * n;
  const maxCount = o.maxDf > 1 ? o.maxDf : o.maxDf * n;
  const { encoder, df, tf } = tok;
  let keep: number[] = [];
  for (let t = 0; t < encoder.termCount; t++) if (df[t] > 0 && df[t] >= minCount && df[t] <= maxCount) keep.push(t);
  yield pause;
  const strings = new Array<string>(encoder.termCount);
  for (const t of keep) {
    const str = encoder.termString(t);
    // Bigram strings are concatenations; reading one character makes V8 flatten it once, rather
    // than on every comparison of the sort below.
    str.charCodeAt(0);
    strings[t] = str;
  }
  yield pause;
  const byTerm = (a: number, b: number): number => (strings[a] < strings[b] ? -1 : strings[a] > strings[b] ? 1 : 0);
  if (o.maxTerms > 0 && keep.length > o.maxTerms) {
    keep.sort((a, b) => tf[b] - tf[a] || byTerm(a, b));
    keep = keep.slice(0, o.maxTerms);
    yield pause;
  }
  keep.sort(byTerm);
  yield pause;
  return { keep, strings };
}

/** Readable label of each kept term: its most used spelling; bigrams join their parts' labels. */
function labelTerms(encoder: TermEncoder, keep: readonly number[]): string[] {
  const best = new Int32Array(encoder.termCount).fill(-1);
  const { surfaceTerm, surfaceUses } = encoder;
  for (let sid = 0; sid < encoder.surfaceCount; sid++) {
    const t = surfaceTerm[sid];
    if (t >= 0 && (best[t] < 0 || surfaceUses[sid] > surfaceUses[best[t]])) best[t] = sid;
  }
  const unigramLabel = (t: number): string => PLACEHOLDER_LABELS.get(encoder.terms[t]) ?? (best[t] >= 0 ? encoder.surfaces[best[t]] : encoder.terms[t]);
  return keep.map((t) => {
    const l = encoder.bigramLeft[t];
    return l < 0 ? unigramLabel(t) : `${unigramLabel(l)} ${unigramLabel(encoder.bigramRight[t])}`;
  });
}

interface Fitted {
  vectorizer: TfidfVectorizer;
  matrix: Csr;
  df: Uint32Array;
}

function* fit(texts: readonly string[], o: TfidfOptions, counts: boolean): Stepwise<Fitted> {
  const n = texts.length;
  const tok = yield* tokenise(texts, o);
  yield { stage: 'weigh', done: 0, total: n };
  const { keep, strings } = yield* chooseVocabulary(tok, n, o);
  const cols = keep.length;
  const column = new Int32Array(tok.encoder.termCount).fill(-1);
  const df = new Uint32Array(cols);
  const idf = new Float64Array(cols);
  let nnz = 0;
  for (let j = 0; j < cols; j++) {
    const t = keep[j];
    column[t] = j;
    df[j] = tok.df[t];
    nnz += df[j];
    // Smooth idf adds one imaginary document holding every term, so no idf is infinite or zero.
    idf[j] = o.smoothIdf ? Math.log((1 + n) / (1 + df[j])) + 1 : Math.log(n / df[j]) + 1;
  }
  const labels = labelTerms(tok.encoder, keep);
  yield { stage: 'weigh', done: 0, total: n };
  const vectorizer = new TfidfVectorizer(o, keep.map((t) => strings[t]), labels, idf, n);

  const weighting: RowWeighting = counts ? { idf: null, sublinearTf: false, normalize: false } : { idf, sublinearTf: o.sublinearTf, normalize: o.normalize };
  const indptr = new Uint32Array(n + 1);
  const indices = new Uint32Array(nnz);
  const values = new Float32Array(nnz);
  const scratch = new RowScratch(cols);
  const { ids, starts } = tok;
  let at = 0, sliceStart = 0;
  yield { stage: 'weigh', done: 0, total: n };
  for (let d = 0; d < n; d++) {
    at = weighRow(ids, starts[d], starts[d + 1], column, weighting, scratch, indices, values, at);
    indptr[d + 1] = at;
    if (d + 1 - sliceStart >= WEIGH_DOCS || starts[d + 1] - starts[sliceStart] >= WEIGH_TOKENS) {
      yield { stage: 'weigh', done: d + 1, total: n };
      sliceStart = d + 1;
    }
  }
  yield { stage: 'weigh', done: n, total: n };
  return { vectorizer, matrix: { rows: n, cols, indptr, indices, values }, df };
}

/**
 * Fits a TF-IDF vocabulary to `texts` and weighs them: tokenise (stage `"tokenise"`), choose
 * terms by minDf/maxDf/maxTerms, then weigh (stage `"weigh"`), yielding a Step every few
 * thousand documents. With the defaults a term's weight is (1 + ln tf) · (ln((1 + n)/(1 + df)) + 1)
 * and rows have unit length (Manning, Raghavan & Schütze, Introduction to Information Retrieval,
 * 2008, §6.2–6.4). Columns are sorted by term. An empty vocabulary gives empty rows, not an error.
 * @param texts the documents; each must be a string.
 * @param opts merged over DEFAULT_TFIDF_OPTIONS.
 * @throws TypeError for a non-string text or bad option type; RangeError for an option out of
 *   range — at the call, before any work.
 */
export function fitTfidfSteps(texts: readonly string[], opts: Partial<TfidfOptions> = {}): Stepwise<FittedTfidf> {
  const o = resolveTfidfOptions(opts);
  checkTexts(texts);
  return fit(texts, o, false);
}

/** {@link fitTfidfSteps} run to the end. */
export function fitTfidf(texts: readonly string[], opts: Partial<TfidfOptions> = {}): FittedTfidf {
  return drain(fitTfidfSteps(texts, opts));
}

/**
 * Fits the vocabulary as {@link fitTfidfSteps} does, but returns raw term counts (for naive
 * Bayes). The vectorizer's `counts()` gives the same numbers for new text.
 */
export function fitCountsSteps(texts: readonly string[], opts: Partial<TfidfOptions> = {}): Stepwise<FittedCounts> {
  const o = resolveTfidfOptions(opts);
  checkTexts(texts);
  return (function* (): Stepwise<FittedCounts> {
    const { vectorizer, matrix, df } = yield* fit(texts, o, true);
    return { vectorizer, counts: matrix, df };
  })();
}

/** {@link fitCountsSteps} run to the end. */
export function fitCounts(texts: readonly string[], opts: Partial<TfidfOptions> = {}): FittedCounts {
  return drain(fitCountsSteps(texts, opts));
}
