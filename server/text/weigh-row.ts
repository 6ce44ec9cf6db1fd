/**
 * One document's term ids → one sparse row of counts or TF-IDF weights.
 */

/** How counts become weights. `idf === null` keeps raw counts. */
export interface RowWeighting {
  idf: Float64Array | null;
  sublinearTf: boolean;
  normalize: boolean;
}

/** Reusable work space of {@link weighRow}, sized to the number of columns. */
export class RowScratch {
  /** Count per column; all zero between calls. */
  readonly counts: Float64Array;
  /** Columns touched by the current row. */
  readonly touched: Uint32Array;

  constructor(cols: number) {
    this.counts = new Float64Array(cols);
    this.touched = new Uint32Array(cols);
  }
}

/**
 * Counts the ids `ids[from .. to)` by column (`column[id]`, ids with a negative column are
 * skipped), weighs each count, and writes the row into `indices`/`values` from position `at`,
 * columns increasing. With `idf`: weight = (1 + ln tf, or tf) · idf, then the row is scaled to
 * unit length if `normalize`; a row with no kept term stays empty.
 * @returns the position after the last entry written.
 */
export function weighRow(
  ids: Uint32Array, from: number, to: number, column: Int32Array,
  w: RowWeighting, scratch: RowScratch, indices: Uint32Array, values: Float32Array, at: number,
): number {
  const { counts, touched } = scratch;
  let m = 0;
  for (let k = from; k < to; k++) {
    const c = column[ids[k]];
    if (c < 0) continue;
    if (counts[c] === 0) touched[m++] = c;
    counts[c] += 1;
  }
  // Insertion sort is quadratic: past ~16 columns the native sort wins (measured on rows of 10–90 columns).
  if (m <= 16) {
    for (let i = 1; i < m; i++) {
      const x = touched[i];
      let j = i - 1;
      while (j >= 0 && touched[j] > x) { touched[j + 1] = touched[j]; j--; }
      touched[j + 1] = x;
    }
  } else touched.subarray(0, m).sort();
  const idf = w.idf;
  if (idf === null) {
    for (let i = 0; i < m; i++) {
      const c = touched[i];
      indices[at + i] = c;
      values[at + i] = counts[c];
      counts[c] = 0;
    }
    return at + m;
  }
  // Weights are kept in float64 (in the counts slots) until scaled, then rounded once to float32.
  let sq = 0;
  for (let i = 0; i < m; i++) {
    const c = touched[i];
    const tf = counts[c];
    const v = (w.sublinearTf ? 1 + Math.log(tf) : tf) * idf[c];
    counts[c] = v;
    sq += v * v;
  }
  const scale = w.normalize && sq > 0 ? 1 / Math.sqrt(sq) : 1;
  for (let i = 0; i < m; i++) {
    const c = touched[i];
    indices[at + i] = c;
    values[at + i] = counts[c] * scale;
    counts[c] = 0;
  }
  return at + m;
}
