/**
 * Agglomerative clustering of documents (unit-norm LSA rows), exact for small inputs and over
 * micro-clusters for large ones.
 *
 * Distances: average and complete linkage use cosine distance (1 − cos), the measure the rest of
 * the engine uses for text; Ward uses Euclidean distance, which Ward's criterion is defined on
 * (for unit rows ‖u − v‖² = 2(1 − cos), so both describe the same geometry).
 *
 * Large n (more than `exactMaxDocuments`): an exact tree needs n(n−1)/2 distances (10 GB at
 * 50,000), so documents are first grouped into m micro-clusters (m ≈ 2√n, 64..256) by two
 * levels of spherical k-means (micro-clusters.ts), the tree is built over the micro-clusters with
 * their sizes as weights, and each document takes its micro-cluster's label. How exact that is
 * depends on the linkage:
 * - Ward: exact given the micro-clusters. Starting from groups A, B of sizes a, b with means
 *   m_A, m_B, Ward's distance is √(2ab/(a+b))·‖m_A − m_B‖ (Ward 1963; the form of the
 *   Lance–Williams recurrence, Lance & Williams 1967), and the weighted recurrence continues exactly
 *   as if the tree had been built from the documents and had formed those groups first.
 * - Average with cosine distance: also exact given the micro-clusters. For unit rows the mean
 *   cosine distance over all pairs (x ∈ A, y ∈ B) is 1 − m_A·m_B (m the plain, unnormalised mean),
 *   because the mean of x·y over the pairs is the product of the means; the size-weighted
 *   average recurrence then keeps it exact.
 * - Complete: an approximation. The largest pairwise distance between two groups cannot be had
 *   from their means, so groups start at their mean pairwise distance (as for average) and merge
 *   by the complete (maximum) rule from there.
 * In every case the micro-clusters themselves are never split, which is the price of the path.
 *
 * Exact duplicates are at distance 0 and join first (height 0); among tied distances the merge
 * order is the chain's, so equally valid trees may differ from another library's.
 */
import type { Dense } from '../common/matrix.js';
import { seededRandom } from '../common/random.js';
import { drain, type Stepwise } from '../common/step.js';
import type { AgglomerateOptions, Dendrogram, Linkage } from './api.js';
import { condensedDistancesSteps, type NumericRows } from './condensed-distances.js';
import { cutTree, linkageSteps } from './linkage.js';
import { microClustersSteps } from './micro-clusters.js';

/** Defaults of `AgglomerateOptions` (see each field's `@default`); `random` is a fresh `seededRandom(1)` per call. */
export const DEFAULT_AGGLOMERATE_OPTIONS: Readonly<Omit<AgglomerateOptions, 'random'>> = Object.freeze({
  linkage: 'average',
  exactMaxDocuments: 3000,
  microClusters: 0,
  microIterations: 6,
});

const LINKAGES = new Set(['average', 'complete', 'ward']);

function mergeOptions(opts: Partial<AgglomerateOptions>): AgglomerateOptions {
  const o: AgglomerateOptions = { ...DEFAULT_AGGLOMERATE_OPTIONS, random: seededRandom(1), ...opts };
  if (!LINKAGES.has(o.linkage)) throw new RangeError(`Unknown linkage "${String(o.linkage)}"; use "average", "complete" or "ward"`);
  if (!Number.isInteger(o.exactMaxDocuments) || o.exactMaxDocuments < 2 || o.exactMaxDocuments > 10_000) {
    throw new RangeError(`exactMaxDocuments must be an integer from 2 to 10000 (the exact path holds n(n−1)/2 distances: 400 MB at 10,000); got ${o.exactMaxDocuments}`);
  }
  if (!Number.isInteger(o.microClusters) || o.microClusters < 0) throw new RangeError(`microClusters must be 0 (automatic) or a positive integer; got ${o.microClusters}`);
  if (!Number.isInteger(o.microIterations) || o.microIterations < 1) throw new RangeError(`microIterations must be a positive integer; got ${o.microIterations}`);
  if (typeof o.random !== 'function') throw new TypeError('random must be a function returning numbers in [0, 1)');
  return o;
}

