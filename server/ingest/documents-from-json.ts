import type { IngestDocument, ParseSummary } from './api.js';
import { DocumentBuilder } from './document-builder.js';
import { IngestError } from './ingest-error.js';
import { JsonRecordSink } from './json-record-sink.js';
import { resolveParseOptions, type ParseOptions } from './parse-options.js';

/** Options of the JSON body form: as {@link ParseOptions}, but `idField` defaults to `'id'`. */
export type JsonBodyOptions = Pick<ParseOptions, 'textField' | 'idField' | 'maxDocumentChars' | 'maxReported'>;

/**
 * Reads the JSON body form of an upload: `{"documents": [{"id": "optional", "text": "…", …}]}`
 * (or the `documents` array itself; strings are accepted as documents too). Keys other than the
 * text and id keys are kept as metadata. A document without an id gets its 1-based position in
 * the array, and `line` in the summary is that position too. Same rules as
 * {@link parseDocuments} otherwise: empty texts skipped, duplicate ids refused, nothing kept →
 * `unprocessable`.
 * @param body - the parsed request body
 * @param opts - text and id keys and caps; `idField` defaults to `'id'`
 * @throws IngestError `bad_request` when `documents` is not an array, `unprocessable` when no
 *   document is usable or ids repeat
 */
export function documentsFromJson(
  body: unknown,
  opts: Partial<JsonBodyOptions> = {},
): { documents: IngestDocument[]; summary: ParseSummary } {
  const o = resolveParseOptions({ idField: 'id', ...opts, format: 'json' });
  const list = Array.isArray(body) ? body : isObject(body) ? body['documents'] : undefined;
  if (!Array.isArray(list)) {
    throw new IngestError(
      'bad_request',
      'The body must be an object with a "documents" array: {"name": "…", "documents": [{"text": "…"}, …]}.',
      { field: 'documents' },
    );
  }
  const builder = new DocumentBuilder({ ...o, batchSize: Number.MAX_SAFE_INTEGER }, 'json', 'position', 'document');
  const sink = new JsonRecordSink(o, builder, false);
  list.forEach((value, i) => sink.add(i + 1, value));
  if (list.length === 0) throw new IngestError('unprocessable', 'The "documents" array is empty: send at least one document with text.', {});
  sink.checkFields();
  const summary = builder.finish();
  return { documents: builder.takeBatch(), summary };
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}
