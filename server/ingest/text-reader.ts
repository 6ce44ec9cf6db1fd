import type { DocumentBuilder } from './document-builder.js';
import { LineSplitter, type NumberedLine } from './line-splitter.js';
import type { ParseOptions } from './parse-options.js';
import type { RecordReader } from './record-reader.js';

/**
 * Reads plain text: every line with something other than spaces on it is a document, kept as
 * written. Blank lines separate, they are not documents and take no position.
 */
export class TextReader implements RecordReader {
  private readonly splitter: LineSplitter;
  private readonly lines: NumberedLine[] = [];

  /**
   * @param opts - resolved parse options
   * @param builder - receives the documents
   */
  constructor(
    opts: ParseOptions,
    private readonly builder: DocumentBuilder,
  ) {
    this.splitter = new LineSplitter(opts.maxRecordChars, 'Line');
  }

  feed(text: string, final: boolean): void {
    this.splitter.feed(text, final, this.lines);
    for (const { line, text: content } of this.lines) {
      if (content.trim().length > 0) this.builder.add(line, content, undefined, {});
    }
    this.lines.length = 0;
  }
}
