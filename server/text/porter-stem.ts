/**
 * Porter (1980) stemming on char codes, written to give exactly what the `natural` package's
 * stemmer gives, including where natural departs from the paper (listed below and checked word by
 * word against natural on WordNet's index in test/text/porter-stem.test.ts).
 *
 * Why our own: natural's stemmer runs each step as a chain of regular-expression replaces and
 * builds several strings per step. Measured on the 50,000-document bench corpus (`npm run bench
 * tfidf`), it was about 35 % of a cold fit. This one works in place on a byte buffer and allocates
 * only the result string.
 *
 * natural's departures from the paper, kept so that no stem changes downstream:
 * - Words shorter than three letters are returned unchanged.
 * - The measure m is computed from a "group" string in which a run of consonants followed by `y`
 *   becomes `CV` and any other `y` is a consonant; a vowel right after such a `y` starts a second
 *   `V` group, so m can be a half (natural's `measure("bya")` is 0.5). Conditions `m > 0`,
 *   `m > 1`, `m = 1` then compare that value as natural does.
 * - Steps 2 and 3 try every suffix of their lists in turn (not only the longest): each suffix whose
 *   stem in the step's input word has m > 0 is replaced in the word as it stands by then.
 * - Step 1c asks for a vowel group anywhere before the last group of the whole word ("say" → "sai").
 * - Step 4 tries only the longest listed suffix, then -(s|t)ion; a failed m test does not fall back
 *   to a shorter suffix ("-ement" with m ≤ 1 does not try "-ment").
 */

const A = 97, E = 101, I = 105, L = 108, O = 111, S = 115, T = 116, U = 117, W = 119, X = 120, Y = 121, Z = 122;
const SYMBOL_C = 1, SYMBOL_V = 2;

/** The word being stemmed, as char codes; `n` of them are valid. Grown for long words. */
let buf = new Uint8Array(64);
let n = 0;
/** A step's input word, for the rules that test it while changing `buf` (steps 2 and 3). */
let orig = new Uint8Array(64);
/** Group symbols of natural's `categorizeGroups`, one per group. */
let groups = new Uint8Array(64);

function isVowel(c: number): boolean {
  return c === A || c === E || c === I || c === O || c === U;
}

/**
 * Fills `groups` with natural's group string of `w[0 .. len)`: each maximal run of a–z other than
 * aeiouy that is followed by `y` gives C then V (the `y` eaten); other consonant runs and stray `y`s
 * give C; each run of aeiou gives V; adjacent Cs merge, adjacent Vs do not.
 * @returns the number of groups.
 */
function fillGroups(w: Uint8Array, len: number): number {
  let g = 0;
  let i = 0;
  while (i < len) {
    const c = w[i];
    if (isVowel(c)) {
      while (i < len && isVowel(w[i])) i++;
      groups[g++] = SYMBOL_V;
    } else if (c === Y) {
      if (g === 0 || groups[g - 1] !== SYMBOL_C) groups[g++] = SYMBOL_C;
      i++;
    } else {
      while (i < len && !isVowel(w[i]) && w[i] !== Y) i++;
      if (g === 0 || groups[g - 1] !== SYMBOL_C) groups[g++] = SYMBOL_C;
      if (i < len && w[i] === Y) { groups[g++] = SYMBOL_V; i++; }
    }
  }
  return g;
}

/** natural's measure of `w[0 .. len)`: groups less a leading C and a trailing V, halved; -1 for the empty word. */
function measure(w: Uint8Array, len: number): number {
  if (len === 0) return -1;
  let g = fillGroups(w, len);
  let first = 0;
  if (groups[0] === SYMBOL_C) { first = 1; g--; }
  if (g > 0 && groups[first + g - 1] === SYMBOL_V) g--;
  return g / 2;
}

/** Whether `w[0 .. len)` has a V group (natural's `categorizeGroups(w).indexOf('V') >= 0`), not counting the last group if `dropLast`. */
function hasVowelGroup(w: Uint8Array, len: number, dropLast: boolean): boolean {
  const g = fillGroups(w, len) - (dropLast ? 1 : 0);
  for (let k = 0; k < g; k++) if (groups[k] === SYMBOL_V) return true;
  return false;
}

