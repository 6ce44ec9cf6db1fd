/**
 * Types of the text pipeline: raw text → normalised tokens → vocabulary → TF-IDF (CSR).
 * The fitted vectoriser is kept with every model so new text is vectorised exactly as the
 * training text was.
 */
import type { Csr } from '../common/matrix.js';
import type { TfidfVectorizer } from './tfidf-vectorizer.js';

/** How raw text becomes tokens. */
export interface TokenOptions {
  /** Drop English stop words. @default true */
  stopWords: boolean;
  /** Reduce words to Porter stems (Porter 1980). @default true */
  stem: boolean;
  /** Also emit adjacent-word bigrams (`"late delivery"` → `late_deliveri`). @default false */
  bigrams: boolean;
  /** Tokens shorter than this (in code points) are dropped, placeholders excepted. @default 2 */
  minTokenLength: number;
}

/** How tokens become TF-IDF rows. */
export interface TfidfOptions extends TokenOptions {
  /** Keep terms in at least this many documents (integer ≥ 1) or this fraction (0 < x < 1). @default 2 */
  minDf: number;
  /** Keep terms in at most this fraction (0 < x ≤ 1) or count (integer > 1) of documents. @default 0.5 */
  maxDf: number;
  /** Keep at most this many terms, the most frequent first (0 = no cap). @default 0 */
  maxTerms: number;
  /** tf → 1 + ln(tf). @default true */
  sublinearTf: boolean;
  /** idf = ln((1 + n) / (1 + df)) + 1, as if one extra document held every term. @default true */
  smoothIdf: boolean;
  /** Scale each row to unit Euclidean length. @default true */
  normalize: boolean;
}

/** The fitted state needed to vectorise new text the same way. Serialisable with `toJSON()`. */
export interface VectorizerState {
  kind: 'sheaf.tfidf';
  version: 1;
  options: TfidfOptions;
  /** Term strings (stems or bigrams), column order. */
  terms: string[];
  /** A readable surface form of each term (its most frequent unstemmed spelling), column order. */
  labels: string[];
  /** Inverse document frequency per column. */
  idf: number[];
  /** Number of training documents. */
  documentCount: number;
}

/** Result of fitting: the vectoriser and the training matrix. */
export interface FittedTfidf {
  vectorizer: TfidfVectorizer;
  /** Documents × terms, TF-IDF weights as the options say. */
  matrix: Csr;
  /** Document frequency per column over the training documents. */
  df: Uint32Array;
}

/** Result of fitting a vocabulary for counting (naive Bayes): the vectoriser and raw term counts. */
export interface FittedCounts {
  vectorizer: TfidfVectorizer;
  /** Documents × terms, raw term counts. */
  counts: Csr;
  /** Document frequency per column over the training documents. */
  df: Uint32Array;
}

/** Terms of one text, as {@link analyzeText} returns them. */
export interface AnalyzedText {
  /** Normalised, stop-worded, stemmed terms in text order (then bigrams, if asked for). */
  terms: string[];
  /** The lower-cased spelling each term came from (bigrams: both spellings, space between). */
  surfaces: string[];
}
