// A whole analysis through the HTTP API on the real server (dist/server/main.js, a fresh DATA_DIR,
// 127.0.0.1 only): 50,000 generated planted-theme documents uploaded, POST an analysis with
// k = "auto", poll until done; prints the wall time from the POST to "done", the stage timings the
// server recorded and the ARI against the planted themes. Runs once per JOB_WORKERS value given
// (each job runs on one worker and its spare thread whatever the count; a run per count shows that
// idle workers cost nothing).
//
//   npm run bench analysis                    (50,000 documents; JOB_WORKERS 1 then 2)
//   npm run bench analysis -- 20000 2         (documents, then the JOB_WORKERS values)
import { adjustedRandIndex } from '../server/cluster/agreement.js';
import { startBenchServer } from './lib/bench-server.js';
import { plantedCorpus } from './lib/cluster-corpus.js';

const docsN = Number(process.argv[2] ?? 50_000);
const workerCounts = process.argv.length > 3 ? process.argv.slice(3).map(Number) : [1, 2];
const corpus = plantedCorpus(docsN, 12);

async function once(workers: number): Promise<void> {
  const srv = await startBenchServer({ JOB_WORKERS: String(workers) });
  try {
    const base = srv.base;
    const call = async (path: string, init: RequestInit = {}): Promise<any> => {
      const r = await fetch(base + '/api/v1' + path, { ...init, headers: { 'content-type': 'application/json' } });
      return r.json();
    };
    const docs = corpus.texts.map((text, i) => ({ text, planted: String(corpus.themes[i]) }));
    const c = await call('/corpora', { method: 'POST', body: JSON.stringify({ name: 'bench', documents: docs }) });
    const t0 = performance.now();
    const a = await call(`/corpora/${c.id}/analyses`, { method: 'POST', body: JSON.stringify({ k: 'auto' }) });
    let done: any = null;
    // Bounded: at most 10 minutes of polling every 100 ms.
    for (let i = 0; i < 6000 && !done; i++) {
      const r = await call(`/analyses/${a.id}`);
      if (r.status !== 'queued' && r.status !== 'running') done = r;
      else await new Promise((res) => setTimeout(res, 100));
    }
    const seconds = (performance.now() - t0) / 1000;
    if (!done || done.status !== 'done') throw new Error(`analysis ended ${done?.status ?? 'unfinished'}: ${JSON.stringify(done?.error)}`);
    // Assignments come in corpus order, as uploaded.
    const rows: { clusterId: string }[] = await (await fetch(`${base}/api/v1/analyses/${a.id}/assignments`)).json();
    const labels = Int32Array.from(rows.map((r) => Number(r.clusterId.replace(/\D/g, ''))));
    const ari = rows.length === docsN ? adjustedRandIndex(corpus.themes, labels) : Number.NaN;
    const timings = Object.entries(done.timings ?? {}).map(([k, v]) => `${k} ${(v as number).toFixed(2)} s`).join(', ');
    console.log(`JOB_WORKERS=${workers}: ${docsN} documents, k = ${done.k}, ${seconds.toFixed(2)} s from POST to done (${timings}); ARI ${ari.toFixed(4)}`);
  } finally {
    await srv.stop();
  }
}

for (const w of workerCounts) await once(w);
