import { describe, expect, it } from 'vitest';
import { mixOver, packRgb, stampMarker } from '../../../client/lib/point-raster.js';

/** The buffer as rows of '#' (colour) and '.' (background), for hand-drawn expectations. */
function picture(buf: Uint32Array, w: number): string[] {
  const rows: string[] = [];
  for (let y = 0; y < buf.length / w; y++) rows.push(Array.from(buf.subarray(y * w, (y + 1) * w), (v) => (v ? '#' : '.')).join(''));
  return rows;
}

describe('point raster', () => {
  it('packs colours in the byte order of ImageData on little-endian machines', () => {
    const px = new Uint32Array([packRgb([0x11, 0x22, 0x33])]);
    expect(Array.from(new Uint8ClampedArray(px.buffer))).toEqual([0x11, 0x22, 0x33, 0xff]);
  });

  it('mixes a colour over a background like alpha blending', () => {
    const px = new Uint32Array([mixOver([0, 0, 0], [255, 255, 255], 0.25)]);
    expect(Array.from(new Uint8ClampedArray(px.buffer))).toEqual([191, 191, 191, 255]);
  });

  it('draws each marker shape as drawn by hand', () => {
    const draw = (marker: 'dot' | 'ring' | 'cross' | 'diamond') => {
      const buf = new Uint32Array(7 * 7);
      stampMarker(buf, 7, 7, 3.5, 3.5, 5, marker, 1);
      return picture(buf, 7);
    };
    expect(draw('dot')).toEqual(['.......', '.#####.', '.#####.', '.#####.', '.#####.', '.#####.', '.......']);
    expect(draw('ring')).toEqual(['.......', '.#####.', '.#...#.', '.#...#.', '.#...#.', '.#####.', '.......']);
    expect(draw('cross')).toEqual(['.......', '...#...', '...#...', '.#####.', '...#...', '...#...', '.......']);
    expect(draw('diamond')).toEqual(['.......', '...#...', '..###..', '.#####.', '..###..', '...#...', '.......']);
  });

  it('clips markers at the buffer edges instead of wrapping to the next row', () => {
    const buf = new Uint32Array(5 * 3);
    stampMarker(buf, 5, 3, 0, 1, 3, 'dot', 1);
    expect(picture(buf, 5)).toEqual(['##...', '##...', '##...']);
    stampMarker(buf, 5, 3, 100, 100, 3, 'dot', 1);
    expect(picture(buf, 5)).toEqual(['##...', '##...', '##...']);
  });
});
