import { analysisOptions, reducedRowsSteps, type AnalysisOptions } from '../../cluster/index.js';
import { seededRandom } from '../../common/random.js';
import type { Stepwise } from '../../common/step.js';
import { projectSteps } from '../../map/index.js';
import { fitTfidfSteps } from '../../text/index.js';
import type { TaskDefinition } from '../api.js';
import { timed } from './timed.js';

export interface MapInput {
  texts: string[];
  params: Partial<AnalysisOptions>;
}

export interface MapOutput {
  xy: Float32Array;
  timings: Record<string, number>;
}

/**
 * The map of an analysis on a worker of its own, beside the clustering: it vectorises and reduces
 * the documents exactly as the clustering does (same options and seed, so the very same LSA rows),
 * then lays them out.
 */
export const mapTask: TaskDefinition<MapInput, MapOutput> = {
  // Weights from bench/cluster.ts and bench/map.ts on 50,000 documents (seconds, rounded).
  stages: [
    { name: 'vectorise', weight: 1 },
    { name: 'reduce', weight: 2 },
    {
      name: 'map',
      weight: 5,
      parts: [
        { name: 'knn', weight: 3 },
        { name: 'graph', weight: 0.5 },
        { name: 'layout', weight: 2 },
      ],
    },
  ],
  *run(input, env): Stepwise<MapOutput> {
    const o = analysisOptions(input.params);
    const timings: Record<string, number> = {};
    const { matrix } = yield* timed('vectorise', fitTfidfSteps(input.texts), timings);
    const reduced = yield* timed('reduce', reducedRowsSteps(matrix, o, env.spare), timings);
    const xy = yield* timed('map', projectSteps(reduced, { random: seededRandom(o.seed) }, env.spare), timings);
    return { xy, timings: { map: timings.map } };
  },
};