/** Whether character `i` of `w` is a V in natural's `categorizeChars`: aeiou, or y after a letter other than aeiouy. */
function charIsV(w: Uint8Array, i: number): boolean {
  const c = w[i];
  if (isVowel(c)) return true;
  return c === Y && i > 0 && !isVowel(w[i - 1]) && w[i - 1] !== Y;
}

/** natural's `categorizeChars(w).substr(from, 3) === 'CVC'` for `w[0 .. len)`, `from` negative as in substr. */
function cvcAt(w: Uint8Array, len: number, from: number): boolean {
  const s = Math.max(len + from, 0);
  if (s + 3 > len) return false;
  return !charIsV(w, s) && charIsV(w, s + 1) && !charIsV(w, s + 2);
}

function endsWith(w: Uint8Array, len: number, suffix: Uint8Array): boolean {
  const m = suffix.length;
  if (m > len) return false;
  // From the last letter back: most suffixes fail there.
  for (let k = m - 1, j = len - 1; k >= 0; k--, j--) if (w[j] !== suffix[k]) return false;
  return true;
}

/** Replaces the last `cut` characters of `buf` with `add`. */
function replaceEnd(cut: number, add: Uint8Array): void {
  n -= cut;
  for (let k = 0; k < add.length; k++) buf[n++] = add[k];
}

const codes = (s: string): Uint8Array => Uint8Array.from(s, (ch) => ch.charCodeAt(0));
type Rule = [suffix: Uint8Array, replacement: Uint8Array];
/**
 * A step's rules grouped by the last letter of their suffix, in list order: only rules ending in the
 * word's last letter can apply (natural applies a rule only where the step's input ends with it).
 */
const rules = (pairs: string[][]): Rule[][] => {
  const byLast: Rule[][] = Array.from({ length: 26 }, () => []);
  for (const [a, b] of pairs) byLast[a.charCodeAt(a.length - 1) - A].push([codes(a), codes(b)]);
  return byLast;
};

const EED = codes('eed'), EE = codes('ee'), ED = codes('ed'), ING = codes('ing'), ION = codes('ion');
const NOTHING = new Uint8Array(0);
const STEP1B_AFTER: Rule[] = [['at', 'ate'], ['bl', 'ble'], ['iz', 'ize']].map(([a, b]) => [codes(a), codes(b)]);
const STEP2 = rules([['ational', 'ate'], ['tional', 'tion'], ['enci', 'ence'], ['anci', 'ance'], ['izer', 'ize'], ['abli', 'able'],
  ['bli', 'ble'], ['alli', 'al'], ['entli', 'ent'], ['eli', 'e'], ['ousli', 'ous'], ['ization', 'ize'], ['ation', 'ate'],
  ['ator', 'ate'], ['alism', 'al'], ['iveness', 'ive'], ['fulness', 'ful'], ['ousness', 'ous'], ['aliti', 'al'],
  ['iviti', 'ive'], ['biliti', 'ble'], ['logi', 'log']]);
const STEP3 = rules([['icate', 'ic'], ['ative', ''], ['alize', 'al'], ['iciti', 'ic'], ['ical', 'ic'], ['ful', ''], ['ness', '']]);
/** Step 4's suffixes, longest first, so the first that fits is the one natural's lazy regex picks. */
const STEP4 = ['ement', 'ance', 'ence', 'able', 'ible', 'ment', 'ant', 'ent', 'ism', 'ate', 'iti', 'ous', 'ive', 'ize', 'al', 'er', 'ic', 'ou']
  .map(codes);

function step1a(): void {
  if (n >= 4 && buf[n - 1] === S && buf[n - 2] === E && buf[n - 3] === S && buf[n - 4] === S) n -= 2; // sses → ss
  else if (n >= 3 && buf[n - 1] === S && buf[n - 2] === E && buf[n - 3] === I) n -= 2; // ies → i
  else if (n > 2 && buf[n - 1] === S && buf[n - 2] !== S) n -= 1;
}

