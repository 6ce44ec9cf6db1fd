import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, startServer, type TestServer } from '../helpers/server.js';

let server: TestServer;
let base: string;

beforeAll(async () => {
  server = await startServer({ env: { MAX_UPLOAD_MB: '1' } });
  base = server.url;
});
afterAll(async () => {
  await server?.stop();
});

function form(fields: Record<string, string>, file?: { name: string; content: string | Uint8Array<ArrayBuffer>; type?: string }): FormData {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.append(k, v);
  if (file) fd.append('file', new Blob([file.content], { type: file.type ?? 'application/octet-stream' }), file.name);
  return fd;
}

async function corpusIds(): Promise<string[]> {
  const r = await api(base, '/corpora');
  expect(r.status).toBe(200);
  return r.body.map((c: { id: string }) => c.id).sort();
}

/** Checks the contract's error shape and that the failed request changed nothing. */
async function expectRefused(res: { status: number; body: any }, status: number, code: string, before: string[]) {
  expect(res.status).toBe(status);
  expect(res.body.error.code).toBe(code);
  expect(typeof res.body.error.message).toBe('string');
  expect(res.body.error.message.length).toBeGreaterThan(10);
  expect(await corpusIds()).toEqual(before);
  expect((await api(base, '/health')).body.status).toBe('ok');
}

