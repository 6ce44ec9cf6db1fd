/**
 * One whole analysis: TF-IDF rows → LSA → (k sweep) → clusters → descriptions.
 *
 * Documents whose TF-IDF row is empty (only stop words, or terms outside the vocabulary) have no
 * direction in cosine space; they are kept out of the LSA fit, the sweep and every silhouette,
 * and are collected in a last cluster marked `noContent`. Exact duplicates are ordinary
 * documents: they share an LSA row, so they always land in the same cluster; k may not exceed
 * the number of distinct non-empty documents, since more clusters than distinct points cannot
 * all be non-empty.
 */
import type { Csr, Dense } from '../common/matrix.js';
import { assertCsr, assertUnreachable } from '../common/matrix.js';
import { seededRandom } from '../common/random.js';
import type { Step, Stepwise } from '../common/step.js';
import { drain } from '../common/step.js';
import { agglomerateSteps, dendrogramSteps, cutDendrogram } from './agglomerate.js';
import type { AnalysisOptions, AnalysisResult } from './api.js';
import { chooseK, kmeansSweepSteps, sampleRows, takeRows, treeSweepSteps } from './choose-k.js';
import { describeClustersSteps } from './describe.js';
import { contentRows, lsaOfContentSteps, spreadRows } from './reduced-rows.js';
import { restageSteps } from './restage.js';
import { partSeed } from './sweep-runs.js';
import { CLUSTER_INLINE } from './spare-tasks.js';
import type { Spare } from '../common/spare.js';
import { sphericalKmeansSteps, type SphericalKmeansResult } from './spherical-kmeans.js';

/** Defaults of {@link AnalysisOptions} (the HTTP contract's defaults for the first six). */
export const DEFAULT_ANALYSIS_OPTIONS: Readonly<AnalysisOptions> = Object.freeze({
  method: 'kmeans',
  k: 'auto',
  kMin: 2,
  kMax: 30,
  linkage: 'average',
  seed: 1,
  dimensions: 100,
  restarts: 4,
  silhouetteSampleSize: 4000,
  termsPerCluster: 10,
  representativesPerCluster: 5,
} as AnalysisOptions);

function positiveInteger(name: string, v: unknown, min: number): void {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < min) throw new RangeError(`${name} must be an integer ≥ ${min}; got ${String(v)}`);
}

/** Merges and validates options (everything that does not depend on the data). */
export function analysisOptions(opts: Partial<AnalysisOptions> = {}): AnalysisOptions {
  const o: AnalysisOptions = { ...DEFAULT_ANALYSIS_OPTIONS, ...opts };
  if (o.method !== 'kmeans' && o.method !== 'agglomerative') throw new RangeError(`Unknown method "${String(o.method)}"; use "kmeans" or "agglomerative"`);
  if (o.linkage !== 'average' && o.linkage !== 'complete' && o.linkage !== 'ward') throw new RangeError(`Unknown linkage "${String(o.linkage)}"; use "average", "complete" or "ward"`);
  if (o.k !== 'auto') positiveInteger('k', o.k, 2);
  positiveInteger('kMin', o.kMin, 2);
  positiveInteger('kMax', o.kMax, 2);
  if (o.kMin > o.kMax) throw new RangeError(`kMin (${o.kMin}) is larger than kMax (${o.kMax}); make kMin ≤ kMax`);
  if (!Number.isInteger(o.seed)) throw new RangeError(`seed must be an integer; got ${String(o.seed)}`);
  positiveInteger('dimensions', o.dimensions, 1);
  positiveInteger('restarts', o.restarts, 1);
  positiveInteger('silhouetteSampleSize', o.silhouetteSampleSize, 2);
  positiveInteger('termsPerCluster', o.termsPerCluster, 0);
  positiveInteger('representativesPerCluster', o.representativesPerCluster, 0);
  return o;
}

