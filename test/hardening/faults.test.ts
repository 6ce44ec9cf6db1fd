import Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { api, startServer, waitForJob, type TestServer } from '../helpers/server.js';
import { syntheticDocuments } from '../helpers/synthetic-corpus.js';

let server: TestServer | null = null;
afterEach(async () => {
  await server?.stop();
  server = null;
});

async function crash(s: TestServer): Promise<string> {
  s.proc.kill('SIGKILL');
  await new Promise((res) => s.proc.once('exit', res));
  return s.dataDir;
}

/** Opens the database file the way an operator would, after the server is gone. */
function integrityOk(dataDir: string): boolean {
  const db = new Database(join(dataDir, 'sheaf.db'), { readonly: true });
  try {
    return db.pragma('integrity_check', { simple: true }) === 'ok';
  } finally {
    db.close();
  }
}

async function waitRunning(base: string, path: string): Promise<void> {
  for (let i = 0; i < 1200; i++) {
    const r = await api(base, path);
    if (r.body.status === 'running') return;
    if (r.body.status !== 'queued') throw new Error(`ended ${r.body.status} before running`);
    await new Promise((res) => setTimeout(res, 25));
  }
  throw new Error('never started');
}

describe('faults', () => {
  it('kill -9 during a large import: nothing half-imported is visible, acknowledged corpora are whole, the file is intact', async () => {
    server = await startServer();
    const ok = await api(server.url, '/corpora', { method: 'POST', json: { name: 'acknowledged', documents: syntheticDocuments(3000) } });
    expect(ok.status).toBe(201);
    // A raw CSV body sent in pieces: the server is importing when it dies.
    const rows = syntheticDocuments(40_000, 8, 60, 11).map((d, i) => `${i + 1},${d.text}\n`);
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      async pull(controller) {
        if (sent >= rows.length) return controller.close();
        controller.enqueue(new TextEncoder().encode((sent === 0 ? 'id,text\n' : '') + rows.slice(sent, sent + 2000).join('')));
        sent += 2000;
        if (sent === 20_000) await new Promise((res) => setTimeout(res, 60_000));
      },
    });
    const upload = fetch(`${server.url}/api/v1/corpora?name=doomed`, { method: 'POST', headers: { 'content-type': 'text/csv' }, body, duplex: 'half' } as RequestInit).catch((e) => e);
    for (let i = 0; i < 400 && sent < 20_000; i++) await new Promise((res) => setTimeout(res, 25));
    await new Promise((res) => setTimeout(res, 300));
    const dataDir = await crash(server);
    expect(await upload).toBeInstanceOf(Error);
    expect(integrityOk(dataDir)).toBe(true);
    server = await startServer({ dataDir });
    const list = await api(server.url, '/corpora');
    expect(list.body.map((c: any) => c.name)).toEqual(['acknowledged']);
    expect(list.body[0].documentCount).toBe(3000);
    const docs = await api(server.url, `/corpora/${ok.body.id}/documents?offset=2999&limit=5`);
    expect(docs.body.items).toHaveLength(1);
    // The same work can be done again.
    const again = await api(server.url, '/corpora', { method: 'POST', json: { name: 'again', documents: syntheticDocuments(500) } });
    expect(again.status).toBe(201);
  });

  it('kill -9 during router training: the job shows failed with the reason, and training can be run again', async () => {
    server = await startServer();
    const docs = syntheticDocuments(30_000).map((d) => ({ text: d.text, theme: d.theme }));
    const c = await api(server.url, '/corpora', { method: 'POST', json: { documents: docs } });
    const r = await api(server.url, '/routers', { method: 'POST', json: { corpusId: c.body.id, labelField: 'theme', folds: 10 } });
    await waitRunning(server.url, `/routers/${r.body.id}`);
    const dataDir = await crash(server);
    expect(integrityOk(dataDir)).toBe(true);
    server = await startServer({ dataDir });
    const after = await api(server.url, `/routers/${r.body.id}`);
    expect(after.body.status).toBe('failed');
    expect(after.body.error.message).toMatch(/stopped while this job was running/);
    expect(after.body.version).toBe(0);
    const re = await api(server.url, `/routers/${r.body.id}/retrain`, { method: 'POST', json: { folds: 2 } });
    expect(re.status).toBe(202);
    const done = await waitForJob(server.url, `/routers/${r.body.id}`, 180_000);
    expect(done.status).toBe('done');
    expect(done.version).toBe(1);
  }, 240_000);

  it('SIGTERM stops a running analysis cleanly: the server exits and the job is failed with a reason', async () => {
    server = await startServer();
    const c = await api(server.url, '/corpora', { method: 'POST', json: { documents: syntheticDocuments(20_000) } });
    const a = await api(server.url, `/corpora/${c.body.id}/analyses`, { method: 'POST', json: { k: 'auto', kMax: 40 } });
    await waitRunning(server.url, `/analyses/${a.body.id}`);
    const exited = new Promise<number | null>((res) => server!.proc.once('exit', (code) => res(code)));
    server.proc.kill('SIGTERM');
    expect(await exited).toBe(0);
    const dataDir = server.dataDir;
    expect(integrityOk(dataDir)).toBe(true);
    server = await startServer({ dataDir });
    const after = await api(server.url, `/analyses/${a.body.id}`);
    expect(after.body.status).toBe('failed');
    expect(after.body.error.code).toBe('interrupted');
  });
});

describe('many clients at once', () => {
  it('20 concurrent uploads all land whole; 10 concurrent analyses queue and finish; health stays up', async () => {
    server = await startServer({ env: { MAX_QUEUED_JOBS: '12' } });
    const base = server.url;
    const uploads = await Promise.all(
      Array.from({ length: 20 }, (_, i) => api(base, '/corpora', { method: 'POST', json: { name: `u${i}`, documents: syntheticDocuments(200, 4, 30, i + 1) } })),
    );
    expect(uploads.map((u) => u.status)).toEqual(Array(20).fill(201));
    const list = await api(base, '/corpora');
    expect(list.body).toHaveLength(20);
    for (const c of list.body) expect(c.documentCount).toBe(200);

    const started = await Promise.all(uploads.slice(0, 10).map((u) => api(base, `/corpora/${u.body.id}/analyses`, { method: 'POST', json: { k: 4 } })));
    expect(started.map((s) => s.status)).toEqual(Array(10).fill(202));
    const health = await api(base, '/health');
    expect(health.status).toBe(200);
    const ends = await Promise.all(started.map((s) => waitForJob(base, `/analyses/${s.body.id}`, 300_000)));
    expect(ends.map((e) => e.status)).toEqual(Array(10).fill('done'));
  }, 300_000);

  it('a full queue answers 429 with Retry-After', async () => {
    server = await startServer({ env: { MAX_QUEUED_JOBS: '2', JOB_WORKERS: '1' } });
    const c = await api(server.url, '/corpora', { method: 'POST', json: { documents: syntheticDocuments(20_000) } });
    const answers = [];
    for (let i = 0; i < 6; i++) answers.push(await api(server.url, `/corpora/${c.body.id}/analyses`, { method: 'POST', json: { k: 'auto', kMax: 40 } }));
    const refused = answers.filter((a) => a.status === 429);
    expect(refused.length).toBeGreaterThan(0);
    expect(refused[0].body.error.code).toBe('too_many_requests');
    expect(Number(refused[0].headers.get('retry-after'))).toBeGreaterThan(0);
    for (const a of answers.filter((x) => x.status === 202)) await api(server.url, `/analyses/${a.body.id}/cancel`, { method: 'POST' });
  });
});
