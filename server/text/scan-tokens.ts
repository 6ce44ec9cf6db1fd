/**
 * Finds the tokens of one normalised, lower-cased text as spans, without making strings.
 */
import { astralClass, bmpClass, CH_APOSTROPHE, CH_CJK, CH_DIGIT, CH_JOINER, CH_LETTER, CH_MARK, CH_SEGMENTED, CH_SURROGATE } from './char-class.js';

/** A run of letters and digits (combining marks inside). */
export const TOKEN_WORD = 1;
/** A word with an apostrophe or an invisible joiner in it, to be cleaned before use. */
export const TOKEN_EDITED_WORD = 2;
/** Digits only, maybe with `.`, `,` or `:` between digits ("3.14", "1,000", "12:30"). */
export const TOKEN_NUMBER = 3;
/** A web address (`http://`, `https://`, `ftp://` or `www.`). */
export const TOKEN_URL = 4;
/** An e-mail address. */
export const TOKEN_EMAIL = 5;
/** One or two adjacent Han/Hiragana/Katakana characters. */
export const TOKEN_CJK = 6;
/** A Thai, Lao, Khmer or Myanmar word found by dictionary segmentation. */
export const TOKEN_SEGMENTED_WORD = 7;

/** ICU's dictionary-based word breaker, for the scripts written without spaces (other than CJK). */
let segmenter: Intl.Segmenter | null = null;

/**
 * Output buffers of {@link scanTokens}: token `k` is `text.slice(start[k], end[k])` of kind
 * `kind[k]`; for words, `hash[k]` is its {@link spanHash} (computed while scanning, to save a pass).
 */
export class TokenSpans {
  start = new Int32Array(256);
  end = new Int32Array(256);
  kind = new Uint8Array(256);
  hash = new Int32Array(256);

  /** Makes room for `n` tokens (a text of length n has at most n tokens). */
  reserve(n: number): void {
    if (n <= this.start.length) return;
    const cap = Math.max(n, this.start.length * 2);
    this.start = new Int32Array(cap);
    this.end = new Int32Array(cap);
    this.kind = new Uint8Array(cap);
    this.hash = new Int32Array(cap);
  }
}

/** FNV-1a constants, as in surface-table.ts's spanHash. */
const FNV_OFFSET = 0x811c9dc5 | 0;
const FNV_PRIME = 0x01000193;

/** The rest of a web address after its scheme or "www.", up to a space or a character URLs never hold unescaped. */
const URL_REST = /[^\s<>"'`{}|\\^[\]]+/y;
/** A domain after "@": labels of up to 63 letters, digits or hyphens (RFC 1035), at least two. */
const DOMAIN = /[\p{L}\p{N}-]{1,63}(?:\.[\p{L}\p{N}-]{1,63})+/uy;
const TRAILING_PUNCTUATION = /[.,;:!?)\]'"]+$/;
/** Longest local part of an e-mail address (RFC 5321). */
const MAX_LOCAL_PART = 64;

function isWordUnit(c: number): boolean {
  const k = bmpClass(c);
  return k === CH_LETTER || k === CH_DIGIT || k === CH_CJK || k === CH_MARK;
}

/** Whether `c` may appear in the local part of an e-mail address as we read it. */
function isLocalPartUnit(c: number): boolean {
  return c === 0x2e || c === 0x5f || c === 0x25 || c === 0x2b || c === 0x2d || isWordUnit(c);
}

/** Web addresses as `[start, end]` pairs: "http://", "https://", "ftp://" or "www." at a word start, then non-space. */
function findUrls(s: string, out: number[]): void {
  let from = 0, sep = -2, www = -2;
  for (;;) {
    // Each marker is searched again only once the scan has passed it, keeping the search linear.
    if (sep !== -1 && sep < from) sep = s.indexOf('://', from);
    if (www !== -1 && www < from) www = s.indexOf('www.', from);
    if (sep < 0 && www < 0) return;
    let a = -1, restAt = 0;
    if (sep >= 0 && (www < 0 || sep < www)) {
      const scheme = sep >= 5 && s.startsWith('https', sep - 5) ? sep - 5 : sep >= 4 && s.startsWith('http', sep - 4) ? sep - 4 : sep >= 3 && s.startsWith('ftp', sep - 3) ? sep - 3 : -1;
      if (scheme >= 0 && (scheme === 0 || !isWordUnit(s.charCodeAt(scheme - 1)))) { a = scheme; restAt = sep + 3; }
      from = sep + 3;
    } else {
      if (www === 0 || !isWordUnit(s.charCodeAt(www - 1))) { a = www; restAt = www + 4; }
      from = www + 4;
    }
    if (a < 0) continue;
    URL_REST.lastIndex = restAt;
    const m = URL_REST.exec(s);
    if (m === null) continue;
    const end = restAt + m[0].replace(TRAILING_PUNCTUATION, '').length;
    if (end > restAt) { out.push(a, end, TOKEN_URL); from = Math.max(from, end); }
  }
}