/** Number of distinct rows among `rows` of a CSR matrix (exact comparison after hashing). */
export function countDistinctRows(x: Csr, rows: Int32Array): number {
  const hashes = new Uint32Array(rows.length);
  const bits = new Uint32Array(x.values.buffer, x.values.byteOffset, x.values.length);
  for (let r = 0; r < rows.length; r++) {
    let h = 0x811c9dc5;
    for (let p = x.indptr[rows[r]]; p < x.indptr[rows[r] + 1]; p++) {
      h = Math.imul(h ^ x.indices[p], 16777619);
      h = Math.imul(h ^ bits[p], 16777619);
    }
    hashes[r] = h >>> 0;
  }
  const order = Int32Array.from({ length: rows.length }, (_, i) => i).sort((a, b) => hashes[a] - hashes[b]);
  const same = (a: number, b: number): boolean => {
    const pa = x.indptr[a], pb = x.indptr[b], len = x.indptr[a + 1] - pa;
    if (x.indptr[b + 1] - pb !== len) return false;
    for (let t = 0; t < len; t++) if (x.indices[pa + t] !== x.indices[pb + t] || x.values[pa + t] !== x.values[pb + t]) return false;
    return true;
  };
  let distinct = 0;
  for (let s = 0; s < order.length; ) {
    let e = s;
    while (e < order.length && hashes[order[e]] === hashes[order[s]]) e++;
    // Within one hash run, count rows unlike every earlier row of the run (runs are tiny).
    for (let i = s; i < e; i++) {
      let fresh = true;
      for (let j = s; j < i && fresh; j++) if (same(rows[order[i]], rows[order[j]])) fresh = false;
      if (fresh) distinct++;
    }
    s = e;
  }
  return distinct;
}

/** What {@link prepareSteps} hands on: the documents with content and their reduced rows. */
export interface Prepared {
  /** Row numbers of the documents whose TF-IDF row has any weight. */
  content: Int32Array;
  /** Distinct rows among them. */
  distinct: number;
  /** LSA rows of the content documents (unit length). */
  reducedContent: Dense;
}

/**
 * The checks and the reduction of an analysis: which documents have content, how many are
 * distinct, and their LSA rows (Halko et al. 2011, from seededRandom(seed) alone, so the rows of
 * a seed are the same whatever clustering follows). Stage `"reduce"`.
 * @throws RangeError for inputs no clustering can split, with a message saying what to change
 */
export function* prepareSteps(tfidf: Csr, opts: Partial<AnalysisOptions> = {}, spare: Spare = CLUSTER_INLINE): Stepwise<Prepared> {
  const o = analysisOptions(opts);
  assertCsr(tfidf);
  const n = tfidf.rows;
  const content = contentRows(tfidf);
  if (content.length < 2) throw new RangeError(`Only ${content.length} of ${n} documents have any usable terms; clustering needs at least 2 (are the texts empty or only stop words?)`);
  const distinct = countDistinctRows(tfidf, content);
  if (distinct < 2) throw new RangeError('All documents with content have the same terms; there is nothing to split');
  if (o.k !== 'auto' && o.k > distinct) throw new RangeError(`k = ${o.k} is more than the ${distinct} distinct documents with content; choose k ≤ ${distinct}`);
  if (o.k === 'auto' && o.kMin > distinct) throw new RangeError(`kMin = ${o.kMin} is more than the ${distinct} distinct documents with content; lower kMin to ${distinct} or less`);
  const reducedContent = yield* lsaOfContentSteps(tfidf, content, o.dimensions, seededRandom(o.seed), spare);
  return { content, distinct, reducedContent };
}

/**
 * Finds the themes of a corpus. Stages: `"reduce"`, `"sweep-k"`, `"cluster"`, `"describe"`.
 * @param tfidf documents × terms, one row per document
 * @param termLabels readable label per column, for cluster terms
 * @param opts see {@link AnalysisOptions}
 * @param spare a thread to share the reduction and the k sweep with; the result is the same without one
 */
