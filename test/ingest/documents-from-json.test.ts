// The JSON body form of POST /corpora (docs: /work/shared/api-v1.md, "Corpora").
import { describe, expect, it } from 'vitest';
import { documentsFromJson, IngestError } from '../../server/ingest/index.js';

function thrown(fn: () => unknown): IngestError {
  try {
    fn();
  } catch (err) {
    return err as IngestError;
  }
  throw new Error('expected an error');
}

describe('documentsFromJson', () => {
  it('takes "id" and "text" and keeps other keys as metadata, numbering missing ids by position', () => {
    const { documents, summary } = documentsFromJson({
      name: 'x',
      documents: [{ id: 'a', text: 'one', lang: 'en' }, { text: 'two' }, 'three'],
    });
    expect(documents).toEqual([
      { id: 'a', text: 'one', meta: { lang: 'en' } },
      { id: '2', text: 'two', meta: {} },
      { id: '3', text: 'three', meta: {} },
    ]);
    expect(summary).toMatchObject({ format: 'json', fields: ['lang'], documentCount: 3, skippedCount: 0 });
  });

  it('accepts the documents array itself', () => {
    expect(documentsFromJson([{ text: 'a' }]).documents).toEqual([{ id: '1', text: 'a', meta: {} }]);
  });

  it('skips empty and non-string texts, reporting their 1-based position', () => {
    const { documents, summary } = documentsFromJson({ documents: [{ text: '  ' }, { text: 3 }, { text: 'ok' }, 5] });
    expect(documents.map((d) => d.id)).toEqual(['3']);
    expect(summary.skipped.map((s) => s.line)).toEqual([1, 2, 4]);
    expect(summary.skipped[0]!.reason).toBe('empty text');
  });

  it('refuses a body without a documents array as a bad request', () => {
    const err = thrown(() => documentsFromJson({ name: 'x' }));
    expect(err).toBeInstanceOf(IngestError);
    expect(err.code).toBe('bad_request');
  });

  it('refuses an empty array, all-empty documents, and duplicate ids as unprocessable', () => {
    expect(thrown(() => documentsFromJson({ documents: [] })).code).toBe('unprocessable');
    const allEmpty = thrown(() => documentsFromJson({ documents: [{ text: '' }, { text: ' \n' }] }));
    expect(allEmpty.code).toBe('unprocessable');
    expect(allEmpty.details).toMatchObject({ skippedCount: 2 });
    expect(allEmpty.message).toBe('None of the 2 records holds a usable document (document 1: empty text; document 2: empty text).');
    const dup = thrown(() => documentsFromJson({ documents: [{ id: 'x', text: 'a' }, { id: 'x', text: 'b' }] }));
    expect(dup.details).toMatchObject({ id: 'x', line: 2, firstLine: 1 });
    expect(dup.message).toContain('Duplicate id "x" in document 2 (first seen in document 1)');
  });

  it('refuses a generated id that collides with a given one rather than merging two documents', () => {
    const err = thrown(() => documentsFromJson({ documents: [{ text: 'a' }, { id: '1', text: 'b' }] }));
    expect(err.code).toBe('unprocessable');
    expect(err.details).toMatchObject({ id: '1' });
  });

  it('names the keys that exist when the text key is missing everywhere', () => {
    const err = thrown(() => documentsFromJson({ documents: [{ body: 'a' }] }));
    expect(err.code).toBe('unprocessable');
    expect(err.details).toMatchObject({ field: 'text', fields: ['body'] });
  });

  it('honours textField and idField', () => {
    const { documents } = documentsFromJson({ documents: [{ key: 'k1', body: 'hello', text: 'meta now' }] }, { textField: 'body', idField: 'key' });
    expect(documents).toEqual([{ id: 'k1', text: 'hello', meta: { text: 'meta now' } }]);
  });
});