function validateRows(x: Dense): void {
  if (!Number.isInteger(x.rows) || x.rows < 2) throw new RangeError(`Agglomerative clustering needs at least 2 documents with content; got ${x.rows}`);
  if (x.cols < 1 || x.data.length !== x.rows * x.cols) throw new RangeError(`The matrix says ${x.rows} × ${x.cols} but holds ${x.data.length} numbers`);
  for (let r = 0; r < x.rows; r++) {
    let s = 0;
    for (let c = 0, o = r * x.cols; c < x.cols; c++) s += x.data[o + c] * x.data[o + c];
    if (!(Math.abs(s - 1) < 1e-3)) {
      throw new RangeError(`Row ${r} has length ${Math.sqrt(s).toPrecision(4)}; pass only documents with content, each scaled to unit length`);
    }
  }
}

/** The automatic number of micro-clusters for n documents and at least k final clusters. */
export function microClusterCount(n: number, k: number, requested = 0): number {
  const m = requested > 0 ? requested : Math.min(256, Math.max(64, Math.ceil(2 * Math.sqrt(n))));
  return Math.min(n, Math.max(m, 4 * k));
}

/**
 * Builds the agglomerative tree of the documents once, so it can be cut at any k (`cutDendrogram`)
 * — a k sweep costs one tree, not one per k.
 * Stages: those of the micro-cluster k-means (large n only), `"distances"`, `"merge"`.
 * @param reduced unit-norm rows, one per document with content.
 * @param opts see `AgglomerateOptions`.
 * @param minLeaves on the large-n path, make at least 4 × this many micro-clusters (the largest k that will be cut). @default 1
 */
export function* dendrogramSteps(reduced: Dense, opts: Partial<AgglomerateOptions> = {}, minLeaves = 1): Stepwise<Dendrogram> {
  const o = mergeOptions(opts);
  validateRows(reduced);
  const n = reduced.rows;
  if (n <= o.exactMaxDocuments) {
    const dist = yield* condensedDistancesSteps(reduced, o.linkage === 'ward' ? 'euclidean' : 'cosine');
    const tree = yield* linkageSteps(dist, n, o.linkage);
    const leafOf = new Int32Array(n);
    for (let i = 0; i < n; i++) leafOf[i] = i;
    return { tree, leafOf, leafSizes: new Float64Array(n).fill(1), approximate: false };
  }

  const m = microClusterCount(n, minLeaves, o.microClusters);
  const micro = yield* microClustersSteps(reduced, m, o.random, o.microIterations);
  const grouped = yield* groupTreeSteps(reduced, micro.labels, micro.count, o.linkage);
  return { ...grouped, approximate: true };
}

/**
 * The agglomerative tree over given groups of rows, as if it had been built from the rows and had
 * formed those groups first (exactly so for Ward and for average with cosine distance on unit
 * rows; approximately for complete — see the file comment). Empty groups are dropped.
 * Stages: `"distances"`, `"merge"`.
 * @param x the rows (unit length for average and complete, whose distance is cosine).
 * @param groupOf group index 0..groups−1 per row.
 * @param groups number of group indices.
 * @param linkage `'ward'` (Euclidean), `'average'` or `'complete'` (cosine).
 * @returns the tree over the non-empty groups (renumbered densely), each row's leaf and the leaf sizes.
 */
export function* groupTreeSteps(x: NumericRows, groupOf: Int32Array, groups: number, linkage: Linkage): Stepwise<Omit<Dendrogram, 'approximate'>> {
  const { rows: n, cols: d, data } = x;
  if (groupOf.length !== n) throw new RangeError(`Expected one group per row: ${groupOf.length} groups for ${n} rows`);
  const counts = new Float64Array(groups);
  for (let i = 0; i < n; i++) {
    if (!(groupOf[i] >= 0 && groupOf[i] < groups)) throw new RangeError(`Row ${i} is in group ${groupOf[i]}; groups are numbered 0..${groups - 1}`);
    counts[groupOf[i]]++;
  }
  const leafOfGroup = new Int32Array(groups).fill(-1);
  let leaves = 0;
  for (let g = 0; g < groups; g++) if (counts[g] > 0) leafOfGroup[g] = leaves++;
  if (leaves < 2) throw new RangeError('All documents fell into one group; there is nothing to split (are they all the same text?)');
  const leafOf = new Int32Array(n);
  const leafSizes = new Float64Array(leaves);
  const means = new Float64Array(leaves * d);
  for (let i = 0; i < n; i++) {
    const leaf = leafOfGroup[groupOf[i]];
    leafOf[i] = leaf;
    leafSizes[leaf]++;
    for (let c = 0, src = i * d, dst = leaf * d; c < d; c++) means[dst + c] += data[src + c];
  }
  for (let leaf = 0; leaf < leaves; leaf++) for (let c = 0; c < d; c++) means[leaf * d + c] /= leafSizes[leaf];
  yield { stage: 'distances', done: 0, total: 1 };
  const dist = groupDistances(means, leafSizes, d, linkage === 'ward');
  yield { stage: 'distances', done: 1, total: 1 };
  const tree = yield* linkageSteps(dist, leaves, linkage, leafSizes);
  return { tree, leafOf, leafSizes };
}

