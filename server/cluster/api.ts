/**
 * Types of the clustering engine: TF-IDF rows → LSA space → clusters → descriptions.
 *
 * Two engineers share this file; each keeps additions inside their own marked block.
 */
import type { Dense } from '../common/matrix.js';

// ───────────────────────────── shared (engineer A) ─────────────────────────────

/** How documents are grouped. */
export type ClusterMethod = 'kmeans' | 'agglomerative';

/** How agglomerative clustering measures the distance between two groups. */
export type Linkage = 'average' | 'complete' | 'ward';

/** Every knob of one analysis. The HTTP layer passes the request's params through here. */
export interface AnalysisOptions {
  /** Grouping algorithm. @default 'kmeans' */
  method: ClusterMethod;
  /** A fixed number of clusters, or `'auto'` to choose it by silhouette over kMin..kMax. @default 'auto' */
  k: 'auto' | number;
  /** Smallest k tried when `k` is `'auto'`. @default 2 */
  kMin: number;
  /** Largest k tried when `k` is `'auto'` (capped by the number of distinct documents). @default 30 */
  kMax: number;
  /** Linkage for `method: 'agglomerative'`. @default 'average' */
  linkage: Linkage;
  /** Seed of every random choice; the same seed gives the same result. @default 1 */
  seed: number;
  /** LSA dimensions (fewer when the vocabulary or the corpus is smaller). @default 100 */
  dimensions: number;
  /** k-means restarts for the final clustering; the lowest objective is kept. @default 4 */
  restarts: number;
  /**
   * Documents sampled (seeded) for the k sweep and the k-means restarts; the winner is then refined
   * on all documents. Raised to 10 × kMax when smaller; all documents when n is smaller. @default 4000
   */
  silhouetteSampleSize: number;
  /** Distinctive terms listed per cluster. @default 10 */
  termsPerCluster: number;
  /** Representative documents listed per cluster. @default 5 */
  representativesPerCluster: number;
}

/** What a person needs to name one cluster. */
export interface ClusterSummary {
  /** Number of documents in the cluster. */
  size: number;
  /** Distinctive terms, most distinctive first (readable surface forms). */
  terms: string[];
  /** Row indices of the documents that best stand for the cluster, best first. */
  representatives: number[];
  /** Mean silhouette of the cluster's documents (0 for the no-content cluster). */
  silhouette: number;
  /** True for the cluster that collects documents with no usable terms. */
  noContent: boolean;
}

/** The outcome of one analysis. */
export interface AnalysisResult {
  /** Number of clusters, the no-content cluster included when there is one. */
  k: number;
  /** Mean silhouette over documents with content (cosine distance in LSA space). */
  silhouette: number;
  /** The silhouette curve of the k sweep (one entry when k was fixed). */
  silhouetteByK: { k: number; silhouette: number }[];
  /** Silhouettes reached on shuffled, structureless data at the same k (empty when k was fixed); see choose-k.ts. */
  referenceByK: { k: number; silhouette: number }[];
  /** Cluster index per document, 0..k-1. */
  labels: Int32Array;
  /** Silhouette per document (0 for documents without content). */
  silhouettes: Float32Array;
  /** One summary per cluster, indexed like `labels`. */
  clusters: ClusterSummary[];
  /** Unit-norm LSA rows (zero rows for documents without content), for the map. */
  reduced: Dense;
  /** A sentence saying how k was chosen, shown to the user. */
  kRule: string;
}

/**
 * A read-only dense row-major matrix in either precision: the engine's `Dense` (Float32) or a
 * Float64 matrix where a check needs full precision.
 */
export interface DenseView {
  rows: number;
  cols: number;
  data: Float32Array | Float64Array;
}

// ───────────────────────── end of engineer A's block ──────────────────────────

// ──────────────────────────────── engineer B ──────────────────────────────────
// Agglomerative clustering and cluster descriptions.

/**
 * An agglomerative tree in SciPy's linkage-matrix layout: row r of `merges` (4 numbers) is
 * `[a, b, height, size]` — clusters a < b joined at `height` into a cluster of `size` points.
 * Ids 0..n−1 are the items, n + r is the cluster formed by row r. Rows are sorted by height.
 */
export interface LinkageMatrix {
  /** Number of items (leaves). */
  n: number;
  /** (n − 1) × 4 numbers, row-major. */
  merges: Float64Array;
}

/** How `agglomerate` groups documents. */
export interface AgglomerateOptions {
  /** Distance between groups. @default 'average' */
  linkage: Linkage;
  /**
   * Up to this many documents, the tree is built exactly over all pairwise distances
   * (n(n−1)/2 Float64 values: 36 MB at 3,000). Above it, documents are first grouped into
   * micro-clusters by spherical k-means and the tree is built over those. @default 3000
   */
  exactMaxDocuments: number;
  /**
   * Number of micro-clusters on the large-n path; 0 picks ⌈2√n⌉ clamped to 64..256 (and at least 4k).
   * @default 0
   */
  microClusters: number;
  /** Lloyd iterations at each level of the micro-cluster k-means (it need not converge; it only has to be fine-grained). @default 6 */
  microIterations: number;
  /** Source of randomness for the micro-cluster k-means. @default seededRandom(1) */
  random: () => number;
}

/** A tree over documents: either exact (one leaf per document) or over micro-clusters. */
export interface Dendrogram {
  /** The tree over leaves. */
  tree: LinkageMatrix;
  /** Leaf index of each document (the identity on the exact path). */
  leafOf: Int32Array;
  /** Number of documents per leaf. */
  leafSizes: Float64Array;
  /** True when leaves are micro-clusters rather than documents. */
  approximate: boolean;
}

/** How clusters are described for a person to name them. */
export interface DescribeOptions {
  /** Distinctive terms listed per cluster. @default 10 */
  termsPerCluster: number;
  /** Representative documents listed per cluster (fewer when the cluster has fewer distinct documents). @default 5 */
  representativesPerCluster: number;
  /**
   * Total weight α₀ of the informative Dirichlet prior of the log-odds term scores; each term's
   * prior is α₀ times its share of all counts in the corpus. Larger values shrink rare terms more.
   * Our choice (no published default): 500 document-occurrences. @default 500
   */
  priorStrength: number;
  /** A candidate representative whose cosine to an already chosen one exceeds this is skipped. @default 0.98 */
  duplicateCosine: number;
}
