import { describe, expect, it } from 'vitest';
import { classLogPosteriors, classPosteriors, rowArgmax } from '../../server/route/class-posteriors.js';

describe('classPosteriors', () => {
  it('turns log scores into probabilities that sum to one per row', () => {
    const p = classPosteriors(Float64Array.from([Math.log(1), Math.log(3), 0, 0]), 2);
    expect(p[0]).toBeCloseTo(0.25, 15);
    expect(p[1]).toBeCloseTo(0.75, 15);
    expect(p[2]).toBe(0.5);
  });

  it('does not underflow on very negative scores', () => {
    const p = classPosteriors(Float64Array.from([-1000, -1001]), 2);
    expect(p[0]).toBeCloseTo(1 / (1 + Math.exp(-1)), 12);
    const lp = classLogPosteriors(Float64Array.from([-1000, -1001]), 2);
    expect(Math.exp(lp[0]) + Math.exp(lp[1])).toBeCloseTo(1, 12);
  });

  it('finds the best class of each row, the first one on ties', () => {
    const label = new Int32Array(2), value = new Float64Array(2);
    rowArgmax(Float64Array.from([0.2, 0.5, 0.3, 0.4, 0.4, 0.2]), 3, label, value);
    expect(Array.from(label)).toEqual([1, 0]);
    expect(Array.from(value)).toEqual([0.5, 0.4]);
  });
});
