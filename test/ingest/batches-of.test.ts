// batchesOf: the parser as a plain async iterable of batches plus the summary at the end.
import { describe, expect, it } from 'vitest';
import { batchesOf, parseDocuments } from '../../server/ingest/index.js';
import { streamOf } from './chunks.js';

describe('batchesOf', () => {
  it('passes every batch through and makes the summary available only after the last one', async () => {
    const input = 'text\n' + Array.from({ length: 12 }, (_, i) => `doc ${i}`).join('\n') + '\n';
    const { batches, summary } = batchesOf(parseDocuments(streamOf(input), { batchSize: 5 }));
    const sizes: number[] = [];
    for await (const batch of batches) {
      expect(summary()).toBeNull();
      sizes.push(batch.length);
    }
    expect(sizes).toEqual([5, 5, 2]);
    expect(summary()).toMatchObject({ format: 'csv', documentCount: 12 });
  });

  it('lets an IngestError through to the consumer', async () => {
    const { batches, summary } = batchesOf(parseDocuments(streamOf('subject\nhello\n'), { format: 'csv' }));
    await expect((async () => {
      for await (const _ of batches) void _;
    })()).rejects.toMatchObject({ code: 'unprocessable' });
    expect(summary()).toBeNull();
  });
});
