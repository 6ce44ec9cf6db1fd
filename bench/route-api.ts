// Routing API under load: POST /routers/:rid/route with one ~60-word text per request, against a
// bare Hono endpoint on the same server (same process, same middleware), in one run.
//
//   npm run bench route-api                 (3 rounds of 5 s per endpoint, 10 connections)
//   npm run bench route-api -- 10 50 5      (seconds per round, connections, rounds)
//
// The endpoints take turns round by round, so a noisy neighbour on the machine hits both alike;
// the ratio is reported per round and as the median.
//
// The server runs in a child process (this file with --serve), so the load generator does not
// share its event loop. The router is trained on 5,000 synthetic documents (seeded) before the
// measurement. Everything talks to 127.0.0.1 only.
import { serve } from '@hono/node-server';
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { hashKey, newRouterKey } from '../server/api/router-keys.js';
import { createApp } from '../server/app.js';
import { readConfig } from '../server/config.js';
import { JobRunner } from '../server/jobs/job-runner.js';
import { WorkerPool } from '../server/jobs/worker-pool.js';
import { trainRouter } from '../server/route/index.js';
import { newId, openSqliteStore } from '../server/store/index.js';
import { syntheticTickets } from './lib/synthetic-tickets.js';

const BODY = JSON.stringify({ text: syntheticTickets(1, 99)[0].text });

interface ServerInfo {
  port: number;
  rid: string;
  key: string;
}

/** Child: the real app with one trained router and a key, plus a bare endpoint; prints where. */
async function serveForBench(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'sheaf-bench-route-'));
  const store = openSqliteStore(dir);
  const pool = new WorkerPool({ size: 1 });
  const runner = new JobRunner(store, pool, { analysis: { run: async () => {} }, training: { run: async () => {} } });
  const app = createApp({ config: { ...readConfig({}), dataDir: dir, routeRatePerKey: 0 }, store, runner, pool, version: 'bench' });
  app.post('/bench/bare', async (c) => {
    await c.req.json();
    return c.json({ ok: true });
  });

  const train = syntheticTickets(5000, 1);
  const t0 = performance.now();
  const { model } = trainRouter(
    train.map((d) => d.text),
    train.map((d) => d.label),
  );
  console.log(`trained on ${train.length} documents in ${((performance.now() - t0) / 1000).toFixed(2)} s`);
  const rid = newId('r');
  await store.createRouter(rid, newId('j'), { corpusId: 'bench', labelField: 'label' }, {});
  await store.saveRouterVersion(rid, model.toJSON(), model.labels, train.length, {}, model.abstainThreshold);
  const key = newRouterKey();
  await store.addKey({ id: newId('k'), routerId: rid, hash: hashKey(key.key), prefix: key.prefix, createdAt: new Date().toISOString(), revokedAt: null, lastUsedAt: null });

  const server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' });
  await new Promise((r) => server.once('listening', r));
  const port = (server.address() as AddressInfo).port;
  console.log(JSON.stringify({ port, rid, key: key.key } satisfies ServerInfo));
  process.on('SIGTERM', async () => {
    server.close();
    await pool.close();
    await store.close();
    rmSync(dir, { recursive: true, force: true });
    process.exit(0);
  });
}

async function main(): Promise<void> {
  const seconds = Number(process.argv[2] ?? 5);
  const connections = Number(process.argv[3] ?? 10);
  const rounds = Number(process.argv[4] ?? 3);
  const child = spawn(process.execPath, [fileURLToPath(import.meta.url), '--serve'], { stdio: ['ignore', 'pipe', 'inherit'] });
  let out = '';
  const info = await new Promise<ServerInfo>((resolve, reject) => {
    child.stdout!.on('data', (d) => {
      out += d;
      const line = out.split('\n').find((l) => l.startsWith('{'));
      if (line) resolve(JSON.parse(line));
    });
    child.on('exit', (code) => reject(new Error(`bench server exited (${code}): ${out}`)));
  });
  console.log(out.split('\n').filter((l) => l && !l.startsWith('{')).join('\n'));
  console.log(`request body: ${BODY.length} bytes (60 words); ${rounds} rounds of ${seconds} s per endpoint, ${connections} connections`);

  const measure = async (name: string, path: string, headers: Record<string, string>, duration: number) => {
    const r = await autocannon({ url: `http://127.0.0.1:${info.port}${path}`, method: 'POST', headers, body: BODY, connections, duration });
    return { name, rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, errors: r.errors + r.timeouts, non2xx: r.non2xx, total: r.requests.total };
  };
  const json = { 'content-type': 'application/json' };
  const routeHeaders = { ...json, authorization: `Bearer ${info.key}` };
  const routePath = `/api/v1/routers/${info.rid}/route`;
  // Warm up both (JIT, model load).
  await measure('bare', '/bench/bare', json, 2);
  await measure('route', routePath, routeHeaders, 2);
  const row = (r: Awaited<ReturnType<typeof measure>>) =>
    `${r.name.padEnd(20)} ${r.rps.toFixed(0).padStart(10)} ${r.p50.toFixed(2).padStart(8)} ${r.p99.toFixed(2).padStart(8)} ${String(r.errors).padStart(8)} ${String(r.non2xx).padStart(8)} ${String(r.total).padStart(7)}`;
  console.log('\nround  endpoint             requests/s   p50 ms   p99 ms   errors  non-2xx   total');
  const ratios: number[] = [];
  const p99s: number[] = [];
  for (let i = 1; i <= rounds; i++) {
    const bare = await measure('bare Hono endpoint', '/bench/bare', json, seconds);
    const routed = await measure('route API', routePath, routeHeaders, seconds);
    console.log(`${String(i).padEnd(6)} ${row(bare)}\n${''.padEnd(6)} ${row(routed)}`);
    ratios.push(routed.rps / bare.rps);
    p99s.push(routed.p99);
  }
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  console.log(
    `\nroute API / bare, per round: ${ratios.map((r) => `${(100 * r).toFixed(1)} %`).join(', ')}; median ${(100 * median(ratios)).toFixed(1)} % (target ≥ 50 %)`,
  );
  console.log(`route API p99 per round: ${p99s.join(', ')} ms; median ${median(p99s)} ms (target ≤ 5 ms)`);
  child.kill('SIGTERM');
}

if (process.argv.includes('--serve')) await serveForBench();
else await main();
