import Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, startServer, waitForJob, type TestServer } from '../helpers/server.js';
import { syntheticDocuments } from '../helpers/synthetic-corpus.js';

let server: TestServer;
let corpusId: string;

beforeAll(async () => {
  server = await startServer();
  const docs = syntheticDocuments(20_000);
  const r = await api(server.url, '/corpora', { method: 'POST', json: { name: 'heavy', documents: docs } });
  expect(r.status).toBe(201);
  corpusId = r.body.id;
});
afterAll(async () => {
  await server?.stop();
});

async function startHeavyAnalysis(): Promise<string> {
  const r = await api(server.url, `/corpora/${corpusId}/analyses`, { method: 'POST', json: { k: 'auto', kMin: 2, kMax: 40 } });
  expect(r.status).toBe(202);
  expect(r.body.status).toBe('queued');
  return r.body.id;
}

async function waitUntilRunning(aid: string): Promise<void> {
  for (let i = 0; i < 600; i++) {
    const r = await api(server.url, `/analyses/${aid}`);
    if (r.body.status === 'running') return;
    if (r.body.status !== 'queued') throw new Error(`analysis ended ${r.body.status} before it was seen running`);
    await new Promise((res) => setTimeout(res, 50));
  }
  throw new Error('analysis never started');
}

describe('jobs', () => {
  it('health answers while a heavy analysis runs in a worker (the HTTP thread is not blocked)', async () => {
    const aid = await startHeavyAnalysis();
    await waitUntilRunning(aid);
    for (let i = 0; i < 5; i++) {
      const h = await api(server.url, '/health');
      expect(h.status).toBe(200);
      expect(h.body.jobs.running).toBeGreaterThanOrEqual(1);
    }
    // Still running after the health answers: they did not wait for the job.
    expect((await api(server.url, `/analyses/${aid}`)).body.status).toBe('running');
    await api(server.url, `/analyses/${aid}/cancel`, { method: 'POST' });
    const end = await waitForJob(server.url, `/analyses/${aid}`, 30_000);
    expect(end.status).toBe('cancelled');
  });

  it('streams progress as Server-Sent Events until a final status event', async () => {
    const aid = await startHeavyAnalysis();
    const res = await fetch(`${server.url}/api/v1/analyses/${aid}/events`);
    expect(res.headers.get('content-type')).toMatch(/text\/event-stream/);
    const reader = res.body!.getReader();
    let text = '';
    let cancelled = false;
    const decoder = new TextDecoder();
    for (let i = 0; i < 10_000; i++) {
      const { done, value } = await reader.read();
      if (done) break;
      text += decoder.decode(value);
      if (!cancelled && /"stage":"(reduce|sweep-k)"/.test(text)) {
        cancelled = true;
        await api(server.url, `/analyses/${aid}/cancel`, { method: 'POST' });
      }
    }
    const events = text.split('\n\n').filter((b) => b.includes('data:'));
    const progress = events.filter((e) => e.startsWith('event: progress')).map((e) => JSON.parse(e.split('data: ')[1]));
    expect(progress.length).toBeGreaterThan(1);
    for (let i = 1; i < progress.length; i++) expect(progress[i].fraction).toBeGreaterThanOrEqual(progress[i - 1].fraction);
    const last = events[events.length - 1];
    expect(last).toMatch(/^event: end/);
    expect(JSON.parse(last.split('data: ')[1]).status).toBe('cancelled');
  });

  it('cancel stops a running analysis, which ends cancelled; cancelling again is a conflict', async () => {
    const aid = await startHeavyAnalysis();
    await waitUntilRunning(aid);
    const t0 = Date.now();
    const c = await api(server.url, `/analyses/${aid}/cancel`, { method: 'POST' });
    expect(c.status).toBe(202);
    const end = await waitForJob(server.url, `/analyses/${aid}`, 30_000);
    console.log(`cancel took effect in ${Date.now() - t0} ms`);
    expect(end.status).toBe('cancelled');
    expect(end.clusters).toEqual([]);
    const again = await api(server.url, `/analyses/${aid}/cancel`, { method: 'POST' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('conflict');
  });

  it('a job left running by a crash is marked failed with a reason at the next start', async () => {
    const aid = await startHeavyAnalysis();
    await waitUntilRunning(aid);
    server.proc.kill('SIGKILL');
    await new Promise((res) => server.proc.once('exit', res));
    const dataDir = server.dataDir;
    const db = new Database(join(dataDir, 'sheaf.db'), { readonly: true });
    expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
    db.close();
    server = await startServer({ dataDir });
    const a = await api(server.url, `/analyses/${aid}`);
    expect(a.body.status).toBe('failed');
    expect(a.body.error.code).toBe('interrupted');
    expect(a.body.error.message).toMatch(/start it again/);
    // The corpus survived whole, and the same work can be queued again.
    const corpus = await api(server.url, `/corpora/${corpusId}`);
    expect(corpus.body.documentCount).toBe(20_000);
    const again = await api(server.url, `/corpora/${corpusId}/analyses`, { method: 'POST', json: { k: 3 } });
    expect(again.status).toBe(202);
    await api(server.url, `/analyses/${again.body.id}/cancel`, { method: 'POST' });
  });
});
