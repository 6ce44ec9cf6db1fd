// CSV reading, checked case by case against RFC 4180 (Shafranovich 2005), section 2, and
// against behaviour the RFC leaves open (delimiters, field counts), which is our decision.
import { describe, expect, it } from 'vitest';
import { collectDocuments, IngestError } from '../../server/ingest/index.js';
import { chunked, parse, rejection } from './chunks.js';

const texts = (docs: { text: string }[]) => docs.map((d) => d.text);

describe('CSV per RFC 4180 §2', () => {
  it('reads a header row and records separated by CRLF (RFC 4180 §2 rules 1 and 3)', async () => {
    const { documents, summary } = await parse('id,text,team\r\n7,printer jams,ops\r\n8,vpn drops,net\r\n');
    expect(texts(documents)).toEqual(['printer jams', 'vpn drops']);
    expect(documents[0]!.meta).toEqual({ id: '7', team: 'ops' });
    expect(summary).toMatchObject({ format: 'csv', delimiter: ',', fields: ['id', 'team'], documentCount: 2, skippedCount: 0 });
  });

  it('reads the last record without a line break (RFC 4180 §2 rule 2)', async () => {
    const { documents } = await parse('text,n\r\nfirst,1\r\nlast,2');
    expect(texts(documents)).toEqual(['first', 'last']);
    expect(documents[1]!.meta).toEqual({ n: '2' });
  });

  it('keeps commas inside quoted fields (RFC 4180 §2 rule 6)', async () => {
    const { documents } = await parse('text,n\r\n"late, cold, and wrong",1\r\n');
    expect(texts(documents)).toEqual(['late, cold, and wrong']);
  });

  it('turns doubled quotes inside quotes into one quote (RFC 4180 §2 rule 7)', async () => {
    const { documents } = await parse('text,n\r\n"the ""new"" screen",1\r\n"""",2\r\n');
    expect(texts(documents)).toEqual(['the "new" screen', '"']);
  });

  it('keeps CRLF, LF and CR embedded in quoted fields (RFC 4180 §2 rule 6)', async () => {
    const { documents, summary } = await parse('text,n\r\n"one\r\ntwo",1\r\n"three\nfour\rfive",2\r\nsix,3\r\n');
    expect(texts(documents)).toEqual(['one\r\ntwo', 'three\nfour\rfive', 'six']);
    expect(summary.skippedCount).toBe(0);
  });

  it('accepts a header with quoted names and spaces as part of fields (RFC 4180 §2 rules 3 and 4)', async () => {
    const { documents } = await parse('"text"," n "\n  padded  ,1\n');
    expect(documents[0]).toEqual({ id: '1', text: '  padded  ', meta: { n: '1' } });
  });

  it('drops a UTF-8 byte order mark before the header', async () => {
    const bytes = new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode('text,n\nhello,1\n')]);
    const { documents, summary } = await parse(bytes);
    expect(texts(documents)).toEqual(['hello']);
    expect(summary.fields).toEqual(['n']);
  });

  it('accepts LF line ends and a trailing newline or none', async () => {
    for (const input of ['text\na\nb\n', 'text\na\nb', 'text\r\na\r\nb\r\n']) {
      const { documents } = await parse(input, { format: 'csv' });
      expect(texts(documents)).toEqual(['a', 'b']);
    }
  });
});

