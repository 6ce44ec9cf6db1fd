/**
 * "Nice" axis ticks (1, 2, 5 × 10ⁿ steps) for the SVG charts, after P. Heckbert, "Nice numbers
 * for graph labels", Graphics Gems, 1990 (method from memory).
 * @param min lowest value to cover
 * @param max highest value to cover
 * @param count about how many ticks are wanted
 * @default count 5
 * @returns ascending tick values covering [min, max]
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) throw new RangeError(`tick range must be finite, got ${min}..${max}`);
  if (!(count >= 1)) throw new RangeError(`tick count must be ≥ 1, got ${count}`);
  if (min > max) [min, max] = [max, min];
  if (min === max) {
    const pad = min === 0 ? 1 : Math.abs(min) * 0.1;
    min -= pad;
    max += pad;
  }
  const step = niceNumber((max - min) / count);
  const lo = Math.floor(min / step) * step;
  const hi = Math.ceil(max / step) * step;
  const out: number[] = [];
  const digits = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  for (let v = lo, i = 0; v <= hi + step / 2 && i < 1000; v += step, i++) out.push(Number(v.toFixed(digits)));
  return out;
}

function niceNumber(x: number): number {
  const e = Math.floor(Math.log10(x));
  const f = x / 10 ** e;
  const nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  return nf * 10 ** e;
}

/**
 * A number for tables and labels: fixed decimals, or an em dash when missing.
 * @param v the value
 * @param digits decimals
 * @default digits 2
 */
export function fmt(v: number | null | undefined, digits = 2): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits);
}

/**
 * A share as a percentage.
 * @param v value in 0..1
 * @param digits decimals
 * @default digits 0
 */
export function pct(v: number | null | undefined, digits = 0): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '—' : `${(v * 100).toFixed(digits)}%`;
}
