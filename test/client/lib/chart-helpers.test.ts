import { describe, expect, it } from 'vitest';
import { heatColour, nearestThresholdPoint } from '../../../client/lib/chart-helpers.js';

describe('chart helpers', () => {
  it('shades from white at 0 to Okabe–Ito blue at 1, clamping outside', () => {
    expect(heatColour(0)).toEqual([255, 255, 255]);
    expect(heatColour(1)).toEqual([0, 114, 178]);
    expect(heatColour(2)).toEqual([0, 114, 178]);
    expect(heatColour(0.5)).toEqual([128, 185, 217]);
  });

  it('reads the measured point closest to a threshold', () => {
    const curve = [
      { threshold: 0.2, precision: 0.7, coverage: 1 },
      { threshold: 0.5, precision: 0.85, coverage: 0.8 },
      { threshold: 0.9, precision: 0.97, coverage: 0.3 },
    ];
    expect(nearestThresholdPoint(curve, 0.6)).toEqual(curve[1]);
    expect(nearestThresholdPoint(curve, 1)).toEqual(curve[2]);
    expect(nearestThresholdPoint([], 0.5)).toBeNull();
  });
});
