/**
 * Raw text → term ids. One encoder interns every spelling and every term it meets, so a word is
 * cleaned, checked against the stop list and stemmed once, however often it occurs.
 */
import type { TokenOptions } from './api.js';
import { IdBuffer, growInt32, growUint32 } from './id-buffer.js';
import { porterStem } from './porter-stem.js';
import { scanTokens, TOKEN_CJK, TOKEN_EDITED_WORD, TOKEN_EMAIL, TOKEN_NUMBER, TOKEN_SEGMENTED_WORD, TOKEN_URL, TokenSpans } from './scan-tokens.js';
import { ENGLISH_STOP_WORDS } from './stop-words.js';
import { spanHash, SurfaceTable } from './surface-table.js';

/** The term standing for any web address. */
export const URL_TERM = '__url__';
/** The term standing for any e-mail address. */
export const EMAIL_TERM = '__email__';
/** The term standing for any number. */
export const NUMBER_TERM = '__number__';
/** Readable labels of the placeholder terms. */
export const PLACEHOLDER_LABELS: ReadonlyMap<string, string> = new Map([
  [URL_TERM, '[web address]'],
  [EMAIL_TERM, '[e-mail address]'],
  [NUMBER_TERM, '[number]'],
]);
/** Joins the two terms of a bigram. Tokens never contain `_`, so a bigram cannot be mistaken for a word. */
export const BIGRAM_JOINER = '_';

/**
 * Longer "words" are skipped: they are hashes, keys, encoded blobs or glued text, never a theme,
 * and they would only bloat the vocabulary. (UTF-16 code units; the longest English and German
 * dictionary words are well under this.)
 */
export const MAX_WORD_LENGTH = 64;

/** Texts longer than this (UTF-16 code units) are scanned into throw-away span buffers. */
const LARGE_TEXT = 1 << 18;

const URL_ID = 0, EMAIL_ID = 1, NUMBER_ID = 2;
/** Bigram keys pack two term ids into one number: left · 2^26 + right (exact below 2^53). */
const PAIR_SHIFT = 2 ** 26;

const NON_ASCII = /[^\0-\x7f]/;
const JOINERS = /[\u00ad\u200c\u200d\u2060\ufeff\u0640]/g;
const APOSTROPHES = /['\u2019\u02bc]/g;
/** English clitics cut from the word they lean on: possessive/"is" 's, 'll, 'd, 're, 've, 'm. */
const CLITIC = /^([a-z]+)'(?:s|ll|d|re|ve|m)$/;

/**
 * Cleans a word holding apostrophes or invisible joiners. English clitics are cut off
 * ("customer's" → "customer", "we'll" → "we"); "n't" and other apostrophes are simply removed
 * ("don't" → "dont", "o'brien" → "obrien"), so every spelling of a contraction meets one stop word.
 */
export function cleanWord(raw: string): string {
  const w = raw.replace(JOINERS, '').replace(APOSTROPHES, "'");
  const m = CLITIC.exec(w);
  if (m !== null) return m[1];
  return w.replace(APOSTROPHES, '');
}

/**
 * The two unigram terms of a bigram term string, or null for a unigram. Words never contain "_"
 * (it is neither a letter nor a digit); only the placeholders do, and only as their first or last part.
 */
export function bigramParts(term: string): [string, string] | null {
  if (PLACEHOLDER_LABELS.has(term)) return null;
  for (const p of PLACEHOLDER_LABELS.keys()) {
    if (term.startsWith(p) && term.charAt(p.length) === BIGRAM_JOINER) return [p, term.slice(p.length + 1)];
  }
  const i = term.indexOf(BIGRAM_JOINER);
  return i < 0 ? null : [term.slice(0, i), term.slice(i + 1)];
}

/** Length in code points (what a reader counts as characters, near enough). */
function codePointLength(s: string): number {
  let n = s.length;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c >= 0xdc00 && c <= 0xdfff) n--;
  }
  return n;
}

