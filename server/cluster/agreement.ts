/**
 * Agreement between two partitions of the same items, the measures clustering quality is
 * reported with. Labels are non-negative integers; their values need not be contiguous.
 */

/** Contingency table of two labelings: counts[i * cols + j] = items with a = i-th class, b = j-th class. */
interface Contingency {
  counts: Float64Array;
  rows: number;
  cols: number;
  n: number;
}

function relabel(x: ArrayLike<number>): { codes: Int32Array; classes: number } {
  const codes = new Int32Array(x.length);
  const seen = new Map<number, number>();
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (!Number.isInteger(v)) throw new TypeError(`labels must be integers; got ${v} at position ${i}`);
    let code = seen.get(v);
    if (code === undefined) { code = seen.size; seen.set(v, code); }
    codes[i] = code;
  }
  return { codes, classes: seen.size };
}

function contingency(a: ArrayLike<number>, b: ArrayLike<number>): Contingency {
  if (a.length !== b.length) throw new RangeError(`the two labelings differ in length (${a.length} vs ${b.length})`);
  const ra = relabel(a);
  const rb = relabel(b);
  const counts = new Float64Array(ra.classes * rb.classes);
  for (let i = 0; i < a.length; i++) counts[ra.codes[i] * rb.classes + rb.codes[i]]++;
  return { counts, rows: ra.classes, cols: rb.classes, n: a.length };
}

/**
 * Adjusted Rand index (Hubert & Arabie, "Comparing partitions", J. Classification 2, 1985):
 * pair-counting agreement corrected for chance; 1 for identical partitions, about 0 for random ones.
 * Written over the pair confusion counts, which equals the usual n-choose-2 form and gives 1 when
 * neither labeling splits or joins any pair differently (e.g. both put everything together).
 * @param a reference labels
 * @param b predicted labels
 */
export function adjustedRandIndex(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const t = contingency(a, b);
  const rowSums = new Float64Array(t.rows);
  const colSums = new Float64Array(t.cols);
  let sumSquares = 0;
  for (let i = 0; i < t.rows; i++) {
    for (let j = 0; j < t.cols; j++) {
      const v = t.counts[i * t.cols + j];
      rowSums[i] += v;
      colSums[j] += v;
      sumSquares += v * v;
    }
  }
  let rowSq = 0;
  for (const v of rowSums) rowSq += v * v;
  let colSq = 0;
  for (const v of colSums) colSq += v * v;
  // Ordered pairs: together in both, apart in a only, apart in b only, apart in both.
  const tp = sumSquares - t.n;
  const fp = colSq - sumSquares;
  const fn = rowSq - sumSquares;
  const tn = t.n * t.n - fp - fn - sumSquares;
  if (fn === 0 && fp === 0) return 1;
  return (2 * (tp * tn - fn * fp)) / ((tp + fn) * (fn + tn) + (tp + fp) * (fp + tn));
}

/**
 * Normalised mutual information with the arithmetic mean of the entropies as normaliser
 * (Strehl & Ghosh 2002 use the geometric mean; the arithmetic one is the common default):
 * NMI = I(a; b) / ((H(a) + H(b)) / 2), natural logarithms. 1 when both labelings have a
 * single class; 0 when the mutual information is 0.
 * @param a reference labels
 * @param b predicted labels
 */
export function normalizedMutualInformation(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const t = contingency(a, b);
  if ((t.rows === 1 && t.cols === 1) || t.n === 0) return 1;
  const rowSums = new Float64Array(t.rows);
  const colSums = new Float64Array(t.cols);
  for (let i = 0; i < t.rows; i++) {
    for (let j = 0; j < t.cols; j++) {
      rowSums[i] += t.counts[i * t.cols + j];
      colSums[j] += t.counts[i * t.cols + j];
    }
  }
  let mi = 0;
  for (let i = 0; i < t.rows; i++) {
    for (let j = 0; j < t.cols; j++) {
      const v = t.counts[i * t.cols + j];
      if (v === 0) continue;
      mi += (v / t.n) * (Math.log(v) + Math.log(t.n) - Math.log(rowSums[i]) - Math.log(colSums[j]));
    }
  }
  mi = Math.max(0, mi);
  if (mi === 0) return 0;
  const entropy = (sums: Float64Array): number => {
    let h = 0;
    for (const v of sums) if (v > 0) h -= (v / t.n) * Math.log(v / t.n);
    return h;
  };
  const normaliser = (entropy(rowSums) + entropy(colSums)) / 2;
  return mi / Math.max(normaliser, Number.EPSILON);
}
