import { collectTrainingSet, SourceNotFoundError, type TrainingSource } from '../jobs/handlers/training-set.js';
import { newId } from '../store/index.js';
import type { JobRecord, RouterRecord } from '../store/api.js';
import { ApiError, notFound } from './api-error.js';
import type { AppDeps } from './deps.js';
import { jobEventStream } from './job-events.js';
import { jobState } from './job-state.js';
import { KeyCache } from './key-cache.js';
import { newRouterKey } from './router-keys.js';
import { routingRoutes } from './routing-routes.js';
import type { RouteDef } from './route-table.js';
import type { Schema } from './schema.js';

/** Said on the router page and in every router object: what automatic routing can and cannot be trusted with. */
export const ROUTING_CAUTION =
  'Automatic routing makes mistakes. Decisions below the abstain threshold are marked for a person to check; ' +
  'messages about safety, health or legal deadlines should never depend on automatic routing alone.';

const TRAINING_OPTIONS = {
  folds: { type: 'integer', minimum: 2, maximum: 20, default: 5 },
  alpha: { type: 'number', exclusiveMinimum: 0, maximum: 100, default: 1 },
  targetPrecision: { type: 'number', exclusiveMinimum: 0, maximum: 1, default: 0.9 },
  seed: { type: 'integer', minimum: 0, maximum: 2 ** 31 - 1, default: 1 },
  variant: { type: 'string', enum: ['auto', 'multinomial', 'complement', 'tfidf', 'tfidf-complement'], description: 'Scoring variant; "auto" picks by held-out accuracy.' },
} as const satisfies Record<string, Schema>;

const TRAIN_BODY: Schema = {
  type: 'object',
  properties: {
    analysisId: { type: 'string', maxLength: 100, description: 'Train from the named themes of this analysis…' },
    corpusId: { type: 'string', maxLength: 100, description: '…or from the labels in a metadata field of this corpus.' },
    labelField: { type: 'string', maxLength: 200 },
    ...TRAINING_OPTIONS,
  },
  additionalProperties: false,
};

const RETRAIN_BODY: Schema = { type: 'object', properties: { ...TRAINING_OPTIONS }, additionalProperties: false };

const ROUTER: Schema = {
  type: 'object',
  properties: {
    id: { type: 'string' },
    status: { type: 'string', enum: ['queued', 'running', 'done', 'failed', 'cancelled'] },
    version: { type: 'integer', description: 'The serving version (0 until the first training succeeds).' },
    labels: { type: 'array', items: { type: 'string' } },
    documentCount: { type: 'integer' },
    evaluation: { type: 'object', properties: {} },
    abstainThreshold: { type: 'number' },
    caution: { type: 'string' },
  },
};

function pickParams(body: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(TRAINING_OPTIONS)) if (body[k] !== undefined) out[k] = body[k];
  return out;
}

function routerView(r: RouterRecord, job: JobRecord | null) {
  return {
    id: r.id,
    createdAt: r.createdAt,
    ...jobState(job, 'failed'),
    source: r.source,
    params: r.params,
    version: r.version,
    labels: r.labels,
    documentCount: r.documentCount,
    evaluation: r.evaluation,
    abstainThreshold: r.abstainThreshold,
    caution: ROUTING_CAUTION,
  };
}

