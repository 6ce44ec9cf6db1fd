import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { chooseK, kmeansSweepSteps, kneeOf, PATIENCE, referenceTrend, sampleRows, shuffledReference } from '../../server/cluster/choose-k.js';
import type { Dense } from '../../server/common/matrix.js';
import { seededRandom } from '../../server/common/random.js';
import { drain } from '../../server/common/step.js';

// Planted, well-separated points written by test/reference/cluster-kmeans.py (scikit-learn script).
const fixture = JSON.parse(readFileSync(new URL('../fixtures/cluster-kmeans.json', import.meta.url), 'utf8')) as { easy: { points: number[][]; k: number } };
const easy: Dense = { rows: fixture.easy.points.length, cols: fixture.easy.points[0].length, data: Float32Array.from(fixture.easy.points.flat()) };

describe('chooseK', () => {
  it('takes the highest silhouette when there is no reference curve', () => {
    const r = chooseK([{ k: 2, silhouette: 0.1 }, { k: 4, silhouette: 0.3 }, { k: 3, silhouette: 0.2 }]);
    expect(r.k).toBe(4);
    expect(r.rule).toMatch(/highest/);
  });

  // A reference exactly on a + b·ln k is its own least-squares trend, so gains are curve − reference.
  const ks = [2, 3, 4, 5, 6, 7, 8];
  const logLinear = (k: number) => 0.02 + 0.01 * Math.log(k);
  const withGains = (gains: number[]) => ks.map((k, i) => ({ k, silhouette: logLinear(k) + gains[i] }));
  const reference = ks.map((k) => ({ k, silhouette: logLinear(k) }));

  it('takes the first k where the gain over the reference stops growing (gap-statistic stopping rule)', () => {
    // gains 0.01, 0.03, 0.05, 0.04, 0.03, 0.02, 0.01: the peak is k = 4.
    const r = chooseK(withGains([0.01, 0.03, 0.05, 0.04, 0.03, 0.02, 0.01]), reference);
    expect(r.k).toBe(4);
    expect(r.rule).toMatch(/k = 4/);
  });

  it('waits two more k before calling a peak (PATIENCE), so a one-step dip does not stop it', () => {
    // gains 0.01, 0.02, 0.03, 0.025, 0.06, 0.05, 0.045: k = 4 dips at 5 but k = 6 beats it
    // (and the knee is at k = 6 too: scaled gain minus scaled k is largest there, 1 − 2/3).
    expect(PATIENCE).toBe(2);
    const r = chooseK(withGains([0.01, 0.02, 0.03, 0.025, 0.06, 0.05, 0.045]), reference);
    expect(r.k).toBe(6);
    expect(r.rule).toMatch(/stops growing/);
  });

  it('takes the knee of a gain that keeps creeping up (Kneedle, Satopää et al. 2011)', () => {
    // gains 0, 0.05, 0.08, 0.09, 0.095, 0.1, 0.104: no peak; scaled gain minus scaled k is
    // 0, 0.314, 0.436, 0.365, 0.247, 0.128, 0 at k = 2..8 (by hand), so the knee is k = 4.
    const r = chooseK(withGains([0, 0.05, 0.08, 0.09, 0.095, 0.1, 0.104]), reference);
    expect(r.k).toBe(4);
    expect(r.rule).toMatch(/knee/);
  });

  it('kneeOf: largest distance above the diagonal of the scaled curve; none for a straight or sagging line', () => {
    expect(kneeOf([1, 2, 3, 4, 5], [0, 0.6, 0.8, 0.9, 1])).toBe(1);
    expect(kneeOf([1, 2, 3], [0, 0.5, 1])).toBeNull();
    expect(kneeOf([1, 2, 3], [0, 0.1, 1])).toBeNull();
    expect(kneeOf([1, 2], [0, 1])).toBeNull();
  });

  it('compares with the trend of a wiggly reference, not with its single points', () => {
    const gains = [0.05, 0.1, 0.15, 0.2, 0.25, 0.2, 0.15];
    const wiggle = [0, 0.06, -0.03, 0.06, -0.03, 0.06, -0.03];
    const curve = withGains(gains);
    const noisy = ks.map((k, i) => ({ k, silhouette: logLinear(k) + wiggle[i] }));
    // Point by point the gain would fall from k = 2 (0.05) to k = 3 (0.1 − 0.06 = 0.04).
    expect(curve[1].silhouette - noisy[1].silhouette).toBeLessThan(curve[0].silhouette - noisy[0].silhouette);
    expect(chooseK(curve, noisy).k).toBe(6);
  });

  it('fits the trend by least squares: exact on a quadratic in ln k, the points themselves below 3', () => {
    const q = ks.map((k) => 0.1 - 0.02 * Math.log(k) + 0.03 * Math.log(k) ** 2);
    referenceTrend(ks, q).forEach((v, i) => expect(v).toBeCloseTo(q[i], 12));
    expect(referenceTrend([2, 3], [0.5, 0.1])).toEqual([0.5, 0.1]);
  });

  it('takes the last k when the gain grows through the whole range', () => {
    const curve = [2, 3, 4].map((k) => ({ k, silhouette: 0.1 * k }));
    const reference = [2, 3, 4].map((k) => ({ k, silhouette: 0.01 * k }));
    expect(chooseK(curve, reference).k).toBe(4);
  });

  it('refuses an empty curve and a reference that lacks a k', () => {
    expect(() => chooseK([])).toThrow(RangeError);
    expect(() => chooseK([{ k: 2, silhouette: 0.1 }, { k: 3, silhouette: 0.2 }], [{ k: 2, silhouette: 0 }])).toThrow(/k = 3/);
  });
});

