/**
 * Writes corpora/demo.csv, the invented demo corpus, from `generateDemoCorpus(DEMO_SEED)`.
 * Run `npm run build`, then `node dist/corpora/generate-demo.js` from the repository root; an
 * optional argument is the output path. Running it twice gives byte-identical files.
 */
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateDemoCorpus } from './demo-corpus.js';
import { DEMO_CORPUS, DEMO_SEED } from './demo-info.js';
import { toCsv } from './to-csv.js';

export { generateDemoCorpus, type DemoTable } from './demo-corpus.js';
export { DEMO_CORPUS, DEMO_HEADER, DEMO_SEED } from './demo-info.js';
export { toCsv } from './to-csv.js';

/**
 * Generates the demo corpus and writes it as CSV.
 * @param path where to write
 * @default path `corpora/demo.csv` under the current directory
 * @returns the number of rows written and the byte size of the file
 */
export function writeDemoCorpus(path: string = DEMO_CORPUS.file): { rows: number; bytes: number } {
  const table = generateDemoCorpus(DEMO_SEED);
  const csv = toCsv(table);
  writeFileSync(path, csv, 'utf8');
  return { rows: table.rows.length, bytes: Buffer.byteLength(csv, 'utf8') };
}

// Write only when run as a script, not when a test imports the exports above.
if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const path = process.argv[2] ?? DEMO_CORPUS.file;
  const { rows, bytes } = writeDemoCorpus(path);
  console.log(`wrote ${rows} invented messages (${(bytes / 1024).toFixed(0)} KiB) to ${path} with seed ${DEMO_SEED}`);
}
