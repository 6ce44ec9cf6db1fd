import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, startServer, waitForJob, type TestServer } from '../helpers/server.js';

let server: TestServer;
let base: string;
let demoId: string;
let analysis: any;

beforeAll(async () => {
  server = await startServer({ demo: true });
  base = server.url;
  const list = await api(base, '/corpora');
  expect(list.body).toHaveLength(1);
  demoId = list.body[0].id;
  const r = await api(base, `/corpora/${demoId}/analyses`, { method: 'POST', json: { k: 8, seed: 3 } });
  expect(r.status).toBe(202);
  analysis = await waitForJob(base, `/analyses/${r.body.id}`);
});
afterAll(async () => {
  await server?.stop();
});

describe('analyses', () => {
  it('loads the invented demo corpus on first start', async () => {
    const c = await api(base, `/corpora/${demoId}`);
    expect(c.body.name).toMatch(/invented/);
    expect(c.body.documentCount).toBe(2000);
  });

  it('finds k themes and describes each with terms, representatives and a silhouette', () => {
    expect(analysis.status).toBe('done');
    expect(analysis.k).toBe(8);
    const themes = analysis.clusters.filter((c: any) => !c.noContent);
    expect(themes).toHaveLength(8);
    expect(analysis.clusters.reduce((s: number, c: any) => s + c.size, 0)).toBe(2000);
    for (const c of themes) {
      expect(c.name).toBeNull();
      expect(c.terms.length).toBeGreaterThanOrEqual(5);
      expect(c.representativeIds.length).toBeGreaterThanOrEqual(3);
      expect(c.silhouette).toBeGreaterThanOrEqual(-1);
      expect(c.silhouette).toBeLessThanOrEqual(1);
    }
    expect(Object.keys(analysis.silhouetteByK)).toEqual(['8']);
    for (const stage of ['vectorise', 'map']) expect(analysis.timings[stage]).toBeGreaterThan(0);
    expect(analysis.params).toMatchObject({ method: 'kmeans', k: 8, seed: 3 });
  });

  it('lists the analyses of a corpus', async () => {
    const r = await api(base, `/corpora/${demoId}/analyses`);
    expect(r.body.map((a: any) => a.id)).toContain(analysis.id);
  });

  it('gives every document its theme, map position and silhouette, in corpus order', async () => {
    const r = await api(base, `/analyses/${analysis.id}/assignments`);
    expect(r.status).toBe(200);
    expect(r.body).toHaveLength(2000);
    const docs = await api(base, `/corpora/${demoId}/documents?limit=3`);
    expect(r.body.slice(0, 3).map((a: any) => a.documentId)).toEqual(docs.body.items.map((d: any) => d.id));
    const ids = new Set(analysis.clusters.map((c: any) => c.id));
    for (const a of r.body) {
      expect(ids.has(a.clusterId)).toBe(true);
      expect(Number.isFinite(a.x) && Number.isFinite(a.y)).toBe(true);
    }
    const sizes = new Map<string, number>();
    for (const a of r.body) sizes.set(a.clusterId, (sizes.get(a.clusterId) ?? 0) + 1);
    for (const c of analysis.clusters) expect(sizes.get(c.id) ?? 0).toBe(c.size);
  });

  it('exports CSV (RFC 4180, formula cells neutralised) and NDJSON with text and theme names', async () => {
    const csv = await fetch(`${base}/api/v1/analyses/${analysis.id}/assignments?format=csv`);
    expect(csv.headers.get('content-type')).toMatch(/text\/csv/);
    const text = await csv.text();
    expect(text.startsWith('documentId,clusterId,clusterName,x,y,silhouette,text\r\n')).toBe(true);
    const nd = await fetch(`${base}/api/v1/analyses/${analysis.id}/assignments?format=ndjson`);
    const lines = (await nd.text()).trim().split('\n').map((l) => JSON.parse(l));
    expect(lines).toHaveLength(2000);
    expect(typeof lines[0].text).toBe('string');
  });

  it('renames, merges and moves, and each answer is the updated analysis', async () => {
    const [a, b, c] = analysis.clusters.filter((x: any) => !x.noContent);
    const renamed = await api(base, `/analyses/${analysis.id}/clusters/${a.id}`, { method: 'PATCH', json: { name: '  Parcels  ' } });
    expect(renamed.status).toBe(200);
    expect(renamed.body.clusters.find((x: any) => x.id === a.id).name).toBe('Parcels');

    const merged = await api(base, `/analyses/${analysis.id}/merge`, { method: 'POST', json: { clusterIds: [a.id, b.id] } });
    expect(merged.status).toBe(200);
    const m = merged.body.clusters.find((x: any) => x.id === a.id);
    expect(m.size).toBe(a.size + b.size);
    expect(m.name).toBe('Parcels');
    expect(merged.body.clusters.find((x: any) => x.id === b.id)).toBeUndefined();
    expect(merged.body.k).toBe(analysis.k - 1);

    const docId = c.representativeIds[0];
    const moved = await api(base, `/analyses/${analysis.id}/moves`, { method: 'POST', json: { documentIds: [docId], clusterId: a.id } });
    expect(moved.status).toBe(200);
    expect(moved.body.clusters.find((x: any) => x.id === a.id).size).toBe(m.size + 1);
    expect(moved.body.clusters.find((x: any) => x.id === c.id).size).toBe(c.size - 1);
    const assignments = await api(base, `/analyses/${analysis.id}/assignments`);
    expect(assignments.body.find((x: any) => x.documentId === docId).clusterId).toBe(a.id);

    // Kept across a restart.
    const dataDir = server.dataDir;
    await server.stop({ keepData: true });
    server = await startServer({ dataDir });
    base = server.url;
    const after = await api(base, `/analyses/${analysis.id}`);
    expect(after.body.clusters.find((x: any) => x.id === a.id)).toMatchObject({ name: 'Parcels', size: m.size + 1 });
  });

  it('refuses bad triage edits with clear errors', async () => {
    const [a] = analysis.clusters;
    expect((await api(base, `/analyses/${analysis.id}/merge`, { method: 'POST', json: { clusterIds: [a.id] } })).status).toBe(400);
    expect((await api(base, `/analyses/${analysis.id}/merge`, { method: 'POST', json: { clusterIds: [a.id, 'nope'] } })).status).toBe(404);
    const dupes = await api(base, `/analyses/${analysis.id}/merge`, { method: 'POST', json: { clusterIds: [a.id, a.id] } });
    expect(dupes.status).toBe(422);
    expect((await api(base, `/analyses/${analysis.id}/moves`, { method: 'POST', json: { documentIds: ['no-such-doc'], clusterId: a.id } })).status).toBe(404);
    expect((await api(base, `/analyses/${analysis.id}/clusters/nope`, { method: 'PATCH', json: { name: 'x' } })).status).toBe(404);
    expect((await api(base, `/analyses/${analysis.id}/clusters/${a.id}`, { method: 'PATCH', json: { name: 5 } })).status).toBe(400);
  });
});

