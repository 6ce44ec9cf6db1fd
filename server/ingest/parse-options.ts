import type { UploadFormat } from './api.js';

/** How uploaded bytes are read. */
export interface ParseOptions {
  /**
   * The input format. `'auto'` picks it from the file name extension (`.csv`, `.tsv`, `.ndjson`,
   * `.jsonl`, `.json`, `.txt`), else from a specific content type (`text/csv`,
   * `application/x-ndjson`, `application/json`, …), else from the first bytes: `[` → JSON array,
   * `{` → NDJSON, a header row that names `textField` or splits like the rows under it → CSV,
   * anything else → plain text. A `.json` file or JSON content type whose first character is `{`
   * is read as NDJSON.
   * @default 'auto'
   */
  format: UploadFormat | 'auto';
  /** The uploaded file's name, used by `'auto'`. @default undefined */
  fileName?: string;
  /** The upload's content type, used by `'auto'`. @default undefined */
  contentType?: string;
  /**
   * The column (CSV) or key (JSON, NDJSON) holding the text. CSV headers also match when they
   * differ only in case or surrounding spaces, because spreadsheets often write `Text`.
   * @default 'text'
   */
  textField: string;
  /**
   * The column or key holding document ids. When unset, ids are the 1-based position of the
   * record in the input (`"1"`, `"2"`, …), counting skipped records too, so an id always points at
   * the same record of the file whatever else was skipped. Ids must be unique.
   * @default undefined
   */
  idField?: string;
  /**
   * CSV only: the field delimiter, one character other than a quote or line break. When unset it
   * is tab for `.tsv` files and `text/tab-separated-values`, else sniffed from the header row
   * (see `sniffDelimiter`: comma, semicolon or tab).
   * @default undefined
   */
  delimiter?: string;
  /** Longer texts are cut to this many UTF-16 code units, with a warning per cut document. @default 2_000_000 */
  maxDocumentChars: number;
  /**
   * One record (a CSV row, an NDJSON line, a JSON array element) longer than this many characters
   * stops the upload: it almost always means a quote that is never closed.
   * @default 16_000_000
   */
  maxRecordChars: number;
  /** Documents per yielded batch. @default 1000 */
  batchSize: number;
  /** At most this many skipped lines and this many warnings are listed (all are counted). @default 1000 */
  maxReported: number;
}

/** Defaults of {@link ParseOptions}. */
export const DEFAULT_PARSE_OPTIONS: Readonly<ParseOptions> = Object.freeze({
  format: 'auto',
  textField: 'text',
  maxDocumentChars: 2_000_000,
  maxRecordChars: 16_000_000,
  batchSize: 1000,
  maxReported: 1000,
});

const FORMATS: readonly string[] = ['auto', 'csv', 'ndjson', 'json', 'text'];

/**
 * Merges `opts` with {@link DEFAULT_PARSE_OPTIONS} and validates the result.
 * @throws TypeError or RangeError naming the bad option.
 */
export function resolveParseOptions(opts: Partial<ParseOptions> = {}): ParseOptions {
  const o: ParseOptions = { ...DEFAULT_PARSE_OPTIONS };
  for (const [key, value] of Object.entries(opts)) {
    if (value !== undefined) (o as unknown as Record<string, unknown>)[key] = value;
  }
  if (typeof o.format !== 'string' || !FORMATS.includes(o.format)) {
    throw new RangeError(`format must be one of ${FORMATS.join(', ')}; got ${JSON.stringify(o.format)}`);
  }
  if (typeof o.textField !== 'string' || o.textField.length === 0) {
    throw new TypeError('textField must be a non-empty string naming the column or key that holds the text');
  }
  if (o.idField !== undefined && (typeof o.idField !== 'string' || o.idField.length === 0)) {
    throw new TypeError('idField must be a non-empty string naming the column or key that holds the ids, or be left out');
  }
  if (o.idField !== undefined && o.idField === o.textField) {
    throw new RangeError(`idField and textField are both "${o.textField}"; ids and text must come from different fields`);
  }
  if (o.delimiter !== undefined && (typeof o.delimiter !== 'string' || o.delimiter.length !== 1 || '"\r\n'.includes(o.delimiter))) {
    throw new RangeError(`delimiter must be one character other than a quote or line break; got ${JSON.stringify(o.delimiter)}`);
  }
  for (const name of ['fileName', 'contentType'] as const) {
    if (o[name] !== undefined && typeof o[name] !== 'string') throw new TypeError(`${name} must be a string`);
  }
  positiveInteger('maxDocumentChars', o.maxDocumentChars);
  positiveInteger('maxRecordChars', o.maxRecordChars);
  positiveInteger('batchSize', o.batchSize);
  if (!Number.isInteger(o.maxReported) || o.maxReported < 0) {
    throw new RangeError(`maxReported must be an integer ≥ 0; got ${String(o.maxReported)}`);
  }
  return o;
}

function positiveInteger(name: string, value: unknown): void {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 1) {
    throw new RangeError(`${name} must be a positive integer; got ${String(value)}`);
  }
}
