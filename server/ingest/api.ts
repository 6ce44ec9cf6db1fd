/**
 * Types of the ingest step: uploaded bytes → documents with ids, text and metadata.
 */

/** The upload formats sheaf reads. */
export type UploadFormat = 'csv' | 'ndjson' | 'json' | 'text';

/** One document as it leaves the parser and enters the store. */
export interface IngestDocument {
  /** From `idField` when set, otherwise the 1-based position of the record in the input (`"1"`, `"2"`, …). */
  id: string;
  /** The document text, faithful to the input except that NUL characters are removed. */
  text: string;
  /** Every other column or key: strings for CSV, JSON values for JSON and NDJSON. */
  meta: Record<string, unknown>;
}

/** A record left out, or a record kept with a remark, and where it is in the input. */
export interface SkippedLine {
  /**
   * 1-based physical line of the file where the record starts (CSV header = line 1). For the JSON
   * body form (`documentsFromJson`) it is the 1-based position in the `documents` array.
   */
  line: number;
  /** A sentence a person can act on. */
  reason: string;
}

/** What the parser found, returned once all documents have been yielded. */
export interface ParseSummary {
  /** The format that was read (after automatic detection). */
  format: UploadFormat;
  /** CSV only: the field delimiter that was used. */
  delimiter?: string;
  /** Metadata field names, in order of first appearance (the text and id fields excluded). */
  fields: string[];
  /** Records left out, at most `maxReported` of them, in input order. */
  skipped: SkippedLine[];
  /** How many records were left out in all (may exceed `skipped.length`). */
  skippedCount: number;
  /** Records kept with a remark (text cut, short CSV row padded, header renamed), at most `maxReported`. */
  warnings: SkippedLine[];
  /** How many warnings there were in all (may exceed `warnings.length`). */
  warningCount: number;
  /** Documents kept (the number yielded). */
  documentCount: number;
}
