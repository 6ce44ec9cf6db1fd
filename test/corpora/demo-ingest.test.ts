import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEMO_CORPUS } from '../../corpora/demo-info.js';
import { parseDocuments, type IngestDocument } from '../../server/ingest/index.js';
import { readRfc4180 } from './rfc4180.js';

async function* chunksOf(bytes: Uint8Array, size: number): AsyncGenerator<Uint8Array> {
  for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
}

describe('corpora/demo.csv through the real upload parser (server/ingest)', () => {
  it('imports every message, with the same ids, texts and metadata, skipping and warning about nothing', async () => {
    const bytes = readFileSync(DEMO_CORPUS.file);
    const [header, ...rows] = readRfc4180(bytes.toString('utf8'));
    // Odd chunk size so that records, quoted line breaks and multi-byte characters straddle chunks.
    const gen = parseDocuments(chunksOf(bytes, 4093), {
      format: 'auto', textField: DEMO_CORPUS.textField, idField: DEMO_CORPUS.idField,
    });
    const docs: IngestDocument[] = [];
    let next = await gen.next();
    while (!next.done) {
      docs.push(...next.value);
      next = await gen.next();
    }
    const summary = next.value;
    expect(summary.format).toBe('csv');
    expect(summary.skippedCount).toBe(0);
    expect(summary.warningCount).toBe(0);
    expect(summary.documentCount).toBe(rows.length);
    expect(summary.fields).toEqual(header.filter((h) => h !== DEMO_CORPUS.textField && h !== DEMO_CORPUS.idField));
    const textAt = header.indexOf(DEMO_CORPUS.textField);
    const labelAt = header.indexOf(DEMO_CORPUS.labelField);
    docs.forEach((d, i) => {
      expect(d.id).toBe(rows[i][header.indexOf(DEMO_CORPUS.idField)]);
      expect(d.text).toBe(rows[i][textAt]);
      expect(d.meta[DEMO_CORPUS.labelField]).toBe(rows[i][labelAt]);
    });
  });
});