/**
 * Turns texts into term ids, interning spellings ("surfaces") and terms as it goes.
 * Term ids are dense from 0 in order of first appearance; ids 0–2 are the placeholders.
 */
export class TermEncoder {
  /** Term string of every unigram id; a bigram's entry is `''` (see {@link termString}). */
  readonly terms: string[] = [URL_TERM, EMAIL_TERM, NUMBER_TERM];
  /** Every distinct lower-cased spelling met, by surface id. */
  get surfaces(): readonly string[] {
    return this.surfaceTable.strings;
  }
  /** Term id of each surface, or -1 when it is dropped (stop word, too short). */
  surfaceTerm = new Int32Array(1024);
  /** Times each surface was kept: the most used one labels its term. */
  surfaceUses = new Uint32Array(1024);
  /** Left and right unigram term ids of each bigram term id (-1 for unigrams). */
  bigramLeft = new Int32Array(1024).fill(-1);
  bigramRight = new Int32Array(1024).fill(-1);
  /** The normalised text of the last {@link encode} call, which its spans index into. */
  lastText = '';

  private readonly surfaceTable = new SurfaceTable();
  private readonly termIndex = new Map<string, number>([[URL_TERM, URL_ID], [EMAIL_TERM, EMAIL_ID], [NUMBER_TERM, NUMBER_ID]]);
  private readonly pairIndex = new Map<number, number>();
  private readonly spans = new TokenSpans();

  /**
   * Id shared by every term outside a closed vocabulary, or -1 for an open encoder. Such a term
   * still counts as a kept word (it separates its neighbours, so they form no bigram), but it is
   * neither named nor interned: transforming new text against a fitted vocabulary meets many
   * spellings it will never use, and interning each one cost more than the rest of its lookup.
   */
  private readonly outsideId: number = -1;

  /**
   * @param options validated token options (see resolveTokenOptions).
   * @param vocabulary if given, the encoder is closed: these terms (and the placeholders) keep ids of
   *   their own, every other unigram gets one shared id, and a bigram with that id on either side gets
   *   it too. For vectorising against fitted columns; an open encoder (no vocabulary) names everything.
   */
  constructor(readonly options: TokenOptions, vocabulary?: readonly string[]) {
    if (vocabulary === undefined) return;
    // A bigram column needs ids for both its parts even when a part is no column itself (minDf,
    // maxDf and maxTerms prune unigrams and bigrams independently); its own id comes from the pair.
    for (const term of vocabulary) {
      const parts = bigramParts(term);
      if (parts === null) this.internTerm(term);
      else { this.internTerm(parts[0]); this.internTerm(parts[1]); }
    }
    this.outsideId = this.newTermId();
  }

  /** Number of distinct terms met so far. */
  get termCount(): number {
    return this.terms.length;
  }

  /** Number of distinct spellings met so far. */
  get surfaceCount(): number {
    return this.surfaceTable.size;
  }

  /** The term string of an id, building a bigram's string on demand. */
  termString(id: number): string {
    const l = this.bigramLeft[id];
    return l < 0 ? this.terms[id] : this.terms[l] + BIGRAM_JOINER + this.terms[this.bigramRight[id]];
  }

