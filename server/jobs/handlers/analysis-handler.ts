import type { ClusterRecord, Store } from '../../store/api.js';
import type { Progress } from '../api.js';
import type { JobContext, JobHandler } from '../job-runner.js';
import type { AnalyseInput, AnalyseOutput, MapInput, MapOutput } from '../tasks/index.js';

/** The clustering half's share of the progress bar when the map runs beside it (they take about as long). */
const CLUSTER_SHARE = 0.5;

/** Runs the clustering and the map on two workers at once; either failing stops the other. */
async function clusterBesideMap(input: MapInput, ctx: JobContext): Promise<AnalyseOutput> {
  const both = new AbortController();
  const stop = () => both.abort();
  ctx.signal.addEventListener('abort', stop, { once: true });
  let cluster: Progress = { stage: 'vectorise', fraction: 0 };
  let map = 0;
  const report = () =>
    ctx.report({
      stage: cluster.fraction < 1 ? cluster.stage : 'map',
      fraction: CLUSTER_SHARE * cluster.fraction + (1 - CLUSTER_SHARE) * map,
      ...(cluster.fraction < 1 && cluster.detail ? { detail: cluster.detail } : {}),
    });
  const clustering = ctx.pool.run<AnalyseOutput>('cluster', input satisfies AnalyseInput, (p) => ((cluster = p), report()), both.signal);
  const mapping = ctx.pool.run<MapOutput>('map', input, (p) => ((map = p.fraction), report()), both.signal);
  clustering.then(() => ((cluster = { stage: 'map', fraction: 1 }), report()), stop);
  mapping.catch(stop);
  try {
    const [out, laid] = await Promise.all([clustering, mapping]);
    out.xy = laid.xy;
    out.timings.map = laid.timings.map;
    return out;
  } finally {
    ctx.signal.removeEventListener('abort', stop);
  }
}

/** Cluster ids are positions at creation (`t1`, `t2`, …): stable through renames, merges and moves. */
export function clusterIdFor(index: number): string {
  return `t${index + 1}`;
}

/**
 * Runs an analysis job: loads the corpus, computes in one or two workers, stores clusters and
 * per-document arrays in one transaction.
 */
export function analysisJobHandler(store: Store): JobHandler {
  return {
    async run(job, ctx) {
      const analysis = await store.getAnalysis(job.targetId);
      if (!analysis) throw new Error(`Analysis ${job.targetId} no longer exists.`);
      const docs = await store.loadDocuments(analysis.corpusId);
      ctx.report({ stage: 'vectorise', fraction: 0 });
      const input = { texts: docs.map((d) => d.text), params: analysis.params };
      // With two idle workers the map is laid out beside the clustering (it repeats the seeded
      // reduction: more CPU, about a quarter less waiting on 50,000 documents); otherwise one
      // worker does it all, so concurrent jobs do not pay for the repeat.
      const out =
        ctx.pool.size - ctx.pool.busy >= 2
          ? await clusterBesideMap(input, ctx)
          : await ctx.pool.run<AnalyseOutput>('analyse', input satisfies AnalyseInput, ctx.report, ctx.signal);
      const clusters: ClusterRecord[] = out.clusters.map((c, i) => ({
        id: clusterIdFor(i),
        name: null,
        size: c.size,
        terms: c.terms,
        representativeIds: c.representatives.map((r) => docs[r].id),
        silhouette: c.silhouette,
        noContent: c.noContent,
      }));
      await store.saveAnalysisResult(
        analysis.id,
        {
          // Themes found; the no-content group (if any) is not one of them, as in silhouetteByK.
          k: out.clusters.filter((c) => !c.noContent).length,
          silhouette: out.silhouette,
          silhouetteByK: out.silhouetteByK,
          referenceByK: out.referenceByK,
          kRule: out.kRule,
          timings: out.timings,
          termCount: out.tfidf.cols,
        },
        clusters,
        {
          labels: out.labels,
          silhouettes: out.silhouettes,
          xy: out.xy,
          reduced: out.reduced,
          'tfidf.indptr': out.tfidf.indptr,
          'tfidf.indices': out.tfidf.indices,
          'tfidf.values': out.tfidf.values,
        },
        { termLabels: out.termLabels, reducedCols: out.reducedCols, tfidfCols: out.tfidf.cols },
      );
    },
  };
}
