import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { adjustedRandIndex, normalizedMutualInformation } from '../../server/cluster/agreement.js';

interface Fixture { agreement: { a: number[]; b: number[]; ari: number; nmi: number }[] }
// Reference: scikit-learn adjusted_rand_score / normalized_mutual_info_score (test/reference/cluster-measures.py).
const fixture = JSON.parse(readFileSync(new URL('../fixtures/cluster-measures.json', import.meta.url), 'utf8')) as Fixture;

describe('adjustedRandIndex', () => {
  it('matches the hand computation from the formula of Hubert & Arabie (1985)', () => {
    // Contingency [[2,1,0],[0,1,2]]: Σ C(nij,2) = 2, Σ C(ai,2) = 6, Σ C(bj,2) = 3, C(6,2) = 15.
    // Expected index 6·3/15 = 1.2, maximum (6+3)/2 = 4.5 → ARI = (2 − 1.2)/(4.5 − 1.2) = 8/33.
    expect(adjustedRandIndex([0, 0, 0, 1, 1, 1], [0, 0, 1, 1, 2, 2])).toBeCloseTo(8 / 33, 14);
  });

  it("equals scikit-learn's adjusted_rand_score on the fixtures, edge cases included", () => {
    for (const c of fixture.agreement) expect(Math.abs(adjustedRandIndex(c.a, c.b) - c.ari)).toBeLessThan(1e-12);
  });

  it('is symmetric and ignores label names', () => {
    const a = [0, 0, 1, 1, 2, 2, 2];
    const b = [1, 1, 1, 0, 0, 2, 2];
    const renamed = b.map((v) => [7, 3, 5][v]);
    expect(adjustedRandIndex(a, b)).toBeCloseTo(adjustedRandIndex(b, a), 14);
    expect(adjustedRandIndex(a, renamed)).toBeCloseTo(adjustedRandIndex(a, b), 14);
  });

  it('refuses labelings of different lengths', () => {
    expect(() => adjustedRandIndex([0, 1], [0])).toThrow(RangeError);
  });
});

describe('normalizedMutualInformation', () => {
  it("equals scikit-learn's normalized_mutual_info_score (arithmetic mean) on the fixtures", () => {
    for (const c of fixture.agreement) expect(Math.abs(normalizedMutualInformation(c.a, c.b) - c.nmi)).toBeLessThan(1e-12);
  });

  it('matches a hand computation: two independent halves give 0, identical partitions give 1', () => {
    // a splits {1,2 | 3,4}, b splits {1,3 | 2,4}: every cell holds 1 = 4·(1/2)(1/2), so I(a;b) = 0.
    expect(normalizedMutualInformation([0, 0, 1, 1], [0, 1, 0, 1])).toBe(0);
    expect(normalizedMutualInformation([0, 0, 1, 2], [4, 4, 0, 9])).toBeCloseTo(1, 14);
  });
});
