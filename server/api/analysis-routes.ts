import { analysisOptions } from '../cluster/index.js';
import { newId } from '../store/index.js';
import { analysisExportRoutes } from './analysis-export.js';
import { analysisTriageRoutes } from './analysis-triage.js';
import { analysisView } from './analysis-view.js';
import { ApiError, notFound } from './api-error.js';
import type { AppDeps } from './deps.js';
import { jobEventStream } from './job-events.js';
import type { RouteDef } from './route-table.js';
import type { Schema } from './schema.js';

export const ANALYSIS_PARAMS: Schema = {
  type: 'object',
  properties: {
    method: { type: 'string', enum: ['kmeans', 'agglomerative'], default: 'kmeans' },
    k: { oneOf: [{ type: 'string', enum: ['auto'] }, { type: 'integer', minimum: 2, maximum: 1000 }], default: 'auto', description: '"auto" or a number of themes' },
    kMin: { type: 'integer', minimum: 2, maximum: 100, default: 2 },
    kMax: { type: 'integer', minimum: 2, maximum: 100, default: 30 },
    linkage: { type: 'string', enum: ['average', 'complete', 'ward'], default: 'average' },
    seed: { type: 'integer', minimum: 0, maximum: 2 ** 31 - 1, default: 1 },
    mapEpochs: {
      oneOf: [{ type: 'string', enum: ['auto', 'fine'] }, { type: 'integer', minimum: 10, maximum: 1000 }],
      default: 'auto',
      description: 'Passes of the map layout. "auto" keeps large maps quick (30 passes at 50,000 documents); "fine" makes at least 200, as plain umap-js does beyond 10,000 points: a slightly more faithful map for several times the layout time; or a number of passes.',
    },
  },
  additionalProperties: false,
};

const CLUSTER: Schema = {
  type: 'object',
  properties: {
    id: { type: 'string' },
    name: { type: 'string', description: 'null until named' },
    size: { type: 'integer' },
    terms: { type: 'array', items: { type: 'string' } },
    representativeIds: { type: 'array', items: { type: 'string' } },
    silhouette: { type: 'number' },
    noContent: { type: 'boolean', description: 'The theme of documents with no usable words (all stop words, empty after cleaning).' },
  },
};

export const ANALYSIS: Schema = {
  type: 'object',
  properties: {
    id: { type: 'string' },
    corpusId: { type: 'string' },
    status: { type: 'string', enum: ['queued', 'running', 'done', 'failed', 'cancelled'] },
    progress: { type: 'object', properties: { stage: { type: 'string' }, fraction: { type: 'number' } } },
    error: { type: 'object', properties: { code: { type: 'string' }, message: { type: 'string' } } },
    params: ANALYSIS_PARAMS,
    k: { type: 'integer' },
    silhouette: { type: 'number' },
    silhouetteByK: { type: 'object', properties: {}, additionalProperties: { type: 'number' } },
    referenceByK: { type: 'object', properties: {}, additionalProperties: { type: 'number' }, description: 'Mean silhouette by k on a shuffled, structureless copy of the documents (the yardstick of k = "auto").' },
    kRule: { type: 'string', description: 'How k was chosen, in words.' },
    clusters: { type: 'array', items: CLUSTER },
    timings: { type: 'object', properties: {}, additionalProperties: { type: 'number' } },
  },
};

/** The analysis endpoints: create, read, follow, cancel; triage and export live beside. */
export function analysisRoutes(deps: AppDeps): RouteDef[] {
  const { store, runner } = deps;
  const view = async (aid: string) => {
    const a = await store.getAnalysis(aid);
    if (!a) throw notFound('analysis', aid);
    return analysisView(a, await store.getJob(aid));
  };
  return [
    {
      method: 'post',
      path: '/corpora/:cid/analyses',
      tag: 'analyses',
      summary: 'Start finding the themes of a corpus',
      body: ANALYSIS_PARAMS,
      responses: { 202: { description: 'Queued.', schema: { type: 'object', properties: { id: { type: 'string' }, status: { type: 'string' } } } } },
      handler: async (c, { body }) => {
        const cid = c.req.param('cid')!;
        const corpus = await store.getCorpus(cid);
        if (!corpus) throw notFound('corpus', cid);
        const params = analysisOptions(body);
        if (typeof params.k === 'number' && params.k > corpus.documentCount) {
          throw new ApiError('unprocessable', `k = ${params.k} is more than the ${corpus.documentCount} documents of the corpus.`, { field: 'k' });
        }
        if (corpus.documentCount < 2) throw new ApiError('unprocessable', 'A corpus needs at least 2 documents to be grouped into themes.');
        if ((await store.countQueued()) >= deps.config.maxQueuedJobs) {
          throw new ApiError('too_many_requests', 'Too many jobs are waiting; try again shortly.', {}, { 'Retry-After': '10' });
        }
        const id = newId('a');
        const mapEpochs = (body as { mapEpochs?: number | 'auto' | 'fine' }).mapEpochs ?? 'auto';
        const stored = { method: params.method, k: params.k, kMin: params.kMin, kMax: params.kMax, linkage: params.linkage, seed: params.seed, mapEpochs };
        await store.createAnalysis(id, cid, stored);
        await runner.enqueue(id, 'analysis', id);
        return c.json({ id, status: 'queued' }, 202);
      },
    },
    {
      method: 'get',
      path: '/corpora/:cid/analyses',
      tag: 'analyses',
      summary: 'The analyses of a corpus, oldest first',
      responses: { 200: { description: 'Analyses.', schema: { type: 'array', items: ANALYSIS } } },
      handler: async (c) => {
        const cid = c.req.param('cid')!;
        if (!(await store.getCorpus(cid))) throw notFound('corpus', cid);
        const list = await store.listAnalyses(cid);
        return c.json(await Promise.all(list.map(async (a) => analysisView(a, await store.getJob(a.id)))));
      },
    },
    {
      method: 'get',
      path: '/analyses/:aid',
      tag: 'analyses',
      summary: 'An analysis: status, progress, themes and their descriptions',
      responses: { 200: { description: 'The analysis.', schema: ANALYSIS } },
      handler: async (c) => c.json(await view(c.req.param('aid')!)),
    },
    {
      method: 'get',
      path: '/analyses/:aid/events',
      tag: 'analyses',
      summary: 'Progress as Server-Sent Events until a final {"status"} event',
      responses: { 200: { description: 'An event stream.', contentType: 'text/event-stream', schema: { type: 'string' } } },
      handler: async (c) => {
        const aid = c.req.param('aid')!;
        if (!(await store.getAnalysis(aid))) throw notFound('analysis', aid);
        return jobEventStream(c, store, runner, aid);
      },
    },
    {
      method: 'post',
      path: '/analyses/:aid/cancel',
      tag: 'analyses',
      summary: 'Cancel a queued or running analysis',
      responses: { 202: { description: 'Cancelling; the analysis ends `cancelled` within a second or two.' } },
      handler: async (c) => {
        const aid = c.req.param('aid')!;
        const job = await store.getJob(aid);
        if (!job) throw notFound('analysis', aid);
        if (!(await runner.cancel(aid))) {
          throw new ApiError('conflict', `The analysis has already ended (${job.status}); there is nothing to cancel.`, { status: job.status });
        }
        return c.json({ id: aid, status: 'cancelling' }, 202);
      },
    },
    ...analysisTriageRoutes(deps),
    ...analysisExportRoutes(deps),
  ];
}