export function* analyseSteps(tfidf: Csr, termLabels: string[], opts: Partial<AnalysisOptions> = {}, spare: Spare = CLUSTER_INLINE): Stepwise<AnalysisResult> {
  const o = analysisOptions(opts);
  assertCsr(tfidf);
  if (termLabels.length !== tfidf.cols) throw new RangeError(`termLabels has ${termLabels.length} entries for ${tfidf.cols} columns`);
  const n = tfidf.rows;
  const { content, distinct, reducedContent } = yield* prepareSteps(tfidf, o, spare);
  // Everything after the reduction draws from a stream of its own: the reduction's rows depend
  // on the seed alone (prepareSteps), whatever follows.
  const random = seededRandom(partSeed(o.seed, 0));

  // Choose k.
  const kMax = o.k === 'auto' ? Math.min(o.kMax, distinct) : o.k;
  const kMin = o.k === 'auto' ? o.kMin : o.k;
  let k = kMin;
  let silhouetteByK: { k: number; silhouette: number }[] = [];
  let reference: { k: number; silhouette: number }[] = [];
  let kRule = '';
  let labelsContent: Int32Array;
  // At least 10 sampled documents per cluster, so a small sample size cannot starve large k.
  const sampleSize = Math.max(o.silhouetteSampleSize, 10 * kMax);
  const sweep = { kMin, kMax, sampleSize, restarts: 2, random, spare };
  switch (o.method) {
    case 'kmeans': {
      // Restarts and the sweep run on a seeded sample; the winner is then refined on every row.
      // Lloyd steps from good centroids converge in a few passes, so the full data is touched
      // a handful of times instead of restarts × iterations × (kMax − kMin + 1) times.
      let initial: Float32Array | null = null;
      let sample: Int32Array;
      if (o.k === 'auto') {
        const result = yield* kmeansSweepSteps(reducedContent, sweep);
        silhouetteByK = result.curve;
        const choice = chooseK(result.curve, result.reference);
        reference = result.reference;
        k = choice.k;
        kRule = result.sample.length < content.length
          ? `${choice.rule}; k-means on a seeded sample of ${result.sample.length} documents`
          : choice.rule;
        initial = result.centroids[k - kMin];
        sample = result.sample;
      } else {
        k = o.k;
        kRule = `k = ${k} was given`;
        sample = sampleRows(content.length, sampleSize, random);
      }
      const clusterStep: Step = { stage: 'cluster', done: 0, total: 2 };
      const sub = sample.length < content.length ? takeRows(reducedContent, sample) : reducedContent;
      const best: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(sub, k, { restarts: o.restarts, initial, random }), 'cluster', clusterStep);
      clusterStep.done = 1;
      labelsContent = best.labels;
      if (sub !== reducedContent) {
        const refined: SphericalKmeansResult = yield* restageSteps(sphericalKmeansSteps(reducedContent, k, { restarts: 1, initial: best.centroids, random }), 'cluster', clusterStep);
        labelsContent = refined.labels;
      }
      break;
    }
    case 'agglomerative': {
      const aggOpts = { linkage: o.linkage, random };
      if (o.k === 'auto') {
        const tree = yield* restageSteps(dendrogramSteps(reducedContent, aggOpts, kMax), 'sweep-k');
        const swept = yield* treeSweepSteps(reducedContent, tree, sweep);
        silhouetteByK = swept.curve;
        reference = swept.reference;
        const choice = chooseK(swept.curve, swept.reference);
        k = choice.k;
        kRule = `${choice.rule}; ${o.linkage}-linkage tree cut at each k`;
        labelsContent = cutDendrogram(tree, k);
        yield { stage: 'cluster', done: 1, total: 1 };
      } else {
        k = o.k;
        kRule = `k = ${k} was given`;
        labelsContent = yield* restageSteps(agglomerateSteps(reducedContent, k, aggOpts), 'cluster');
      }
      break;
    }
    default:
      return assertUnreachable(o.method);
  }

  // Spread back to all documents; documents without content form the last cluster.
  const reduced = spreadRows(reducedContent, content, n);
  const labels = new Int32Array(n).fill(k);
  for (let s = 0; s < content.length; s++) labels[content[s]] = labelsContent[s];
  const empties = n - content.length;
  const total = empties > 0 ? k + 1 : k;
  const described = yield* restageSteps(describeClustersSteps(tfidf, reduced, labels, total, termLabels, {
    termsPerCluster: o.termsPerCluster,
    representativesPerCluster: o.representativesPerCluster,
  }), 'describe');
  const clusters = described.clusters;
  if (o.k !== 'auto') silhouetteByK = [{ k, silhouette: described.silhouette }];
  const done: Step = { stage: 'describe', done: 1, total: 1 };
  yield done;
  return { k: total, silhouette: described.silhouette, silhouetteByK, referenceByK: reference, labels, silhouettes: described.silhouettes, clusters, reduced, kRule };
}

/** Plain form of {@link analyseSteps}. */
export function analyse(tfidf: Csr, termLabels: string[], opts: Partial<AnalysisOptions> = {}, spare: Spare = CLUSTER_INLINE): AnalysisResult {
  return drain(analyseSteps(tfidf, termLabels, opts, spare));
}
