import { analyseSteps, type AnalysisOptions, type ClusterSummary } from '../../cluster/index.js';
import { seededRandom } from '../../common/random.js';
import type { Stepwise } from '../../common/step.js';
import { autoEpochs, projectSteps } from '../../map/index.js';
import { fitTfidfSteps } from '../../text/index.js';
import type { TaskDefinition, TaskEnv } from '../api.js';
import { timed } from './timed.js';

export interface AnalyseInput {
  texts: string[];
  /** The clustering's options, plus the map's layout epochs (analyses stored before it have none: "auto"). */
  params: Partial<AnalysisOptions> & { mapEpochs?: number | 'auto' | 'fine' };
}

export interface AnalyseOutput {
  k: number;
  silhouette: number;
  silhouetteByK: { k: number; silhouette: number }[];
  referenceByK: { k: number; silhouette: number }[];
  kRule: string;
  clusters: ClusterSummary[];
  labels: Int32Array;
  silhouettes: Float32Array;
  xy: Float32Array;
  reduced: Float32Array;
  reducedCols: number;
  tfidf: { indptr: Uint32Array; indices: Uint32Array; values: Float32Array; cols: number };
  termLabels: string[];
  timings: Record<string, number>;
}

/** Layout epochs of a "fine" map, at the least (see AnalyseInput.params.mapEpochs). */
const FINE_EPOCHS = 200;

const CLUSTER_STAGES = [
  { name: 'vectorise', weight: 1, parts: [{ name: 'tokenise', weight: 3 }, { name: 'weigh', weight: 1 }] },
  { name: 'reduce', weight: 2 },
  { name: 'sweep-k', weight: 3 },
  { name: 'cluster', weight: 0.5 },
  { name: 'describe', weight: 0.5 },
];

function* analysis(input: AnalyseInput, env: TaskEnv): Stepwise<AnalyseOutput> {
  const timings: Record<string, number> = {};
  const fitted = yield* timed('vectorise', fitTfidfSteps(input.texts), timings);
  const matrix = fitted.matrix;
  const termLabels = fitted.vectorizer.labels;
  const t0 = performance.now();
  const result = yield* analyseSteps(matrix, termLabels, input.params, env.spare);
  timings.cluster = (performance.now() - t0) / 1000;
  const seed = typeof input.params.seed === 'number' ? input.params.seed : 1;
  const asked = input.params.mapEpochs ?? 'auto';
  // "fine": at least the 200 epochs plain umap-js runs beyond 10,000 points (our "auto" runs fewer there).
  const epochs = asked === 'fine' ? Math.max(FINE_EPOCHS, autoEpochs(result.reduced.rows)) : asked;
  const xy = yield* timed('map', projectSteps(result.reduced, { random: seededRandom(seed), epochs }, env.spare), timings);
  return {
    k: result.k,
    silhouette: result.silhouette,
    silhouetteByK: result.silhouetteByK,
    referenceByK: result.referenceByK,
    kRule: result.kRule,
    clusters: result.clusters,
    labels: result.labels,
    silhouettes: result.silhouettes,
    xy,
    reduced: result.reduced.data,
    reducedCols: result.reduced.cols,
    tfidf: { indptr: matrix.indptr, indices: matrix.indices, values: matrix.values, cols: matrix.cols },
    termLabels,
    timings,
  };
}

/**
 * A whole analysis in a worker: vectorise → reduce, sweep k, cluster, describe (the clustering
 * engine's stages) → map. Weights from bench/cluster.ts and bench/map.ts on 50,000 documents
 * (seconds per stage, rounded).
 */
export const analyseTask: TaskDefinition<AnalyseInput, AnalyseOutput> = {
  stages: [
    ...CLUSTER_STAGES,
    {
      name: 'map',
      weight: 5,
      parts: [
        { name: 'knn', weight: 3 },
        { name: 'graph', weight: 0.5 },
        { name: 'sketch', weight: 0.8 },
        { name: 'layout', weight: 2 },
      ],
    },
  ],
  run: (input, env) => analysis(input, env),
};
