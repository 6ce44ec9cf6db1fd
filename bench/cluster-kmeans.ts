/**
 * k-means implementations side by side on the same LSA rows of generated documents (planted
 * themes): our typed-array spherical k-means (Hamerly bounds) against ml-kmeans 7 (the general
 * k-means of the mljs project, number[][] rows, squared euclidean distance). On unit rows the two
 * objectives agree: ‖x − c‖² = 2(1 − cos) for unit centroids. One run each, k-means++ seeding.
 *
 * Usage: npm run bench cluster-kmeans [-- --docs 20000 --k 12]
 */
import { kmeans as mlKmeans } from 'ml-kmeans';
import { adjustedRandIndex, lsa, sphericalKmeans } from '../server/cluster/index.js';
import { seededRandom } from '../server/common/random.js';
import { fitTfidf } from '../server/text/index.js';
import { plantedCorpus } from './lib/cluster-corpus.js';

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

const docs = arg('docs', 20_000);
const k = arg('k', 12);
const corpus = plantedCorpus(docs, k);
const { matrix } = fitTfidf(corpus.texts);
const reduced = lsa(matrix, { random: seededRandom(1) }).reduced;
const d = reduced.cols;
const rows: number[][] = [];
for (let i = 0; i < reduced.rows; i++) rows.push(Array.from(reduced.data.subarray(i * d, (i + 1) * d)));
console.log(`${docs} generated documents (invented pseudo-words), ${k} planted themes, ${d} LSA dimensions, k = ${k}`);

/** Σ‖x − c‖² with c the plain mean of each cluster (the euclidean k-means objective). */
function sse(labels: ArrayLike<number>): number {
  const sums = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < reduced.rows; i++) { counts[labels[i]]++; for (let a = 0; a < d; a++) sums[labels[i] * d + a] += reduced.data[i * d + a]; }
  let total = 0;
  for (let i = 0; i < reduced.rows; i++) for (let a = 0; a < d; a++) { const t = reduced.data[i * d + a] - sums[labels[i] * d + a] / counts[labels[i]]; total += t * t; }
  return total;
}

(globalThis as { gc?: () => void }).gc?.();
let t = performance.now();
const ours = sphericalKmeans(reduced, k, { restarts: 1, random: seededRandom(1) });
const oursSeconds = (performance.now() - t) / 1000;
(globalThis as { gc?: () => void }).gc?.();
t = performance.now();
const theirs = mlKmeans(rows, k, { initialization: 'kmeans++', seed: 1, maxIterations: 100 });
const theirSeconds = (performance.now() - t) / 1000;

console.log('                      seconds   iterations   SSE          ARI vs planted');
console.log(`sheaf spherical      ${oursSeconds.toFixed(2).padStart(7)}   ${String(ours.iterations).padStart(10)}   ${sse(ours.labels).toFixed(2).padStart(10)}   ${adjustedRandIndex(corpus.themes, ours.labels).toFixed(4)}`);
console.log(`ml-kmeans 7          ${theirSeconds.toFixed(2).padStart(7)}   ${String(theirs.iterations).padStart(10)}   ${sse(theirs.clusters).toFixed(2).padStart(10)}   ${adjustedRandIndex(corpus.themes, theirs.clusters).toFixed(4)}`);
console.log(`time ratio (sheaf / ml-kmeans): ${(oursSeconds / theirSeconds).toFixed(2)}`);
