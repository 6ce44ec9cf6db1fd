import type { AnalysisRecord, JobRecord } from '../store/api.js';
import { jobState } from './job-state.js';

/** The contract's analysis object, from the stored analysis and its job. */
export function analysisView(a: AnalysisRecord, job: JobRecord | null) {
  const s = a.summary;
  const silhouetteByK: Record<string, number> = {};
  for (const p of s?.silhouetteByK ?? []) silhouetteByK[String(p.k)] = p.silhouette;
  const referenceByK: Record<string, number> = {};
  for (const p of s?.referenceByK ?? []) referenceByK[String(p.k)] = p.silhouette;
  return {
    id: a.id,
    corpusId: a.corpusId,
    createdAt: a.createdAt,
    ...jobState(job, s ? 'done' : 'failed'),
    params: a.params,
    k: s?.k ?? null,
    silhouette: s?.silhouette ?? null,
    silhouetteByK,
    referenceByK,
    kRule: s?.kRule ?? null,
    termCount: s?.termCount ?? null,
    clusters: a.clusters.map((c) => ({
      id: c.id,
      name: c.name,
      size: c.size,
      terms: c.terms,
      representativeIds: c.representativeIds,
      silhouette: c.silhouette,
      noContent: c.noContent,
    })),
    timings: s?.timings ?? {},
  };
}
