import { describe, expect, it } from 'vitest';
import { detectFormat, previewText, splitCsv, splitJsonArray } from '../../../client/lib/preview-parse.js';

// Source: RFC 4180, "Common Format and MIME Type for CSV Files" (IETF, 2005), section 2,
// rules 1–7 and their examples.
describe('splitCsv follows RFC 4180', () => {
  it('splits records on CRLF and fields on commas (rule 1, 2)', () => {
    const { records } = splitCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
    expect(records.map((r) => r.fields)).toEqual([
      ['aaa', 'bbb', 'ccc'],
      ['zzz', 'yyy', 'xxx'],
    ]);
  });

  it('reads a last record without a line break (rule 2)', () => {
    expect(splitCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx').records.map((r) => r.fields)).toEqual([
      ['aaa', 'bbb', 'ccc'],
      ['zzz', 'yyy', 'xxx'],
    ]);
  });

  it('unwraps quoted fields (rule 5)', () => {
    expect(splitCsv('"aaa","bbb","ccc"\r\nzzz,yyy,xxx').records[0].fields).toEqual(['aaa', 'bbb', 'ccc']);
  });

  it('keeps line breaks, commas and doubled quotes inside quoted fields (rules 6, 7)', () => {
    const { records } = splitCsv('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx');
    expect(records[0].fields).toEqual(['aaa', 'b\r\nbb', 'ccc']);
    expect(records[1]).toEqual({ line: 3, fields: ['zzz', 'yyy', 'xxx'] });
    expect(splitCsv('"aaa","b""bb","ccc"').records[0].fields).toEqual(['aaa', 'b"bb', 'ccc']);
    expect(splitCsv('"a,b",c').records[0].fields).toEqual(['a,b', 'c']);
  });

  it('reports a quote that is never closed', () => {
    expect(splitCsv('a,"open\nstill open').openQuote).toBe(true);
    expect(splitCsv('a,"closed"\n').openQuote).toBe(false);
  });

  it('accepts bare LF line ends and a byte-order mark (common practice for exported files)', () => {
    expect(splitCsv('\uFEFFid,text\n1,hello\n').records.map((r) => r.fields)).toEqual([
      ['id', 'text'],
      ['1', 'hello'],
    ]);
  });
});

describe('previewText', () => {
  it('reads a CSV header row as field names and guesses text and id fields', () => {
    const p = previewText('id,body,channel\n1,"My card was charged twice, please help",email\n2,Cannot log in,chat\n', 'csv');
    expect(p.fields).toEqual(['id', 'body', 'channel']);
    expect(p.rows).toHaveLength(2);
    expect(p.rows[0].body).toBe('My card was charged twice, please help');
    expect(p.textField).toBe('body');
    expect(p.idField).toBe('id');
    expect(p.problems).toEqual([]);
  });

  it('flags CSV rows whose field count differs from the header, with their line', () => {
    const p = previewText('id,text\n1,ok\n2,too,many\n', 'csv');
    expect(p.problems).toEqual([{ line: 3, reason: 'has 3 fields, the header has 2' }]);
  });

  it('drops the cut-off last record of a truncated sample instead of reporting it', () => {
    const p = previewText('id,text\n1,whole\n2,"cut off in the mid', 'csv', { truncated: true });
    expect(p.rows.map((r) => r.id)).toEqual(['1']);
    expect(p.problems).toEqual([]);
    expect(p.partial).toBe(true);
  });

  // Source: NDJSON specification 1.0 (github.com/ndjson/ndjson-spec): one JSON text per line, LF or CRLF.
  it('reads NDJSON objects one per line and reports lines that are not JSON', () => {
    const p = previewText('{"text":"a","tag":"x"}\r\n{"text":"b","n":2}\nnot json\n\n', 'ndjson');
    expect(p.fields).toEqual(['text', 'tag', 'n']);
    expect(p.rows).toEqual([{ text: 'a', tag: 'x' }, { text: 'b', n: '2' }]);
    expect(p.problems).toEqual([{ line: 3, reason: 'is not valid JSON' }]);
  });

  it('reads a JSON array of objects and shows nested values as JSON text', () => {
    const p = previewText('[{"id":"a1","text":"hello","meta":{"k":1}},{"id":"a2","text":"bye"}]', 'json');
    expect(p.rows).toEqual([
      { id: 'a1', text: 'hello', meta: '{"k":1}' },
      { id: 'a2', text: 'bye' },
    ]);
    expect(p.partial).toBe(false);
  });

  it('treats plain text as one document per line and notes empty lines', () => {
    const p = previewText('first\n\nsecond\n', 'lines');
    expect(p.rows).toEqual([{ text: 'first' }, { text: 'second' }]);
    expect(p.problems).toContainEqual({ line: 2, reason: 'is empty and will be skipped' });
  });

  it('stops at maxRows and says the preview is partial', () => {
    const csv = 'text\n' + Array.from({ length: 50 }, (_, i) => `row ${i}`).join('\n');
    const p = previewText(csv, 'csv', { maxRows: 10 });
    expect(p.rows).toHaveLength(10);
    expect(p.partial).toBe(true);
  });

  it('refuses a maxRows below 1 with a message naming the option', () => {
    expect(() => previewText('x', 'lines', { maxRows: 0 })).toThrow(/maxRows/);
  });
});

describe('splitJsonArray', () => {
  // Source: RFC 8259 (JSON), section 7: strings may hold escaped quotes and brackets.
  it('cuts elements at top-level commas only, respecting strings and nesting', () => {
    const { elements, closed } = splitJsonArray('[ {"t":"a, [b]"}, {"t":"c \\" ]"} , "plain" ]', 10);
    expect(elements.map((e) => JSON.parse(e))).toEqual([{ t: 'a, [b]' }, { t: 'c " ]' }, 'plain']);
    expect(closed).toBe(true);
  });

  it('returns the complete elements of an array cut short', () => {
    const { elements, closed } = splitJsonArray('[{"t":"a"},{"t":"b"},{"t":"c', 10);
    expect(elements).toEqual(['{"t":"a"}', '{"t":"b"}']);
    expect(closed).toBe(false);
  });
});

describe('detectFormat', () => {
  it('trusts the file extension first', () => {
    expect(detectFormat('a.csv', '[')).toBe('csv');
    expect(detectFormat('a.ndjson', '')).toBe('ndjson');
    expect(detectFormat('a.jsonl', '')).toBe('ndjson');
    expect(detectFormat('a.json', '[{}]')).toBe('json');
    expect(detectFormat('a.json', '{"a":1}\n{"a":2}')).toBe('ndjson');
    expect(detectFormat('a.txt', '{')).toBe('lines');
  });

  it('falls back to the first character without an extension', () => {
    expect(detectFormat('', '  [1]')).toBe('json');
    expect(detectFormat('', '{"a":1}')).toBe('ndjson');
    expect(detectFormat('', 'hello')).toBe('lines');
  });
});
