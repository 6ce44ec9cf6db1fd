import { createReadStream, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { batchesOf } from '../ingest/batches-of.js';
import { parseDocuments } from '../ingest/index.js';
import type { Store } from '../store/api.js';

/** The committed demo corpus (invented messages; see corpora/README.md). */
export const DEMO_CSV = fileURLToPath(new URL('../../../corpora/demo.csv', import.meta.url));

/** Imports the demo corpus; a missing file is reported and skipped, not fatal. */
export async function loadDemoCorpus(store: Store, path = DEMO_CSV): Promise<void> {
  if (!existsSync(path)) {
    console.warn(`[sheaf] demo corpus not found at ${path}; starting empty`);
    return;
  }
  const parse = parseDocuments(createReadStream(path), { format: 'csv', fileName: 'demo.csv', textField: 'text', idField: 'id' });
  const { batches, summary } = batchesOf(parse);
  const corpus = await store.importCorpus('Demo inbox (invented messages)', batches, () => summary()?.fields ?? []);
  console.log(`[sheaf] loaded the demo corpus: ${corpus.documentCount} invented messages`);
}
