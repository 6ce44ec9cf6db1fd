/**
 * Agglomerative clustering and cluster descriptions, timed on generated unit rows (a mixture of
 * 30 directions in 100 dimensions plus noise; no text involved).
 *
 * Cases, each in its own child process so that each peak RSS is its own:
 *  - exact:   the exact tree (all pairwise distances) on 3,000 × 100, per linkage, against SciPy's
 *             linkage(pdist(...)) on the same rows in a /usr/bin/python3 subprocess, ratio side by side;
 *  - large:   agglomerate() on 50,000 × 100 (micro-cluster path), per linkage, k = 20;
 *  - describe: describeClusters() on 50,000 × 100 with a 20,000-term CSR (~30 terms per document),
 *             k = 31 (30 clusters + a no-content cluster of 500 empty documents);
 *  - silhouette: the silhouettes alone against scikit-learn's silhouette_samples(metric="cosine")
 *             on 10,000 × 100 (the O(n²) peer cannot do 50,000 in reasonable time).
 *
 * Usage: npm run bench agglomerate [-- --no-peer]
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { agglomerate } from '../server/cluster/agglomerate.js';
import type { Linkage } from '../server/cluster/api.js';
import { describeClusters } from '../server/cluster/describe.js';
import { condensedDistances } from '../server/cluster/condensed-distances.js';
import { cutTree, linkageFromCondensed } from '../server/cluster/linkage.js';
import { cosineSilhouette } from '../server/cluster/silhouette.js';
import type { Csr, Dense } from '../server/common/matrix.js';
import { randomNormal, seededRandom } from '../server/common/random.js';

const LINKAGES: Linkage[] = ['average', 'complete', 'ward'];

function mixture(n: number, d: number, centres: number, seed: number): { x: Dense; truth: Int32Array } {
  const random = seededRandom(seed);
  const dirs = Float64Array.from({ length: centres * d }, () => randomNormal(random));
  const data = new Float32Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = Math.floor(random() * centres);
    truth[i] = c;
    let s = 0;
    for (let t = 0; t < d; t++) {
      const v = dirs[c * d + t] + 1.2 * randomNormal(random);
      data[i * d + t] = v;
      s += v * v;
    }
    const inv = 1 / Math.sqrt(s);
    for (let t = 0; t < d; t++) data[i * d + t] *= inv;
  }
  return { x: { rows: n, cols: d, data }, truth };
}

/** ~30 distinct terms per document out of `v`, skewed towards low column numbers; `empty` documents have none. */
function sparse(n: number, v: number, empty: number, seed: number): Csr {
  const random = seededRandom(seed);
  const indptr = new Uint32Array(n + 1);
  const cols: number[] = [];
  for (let i = 0; i < n; i++) {
    if (i >= n - empty) {
      indptr[i + 1] = indptr[i];
      continue;
    }
    const row = new Set<number>();
    while (row.size < 30) row.add(Math.floor(v * random() ** 2));
    cols.push(...[...row].sort((a, b) => a - b));
    indptr[i + 1] = cols.length;
  }
  return { rows: n, cols: v, indptr, indices: Uint32Array.from(cols), values: new Float32Array(cols.length).fill(0.18) };
}

