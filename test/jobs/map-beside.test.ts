import { describe, expect, it } from 'vitest';
import { api, startServer, waitForJob } from '../helpers/server.js';
import { syntheticDocuments } from '../helpers/synthetic-corpus.js';

async function assignmentsWith(workers: string): Promise<{ analysis: any; rows: any[] }> {
  const server = await startServer({ env: { JOB_WORKERS: workers } });
  try {
    const docs = syntheticDocuments(1500, 5, 40, 3);
    docs.push({ text: 'the and of', theme: 'none' });
    const c = await api(server.url, '/corpora', { method: 'POST', json: { documents: docs } });
    const a = await api(server.url, `/corpora/${c.body.id}/analyses`, { method: 'POST', json: { k: 'auto', kMax: 8, seed: 4 } });
    const analysis = await waitForJob(server.url, `/analyses/${a.body.id}`);
    const rows = (await api(server.url, `/analyses/${a.body.id}/assignments`)).body;
    return { analysis, rows };
  } finally {
    await server.stop();
  }
}

describe('the map laid out beside the clustering', () => {
  it('gives exactly the same analysis and map as one worker doing it all', async () => {
    const alone = await assignmentsWith('1');
    const beside = await assignmentsWith('2');
    expect(alone.analysis.status).toBe('done');
    expect(beside.analysis.status).toBe('done');
    expect(beside.analysis.k).toBe(alone.analysis.k);
    expect(beside.analysis.clusters).toEqual(alone.analysis.clusters);
    expect(beside.rows).toEqual(alone.rows);
    // The no-content document sits apart on the map, not on top of the others.
    expect(new Set(alone.rows.map((r: any) => `${r.x},${r.y}`)).size).toBeGreaterThan(1000);
  }, 180_000);
});