/** The router endpoints: train, read, follow, cancel, retrain, keys; routing itself is in routing-routes. */
export function routerRoutes(deps: AppDeps): RouteDef[] {
  const { store, runner } = deps;
  const keys = new KeyCache(store);
  const get = async (rid: string) => {
    const r = await store.getRouter(rid);
    if (!r) throw notFound('router', rid);
    return r;
  };
  const checkSource = async (source: TrainingSource) => {
    try {
      await collectTrainingSet(store, source);
    } catch (e) {
      if (e instanceof SourceNotFoundError) throw notFound(e.kind, e.id);
      if (e instanceof RangeError) throw new ApiError('unprocessable', e.message);
      throw e;
    }
  };
  const checkQueue = async () => {
    if ((await store.countQueued()) >= deps.config.maxQueuedJobs) {
      throw new ApiError('too_many_requests', 'Too many jobs are waiting; try again shortly.', {}, { 'Retry-After': '10' });
    }
  };
  return [
    {
      method: 'post',
      path: '/routers',
      tag: 'routers',
      summary: 'Train a naive-Bayes router from named themes or a label field',
      body: TRAIN_BODY,
      responses: { 202: { description: 'Training queued.', schema: { type: 'object', properties: { id: { type: 'string' }, status: { type: 'string' } } } } },
      handler: async (c, { body }) => {
        let source: TrainingSource;
        if (typeof body.analysisId === 'string' && body.corpusId === undefined && body.labelField === undefined) source = { analysisId: body.analysisId };
        else if (typeof body.corpusId === 'string' && typeof body.labelField === 'string' && body.analysisId === undefined) {
          source = { corpusId: body.corpusId, labelField: body.labelField };
        } else throw new ApiError('bad_request', 'Give either "analysisId", or both "corpusId" and "labelField".');
        await checkSource(source);
        await checkQueue();
        const id = newId('r');
        const jobId = newId('j');
        await store.createRouter(id, jobId, source as unknown as Record<string, unknown>, pickParams(body));
        await runner.enqueue(jobId, 'training', id);
        return c.json({ id, status: 'queued' }, 202);
      },
    },
    {
      method: 'get',
      path: '/routers',
      tag: 'routers',
      summary: 'List routers',
      responses: { 200: { description: 'Routers, oldest first.', schema: { type: 'array', items: ROUTER } } },
      handler: async (c) => {
        const list = await store.listRouters();
        return c.json(await Promise.all(list.map(async (r) => routerView(r, await store.getJob(r.jobId)))));
      },
    },
    {
      method: 'get',
      path: '/routers/:rid',
      tag: 'routers',
      summary: 'A router: training status and its cross-validated evaluation',
      responses: { 200: { description: 'The router.', schema: ROUTER } },
      handler: async (c) => {
        const r = await get(c.req.param('rid')!);
        return c.json(routerView(r, await store.getJob(r.jobId)));
      },
    },
    {
      method: 'delete',
      path: '/routers/:rid',
      tag: 'routers',
      summary: 'Delete a router and its keys',
      responses: { 204: { description: 'Deleted.' } },
      handler: async (c) => {
        const rid = c.req.param('rid')!;
        const r = await get(rid);
        await runner.cancel(r.jobId);
        await store.deleteRouter(rid);
        return c.body(null, 204);
      },
    },
    {
      method: 'post',
      path: '/routers/:rid/retrain',
      tag: 'routers',
      summary: 'Train a new version from the same source; the current version serves until it is ready',
      body: RETRAIN_BODY,
      responses: { 202: { description: 'Training queued.' } },
      handler: async (c, { body }) => {
        const r = await get(c.req.param('rid')!);
        const job = await store.getJob(r.jobId);
        if (job && (job.status === 'queued' || job.status === 'running')) throw new ApiError('conflict', 'This router is already being trained.');
        await checkSource(r.source as TrainingSource);
        await checkQueue();
        const jobId = newId('j');
        await store.setRouterJob(r.id, jobId, { ...r.params, ...pickParams(body) });
        await runner.enqueue(jobId, 'training', r.id);
        return c.json({ id: r.id, status: 'queued' }, 202);
      },
    },
    {
      method: 'get',
      path: '/routers/:rid/events',
      tag: 'routers',
      summary: 'Training progress as Server-Sent Events until a final {"status"} event',
      responses: { 200: { description: 'An event stream.', contentType: 'text/event-stream', schema: { type: 'string' } } },
      handler: async (c) => {
        const r = await get(c.req.param('rid')!);
        return jobEventStream(c, store, runner, r.jobId);
      },
    },
    {
      method: 'post',
      path: '/routers/:rid/cancel',
      tag: 'routers',
      summary: 'Cancel the training in progress (the serving version, if any, keeps serving)',
      responses: { 202: { description: 'Cancelling.' } },
      handler: async (c) => {
        const r = await get(c.req.param('rid')!);
        if (!(await runner.cancel(r.jobId))) throw new ApiError('conflict', 'No training of this router is in progress.');
        return c.json({ id: r.id, status: 'cancelling' }, 202);
      },
    },
    {
      method: 'post',
      path: '/routers/:rid/keys',
      tag: 'keys',
      summary: 'Create a routing key (shown once; only its hash is kept)',
      responses: { 201: { description: 'The key.', schema: { type: 'object', properties: { id: { type: 'string' }, key: { type: 'string' }, prefix: { type: 'string' } } } } },
      handler: async (c) => {
        const r = await get(c.req.param('rid')!);
        const k = newRouterKey();
        const id = newId('k');
        await store.addKey({ id, routerId: r.id, hash: k.hash, prefix: k.prefix, createdAt: new Date().toISOString(), revokedAt: null, lastUsedAt: null });
        return c.json({ id, key: k.key, prefix: k.prefix }, 201);
      },
    },
    {
      method: 'get',
      path: '/routers/:rid/keys',
      tag: 'keys',
      summary: 'List a router’s keys (prefixes only)',
      responses: { 200: { description: 'Keys.' } },
      handler: async (c) => {
        const r = await get(c.req.param('rid')!);
        const keys = await store.listKeys(r.id);
        return c.json(keys.map((k) => ({ id: k.id, prefix: k.prefix, createdAt: k.createdAt, revokedAt: k.revokedAt, lastUsedAt: k.lastUsedAt })));
      },
    },
    {
      method: 'delete',
      path: '/routers/:rid/keys/:kid',
      tag: 'keys',
      summary: 'Revoke a key; it stops working at once',
      responses: { 204: { description: 'Revoked.' } },
      handler: async (c) => {
        const r = await get(c.req.param('rid')!);
        const kid = c.req.param('kid')!;
        if (!(await store.revokeKey(r.id, kid))) throw new ApiError('not_found', `This router has no active key "${kid}".`, { keyId: kid });
        keys.forget(kid);
        return c.body(null, 204);
      },
    },
    ...routingRoutes(deps, keys),
  ];
}
