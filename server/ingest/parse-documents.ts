import type { IngestDocument, ParseSummary } from './api.js';
import { CsvReader } from './csv-reader.js';
import { decodeUtf8 } from './decode-utf8.js';
import { detectFormat, type DetectedFormat } from './detect-format.js';
import { DocumentBuilder } from './document-builder.js';
import { IngestError } from './ingest-error.js';
import { JsonArrayReader } from './json-array-reader.js';
import { JsonRecordSink } from './json-record-sink.js';
import { NdjsonReader } from './ndjson-reader.js';
import { resolveParseOptions, type ParseOptions } from './parse-options.js';
import type { RecordReader } from './record-reader.js';
import { TextReader } from './text-reader.js';
import { assertUnreachable } from '../common/matrix.js';

/** Text read before the format is decided: enough for a header and a few rows. */
const SNIFF_CHARS = 64 * 1024;
const SNIFF_LINES = 8;

/**
 * Reads an upload (CSV, NDJSON, JSON array or plain text, UTF-8) as a stream and yields its
 * documents in batches, so the caller can store them as they come while memory stays bounded by
 * a batch, not the file. Returns the summary when the input is exhausted.
 *
 * Bad records are skipped and listed in the summary; bad input as a whole (not UTF-8, binary,
 * missing text field, no document at all, broken structure, duplicate ids) throws an
 * {@link IngestError} whose message says what to fix. Since an error can come after batches were
 * yielded, the caller stores the batches in one transaction. Stopping the iteration early (a
 * cancelled upload) closes `chunks`.
 *
 * @example
 * ```ts
 * // `file` is a Node Readable (e.g. a busboy file part): it is an AsyncIterable<Buffer>.
 * const gen = parseDocuments(file, { fileName: info.filename, contentType: info.mimeType, textField, idField });
 * for (let next = await gen.next(); ; next = await gen.next()) {
 *   if (next.done) { summary = next.value; break; }
 *   insertDocuments(corpusId, next.value); // inside one transaction
 * }
 * // IngestError: code 'unsupported_media_type' → 415, 'unprocessable' → 422, 'bad_request' → 400
 * ```
 * @param chunks - the uploaded bytes, in chunks of any size
 * @param opts - see {@link ParseOptions}
 * @yields batches of at most `batchSize` documents, in input order
 * @returns what was read, skipped and noted
 * @throws IngestError for bad input, TypeError or RangeError for bad options
 */
export async function* parseDocuments(
  chunks: AsyncIterable<Uint8Array>,
  opts: Partial<ParseOptions> = {},
): AsyncGenerator<IngestDocument[], ParseSummary, void> {
  let o = resolveParseOptions(opts);
  const texts = decodeUtf8(chunks);
  try {
    let head = '';
    let lines = 0;
    let ended = false;
    while (head.length < SNIFF_CHARS && lines < SNIFF_LINES) {
      const next = await texts.next();
      if (next.done) {
        ended = true;
        break;
      }
      head += next.value;
      for (let i = next.value.indexOf('\n'); i >= 0; i = next.value.indexOf('\n', i + 1)) lines++;
    }
    if (ended && head.trim().length === 0) {
      throw new IngestError('unprocessable', 'The upload is empty: there is no text in it.', {});
    }
    const detected = detectFormat(head, o, ended);
    let notice: string | undefined;
    if (detected.format === 'text' && o.idField !== undefined) {
      notice = `idField "${o.idField}" is ignored for plain text, which has no fields; documents are numbered by line`;
      o = { ...o, idField: undefined };
    }
    const builder = new DocumentBuilder(o, detected.format);
    if (notice !== undefined) builder.warn(1, notice);
    const reader = createReader(detected, o, builder);
    reader.feed(head, ended);
    while (!ended) {
      yield* batches(builder, o.batchSize, false);
      const next = await texts.next();
      if (next.done) ended = true;
      reader.feed(next.done ? '' : next.value, ended);
    }
    const summary = builder.finish();
    yield* batches(builder, o.batchSize, true);
    return summary;
  } finally {
    await texts.return();
  }
}

/**
 * Reads a whole upload into memory: {@link parseDocuments} drained. For small uploads and tests;
 * the server streams.
 */
export async function collectDocuments(
  chunks: AsyncIterable<Uint8Array>,
  opts: Partial<ParseOptions> = {},
): Promise<{ documents: IngestDocument[]; summary: ParseSummary }> {
  const documents: IngestDocument[] = [];
  const gen = parseDocuments(chunks, opts);
  for (;;) {
    const next = await gen.next();
    if (next.done) return { documents, summary: next.value };
    for (const d of next.value) documents.push(d);
  }
}

/** Full batches while there are any; with `all`, everything pending, in batches of at most `size`. */
function* batches(builder: DocumentBuilder, size: number, all: boolean): Generator<IngestDocument[], void, void> {
  while (all ? builder.pending > 0 : builder.batchFull) yield builder.takeBatch(size);
}

function createReader(detected: DetectedFormat, o: ParseOptions, builder: DocumentBuilder): RecordReader {
  switch (detected.format) {
    case 'csv':
      return new CsvReader(o, builder, detected.delimiter ?? ',');
    case 'ndjson':
      return new NdjsonReader(o, new JsonRecordSink(o, builder));
    case 'json':
      return new JsonArrayReader(o, new JsonRecordSink(o, builder));
    case 'text':
      return new TextReader(o, builder);
    default:
      return assertUnreachable(detected.format);
  }
}
