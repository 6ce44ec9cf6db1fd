// NDJSON (one JSON text per line, https://github.com/ndjson/ndjson-spec) and top-level JSON
// arrays (RFC 8259 §5) read as documents.
import { describe, expect, it } from 'vitest';
import { collectDocuments, IngestError, JsonArraySplitter, type JsonElement } from '../../server/ingest/index.js';
import { chunked, parse, rejection } from './chunks.js';

describe('NDJSON', () => {
  it('reads one object per line, other keys as JSON-valued metadata, blank lines ignored', async () => {
    const { documents, summary } = await parse('{"text":"a","n":1,"tags":["x"]}\n\n   \n{"text":"b","ok":true}\n', { format: 'ndjson' });
    expect(documents).toEqual([
      { id: '1', text: 'a', meta: { n: 1, tags: ['x'] } },
      { id: '2', text: 'b', meta: { ok: true } },
    ]);
    expect(summary).toMatchObject({ format: 'ndjson', fields: ['n', 'tags', 'ok'], skippedCount: 0 });
  });

  it('skips malformed lines with their line number and keeps going', async () => {
    const { documents, summary } = await parse('{"text":"a"}\n{"text": nope}\n{"text":"c"}\n', { format: 'ndjson' });
    expect(documents.map((d) => [d.id, d.text])).toEqual([
      ['1', 'a'],
      ['3', 'c'],
    ]);
    expect(summary.skipped).toHaveLength(1);
    expect(summary.skipped[0]!.line).toBe(2);
    expect(summary.skipped[0]!.reason).toMatch(/^not valid JSON/);
  });

  it('refuses an upload where no line parses', async () => {
    const err = await rejection(parse('{oops\n{"text":\n', { format: 'ndjson' }));
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('None of the 2 records');
  });

  it('skips non-string text values with a reason', async () => {
    const { summary } = await parse('{"text":5}\n{"text":null}\n{"text":{"a":1}}\n{"text":"ok"}\n', { format: 'ndjson' });
    expect(summary.skipped).toEqual([
      { line: 1, reason: 'the "text" value is a number (5), not text' },
      { line: 2, reason: 'the "text" value is null, not text' },
      { line: 3, reason: 'the "text" value is an object, not text' },
    ]);
  });

  it('refuses a missing text key, naming the keys that exist', async () => {
    const err = await rejection(parse('{"body":"a","who":"x"}\n{"body":"b"}\n', { format: 'ndjson' }));
    expect(err).toBeInstanceOf(IngestError);
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('"body", "who"');
    expect(err.details).toMatchObject({ field: 'text', fields: ['body', 'who'] });
  });

  it('takes ids from idField, numbers or strings, and refuses duplicates', async () => {
    const { documents } = await parse('{"key":7,"text":"a"}\n{"key":"x","text":"b"}\n', { format: 'ndjson', idField: 'key' });
    expect(documents.map((d) => d.id)).toEqual(['7', 'x']);
    const err = await rejection(parse('{"key":7,"text":"a"}\n{"key":"7","text":"b"}\n', { format: 'ndjson', idField: 'key' }));
    expect(err.details).toMatchObject({ id: '7', line: 2, firstLine: 1 });
  });

  it('keeps a "__proto__" key as ordinary metadata, not as a prototype', async () => {
    const { documents, summary } = await parse('{"text":"a","__proto__":{"polluted":1}}\n', { format: 'ndjson' });
    const meta = documents[0]!.meta;
    expect(Object.getPrototypeOf(meta)).toBe(Object.prototype);
    expect(Object.keys(meta)).toEqual(['__proto__']);
    expect(JSON.stringify(meta)).toBe('{"__proto__":{"polluted":1}}');
    expect(summary.fields).toEqual(['__proto__']);
  });

  it('removes NUL characters from text and replaces lone surrogates, keeping other control characters', async () => {
    const { documents } = await parse('{"text":"a\\u0000b\\u0007c\\ud800d\\tz"}\n', { format: 'ndjson' });
    expect(documents[0]!.text).toBe('ab\u0007c\uFFFDd\tz');
  });
});