describe('corpora', () => {
  it('answers health with a version', async () => {
    const r = await api(base, '/health');
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('ok');
    expect(r.body.version).toMatch(/^\d+\.\d+\.\d+/);
  });

  it('creates a corpus from JSON, generating ids by position and keeping metadata', async () => {
    const r = await api(base, '/corpora', {
      method: 'POST',
      json: { name: 'json', documents: [{ text: 'first one', lang: 'en' }, { text: '   ' }, { text: 'third', lang: 'de', id: 'x3' }] },
    });
    expect(r.status).toBe(201);
    expect(r.body.documentCount).toBe(2);
    expect(r.body.skipped).toEqual([{ line: 2, reason: expect.stringMatching(/empty/) }]);
    expect(r.body.fields).toContain('lang');
    const docs = await api(base, `/corpora/${r.body.id}/documents`);
    expect(docs.body.total).toBe(2);
    expect(docs.body.items[0]).toEqual({ id: '1', text: 'first one', meta: { lang: 'en' } });
    expect(docs.body.items[1].id).toBe('x3');
    const one = await api(base, `/corpora/${r.body.id}`);
    expect(one.body).toMatchObject({ id: r.body.id, name: 'json', documentCount: 2, fields: ['lang'] });
  });

  it('imports a multipart CSV with quoted commas, doubled quotes and embedded line breaks (RFC 4180 §2.6–2.7)', async () => {
    const csv = 'id,body,team\r\n1,"Hello, world","a"\r\n2,"She said ""hi""\r\nthen left",b\r\n3,,c\r\n';
    const r = await api(base, '/corpora', { method: 'POST', body: form({ name: 'csv', textField: 'body', idField: 'id' }, { name: 't.csv', content: csv, type: 'text/csv' }) });
    expect(r.status).toBe(201);
    expect(r.body.documentCount).toBe(2);
    expect(r.body.format).toBe('csv');
    expect(r.body.skipped).toHaveLength(1);
    expect(r.body.skipped[0].line).toBe(5);
    const docs = await api(base, `/corpora/${r.body.id}/documents`);
    expect(docs.body.items.map((d: { text: string }) => d.text)).toEqual(['Hello, world', 'She said "hi"\r\nthen left']);
    expect(docs.body.items[0].meta).toEqual({ team: 'a' });
  });

  it('imports NDJSON, a JSON array and plain lines, detected from the file', async () => {
    const nd = await api(base, '/corpora', { method: 'POST', body: form({ name: 'nd' }, { name: 'a.ndjson', content: '{"text":"one"}\n{"text":"two"}\n' }) });
    expect(nd.status).toBe(201);
    expect(nd.body).toMatchObject({ documentCount: 2, format: 'ndjson' });
    const arr = await api(base, '/corpora', { method: 'POST', body: form({ name: 'arr' }, { name: 'a.json', content: '[{"text":"one"},{"text":"two"},{"text":"three"}]' }) });
    expect(arr.body).toMatchObject({ documentCount: 3, format: 'json' });
    const txt = await api(base, '/corpora', { method: 'POST', body: form({ name: 'txt' }, { name: 'a.txt', content: 'line one\n\nline two\n' }) });
    expect(txt.body).toMatchObject({ documentCount: 2, format: 'text' });
  });

  it('accepts a raw text/csv body with options in the query', async () => {
    const res = await fetch(`${base}/api/v1/corpora?name=raw&textField=msg`, { method: 'POST', headers: { 'content-type': 'text/csv' }, body: 'msg\nhello\nworld\n' });
    expect(res.status).toBe(201);
    expect((await res.json()).documentCount).toBe(2);
  });

  it('pages and filters documents', async () => {
    const docs = Array.from({ length: 25 }, (_, i) => ({ text: i % 5 === 0 ? `refund number ${i}` : `other ${i}` }));
    const r = await api(base, '/corpora', { method: 'POST', json: { name: 'paged', documents: docs } });
    const page = await api(base, `/corpora/${r.body.id}/documents?offset=10&limit=5`);
    expect(page.body.total).toBe(25);
    expect(page.body.items.map((d: { id: string }) => d.id)).toEqual(['11', '12', '13', '14', '15']);
    const q = await api(base, `/corpora/${r.body.id}/documents?q=REFUND`);
    expect(q.body.total).toBe(5);
    const bad = await api(base, `/corpora/${r.body.id}/documents?limit=0`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('bad_request');
  });

  it('deletes a corpus', async () => {
    const r = await api(base, '/corpora', { method: 'POST', json: { name: 'gone', documents: [{ text: 'a' }] } });
    expect((await api(base, `/corpora/${r.body.id}`, { method: 'DELETE' })).status).toBe(204);
    expect((await api(base, `/corpora/${r.body.id}`)).status).toBe(404);
    expect((await api(base, `/corpora/${r.body.id}`, { method: 'DELETE' })).status).toBe(404);
  });
});

describe('bad input gets a clear error and changes nothing', () => {
  it('malformed JSON → 400', async () => {
    const before = await corpusIds();
    await expectRefused(await api(base, '/corpora', { method: 'POST', body: '{"documents": [', headers: { 'content-type': 'application/json' } }), 400, 'bad_request', before);
  });

  it('missing or non-array documents → 400', async () => {
    const before = await corpusIds();
    await expectRefused(await api(base, '/corpora', { method: 'POST', json: { name: 'x' } }), 400, 'bad_request', before);
    await expectRefused(await api(base, '/corpora', { method: 'POST', json: { documents: 'hello' } }), 400, 'bad_request', before);
  });

  it('all-empty texts → 422', async () => {
    const before = await corpusIds();
    await expectRefused(await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: '' }, { text: ' \n ' }] } }), 422, 'unprocessable', before);
  });

  it('non-string text is skipped with a reason; only non-string texts → 422', async () => {
    const before = await corpusIds();
    await expectRefused(await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 5 }, { text: { a: 1 } }] } }), 422, 'unprocessable', before);
    const mixed = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 5 }, { text: 'fine' }] } });
    expect(mixed.status).toBe(201);
    expect(mixed.body.skipped[0]).toMatchObject({ line: 1 });
  });

  it('multipart without a file → 400', async () => {
    const before = await corpusIds();
    await expectRefused(await api(base, '/corpora', { method: 'POST', body: form({ name: 'nofile' }) }), 400, 'bad_request', before);
  });

  it('CSV without the named column → 422 naming the columns there are', async () => {
    const before = await corpusIds();
    const r = await api(base, '/corpora', { method: 'POST', body: form({ textField: 'message' }, { name: 'a.csv', content: 'id,body\n1,hello\n' }) });
    await expectRefused(r, 422, 'unprocessable', before);
    expect(r.body.error.message).toMatch(/body/);
  });

  it('a binary file → 415', async () => {
    const before = await corpusIds();
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 1, 2, 3, 0, 0, 0]);
    await expectRefused(await api(base, '/corpora', { method: 'POST', body: form({}, { name: 'photo.csv', content: png }) }), 415, 'unsupported_media_type', before);
  });

  it('non-UTF-8 text → 415 telling to save as UTF-8', async () => {
    const before = await corpusIds();
    const latin1 = new Uint8Array([...Buffer.from('text\ncaf'), 0xe9, 0x0a]);
    const r = await api(base, '/corpora', { method: 'POST', body: form({}, { name: 'l1.csv', content: latin1 }) });
    await expectRefused(r, 415, 'unsupported_media_type', before);
    expect(r.body.error.message).toMatch(/UTF-8/);
  });

  it('a body over MAX_UPLOAD_MB → 413 with the limit in the message', async () => {
    const before = await corpusIds();
    const big = 'text\n' + 'x'.repeat(100).concat('\n').repeat(12_000);
    const r = await api(base, '/corpora', { method: 'POST', body: form({ name: 'big' }, { name: 'big.csv', content: big }) });
    await expectRefused(r, 413, 'payload_too_large', before);
    expect(r.body.error.message).toMatch(/1 MB/);
    const json = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 'y'.repeat(1_200_000) }] } });
    await expectRefused(json, 413, 'payload_too_large', before);
  });

  it('every JSON endpoint has a body limit (1 MiB unless documented otherwise) → 413', async () => {
    const before = await corpusIds();
    const huge = { corpusId: 'x'.repeat(2 * 1024 * 1024), labelField: 'y' };
    await expectRefused(await api(base, '/routers', { method: 'POST', json: huge }), 413, 'payload_too_large', before);
    await expectRefused(await api(base, '/corpora/c_x/analyses', { method: 'POST', json: { seed: 1, pad: 'x'.repeat(2 * 1024 * 1024) } }), 413, 'payload_too_large', before);
  });

  it('an unsupported content type → 415', async () => {
    const before = await corpusIds();
    await expectRefused(await api(base, '/corpora', { method: 'POST', body: 'x', headers: { 'content-type': 'image/png' } }), 415, 'unsupported_media_type', before);
  });

  it('unknown ids → 404 in the error shape', async () => {
    for (const path of ['/corpora/c_nope', '/corpora/c_nope/documents', '/analyses/a_nope', '/routers/r_nope', '/analyses/a_nope/assignments']) {
      const r = await api(base, path);
      expect(r.status, path).toBe(404);
      expect(r.body.error.code).toBe('not_found');
    }
    const odd = await api(base, `/corpora/${encodeURIComponent("x'; DROP TABLE corpora; --")}`);
    expect(odd.status).toBe(404);
    expect(odd.body.error.code).toBe('not_found');
    const long = await api(base, `/analyses/${'a'.repeat(5000)}`);
    expect(long.status).toBe(404);
    expect(JSON.stringify(long.body).length).toBeLessThan(1000);
    const r = await api(base, '/no-such-endpoint');
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
  });
});

