import type { DocumentBuilder } from './document-builder.js';
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
   * @param builder - receives skipped elements
   * @param sink - turns parsed values into documents
   */
  constructor(
    opts: ParseOptions,
    private readonly builder: DocumentBuilder,
    private readonly sink: JsonRecordSink,
  ) {
    this.splitter = new JsonArraySplitter(opts.maxRecordChars);
  }

  feed(text: string, final: boolean): void {
    this.splitter.feed(text, final, this.elements);
    for (const { line, source } of this.elements) {
      let value: unknown;
      try {
        value = JSON.parse(source);
      } catch (err) {
        this.builder.skipRecord(line, `not valid JSON (${(err as Error).message})`);
        continue;
      }
      this.sink.add(line, value);
    }
    this.elements.length = 0;
    if (final) this.sink.checkFields();
  }
}
