import { describe, expect, it } from 'vitest';
import { decisionEvidence } from '../../server/route/decision-evidence.js';
import { csrFromRows } from './csr-from-rows.js';

describe('decisionEvidence', () => {
  // Feature-major weights for 2 classes over 4 terms: [w(term, A), w(term, B)].
  const w = Float64Array.from([
    -1, -3, // term 0: log-ratio A:B = +2
    -2, -2, // term 1: neutral
    -3, -1, // term 2: favours B
    -1, -2, // term 3: log-ratio +1
  ]);
  const x = csrFromRows([[1, 4, 1, 3]]);

  it('lists the terms by count × log-ratio toward the chosen class, strongest first', () => {
    // term 3: 3 × 1 = 3; term 0: 1 × 2 = 2; term 1: 0; term 2: −2.
    expect(decisionEvidence(x, 0, w, 2, 0, 1, 5)).toEqual([3, 0]);
  });

  it('keeps only the asked number of terms', () => {
    expect(decisionEvidence(x, 0, w, 2, 0, 1, 1)).toEqual([3]);
  });

  it('argues the other way when the other class was chosen', () => {
    expect(decisionEvidence(x, 0, w, 2, 1, 0, 5)).toEqual([2]);
  });
});
