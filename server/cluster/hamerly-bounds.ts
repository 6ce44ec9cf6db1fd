/**
 * Assignment with one upper and one lower bound per row (Hamerly, "Making k-means even faster",
 * SDM 2010), on the chord distance of unit vectors. It needs O(n) memory whatever k is, so it
 * serves the runs with many clusters where Elkan's n·k bounds (elkan-bounds.ts) would not fit.
 */
import { chord, dot, dotRows } from './unit-sphere.js';

/** Bound state of one Lloyd run under Hamerly's method. */
export interface HamerlyBounds {
  labels: Int32Array;
  upper: Float64Array;
  lower: Float64Array;
  half: Float64Array;
  /** Scratch: one row's products with every centroid (allocated on first use when absent). */
  dots?: Float64Array;
}

/** Assigns rows i0..i1 to their nearest centroid, skipping rows Hamerly's bounds settle; returns rows that moved. */
export function hamerlyAssignRange(x: Float64Array, d: number, k: number, centroids: Float64Array, b: HamerlyBounds, i0: number, i1: number): number {
  const { labels, upper, lower, half } = b;
  const dots = b.dots && b.dots.length >= k ? b.dots : (b.dots = new Float64Array(k));
  let moved = 0;
  for (let i = i0; i < i1; i++) {
    const own = labels[i];
    if (own >= 0) {
      const bound = Math.max(half[own], lower[i]);
      if (upper[i] <= bound) continue;
      upper[i] = chord(dot(x, i * d, centroids, own * d, d));
      if (upper[i] <= bound) continue;
    }
    // Nearest two by cosine (the chord is monotone in it), converted to chords once.
    let b1 = -1;
    let c1 = -Infinity;
    let c2 = -Infinity;
    dotRows(x, i * d, centroids, 0, k, d, dots);
    for (let c = 0; c < k; c++) {
      const cos = dots[c];
      if (cos > c1) { c2 = c1; c1 = cos; b1 = c; } else if (cos > c2) c2 = cos;
    }
    const d1 = chord(c1);
    const d2 = c2 === -Infinity ? Infinity : chord(c2);
    if (b1 !== own) moved++;
    labels[i] = b1;
    upper[i] = d1;
    lower[i] = d2;
  }
  return moved;
}

/** Hamerly's bound update: the own bound grows by its centroid's shift, the other by the largest shift. */
export function hamerlyShift(n: number, k: number, shift: Float64Array, b: HamerlyBounds, reset: boolean): void {
  const { labels, upper, lower } = b;
  let maxShift = 0;
  for (let c = 0; c < k; c++) if (shift[c] > maxShift) maxShift = shift[c];
  for (let i = 0; i < n; i++) {
    // Hamerly uses the largest shift among the other centroids; the overall largest is a safe bound.
    upper[i] = reset ? Infinity : upper[i] + shift[labels[i]];
    lower[i] = reset ? 0 : lower[i] - maxShift;
  }
}

/** s(j): half the chord from centroid j to its nearest other centroid. */
export function hamerlyGaps(d: number, k: number, centroids: Float64Array, half: Float64Array): void {
  half.fill(Infinity);
  for (let a = 0; a < k; a++) {
    for (let c = a + 1; c < k; c++) {
      const h = chord(dot(centroids, a * d, centroids, c * d, d)) / 2;
      if (h < half[a]) half[a] = h;
      if (h < half[c]) half[c] = h;
    }
  }
}

