import { RouterModel } from '../route/index.js';
import { ApiError, notFound } from './api-error.js';
import type { AppDeps } from './deps.js';
import type { KeyCache } from './key-cache.js';
import { RateLimiter } from './rate-limit.js';
import { bearerKey, hashKey, sameHash } from './router-keys.js';
import type { RouteDef } from './route-table.js';
import type { Schema } from './schema.js';

/** Most texts in one routing request. */
export const MAX_ROUTE_BATCH = 1000;

const ROUTE_BODY: Schema = {
  type: 'object',
  properties: {
    text: { type: 'string', maxLength: 1_000_000 },
    documents: {
      type: 'array',
      items: { type: 'object', properties: { id: { type: 'string', maxLength: 1000 }, text: { type: 'string', maxLength: 1_000_000 } }, required: ['text'] },
    },
    evidence: { type: 'integer', minimum: 0, maximum: 50, default: 5 },
  },
  additionalProperties: false,
};

const ROUTE_RESULT: Schema = {
  type: 'object',
  properties: {
    results: {
      type: 'array',
      items: {
        type: 'object',
        properties: {
          id: { type: 'string' },
          label: { type: 'string' },
          confidence: { type: 'number' },
          abstained: { type: 'boolean' },
          scores: { type: 'object', properties: {}, additionalProperties: { type: 'number' } },
          evidence: { type: 'array', items: { type: 'string' } },
          reason: { type: 'string', description: 'Why a text gave no evidence: "empty text" or "no known words".' },
        },
      },
    },
    version: { type: 'integer' },
  },
};

/** `POST /routers/:rid/route`: routes texts with the serving version, behind a router key. */
export function routingRoutes(deps: AppDeps, keys: KeyCache): RouteDef[] {
  const { store } = deps;
  // Models are loaded on first use and replaced when a newer version starts serving.
  const models = new Map<string, { version: number; model: RouterModel }>();

  const limiter = new RateLimiter(deps.config.routeRatePerKey);

  /** Checks the key and its rate; returns nothing, throws 401/403/429. */
  async function authorise(rid: string, header: string | undefined): Promise<void> {
    const key = bearerKey(header);
    if (!key) throw new ApiError('unauthorized', 'Send a router key as "Authorization: Bearer <key>". Create one with POST /api/v1/routers/{id}/keys.');
    const hash = hashKey(key);
    const record = await keys.find(hash);
    if (!record || !sameHash(record.hash, hash)) throw new ApiError('unauthorized', 'The key is not valid.');
    if (record.revokedAt) throw new ApiError('unauthorized', 'The key was revoked.');
    if (record.routerId !== rid) throw new ApiError('forbidden', 'The key belongs to another router.');
    const wait = limiter.take(record.id);
    if (wait > 0) {
      throw new ApiError('too_many_requests', `This key is sending more than ${deps.config.routeRatePerKey} requests per second; slow down or batch texts (up to ${MAX_ROUTE_BATCH} per request).`, { retryAfterSeconds: wait }, { 'Retry-After': String(wait) });
    }
  }

  async function model(rid: string): Promise<{ version: number; model: RouterModel }> {
    const version = await store.servingVersion(rid);
    if (version === null) throw notFound('router', rid);
    if (version === 0) throw new ApiError('conflict', 'The router has no trained version yet; wait for its training to finish.');
    const cached = models.get(rid);
    if (cached && cached.version === version) return cached;
    const stored = await store.loadRouterModel(rid);
    if (!stored) throw notFound('router', rid);
    const entry = { version: stored.version, model: RouterModel.fromJSON(stored.model) };
    models.set(rid, entry);
    return entry;
  }

  return [
    {
      method: 'post',
      path: '/routers/:rid/route',
      tag: 'routing',
      summary: 'Route one text or a batch of up to 1,000, in input order',
      security: 'router-key',
      body: ROUTE_BODY,
      maxBodyBytes: 32 * 1024 * 1024,
      responses: { 200: { description: 'One result per text, in input order.', schema: ROUTE_RESULT } },
      handler: async (c, { body }) => {
        const rid = c.req.param('rid')!;
        await authorise(rid, c.req.header('authorization'));
        const hasText = body.text !== undefined;
        const hasDocs = body.documents !== undefined;
        if (hasText === hasDocs) throw new ApiError('bad_request', 'Send either "text" or "documents" (an array of {"id"?, "text"}).');
        const docs: { id?: string; text: string }[] = hasText ? [{ text: body.text }] : body.documents;
        if (docs.length > MAX_ROUTE_BATCH) {
          throw new ApiError('payload_too_large', `A batch may hold at most ${MAX_ROUTE_BATCH} documents (got ${docs.length}); split it.`, {
            limit: MAX_ROUTE_BATCH,
          });
        }
        const { version, model: m } = await model(rid);
        const results = m.route(
          docs.map((d) => d.text),
          { evidence: body.evidence ?? 5 },
        );
        return c.json({
          version,
          results: results.map((r, i) => ({ id: docs[i].id ?? String(i + 1), ...r })),
        });
      },
    },
  ];
}
