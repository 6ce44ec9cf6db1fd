/**
 * Interning of substrings without making strings: a token is looked up by its span in the text,
 * so only a spelling never seen before becomes a string. With Zipfian vocabularies almost every
 * lookup is a hit, and this saves one allocation and one string hash per token.
 */

/** FNV-1a hash of the UTF-16 code units `s[start .. end)`. */
export function spanHash(s: string, start: number, end: number): number {
  let h = 0x811c9dc5 | 0;
  for (let i = start; i < end; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x01000193);
  return h;
}

/** V8's SlicedString::kMinLength: a slice at least this long is a view into its parent string. */
const SHORT_SLICE = 13;

/** Int32 fields per slot: hash, id + 1 (0 = empty), offset of the characters, length. */
const SLOT = 4;

/** A set of strings, numbered from 0 in order of insertion, found by span and hash. */
export class SurfaceTable {
  /** The strings, by id. */
  readonly strings: string[] = [];
  /**
   * Open addressing with linear probing. A slot holds everything a probe needs side by side,
   * so a lookup touches one slot and the characters, not four separate arrays.
   */
  private slots = new Int32Array(4096 * SLOT);
  private capacity = 4096;
  /** The strings' code units back to back: comparing against a typed array is fast. */
  private chars = new Uint16Array(16384);
  private used = 0;

  /** Number of strings held. */
  get size(): number {
    return this.strings.length;
  }

  /** Id of the string equal to `s[start .. end)` (whose {@link spanHash} is `hash`), or -1. */
  find(s: string, start: number, end: number, hash: number): number {
    const len = end - start;
    const { slots, chars } = this;
    const mask = this.capacity - 1;
    for (let p = hash & mask; ; p = (p + 1) & mask) {
      const q = p * SLOT;
      const id1 = slots[q + 1];
      if (id1 === 0) return -1;
      if (slots[q] !== hash || slots[q + 3] !== len) continue;
      const from = slots[q + 2];
      let i = 0;
      while (i < len && chars[from + i] === s.charCodeAt(start + i)) i++;
      if (i === len) return id1 - 1;
    }
  }

  /**
   * Adds `s[start .. end)`, known to be absent, with its hash; returns its id. The stored string
   * is a fresh copy, so it does not keep the whole text alive.
   */
  add(s: string, start: number, end: number, hash: number): number {
    const id = this.strings.length;
    const len = end - start;
    const from = this.used;
    if (from + len > this.chars.length) {
      const next = new Uint16Array(Math.max(from + len, this.chars.length * 2));
      next.set(this.chars);
      this.chars = next;
    }
    for (let i = 0; i < len; i++) this.chars[from + i] = s.charCodeAt(start + i);
    this.used += len;
    // A copy that shares no memory with `s`: V8 copies slices shorter than 13 code units (longer ones
    // would point into the whole text), so only longer words are built from their code units.
    this.strings.push(len < SHORT_SLICE ? s.slice(start, end) : String.fromCharCode.apply(null, this.chars.subarray(from, from + len) as unknown as number[]));
    if (2 * (id + 1) > this.capacity) this.rehash(this.capacity * 2);
    this.place(hash, id, from, len);
    return id;
  }

  private place(hash: number, id: number, from: number, len: number): void {
    const { slots } = this;
    const mask = this.capacity - 1;
    let p = hash & mask;
    while (slots[p * SLOT + 1] !== 0) p = (p + 1) & mask;
    const q = p * SLOT;
    slots[q] = hash;
    slots[q + 1] = id + 1;
    slots[q + 2] = from;
    slots[q + 3] = len;
  }

  private rehash(capacity: number): void {
    const old = this.slots;
    this.slots = new Int32Array(capacity * SLOT);
    this.capacity = capacity;
    for (let q = 0; q < old.length; q += SLOT) if (old[q + 1] !== 0) this.place(old[q], old[q + 1] - 1, old[q + 2], old[q + 3]);
  }
}
