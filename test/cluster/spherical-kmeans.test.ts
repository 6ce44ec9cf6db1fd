import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { adjustedRandIndex } from '../../server/cluster/agreement.js';
import { sphericalKmeans, sphericalKmeansSteps } from '../../server/cluster/spherical-kmeans.js';
import type { Dense } from '../../server/common/matrix.js';
import { seededRandom } from '../../server/common/random.js';

interface Fixture {
  hard: { points: number[][]; k: number; inertia: number; sphericalObjectiveOfSklearnLabels: number };
  easy: { points: number[][]; k: number; planted: number[] };
}
// Reference: scikit-learn KMeans(n_init=10) on unit-normalised points (test/reference/cluster-kmeans.py).
const fixture = JSON.parse(readFileSync(new URL('../fixtures/cluster-kmeans.json', import.meta.url), 'utf8')) as Fixture;

function dense(points: number[][]): Dense {
  return { rows: points.length, cols: points[0].length, data: Float32Array.from(points.flat()) };
}

/** Σ‖x − mean(C)‖² of a partition: scikit-learn's inertia for the same labels. */
function euclideanSse(points: number[][], labels: Int32Array, k: number): number {
  const d = points[0].length;
  const sums = new Float64Array(k * d);
  const counts = new Float64Array(k);
  points.forEach((p, i) => { counts[labels[i]]++; p.forEach((v, a) => { sums[labels[i] * d + a] += v; }); });
  let sse = 0;
  points.forEach((p, i) => p.forEach((v, a) => { const t = v - sums[labels[i] * d + a] / counts[labels[i]]; sse += t * t; }));
  return sse;
}

describe('sphericalKmeans', () => {
  it('finds the planted partition of a well-separated fixture (ARI 1.0)', () => {
    const { points, k, planted } = fixture.easy;
    const r = sphericalKmeans(dense(points), k, { random: seededRandom(3) });
    expect(adjustedRandIndex(planted, r.labels)).toBe(1);
  });

  it("gets within 1 % of scikit-learn's KMeans objective on a harder fixture", () => {
    const { points, k, inertia, sphericalObjectiveOfSklearnLabels } = fixture.hard;
    const r = sphericalKmeans(dense(points), k, { restarts: 10, random: seededRandom(1) });
    // On the unit sphere ‖x − c‖² = 2(1 − cos): our objective in squared-chord units.
    const ours = 2 * r.objective;
    console.log(`hard fixture: sheaf spherical objective ${ours.toFixed(3)} vs sklearn labels ${sphericalObjectiveOfSklearnLabels.toFixed(3)}; SSE ${euclideanSse(points, r.labels, k).toFixed(3)} vs sklearn inertia ${inertia.toFixed(3)}`);
    expect(ours).toBeLessThanOrEqual(1.01 * sphericalObjectiveOfSklearnLabels);
    expect(euclideanSse(points, r.labels, k)).toBeLessThanOrEqual(1.01 * inertia);
  });

  it('ends with every row at its most similar centroid (the bounds skip no needed comparison)', () => {
    const data = dense(fixture.hard.points);
    const { k } = fixture.hard;
    const r = sphericalKmeans(data, k, { restarts: 1, random: seededRandom(9) });
    const d = data.cols;
    for (let i = 0; i < data.rows; i++) {
      let best = -1, bestCos = -Infinity;
      for (let c = 0; c < k; c++) {
        let s = 0;
        for (let a = 0; a < d; a++) s += data.data[i * d + a] * r.centroids[c * d + a];
        if (s > bestCos + 1e-9) { bestCos = s; best = c; }
      }
      let own = 0;
      for (let a = 0; a < d; a++) own += data.data[i * d + a] * r.centroids[r.labels[i] * d + a];
      expect(own).toBeGreaterThanOrEqual(bestCos - 1e-6);
      expect(best).toBeGreaterThanOrEqual(0);
    }
  });

  it('gives the same result for the same seed', () => {
    const data = dense(fixture.hard.points);
    const a = sphericalKmeans(data, 7, { random: seededRandom(42) });
    const b = sphericalKmeans(data, 7, { random: seededRandom(42) });
    expect(Array.from(a.labels)).toEqual(Array.from(b.labels));
    expect(a.objective).toBe(b.objective);
  });

  it('keeps more restarts at least as good as fewer', () => {
    const data = dense(fixture.hard.points);
    const one = sphericalKmeans(data, 10, { restarts: 1, random: seededRandom(8) });
    const many = sphericalKmeans(data, 10, { restarts: 6, random: seededRandom(8) });
    expect(many.objective).toBeLessThanOrEqual(one.objective + 1e-9);
  });

  it('leaves no cluster empty when rows repeat, as long as k ≤ distinct rows', () => {
    const rows = [[1, 0], [1, 0], [1, 0], [0, 1], [0, 1], [0.6, 0.8]];
    const r = sphericalKmeans(dense(rows), 3, { random: seededRandom(1) });
    expect(new Set(r.labels).size).toBe(3);
    expect(r.labels[0]).toBe(r.labels[1]);
  });

  it('continues from given centroids and reports progress under its stage name', () => {
    const data = dense(fixture.easy.points);
    const first = sphericalKmeans(data, 5, { random: seededRandom(2) });
    const gen = sphericalKmeansSteps(data, 6, { initial: first.centroids, restarts: 1, stage: 'probe' });
    let steps = 0;
    let next = gen.next();
    while (!next.done) { expect(next.value.stage).toBe('probe'); steps++; next = gen.next(); }
    expect(steps).toBeGreaterThan(0);
    expect(adjustedRandIndex(fixture.easy.planted, next.value.labels)).toBe(1);
  });

  it('rejects k larger than the rows and a non-integer k with actionable messages', () => {
    const data = dense([[1, 0], [0, 1]]);
    expect(() => sphericalKmeans(data, 3)).toThrow(/choose k ≤ 2/);
    expect(() => sphericalKmeans(data, 1.5)).toThrow(RangeError);
  });
});

