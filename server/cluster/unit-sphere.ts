/**
 * Distances between unit vectors, shared by the k-means loops: the dot product and the chord
 * length ‖x − c‖ = √(2 − 2·x·c), which (unlike 1 − cos) is a metric, so triangle-inequality
 * bounds (Hamerly 2010, Elkan 2003) apply to it.
 */

/** x[i..i+d) · c[j..j+d), four partial sums so the multiplies need not wait on one another. */
export function dot(x: Float64Array, i: number, c: Float64Array, j: number, d: number): number {
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  let a = 0;
  for (; a + 3 < d; a += 4) {
    s0 += x[i + a] * c[j + a];
    s1 += x[i + a + 1] * c[j + a + 1];
    s2 += x[i + a + 2] * c[j + a + 2];
    s3 += x[i + a + 3] * c[j + a + 3];
  }
  for (; a < d; a++) s0 += x[i + a] * c[j + a];
  return s0 + s1 + (s2 + s3);
}

/** Chord distance between unit vectors with the given cosine, clamped against rounding. */
export function chord(cos: number): number {
  return Math.sqrt(Math.max(0, 2 - 2 * cos));
}

