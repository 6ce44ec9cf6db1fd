// How an upload's format is chosen when the caller says 'auto' (our rules, documented on
// ParseOptions.format; content types are the IANA-registered ones, RFC 4180 §3 for text/csv).
import { describe, expect, it } from 'vitest';
import { detectFormat, sniffDelimiter } from '../../server/ingest/index.js';

const detect = (head: string, extra: { fileName?: string; contentType?: string; textField?: string } = {}) =>
  detectFormat(head, { format: 'auto', textField: 'text', ...extra }, true);

describe('detectFormat', () => {
  it('goes by the file name extension first', () => {
    expect(detect('anything', { fileName: 'a.CSV' })).toEqual({ format: 'csv', delimiter: ',' });
    expect(detect('a\tb', { fileName: 'a.tsv' })).toEqual({ format: 'csv', delimiter: '\t' });
    expect(detect('{"text":1}', { fileName: 'a.jsonl' })).toEqual({ format: 'ndjson' });
    expect(detect('[1]', { fileName: 'x.ndjson' })).toEqual({ format: 'ndjson' });
    expect(detect('text,n\na,1', { fileName: 'notes.txt' })).toEqual({ format: 'text' });
  });

  it('reads a .json file or JSON content type starting with "{" as NDJSON, with "[" as an array', () => {
    expect(detect(' \n{"text":"a"}', { fileName: 'a.json' })).toEqual({ format: 'ndjson' });
    expect(detect('\n [ {"text":"a"}', { fileName: 'a.json' })).toEqual({ format: 'json' });
    expect(detect('{"text":"a"}', { contentType: 'application/json; charset=utf-8' })).toEqual({ format: 'ndjson' });
  });

  it('uses a specific content type when the name says nothing', () => {
    expect(detect('text;n\na;1', { contentType: 'text/csv' })).toEqual({ format: 'csv', delimiter: ';' });
    expect(detect('{}', { contentType: 'application/x-ndjson', fileName: 'upload' })).toEqual({ format: 'ndjson' });
    expect(detect('a\tb', { contentType: 'text/tab-separated-values' })).toEqual({ format: 'csv', delimiter: '\t' });
  });

  it('sniffs the content otherwise: JSON by its first character, CSV by its header, else plain text', () => {
    expect(detect('[{"text":"a"}]', { contentType: 'application/octet-stream' })).toEqual({ format: 'json' });
    expect(detect('{"text":"a"}\n')).toEqual({ format: 'ndjson' });
    expect(detect('id,Text\n1,hello, world\n')).toEqual({ format: 'csv', delimiter: ',' });
    expect(detect('subject,body,queue\na,b,c\nd,e,f\n')).toEqual({ format: 'csv', delimiter: ',' });
    expect(detect('My printer, again, is broken\nThe VPN drops every hour\n')).toEqual({ format: 'text' });
    expect(detect('one line only, with a comma')).toEqual({ format: 'text' });
  });

  it('treats a header naming a custom textField as CSV', () => {
    expect(detect('body\nhello\n', { textField: 'body' })).toEqual({ format: 'csv', delimiter: ',' });
  });
});

describe('sniffDelimiter', () => {
  it('prefers the delimiter under which the header names the text field', () => {
    expect(sniffDelimiter('id;text;note, extra\n', 'text')).toBe(';');
    expect(sniffDelimiter('a;b;c,text\n', 'text')).toBe(',');
  });

  it('otherwise picks the one giving the most fields, comma on ties, ignoring quoted delimiters', () => {
    expect(sniffDelimiter('a\tb\tc\n', 'x')).toBe('\t');
    expect(sniffDelimiter('"a;b;c",d\n', 'x')).toBe(',');
    expect(sniffDelimiter('a;b,c\n', 'x')).toBe(',');
    expect(sniffDelimiter('single\n', 'x')).toBe(',');
  });
});