  /**
   * Appends the term ids of `text` to `out`: its unigrams in text order, then (with the
   * `bigrams` option) the bigram of each pair of adjacent kept unigrams.
   * @param spans if given, receives `start, end` into {@link lastText} for each unigram appended.
   * @returns the number of unigrams appended.
   */
  encode(text: string, out: IdBuffer, spans?: IdBuffer): number {
    // NFKC folds compatibility forms (ligatures, full-width letters, superscripts) into plain ones;
    // toLowerCase after it is our case folding (it keeps ß and final sigma, unlike full folding).
    // ASCII is its own NFKC form, and a native regex finds that out faster than ICU's check does.
    const s = (NON_ASCII.test(text) ? text.normalize('NFKC') : text).toLowerCase();
    this.lastText = s;
    // A huge text gets spans of its own, so the encoder (often long-lived) does not keep them.
    const sp = s.length > LARGE_TEXT ? new TokenSpans() : this.spans;
    const n = scanTokens(s, sp);
    const bigrams = this.options.bigrams;
    out.reserve(bigrams ? 2 * n : n);
    const data = out.data;
    const base = out.length;
    let len = base;
    const { start, end, kind, hash } = sp;
    const table = this.surfaceTable;
    let surfaceTerm = this.surfaceTerm, surfaceUses = this.surfaceUses;
    for (let k = 0; k < n; k++) {
      const kd = kind[k];
      let t: number;
      if (kd === TOKEN_NUMBER) t = NUMBER_ID;
      else if (kd === TOKEN_URL) t = URL_ID;
      else if (kd === TOKEN_EMAIL) t = EMAIL_ID;
      else {
        const a = start[k], b = end[k];
        if (b - a > MAX_WORD_LENGTH) continue;
        const h = kd === TOKEN_CJK || kd === TOKEN_SEGMENTED_WORD ? spanHash(s, a, b) : hash[k];
        let sid = table.find(s, a, b, h);
        if (sid < 0) {
          sid = this.addSurface(s, a, b, h, kd);
          surfaceTerm = this.surfaceTerm;
          surfaceUses = this.surfaceUses;
        }
        t = surfaceTerm[sid];
        if (t < 0) continue;
        surfaceUses[sid]++;
      }
      data[len++] = t;
      if (spans !== undefined) { spans.push(start[k]); spans.push(end[k]); }
    }
    const kept = len - base;
    // Bigram ids may grow the term tables but never `out`, which was reserved for them above.
    if (bigrams) for (let j = base; j + 1 < base + kept; j++) data[len++] = this.bigramId(data[j], data[j + 1]);
    out.length = len;
    return kept;
  }

  private addSurface(s: string, a: number, b: number, hash: number, kind: number): number {
    const sid = this.surfaceTable.add(s, a, b, hash);
    const raw = this.surfaceTable.strings[sid];
    if (sid >= this.surfaceTerm.length) {
      this.surfaceTerm = growInt32(this.surfaceTerm, sid + 1);
      this.surfaceUses = growUint32(this.surfaceUses, sid + 1);
    }
    this.surfaceTerm[sid] = this.termOfSurface(raw, kind);
    return sid;
  }

  private termOfSurface(raw: string, kind: number): number {
    const o = this.options;
    if (kind === TOKEN_CJK) return this.internTerm(raw);
    const word = kind === TOKEN_EDITED_WORD ? cleanWord(raw) : raw;
    if (codePointLength(word) < o.minTokenLength) return -1;
    if (o.stopWords && ENGLISH_STOP_WORDS.has(word)) return -1;
    return this.internTerm(o.stem ? porterStem(word) : word);
  }

  private internTerm(term: string): number {
    let t = this.termIndex.get(term);
    if (t === undefined && this.outsideId >= 0) return this.outsideId;
    if (t === undefined) {
      t = this.newTermId();
      this.terms[t] = term;
      this.termIndex.set(term, t);
    }
    return t;
  }

  private bigramId(left: number, right: number): number {
    if (left === this.outsideId || right === this.outsideId) return this.outsideId;
    const key = left * PAIR_SHIFT + right;
    let t = this.pairIndex.get(key);
    if (t === undefined) {
      t = this.newTermId();
      this.terms[t] = '';
      this.bigramLeft[t] = left;
      this.bigramRight[t] = right;
      this.pairIndex.set(key, t);
    }
    return t;
  }

  private newTermId(): number {
    const t = this.terms.length;
    if (t >= PAIR_SHIFT) throw new RangeError(`More than ${PAIR_SHIFT} distinct terms; split the corpus or turn bigrams off`);
    if (t >= this.bigramLeft.length) {
      this.bigramLeft = growInt32(this.bigramLeft, t + 1, -1);
      this.bigramRight = growInt32(this.bigramRight, t + 1, -1);
    }
    this.terms.push('');
    return t;
  }
}
