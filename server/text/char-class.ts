/**
 * What each character is to the tokeniser. A lookup table filled on first sight of each
 * character keeps Unicode property tests out of the per-character loop.
 */

/** Not part of any token: spaces, punctuation, symbols, emoji. */
export const CH_OTHER = 1;
/** A letter (`\p{L}`) outside the CJK scripts. */
export const CH_LETTER = 2;
/** A digit or other number character (`\p{N}`). */
export const CH_DIGIT = 3;
/** A combining mark (`\p{M}`): kept inside a word, never starts one. */
export const CH_MARK = 4;
/** A Han, Hiragana or Katakana letter: these scripts are written without spaces between words. */
export const CH_CJK = 5;
/** An apostrophe (U+0027, U+2019, U+02BC): joins two letters of one word ("don't"). */
export const CH_APOSTROPHE = 6;
/**
 * Invisible inside a word and dropped from it: soft hyphen, zero-width (non-)joiner, word
 * joiner, byte-order mark, Arabic tatweel (a stretching stroke, not a letter).
 */
export const CH_JOINER = 7;
/** A UTF-16 high surrogate: look at the whole code point. */
export const CH_SURROGATE = 8;
/**
 * A letter or mark of Thai, Lao, Khmer or Myanmar: scripts written without spaces between words
 * whose words can only be found with a dictionary (we use ICU's, through Intl.Segmenter).
 */
export const CH_SEGMENTED = 9;

const CJK = /^[\p{scx=Han}\p{scx=Hiragana}\p{scx=Katakana}]$/u;
const SEGMENTED = /^[\p{scx=Thai}\p{scx=Lao}\p{scx=Khmer}\p{scx=Myanmar}]$/u;
const LETTER = /^\p{L}$/u;
const NUMBER = /^\p{N}$/u;
const MARK = /^\p{M}$/u;

/** Class of a code point, by Unicode properties. */
export function classifyCodePoint(cp: number): number {
  if (cp === 0x27 || cp === 0x2019 || cp === 0x02bc) return CH_APOSTROPHE;
  if (cp === 0xad || cp === 0x200c || cp === 0x200d || cp === 0x2060 || cp === 0xfeff || cp === 0x640) return CH_JOINER;
  if (cp >= 0xd800 && cp <= 0xdbff) return CH_SURROGATE;
  if (cp >= 0xdc00 && cp <= 0xdfff) return CH_OTHER;
  const ch = String.fromCodePoint(cp);
  if ((LETTER.test(ch) || MARK.test(ch)) && SEGMENTED.test(ch)) return CH_SEGMENTED;
  if (LETTER.test(ch)) return CJK.test(ch) ? CH_CJK : CH_LETTER;
  if (NUMBER.test(ch)) return CH_DIGIT;
  if (MARK.test(ch)) return CH_MARK;
  return CH_OTHER;
}

/** Classes of the Basic Multilingual Plane by UTF-16 code unit; 0 = not looked at yet. */
export const BMP_CLASS = new Uint8Array(0x10000);
for (let c = 0; c < 0x80; c++) BMP_CLASS[c] = classifyCodePoint(c);

const astral = new Map<number, number>();

/** Class of a BMP code unit, filling the table on first sight. */
export function bmpClass(c: number): number {
  const k = BMP_CLASS[c];
  return k !== 0 ? k : (BMP_CLASS[c] = classifyCodePoint(c));
}

/** Class of a code point above U+FFFF (emoji, CJK extensions, historic scripts), cached. */
export function astralClass(cp: number): number {
  let k = astral.get(cp);
  if (k === undefined) {
    k = classifyCodePoint(cp);
    if (astral.size < 100_000) astral.set(cp, k);
  }
  return k;
}