describe('analysis parameters and awkward corpora', () => {
  it.each([
    [{ k: 1 }, 400],
    [{ k: 'many' }, 400],
    [{ method: 'dbscan' }, 400],
    [{ linkage: 'single' }, 400],
    [{ kMin: 10, kMax: 5 }, 422],
    [{ k: 5000 }, 400],
    [{ seed: 1.5 }, 400],
    [{ unknown: true }, 400],
    [{ mapEpochs: 5 }, 400],
    [{ mapEpochs: 'many' }, 400],
    [{ mapEpochs: 2000 }, 400],
  ])('refuses %j with %i', async (params, status) => {
    const r = await api(base, `/corpora/${demoId}/analyses`, { method: 'POST', json: params });
    expect(r.status).toBe(status);
    expect(r.body.error.message.length).toBeGreaterThan(10);
  });

  it('lays the map out with the epochs asked for (mapEpochs), the themes unchanged', async () => {
    const r = await api(base, `/corpora/${demoId}/analyses`, { method: 'POST', json: { k: 8, seed: 3, mapEpochs: 20 } });
    expect(r.status).toBe(202);
    const quick = await waitForJob(base, `/analyses/${r.body.id}`);
    expect(quick.params).toMatchObject({ k: 8, seed: 3, mapEpochs: 20 });
    expect(analysis.params.mapEpochs).toBe('auto');
    // Same seed, same themes; only the layout's length differs, so the map does too.
    expect(quick.clusters.map((c: any) => c.size)).toEqual(analysis.clusters.map((c: any) => c.size));
    const [a, b] = await Promise.all([api(base, `/analyses/${analysis.id}/assignments`), api(base, `/analyses/${quick.id}/assignments`)]);
    expect(b.body).toHaveLength(2000);
    const moved = a.body.filter((x: any, i: number) => x.x !== b.body[i].x || x.y !== b.body[i].y).length;
    expect(moved).toBeGreaterThan(1900);
    // "fine" never makes fewer passes than "auto": at 2,000 documents "auto" already makes 500
    // (more than fine's 200), so the map is the same point for point.
    const f = await api(base, `/corpora/${demoId}/analyses`, { method: 'POST', json: { k: 8, seed: 3, mapEpochs: 'fine' } });
    const fine = await waitForJob(base, `/analyses/${f.body.id}`);
    expect(fine.params.mapEpochs).toBe('fine');
    const c = await api(base, `/analyses/${fine.id}/assignments`);
    expect(c.body.map((x: any) => [x.x, x.y])).toEqual(a.body.map((x: any) => [x.x, x.y]));
  });

  it('refuses k larger than the corpus, and a corpus of one document', async () => {
    const small = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 'alpha beta' }, { text: 'gamma delta' }, { text: 'epsilon' }] } });
    expect((await api(base, `/corpora/${small.body.id}/analyses`, { method: 'POST', json: { k: 4 } })).status).toBe(422);
    const one = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 'alone here' }] } });
    const r = await api(base, `/corpora/${one.body.id}/analyses`, { method: 'POST', json: {} });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('unprocessable');
  });

  it('puts documents that are all stop words into their own no-content theme', async () => {
    const docs = [
      ...Array.from({ length: 12 }, (_, i) => ({ text: `invoice payment overdue amount ${i}` })),
      ...Array.from({ length: 12 }, (_, i) => ({ text: `parcel courier tracking delayed ${i}` })),
      { text: 'the and of it is' },
      { text: 'was were be' },
    ];
    const c = await api(base, '/corpora', { method: 'POST', json: { documents: docs } });
    const r = await api(base, `/corpora/${c.body.id}/analyses`, { method: 'POST', json: { k: 2 } });
    const a = await waitForJob(base, `/analyses/${r.body.id}`);
    expect(a.status).toBe('done');
    const empty = a.clusters.filter((x: any) => x.noContent);
    expect(empty).toHaveLength(1);
    expect(empty[0].size).toBe(2);
    expect(a.clusters.filter((x: any) => !x.noContent).map((x: any) => x.size).sort()).toEqual([12, 12]);
    expect(Number.isFinite(a.silhouette)).toBe(true);
  });

  it('reports a job failure in words when k exceeds the distinct documents (exact duplicates)', async () => {
    const docs = [...Array(4).fill({ text: 'alpha beta gamma' }), ...Array(4).fill({ text: 'delta epsilon zeta' })];
    const c = await api(base, '/corpora', { method: 'POST', json: { documents: docs } });
    const r = await api(base, `/corpora/${c.body.id}/analyses`, { method: 'POST', json: { k: 3 } });
    const a = await waitForJob(base, `/analyses/${r.body.id}`);
    expect(a.status).toBe('failed');
    expect(a.error.code).toBe('unprocessable');
    expect(a.error.message).toMatch(/distinct|different|identical/i);
  });
});
