/**
 * The terms of a single text, as strings: for showing why a text was routed, for tests, and for
 * anyone who wants our tokens without a vocabulary.
 */
import type { AnalyzedText, TokenOptions } from './api.js';
import { IdBuffer } from './id-buffer.js';
import { TermEncoder } from './term-encoder.js';
import { rejectUnknownOptions, resolveTokenOptions } from './token-options.js';

/** Encoders by option set, so repeated calls reuse their caches; each starts over when large. */
const encoders = new Map<string, TermEncoder>();
const ENCODER_LIMIT = 200_000;

function encoderFor(o: TokenOptions): TermEncoder {
  const key = `${o.stopWords}|${o.stem}|${o.bigrams}|${o.minTokenLength}`;
  let e = encoders.get(key);
  if (e === undefined || e.surfaceCount > ENCODER_LIMIT || e.termCount > ENCODER_LIMIT) {
    e = new TermEncoder(o);
    encoders.set(key, e);
  }
  return e;
}

/**
 * Normalises, tokenises, drops stop words and stems `text` exactly as fitting and transforming
 * do, and returns the terms with the spelling each came from. In order:
 * - Unicode NFKC (ligatures, full-width and other compatibility forms become plain letters), then
 *   `toLowerCase()` as the case folding (simple lower-casing: "ß" stays "ß").
 * - Words are runs of letters and digits in any script, combining marks kept inside; hyphens and
 *   other punctuation split; emoji and symbols are dropped; words over 64 code units are skipped.
 * - Apostrophes: English clitics are cut ("customer's" → "customer", "we'll" → "we"); "n't" and
 *   other inner apostrophes are removed ("don't" → "dont"). Straight, curly and modifier apostrophes alike.
 * - Numbers become `__number__`, web addresses `__url__`, e-mail addresses `__email__`.
 * - Han, Hiragana and Katakana (written without spaces) become overlapping character bigrams;
 *   Thai, Lao, Khmer and Myanmar are split into words by ICU's dictionaries (Intl.Segmenter).
 * - Stop words (ENGLISH_STOP_WORDS) and words shorter than minTokenLength are dropped; words
 *   spelt in a–z are Porter-stemmed; with `bigrams`, adjacent kept terms also form `left_right`.
 * @param opts token options (TF-IDF options are accepted and ignored), merged over DEFAULT_TOKEN_OPTIONS.
 */
export function analyzeText(text: string, opts: Partial<TokenOptions> = {}): AnalyzedText {
  if (typeof text !== 'string') throw new TypeError(`Text must be a string, not ${text === null ? 'null' : typeof text}`);
  if (opts === null || typeof opts !== 'object') throw new TypeError('Text options must be an object');
  rejectUnknownOptions(opts);
  const o = resolveTokenOptions({ stopWords: opts.stopWords, stem: opts.stem, bigrams: opts.bigrams, minTokenLength: opts.minTokenLength });
  const enc = encoderFor(o);
  const ids = new IdBuffer(64);
  const spans = new IdBuffer(128);
  const unigrams = enc.encode(text, ids, spans);
  const s = enc.lastText;
  const terms = new Array<string>(ids.length);
  const surfaces = new Array<string>(ids.length);
  for (let k = 0; k < ids.length; k++) {
    terms[k] = enc.termString(ids.data[k]);
    surfaces[k] = k < unigrams ? s.slice(spans.data[2 * k], spans.data[2 * k + 1]) : `${surfaces[k - unigrams]} ${surfaces[k - unigrams + 1]}`;
  }
  return { terms, surfaces };
}
