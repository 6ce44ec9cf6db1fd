/**
 * Describes clusters so a person can name them at a glance: size, distinctive terms,
 * representative documents and silhouettes. Cheap enough (O(n·k·d + nnz + k·V)) to rerun
 * synchronously after every triage edit.
 */
import type { Csr, Dense } from '../common/matrix.js';
import { drain, type Stepwise } from '../common/step.js';
import type { ClusterSummary, DescribeOptions } from './api.js';
import { clusterTermCounts, distinctiveTerms } from './distinctive-terms.js';
import { representatives } from './representatives.js';
import { cosineSilhouette } from './silhouette.js';

/** Defaults of `DescribeOptions` (see each field's `@default`). */
export const DEFAULT_DESCRIBE_OPTIONS: Readonly<DescribeOptions> = {
  termsPerCluster: 10,
  representativesPerCluster: 5,
  priorStrength: 500,
  duplicateCosine: 0.98,
};

/** What `describeClusters` returns. */
export interface ClusterDescription {
  /** One summary per cluster index 0..k−1. */
  clusters: ClusterSummary[];
  /** Silhouette per document (0 for documents without content and for members of one-document clusters). */
  silhouettes: Float32Array;
  /** Mean silhouette over documents with content (0 when there are none). */
  silhouette: number;
}

const ROWS_PER_STEP = 8192;

function mergeOptions(opts: Partial<DescribeOptions>): DescribeOptions {
  const o = { ...DEFAULT_DESCRIBE_OPTIONS, ...opts };
  for (const key of ['termsPerCluster', 'representativesPerCluster'] as const) {
    if (!Number.isInteger(o[key]) || o[key] < 0 || o[key] > 1000) throw new RangeError(`${key} must be an integer from 0 to 1000; got ${o[key]}`);
  }
  if (!(o.priorStrength > 0) || !Number.isFinite(o.priorStrength)) throw new RangeError(`priorStrength must be a positive number; got ${o.priorStrength}`);
  if (!(o.duplicateCosine > 0 && o.duplicateCosine <= 1)) throw new RangeError(`duplicateCosine must be in (0, 1]; got ${o.duplicateCosine}`);
  return o;
}