describe('JSON array', () => {
  it('reads an array of objects and of strings', async () => {
    const { documents, summary } = await parse('[{"text":"a","lang":"en"}, "plain string", {"text":"c"}]', { format: 'json' });
    expect(documents).toEqual([
      { id: '1', text: 'a', meta: { lang: 'en' } },
      { id: '2', text: 'plain string', meta: {} },
      { id: '3', text: 'c', meta: {} },
    ]);
    expect(summary.format).toBe('json');
  });

  it('reports each element at the line it starts on, and skips malformed elements', async () => {
    const input = '[\n  {"text": "a"},\n  {"text": \'single\'},\n  {"text":\n    "multi"},\n  "",\n  7\n]\n';
    const { documents, summary } = await parse(input);
    expect(documents.map((d) => [d.id, d.text])).toEqual([
      ['1', 'a'],
      ['3', 'multi'],
    ]);
    expect(summary.skipped.map((s) => s.line)).toEqual([3, 6, 7]);
    expect(summary.skipped[0]!.reason).toMatch(/^not valid JSON/);
    expect(summary.skipped[1]!.reason).toBe('empty text');
  });

  it('keeps brackets and escaped quotes inside strings out of the structure', async () => {
    const { documents } = await parse('[{"text":"a ] } \\" [ {","x":[1,{"y":"]"}]}]');
    expect(documents[0]).toEqual({ id: '1', text: 'a ] } " [ {', meta: { x: [1, { y: ']' }] } });
  });

  it('tolerates a trailing comma', async () => {
    const { documents } = await parse('["a","b",]');
    expect(documents.map((d) => d.text)).toEqual(['a', 'b']);
  });

  it('refuses an array that is never closed, a missing comma, and text after the array', async () => {
    for (const [input, pattern] of [
      ['[{"text":"a"},\n{"text":"b"}', /not closed.*line 2/],
      ['[{"text":"a"} {"text":"b"}]', /line 1: expected "," or "\]"/],
      ['[{"text":"a"}]\n[{"text":"b"}]', /more text after the end/],
    ] as const) {
      const err = await rejection(parse(input, { format: 'json' }));
      expect(err.code).toBe('unprocessable');
      expect(err.message).toMatch(pattern);
    }
  });

  it('suggests NDJSON when a JSON upload is an object', async () => {
    const err = await rejection(parse('{"text":"a"}\n{"text":"b"}\n', { format: 'json' }));
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('NDJSON');
  });

  it('splits elements the same way whatever the chunking', () => {
    const input = '[ {"text":"x\\"]"} ,\r\n"s", [1,[2]], 3.5e2 ,null,{"a":{"b":"}"}}]';
    const run = (size: number) => {
      const out: JsonElement[] = [];
      const sp = new JsonArraySplitter(1e9);
      for (let i = 0; i < input.length; i += size) sp.feed(input.slice(i, i + size), false, out);
      sp.feed('', true, out);
      return out;
    };
    const whole = run(input.length);
    expect(whole.map((e) => e.source)).toEqual(['{"text":"x\\"]"}', '"s"', '[1,[2]]', '3.5e2', 'null', '{"a":{"b":"}"}}']);
    expect(whole.map((e) => e.line)).toEqual([1, 2, 2, 2, 2, 2]);
    for (let size = 1; size < input.length; size++) expect(run(size)).toEqual(whole);
  });

  it('refuses an element longer than maxRecordChars while streaming', async () => {
    const input = `[{"text":"${'x'.repeat(200_000)}"}]`;
    const err = await rejection(collectDocuments(chunked(input, 4096), { format: 'json', maxRecordChars: 1000 }));
    expect(err.code).toBe('unprocessable');
    expect(err.details).toEqual({ line: 1 });
  });
});

describe('plain text', () => {
  it('makes one document per non-blank line, kept as written, with line numbers as positions of non-blank lines', async () => {
    const { documents, summary } = await parse('first line\r\n\r\n  second  \rthird\n   \n', { format: 'text' });
    expect(documents).toEqual([
      { id: '1', text: 'first line', meta: {} },
      { id: '2', text: '  second  ', meta: {} },
      { id: '3', text: 'third', meta: {} },
    ]);
    expect(summary).toMatchObject({ format: 'text', fields: [], skippedCount: 0 });
  });

  it('warns that idField is ignored for plain text', async () => {
    const { summary } = await parse('a\nb\n', { format: 'text', idField: 'id' });
    expect(summary.warnings[0]!.reason).toContain('idField "id" is ignored');
  });

  it('refuses an upload with only blank lines', async () => {
    const err = await rejection(parse('\n  \n\r\n', { format: 'text' }));
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('empty');
  });
});
