import { describeClustersSteps, type ClusterSummary } from '../../cluster/index.js';
import type { Stepwise } from '../../common/step.js';
import type { TaskDefinition } from '../api.js';

export interface DescribeInput {
  tfidf: { indptr: Uint32Array; indices: Uint32Array; values: Float32Array; cols: number };
  reduced: Float32Array;
  reducedCols: number;
  labels: Int32Array;
  k: number;
  termLabels: string[];
}

export interface DescribeOutput {
  clusters: ClusterSummary[];
  silhouettes: Float32Array;
  silhouette: number;
}

/** Re-describes clusters after a triage edit (merge or move) changed who belongs where. */
export const describeTask: TaskDefinition<DescribeInput, DescribeOutput> = {
  stages: [{ name: 'describe', weight: 1 }],
  *run(input): Stepwise<DescribeOutput> {
    const n = input.labels.length;
    const tfidf = { rows: n, cols: input.tfidf.cols, indptr: input.tfidf.indptr, indices: input.tfidf.indices, values: input.tfidf.values };
    const reduced = { rows: n, cols: input.reducedCols, data: input.reduced };
    return yield* describeClustersSteps(tfidf, reduced, input.labels, input.k, input.termLabels);
  },
};
