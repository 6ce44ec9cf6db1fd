/**
 * Porter stemming with a cache. Vocabularies are Zipfian: a few thousand distinct words make up
 * nearly every token, so each word is stemmed once and then looked up.
 */
import PorterStemmer from 'natural/lib/natural/stemmers/porter_stemmer.js';

/** Beyond this many cached words the cache starts over, so a long-lived server cannot grow without bound. */
const CACHE_LIMIT = 500_000;
const cache = new Map<string, string>();

/**
 * The Porter (1980) stem of a lower-case English word ("An algorithm for suffix stripping",
 * Program 14(3)), as implemented by the `natural` package. Where natural departs from the paper
 * is recorded in test/text/porter-stem.test.ts.
 * @param word lower-case letters a–z; other input is returned unchanged.
 */
export function porterStem(word: string): string {
  let s = cache.get(word);
  if (s !== undefined) return s;
  s = ASCII_WORD.test(word) ? PorterStemmer.stem(word) : word;
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(word, s);
  return s;
}

/** Porter's rules are for English spelling; any other word is left as written. */
const ASCII_WORD = /^[a-z]+$/;
