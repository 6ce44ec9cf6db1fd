/**
 * Receiver operating characteristic of one score against a yes/no truth, built as scikit-learn's
 * `roc_curve` builds it: one point per distinct score (tied scores move the curve diagonally),
 * collinear points dropped, starting at (0, 0). The area is the trapezoid rule over those points,
 * so ties count half, as in the Mann–Whitney reading of AUC.
 */

/** A ROC curve as parallel arrays, from (0, 0) to (1, 1). */
export interface RocCurve {
  fpr: Float64Array;
  tpr: Float64Array;
  /** Score at each point (the first point has +Infinity). */
  thresholds: Float64Array;
}

/**
 * Computes the ROC curve of `scores` against `positive`.
 * @param scores higher means more likely positive.
 * @param positive 1 for a positive document, 0 otherwise.
 * @throws RangeError when there are no positives or no negatives (the curve is undefined).
 */
export function rocCurve(scores: ArrayLike<number>, positive: ArrayLike<number>): RocCurve {
  const n = scores.length;
  if (positive.length !== n) throw new RangeError(`Got ${n} scores and ${positive.length} truth values`);
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => scores[b] - scores[a] || a - b);
  // Cumulative counts at the last index of each run of equal scores.
  const tps: number[] = [0], fps: number[] = [0], thr: number[] = [Infinity];
  let tp = 0, fp = 0;
  for (let k = 0; k < n; k++) {
    const i = order[k];
    if (positive[i]) tp++;
    else fp++;
    if (k === n - 1 || scores[order[k + 1]] !== scores[i]) {
      tps.push(tp);
      fps.push(fp);
      thr.push(scores[i]);
    }
  }
  if (tp === 0 || fp === 0) throw new RangeError('A ROC curve needs at least one positive and one negative document');
  // Drop points that lie on the straight line between their neighbours.
  const keep: number[] = [0];
  for (let k = 1; k < tps.length - 1; k++) {
    const collinear = fps[k + 1] - 2 * fps[k] + fps[k - 1] === 0 && tps[k + 1] - 2 * tps[k] + tps[k - 1] === 0;
    if (!collinear) keep.push(k);
  }
  if (tps.length > 1) keep.push(tps.length - 1);
  const m = keep.length;
  const fpr = new Float64Array(m), tpr = new Float64Array(m), thresholds = new Float64Array(m);
  for (let q = 0; q < m; q++) {
    fpr[q] = fps[keep[q]] / fp;
    tpr[q] = tps[keep[q]] / tp;
    thresholds[q] = thr[keep[q]];
  }
  return { fpr, tpr, thresholds };
}

/**
 * Area under a curve by the trapezoid rule.
 * @param x increasing abscissae.
 * @param y ordinates.
 */
export function trapezoidArea(x: ArrayLike<number>, y: ArrayLike<number>): number {
  let area = 0;
  for (let i = 1; i < x.length; i++) area += ((x[i] - x[i - 1]) * (y[i] + y[i - 1])) / 2;
  return area;
}

/**
 * Area under the ROC curve of `scores` against `positive` (equal to scikit-learn's `roc_auc_score`).
 * @param scores higher means more likely positive.
 * @param positive 1 for a positive document, 0 otherwise.
 */
export function rocAuc(scores: ArrayLike<number>, positive: ArrayLike<number>): number {
  const c = rocCurve(scores, positive);
  return trapezoidArea(c.fpr, c.tpr);
}

/**
 * At most `maxPoints` points of a curve for display: the first and last always, the rest evenly
 * spaced by index.
 * @param x abscissae.
 * @param y ordinates.
 * @param maxPoints upper bound on the number of points (≥ 2).
 */
export function thinCurve(x: ArrayLike<number>, y: ArrayLike<number>, maxPoints: number): [number, number][] {
  const n = x.length;
  const out: [number, number][] = [];
  if (n <= maxPoints) {
    for (let i = 0; i < n; i++) out.push([x[i], y[i]]);
    return out;
  }
  const step = (n - 1) / (maxPoints - 1);
  let last = -1;
  for (let k = 0; k < maxPoints; k++) {
    const i = k === maxPoints - 1 ? n - 1 : Math.round(k * step);
    if (i === last) continue;
    out.push([x[i], y[i]]);
    last = i;
  }
  return out;
}
