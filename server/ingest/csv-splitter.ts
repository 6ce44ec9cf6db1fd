import { IngestError } from './ingest-error.js';
import { LineBreakCounter } from './line-breaks.js';
import { PendingText } from './pending-text.js';

const QUOTE = 0x22;
const CR = 0x0d;
const LF = 0x0a;

/** One CSV record and where it starts. */
export interface CsvRecord {
  /** 1-based physical line on which the record starts. */
  line: number;
  fields: string[];
  /** True when the input ended inside a quoted field, so the last field ran to the end of the file. */
  unclosedQuote: boolean;
}

/**
 * Splits CSV text into records as it arrives, per RFC 4180 §2: fields separated by the
 * delimiter, records by CRLF (LF or a lone CR are accepted too), fields optionally enclosed in
 * double quotes, inside which the delimiter, line breaks and doubled quotes (`""` → `"`) are
 * data. Lenient where the RFC is silent, as Python's csv module is: a quote inside an unquoted
 * field is data, text after a closing quote is appended to the field. Entirely empty lines are
 * not records.
 */
export class CsvSplitter {
  private readonly pending = new PendingText();
  private line = 1;
  private readonly breaks = new LineBreakCounter();

  /**
   * @param delimiter - the field separator, one character
   * @param maxRecordChars - longest record accepted before the input is refused
   */
  constructor(
    readonly delimiter: string,
    private readonly maxRecordChars: number,
  ) {
    if (delimiter.length !== 1 || delimiter === '"' || delimiter === '\r' || delimiter === '\n') {
      throw new RangeError(`the CSV delimiter must be one character other than a quote or line break; got ${JSON.stringify(delimiter)}`);
    }
  }

  /**
   * Adds text and appends every record it completes to `out`.
   * @param text - the next piece of the input
   * @param final - true for the last call; the pending record is then completed as it stands
   */
  feed(text: string, final: boolean, out: CsvRecord[]): void {
    const s = this.pending.add(text, final);
    if (s === null) return;
    const left = this.pending.keep(s, this.split(s, final, out));
    if (left > this.maxRecordChars) {
      throw new IngestError(
        'unprocessable',
        `The CSV row starting on line ${this.line} is longer than ${this.maxRecordChars} characters. ` +
          'A quote (") that is never closed is the usual cause: check that row, or quote the field and double the quotes inside it.',
        { line: this.line },
      );
    }
  }

  /** Parses complete records from `s`, returns how many characters were consumed. */
  private split(s: string, final: boolean, out: CsvRecord[]): number {
    const n = s.length;
    const delim = this.delimiter.charCodeAt(0);
    let pos = 0;
    let line = this.line;
    let recordStart = 0;
    let recordLine = line;
    let incomplete = false;
    const breaks = this.breaks;
    breaks.reset(s);
    records: while (pos < n) {
      recordStart = pos;
      recordLine = line;
      const c0 = s.charCodeAt(pos);
      if (c0 === LF || c0 === CR) {
        // An empty line: no record. A CR at the very end may be the first half of a CRLF.
        if (c0 === CR && pos + 1 === n && !final) {
          incomplete = true;
          break;
        }
        pos += c0 === CR && s.charCodeAt(pos + 1) === LF ? 2 : 1;
        line++;
        continue;
      }
      const fields: string[] = [];
      let unclosedQuote = false;
      for (;;) {
        let value: string;
        if (s.charCodeAt(pos) === QUOTE) {
          let p = pos + 1;
          value = '';
          for (;;) {
            const q = s.indexOf('"', p);
            if (q < 0) {
              if (!final) {
                incomplete = true; // wait for the closing quote
                break records;
              }
              value += s.slice(p);
              line += breaks.count(p, n);
              p = n;
              unclosedQuote = true;
              break;
            }
            value += s.slice(p, q);
            line += breaks.count(p, q);
            if (q + 1 < n && s.charCodeAt(q + 1) === QUOTE) {
              value += '"';
              p = q + 2;
              continue;
            }
            if (q + 1 === n && !final) {
              incomplete = true; // it could be the first half of a doubled quote
              break records;
            }
            p = q + 1;
            break;
          }
          pos = p;
          // Text between the closing quote and the next delimiter is kept, as Python's csv module does.
          const end = fieldEnd(s, pos, delim);
          if (end > pos) {
            value += s.slice(pos, end);
            pos = end;
          }
        } else {
          const end = fieldEnd(s, pos, delim);
          value = s.slice(pos, end);
          pos = end;
        }
        fields.push(value);
        if (pos >= n) {
          if (!final) {
            incomplete = true;
            break records;
          }
          break;
        }
        const c = s.charCodeAt(pos);
        if (c === delim) {
          pos++;
          if (pos >= n) {
            if (!final) {
              incomplete = true;
              break records;
            }
            fields.push('');
            break;
          }
          continue;
        }
        // c is CR or LF: the record ends here.
        if (c === CR) {
          if (pos + 1 === n && !final) {
            incomplete = true;
            break records;
          }
          pos += s.charCodeAt(pos + 1) === LF ? 2 : 1;
        } else pos++;
        line++;
        break;
      }
      out.push({ line: recordLine, fields, unclosedQuote });
    }
    if (incomplete) {
      pos = recordStart;
      line = recordLine;
    }
    this.line = line;
    return pos;
  }
}

/** Position of the next delimiter, CR or LF at or after `from`, or `s.length`. */
function fieldEnd(s: string, from: number, delim: number): number {
  const n = s.length;
  for (let i = from; i < n; i++) {
    const c = s.charCodeAt(i);
    if (c === delim || c === LF || c === CR) return i;
  }
  return n;
}
