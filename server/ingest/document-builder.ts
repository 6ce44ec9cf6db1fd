import type { IngestDocument, ParseSummary, SkippedLine, UploadFormat } from './api.js';
import { IngestError } from './ingest-error.js';
import type { ParseOptions } from './parse-options.js';

/** What to do with a record that has no id when `idField` is set. */
export type MissingIdPolicy = 'skip' | 'position';

/** Cap on metadata field names collected from JSON records, so odd inputs cannot grow it without end. */
const MAX_FIELDS = 1000;

/** ES2024 string methods, present in Node 20 but not in the ES2023 library types. */
interface WellFormedString {
  isWellFormed(): boolean;
  toWellFormed(): string;
}

/**
 * Turns records of any format into documents and keeps the books: positional ids, id
 * uniqueness, skipped records, warnings, metadata field names, batches.
 *
 * Every record of the input goes through exactly one of `add` or `skip`, which is what makes
 * positional ids count skipped records too.
 */
export class DocumentBuilder {
  private batch: IngestDocument[] = [];
  private batchChars = 0;
  private position = 0;
  private kept = 0;
  private readonly skipped: SkippedLine[] = [];
  private skippedCount = 0;
  private readonly warnings: SkippedLine[] = [];
  private warningCount = 0;
  private readonly idLines = new Map<string, number>();
  private readonly fieldSet = new Set<string>();
  /** The delimiter a CSV reader settled on, reported in the summary. */
  delimiter?: string;

  /**
   * @param opts - resolved parse options (text and id field, caps)
   * @param format - the format being read, for the summary
   * @param missingId - what a record without an id becomes when `idField` is set
   * @param place - what a record's number is called in messages: a file `line`, or a `document` of a request body
   */
  constructor(
    private readonly opts: ParseOptions,
    private readonly format: UploadFormat,
    private readonly missingId: MissingIdPolicy = 'skip',
    private readonly place: 'line' | 'document' = 'line',
  ) {}

  /** Declares metadata field names up front (CSV headers), in column order. */
  declareFields(names: readonly string[]): void {
    for (const name of names) this.fieldSet.add(name);
  }

  /**
   * Adds one record.
   * @param line - where the record starts
   * @param text - the value of the text field (anything; non-strings are skipped)
   * @param id - the value of the id field, or undefined when there is none
   * @param meta - the other fields
   * @param collectFields - add `meta`'s keys to the summary's field names (JSON records)
   */
  add(line: number, text: unknown, id: unknown, meta: Record<string, unknown>, collectFields = false): boolean {
    const position = ++this.position;
    if (typeof text !== 'string') {
      this.drop(line, text === undefined ? `no "${this.opts.textField}" field` : `the "${this.opts.textField}" value is ${kindOf(text)}, not text`);
      return false;
    }
    let docId: string;
    if (this.opts.idField === undefined || ((id === undefined || id === null || id === '') && this.missingId === 'position')) {
      docId = String(position);
    } else if (typeof id === 'string' || (typeof id === 'number' && Number.isFinite(id))) {
      docId = String(id).trim();
      if (docId === '') {
        this.drop(line, `empty id in "${this.opts.idField}"`);
        return false;
      }
    } else if (id === undefined || id === null || id === '') {
      this.drop(line, `no id in "${this.opts.idField}"`);
      return false;
    } else {
      this.drop(line, `the "${this.opts.idField}" value is ${kindOf(id)}; an id must be text or a number`);
      return false;
    }
    let clean = text.includes('\0') ? text.replaceAll('\0', '') : text;
    if (clean.trim().length === 0) {
      this.drop(line, 'empty text');
      return false;
    }
    // Lone surrogates can only come from JSON escapes; they would not survive UTF-8 storage.
    if (!(clean as unknown as WellFormedString).isWellFormed()) clean = (clean as unknown as WellFormedString).toWellFormed();
    const max = this.opts.maxDocumentChars;
    if (clean.length > max) {
      const cut = isHighSurrogate(clean.charCodeAt(max - 1)) ? max - 1 : max;
      this.warn(line, `text cut to ${cut} characters (it had ${clean.length}); raise maxDocumentChars to keep more`);
      clean = clean.slice(0, cut);
    }
    // Positional ids are unique by construction; only ids taken from the input need the map.
    const firstLine = this.opts.idField === undefined ? undefined : this.idLines.get(docId);
    if (firstLine !== undefined) {
      throw new IngestError(
        'unprocessable',
        `Duplicate id "${docId}" in ${this.place} ${line} (first seen in ${this.place} ${firstLine}): ids in "${this.opts.idField ?? 'id'}" must be unique. ` +
          'Fix the duplicates or upload without an id field to number documents by position.',
        { id: docId, line, firstLine },
      );
    }
    if (this.opts.idField !== undefined) this.idLines.set(docId, line);
    if (collectFields && this.fieldSet.size < MAX_FIELDS) {
      for (const key in meta) if (this.fieldSet.size < MAX_FIELDS) this.fieldSet.add(key);
    }
    this.batch.push({ id: docId, text: clean, meta });
    this.batchChars += clean.length;
    this.kept++;
    return true;
  }