function step1b(): void {
  if (endsWith(buf, n, EED)) {
    if (measure(buf, n - 3) > 0) replaceEnd(3, EE);
    return;
  }
  const cut = endsWith(buf, n, ED) ? 2 : endsWith(buf, n, ING) ? 3 : 0;
  // natural treats an empty remainder ("ing") as no match, and needs a vowel group in the stem.
  if (cut === 0 || n === cut || !hasVowelGroup(buf, n - cut, false)) return;
  n -= cut;
  for (let r = 0; r < STEP1B_AFTER.length; r++) {
    const suffix = STEP1B_AFTER[r][0];
    if (endsWith(buf, n, suffix)) { replaceEnd(suffix.length, STEP1B_AFTER[r][1]); return; }
  }
  const last = buf[n - 1];
  if (n >= 2 && last === buf[n - 2] && !isVowel(last) && last !== L && last !== S && last !== Z) { n--; return; }
  if (measure(buf, n) === 1 && cvcAt(buf, n, -3) && last !== W && last !== X && last !== Y) buf[n++] = E;
}

function step1c(): void {
  if (buf[n - 1] === Y && hasVowelGroup(buf, n, true)) buf[n - 1] = I;
}

/** natural's `replacePatterns(word, list, 0)`: every rule whose stem in the input word has m > 0 is applied to the word as it stands. */
function replaceEach(byLast: readonly Rule[][]): void {
  if (n === 0) return;
  const list = byLast[buf[n - 1] - A];
  if (list.length === 0) return;
  if (orig.length < n) orig = new Uint8Array(buf.length);
  for (let i = 0; i < n; i++) orig[i] = buf[i];
  const n0 = n;
  for (let r = 0; r < list.length; r++) {
    const suffix = list[r][0], replacement = list[r][1];
    if (!endsWith(orig, n0, suffix) || measure(orig, n0 - suffix.length) <= 0) continue;
    // natural keeps the word when a replacement would leave it empty (an empty string is falsy there).
    if (endsWith(buf, n, suffix) && n - suffix.length + replacement.length > 0) replaceEnd(suffix.length, replacement);
  }
}

function step4(): void {
  for (let r = 0; r < STEP4.length; r++) {
    const suffix = STEP4[r];
    if (n > suffix.length && endsWith(buf, n, suffix)) {
      if (measure(buf, n - suffix.length) > 1) { n -= suffix.length; return; }
      break;
    }
  }
  if (n > 4 && endsWith(buf, n, ION) && (buf[n - 4] === S || buf[n - 4] === T) && measure(buf, n - 3) > 1) n -= 3;
}

function step5a(): void {
  if (buf[n - 1] !== E) return;
  const m = measure(buf, n - 1);
  if (m > 1 || (m === 1 && !(cvcAt(buf, n, -4) && n >= 2 && buf[n - 2] !== W && buf[n - 2] !== X && buf[n - 2] !== Y))) n--;
}

function step5b(): void {
  if (n >= 2 && buf[n - 1] === L && buf[n - 2] === L && measure(buf, n) > 1) n--;
}

/** Runs the steps on `word` (a–z only, length ≥ 3) and returns its stem, reusing `word` when nothing changed. */
function stemLetters(word: string): string {
  const len = word.length;
  if (buf.length < len + 4) {
    buf = new Uint8Array(2 * len + 4);
    groups = new Uint8Array(2 * len + 4);
  }
  for (let i = 0; i < len; i++) buf[i] = word.charCodeAt(i);
  n = len;
  step1a(); step1b(); step1c();
  replaceEach(STEP2);
  replaceEach(STEP3);
  step4(); step5a(); step5b();
  let same = 0;
  const upTo = Math.min(n, len);
  while (same < upTo && buf[same] === word.charCodeAt(same)) same++;
  if (same === n && n === len) return word;
  let tail = '';
  for (let i = same; i < n; i++) tail += String.fromCharCode(buf[i]);
  return word.slice(0, same) + tail;
}

function isLowerAscii(word: string): boolean {
  if (word.length === 0) return false;
  for (let i = 0; i < word.length; i++) {
    const c = word.charCodeAt(i);
    if (c < A || c > Z) return false;
  }
  return true;
}

/**
 * The Porter (1980) stem of a lower-case English word (M. F. Porter, "An algorithm for suffix
 * stripping", Program 14(3), 130–137), exactly as the `natural` package (v8) computes it; see the
 * file comment for where that differs from the paper.
 * @param word lower-case letters a–z; other input (capitals, digits, accents, empty) is returned unchanged.
 */
export function porterStem(word: string): string {
  return word.length >= 3 && isLowerAscii(word) ? stemLetters(word) : word;
}
