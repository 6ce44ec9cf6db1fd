import type { DescribeInput, DescribeOutput } from '../jobs/tasks/index.js';
import type { ClusterRecord } from '../store/api.js';
import { mergeClusters, moveDocuments, type Relabelling } from '../triage/index.js';
import { analysisView } from './analysis-view.js';
import { ANALYSIS } from './analysis-routes.js';
import { ApiError, notFound } from './api-error.js';
import type { AppDeps } from './deps.js';
import type { RouteDef } from './route-table.js';

/** Edits of one analysis run one at a time, so two quick merges cannot lose each other. */
const locks = new Map<string, Promise<unknown>>();
function serialised<T>(key: string, fn: () => Promise<T>): Promise<T> {
  const prev = locks.get(key) ?? Promise.resolve();
  const next = prev.then(fn, fn);
  const tail = next.catch(() => {});
  locks.set(key, tail);
  void tail.then(() => {
    if (locks.get(key) === tail) locks.delete(key);
  });
  return next;
}

/** The triage edits: rename a theme, merge themes, move documents. Each answers the updated analysis. */
export function analysisTriageRoutes(deps: AppDeps): RouteDef[] {
  const { store, pool } = deps;

  async function finished(aid: string) {
    const a = await store.getAnalysis(aid);
    if (!a) throw notFound('analysis', aid);
    if (!a.summary) throw new ApiError('conflict', 'The analysis has not finished; edit its themes once it is done.');
    return a;
  }

  function clusterIndex(clusters: ClusterRecord[], id: string): number {
    const i = clusters.findIndex((c) => c.id === id);
    if (i < 0) throw new ApiError('not_found', `The analysis has no theme "${id}".`, { clusterId: id });
    return i;
  }

  /** Applies a relabelling: re-describes the themes in a worker and stores everything at once. */
  async function apply(aid: string, clusters: ClusterRecord[], edit: Relabelling, names: (string | null)[]) {
    const a = (await store.getAnalysis(aid))!;
    const arrays = await store.loadArrays(aid, ['reduced', 'tfidf.indptr', 'tfidf.indices', 'tfidf.values']);
    const extra = (await store.loadExtra(aid)) as { termLabels: string[]; reducedCols: number; tfidfCols: number };
    const out = await pool.run<DescribeOutput>('describe', {
      tfidf: {
        indptr: arrays['tfidf.indptr'] as Uint32Array,
        indices: arrays['tfidf.indices'] as Uint32Array,
        values: arrays['tfidf.values'] as Float32Array,
        cols: extra.tfidfCols,
      },
      reduced: arrays.reduced as Float32Array,
      reducedCols: extra.reducedCols,
      labels: edit.labels,
      k: edit.k,
      termLabels: extra.termLabels,
    } satisfies DescribeInput);
    const ids = await store.loadDocumentIds(a.corpusId);
    const next: ClusterRecord[] = [];
    clusters.forEach((old, i) => {
      const j = edit.mapping[i];
      if (j < 0) return;
      const d = out.clusters[j];
      next[j] = {
        id: old.id,
        name: names[i],
        size: d.size,
        terms: d.terms,
        representativeIds: d.representatives.map((r) => ids[r]),
        silhouette: d.silhouette,
        noContent: old.noContent,
      };
    });
    await store.saveTriage(aid, next, { labels: edit.labels, silhouettes: out.silhouettes }, out.silhouette);
  }

  const answer = async (aid: string) => analysisView((await store.getAnalysis(aid))!, await store.getJob(aid));

  return [
    {
      method: 'patch',
      path: '/analyses/:aid/clusters/:clid',
      tag: 'triage',
      summary: 'Name (or rename) a theme; an empty name clears it',
      body: { type: 'object', properties: { name: { oneOf: [{ type: 'string', maxLength: 200 }, { type: 'null' }] } }, required: ['name'], additionalProperties: false },
      responses: { 200: { description: 'The updated analysis.', schema: ANALYSIS } },
      handler: async (c, { body }) => {
        const aid = c.req.param('aid')!;
        const clid = c.req.param('clid')!;
        await finished(aid);
        const name = typeof body.name === 'string' && body.name.trim() ? body.name.trim() : null;
        if (!(await store.renameCluster(aid, clid, name))) throw new ApiError('not_found', `The analysis has no theme "${clid}".`, { clusterId: clid });
        return c.json(await answer(aid));
      },
    },
    {
      method: 'post',
      path: '/analyses/:aid/merge',
      tag: 'triage',
      summary: 'Merge themes into the first one listed',
      body: {
        type: 'object',
        properties: { clusterIds: { type: 'array', items: { type: 'string', maxLength: 100 }, minItems: 2, maxItems: 1000 }, name: { type: 'string', maxLength: 200 } },
        required: ['clusterIds'],
        additionalProperties: false,
      },
      responses: { 200: { description: 'The updated analysis.', schema: ANALYSIS } },
      handler: async (c, { body }) => {
        const aid = c.req.param('aid')!;
        return serialised(aid, async () => {
          const a = await finished(aid);
          const idx = (body.clusterIds as string[]).map((id) => clusterIndex(a.clusters, id));
          if (idx.some((i) => a.clusters[i].noContent)) {
            throw new ApiError('unprocessable', 'The theme of documents without usable words cannot be merged; move its documents instead.');
          }
          const { labels } = await store.loadArrays(aid, ['labels']);
          let edit: Relabelling;
          try {
            edit = mergeClusters(labels as Int32Array, a.clusters.length, idx);
          } catch (e) {
            throw new ApiError('unprocessable', (e as Error).message);
          }
          const names = a.clusters.map((cl) => cl.name);
          const given = typeof body.name === 'string' && body.name.trim() ? body.name.trim() : null;
          names[idx[0]] = given ?? idx.map((i) => a.clusters[i].name).find((n) => n) ?? null;
          await apply(aid, a.clusters, edit, names);
          return c.json(await answer(aid));
        });
      },
    },
    {
      method: 'post',
      path: '/analyses/:aid/moves',
      tag: 'triage',
      summary: 'Move documents to a theme',
      body: {
        type: 'object',
        properties: { documentIds: { type: 'array', items: { type: 'string', maxLength: 1000 }, minItems: 1, maxItems: 100000 }, clusterId: { type: 'string', maxLength: 100 } },
        required: ['documentIds', 'clusterId'],
        additionalProperties: false,
      },
      maxBodyBytes: 16 * 1024 * 1024,
      responses: { 200: { description: 'The updated analysis.', schema: ANALYSIS } },
      handler: async (c, { body }) => {
        const aid = c.req.param('aid')!;
        return serialised(aid, async () => {
          const a = await finished(aid);
          const target = clusterIndex(a.clusters, body.clusterId);
          if (a.clusters[target].noContent) throw new ApiError('unprocessable', 'Documents cannot be moved into the theme of documents without usable words.');
          const ids = await store.loadDocumentIds(a.corpusId);
          const pos = new Map(ids.map((id, i) => [id, i]));
          const docs = (body.documentIds as string[]).map((id) => {
            const p = pos.get(id);
            if (p === undefined) throw new ApiError('not_found', `The corpus has no document "${id}".`, { documentId: id });
            return p;
          });
          const { labels } = await store.loadArrays(aid, ['labels']);
          const edit = moveDocuments(labels as Int32Array, a.clusters.length, docs, target);
          await apply(aid, a.clusters, edit, a.clusters.map((cl) => cl.name));
          return c.json(await answer(aid));
        });
      },
    },
  ];
}
