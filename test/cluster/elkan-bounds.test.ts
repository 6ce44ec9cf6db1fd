import { describe, expect, it } from 'vitest';
import { elkanAssignRange, elkanBounds, elkanCentroidGaps, elkanFits, elkanShift, elkanStartFromLabels } from '../../server/cluster/elkan-bounds.js';
import { randomNormal, seededRandom, type Random } from '../../server/common/random.js';

// Check: Elkan (ICML 2003) claims the bounds skip only comparisons that cannot change the
// assignment, so every pass must agree with a brute-force nearest-centroid scan (the definition).

function unitRows(n: number, d: number, random: Random, clusters = 0): Float64Array {
  const x = new Float64Array(n * d);
  const centres = Array.from({ length: clusters }, () => Array.from({ length: d }, () => randomNormal(random)));
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let a = 0; a < d; a++) {
      const v = randomNormal(random) + (clusters ? 3 * centres[i % clusters][a] : 0);
      x[i * d + a] = v;
      s += v * v;
    }
    for (let a = 0; a < d; a++) x[i * d + a] /= Math.sqrt(s);
  }
  return x;
}

function nearest(x: Float64Array, i: number, c: Float64Array, k: number, d: number): { label: number; cos: number } {
  let label = -1;
  let cos = -Infinity;
  for (let j = 0; j < k; j++) {
    let s = 0;
    for (let a = 0; a < d; a++) s += x[i * d + a] * c[j * d + a];
    if (s > cos) { cos = s; label = j; }
  }
  return { label, cos };
}

/** Every row's own centroid is as similar as the best one (ties within rounding are fine). */
function expectNearest(x: Float64Array, labels: Int32Array, c: Float64Array, n: number, k: number, d: number): void {
  let worst = -Infinity;
  for (let i = 0; i < n; i++) {
    const best = nearest(x, i, c, k, d);
    let own = 0;
    for (let a = 0; a < d; a++) own += x[i * d + a] * c[labels[i] * d + a];
    worst = Math.max(worst, best.cos - own);
  }
  expect(worst).toBeLessThanOrEqual(1e-12);
}

/** Moves each centroid a little (some not at all), renormalises, and returns the chord shifts. */
function nudge(c: Float64Array, k: number, d: number, random: Random, scale: number): Float64Array {
  const shift = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    if (j % 3 === 0) continue;
    const old = c.slice(j * d, (j + 1) * d);
    let s = 0;
    for (let a = 0; a < d; a++) { c[j * d + a] += scale * randomNormal(random); s += c[j * d + a] ** 2; }
    let dot = 0;
    for (let a = 0; a < d; a++) { c[j * d + a] /= Math.sqrt(s); dot += old[a] * c[j * d + a]; }
    shift[j] = Math.sqrt(Math.max(0, 2 - 2 * dot));
  }
  return shift;
}

describe('Elkan bounds on the unit sphere', () => {
  it('matches a brute-force scan on the first pass and after centroids move', () => {
    const random = seededRandom(5);
    const n = 600, d = 12, k = 9;
    const x = unitRows(n, d, random, 6);
    const c = unitRows(k, d, random);
    const b = elkanBounds(n, k);
    elkanCentroidGaps(d, k, c, b);
    const moved = elkanAssignRange(x, d, k, c, b, 0, n);
    expect(moved).toBe(n);
    for (let i = 0; i < n; i++) expect(b.labels[i]).toBe(nearest(x, i, c, k, d).label);
    for (let round = 0; round < 6; round++) {
      const shift = nudge(c, k, d, random, 0.05 * (round + 1));
      elkanShift(n, k, shift, b, false);
      // The loosened bounds stay bounds: no lower bound above, no upper bound below, the truth.
      let worstLower = -Infinity;
      let worstUpper = -Infinity;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < k; j++) {
          let s = 0;
          for (let a = 0; a < d; a++) s += x[i * d + a] * c[j * d + a];
          const chord = Math.sqrt(Math.max(0, 2 - 2 * s));
          worstLower = Math.max(worstLower, b.lower[i * k + j] - chord);
          if (j === b.labels[i]) worstUpper = Math.max(worstUpper, chord - b.upper[i]);
        }
      }
      expect(worstLower).toBeLessThanOrEqual(1e-12);
      expect(worstUpper).toBeLessThanOrEqual(1e-12);
      elkanCentroidGaps(d, k, c, b);
      elkanAssignRange(x, d, k, c, b, 0, n);
      expectNearest(x, b.labels, c, n, k, d);
    }
  });

  it('starts exactly from any labels, even deliberately wrong ones', () => {
    const random = seededRandom(8);
    const n = 400, d = 10, k = 7;
    const x = unitRows(n, d, random, 5);
    const c = unitRows(k, d, random);
    const wrong = Int32Array.from({ length: n }, (_, i) => (nearest(x, i, c, k, d).label + 1 + (i % (k - 1))) % k);
    const b = elkanBounds(n, k);
    elkanCentroidGaps(d, k, c, b);
    elkanStartFromLabels(x, d, k, c, b, wrong, 0, n);
    elkanAssignRange(x, d, k, c, b, 0, n);
    for (let i = 0; i < n; i++) expect(b.labels[i]).toBe(nearest(x, i, c, k, d).label);
  });

  it('drops every bound after a reset, and is used only while n·k fits the limit', () => {
    const b = elkanBounds(3, 2);
    b.upper.fill(0.5);
    b.lower.fill(0.25);
    elkanShift(3, 2, new Float64Array(2), b, true);
    expect(Array.from(b.upper)).toEqual([Infinity, Infinity, Infinity]);
    expect(Array.from(b.lower)).toEqual([0, 0, 0, 0, 0, 0]);
    expect(elkanFits(1000, 10, 10_000)).toBe(true);
    expect(elkanFits(1001, 10, 10_000)).toBe(false);
    expect(elkanFits(1000, 1)).toBe(false);
  });
});
