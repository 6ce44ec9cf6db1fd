import { createReadStream } from 'node:fs';
import type { Context } from 'hono';
import { batchesOf } from '../ingest/batches-of.js';
import { documentsFromJson, IngestError, parseDocuments, type ParseSummary } from '../ingest/index.js';
import { DuplicateIdError, type DocumentRecord } from '../store/index.js';
import { ApiError, notFound } from './api-error.js';
import type { AppDeps } from './deps.js';
import { bodyChunks, bodyText } from './read-body.js';
import type { RouteDef } from './route-table.js';
import { spoolMultipart } from './multipart-upload.js';
import type { Schema } from './schema.js';

const CORPUS: Schema = {
  type: 'object',
  properties: {
    id: { type: 'string' },
    name: { type: 'string' },
    documentCount: { type: 'integer' },
    createdAt: { type: 'string' },
    fields: { type: 'array', items: { type: 'string' } },
  },
};

const IMPORT_RESULT: Schema = {
  type: 'object',
  properties: {
    id: { type: 'string' },
    name: { type: 'string' },
    documentCount: { type: 'integer' },
    skipped: { type: 'array', items: { type: 'object', properties: { line: { type: 'integer' }, reason: { type: 'string' } } } },
    skippedCount: { type: 'integer', description: 'All skipped records; `skipped` lists the first ones.' },
    warnings: { type: 'array', items: { type: 'object', properties: { line: { type: 'integer' }, reason: { type: 'string' } } } },
    fields: { type: 'array', items: { type: 'string' } },
    format: { type: 'string', enum: ['csv', 'ndjson', 'json', 'text'] },
  },
};

const JSON_UPLOAD: Schema = {
  type: 'object',
  properties: {
    name: { type: 'string', minLength: 1, maxLength: 200 },
    documents: { type: 'array', items: { type: 'object', properties: {}, description: '{"id"?, "text", …metadata}' } },
    textField: { type: 'string', minLength: 1, maxLength: 200, default: 'text' },
    idField: { type: 'string', minLength: 1, maxLength: 200 },
  },
  required: ['documents'],
};

const FORMAT_BY_TYPE: Record<string, 'csv' | 'ndjson' | 'json' | 'text'> = {
  'text/csv': 'csv',
  'application/csv': 'csv',
  'application/x-ndjson': 'ndjson',
  'application/ndjson': 'ndjson',
  'application/jsonl': 'ndjson',
  'text/plain': 'text',
};

function toApiError(e: unknown): unknown {
  if (e instanceof IngestError) return new ApiError(e.code, e.message, e.details);
  if (e instanceof DuplicateIdError) return new ApiError('unprocessable', e.message);
  return e;
}

function corpusName(raw: unknown, fallback: string): string {
  const name = typeof raw === 'string' ? raw.trim() : '';
  if (name.length > 200) throw new ApiError('bad_request', 'The corpus name must have at most 200 characters.');
  return name || fallback;
}

/** Imports parsed batches into the store and answers 201 with what was skipped. */
async function importAndAnswer(
  deps: AppDeps,
  c: Context,
  name: string,
  parse: AsyncGenerator<DocumentRecord[], ParseSummary>,
): Promise<Response> {
  const { batches, summary } = batchesOf(parse);
  try {
    const corpus = await deps.store.importCorpus(name, batches, () => summary()?.fields ?? []);
    const s = summary();
    return c.json(
      {
        id: corpus.id,
        name: corpus.name,
        documentCount: corpus.documentCount,
        skipped: s?.skipped ?? [],
        skippedCount: s?.skippedCount ?? 0,
        warnings: s?.warnings ?? [],
        fields: corpus.fields,
        format: s?.format,
      },
      201,
    );
  } catch (e) {
    throw toApiError(e);
  }
}

async function* oneBatch(docs: DocumentRecord[], summary: ParseSummary): AsyncGenerator<DocumentRecord[], ParseSummary> {
  yield docs;
  return summary;
}

