import { IngestError } from './ingest-error.js';
import { LineBreakCounter } from './line-breaks.js';
import { PendingText } from './pending-text.js';

/** The source text of one top-level array element and the line it starts on. */
export interface JsonElement {
  line: number;
  source: string;
}

type Expect = 'open' | 'first' | 'after' | 'next' | 'done';

/**
 * Splits a top-level JSON array (RFC 8259) into the source text of its elements as the text
 * arrives, so a 200 MB array is never held whole: each element is found by bracket depth,
 * skipping strings, and handed on for `JSON.parse`. An element that is not valid JSON on its own
 * is the caller's to skip; a broken array structure (no `[`, a missing comma, text after the
 * final `]`, no final `]`) is an `unprocessable` IngestError with its line. A trailing comma
 * before `]` is tolerated.
 */
export class JsonArraySplitter {
  private readonly pending = new PendingText();
  private line = 1;
  private expect: Expect = 'open';
  private readonly breaks = new LineBreakCounter();

  /** @param maxRecordChars - longest element accepted before the input is refused */
  constructor(private readonly maxRecordChars: number) {}

  /**
   * Adds text and appends every element it completes to `out`.
   * @param final - true for the last call; the array must then be closed
   */
  feed(text: string, final: boolean, out: JsonElement[]): void {
    const s = this.pending.add(text, final);
    if (s === null) return;
    const left = this.pending.keep(s, this.split(s, final, out));
    if (left > this.maxRecordChars) {
      throw new IngestError(
        'unprocessable',
        `The JSON array element starting on line ${this.line} is longer than ${this.maxRecordChars} characters; ` +
          'check that its brackets and quotes are closed.',
        { line: this.line },
      );
    }
    if (final && this.expect !== 'done') {
      throw new IngestError(
        'unprocessable',
        this.expect === 'open'
          ? 'The JSON upload is empty: expected an array of objects ([{"text": "…"}, …]).'
          : `The JSON array is not closed: the file ends at line ${this.line} before the final "]". Is the upload cut short?`,
        { line: this.line },
      );
    }
  }

  private split(s: string, final: boolean, out: JsonElement[]): number {
    const n = s.length;
    let pos = 0;
    this.breaks.reset(s);
    for (;;) {
      let p = pos;
      while (p < n && isWhitespace(s.charCodeAt(p))) p++;
      if (p === n) {
        const keep = !final && p > pos && s.charCodeAt(p - 1) === 0x0d ? 1 : 0; // a CR that may precede LF
        this.line += this.breaks.count(pos, p - keep);
        return p - keep;
      }
      this.line += this.breaks.count(pos, p);
      pos = p;
      const c = s.charCodeAt(pos);
      switch (this.expect) {
        case 'open':
          if (c !== 0x5b) throw notAnArray(s, pos, this.line);
          pos++;
          this.expect = 'first';
          break;
        case 'first':
        case 'next':
          if (c === 0x5d) {
            pos++;
            this.expect = 'done';
            break;
          } else {
            const end = elementEnd(s, pos, final);
            if (end < 0) return pos;
            out.push({ line: this.line, source: s.slice(pos, end) });
            this.line += this.breaks.count(pos, end);
            pos = end;
            this.expect = 'after';
          }
          break;
        case 'after':
          if (c === 0x2c) this.expect = 'next';
          else if (c === 0x5d) this.expect = 'done';
          else throw structure(`line ${this.line}: expected "," or "]" after an array element, found ${describe(s, pos)}`, this.line);
          pos++;
          break;
        case 'done':
          throw structure(`line ${this.line}: there is more text after the end of the JSON array (${describe(s, pos)})`, this.line);
      }
    }
  }
}

function isWhitespace(c: number): boolean {
  return c === 0x20 || c === 0x0a || c === 0x0d || c === 0x09;
}

/** End (exclusive) of the element starting at `pos`, or -1 when more text is needed. */
function elementEnd(s: string, pos: number, final: boolean): number {
  const n = s.length;
  const c = s.charCodeAt(pos);
  if (c === 0x22) {
    const q = stringEnd(s, pos);
    return q < 0 ? (final ? n : -1) : q;
  }
  if (c === 0x7b || c === 0x5b) {
    let depth = 0;
    for (let i = pos; i < n; i++) {
      const d = s.charCodeAt(i);
      if (d === 0x22) {
        const q = stringEnd(s, i);
        if (q < 0) break;
        i = q - 1;
      } else if (d === 0x7b || d === 0x5b) depth++;
      else if (d === 0x7d || d === 0x5d) {
        if (--depth === 0) return i + 1;
      }
    }
    return final ? n : -1;
  }
  // A scalar (number, true, false, null) or stray text: up to the next separator. At least one
  // character is taken so a stray "}" cannot stall the splitter.
  for (let i = pos + 1; i < n; i++) {
    const d = s.charCodeAt(i);
    if (d === 0x2c || d === 0x5d || d === 0x7d || isWhitespace(d)) return i;
  }
  return final ? n : -1;
}

/** Index just past the closing quote of the string opening at `pos`, or -1 when not closed yet. */
function stringEnd(s: string, pos: number): number {
  let q = pos;
  for (;;) {
    q = s.indexOf('"', q + 1);
    if (q < 0) return -1;
    let backslashes = 0;
    while (s.charCodeAt(q - 1 - backslashes) === 0x5c) backslashes++;
    if (backslashes % 2 === 0) return q + 1;
  }
}

/** Quotes the character at `pos`; one character only, so the message does not depend on chunking. */
function describe(s: string, pos: number): string {
  return JSON.stringify(String.fromCodePoint(s.codePointAt(pos)!));
}

function structure(message: string, line: number): IngestError {
  return new IngestError('unprocessable', `The JSON array is malformed: ${message}.`, { line });
}

function notAnArray(s: string, pos: number, line: number): IngestError {
  const hint =
    s.charCodeAt(pos) === 0x7b
      ? ' It starts with "{": if it holds one object per line, upload it as NDJSON (format "ndjson" or a .ndjson file name).'
      : '';
  return new IngestError(
    'unprocessable',
    `A JSON upload must be an array of objects or strings ([{"text": "…"}, …]), but it starts with ${describe(s, pos)} on line ${line}.${hint}`,
    { line },
  );
}
