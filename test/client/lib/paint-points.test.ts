import { describe, expect, it } from 'vitest';
import { MAP_BACKGROUND, paintPoints, styleColours, type FrameInput } from '../../../client/lib/paint-points.js';
import type { ThemeStyle } from '../../../client/lib/palette.js';
import { bucketByStyle } from '../../../client/lib/point-buckets.js';
import { mixOver, packRgb } from '../../../client/lib/point-raster.js';

const red: ThemeStyle = { color: '#FF0000', rgb: [255, 0, 0], marker: 'dot' };
const blue: ThemeStyle = { color: '#0000FF', rgb: [0, 0, 255], marker: 'dot' };
const W = 12, H = 12;

function frame(extra: Partial<FrameInput> = {}): FrameInput {
  const styleOf = Int32Array.from([0, 1, 1]);
  return {
    xs: Float32Array.from([2, 8, 50]),
    ys: Float32Array.from([2, 8, 2]),
    buckets: bucketByStyle(styleOf, 2),
    styles: [red, blue],
    focus: -1,
    matches: null,
    selected: null,
    hovered: -1,
    size: 3,
    dpr: 1,
    ...extra,
  };
}
// Data (x, y) lands on pixel (x, 11 − y): one device pixel per data unit, y flipped.
const placement = { k: 1, ox: 0.5, oy: 11.5 };
const at = (px: Uint32Array, x: number, y: number) => px[(11 - y) * W + x];

describe('paintPoints', () => {
  it('paints each point in its theme colour on the background, and skips points off the buffer', () => {
    const px = new Uint32Array(W * H);
    paintPoints(px, W, H, frame(), placement, styleColours([red, blue]));
    expect(at(px, 2, 2)).toBe(packRgb([255, 0, 0]));
    expect(at(px, 8, 8)).toBe(packRgb([0, 0, 255]));
    expect(at(px, 5, 5)).toBe(packRgb(MAP_BACKGROUND));
    // 2 points × 3 × 3 pixels painted; the third point (x = 50) is outside.
    expect(px.filter((v) => v !== packRgb(MAP_BACKGROUND)).length).toBe(18);
  });

  it('dims the other themes when one is in focus and draws the focused one larger', () => {
    const px = new Uint32Array(W * H);
    paintPoints(px, W, H, frame({ focus: 1 }), placement, styleColours([red, blue]));
    expect(at(px, 2, 2)).toBe(mixOver([255, 0, 0], MAP_BACKGROUND, 0.22));
    expect(at(px, 8, 8)).toBe(packRgb([0, 0, 255]));
    expect(px.filter((v) => v === packRgb([0, 0, 255])).length).toBe(16);
  });

  it('rings selected and hovered points around the marker, leaving its centre', () => {
    const px = new Uint32Array(W * H);
    paintPoints(px, W, H, frame({ selected: Uint8Array.from([1, 0, 0]) }), placement, styleColours([red, blue]));
    const ring = packRgb([0, 114, 178]);
    expect(at(px, 2, 2)).toBe(packRgb([255, 0, 0]));
    // The selection ring (side 7, width 2) passes through (−1 .. 5) around x = 2; its inner edge at x = 5.
    expect(at(px, 5, 2)).toBe(ring);
    const hovered = new Uint32Array(W * H);
    paintPoints(hovered, W, H, frame({ hovered: 1 }), placement, styleColours([red, blue]));
    expect(at(hovered, 8, 8)).toBe(packRgb([0, 0, 255]));
    expect(hovered.filter((v) => v === packRgb([31, 35, 38])).length).toBeGreaterThan(0);
  });
});