/** `groupTreeSteps` run to the end. Same parameters. */
export function groupTree(x: NumericRows, groupOf: Int32Array, groups: number, linkage: Linkage): Omit<Dendrogram, 'approximate'> {
  return drain(groupTreeSteps(x, groupOf, groups, linkage));
}

/**
 * Starting distances between groups given their plain means (see the file comment):
 * Ward √(2ab/(a+b))·‖m_A − m_B‖, otherwise the mean pairwise cosine distance 1 − m_A·m_B.
 */
function groupDistances(means: Float64Array, sizes: Float64Array, d: number, ward: boolean): Float64Array {
  const m = sizes.length;
  const out = new Float64Array((m * (m - 1)) / 2);
  let p = 0;
  for (let a = 0; a < m; a++) {
    for (let b = a + 1; b < m; b++, p++) {
      let s = 0;
      if (ward) {
        for (let c = 0; c < d; c++) {
          const t = means[a * d + c] - means[b * d + c];
          s += t * t;
        }
        out[p] = Math.sqrt(((2 * sizes[a] * sizes[b]) / (sizes[a] + sizes[b])) * s);
      } else {
        for (let c = 0; c < d; c++) s += means[a * d + c] * means[b * d + c];
        out[p] = Math.max(0, 1 - s);
      }
    }
  }
  return out;
}

/**
 * Cluster labels of the documents when the tree is cut into k clusters.
 * Clusters are numbered 0..k−1 in order of their first document.
 * @param dendrogram from `dendrogramSteps`.
 * @param k number of clusters, 1 ≤ k ≤ number of leaves.
 */
export function cutDendrogram(dendrogram: Dendrogram, k: number): Int32Array {
  const { tree, leafOf } = dendrogram;
  if (!Number.isInteger(k) || k < 1 || k > tree.n) {
    throw new RangeError(`Cannot make ${k} clusters: the tree has ${tree.n} ${dendrogram.approximate || tree.n !== leafOf.length ? 'groups' : 'documents'}; choose k between 1 and ${tree.n}`);
  }
  const leafLabels = cutTree(tree, k);
  // Renumber by first document (leaf order and document order differ on the large-n path).
  const rename = new Int32Array(k).fill(-1);
  const labels = new Int32Array(leafOf.length);
  let next = 0;
  for (let i = 0; i < leafOf.length; i++) {
    const l = leafLabels[leafOf[i]];
    if (rename[l] < 0) rename[l] = next++;
    labels[i] = rename[l];
  }
  return labels;
}

/**
 * Agglomerative clustering of documents into k clusters.
 * @param reduced unit-norm rows (LSA space), one per document with content.
 * @param k number of clusters, 2 ≤ k ≤ n.
 * @param opts see `AgglomerateOptions` (linkage, exact-path threshold, micro-clusters, random).
 * @returns cluster index 0..k−1 per row, numbered in order of first appearance.
 */
export function* agglomerateSteps(reduced: Dense, k: number, opts: Partial<AgglomerateOptions> = {}): Stepwise<Int32Array> {
  if (!Number.isInteger(k) || k < 2) throw new RangeError(`k must be an integer of at least 2; got ${k}`);
  if (k > reduced.rows) throw new RangeError(`k = ${k} is more than the ${reduced.rows} documents with content; choose k ≤ ${reduced.rows}`);
  const dendrogram = yield* dendrogramSteps(reduced, opts, k);
  return cutDendrogram(dendrogram, k);
}

/** `agglomerateSteps` run to the end. Same parameters. */
export function agglomerate(reduced: Dense, k: number, opts: Partial<AgglomerateOptions> = {}): Int32Array {
  return drain(agglomerateSteps(reduced, k, opts));
}

/** `dendrogramSteps` run to the end. Same parameters. */
export function dendrogram(reduced: Dense, opts: Partial<AgglomerateOptions> = {}, minLeaves = 1): Dendrogram {
  return drain(dendrogramSteps(reduced, opts, minLeaves));
}
