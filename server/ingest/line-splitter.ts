import { IngestError } from './ingest-error.js';

/** One physical line and its 1-based number. */
export interface NumberedLine {
  line: number;
  text: string;
}

/**
 * Splits text into lines as it arrives. LF, CRLF and a lone CR all end a line; the terminator is
 * not part of the line. A last line without a terminator is still a line.
 */
export class LineSplitter {
  private pending = '';
  private line = 1;

  /**
   * @param maxLineChars - longest line accepted before the input is refused
   * @param what - how the refusal names a line, e.g. "NDJSON line"
   */
  constructor(
    private readonly maxLineChars: number,
    private readonly what: string,
  ) {}

  /**
   * Adds text and appends every line it completes to `out`.
   * @param final - true for the last call; the pending text is then a line of its own
   */
  feed(text: string, final: boolean, out: NumberedLine[]): void {
    const s = this.pending.length > 0 ? this.pending + text : text;
    const n = s.length;
    let pos = 0;
    // The pending text holds no terminator except perhaps a CR at its end, so search only the new text.
    const from = Math.max(0, this.pending.length - 1);
    let lf = s.indexOf('\n', from);
    let cr = s.indexOf('\r', from);
    for (;;) {
      if (lf >= 0 && lf < pos) lf = s.indexOf('\n', pos);
      if (cr >= 0 && cr < pos) cr = s.indexOf('\r', pos);
      const end = lf < 0 ? cr : cr < 0 ? lf : Math.min(lf, cr);
      if (end < 0) break;
      if (end === cr && end + 1 === n && !final) break; // maybe half of a CRLF
      out.push({ line: this.line++, text: s.slice(pos, end) });
      pos = end === cr && s.charCodeAt(end + 1) === 0x0a ? end + 2 : end + 1;
    }
    this.pending = pos === 0 ? s : s.slice(pos);
    if (final) {
      if (this.pending.length > 0) out.push({ line: this.line++, text: this.pending });
      this.pending = '';
    } else if (this.pending.length > this.maxLineChars) {
      throw new IngestError(
        'unprocessable',
        `${this.what} ${this.line} is longer than ${this.maxLineChars} characters; split the input into one record per line.`,
        { line: this.line },
      );
    }
  }
}
