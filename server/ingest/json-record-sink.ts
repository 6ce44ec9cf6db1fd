import type { DocumentBuilder } from './document-builder.js';
import { listFields, setField } from './field-match.js';
import { IngestError } from './ingest-error.js';
import type { ParseOptions } from './parse-options.js';

/** Keys remembered for the "no such field" message. */
const MAX_KEYS_NOTED = 200;

/**
 * Turns parsed JSON values (from NDJSON lines, array elements or a request body) into
 * documents. An object gives its `textField` as text, its `idField` as id and its other keys as
 * metadata (JSON values, unchanged); a string is a document with no metadata; anything else is
 * skipped. Tracks whether the text and id fields were ever present, to say so when nothing is kept.
 */
export class JsonRecordSink {
  private objects = 0;
  private withText = 0;
  private withId = 0;
  private readonly keysSeen = new Set<string>();

  /**
   * @param opts - resolved parse options (text and id keys)
   * @param builder - receives the documents
   * @param idRequired - whether an `idField` absent from every record is an error (false where ids are optional)
   */
  constructor(
    private readonly opts: ParseOptions,
    private readonly builder: DocumentBuilder,
    private readonly idRequired = true,
  ) {}

  /**
   * @param line - where the value starts (or its position in a request body)
   * @param value - the parsed JSON value
   */
  /** Parses one record's JSON text and adds it; text that is not JSON skips the record with the reason. */
  addSource(line: number, source: string): void {
    let value: unknown;
    try {
      value = JSON.parse(source);
    } catch (err) {
      this.builder.skipRecord(line, `not valid JSON (${(err as Error).message})`);
      return;
    }
    this.add(line, value);
  }

  add(line: number, value: unknown): void {
    if (typeof value === 'string') {
      this.builder.add(line, value, undefined, {});
      return;
    }
    if (value === null || typeof value !== 'object' || Array.isArray(value)) {
      const what = value === null ? 'null' : Array.isArray(value) ? 'a list' : `a ${typeof value}`;
      this.builder.skipRecord(line, `expected a JSON object with a "${this.opts.textField}" field, found ${what}`);
      return;
    }
    this.objects++;
    const record = value as Record<string, unknown>;
    const { textField, idField } = this.opts;
    const meta: Record<string, unknown> = {};
    let text: unknown;
    let id: unknown;
    for (const key in record) {
      if (this.keysSeen.size < MAX_KEYS_NOTED) this.keysSeen.add(key);
      if (key === textField) text = record[key];
      else if (key === idField) id = record[key];
      else setField(meta, key, record[key]);
    }
    if (Object.hasOwn(record, textField)) this.withText++;
    if (idField !== undefined && Object.hasOwn(record, idField)) this.withId++;
    this.builder.add(line, text, id, meta, true);
  }

  /**
   * Explains an upload with objects but no text (or no id) field anywhere.
   * @throws IngestError `unprocessable` naming the fields that do exist
   */
  checkFields(): void {
    if (this.builder.documentCount > 0 || this.objects === 0) return;
    const keys = listFields([...this.keysSeen]);
    if (this.withText === 0) {
      throw new IngestError(
        'unprocessable',
        `No record has a "${this.opts.textField}" field. The fields found are ${keys}: choose the one that holds the text (textField).`,
        { field: this.opts.textField, fields: [...this.keysSeen] },
      );
    }
    if (this.idRequired && this.opts.idField !== undefined && this.withId === 0) {
      throw new IngestError(
        'unprocessable',
        `No record has a "${this.opts.idField}" field for ids. The fields found are ${keys}: choose one (idField) or leave idField out to number records by position.`,
        { field: this.opts.idField, fields: [...this.keysSeen] },
      );
    }
  }
}
