import { JsonArraySplitter, type JsonElement } from './json-array-splitter.js';
import type { JsonRecordSink } from './json-record-sink.js';
import type { ParseOptions } from './parse-options.js';
import type { RecordReader } from './record-reader.js';

/**
 * Reads a top-level JSON array of objects or strings, element by element. An element that is
 * not valid JSON by itself is skipped and reported; a broken array is refused.
 */
export class JsonArrayReader implements RecordReader {
  private readonly splitter: JsonArraySplitter;
  private readonly elements: JsonElement[] = [];

  /**
   * @param opts - resolved parse options
   * @param sink - parses records into documents (and skips those that are not JSON)
   */
  constructor(
    opts: ParseOptions,
    private readonly sink: JsonRecordSink,
  ) {
    this.splitter = new JsonArraySplitter(opts.maxRecordChars);
  }

  feed(text: string, final: boolean): void {
    this.splitter.feed(text, final, this.elements);
    for (const { line, source } of this.elements) this.sink.addSource(line, source);
    this.elements.length = 0;
    if (final) this.sink.checkFields();
  }
}
