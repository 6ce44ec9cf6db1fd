import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cosineSilhouette, sampledCosineSilhouette, silhouetteSamples } from '../../server/cluster/silhouette.js';
import { seededRandom } from '../../server/common/random.js';
import type { DenseView } from '../../server/cluster/api.js';

interface Fixture {
  silhouettes: { points: number[][]; labels: number[]; k: number; cosine: { samples: number[]; score: number }; euclidean: { samples: number[]; score: number } }[];
}
// Reference: scikit-learn silhouette_samples / silhouette_score (test/reference/cluster-measures.py).
const fixture = JSON.parse(readFileSync(new URL('../fixtures/cluster-measures.json', import.meta.url), 'utf8')) as Fixture;

function dense64(points: number[][]): DenseView {
  const cols = points[0].length;
  return { rows: points.length, cols, data: Float64Array.from(points.flat()), };
}

describe('silhouetteSamples (the definition, O(n²))', () => {
  it('matches the hand computation of Rousseeuw (1987) on a 1-D example', () => {
    // Source: the definition in Rousseeuw (1987), computed by hand: A = {0, 2}, B = {6, 8, 10},
    // C = {20} (a singleton, whose silhouette is 0 by the paper's convention).
    // x=0: a=2, b=mean(6,8,10)=8 → 6/8;  x=2: a=2, b=6 → 4/6;  x=6: a=3, b=5 → 2/5;
    // x=8: a=2, b=7 → 5/7;  x=10: a=3, b=9 → 6/9;  x=20: 0.
    const data: DenseView = { rows: 6, cols: 1, data: Float64Array.from([0, 2, 6, 8, 10, 20]) };
    const labels = Int32Array.from([0, 0, 1, 1, 1, 2]);
    const expected = [3 / 4, 2 / 3, 2 / 5, 5 / 7, 2 / 3, 0];
    const s = silhouetteSamples(data, labels, 3, 'euclidean');
    expected.forEach((v, i) => expect(s.samples[i]).toBeCloseTo(v, 14));
    expect(s.mean).toBeCloseTo(expected.reduce((a, b) => a + b) / 6, 14);
  });

  for (const metric of ['cosine', 'euclidean'] as const) {
    it(`equals scikit-learn's silhouette_samples and silhouette_score with ${metric} distance within 1e-9`, () => {
      for (const c of fixture.silhouettes) {
        const s = silhouetteSamples(dense64(c.points), Int32Array.from(c.labels), c.k, metric);
        c[metric].samples.forEach((v, i) => expect(Math.abs(s.samples[i] - v)).toBeLessThan(1e-9));
        expect(Math.abs(s.mean - c[metric].score)).toBeLessThan(1e-9);
      }
    });
  }
});

describe('cosineSilhouette (centroid identity, O(n·k·d))', () => {
  it("equals scikit-learn's cosine silhouette_samples within 1e-9", () => {
    for (const c of fixture.silhouettes) {
      const s = cosineSilhouette(dense64(c.points), Int32Array.from(c.labels), c.k);
      c.cosine.samples.forEach((v, i) => expect(Math.abs(s.samples[i] - v)).toBeLessThan(1e-9));
      expect(Math.abs(s.mean - c.cosine.score)).toBeLessThan(1e-9);
    }
  });

  it('equals the O(n²) definition on random data, clusters of one and rows left out included', () => {
    const random = seededRandom(5);
    const n = 120, d = 8, k = 6;
    const data: DenseView = { rows: n, cols: d, data: Float64Array.from({ length: n * d }, () => random() - 0.3) };
    const labels = Int32Array.from({ length: n }, () => Math.floor(random() * (k - 1)));
    labels[7] = k - 1; // a singleton
    labels[11] = -1; // not clustered
    labels[12] = -1;
    const fast = cosineSilhouette(data, labels, k);
    const slow = silhouetteSamples(data, labels, k, 'cosine');
    for (let i = 0; i < n; i++) expect(Math.abs(fast.samples[i] - slow.samples[i])).toBeLessThan(1e-12);
    expect(fast.samples[7]).toBe(0);
    expect(fast.samples[11]).toBe(0);
    expect(Math.abs(fast.mean - slow.mean)).toBeLessThan(1e-12);
  });

  it('gives members of a cluster of exact copies a silhouette of 1', () => {
    const data: DenseView = { rows: 5, cols: 2, data: Float64Array.from([1, 0, 1, 0, 1, 0, 0, 1, 0.1, 1]) };
    const s = cosineSilhouette(data, Int32Array.from([0, 0, 0, 1, 1]), 2);
    expect(s.samples[0]).toBeCloseTo(1, 12);
    expect(s.samples[3]).toBeGreaterThan(0.9);
  });
});

describe('sampledCosineSilhouette', () => {
  it('averages the exact silhouettes of the sampled rows', () => {
    const c = fixture.silhouettes[1];
    const data = dense64(c.points);
    const labels = Int32Array.from(c.labels);
    const sample = Int32Array.from([0, 3, 9, 20, 50, 77, 149]);
    const expected = Array.from(sample).reduce((a, i) => a + c.cosine.samples[i], 0) / sample.length;
    expect(Math.abs(sampledCosineSilhouette(data, labels, c.k, sample) - expected)).toBeLessThan(1e-9);
    const all = Int32Array.from({ length: data.rows }, (_, i) => i);
    expect(Math.abs(sampledCosineSilhouette(data, labels, c.k, all) - c.cosine.score)).toBeLessThan(1e-9);
  });

  it('rejects labels outside 0..k−1 with a message naming the row', () => {
    const data: DenseView = { rows: 2, cols: 1, data: Float64Array.from([1, 2]) };
    expect(() => cosineSilhouette(data, Int32Array.from([0, 3]), 2)).toThrow(/row 1/);
  });
});
