/**
 * Theme colours that stay distinguishable for people with the common colour-vision deficiencies.
 *
 * The eight hues are the Okabe–Ito set: M. Okabe and K. Ito, "Color Universal Design (CUD) — How
 * to make figures and presentations that are friendly to colorblind people", web page, 2002,
 * revised 2008 (hex values as published there, from memory). Beyond eight themes a hue repeats with a lightness step
 * and a different marker shape, so that no two of the first 32 themes share both colour and shape.
 */

/** The eight Okabe–Ito colours in their published order (black first). */
export const OKABE_ITO = [
  '#000000', // black
  '#E69F00', // orange
  '#56B4E9', // sky blue
  '#009E73', // bluish green
  '#F0E442', // yellow
  '#0072B2', // blue
  '#D55E00', // vermillion
  '#CC79A7', // reddish purple
] as const;

/**
 * The order themes take the hues in: strong, well-separated hues first; yellow (weak on a light
 * background) and black (reads as "ink", not as a category) last.
 */
const HUE_ORDER = [5, 1, 3, 6, 2, 7, 4, 0] as const;

/** Marker shapes, one per lightness tier. */
export type Marker = 'dot' | 'ring' | 'cross' | 'diamond';
const MARKERS: readonly Marker[] = ['dot', 'ring', 'cross', 'diamond'];
/** Lightness change per tier (negative darkens); tier 0 is the published colour. */
const TIER_SHIFT = [0, -0.35, 0.4, -0.6];
const BLACK_TIER_SHIFT = [0, 0.3, 0.55, 0.15];

/** How one theme is drawn. */
export interface ThemeStyle {
  /** CSS hex colour. */
  color: string;
  /** [r, g, b] in 0..255 (for canvas and contrast checks). */
  rgb: [number, number, number];
  marker: Marker;
}

/** Colour of the theme that holds documents with no usable words: a neutral grey, never a hue. */
export const NO_CONTENT_STYLE: ThemeStyle = { color: '#9B9B9B', rgb: [155, 155, 155], marker: 'ring' };

/**
 * Parses `#rrggbb`.
 * @param hex colour as six hex digits after `#`
 */
export function hexToRgb(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new TypeError(`expected a colour like #12ab9f, got ${JSON.stringify(hex)}`);
  const n = parseInt(m[1], 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

function toHex(rgb: [number, number, number]): string {
  return '#' + rgb.map((v) => Math.round(v).toString(16).padStart(2, '0')).join('').toUpperCase();
}

/** Moves a colour toward white (shift > 0) or black (shift < 0) by the given fraction. */
function shiftLightness(rgb: [number, number, number], shift: number): [number, number, number] {
  const target = shift > 0 ? 255 : 0;
  const t = Math.abs(shift);
  return [rgb[0] + (target - rgb[0]) * t, rgb[1] + (target - rgb[1]) * t, rgb[2] + (target - rgb[2]) * t].map(Math.round) as [
    number,
    number,
    number,
  ];
}

/**
 * The style of the theme at a position in the analysis's theme list.
 * @param index 0-based position of the theme (stable for the life of the analysis)
 */
export function themeStyle(index: number): ThemeStyle {
  if (!Number.isInteger(index) || index < 0) throw new RangeError(`theme index must be a whole number ≥ 0, got ${index}`);
  const hue = HUE_ORDER[index % HUE_ORDER.length];
  const tier = Math.floor(index / HUE_ORDER.length) % MARKERS.length;
  let rgb = hexToRgb(OKABE_ITO[hue]);
  // Black cannot darken, so its tiers step toward grey instead.
  const shift = hue === 0 ? BLACK_TIER_SHIFT[tier] : TIER_SHIFT[tier];
  rgb = shiftLightness(rgb, shift);
  return { color: toHex(rgb), rgb, marker: MARKERS[tier] };
}

/**
 * WCAG 2 relative luminance of an sRGB colour (https://www.w3.org/TR/WCAG21/#dfn-relative-luminance).
 * @param rgb channels in 0..255
 */
export function relativeLuminance(rgb: readonly [number, number, number]): number {
  const lin = rgb.map((v) => {
    const c = v / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2];
}

/**
 * WCAG 2 contrast ratio of two colours (1..21).
 * @param a first colour channels
 * @param b second colour channels
 */
export function contrastRatio(a: readonly [number, number, number], b: readonly [number, number, number]): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

/**
 * Black or white, whichever reads better on the given background (for labels on swatches and heat-map cells).
 * @param rgb background channels
 */
export function inkOn(rgb: readonly [number, number, number]): '#000000' | '#FFFFFF' {
  return contrastRatio(rgb, [0, 0, 0]) >= contrastRatio(rgb, [255, 255, 255]) ? '#000000' : '#FFFFFF';
}