async function createCorpus(deps: AppDeps, c: Context): Promise<Response> {
  const type = (c.req.header('content-type') ?? '').split(';')[0].trim().toLowerCase();
  const limit = deps.config.maxUploadBytes;
  if (type === 'application/json') {
    const text = await bodyText(c, limit);
    let body: unknown;
    try {
      body = JSON.parse(text);
    } catch (e) {
      throw new ApiError('bad_request', `The body is not valid JSON: ${(e as Error).message}`);
    }
    const b = body as Record<string, unknown>;
    if (b === null || typeof b !== 'object' || Array.isArray(b)) {
      throw new ApiError('bad_request', 'Send an object {"name": "…", "documents": [{"text": "…"}, …]}.');
    }
    if (!Array.isArray(b.documents)) {
      throw new ApiError('bad_request', '"documents" must be an array of objects, each with a "text" field.', { field: 'documents' });
    }
    for (const f of ['textField', 'idField'] as const) {
      if (b[f] !== undefined && typeof b[f] !== 'string') throw new ApiError('bad_request', `"${f}" must be a string.`);
    }
    let parsed: ReturnType<typeof documentsFromJson>;
    try {
      parsed = documentsFromJson(b, { textField: (b.textField as string) ?? 'text', ...(typeof b.idField === 'string' ? { idField: b.idField } : {}) });
    } catch (e) {
      throw toApiError(e);
    }
    return importAndAnswer(deps, c, corpusName(b.name, 'Untitled corpus'), oneBatch(parsed.documents, parsed.summary));
  }
  if (type === 'multipart/form-data') {
    const upload = await spoolMultipart(c, limit);
    try {
      const f = upload.fields;
      if (!upload.file) throw new ApiError('bad_request', 'The form has no "file" part. Attach the file as the field "file".', { field: 'file' });
      const file = upload.file;
      const format = f.format && f.format !== 'auto' ? f.format : 'auto';
      if (!['auto', 'csv', 'ndjson', 'json', 'text'].includes(format)) {
        throw new ApiError('bad_request', `Unknown format "${format}": use csv, ndjson, json or text (or leave it out to detect it).`);
      }
      const parse = parseDocuments(createReadStream(file.path), {
        format: format as 'auto',
        fileName: file.name,
        contentType: file.mimeType,
        textField: f.textField || 'text',
        idField: f.idField || undefined,
      });
      return await importAndAnswer(deps, c, corpusName(f.name, file.name || 'Untitled corpus'), parse);
    } catch (e) {
      throw toApiError(e);
    } finally {
      await upload.cleanup();
    }
  }
  const format = FORMAT_BY_TYPE[type];
  if (!format) {
    throw new ApiError(
      'unsupported_media_type',
      `Send the corpus as application/json, multipart/form-data (field "file"), or a raw text/csv, application/x-ndjson or text/plain body (got "${type || 'no Content-Type'}").`,
    );
  }
  const q = c.req.query();
  const parse = parseDocuments(bodyChunks(c, limit), { format, textField: q.textField || 'text', idField: q.idField || undefined });
  return importAndAnswer(deps, c, corpusName(q.name, 'Untitled corpus'), parse);
}

/** The corpus endpoints of the contract. */
export function corpusRoutes(deps: AppDeps): RouteDef[] {
  const get = async (cid: string) => {
    const corpus = await deps.store.getCorpus(cid);
    if (!corpus) throw notFound('corpus', cid);
    return corpus;
  };
  return [
    {
      method: 'post',
      path: '/corpora',
      tag: 'corpora',
      summary: 'Create a corpus from JSON, a multipart file upload, or a raw CSV/NDJSON/text body',
      description:
        'Multipart fields: file, name, textField (default "text"), idField, format (csv|ndjson|json|text, detected when left out). ' +
        'A raw body with Content-Type text/csv, application/x-ndjson or text/plain takes name, textField and idField from the query. ' +
        'The import is all or nothing; empty documents are skipped and reported.',
      rawBody: {
        'application/json': { schema: JSON_UPLOAD },
        'multipart/form-data': {
          schema: {
            type: 'object',
            properties: {
              file: { type: 'string', description: 'The file (binary).' },
              name: { type: 'string' },
              textField: { type: 'string' },
              idField: { type: 'string' },
              format: { type: 'string', enum: ['csv', 'ndjson', 'json', 'text'] },
            },
            required: ['file'],
          },
        },
        'text/csv': { schema: { type: 'string' } },
        'application/x-ndjson': { schema: { type: 'string' } },
        'text/plain': { schema: { type: 'string' } },
      },
      responses: { 201: { description: 'The corpus was created.', schema: IMPORT_RESULT } },
      handler: (c) => createCorpus(deps, c),
    },
    {
      method: 'get',
      path: '/corpora',
      tag: 'corpora',
      summary: 'List corpora',
      responses: { 200: { description: 'All corpora, oldest first.', schema: { type: 'array', items: CORPUS } } },
      handler: async (c) => c.json((await deps.store.listCorpora()).map(({ fields: _f, ...rest }) => rest)),
    },
    {
      method: 'get',
      path: '/corpora/:cid',
      tag: 'corpora',
      summary: 'One corpus with its metadata field names',
      responses: { 200: { description: 'The corpus.', schema: CORPUS } },
      handler: async (c) => c.json(await get(c.req.param('cid')!)),
    },
    {
      method: 'delete',
      path: '/corpora/:cid',
      tag: 'corpora',
      summary: 'Delete a corpus, its documents and analyses (routers trained on it keep working)',
      responses: { 204: { description: 'Deleted.' } },
      handler: async (c) => {
        const cid = c.req.param('cid')!;
        if (!(await deps.store.deleteCorpus(cid))) throw notFound('corpus', cid);
        return c.body(null, 204);
      },
    },
    {
      method: 'get',
      path: '/corpora/:cid/documents',
      tag: 'corpora',
      summary: 'A page of documents, optionally filtered by a word or phrase',
      query: {
        type: 'object',
        properties: {
          offset: { type: 'integer', minimum: 0, default: 0 },
          limit: { type: 'integer', minimum: 1, maximum: 1000, default: 100 },
          q: { type: 'string', maxLength: 500 },
        },
      },
      responses: {
        200: {
          description: 'The page and the total matching.',
          schema: {
            type: 'object',
            properties: {
              total: { type: 'integer' },
              items: { type: 'array', items: { type: 'object', properties: { id: { type: 'string' }, text: { type: 'string' }, meta: { type: 'object', properties: {} } } } },
            },
          },
        },
      },
      handler: async (c, { query }) => {
        const cid = c.req.param('cid')!;
        await get(cid);
        return c.json(await deps.store.listDocuments(cid, { offset: query.offset ?? 0, limit: query.limit ?? 100, q: query.q }));
      },
    },
  ];
}
