import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { abstainThreshold, thinThresholdCurve } from '../../server/route/abstain-threshold.js';

describe('abstainThreshold', () => {
  // Hand-computed: confidences 0.95 ✓, 0.9 ✓, 0.8 ✓, 0.8 ✗, 0.7 ✓, 0.6 ✗, 0.5 ✗.
  const conf = [0.5, 0.95, 0.8, 0.7, 0.9, 0.8, 0.6];
  const ok = [0, 1, 1, 1, 1, 0, 0];

  it('picks the lowest confidence whose decisions at or above it reach the target', () => {
    // ≥0.95: 1/1; ≥0.9: 2/2; ≥0.8: 3/4; ≥0.7: 4/5 = 0.8; ≥0.6: 4/6; ≥0.5: 4/7.
    const t = abstainThreshold(conf, ok, 0.8).threshold;
    expect(t).toEqual({ value: 0.7, targetPrecision: 0.8, precision: 0.8, coverage: 5 / 7, reached: true });
    expect(abstainThreshold(conf, ok, 0.9).threshold.value).toBe(0.9);
  });

  it('treats tied confidences as one decision point', () => {
    const { curve } = abstainThreshold(conf, ok, 0.8);
    expect(curve.map((p) => p.threshold)).toEqual([0.95, 0.9, 0.8, 0.7, 0.6, 0.5]);
    expect(curve[2]).toEqual({ threshold: 0.8, precision: 0.75, coverage: 4 / 7 });
  });

  it('says so when the target cannot be reached, and keeps the highest confidence', () => {
    const t = abstainThreshold([0.9, 0.6, 0.4], [0, 1, 1], 0.9).threshold;
    expect(t.reached).toBe(false);
    expect(t.value).toBe(0.9);
    expect(t.precision).toBe(0);
  });

  it('covers everything when every decision is right', () => {
    expect(abstainThreshold([0.3, 0.6], [1, 1], 1).threshold).toMatchObject({ value: 0.3, coverage: 1, reached: true });
  });

  it('rejects an empty set or a target outside (0, 1]', () => {
    expect(() => abstainThreshold([], [], 0.9)).toThrow(/held-out/);
    expect(() => abstainThreshold([0.5], [1], 0)).toThrow(/targetPrecision/);
    expect(() => abstainThreshold([0.5], [1], 1.5)).toThrow(RangeError);
  });

  it('thins a long curve to at most the asked points, keeping the ends and the chosen threshold', () => {
    const n = 5000;
    const c = Array.from({ length: n }, (_, i) => 1 - i / n);
    const r = Array.from({ length: n }, (_, i) => (i % 10 === 0 ? 0 : 1));
    const choice = abstainThreshold(c, r, 0.85);
    const thin = thinThresholdCurve(choice.curve, 100, choice.threshold.value);
    expect(thin.length).toBeLessThanOrEqual(100);
    expect(thin[0]).toEqual(choice.curve[0]);
    expect(thin[thin.length - 1]).toEqual(choice.curve[choice.curve.length - 1]);
    expect(thin.some((p) => p.threshold === choice.threshold.value)).toBe(true);
  });
});

describe('abstainThreshold properties', () => {
  it('always picks the lowest curve point reaching the target, and reports its precision and coverage', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 20 }), fc.boolean()), { minLength: 1, maxLength: 80 }),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        (pairs, target) => {
          const conf = pairs.map((p) => p[0] / 20), ok = pairs.map((p) => (p[1] ? 1 : 0));
          const { threshold, curve } = abstainThreshold(conf, ok, target);
          const kept = conf.map((c, i) => [c, ok[i]] as const).filter(([c]) => c >= threshold.value);
          expect(threshold.coverage).toBeCloseTo(kept.length / conf.length, 12);
          expect(threshold.precision).toBeCloseTo(kept.reduce((s, [, o]) => s + o, 0) / kept.length, 12);
          const reaching = curve.filter((p) => p.precision >= target);
          expect(threshold.reached).toBe(reaching.length > 0);
          if (threshold.reached) expect(threshold.value).toBe(Math.min(...reaching.map((p) => p.threshold)));
          else expect(threshold.value).toBe(Math.max(...conf));
        },
      ),
      { seed: 7, numRuns: 300 },
    );
  });
});
