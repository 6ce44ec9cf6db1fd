import { describe, expect, it } from 'vitest';
import { clusterTermCounts, distinctiveTerms, logOddsZ } from '../../server/cluster/distinctive-terms.js';
import type { Csr } from '../../server/common/matrix.js';

/** A CSR matrix from rows of column indices (value 1 at each). */
function csrFromColumns(rows: number[][], cols: number): Csr {
  const indptr = new Uint32Array(rows.length + 1);
  rows.forEach((r, i) => (indptr[i + 1] = indptr[i] + r.length));
  return { rows: rows.length, cols, indptr, indices: Uint32Array.from(rows.flat()), values: new Float32Array(indptr[rows.length]).fill(0.5) };
}

describe('logOddsZ', () => {
  it('matches a hand computation of Monroe, Colaresi & Quinn (2008) eqs. 16, 18 and 22', () => {
    // Source: Monroe, Colaresi & Quinn, "Fightin' Words", Political Analysis 16(4), 2008, §3.5.
    // Three terms; group counts y_i = [3, 1, 0], corpus counts y = [4, 2, 4] (n = 10, n_i = 4, n_j = 6);
    // prior α₀ = 10 so α_w = α₀·y_w/n = [4, 2, 4].
    // Term 0: y_i = 3, y_j = 1, α = 4.
    //   δ = ln((3+4)/(4+10−3−4)) − ln((1+4)/(6+10−1−4)) = ln(7/7) − ln(5/11) = ln(11/5)
    //   σ² = 1/(3+4) + 1/(1+4) = 12/35;  z = ln(11/5)/√(12/35) ≈ 1.34655
    // Term 2: y_i = 0, y_j = 4, α = 4.
    //   δ = ln(4/(4+10−0−4)) − ln(8/(6+10−4−4)) = ln(4/10) − ln(8/8) = ln(2/5)
    //   σ² = 1/4 + 1/8 = 3/8;  z = ln(2/5)/√(3/8) ≈ −1.49630
    const z = logOddsZ([3, 1, 0], [4, 2, 4], 10);
    expect(z[0]).toBeCloseTo(Math.log(11 / 5) / Math.sqrt(12 / 35), 12);
    expect(z[0]).toBeCloseTo(1.34655, 4);
    expect(z[2]).toBeCloseTo(Math.log(2 / 5) / Math.sqrt(3 / 8), 12);
    expect(z[2]).toBeCloseTo(-1.4963, 4);
  });

  it('gives NaN for a term absent from the whole corpus and 0 for a term spread evenly', () => {
    // Even spread: group holds half of everything, term holds half of its count in the group.
    const z = logOddsZ([2, 2, 0], [4, 4, 0], 8);
    expect(z[0]).toBeCloseTo(0, 12);
    expect(Number.isNaN(z[2])).toBe(true);
  });
});

describe('clusterTermCounts', () => {
  it('counts documents containing each term per cluster, not weights', () => {
    const tfidf = csrFromColumns([[0, 1], [1], [1, 2], [2]], 3);
    tfidf.values[0] = 0.9; // weights do not matter, only presence
    const counts = clusterTermCounts(tfidf, new Int32Array([0, 0, 1, 1]), 2);
    expect(Array.from(counts)).toEqual([1, 2, 0, 0, 1, 2]);
  });
});

describe('distinctiveTerms', () => {
  it('lists over-represented terms first, as readable labels, and skips repeated labels and skipped clusters', () => {
    // Cluster 0 is about refunds, cluster 1 about passwords; "account" is everywhere.
    const labels = ['refund', 'account', 'password', 'Password', 'late'];
    const docs = [[0, 1, 4], [0, 1], [0, 1, 4], [1, 2, 3], [1, 2], [1, 2, 3], []];
    const tfidf = csrFromColumns(docs, 5);
    const counts = clusterTermCounts(tfidf, new Int32Array([0, 0, 0, 1, 1, 1, 2]), 3);
    const terms = distinctiveTerms(counts, 3, labels, 3, 5, (c) => c === 2);
    expect(terms[0].labels).toEqual(['refund', 'late']);
    expect(terms[1].labels).toEqual(['password', 'Password']);
    expect(terms[2].labels).toEqual([]);
    expect(terms[0].z[0]).toBeGreaterThan(terms[0].z[1]);
    const dup = distinctiveTerms(counts, 3, ['refund', 'account', 'pw', 'pw', 'late'], 3, 5);
    expect(dup[1].labels).toEqual(['pw']);
  });
});