/**
 * E-mail addresses, searched from each "@" (backwards over at most 64 local-part characters,
 * forwards over a domain), so the cost is linear in the text however few addresses it holds.
 */
function findEmails(s: string, urls: readonly number[], out: number[]): void {
  let from = 0;
  for (let at = s.indexOf('@'); at >= 0; at = s.indexOf('@', from)) {
    from = at + 1;
    let a = at;
    while (a > 0 && at - a < MAX_LOCAL_PART && isLocalPartUnit(s.charCodeAt(a - 1))) a--;
    if (a === at) continue;
    DOMAIN.lastIndex = at + 1;
    const m = DOMAIN.exec(s);
    if (m === null) continue;
    const b = at + 1 + m[0].length;
    let inside = false;
    for (let u = 0; u < urls.length && !inside; u += 3) inside = a < urls[u + 1] && b > urls[u];
    if (!inside) out.push(a, b, TOKEN_EMAIL);
    from = b;
  }
}

/** Web and e-mail addresses as `[start, end, kind]` triples in text order. */
function findAddresses(s: string): number[] {
  const urls: number[] = [];
  findUrls(s, urls);
  const emails: number[] = [];
  if (s.includes('@')) findEmails(s, urls, emails);
  if (emails.length === 0) return urls;
  if (urls.length === 0) return emails;
  // Both lists are in text order and do not overlap (an address inside a web address is dropped): merge them.
  const merged: number[] = [];
  let u = 0, e = 0;
  while (u < urls.length || e < emails.length) {
    const list = e >= emails.length || (u < urls.length && urls[u] <= emails[e]) ? urls : emails;
    const at = list === urls ? u : e;
    merged.push(list[at], list[at + 1], list[at + 2]);
    if (list === urls) u += 3; else e += 3;
  }
  return merged;
}

/**
 * Splits `s` (already NFKC-normalised and lower-cased) into token spans.
 * - Words are runs of letters and digits in any script; combining marks stay inside a word.
 *   An apostrophe between two letters stays inside ("don't"); hyphens and other punctuation split.
 * - Runs of digits with `.`, `,` or `:` between digits are one number token.
 * - Han, Hiragana and Katakana have no spaces between words, so a run of them becomes its
 *   overlapping character bigrams ("東京都" → "東京", "京都"); a lone character stands alone.
 * - Thai, Lao, Khmer and Myanmar runs are split into words by ICU's dictionaries (Intl.Segmenter).
 * - Web and e-mail addresses are single tokens; everything else (emoji included) separates tokens.
 * @param out receives the spans; grown as needed.
 * @returns the number of tokens.
 */
