/**
 * Draws map markers straight into a 32-bit pixel buffer that is then put on the canvas in one
 * call. Without a GPU, Chromium's canvas fills tens of thousands of small shapes slowly (hundreds
 * of milliseconds per frame for 50,000 points, see bench/map-frames.ts); writing the few pixels of
 * each marker ourselves costs a few milliseconds.
 *
 * Pixels are packed as the bytes of ImageData read through a little-endian Uint32Array:
 * `0xAABBGGRR`.
 */
import type { Marker } from './palette.js';

/**
 * Packs an opaque colour for a little-endian RGBA pixel buffer.
 * @param rgb channels in 0..255
 */
export function packRgb(rgb: readonly [number, number, number]): number {
  return ((255 << 24) | (rgb[2] << 16) | (rgb[1] << 8) | rgb[0]) >>> 0;
}

/**
 * A colour seen at partial opacity over a background, as an opaque packed pixel (dimmed themes
 * are drawn this way: same look as alpha blending on a plain background, no blending cost).
 * @param rgb foreground channels
 * @param bg background channels
 * @param alpha foreground opacity 0..1
 */
export function mixOver(rgb: readonly [number, number, number], bg: readonly [number, number, number], alpha: number): number {
  const a = Math.max(0, Math.min(1, alpha));
  return packRgb([0, 1, 2].map((c) => Math.round(bg[c] + (rgb[c] - bg[c]) * a)) as [number, number, number]);
}

/**
 * Writes one marker centred on (cx, cy) into a pixel buffer, clipped to its edges.
 * @param buf pixels, row-major, `width × height`
 * @param width buffer width in pixels
 * @param height buffer height in pixels
 * @param cx centre x in pixels
 * @param cy centre y in pixels
 * @param size marker width in pixels (≥ 1)
 * @param marker shape: filled square (`dot`), square outline (`ring`), plus (`cross`), filled diamond
 * @param colour packed pixel
 * @param stroke outline width in pixels for `ring` and `cross`
 */
export function stampMarker(
  buf: Uint32Array,
  width: number,
  height: number,
  cx: number,
  cy: number,
  size: number,
  marker: Marker,
  colour: number,
  stroke = 1,
): void {
  const s = Math.max(1, Math.round(size));
  const x0 = Math.round(cx - s / 2);
  const y0 = Math.round(cy - s / 2);
  if (x0 >= width || y0 >= height || x0 + s <= 0 || y0 + s <= 0) return;
  const xa = Math.max(0, x0), xb = Math.min(width, x0 + s);
  const ya = Math.max(0, y0), yb = Math.min(height, y0 + s);
  const w = Math.max(1, Math.round(stroke));
  switch (marker) {
    case 'dot':
      for (let y = ya; y < yb; y++) buf.fill(colour, y * width + xa, y * width + xb);
      return;
    case 'ring':
      for (let y = ya; y < yb; y++) {
        const edgeRow = y - y0 < w || y0 + s - 1 - y < w;
        if (edgeRow) buf.fill(colour, y * width + xa, y * width + xb);
        else {
          for (let x = xa; x < Math.min(xb, x0 + w); x++) buf[y * width + x] = colour;
          for (let x = Math.max(xa, x0 + s - w); x < xb; x++) buf[y * width + x] = colour;
        }
      }
      return;
    case 'cross': {
      const mid0 = x0 + Math.floor((s - w) / 2), midY0 = y0 + Math.floor((s - w) / 2);
      for (let y = ya; y < yb; y++) {
        if (y >= midY0 && y < midY0 + w) buf.fill(colour, y * width + xa, y * width + xb);
        else for (let x = Math.max(xa, mid0); x < Math.min(xb, mid0 + w); x++) buf[y * width + x] = colour;
      }
      return;
    }
    case 'diamond': {
      const r = (s - 1) / 2;
      const mx = x0 + r, my = y0 + r;
      for (let y = ya; y < yb; y++) {
        const half = r - Math.abs(y - my);
        const xl = Math.max(xa, Math.ceil(mx - half - 0.01)), xr = Math.min(xb - 1, Math.floor(mx + half + 0.01));
        if (xr >= xl) buf.fill(colour, y * width + xl, y * width + xr + 1);
      }
      return;
    }
  }
}