/** Wall seconds and CPU seconds (user + system) of `f`: on a shared machine the CPU figure is the steadier one. */
function timed<T>(f: () => T): { value: T; seconds: number; cpu: number } {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = f();
  const c = process.cpuUsage(c0);
  return { value, seconds: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
}

const peakMb = (): number => process.resourceUsage().maxRSS / 1024;

/** Runs one case in this process and prints one JSON line. */
function runCase(name: string, dir: string): void {
  if (name.startsWith('exact-')) {
    const linkage = name.slice(6) as Linkage;
    const { x } = mixture(3000, 100, 30, 1);
    if (linkage === 'average') writeFileSync(join(dir, 'exact.f32'), new Uint8Array(x.data.buffer));
    const r = timed(() => cutTree(linkageFromCondensed(condensedDistances(x, linkage === 'ward' ? 'euclidean' : 'cosine'), 3000, linkage), 20));
    console.log(JSON.stringify({ seconds: r.seconds, cpu: r.cpu, peakMb: peakMb() }));
  } else if (name.startsWith('large-')) {
    const linkage = name.slice(6) as Linkage;
    const { x } = mixture(50_000, 100, 30, 2);
    const before = peakMb();
    const r = timed(() => agglomerate(x, 20, { linkage, random: seededRandom(1) }));
    console.log(JSON.stringify({ seconds: r.seconds, cpu: r.cpu, peakMb: peakMb(), inputMb: before }));
  } else if (name === 'describe') {
    const n = 50_000;
    const { x, truth } = mixture(n, 100, 30, 3);
    const labels = Int32Array.from(truth);
    for (let i = n - 500; i < n; i++) {
      labels[i] = 30;
      x.data.fill(0, i * 100, (i + 1) * 100);
    }
    const tfidf = sparse(n, 20_000, 500, 4);
    const termLabels = Array.from({ length: 20_000 }, (_, i) => `term${i}`);
    const before = peakMb();
    describeClusters(tfidf, x, labels, 31, termLabels); // warm-up, as the API process would be
    const r = timed(() => describeClusters(tfidf, x, labels, 31, termLabels));
    console.log(JSON.stringify({ seconds: r.seconds, cpu: r.cpu, peakMb: peakMb(), inputMb: before }));
  } else if (name === 'silhouette') {
    const { x, truth } = mixture(10_000, 100, 30, 5);
    writeFileSync(join(dir, 'sil.f32'), new Uint8Array(x.data.buffer));
    writeFileSync(join(dir, 'sil.i32'), new Uint8Array(truth.buffer));
    const r = timed(() => cosineSilhouette(x, truth, 30));
    console.log(JSON.stringify({ seconds: r.seconds, cpu: r.cpu, peakMb: peakMb(), mean: r.value.mean }));
  }
}

const PEER = String.raw`
import json, resource, sys, time
import numpy as np
case, path = sys.argv[1], sys.argv[2]
if case.startswith('exact-'):
    from scipy.cluster.hierarchy import linkage, fcluster
    from scipy.spatial.distance import pdist
    method = case[6:]
    x = np.fromfile(path + '/exact.f32', dtype=np.float32).reshape(3000, 100).astype(np.float64)
    t, c = time.perf_counter(), time.process_time()
    z = linkage(pdist(x, 'euclidean' if method == 'ward' else 'cosine'), method=method)
    fcluster(z, 20, 'maxclust')
    s, cpu = time.perf_counter() - t, time.process_time() - c
    print(json.dumps({'seconds': s, 'cpu': cpu, 'peakMb': resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024}))
else:
    from sklearn.metrics import silhouette_samples
    x = np.fromfile(path + '/sil.f32', dtype=np.float32).reshape(10000, 100).astype(np.float64)
    y = np.fromfile(path + '/sil.i32', dtype=np.int32)
    t, c = time.perf_counter(), time.process_time()
    s = silhouette_samples(x, y, metric='cosine')
    sec, cpu = time.perf_counter() - t, time.process_time() - c
    print(json.dumps({'seconds': sec, 'cpu': cpu, 'peakMb': resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024, 'mean': float(s.mean())}))
`;

interface Figures {
  seconds: number;
  cpu: number;
  peakMb: number;
  mean?: number;
  inputMb?: number;
}

function child(cmd: string, args: string[]): Figures {
  const r = spawnSync(cmd, args, { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop()!);
}

function main(): void {
  const caseIndex = process.argv.indexOf('--case');
  if (caseIndex >= 0) {
    runCase(process.argv[caseIndex + 1], process.argv[caseIndex + 2]);
    return;
  }
  const peer = !process.argv.includes('--no-peer');
  const self = fileURLToPath(import.meta.url);
  const dir = mkdtempSync(join(tmpdir(), 'sheaf-agglomerate-'));
  const ours = (name: string) => child(process.execPath, ['--expose-gc', self, '--case', name, dir]);
  const theirs = (name: string) => child('/usr/bin/python3', ['-c', PEER, name, dir]);
  const fmt = (r: Figures) => `${r.seconds.toFixed(3).padStart(7)} s wall ${r.cpu.toFixed(3).padStart(7)} s cpu ${r.peakMb.toFixed(0).padStart(5)} MB`;
  const ratio = (a: Figures, b: Figures) => `wall ${(a.seconds / b.seconds).toFixed(2)}  cpu ${(a.cpu / b.cpu).toFixed(2)}`;
  console.log(`machine load average at start: ${loadavg().map((v) => v.toFixed(2)).join(' ')} (${cpus().length} cores)`);
  try {
    console.log('exact tree, 3,000 × 100 unit rows (distances + tree + cut at 20)');
    console.log(`  linkage    sheaf                                    ${peer ? 'SciPy 1.10 linkage(pdist)                ratio sheaf/SciPy' : ''}`);
    for (const l of LINKAGES) {
      const a = ours(`exact-${l}`);
      const b = peer ? theirs(`exact-${l}`) : null;
      console.log(`  ${l.padEnd(9)}  ${fmt(a)}   ${b ? `${fmt(b)}   ${ratio(a, b)}` : ''}`);
    }
    console.log('\nagglomerate(), 50,000 × 100 unit rows, k = 20 (micro-cluster path); peak RSS includes the 20 MB input');
    for (const l of LINKAGES) console.log(`  ${l.padEnd(9)}  ${fmt(ours(`large-${l}`))}`);
    console.log('\ndescribeClusters(), 50,000 × 100, 20,000 terms, 1.5M non-zeros, k = 31 (one no-content cluster)');
    console.log(`  sheaf      ${fmt(ours('describe'))}`);
    console.log('\ncosine silhouettes of every row, 10,000 × 100, 30 clusters');
    const s = ours('silhouette');
    const t = peer ? theirs('silhouette') : null;
    console.log(`  sheaf (centroid identity)          ${fmt(s)}   mean ${s.mean!.toFixed(6)}`);
    if (t) console.log(`  scikit-learn silhouette_samples    ${fmt(t)}   mean ${t.mean!.toFixed(6)}   ratio sheaf/sklearn ${ratio(s, t)}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main();
