import type { UploadFormat } from './api.js';
import { CsvSplitter, type CsvRecord } from './csv-splitter.js';
import type { ParseOptions } from './parse-options.js';
import { sniffDelimiter } from './sniff-delimiter.js';

/** A format and, for CSV, its delimiter. */
export interface DetectedFormat {
  format: UploadFormat;
  delimiter?: string;
}

const BY_EXTENSION: Readonly<Record<string, UploadFormat | 'json-family' | 'tsv'>> = {
  csv: 'csv',
  tsv: 'tsv',
  tab: 'tsv',
  ndjson: 'ndjson',
  jsonl: 'ndjson',
  jsonlines: 'ndjson',
  ldjson: 'ndjson',
  json: 'json-family',
  txt: 'text',
  text: 'text',
};

const BY_CONTENT_TYPE: Readonly<Record<string, UploadFormat | 'json-family' | 'tsv'>> = {
  'text/csv': 'csv',
  'application/csv': 'csv',
  'text/comma-separated-values': 'csv',
  'text/tab-separated-values': 'tsv',
  'application/x-ndjson': 'ndjson',
  'application/ndjson': 'ndjson',
  'application/jsonl': 'ndjson',
  'application/x-jsonlines': 'ndjson',
  'application/jsonlines': 'ndjson',
  'application/json': 'json-family',
  'text/json': 'json-family',
};

/**
 * Decides how to read an upload (see {@link ParseOptions.format} for the rules).
 * @param head - the first decoded text of the upload (a few lines are enough)
 * @param opts - format, fileName, contentType, textField and delimiter
 * @param complete - true when `head` is the whole upload
 */
export function detectFormat(
  head: string,
  opts: Pick<ParseOptions, 'format' | 'fileName' | 'contentType' | 'textField' | 'delimiter'>,
  complete: boolean,
): DetectedFormat {
  const hint = opts.format !== 'auto' ? opts.format : (fromName(opts.fileName) ?? fromContentType(opts.contentType));
  const tabHint = fromName(opts.fileName) === 'tsv' || fromContentType(opts.contentType) === 'tsv';
  switch (hint) {
    case 'csv':
      return { format: 'csv', delimiter: opts.delimiter ?? (tabHint ? '\t' : sniffDelimiter(head, opts.textField)) };
    case 'tsv':
      return { format: 'csv', delimiter: opts.delimiter ?? '\t' };
    case 'ndjson':
    case 'json':
    case 'text':
      return { format: hint };
    case 'json-family':
      return { format: firstChar(head) === '{' ? 'ndjson' : 'json' };
    case undefined:
      return sniff(head, opts.textField, complete, opts.delimiter);
  }
}

function fromName(fileName: string | undefined): UploadFormat | 'json-family' | 'tsv' | undefined {
  const dot = fileName?.lastIndexOf('.') ?? -1;
  if (fileName === undefined || dot < 0) return undefined;
  return BY_EXTENSION[fileName.slice(dot + 1).toLowerCase()];
}

function fromContentType(contentType: string | undefined): UploadFormat | 'json-family' | 'tsv' | undefined {
  if (contentType === undefined) return undefined;
  return BY_CONTENT_TYPE[contentType.split(';')[0]!.trim().toLowerCase()];
}

function firstChar(head: string): string {
  const m = /\S/.exec(head);
  return m ? m[0] : '';
}

/** Reads the content when neither name nor type settles it. */
function sniff(head: string, textField: string, complete: boolean, given: string | undefined): DetectedFormat {
  const c = firstChar(head);
  if (c === '[') return { format: 'json' };
  if (c === '{') return { format: 'ndjson' };
  const delimiter = given ?? sniffDelimiter(head, textField);
  const records: CsvRecord[] = [];
  new CsvSplitter(delimiter, Number.MAX_SAFE_INTEGER).feed(head, complete, records);
  const header = records[0];
  if (header === undefined) return { format: 'text' };
  const wanted = textField.trim().toLowerCase();
  if (header.fields.some((f) => f.trim().toLowerCase() === wanted)) return { format: 'csv', delimiter };
  // No column named like the text field: call it CSV only when it clearly is a table, so that a
  // plain text file with commas is not cut into columns.
  const names = header.fields.map((f) => f.trim());
  const table =
    names.length >= 2 &&
    records.length >= 2 &&
    records.slice(1).every((r) => r.fields.length === names.length) &&
    names.every((f) => f.length > 0 && f.length <= 64) &&
    new Set(names).size === names.length;
  return table ? { format: 'csv', delimiter } : { format: 'text' };
}