  /** Leaves out one record (it still takes up a position). */
  skipRecord(line: number, reason: string): void {
    this.position++;
    this.drop(line, reason);
  }

  private drop(line: number, reason: string): void {
    this.skippedCount++;
    if (this.skipped.length < this.opts.maxReported) this.skipped.push({ line, reason });
  }

  /** Notes a remark about a kept record or about the input as a whole. */
  warn(line: number, reason: string): void {
    this.warningCount++;
    if (this.warnings.length < this.opts.maxReported) this.warnings.push({ line, reason });
  }

  /** True when the pending batch is full by count or by size (huge texts make small batches). */
  get batchFull(): boolean {
    return this.batch.length >= this.opts.batchSize || this.batchChars >= 8 * this.opts.maxDocumentChars;
  }

  /**
   * Hands over pending documents, the oldest first.
   * @param limit - at most this many
   */
  takeBatch(limit = Number.POSITIVE_INFINITY): IngestDocument[] {
    if (this.batch.length <= limit) {
      const out = this.batch;
      this.batch = [];
      this.batchChars = 0;
      return out;
    }
    const out = this.batch.slice(0, limit);
    this.batch = this.batch.slice(limit);
    for (const d of out) this.batchChars -= d.text.length;
    return out;
  }

  /** Documents kept but not yet handed over. */
  get pending(): number {
    return this.batch.length;
  }

  /** Records seen so far (kept and skipped). */
  get records(): number {
    return this.position;
  }

  /** Documents kept so far. */
  get documentCount(): number {
    return this.kept;
  }

  /**
   * Closes the books.
   * @throws IngestError `unprocessable` when no document was kept
   */
  finish(): ParseSummary {
    if (this.kept === 0) {
      const reasons = this.skipped.slice(0, 5).map((s) => `${this.place} ${s.line}: ${s.reason}`).join('; ');
      throw new IngestError(
        'unprocessable',
        this.position === 0
          ? 'The upload holds no documents: it is empty.'
          : `None of the ${this.position} records holds a usable document (${reasons}${this.skippedCount > 5 ? '; …' : ''}).`,
        { skipped: this.skipped, skippedCount: this.skippedCount },
      );
    }
    return {
      format: this.format,
      ...(this.delimiter !== undefined ? { delimiter: this.delimiter } : {}),
      fields: [...this.fieldSet],
      skipped: this.skipped,
      skippedCount: this.skippedCount,
      warnings: this.warnings,
      warningCount: this.warningCount,
      documentCount: this.kept,
    };
  }
}

function isHighSurrogate(c: number): boolean {
  return c >= 0xd800 && c <= 0xdbff;
}

function kindOf(v: unknown): string {
  if (v === null) return 'null';
  if (v === undefined) return 'missing';
  if (Array.isArray(v)) return 'a list';
  switch (typeof v) {
    case 'number':
      return `a number (${v})`;
    case 'boolean':
      return `a boolean (${v})`;
    case 'object':
      return 'an object';
    default:
      return typeof v;
  }
}
