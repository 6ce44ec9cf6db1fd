import { describe, expect, it } from 'vitest';
import { OKABE_ITO, contrastRatio, hexToRgb, inkOn, relativeLuminance, themeStyle } from '../../../client/lib/palette.js';

describe('palette', () => {
  // Source: Okabe & Ito, "Color Universal Design" (2002, revised 2008); hex values from memory.
  it('holds the eight Okabe–Ito colours', () => {
    expect([...OKABE_ITO]).toEqual(['#000000', '#E69F00', '#56B4E9', '#009E73', '#F0E442', '#0072B2', '#D55E00', '#CC79A7']);
  });

  it('uses each of the eight hues once, unchanged, for the first eight themes', () => {
    const first = Array.from({ length: 8 }, (_, i) => themeStyle(i));
    expect(new Set(first.map((s) => s.color)).size).toBe(8);
    for (const s of first) {
      expect(OKABE_ITO as readonly string[]).toContain(s.color);
      expect(s.marker).toBe('dot');
    }
  });

  it('never gives two of the first 32 themes the same colour and marker', () => {
    const keys = Array.from({ length: 32 }, (_, i) => {
      const s = themeStyle(i);
      return `${s.color}/${s.marker}`;
    });
    expect(new Set(keys).size).toBe(32);
    expect(new Set(Array.from({ length: 32 }, (_, i) => themeStyle(i).color)).size).toBe(32);
  });

  it('refuses a negative or fractional theme index', () => {
    expect(() => themeStyle(-1)).toThrow(RangeError);
    expect(() => themeStyle(1.5)).toThrow(RangeError);
  });

  // Source: WCAG 2.1, definitions of "relative luminance" and "contrast ratio" (W3C, 2018).
  it('computes WCAG relative luminance and contrast', () => {
    expect(relativeLuminance([255, 255, 255])).toBeCloseTo(1, 12);
    expect(relativeLuminance([0, 0, 0])).toBe(0);
    expect(contrastRatio([0, 0, 0], [255, 255, 255])).toBeCloseTo(21, 12);
    // #777777 on white is the usual example just under the 4.5:1 AA limit (from memory: 4.48).
    expect(contrastRatio(hexToRgb('#777777'), [255, 255, 255])).toBeCloseTo(4.48, 2);
  });

  it('chooses the more legible of black and white ink', () => {
    expect(inkOn([255, 255, 255])).toBe('#000000');
    expect(inkOn([0, 114, 178])).toBe('#FFFFFF');
    expect(inkOn(hexToRgb('#F0E442'))).toBe('#000000');
  });

  it('rejects colours that are not #rrggbb', () => {
    expect(() => hexToRgb('red')).toThrow(TypeError);
  });
});