describe('kmeansSweepSteps', () => {
  it('sweeps every k of the range and recovers the planted number of directions', () => {
    const r = drain(kmeansSweepSteps(easy, { kMin: 2, kMax: 10, sampleSize: 4000, restarts: 2, random: seededRandom(1) }));
    expect(r.curve.map((p) => p.k)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect(r.reference.map((p) => p.k)).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect(r.centroids[4].length).toBe(6 * easy.cols);
    expect(chooseK(r.curve, r.reference).k).toBe(fixture.easy.k);
    expect(chooseK(r.curve).k).toBe(fixture.easy.k);
  });

  it('clusters only the sample when the data is larger than the sample size', () => {
    const r = drain(kmeansSweepSteps(easy, { kMin: 2, kMax: 3, sampleSize: 50, restarts: 1, random: seededRandom(1) }));
    expect(r.sample.length).toBe(50);
  });
});

describe('shuffledReference and sampleRows', () => {
  it('keeps rows unit length and each coordinate a shuffle of the original column (before scaling)', () => {
    const ref = shuffledReference(easy, seededRandom(2));
    for (let i = 0; i < ref.rows; i++) {
      let s = 0;
      for (let c = 0; c < ref.cols; c++) s += ref.data[i * ref.cols + c] ** 2;
      expect(s).toBeCloseTo(1, 5);
    }
    // Signs are kept by the shuffle and by the scaling: column sign counts match the original.
    for (let c = 0; c < easy.cols; c++) {
      let a = 0, b = 0;
      for (let i = 0; i < easy.rows; i++) { if (easy.data[i * easy.cols + c] > 0) a++; if (ref.data[i * ref.cols + c] > 0) b++; }
      expect(b).toBe(a);
    }
  });

  it('samples distinct rows in ascending order, all rows when the size is larger', () => {
    const s = sampleRows(1000, 100, seededRandom(3));
    expect(new Set(s).size).toBe(100);
    expect(Array.from(s)).toEqual(Array.from(s).sort((a, b) => a - b));
    expect(sampleRows(5, 10).length).toBe(5);
  });
});