function validate(tfidf: Csr, reduced: Dense, labels: Int32Array, k: number, termLabels: readonly string[]): void {
  const n = labels.length;
  if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a positive integer; got ${k}`);
  if (tfidf.rows !== n || reduced.rows !== n) throw new RangeError(`Expected one label per document: ${n} labels, ${tfidf.rows} TF-IDF rows, ${reduced.rows} reduced rows`);
  if (reduced.data.length !== reduced.rows * reduced.cols) throw new RangeError(`The reduced matrix says ${reduced.rows} × ${reduced.cols} but holds ${reduced.data.length} numbers`);
  if (termLabels.length !== tfidf.cols) throw new RangeError(`Expected ${tfidf.cols} term labels (one per TF-IDF column); got ${termLabels.length}`);
  for (let i = 0; i < n; i++) {
    if (!(labels[i] >= 0 && labels[i] < k)) throw new RangeError(`Document ${i} has cluster ${labels[i]}; clusters are numbered 0..${k - 1}`);
  }
}

/**
 * Describes every cluster of a labelling, yielding `"describe"` steps.
 *
 * A document has content when its TF-IDF row has a non-zero entry and its reduced row is
 * (about) unit length. Documents without content get silhouette 0 and are left out of every
 * mean, centroid and choice; a non-empty cluster made only of them is the no-content cluster
 * (`noContent: true`, terms [], representatives [], silhouette 0).
 *
 * Silhouette (Rousseeuw 1987) with cosine distance, for all n documents in O(n·k·d), by the
 * identity stated in silhouette.ts: for unit rows the mean cosine distance from x to the members
 * of C is exactly 1 − x·m_C (m_C the plain mean of C), and with x excluded from its own cluster A,
 * a(x) = |A|(1 − x·m_A)/(|A| − 1). s = 0 for one-document clusters (Rousseeuw's convention).
 * Exact duplicates are at distance 0: a cluster of copies has a = 0 and s = 1 for its members.
 *
 * @param tfidf TF-IDF rows (only the non-zero pattern is used, for term counts).
 * @param reduced unit-norm LSA rows (zero rows for documents without content).
 * @param labels cluster index 0..k−1 per document.
 * @param k number of clusters (the no-content cluster included when there is one).
 * @param termLabels readable label per TF-IDF column.
 * @param opts see `DescribeOptions`.
 */
export function* describeClustersSteps(
  tfidf: Csr,
  reduced: Dense,
  labels: Int32Array,
  k: number,
  termLabels: readonly string[],
  opts: Partial<DescribeOptions> = {},
): Stepwise<ClusterDescription> {
  const o = mergeOptions(opts);
  validate(tfidf, reduced, labels, k, termLabels);
  const n = labels.length;
  const d = reduced.cols;
  const x = reduced.data;
  const blocks = Math.ceil(n / ROWS_PER_STEP);
  const total = 2 * blocks + 3;
  let done = 0;

  const content = new Uint8Array(n);
  const size = new Float64Array(k);
  const contentSize = new Float64Array(k);
  const means = new Float64Array(k * d);
  for (let b = 0; b < blocks; b++) {
    for (let i = b * ROWS_PER_STEP, end = Math.min(n, i + ROWS_PER_STEP); i < end; i++) {
      const c = labels[i];
      size[c]++;
      let s = 0;
      for (let t = 0; t < d; t++) s += x[i * d + t] * x[i * d + t];
      if (tfidf.indptr[i + 1] === tfidf.indptr[i] || !(s > 0.5)) continue;
      content[i] = 1;
      contentSize[c]++;
      for (let t = 0; t < d; t++) means[c * d + t] += x[i * d + t];
    }
    yield { stage: 'describe', done: ++done, total };
  }
  for (let c = 0; c < k; c++) if (contentSize[c] > 0) for (let t = 0; t < d; t++) means[c * d + t] /= contentSize[c];

  // Silhouettes by the centroid identity (silhouette.ts); documents without content take no part.
  const masked = new Int32Array(n);
  for (let i = 0; i < n; i++) masked[i] = content[i] ? labels[i] : -1;
  const sil = cosineSilhouette(reduced, masked, k);
  const silhouettes = Float32Array.from(sil.samples);
  yield { stage: 'describe', done: ++done, total };

  const closeness = new Float64Array(n).fill(NaN);
  const clusterSum = new Float64Array(k);
  for (let b = 0; b < blocks; b++) {
    for (let i = b * ROWS_PER_STEP, end = Math.min(n, i + ROWS_PER_STEP); i < end; i++) {
      if (!content[i]) continue;
      const own = labels[i];
      let dot = 0;
      for (let t = 0, oi = i * d, oc = own * d; t < d; t++) dot += x[oi + t] * means[oc + t];
      closeness[i] = dot;
      clusterSum[own] += sil.samples[i];
    }
    yield { stage: 'describe', done: ++done, total };
  }

  const noContent = (c: number) => size[c] > 0 && contentSize[c] === 0;
  const counts = clusterTermCounts(tfidf, labels, k);
  const terms = distinctiveTerms(counts, k, termLabels, o.termsPerCluster, o.priorStrength, noContent);
  yield { stage: 'describe', done: ++done, total };
  const reps = representatives(reduced, labels, k, closeness, o.representativesPerCluster, o.duplicateCosine);
  yield { stage: 'describe', done: ++done, total };

  const clusters: ClusterSummary[] = [];
  for (let c = 0; c < k; c++) {
    clusters.push({
      size: size[c],
      terms: terms[c].labels,
      representatives: reps[c],
      silhouette: contentSize[c] > 0 ? clusterSum[c] / contentSize[c] : 0,
      noContent: noContent(c),
    });
  }
  return { clusters, silhouettes, silhouette: sil.mean };
}

/** `describeClustersSteps` run to the end. Same parameters. */
export function describeClusters(
  tfidf: Csr,
  reduced: Dense,
  labels: Int32Array,
  k: number,
  termLabels: readonly string[],
  opts: Partial<DescribeOptions> = {},
): ClusterDescription {
  return drain(describeClustersSteps(tfidf, reduced, labels, k, termLabels, opts));
}
