import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, startServer, type TestServer } from '../helpers/server.js';

let server: TestServer;
let base: string;
beforeAll(async () => {
  server = await startServer({ env: { MAX_UPLOAD_MB: '64' } });
  base = server.url;
});
afterAll(async () => {
  await server?.stop();
});

const ALLOWED = new Set([201, 400, 413, 415, 422]);

function isContractAnswer(status: number, body: any): boolean {
  if (status === 201) return typeof body?.id === 'string' && body.documentCount > 0;
  return typeof body?.error?.code === 'string' && typeof body?.error?.message === 'string' && body.error.message.length > 0;
}

describe('arbitrary input never crashes or hangs the server (property-based, fast-check)', () => {
  it('multipart files of arbitrary bytes, in every format', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.uint8Array({ maxLength: 2048 }),
        fc.constantFrom('a.csv', 'a.ndjson', 'a.json', 'a.txt', 'noext'),
        fc.constantFrom('text', 'body', 'x'),
        async (bytes, name, textField) => {
          const fd = new FormData();
          fd.append('textField', textField);
          fd.append('file', new Blob([bytes]), name);
          const r = await api(base, '/corpora', { method: 'POST', body: fd, signal: AbortSignal.timeout(10_000) });
          expect(ALLOWED.has(r.status), `status ${r.status}`).toBe(true);
          expect(isContractAnswer(r.status, r.body)).toBe(true);
        },
      ),
      { numRuns: 120, seed: 42 },
    );
    expect((await api(base, '/health')).body.status).toBe('ok');
  });

  it('text-like uploads built from CSV/JSON punctuation, quotes and line breaks', async () => {
    const piece = fc.constantFrom('"', ',', '\n', '\r\n', '{', '}', '[', ']', ':', 'text', 'héllo', '\\', ' ', '\t', ';', '\u0000', '😀');
    await fc.assert(
      fc.asyncProperty(fc.array(piece, { maxLength: 200 }), fc.constantFrom('csv', 'ndjson', 'json', 'text'), async (parts, format) => {
        const fd = new FormData();
        fd.append('format', format);
        fd.append('file', new Blob([parts.join('')]), 'upload');
        const r = await api(base, '/corpora', { method: 'POST', body: fd, signal: AbortSignal.timeout(10_000) });
        expect(ALLOWED.has(r.status), `status ${r.status}`).toBe(true);
        expect(isContractAnswer(r.status, r.body)).toBe(true);
      }),
      { numRuns: 150, seed: 7 },
    );
  });

  it('arbitrary JSON bodies on every JSON endpoint', async () => {
    const corpus = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: 'one two' }, { text: 'three four' }] } });
    const paths = ['/corpora', `/corpora/${corpus.body.id}/analyses`, '/routers'];
    await fc.assert(
      fc.asyncProperty(fc.jsonValue({ maxDepth: 3 }), fc.constantFrom(...paths), async (value, path) => {
        const r = await api(base, path, { method: 'POST', body: JSON.stringify(value), headers: { 'content-type': 'application/json' }, signal: AbortSignal.timeout(10_000) });
        expect(r.status).toBeLessThan(500);
        if (r.status >= 400) expect(isContractAnswer(r.status, r.body)).toBe(true);
        if (r.status === 202) await api(base, `/analyses/${r.body.id}/cancel`, { method: 'POST' });
      }),
      { numRuns: 150, seed: 3 },
    );
  });
});

describe('Unicode and extreme documents', () => {
  it('keeps emoji, right-to-left scripts, CJK, combining marks and control characters as sent (NUL removed)', async () => {
    const texts = [
      'Paket nicht angekommen 📦😡 — bitte helfen',
      'الطلب لم يصل بعد، أرجو المساعدة',
      'שלום, ההזמנה שלי מאחרת',
      '荷物がまだ届いていません。確認してください。',
      'e\u0301te\u0301 cafe\u0301 (combining acute accents)',
      'tab\there, bell\u0007, escape\u001b[31m, NUL\u0000 gone',
    ];
    const r = await api(base, '/corpora', { method: 'POST', json: { documents: texts.map((text) => ({ text })) } });
    expect(r.status).toBe(201);
    const docs = await api(base, `/corpora/${r.body.id}/documents`);
    expect(docs.body.items.map((d: any) => d.text)).toEqual(texts.map((t) => t.replace(/\u0000/g, '')));
  });

  it('a single 5 MB document is accepted, capped at the documented length, with a warning', async () => {
    const five = 'word '.repeat(1_000_000);
    const r = await api(base, '/corpora', { method: 'POST', json: { documents: [{ text: five }, { text: 'small one' }] } });
    expect(r.status).toBe(201);
    expect(r.body.warnings).toHaveLength(1);
    expect(r.body.warnings[0].reason).toMatch(/cut to 2000000 characters/);
    const docs = await api(base, `/corpora/${r.body.id}/documents?limit=1`);
    expect(docs.body.items[0].text.length).toBeLessThanOrEqual(2_000_000);
  });

  it('imports a million one-word documents', async () => {
    const words = ['refund', 'parcel', 'invoice', 'login', 'teapot'];
    const body = Array.from({ length: 1_000_000 }, (_, i) => words[i % 5]).join('\n');
    const res = await fetch(`${base}/api/v1/corpora?name=million`, { method: 'POST', headers: { 'content-type': 'text/plain' }, body });
    expect(res.status).toBe(201);
    const json = await res.json();
    expect(json.documentCount).toBe(1_000_000);
    const last = await api(base, `/corpora/${json.id}/documents?offset=999999&limit=1`);
    expect(last.body.items[0]).toMatchObject({ id: '1000000', text: 'teapot' });
  }, 120_000);
});

describe('export', () => {
  it('neutralises formula-like document text in the CSV export', async () => {
    const { waitForJob } = await import('../helpers/server.js');
    const docs = [
      ...Array.from({ length: 6 }, (_, i) => ({ text: `=HYPERLINK("http://example.com") invoice payment ${i}` })),
      ...Array.from({ length: 6 }, (_, i) => ({ text: `@SUM parcel courier late ${i}` })),
    ];
    const c = await api(base, '/corpora', { method: 'POST', json: { documents: docs } });
    const a = await api(base, `/corpora/${c.body.id}/analyses`, { method: 'POST', json: { k: 2 } });
    expect((await waitForJob(base, `/analyses/${a.body.id}`)).status).toBe('done');
    const csv = await (await fetch(`${base}/api/v1/analyses/${a.body.id}/assignments?format=csv`)).text();
    const lines = csv.trim().split('\r\n').slice(1);
    expect(lines).toHaveLength(12);
    for (const line of lines) expect(line).toMatch(/,"?'[=@]/);
  });
});
