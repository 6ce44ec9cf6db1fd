/**
 * Defaults and validation for {@link TokenOptions}.
 */
import type { TfidfOptions, TokenOptions } from './api.js';

/** Default tokenisation: English stop words dropped, Porter stems, no bigrams, tokens of 2+ characters. */
export const DEFAULT_TOKEN_OPTIONS: Readonly<TokenOptions> = Object.freeze({
  stopWords: true,
  stem: true,
  bigrams: false,
  minTokenLength: 2,
});

/** Every option name of the text pipeline, so a misspelt one is reported rather than ignored. */
const KNOWN: ReadonlySet<string> = new Set<keyof TfidfOptions>([
  'stopWords', 'stem', 'bigrams', 'minTokenLength', 'minDf', 'maxDf', 'maxTerms', 'sublinearTf', 'smoothIdf', 'normalize',
]);

/** Throws a TypeError naming the first key of `opts` that is no option of the text pipeline. */
export function rejectUnknownOptions(opts: object): void {
  for (const key of Object.keys(opts)) {
    if (!KNOWN.has(key)) throw new TypeError(`Unknown text option "${key}"; known options are ${[...KNOWN].join(', ')}`);
  }
}

/** Throws a TypeError unless `value` is a boolean. */
export function checkBoolean(name: string, value: unknown): void {
  if (typeof value !== 'boolean') throw new TypeError(`Option ${name} must be true or false, not ${JSON.stringify(value)}`);
}

/**
 * Merges `opts` over {@link DEFAULT_TOKEN_OPTIONS} and validates the result.
 * @throws TypeError for an unknown option or a value of the wrong type; RangeError for a value out of range.
 */
export function resolveTokenOptions(opts: Partial<TokenOptions> = {}): TokenOptions {
  if (opts === null || typeof opts !== 'object') throw new TypeError('Text options must be an object');
  rejectUnknownOptions(opts);
  // Picks only the token options, so TF-IDF options may be passed through (validated elsewhere).
  const o: TokenOptions = {
    stopWords: opts.stopWords ?? DEFAULT_TOKEN_OPTIONS.stopWords,
    stem: opts.stem ?? DEFAULT_TOKEN_OPTIONS.stem,
    bigrams: opts.bigrams ?? DEFAULT_TOKEN_OPTIONS.bigrams,
    minTokenLength: opts.minTokenLength ?? DEFAULT_TOKEN_OPTIONS.minTokenLength,
  };
  checkBoolean('stopWords', o.stopWords);
  checkBoolean('stem', o.stem);
  checkBoolean('bigrams', o.bigrams);
  if (!Number.isInteger(o.minTokenLength) || o.minTokenLength < 1 || o.minTokenLength > 100) {
    throw new RangeError(`Option minTokenLength must be a whole number from 1 to 100, not ${JSON.stringify(o.minTokenLength)}`);
  }
  return o;
}
