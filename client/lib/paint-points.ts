/**
 * Paints one frame of the map into a pixel buffer: every point as its theme's marker, the focused
 * theme last and larger (others dimmed), then rings for search matches, the selection and the
 * hovered point. Pure: the map element owns the canvas and puts the buffer on it.
 */
import type { ThemeStyle } from './palette.js';
import { mixOver, packRgb, stampMarker } from './point-raster.js';

/** Map background (#FCFCFA) as channels. */
export const MAP_BACKGROUND: [number, number, number] = [252, 252, 250];
const BACKGROUND = packRgb(MAP_BACKGROUND);
const INK = packRgb([31, 35, 38]);
const SELECTED = packRgb([0, 114, 178]);
/** Opacity a theme keeps while another is in focus (common practice: faint but still findable). */
const DIM_ALPHA = 0.22;

/** Screen placement: device pixel = data × k + offset (y flipped). */
export interface Placement {
  k: number;
  ox: number;
  oy: number;
}

/** What one frame shows. */
export interface FrameInput {
  xs: Float32Array;
  ys: Float32Array;
  /** Points grouped by style (see bucketByStyle). */
  buckets: { order: Uint32Array; start: Uint32Array };
  styles: readonly ThemeStyle[];
  /** Style drawn on top and the others dimmed, or -1. */
  focus: number;
  matches: Uint8Array | null;
  selected: Uint8Array | null;
  hovered: number;
  /** Marker size in device pixels. */
  size: number;
  /** Device pixels per CSS pixel (ring widths scale with it). */
  dpr: number;
}

/**
 * Packed colours per style, full and dimmed.
 * @param styles draw styles
 */
export function styleColours(styles: readonly ThemeStyle[]): { full: Uint32Array; dim: Uint32Array } {
  return {
    full: Uint32Array.from(styles, (s) => packRgb(s.rgb)),
    dim: Uint32Array.from(styles, (s) => mixOver(s.rgb, MAP_BACKGROUND, DIM_ALPHA)),
  };
}

function stampStyle(px: Uint32Array, W: number, H: number, f: FrameInput, p: Placement, st: number, size: number, colour: number): void {
  const { order, start } = f.buckets;
  const { xs, ys } = f;
  const { k, ox, oy } = p;
  const marker = f.styles[st].marker;
  if (marker !== 'dot') {
    for (let q = start[st]; q < start[st + 1]; q++) {
      const i = order[q];
      stampMarker(px, W, H, xs[i] * k + ox, oy - ys[i] * k, size, marker, colour, f.dpr);
    }
    return;
  }
  // The common case, inlined: a filled square of side s.
  const s = Math.max(1, Math.round(size));
  const half = s / 2;
  for (let q = start[st], end = start[st + 1]; q < end; q++) {
    const i = order[q];
    const x0 = Math.round(xs[i] * k + ox - half);
    const y0 = Math.round(oy - ys[i] * k - half);
    if (x0 >= W || y0 >= H || x0 + s <= 0 || y0 + s <= 0) continue;
    const xa = x0 < 0 ? 0 : x0, xb = x0 + s > W ? W : x0 + s;
    const ya = y0 < 0 ? 0 : y0, yb = y0 + s > H ? H : y0 + s;
    for (let y = ya; y < yb; y++) {
      const row = y * W;
      for (let x = xa; x < xb; x++) px[row + x] = colour;
    }
  }
}

function ringMask(px: Uint32Array, W: number, H: number, f: FrameInput, p: Placement, mask: Uint8Array, size: number, colour: number, stroke: number): void {
  const n = Math.min(mask.length, f.xs.length);
  for (let i = 0; i < n; i++) {
    if (mask[i]) stampMarker(px, W, H, f.xs[i] * p.k + p.ox, p.oy - f.ys[i] * p.k, size, 'ring', colour, stroke);
  }
}

/**
 * Paints a frame.
 * @param px pixel buffer, `width × height`, overwritten
 * @param width buffer width
 * @param height buffer height
 * @param f what to show
 * @param p where data lands on the buffer
 * @param colours from {@link styleColours} for `f.styles`
 */
export function paintPoints(px: Uint32Array, width: number, height: number, f: FrameInput, p: Placement, colours: { full: Uint32Array; dim: Uint32Array }): void {
  px.fill(BACKGROUND);
  const focus = f.focus >= 0 && f.focus < f.styles.length ? f.focus : -1;
  for (let st = 0; st < f.styles.length; st++) {
    if (st !== focus) stampStyle(px, width, height, f, p, st, f.size, focus >= 0 ? colours.dim[st] : colours.full[st]);
  }
  if (focus >= 0) stampStyle(px, width, height, f, p, focus, f.size + f.dpr, colours.full[focus]);
  if (f.matches) ringMask(px, width, height, f, p, f.matches, f.size + 3 * f.dpr, INK, f.dpr);
  if (f.selected) ringMask(px, width, height, f, p, f.selected, f.size + 4 * f.dpr, SELECTED, 2 * f.dpr);
  if (f.hovered >= 0 && f.hovered < f.xs.length) {
    const i = f.hovered;
    stampMarker(px, width, height, f.xs[i] * p.k + p.ox, p.oy - f.ys[i] * p.k, f.size + 6 * f.dpr, 'ring', INK, 2 * f.dpr);
  }
}
