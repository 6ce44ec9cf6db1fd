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
   * @param sink - parses records into documents (and skips those that are not JSON)
   */
  constructor(
    opts: ParseOptions,
    private readonly sink: JsonRecordSink,
  ) {
    this.splitter = new LineSplitter(opts.maxRecordChars, 'NDJSON line');
  }

  feed(text: string, final: boolean): void {
    this.splitter.feed(text, final, this.lines);
    for (const { line, text: source } of this.lines) {
      if (source.trim().length > 0) this.sink.addSource(line, source);
    }
    this.lines.length = 0;
    if (final) this.sink.checkFields();
  }
}
