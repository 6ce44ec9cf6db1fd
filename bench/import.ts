// Server-side import: what happens after a 50,000-document upload is received — parse the CSV
// stream, store it in SQLite (one import, visible only when whole), then vectorise the texts
// (TF-IDF), as an analysis does first. Prints the time of each step and the peak RSS.
//
//   npm run bench import                 (50,000 documents of ~60 words)
//   npm run bench import -- 100000
//
// Input is generated (seeded) into os.tmpdir(). The peer for TF-IDF (natural's TfIdf class) is in
// `npm run bench tfidf`, on the same kind of data.
import { createReadStream, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { batchesOf } from '../server/ingest/batches-of.js';
import { parseDocuments } from '../server/ingest/index.js';
import { openSqliteStore } from '../server/store/index.js';
import { fitTfidf } from '../server/text/index.js';
import { zipfianDocuments } from './lib/synthetic-tickets.js';

const n = Number(process.argv[2] ?? 50_000);
const dir = mkdtempSync(join(tmpdir(), 'sheaf-bench-import-'));
const csvPath = join(dir, 'upload.csv');
const docs = zipfianDocuments(n, 5);
writeFileSync(csvPath, 'id,text,channel\n' + docs.map((d, i) => `${i + 1},"${d}",${i % 3 ? 'email' : 'chat'}`).join('\n') + '\n');
const bytes = statSync(csvPath).size;
(globalThis as { gc?: () => void }).gc?.();
const rssBefore = process.memoryUsage().rss;
let peak = rssBefore;
const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);

const store = openSqliteStore(join(dir, 'data'));
const c0 = process.cpuUsage();
const t0 = performance.now();
const { batches, summary } = batchesOf(parseDocuments(createReadStream(csvPath), { format: 'csv', textField: 'text', idField: 'id' }));
const texts: string[] = [];
async function* keepTexts() {
  for await (const batch of batches) {
    for (const d of batch) texts.push(d.text);
    yield batch;
  }
}
const corpus = await store.importCorpus('bench', keepTexts(), () => summary()?.fields ?? []);
const t1 = performance.now();
const c1 = process.cpuUsage(c0);
const t2 = t1;
const { matrix } = fitTfidf(texts);
const t3 = performance.now();
const c3 = process.cpuUsage(c0);
clearInterval(sampler);
peak = Math.max(peak, process.memoryUsage().rss);

const mb = (b: number) => (b / 1024 / 1024).toFixed(0);
console.log(`${n} documents, ${mb(bytes)} MB CSV → ${corpus.documentCount} stored; ${matrix.cols} terms, ${matrix.indptr[matrix.rows]} non-zeros`);
const cpu = (u: NodeJS.CpuUsage) => (u.user + u.system) / 1e6;
console.log(`                             wall      CPU`);
console.log(`parse + store (one import):  ${((t1 - t0) / 1000).toFixed(3)} s  ${cpu(c1).toFixed(3)} s`);
console.log(`TF-IDF fit:                  ${((t3 - t2) / 1000).toFixed(3)} s  ${(cpu(c3) - cpu(c1)).toFixed(3)} s`);
console.log(`total server time:           ${((t3 - t0) / 1000).toFixed(3)} s  ${cpu(c3).toFixed(3)} s   (target ≤ 1.5 s)`);
console.log(`RSS before ${mb(rssBefore)} MB, peak ${mb(peak)} MB, peak above start ${mb(peak - rssBefore)} MB (target: peak ≤ 400 MB)`);
await store.close();
rmSync(dir, { recursive: true, force: true });
