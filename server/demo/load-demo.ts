import { createReadStream, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { batchesOf } from '../ingest/batches-of.js';
import { parseDocuments } from '../ingest/index.js';
import type { Store } from '../store/api.js';
import { DEMO_CORPUS } from '../../corpora/demo-info.js';

/** The committed demo corpus (invented messages; see corpora/README.md). Resolved from dist/server/demo/. */
export const DEMO_CSV = fileURLToPath(new URL(`../../../${DEMO_CORPUS.file}`, import.meta.url));

/** Imports the demo corpus; a missing file is reported and skipped, not fatal. */
export async function loadDemoCorpus(store: Store, path = DEMO_CSV): Promise<void> {
  if (!existsSync(path)) {
    console.warn(`[sheaf] demo corpus not found at ${path}; starting empty`);
    return;
  }
  const parse = parseDocuments(createReadStream(path), { format: 'csv', fileName: 'demo.csv', textField: DEMO_CORPUS.textField, idField: DEMO_CORPUS.idField });
  const { batches, summary } = batchesOf(parse);
  const corpus = await store.importCorpus(DEMO_CORPUS.name, batches, () => summary()?.fields ?? []);
  console.log(`[sheaf] loaded the demo corpus: ${corpus.documentCount} invented messages`);
}