describe('OpenAPI', () => {
  it('describes every endpoint of the contract', async () => {
    const r = await api(base, '/openapi.json');
    expect(r.status).toBe(200);
    expect(r.body.openapi).toBe('3.1.0');
    const contract = await readFile(new URL('../../../shared/api-v1.md', import.meta.url), 'utf8').catch(() => '');
    const expected = [
      ['get', '/api/v1/health'],
      ['post', '/api/v1/corpora'],
      ['get', '/api/v1/corpora'],
      ['get', '/api/v1/corpora/{cid}'],
      ['delete', '/api/v1/corpora/{cid}'],
      ['get', '/api/v1/corpora/{cid}/documents'],
      ['post', '/api/v1/corpora/{cid}/analyses'],
      ['get', '/api/v1/analyses/{aid}'],
      ['get', '/api/v1/analyses/{aid}/events'],
      ['post', '/api/v1/analyses/{aid}/cancel'],
      ['get', '/api/v1/analyses/{aid}/assignments'],
      ['patch', '/api/v1/analyses/{aid}/clusters/{clid}'],
      ['post', '/api/v1/analyses/{aid}/merge'],
      ['post', '/api/v1/analyses/{aid}/moves'],
      ['post', '/api/v1/routers'],
      ['get', '/api/v1/routers/{rid}'],
      ['get', '/api/v1/routers/{rid}/events'],
      ['post', '/api/v1/routers/{rid}/cancel'],
      ['post', '/api/v1/routers/{rid}/keys'],
      ['delete', '/api/v1/routers/{rid}/keys/{kid}'],
      ['post', '/api/v1/routers/{rid}/route'],
    ];
    for (const [method, path] of expected) expect(r.body.paths[path]?.[method], `${method} ${path}`).toBeTruthy();
    if (contract) expect(contract).toContain('POST /routers/:rid/keys');
    expect(r.body.paths['/api/v1/routers/{rid}/route'].post.security).toEqual([{ routerKey: [] }]);
  });
});
