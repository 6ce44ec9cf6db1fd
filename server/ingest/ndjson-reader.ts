import type { DocumentBuilder } from './document-builder.js';
import type { JsonRecordSink } from './json-record-sink.js';
import { LineSplitter, type NumberedLine } from './line-splitter.js';
import type { ParseOptions } from './parse-options.js';
import type { RecordReader } from './record-reader.js';

/**
 * Reads NDJSON: one JSON value per line, blank lines ignored (they take no position). A line
 * that is not valid JSON is skipped and reported, not fatal.
 */
export class NdjsonReader implements RecordReader {
  private readonly splitter: LineSplitter;
  private readonly lines: NumberedLine[] = [];

  /**
   * @param opts - resolved parse options
   * @param builder - receives skipped lines
   * @param sink - turns parsed values into documents
   */
  constructor(
    opts: ParseOptions,
    private readonly builder: DocumentBuilder,
    private readonly sink: JsonRecordSink,
  ) {
    this.splitter = new LineSplitter(opts.maxRecordChars, 'NDJSON line');
  }

  feed(text: string, final: boolean): void {
    this.splitter.feed(text, final, this.lines);
    for (const { line, text: source } of this.lines) {
      if (source.trim().length === 0) continue;
      let value: unknown;
      try {
        value = JSON.parse(source);
      } catch (err) {
        this.builder.skipRecord(line, `not valid JSON (${(err as Error).message})`);
        continue;
      }
      this.sink.add(line, value);
    }
    this.lines.length = 0;
    if (final) this.sink.checkFields();
  }
}