export function scanTokens(s: string, out: TokenSpans): number {
  const len = s.length;
  out.reserve(len + 1);
  const { start, end, kind, hash } = out;
  const addresses = s.includes('@') || s.includes('://') || s.includes('www.') ? findAddresses(s) : null;
  let nextAddress = addresses !== null && addresses.length > 0 ? addresses[0] : len;
  let a = 0;
  let n = 0;
  let i = 0;
  while (i < len) {
    if (i === nextAddress && addresses !== null) {
      start[n] = addresses[a];
      end[n] = addresses[a + 1];
      kind[n++] = addresses[a + 2];
      i = addresses[a + 1];
      a += 3;
      nextAddress = a < addresses.length ? addresses[a] : len;
      continue;
    }
    let c = s.charCodeAt(i);
    // Spaces and ASCII punctuation between words are most of what is not a word: skip them on a range test.
    if (c < 0x80 && (c < 0x30 || (c > 0x39 && c < 0x41) || (c > 0x5a && c < 0x61) || c > 0x7a)) { i++; continue; }
    let w = 1;
    let k = bmpClass(c);
    if (k === CH_SURROGATE) {
      c = s.codePointAt(i)!;
      if (c > 0xffff) { w = 2; k = astralClass(c); } else k = 0;
    }
    if (k === CH_LETTER || k === CH_DIGIT) {
      const from = i;
      let digitsOnly = k === CH_DIGIT;
      let separated = false;
      let edited = false;
      let h = Math.imul(FNV_OFFSET ^ s.charCodeAt(i), FNV_PRIME);
      if (w === 2) h = Math.imul(h ^ s.charCodeAt(i + 1), FNV_PRIME);
      i += w;
      while (i < nextAddress) {
        let d = s.charCodeAt(i);
        // Lower-case a–z is nearly every character of a word: a range test, no table, no branches on class.
        if (d >= 0x61 && d <= 0x7a) {
          if (separated) break;
          digitsOnly = false;
          h = Math.imul(h ^ d, FNV_PRIME);
          i++;
          continue;
        }
        const unit = d;
        let dw = 1;
        let dk = bmpClass(d);
        if (dk === CH_SURROGATE) {
          d = s.codePointAt(i)!;
          if (d > 0xffff) { dw = 2; dk = astralClass(d); } else dk = 0;
        }
        if (dk === CH_DIGIT || dk === CH_LETTER || dk === CH_MARK) {
          if (dk !== CH_DIGIT) {
            if (separated) break;
            if (dk === CH_LETTER) digitsOnly = false;
          }
        } else if (dk === CH_APOSTROPHE) {
          if (digitsOnly || i + 1 >= nextAddress || bmpClass(s.charCodeAt(i + 1)) !== CH_LETTER) break;
          edited = true;
        } else if (dk === CH_JOINER) {
          if (separated) break;
          edited = true;
        } else if (digitsOnly && (d === 0x2e || d === 0x2c || d === 0x3a) && i + 1 < nextAddress && bmpClass(s.charCodeAt(i + 1)) === CH_DIGIT) {
          separated = true;
        } else break;
        h = Math.imul(h ^ unit, FNV_PRIME);
        if (dw === 2) h = Math.imul(h ^ s.charCodeAt(i + 1), FNV_PRIME);
        i += dw;
      }
      start[n] = from;
      end[n] = i;
      hash[n] = h;
      kind[n++] = digitsOnly ? TOKEN_NUMBER : edited ? TOKEN_EDITED_WORD : TOKEN_WORD;
    } else if (k === CH_CJK) {
      // Overlapping bigrams: each token spans from the previous character's start to this one's end.
      let prev = i;
      i += w;
      let single = true;
      while (i < nextAddress) {
        let d = s.charCodeAt(i);
        let dw = 1;
        let dk = bmpClass(d);
        if (dk === CH_SURROGATE) {
          d = s.codePointAt(i)!;
          if (d > 0xffff) { dw = 2; dk = astralClass(d); } else dk = 0;
        }
        if (dk === CH_MARK) { i += dw; continue; }
        if (dk !== CH_CJK) break;
        start[n] = prev;
        end[n] = i + dw;
        kind[n++] = TOKEN_CJK;
        single = false;
        prev = i;
        i += dw;
      }
      if (single) {
        start[n] = prev;
        end[n] = i;
        kind[n++] = TOKEN_CJK;
      }
    } else if (k === CH_SEGMENTED) {
      const from = i;
      i += w;
      while (i < nextAddress) {
        const dk = bmpClass(s.charCodeAt(i));
        if (dk !== CH_SEGMENTED && dk !== CH_MARK) break;
        i++;
      }
      segmenter ??= new Intl.Segmenter(undefined, { granularity: 'word' });
      for (const seg of segmenter.segment(s.slice(from, i))) {
        if (!seg.isWordLike) continue;
        start[n] = from + seg.index;
        end[n] = from + seg.index + seg.segment.length;
        kind[n++] = TOKEN_SEGMENTED_WORD;
      }
    } else i += w;
  }
  return n;
}
