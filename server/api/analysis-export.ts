import { stream } from 'hono/streaming';
import { ApiError, notFound } from './api-error.js';
import { csvRow } from './csv-cell.js';
import type { AppDeps } from './deps.js';
import { ExportCache } from './export-cache.js';
import type { RouteDef } from './route-table.js';

const ROWS_PER_CHUNK = 2000;
/** JSON assignments of analyses up to this size are kept ready in memory (about 80 bytes a row). */
const CACHED_ROWS = 200_000;
const SEND_BYTES = 256 * 1024;

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

/** `GET /analyses/:aid/assignments`: every document's theme and map position, as JSON, CSV or NDJSON, streamed. */
export function analysisExportRoutes(deps: AppDeps): RouteDef[] {
  const { store } = deps;
  const cache = new ExportCache();
  return [
    {
      method: 'get',
      path: '/analyses/:aid/assignments',
      tag: 'analyses',
      summary: 'Each document’s theme, map position and silhouette, in corpus order',
      description: 'format=json (default) omits the text; csv and ndjson include the text and theme name, for export.',
      query: { type: 'object', properties: { format: { type: 'string', enum: ['json', 'csv', 'ndjson'], default: 'json' } } },
      responses: {
        200: {
          description: 'The assignments.',
          schema: {
            type: 'array',
            items: {
              type: 'object',
              properties: { documentId: { type: 'string' }, clusterId: { type: 'string' }, x: { type: 'number' }, y: { type: 'number' }, silhouette: { type: 'number' } },
            },
          },
        },
      },
      handler: async (c, { query }) => {
        const aid = c.req.param('aid')!;
        const a = await store.getAnalysis(aid);
        if (!a) throw notFound('analysis', aid);
        if (!a.summary) throw new ApiError('conflict', 'The analysis has not finished; its assignments are not ready yet.');
        const format: 'json' | 'csv' | 'ndjson' = query.format ?? 'json';
        const types = { json: 'application/json; charset=utf-8', csv: 'text/csv; charset=utf-8', ndjson: 'application/x-ndjson; charset=utf-8' };
        c.header('Content-Type', types[format]);
        if (format !== 'json') c.header('Content-Disposition', `attachment; filename="themes-${aid}.${format}"`);
        const clusters = a.clusters;

        async function* chunks(): AsyncGenerator<string> {
          const arrays = await store.loadArrays(aid, ['labels', 'xy', 'silhouettes']);
          const labels = arrays.labels as Int32Array;
          const xy = arrays.xy as Float32Array;
          const sil = arrays.silhouettes as Float32Array;
          const docs = format === 'json' ? (await store.loadDocumentIds(a!.corpusId)).map((id) => ({ id, text: '' })) : await store.loadDocuments(a!.corpusId);
          const n = labels.length;
          if (format === 'csv') yield csvRow(['documentId', 'clusterId', 'clusterName', 'x', 'y', 'silhouette', 'text']);
          if (format === 'json') yield '[';
          for (let start = 0; start < n; start += ROWS_PER_CHUNK) {
            let chunk = '';
            for (let i = start; i < Math.min(n, start + ROWS_PER_CHUNK); i++) {
              const r = {
                documentId: docs[i].id,
                clusterId: clusters[labels[i]]?.id ?? null,
                x: round(xy[2 * i], 4),
                y: round(xy[2 * i + 1], 4),
                silhouette: round(sil[i], 4),
              };
              if (format === 'json') chunk += (i ? ',' : '') + JSON.stringify(r);
              else if (format === 'ndjson') chunk += JSON.stringify({ ...r, clusterName: clusters[labels[i]]?.name ?? null, text: docs[i].text }) + '\n';
              else chunk += csvRow([r.documentId, r.clusterId, clusters[labels[i]]?.name ?? '', r.x, r.y, r.silhouette, docs[i].text]);
            }
            yield chunk;
          }
          if (format === 'json') yield ']';
        }

        // The map asks for this on every page load: kept ready per revision and sent as slices of
        // one buffer. Exports with text, and very large analyses, are built while they are sent.
        const size = a.clusters.reduce((sum, cl) => sum + cl.size, 0);
        if (format === 'json' && size <= CACHED_ROWS) {
          const buf = await cache.get(`${aid}:${a.revision}`, async () => {
            const parts: string[] = [];
            for await (const chunk of chunks()) parts.push(chunk);
            return Buffer.from(parts.join(''));
          });
          return stream(c, async (s) => {
            for (let off = 0; off < buf.length; off += SEND_BYTES) await s.write(buf.subarray(off, off + SEND_BYTES));
          });
        }
        return stream(c, async (s) => {
          for await (const chunk of chunks()) await s.write(chunk);
        });
      },
    },
  ];
}
