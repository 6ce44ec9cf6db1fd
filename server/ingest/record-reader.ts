/**
 * A format reader: takes decoded text as it arrives and hands every record to a
 * `DocumentBuilder`. Implementations: CsvReader, NdjsonReader, JsonArrayReader, TextReader.
 */
export interface RecordReader {
  /**
   * @param text - the next piece of the upload
   * @param final - true for the last call (with `text` possibly empty)
   */
  feed(text: string, final: boolean): void;
}
