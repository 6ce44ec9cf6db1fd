/**
 * Clustering bench: 50,000 generated documents (~60 words, planted themes) through our
 * auto-k 2..30 + final clustering + descriptions, with wall time per stage and peak RSS; then the
 * same documents through scikit-learn (Debian's python3-sklearn) in a subprocess:
 * TfidfVectorizer → TruncatedSVD(100) → Normalizer → KMeans over k = 2..30 scored by sampled
 * silhouette, final KMeans at the best k. Prints both, the time ratio and both ARIs.
 *
 * Usage: npm run bench cluster [-- --docs 50000 --themes 12 --no-peer --one-core]
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { adjustedRandIndex, analyseSteps, normalizedMutualInformation, type AnalysisResult } from '../server/cluster/index.js';
import { fitTfidf } from '../server/text/index.js';
import { plantedCorpus } from './lib/cluster-corpus.js';
import { SpareThread } from '../server/jobs/spare-thread.js';

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

const docs = arg('docs', 50_000);
const themes = arg('themes', 12);
const method = process.argv.includes('--agglomerative') ? 'agglomerative' : 'kmeans';
const rssMb = (): number => process.memoryUsage().rss / 2 ** 20;

// A spare thread, as each job worker keeps one: the reduction and the k sweep share the second core.
const spare = process.argv.includes('--one-core') ? undefined : new SpareThread();
const corpus = plantedCorpus(docs, themes);
let t0 = performance.now();
const { matrix, vectorizer } = fitTfidf(corpus.texts);
const terms = vectorizer.labels;
const tfidfSeconds = (performance.now() - t0) / 1000;
console.log(`corpus: ${docs} generated documents (invented pseudo-words), ${themes} planted themes, ${terms.length} terms, ${matrix.indptr[matrix.rows]} non-zeros`);
console.log(`tfidf (sheaf text pipeline, fitTfidf): ${tfidfSeconds.toFixed(2)} s`);

(globalThis as { gc?: () => void }).gc?.();
const stageSeconds = new Map<string, number>();
// CPU time per stage too: the machine is shared, so wall time alone is noisy.
const stageCpu = new Map<string, number>();
const cpuSeconds = (): number => { const u = process.cpuUsage(); return (u.user + u.system) / 1e6; };
let peakRss = rssMb();
const cpu0 = cpuSeconds();
t0 = performance.now();
let last = t0;
let lastCpu = cpu0;
let stage = '';
const gen = analyseSteps(matrix, terms, { method, k: 'auto', kMin: 2, kMax: 30, seed: 1 }, spare);
let result: AnalysisResult | undefined;
let steps = 0;
// The longest stretch without a progress step bounds how late a cancel can take effect.
const longest = { ms: 0, stage: '' };
for (;;) {
  const next = gen.next();
  const now = performance.now();
  // CPU time is read only when the stage changes: reading it at every step costs ~20 µs.
  if (next.done || next.value.stage !== stage) {
    const nowCpu = cpuSeconds();
    if (stage) stageCpu.set(stage, (stageCpu.get(stage) ?? 0) + nowCpu - lastCpu);
    lastCpu = nowCpu;
  }
  if (now - last > longest.ms) { longest.ms = now - last; longest.stage = next.done ? 'result' : next.value.stage; }
  if (stage) stageSeconds.set(stage, (stageSeconds.get(stage) ?? 0) + (now - last) / 1000);
  last = now;
  if (next.done) { result = next.value; break; }
  stage = next.value.stage;
  if (++steps % 64 === 0) peakRss = Math.max(peakRss, rssMb());
}
const oursSeconds = (performance.now() - t0) / 1000;
const oursCpu = cpuSeconds() - cpu0;
await spare?.close();
peakRss = Math.max(peakRss, rssMb(), process.resourceUsage().maxRSS / 1024);
if (!result) throw new Error('the analysis returned nothing');
const ourAri = adjustedRandIndex(corpus.themes, result.labels);
const ourNmi = normalizedMutualInformation(corpus.themes, result.labels);
console.log(`\nsheaf ${method}${spare ? ' (with a spare thread)' : ' (one core)'}: k = ${result.k} (${result.kRule})`);
console.log('  stage      wall      CPU');
for (const [s, sec] of stageSeconds) console.log(`  ${s.padEnd(10)} ${sec.toFixed(2).padStart(5)} s  ${(stageCpu.get(s) ?? 0).toFixed(2).padStart(5)} s`);
console.log(`  total      ${oursSeconds.toFixed(2).padStart(5)} s  ${oursCpu.toFixed(2).padStart(5)} s CPU  (${steps} progress steps)   peak RSS ${peakRss.toFixed(0)} MB   ARI ${ourAri.toFixed(4)}  NMI ${ourNmi.toFixed(4)}`);
console.log(`  longest stretch between progress steps: ${longest.ms.toFixed(0)} ms (ending in stage ${longest.stage})`);
console.log(`  silhouette by k: ${result.silhouetteByK.map((p) => `${p.k}:${p.silhouette.toFixed(3)}`).join(' ')}`);

if (!process.argv.includes('--no-peer')) {
  const dir = mkdtempSync(join(tmpdir(), 'sheaf-bench-'));
  try {
    writeFileSync(join(dir, 'docs.txt'), corpus.texts.join('\n'));
    writeFileSync(join(dir, 'themes.json'), JSON.stringify(Array.from(corpus.themes)));
    // Run from the repository root (as `npm run bench` does).
    const script = join(process.cwd(), 'bench', 'cluster-peer.py');
    const peer = spawnSync('/usr/bin/python3', [script, dir], { encoding: 'utf8', maxBuffer: 1 << 26 });
    if (peer.status !== 0) {
      console.log(`\npeer failed: ${peer.stderr}`);
    } else {
      const p = JSON.parse(peer.stdout.trim().split('\n').pop()!);
      console.log(`\nscikit-learn ${p.version}: k = ${p.k}; tfidf ${p.tfidf.toFixed(2)} s, svd ${p.svd.toFixed(2)} s, sweep ${p.sweep.toFixed(2)} s, final ${p.final.toFixed(2)} s; peak RSS ${p.peakRssMb.toFixed(0)} MB   ARI ${p.ari.toFixed(4)}  NMI ${p.nmi.toFixed(4)}`);
      const peerCluster = p.svd + p.sweep + p.final;
      console.log('\n                         sheaf      scikit-learn   ratio (sheaf / sklearn)');
      console.log(`clustering (no tfidf)  ${oursSeconds.toFixed(2).padStart(7)} s  ${peerCluster.toFixed(2).padStart(9)} s     ${(oursSeconds / peerCluster).toFixed(2)}`);
      console.log(`with tfidf             ${(oursSeconds + tfidfSeconds).toFixed(2).padStart(7)} s  ${(peerCluster + p.tfidf).toFixed(2).padStart(9)} s     ${((oursSeconds + tfidfSeconds) / (peerCluster + p.tfidf)).toFixed(2)}`);
      console.log(`ARI vs planted themes  ${ourAri.toFixed(4).padStart(9)}  ${p.ari.toFixed(4).padStart(11)}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
