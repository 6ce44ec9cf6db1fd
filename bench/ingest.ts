// Ingest benchmark: how fast uploads are parsed and how little memory a large upload takes.
//
//   npm run bench ingest            (50,000 rows of ~60 words, and a ~50 MB CSV streamed from disk)
//   npm run bench ingest -- 20000   (another row count for the first part)
//
// Inputs are generated (fixed seed) into os.tmpdir(). The peer is Python's csv / json modules
// (Debian /usr/bin/python3, C-implemented readers) reading the same files in the same run; each
// side times its own parse only, without process start-up.
import { spawnSync } from 'node:child_process';
import { createReadStream, createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { once } from 'node:events';
import { parseDocuments, type ParseOptions } from '../server/ingest/index.js';
import { seededRandom } from '../server/common/random.js';

const CHILD_FLAG = '--memory-child';
const child = process.argv[2] === CHILD_FLAG;
const rows = child ? 0 : Number(process.argv[2] ?? 50_000);
const dir = child ? '' : mkdtempSync(join(tmpdir(), 'sheaf-bench-ingest-'));
const gc = (globalThis as { gc?: () => void }).gc ?? (() => undefined);

const WORDS = ('printer network password login screen update invoice refund delivery account error crash slow ' +
  'billing order email phone battery laptop monitor keyboard install license vpn server backup sync folder ' +
  'report export import calendar meeting schedule ticket urgent again please thanks broken missing wrong').split(' ');

function sentence(random: () => number, words: number): string {
  const out: string[] = [];
  for (let i = 0; i < words; i++) {
    let w = WORDS[Math.floor(random() * WORDS.length)]!;
    if (random() < 0.05) w += ',';
    if (random() < 0.01) w = `"${w}"`;
    out.push(w);
  }
  return out.join(' ');
}

type Kind = 'csv' | 'ndjson' | 'json';

/** Writes `n` invented tickets (text of ~60 words) in the given format; returns the path. */
async function writeInput(kind: Kind, n: number, words: number): Promise<string> {
  const path = join(dir, `tickets-${n}-${words}.${kind}`);
  const random = seededRandom(1234);
  const out = createWriteStream(path);
  let buf = kind === 'csv' ? 'id,text,queue,priority\r\n' : kind === 'json' ? '[\n' : '';
  for (let i = 1; i <= n; i++) {
    const text = sentence(random, words);
    const queue = ['it', 'billing', 'shipping'][i % 3]!;
    if (kind === 'csv') buf += `${i},"${text.replaceAll('"', '""')}",${queue},${i % 5}\r\n`;
    else {
      const line = JSON.stringify({ id: String(i), text, queue, priority: i % 5 });
      buf += kind === 'json' ? `${line}${i < n ? ',' : ''}\n` : `${line}\n`;
    }
    if (buf.length > 1 << 20) {
      if (!out.write(buf)) await once(out, 'drain');
      buf = '';
    }
  }
  out.end(buf + (kind === 'json' ? ']\n' : ''));
  await once(out, 'finish');
  return path;
}

/** Parses a file streamed from disk; returns ms, documents and the peak RSS seen between batches. */
async function parseFile(
  path: string,
  opts: Partial<ParseOptions>,
): Promise<{ ms: number; cpuMs: number; docs: number; peakRss: number; baseRss: number }> {
  gc();
  const baseRss = process.memoryUsage().rss;
  let peakRss = baseRss;
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const gen = parseDocuments(createReadStream(path, { highWaterMark: 64 * 1024 }), opts);
  let docs = 0;
  for (;;) {
    const next = await gen.next();
    if (next.done) break;
    docs += next.value.length;
    const rss = process.memoryUsage().rss;
    if (rss > peakRss) peakRss = rss;
  }
  const cpu = process.cpuUsage(c0);
  return { ms: performance.now() - t0, cpuMs: (cpu.user + cpu.system) / 1000, docs, peakRss, baseRss };
}

const PY_PEER = String.raw`
import csv, json, resource, sys, time
kind, path = sys.argv[1], sys.argv[2]
t0 = time.perf_counter()
c0 = time.process_time()
n = 0
with open(path, encoding='utf-8', newline='') as f:
    if kind == 'csv':
        for row in csv.DictReader(f):
            n += 1
    elif kind == 'ndjson':
        for line in f:
            if line.strip():
                json.loads(line); n += 1
    else:
        n = len(json.load(f))
ms = (time.perf_counter() - t0) * 1000
cpu = (time.process_time() - c0) * 1000
print(json.dumps({'ms': ms, 'cpuMs': cpu, 'docs': n, 'maxrssKb': resource.getrusage(resource.RUSAGE_SELF).ru_maxrss}))
`;

interface PeerResult {
  ms: number;
  cpuMs: number;
  docs: number;
  maxrssKb: number;
}

function python(kind: Kind, path: string): PeerResult | null {
  const r = spawnSync('/usr/bin/python3', ['-c', PY_PEER, kind, path], { encoding: 'utf8' });
  if (r.status !== 0) {
    console.log(`  (python peer unavailable: ${r.stderr.trim().split('\n').pop() ?? r.error?.message})`);
    return null;
  }
  return JSON.parse(r.stdout) as PeerResult;
}

const mb = (bytes: number) => `${(bytes / 1e6).toFixed(1)} MB`;

const fmt = (ms: number) => ms.toFixed(0).padStart(7);

async function main(): Promise<void> {
  console.log(`sheaf ingest bench — node ${process.version}, load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}, inputs in ${dir}`);
  console.log('CPU ms is user+system time of the parse alone; wall ms also counts waiting for a core on a busy machine.');
  console.log(`\n1. ${rows.toLocaleString('en')} documents of ~60 words (best of 3 runs each, streamed from disk in 64 KiB chunks)`);
  console.log('   format   size        sheaf wall ms  cpu ms   python wall ms  cpu ms   ratio sheaf/python (wall, cpu)');
  for (const kind of ['csv', 'ndjson', 'json'] as const) {
    const path = await writeInput(kind, rows, 60);
    let best = { ms: Infinity, cpuMs: Infinity };
    for (let i = 0; i < 3; i++) {
      const r = await parseFile(path, { idField: 'id' });
      if (r.docs !== rows) throw new Error(`expected ${rows} documents, got ${r.docs}`);
      if (r.ms < best.ms) best = r;
    }
    let py: PeerResult | null = null;
    for (let i = 0; i < 3; i++) {
      const p = python(kind, path);
      if (p && p.docs !== rows) throw new Error(`python read ${p.docs} documents`);
      if (p && (!py || p.ms < py.ms)) py = p;
    }
    console.log(
      `   ${kind.padEnd(8)} ${mb(statSync(path).size).padEnd(10)} ${fmt(best.ms)}       ${fmt(best.cpuMs)}   ` +
        (py ? `${fmt(py.ms)}         ${fmt(py.cpuMs)}   ${(best.ms / py.ms).toFixed(2)}, ${(best.cpuMs / py.cpuMs).toFixed(2)}` : '(no peer)'),
    );
    rmSync(path);
  }

  const bigRows = 110_000;
  console.log(`\n2. memory: a ~50 MB CSV (${bigRows.toLocaleString('en')} rows of ~60 words), streamed from disk, batches of 1,000,`);
  console.log('   each side in a fresh process; peak RSS is the whole process (runtime included)');
  const big = await writeInput('csv', bigRows, 60);
  const r = spawnSync(process.execPath, ['--expose-gc', process.argv[1]!, CHILD_FLAG, big], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`memory child failed: ${r.stderr}`);
  const mine = JSON.parse(r.stdout) as PeerResult & { startRssKb: number };
  if (mine.docs !== bigRows) throw new Error(`expected ${bigRows} documents, got ${mine.docs}`);
  const py = python('csv', big);
  console.log(`   file ${mb(statSync(big).size)}`);
  console.log(
    `   sheaf:  ${mine.docs.toLocaleString('en')} documents, ${mine.ms.toFixed(0)} ms wall, ${mine.cpuMs.toFixed(0)} ms CPU, ` +
      `peak RSS ${mb(mine.maxrssKb * 1024)} (process at start ${mb(mine.startRssKb * 1024)})`,
  );
  if (py) {
    console.log(`   python: ${py.docs.toLocaleString('en')} rows (csv.DictReader), ${py.ms.toFixed(0)} ms wall, ${py.cpuMs.toFixed(0)} ms CPU, peak RSS ${mb(py.maxrssKb * 1024)}`);
    console.log(`   ratio sheaf/python: ${(mine.ms / py.ms).toFixed(2)} wall, ${(mine.cpuMs / py.cpuMs).toFixed(2)} CPU, ${(mine.maxrssKb / py.maxrssKb).toFixed(2)} peak RSS`);
  }
  rmSync(dir, { recursive: true, force: true });
}

/** Child mode: parse one file in a fresh process and print its figures as JSON. */
async function memoryChild(path: string): Promise<void> {
  const startRssKb = process.memoryUsage().rss / 1024;
  const r = await parseFile(path, { idField: 'id' });
  console.log(JSON.stringify({ ms: r.ms, cpuMs: r.cpuMs, docs: r.docs, maxrssKb: process.resourceUsage().maxRSS, startRssKb }));
}

if (child) {
  memoryChild(process.argv[3]!).catch((err: unknown) => {
    console.error(err);
    process.exit(1);
  });
} else main().catch((err: unknown) => {
  rmSync(dir, { recursive: true, force: true });
  console.error(err);
  process.exit(1);
});
