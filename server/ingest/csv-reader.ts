import { CsvSplitter, type CsvRecord } from './csv-splitter.js';
import type { DocumentBuilder } from './document-builder.js';
import { findField, listFields, setField } from './field-match.js';
import { IngestError } from './ingest-error.js';
import type { ParseOptions } from './parse-options.js';
import type { RecordReader } from './record-reader.js';

/**
 * Reads CSV with a header row. Each row becomes a document: the text column is the text, the id
 * column (if any) the id, every other column a string in `meta`.
 *
 * Rows whose field count differs from the header's: a short row is padded with empty fields and
 * kept with a warning (exporters drop trailing empty cells); a long row is skipped, since an extra
 * field usually means a delimiter inside an unquoted text and any guess would misplace data —
 * unless the extra fields are all empty (trailing delimiters), which are dropped silently.
 */
export class CsvReader implements RecordReader {
  private readonly splitter: CsvSplitter;
  private readonly records: CsvRecord[] = [];
  private header: string[] | null = null;
  private textColumn = -1;
  private idColumn = -1;
  private rows = 0;

  /**
   * @param opts - resolved parse options
   * @param builder - receives the documents
   * @param delimiter - the field separator
   */
  constructor(
    private readonly opts: ParseOptions,
    private readonly builder: DocumentBuilder,
    delimiter: string,
  ) {
    this.splitter = new CsvSplitter(delimiter, opts.maxRecordChars);
    builder.delimiter = delimiter;
  }

  feed(text: string, final: boolean): void {
    this.splitter.feed(text, final, this.records);
    for (const record of this.records) {
      if (this.header === null) this.readHeader(record);
      else this.readRow(record);
    }
    this.records.length = 0;
    if (final && this.header !== null && this.rows === 0) {
      throw new IngestError('unprocessable', 'The CSV has a header row but no rows under it.', { fields: this.header });
    }
  }

  private readHeader(record: CsvRecord): void {
    if (record.unclosedQuote) {
      throw new IngestError('unprocessable', 'The CSV header row (line 1) opens a quote that is never closed.', { line: record.line });
    }
    const names: string[] = [];
    const seen = new Set<string>();
    record.fields.forEach((raw, i) => {
      let name = raw.trim();
      if (name === '') {
        name = `column_${i + 1}`;
        this.builder.warn(record.line, `column ${i + 1} has no name in the header; it is called "${name}"`);
      }
      if (seen.has(name)) {
        let k = 2;
        while (seen.has(`${name}_${k}`)) k++;
        this.builder.warn(record.line, `column ${i + 1} repeats the name "${name}"; it is called "${name}_${k}"`);
        name = `${name}_${k}`;
      }
      seen.add(name);
      names.push(name);
    });
    this.textColumn = findField(names, this.opts.textField);
    if (this.textColumn < 0) {
      throw new IngestError(
        'unprocessable',
        `The CSV has no column "${this.opts.textField}". Its columns are ${listFields(names)}: choose the one that holds the text (textField).`,
        { field: this.opts.textField, fields: names },
      );
    }
    if (this.opts.idField !== undefined) {
      this.idColumn = findField(names, this.opts.idField);
      if (this.idColumn < 0) {
        throw new IngestError(
          'unprocessable',
          `The CSV has no column "${this.opts.idField}" for ids. Its columns are ${listFields(names)}: choose one (idField) or leave idField out to number rows by position.`,
          { field: this.opts.idField, fields: names },
        );
      }
    }
    this.header = names;
    this.builder.declareFields(names.filter((_, i) => i !== this.textColumn && i !== this.idColumn));
  }

  private readRow(record: CsvRecord): void {
    this.rows++;
    const header = this.header!;
    const fields = record.fields;
    if (record.unclosedQuote) {
      this.builder.skipRecord(
        record.line,
        'a quote (") opened on this row is never closed, so the rest of the file was read into one field; close the quote or double the quotes inside it',
      );
      return;
    }
    if (fields.length > header.length && fields.slice(header.length).some((f) => f !== '')) {
      this.builder.skipRecord(
        record.line,
        `the row has ${fields.length} fields but the header has ${header.length}; a delimiter inside an unquoted field? Quote that field`,
      );
      return;
    }
    const short = fields.length < header.length;
    const meta: Record<string, unknown> = {};
    for (let i = 0; i < header.length; i++) {
      if (i !== this.textColumn && i !== this.idColumn) setField(meta, header[i]!, fields[i] ?? '');
    }
    const kept = this.builder.add(
      record.line,
      fields[this.textColumn] ?? '',
      this.idColumn >= 0 ? (fields[this.idColumn] ?? '') : undefined,
      meta,
    );
    if (kept && short) {
      this.builder.warn(record.line, `the row has ${fields.length} of the header's ${header.length} fields; the missing ones were left empty`);
    }
  }
}