describe('CSV choices beyond the RFC', () => {
  it('numbers rows from line 1 = header, counting lines inside quoted fields', async () => {
    const { summary } = await parse('text,n\n"multi\nline\ntext",1\n"",2\n\nok,3\n  ,4\n');
    expect(summary.skipped).toEqual([
      { line: 5, reason: 'empty text' },
      { line: 8, reason: 'empty text' },
    ]);
  });

  it('gives ids by position counting skipped rows, so an id names the same row whatever is skipped', async () => {
    const { documents } = await parse('text\nalpha\n""\ngamma\n');
    expect(documents.map((d) => d.id)).toEqual(['1', '3']);
  });

  it('takes ids from idField and leaves that column out of the metadata', async () => {
    const { documents, summary } = await parse('ticket,text,queue\nT-9,disk full,ops\nT-3,no login,it\n', { idField: 'ticket' });
    expect(documents.map((d) => d.id)).toEqual(['T-9', 'T-3']);
    expect(documents[0]!.meta).toEqual({ queue: 'ops' });
    expect(summary.fields).toEqual(['queue']);
  });

  it('refuses duplicate ids naming the id and both lines', async () => {
    const err = await rejection(parse('ticket,text\nA,one\nB,two\nA,three\n', { idField: 'ticket' }));
    expect(err).toBeInstanceOf(IngestError);
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('"A"');
    expect(err.details).toMatchObject({ id: 'A', line: 4, firstLine: 2 });
  });

  it('skips a row without an id when idField is set', async () => {
    const { documents, summary } = await parse('ticket,text\n,one\nB,two\n', { idField: 'ticket' });
    expect(documents.map((d) => d.id)).toEqual(['B']);
    expect(summary.skipped).toEqual([{ line: 2, reason: 'empty id in "ticket"' }]);
  });

  it('refuses a missing text column, naming the columns that exist', async () => {
    const err = await rejection(parse('subject,body\na,b\n', { format: 'csv' }));
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('"subject", "body"');
    expect(err.details).toMatchObject({ field: 'text', fields: ['subject', 'body'] });
  });

  it('refuses a missing id column, naming the columns that exist', async () => {
    const err = await rejection(parse('text,b\na,b\n', { idField: 'key' }));
    expect(err.code).toBe('unprocessable');
    expect(err.details).toMatchObject({ field: 'key', fields: ['text', 'b'] });
  });

  it('matches the text column ignoring case and surrounding spaces', async () => {
    const { documents } = await parse('Id, Text \n1,hello\n', { format: 'csv' });
    expect(documents[0]).toEqual({ id: '1', text: 'hello', meta: { Id: '1' } });
  });

  it('uses a textField other than the default', async () => {
    const { documents } = await parse('subject,body\nhi,the body\n', { textField: 'body' });
    expect(documents[0]).toEqual({ id: '1', text: 'the body', meta: { subject: 'hi' } });
  });

  it('pads a short row with empty fields and warns', async () => {
    const { documents, summary } = await parse('text,a,b\nhello,1\n');
    expect(documents[0]!.meta).toEqual({ a: '1', b: '' });
    expect(summary.warnings).toEqual([{ line: 2, reason: "the row has 2 of the header's 3 fields; the missing ones were left empty" }]);
  });

  it('skips a long row with its line and reason, but drops trailing empty fields silently', async () => {
    const { documents, summary } = await parse('text,a\nok,1\nbroken, really,2\nfine,3,,\n');
    expect(texts(documents)).toEqual(['ok', 'fine']);
    expect(summary.skipped).toHaveLength(1);
    expect(summary.skipped[0]!.line).toBe(3);
    expect(summary.skipped[0]!.reason).toContain('3 fields but the header has 2');
  });

  it('skips a row whose quote is never closed and says so', async () => {
    const { documents, summary } = await parse('text,n\nok,1\n"never closed,2\nmore,3\n');
    expect(texts(documents)).toEqual(['ok']);
    expect(summary.skipped[0]!.line).toBe(3);
    expect(summary.skipped[0]!.reason).toContain('never closed');
  });

  it('reads semicolon and tab delimited files when the header uses them', async () => {
    const semi = await parse('id;text;note\n1;bonjour, monde;x\n', { fileName: 'export.csv' });
    expect(semi.documents[0]).toEqual({ id: '1', text: 'bonjour, monde', meta: { id: '1', note: 'x' } });
    expect(semi.summary.delimiter).toBe(';');
    const tab = await parse('text\tscore\nhello, there\t3\n');
    expect(tab.documents[0]!.meta).toEqual({ score: '3' });
    expect(tab.summary.delimiter).toBe('\t');
  });

  it('uses an explicit delimiter over the sniffed one', async () => {
    const { documents, summary } = await parse('id|text\n1|a, b; c\n', { delimiter: '|' });
    expect(documents[0]).toEqual({ id: '1', text: 'a, b; c', meta: { id: '1' } });
    expect(summary).toMatchObject({ format: 'csv', delimiter: '|' });
  });

  it('reads a .tsv file with tabs even when its header has commas', async () => {
    const { documents } = await parse('text\tnote\na,b\tc\n', { fileName: 'x.tsv' });
    expect(documents[0]).toEqual({ id: '1', text: 'a,b', meta: { note: 'c' } });
  });

  it('names unnamed columns and renames repeated ones, with warnings', async () => {
    const { documents, summary } = await parse('text,,tag,tag\nhi,1,a,b\n');
    expect(documents[0]!.meta).toEqual({ column_2: '1', tag: 'a', tag_2: 'b' });
    expect(summary.warningCount).toBe(2);
  });

  it('refuses a header with no rows under it', async () => {
    const err = await rejection(parse('text,n\n', { format: 'csv' }));
    expect(err.code).toBe('unprocessable');
    expect(err.message).toContain('no rows');
  });

  it('cuts texts longer than maxDocumentChars, one warning per cut document', async () => {
    const { documents, summary } = await parse(`text\n${'a'.repeat(50)}\nshort\n${'b'.repeat(11)}\n`, { maxDocumentChars: 10 });
    expect(texts(documents)).toEqual(['a'.repeat(10), 'short', 'b'.repeat(10)]);
    expect(summary.warnings.map((w) => w.line)).toEqual([2, 4]);
  });

  it('does not split a surrogate pair when cutting', async () => {
    const { documents } = await parse(`text\nabc😀def\n`, { maxDocumentChars: 4 });
    expect(documents[0]!.text).toBe('abc');
  });

  it('refuses a row that runs past maxRecordChars while streaming, naming its line', async () => {
    const input = `text\nok\n"${'x'.repeat(100_000)}\nmore,rows\n`;
    const err = await rejection(collectDocuments(chunked(input, 64), { maxRecordChars: 100 }));
    expect(err).toBeInstanceOf(IngestError);
    expect(err.code).toBe('unprocessable');
    expect(err.details).toEqual({ line: 3 });
    expect(err.message).toContain('never closed');
  });

  it('skips a row with an unclosed quote at the very end when it fits in maxRecordChars', async () => {
    const { documents, summary } = await collectDocuments(chunked('text\nok\n"unfinished', 3), { maxRecordChars: 100 });
    expect(texts(documents)).toEqual(['ok']);
    expect(summary.skipped[0]!.line).toBe(3);
  });
});
