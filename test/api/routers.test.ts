import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, startServer, waitForJob, type TestServer } from '../helpers/server.js';

let server: TestServer;
let base: string;
let demoId: string;
let router: any;
let key: string;
let keyId: string;

const route = (rid: string, body: unknown, k?: string) =>
  api(base, `/routers/${rid}/route`, { method: 'POST', json: body, headers: k ? { authorization: `Bearer ${k}` } : {} });

beforeAll(async () => {
  server = await startServer({ demo: true });
  base = server.url;
  demoId = (await api(base, '/corpora')).body[0].id;
  const r = await api(base, '/routers', { method: 'POST', json: { corpusId: demoId, labelField: 'intended_theme', folds: 5, targetPrecision: 0.95 } });
  expect(r.status).toBe(202);
  router = await waitForJob(base, `/routers/${r.body.id}`);
  const k = await api(base, `/routers/${router.id}/keys`, { method: 'POST' });
  expect(k.status).toBe(201);
  key = k.body.key;
  keyId = k.body.id;
});
afterAll(async () => {
  await server?.stop();
});

describe('routers', () => {
  it('trains from a label column and reports a cross-validated evaluation', () => {
    expect(router.status).toBe('done');
    expect(router.version).toBe(1);
    expect(router.labels).toHaveLength(11);
    expect(router.documentCount).toBe(2000);
    const e = router.evaluation;
    expect(e.folds).toBe(5);
    expect(e.accuracy).toBeGreaterThan(0.5);
    expect(e.errorRate).toBeCloseTo(1 - e.accuracy, 12);
    expect(e.perLabel).toHaveLength(11);
    for (const p of e.perLabel) for (const m of ['precision', 'recall', 'specificity', 'f1', 'auc']) expect(p[m]).toBeGreaterThanOrEqual(0);
    expect(e.confusion.matrix.flat().reduce((a: number, b: number) => a + b, 0)).toBe(2000);
    expect(e.threshold.targetPrecision).toBe(0.95);
    expect(router.abstainThreshold).toBe(e.threshold.value);
    expect(router.caution).toMatch(/safety, health or legal deadlines/);
  });

  it('routes one text and a batch in input order, with scores and evidence', async () => {
    const one = await route(router.id, { text: 'My parcel still has not arrived and the tracking has not moved for a week' }, key);
    expect(one.status).toBe(200);
    expect(one.body.results).toHaveLength(1);
    const r0 = one.body.results[0];
    expect(router.labels).toContain(r0.label);
    expect(r0.confidence).toBeGreaterThan(0);
    expect(Object.values(r0.scores).reduce((a: number, b: any) => a + b, 0)).toBeCloseTo(1, 6);
    expect(r0.evidence.length).toBeGreaterThan(0);
    const batch = await route(router.id, { documents: [{ id: 'a', text: 'refund please, the mug was wrong' }, { text: '' }, { id: 'c', text: 'invoice VAT number' }] }, key);
    expect(batch.body.results.map((r: any) => r.id)).toEqual(['a', '2', 'c']);
    expect(batch.body.results[1]).toMatchObject({ abstained: true, reason: expect.stringMatching(/empty/) });
  });

  it('refuses routing without a key (401), with a wrong key (401) and with another router’s key (403)', async () => {
    expect((await route(router.id, { text: 'x' })).status).toBe(401);
    const wrong = await route(router.id, { text: 'x' }, 'shk_not-a-real-key');
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe('unauthorized');
    const other = await api(base, '/routers', { method: 'POST', json: { corpusId: demoId, labelField: 'language' } });
    expect(other.status).toBe(202);
    const otherKey = (await api(base, `/routers/${other.body.id}/keys`, { method: 'POST' })).body.key;
    const cross = await route(router.id, { text: 'x' }, otherKey);
    expect(cross.status).toBe(403);
    expect(cross.body.error.code).toBe('forbidden');
  });

  it('revokes a key at once', async () => {
    const k = await api(base, `/routers/${router.id}/keys`, { method: 'POST' });
    expect((await route(router.id, { text: 'hello' }, k.body.key)).status).toBe(200);
    const list = await api(base, `/routers/${router.id}/keys`);
    expect(list.body.map((x: any) => x.id)).toContain(k.body.id);
    expect(JSON.stringify(list.body)).not.toContain(k.body.key);
    expect((await api(base, `/routers/${router.id}/keys/${k.body.id}`, { method: 'DELETE' })).status).toBe(204);
    const after = await route(router.id, { text: 'hello' }, k.body.key);
    expect(after.status).toBe(401);
    expect(after.body.error.message).toMatch(/revoked/);
    expect((await route(router.id, { text: 'hello' }, key)).status).toBe(200);
    expect(keyId).toBeTruthy();
  });

  it('refuses bad routing bodies', async () => {
    const many = Array.from({ length: 1001 }, () => ({ text: 'x' }));
    const big = await route(router.id, { documents: many }, key);
    expect(big.status).toBe(413);
    expect(big.body.error.message).toMatch(/1000/);
    expect((await route(router.id, { text: 5 }, key)).status).toBe(400);
    expect((await route(router.id, { documents: [{ text: null }] }, key)).status).toBe(400);
    expect((await route(router.id, {}, key)).status).toBe(400);
    expect((await route('r_unknown', { text: 'x' }, key)).status).toBe(403);
  });

  it('refuses training sources that cannot make a router', async () => {
    const oneLabel = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 'a b', tag: 'x' }, { text: 'c d', tag: 'x' }] } });
    const r1 = await api(base, '/routers', { method: 'POST', json: { corpusId: oneLabel.body.id, labelField: 'tag' } });
    expect(r1.status).toBe(422);
    expect(r1.body.error.message).toMatch(/at least 2 labels/);
    const noField = await api(base, '/routers', { method: 'POST', json: { corpusId: demoId, labelField: 'nope' } });
    expect(noField.status).toBe(422);
    expect((await api(base, '/routers', { method: 'POST', json: { corpusId: 'c_nope', labelField: 'x' } })).status).toBe(404);
    expect((await api(base, '/routers', { method: 'POST', json: { analysisId: 'a', corpusId: 'b' } })).status).toBe(400);
    const a = await api(base, `/corpora/${demoId}/analyses`, { method: 'POST', json: { k: 4 } });
    await waitForJob(base, `/analyses/${a.body.id}`);
    const unnamed = await api(base, '/routers', { method: 'POST', json: { analysisId: a.body.id } });
    expect(unnamed.status).toBe(422);
    expect(unnamed.body.error.message).toMatch(/name/);
  });

  it('trains from the named themes of an analysis, leaving unnamed ones out', async () => {
    const a = await api(base, `/corpora/${demoId}/analyses`, { method: 'POST', json: { k: 4, seed: 2 } });
    const done = await waitForJob(base, `/analyses/${a.body.id}`);
    const [t1, t2] = done.clusters;
    await api(base, `/analyses/${a.body.id}/clusters/${t1.id}`, { method: 'PATCH', json: { name: 'First' } });
    await api(base, `/analyses/${a.body.id}/clusters/${t2.id}`, { method: 'PATCH', json: { name: 'Second' } });
    const r = await api(base, '/routers', { method: 'POST', json: { analysisId: a.body.id } });
    expect(r.status).toBe(202);
    const trained = await waitForJob(base, `/routers/${r.body.id}`);
    expect(trained.status).toBe('done');
    expect(trained.labels.sort()).toEqual(['First', 'Second']);
    expect(trained.documentCount).toBe(t1.size + t2.size);
  });

  it('retrains into a new version while the old one keeps answering; a failed retraining leaves it serving', async () => {
    const re = await api(base, `/routers/${router.id}/retrain`, { method: 'POST', json: { folds: 3 } });
    expect(re.status).toBe(202);
    // Whatever the training is doing, routing answers with a serving version.
    const during = await route(router.id, { text: 'where is my order' }, key);
    expect(during.status).toBe(200);
    expect(during.body.version).toBeGreaterThanOrEqual(1);
    const after = await waitForJob(base, `/routers/${router.id}`);
    expect(after.version).toBe(2);
    expect(after.evaluation.folds).toBe(3);
    expect((await route(router.id, { text: 'where is my order' }, key)).body.version).toBe(2);
    // A retraining that does not finish (cancelled here) leaves version 2 serving.
    const again = await api(base, `/routers/${router.id}/retrain`, { method: 'POST', json: {} });
    expect(again.status).toBe(202);
    await api(base, `/routers/${router.id}/cancel`, { method: 'POST' });
    const stopped = await waitForJob(base, `/routers/${router.id}`);
    expect(['cancelled', 'done']).toContain(stopped.status);
    if (stopped.status === 'cancelled') expect(stopped.version).toBe(2);
    expect((await route(router.id, { text: 'where is my order' }, key)).status).toBe(200);
    // The source corpus goes away: retraining fails at once, version 2 keeps serving.
    const c = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 'aa bb', t: 'x' }, { text: 'cc dd', t: 'x' }, { text: 'ee ff', t: 'y' }, { text: 'gg hh', t: 'y' }] } });
    const small = await api(base, '/routers', { method: 'POST', json: { corpusId: c.body.id, labelField: 't', folds: 2 } });
    const smallDone = await waitForJob(base, `/routers/${small.body.id}`);
    expect(smallDone.status).toBe('done');
    await api(base, `/corpora/${c.body.id}`, { method: 'DELETE' });
    expect((await api(base, `/routers/${small.body.id}/retrain`, { method: 'POST', json: {} })).status).toBe(404);
    const sk = (await api(base, `/routers/${small.body.id}/keys`, { method: 'POST' })).body.key;
    const still = await route(small.body.id, { text: 'aa bb' }, sk);
    expect(still.status).toBe(200);
    expect(still.body.version).toBe(1);
  });
});