describe('sphericalKmeans bounds and warm starts', () => {
  it('gives the same clustering with per-centroid bounds (Elkan) as with one bound per row (Hamerly)', () => {
    const data = dense(fixture.hard.points);
    const a = sphericalKmeans(data, 7, { restarts: 2, random: seededRandom(4) });
    const b = sphericalKmeans(data, 7, { restarts: 2, maxBoundPairs: 0, random: seededRandom(4) });
    expect(Array.from(a.labels)).toEqual(Array.from(b.labels));
    expect(a.iterations).toBe(b.iterations);
    expect(Math.abs(a.objective - b.objective)).toBeLessThan(1e-9);
  });

  it("gives the same clustering from the previous run's labels as without them, one k up", () => {
    const data = dense(fixture.hard.points);
    const previous = sphericalKmeans(data, 5, { restarts: 1, random: seededRandom(6) });
    expect(previous.iterations).toBeLessThan(100);
    const plain = sphericalKmeans(data, 6, { restarts: 1, initial: previous.centroids, random: seededRandom(2) });
    const hinted = sphericalKmeans(data, 6, { restarts: 1, initial: previous.centroids, initialLabels: previous.labels, random: seededRandom(2) });
    expect(Array.from(hinted.labels)).toEqual(Array.from(plain.labels));
    expect(hinted.iterations).toBe(plain.iterations);
    expect(Math.abs(hinted.objective - plain.objective)).toBeLessThan(1e-9);
  });

  it('rejects initial labels of the wrong length or naming a centroid that was not given', () => {
    const data = dense(fixture.hard.points);
    const previous = sphericalKmeans(data, 3, { restarts: 1, random: seededRandom(6) });
    expect(() => sphericalKmeans(data, 4, { initial: previous.centroids, initialLabels: previous.labels.subarray(1) })).toThrow(/initialLabels has \d+ entries/);
    const bad = Int32Array.from(previous.labels);
    bad[0] = 3;
    expect(() => sphericalKmeans(data, 4, { initial: previous.centroids, initialLabels: bad })).toThrow(/one of the 3 initial centroids/);
    expect(() => sphericalKmeans(data, 4, { maxBoundPairs: -1 })).toThrow(/maxBoundPairs/);
  });
});
