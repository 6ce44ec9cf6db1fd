// Load on the real server process (dist/server/main.js, a fresh DATA_DIR, 127.0.0.1 only):
//  1. POST /routers/:rid/route, one ~60-word text per request;
//  2. GET /analyses/:aid/assignments of a 50,000-document analysis (streamed).
// Each for N seconds with C connections (autocannon); prints requests/s, p99, errors, non-2xx and
// the server's RSS after warm-up and at the end (memory should stay flat).
//
//   npm run bench load                  (30 s each, 50 connections, 50,000 documents)
//   npm run bench load -- 10 20 20000   (seconds, connections, documents)
import autocannon from 'autocannon';
import { readFileSync } from 'node:fs';
import { startBenchServer } from './lib/bench-server.js';
import { syntheticTickets } from './lib/synthetic-tickets.js';

const seconds = Number(process.argv[2] ?? 30);
const connections = Number(process.argv[3] ?? 50);
const docsN = Number(process.argv[4] ?? 50_000);

const srv = await startBenchServer({ ROUTE_RATE_LIMIT: '0' });
const server = srv.process;
const base = srv.base;

function rssMb(): number {
  const status = readFileSync(`/proc/${server.pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024;
}

async function call(path: string, init: RequestInit = {}): Promise<any> {
  const r = await fetch(base + '/api/v1' + path, { ...init, headers: { 'content-type': 'application/json', ...(init.headers as Record<string, string>) } });
  return r.json();
}

async function waitDone(path: string): Promise<any> {
  for (let i = 0; i < 6000; i++) {
    const r = await call(path);
    if (r.status !== 'queued' && r.status !== 'running') return r;
    await new Promise((res) => setTimeout(res, 200));
  }
  throw new Error(`${path} did not finish`);
}

const docs = syntheticTickets(docsN, 3).map((d) => ({ text: d.text, topic: d.label }));
const corpus = await call('/corpora', { method: 'POST', body: JSON.stringify({ name: 'load', documents: docs }) });
const router = await call('/routers', { method: 'POST', body: JSON.stringify({ corpusId: corpus.id, labelField: 'topic' }) });
const trained = await waitDone(`/routers/${router.id}`);
const { key } = await call(`/routers/${router.id}/keys`, { method: 'POST' });
const t0 = performance.now();
const analysis = await call(`/corpora/${corpus.id}/analyses`, { method: 'POST', body: JSON.stringify({ k: 12 }) });
const analysed = await waitDone(`/analyses/${analysis.id}`);
console.log(`corpus ${docsN} documents; router ${trained.status}; analysis ${analysed.status} in ${((performance.now() - t0) / 1000).toFixed(1)} s`);

async function run(name: string, opts: { url: string; method?: string; headers?: Record<string, string>; body?: string }) {
  await autocannon({ ...opts, connections, duration: 3 });
  const warm = rssMb();
  const r = await autocannon({ ...opts, connections, duration: seconds });
  const end = rssMb();
  console.log(
    `${name.padEnd(22)} ${r.requests.average.toFixed(0).padStart(8)} req/s  p50 ${String(r.latency.p50).padStart(5)} ms  p99 ${String(r.latency.p99).padStart(6)} ms  ` +
      `errors ${r.errors + r.timeouts}  non-2xx ${r.non2xx}  RSS after warm-up ${warm.toFixed(0)} MB, at end ${end.toFixed(0)} MB (${(((end - warm) / warm) * 100).toFixed(1)} %)`,
  );
}

console.log(`${seconds} s per endpoint, ${connections} connections, 127.0.0.1`);
await run('route (1 text)', {
  url: `${base}/api/v1/routers/${router.id}/route`,
  method: 'POST',
  headers: { 'content-type': 'application/json', authorization: `Bearer ${key}` },
  body: JSON.stringify({ text: syntheticTickets(1, 77)[0].text }),
});
await run(`assignments (${docsN})`, { url: `${base}/api/v1/analyses/${analysis.id}/assignments` });
await srv.stop();
