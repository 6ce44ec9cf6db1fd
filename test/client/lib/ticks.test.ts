import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fmt, niceTicks, pct } from '../../../client/lib/ticks.js';

describe('niceTicks', () => {
  // Heckbert, "Nice numbers for graph labels" (Graphics Gems, 1990): steps are 1, 2 or 5 × 10ⁿ.
  it('covers the range with evenly spaced 1-2-5 steps', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 1e-3, max: 1e4, noNaN: true }), fc.integer({ min: 2, max: 10 }), (lo, span, count) => {
        const hi = lo + span;
        const t = niceTicks(lo, hi, count);
        const step = t[1] - t[0];
        // Ticks are rounded to the step's decimals, so allow a sliver of the step.
        expect(t[0]).toBeLessThanOrEqual(lo + step * 1e-9);
        expect(t[t.length - 1]).toBeGreaterThanOrEqual(hi - step * 1e-9);
        const mant = step / 10 ** Math.floor(Math.log10(step));
        expect([1, 2, 5, 10].some((m) => Math.abs(mant - m) < 1e-6)).toBe(true);
        for (let i = 2; i < t.length; i++) expect(t[i] - t[i - 1]).toBeCloseTo(step, 6);
      }),
      { numRuns: 300 },
    );
  });

  it('gives the familiar ticks for 0..1 and a silhouette range', () => {
    expect(niceTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(niceTicks(0, 0.37, 4)).toEqual([0, 0.1, 0.2, 0.3, 0.4]);
  });

  it('widens an empty range instead of dividing by zero', () => {
    expect(niceTicks(3, 3).length).toBeGreaterThan(1);
  });

  it('refuses infinite bounds', () => {
    expect(() => niceTicks(0, Infinity)).toThrow(RangeError);
  });
});

describe('fmt and pct', () => {
  it('show a dash for missing values', () => {
    expect(fmt(null)).toBe('—');
    expect(fmt(NaN)).toBe('—');
    expect(pct(undefined)).toBe('—');
  });
  it('round to the asked decimals', () => {
    expect(fmt(0.12345, 3)).toBe('0.123');
    expect(pct(0.905, 1)).toBe('90.5%');
  });
});
