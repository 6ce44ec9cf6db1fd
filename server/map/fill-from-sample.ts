import type { Random } from '../common/random.js';
import type { FuzzyGraph } from './api.js';

/** Jitter of a filled-in point, as a fraction of the placed layout's RMS radius: only so points with the same neighbours do not coincide. */
const JITTER = 0.004;

/**
 * Positions for every point from a laid-out sample: each sampled point keeps its place, then the
 * others are placed ring by ring outward from the sample over the graph, each at the weighted
 * mean of its neighbours already placed (plus a tiny jitter). Points the graph never connects to
 * a sampled point (a component with no point in the sample) go where `fallback` puts them, through
 * the least-squares affine map from the sample's `fallback` positions to its laid-out ones, so
 * they land in the sample layout's frame.
 * @param graph symmetric fuzzy graph over all n points
 * @param sample indices of the sampled points (distinct)
 * @param sampleXY the sample's layout, sample.length×2 interleaved, already scaled as wanted
 * @param fallback n×2 positions in any frame (e.g. the principal axes) for unreached points
 * @param random for the jitter
 * @returns n×2 positions, interleaved
 */
export function fillFromSample(graph: FuzzyGraph, sample: Int32Array, sampleXY: Float64Array, fallback: Float64Array, random: Random): Float64Array {
  const { n, indptr, indices, weights } = graph;
  const pos = new Float64Array(2 * n);
  const placed = new Uint8Array(n);
  let cx = 0;
  let cy = 0;
  for (let s = 0; s < sample.length; s++) {
    cx += sampleXY[2 * s];
    cy += sampleXY[2 * s + 1];
  }
  cx /= Math.max(1, sample.length);
  cy /= Math.max(1, sample.length);
  let spread = 0;
  for (let s = 0; s < sample.length; s++) {
    const i = sample[s];
    pos[2 * i] = sampleXY[2 * s];
    pos[2 * i + 1] = sampleXY[2 * s + 1];
    placed[i] = 1;
    spread += (sampleXY[2 * s] - cx) ** 2 + (sampleXY[2 * s + 1] - cy) ** 2;
  }
  const jitter = JITTER * Math.sqrt(spread / Math.max(1, sample.length));

  // One ring at a time: a point sees only points placed in earlier rings, so the result does not
  // depend on the order of the points within a ring.
  let ring = new Int32Array(n);
  let next = new Int32Array(n);
  const queued = placed.slice();
  let ringSize = enqueueNeighbours(graph, sample, sample.length, queued, ring);
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  while (ringSize > 0) {
    for (let r = 0; r < ringSize; r++) {
      const i = ring[r];
      let sw = 0;
      let px = 0;
      let py = 0;
      for (let t = indptr[i]; t < indptr[i + 1]; t++) {
        const j = indices[t];
        if (!placed[j]) continue;
        const w = weights[t];
        sw += w;
        px += w * pos[2 * j];
        py += w * pos[2 * j + 1];
      }
      // A ring member has a placed neighbour by construction, and the fuzzy graph keeps only
      // positive weights, so sw > 0.
      xs[i] = px / sw + (random() - 0.5) * jitter;
      ys[i] = py / sw + (random() - 0.5) * jitter;
    }
    for (let r = 0; r < ringSize; r++) {
      const i = ring[r];
      pos[2 * i] = xs[i];
      pos[2 * i + 1] = ys[i];
      placed[i] = 1;
    }
    const nextSize = enqueueNeighbours(graph, ring, ringSize, queued, next);
    [ring, next] = [next, ring];
    ringSize = nextSize;
  }

  let unreached = 0;
  for (let i = 0; i < n; i++) if (!placed[i]) unreached++;
  if (unreached > 0) {
    const map = affineFit(sample, fallback, sampleXY);
    for (let i = 0; i < n; i++) {
      if (placed[i]) continue;
      const u = fallback[2 * i];
      const v = fallback[2 * i + 1];
      pos[2 * i] = map[0] * u + map[1] * v + map[2] + (random() - 0.5) * jitter;
      pos[2 * i + 1] = map[3] * u + map[4] * v + map[5] + (random() - 0.5) * jitter;
    }
  }
  return pos;
}

/** Writes the not yet queued neighbours of points[0 … count) into `into`, marks them queued, returns how many. */
function enqueueNeighbours(graph: FuzzyGraph, points: Int32Array, count: number, queued: Uint8Array, into: Int32Array): number {
  const { indptr, indices } = graph;
  let size = 0;
  for (let r = 0; r < count; r++) {
    const i = points[r];
    for (let t = indptr[i]; t < indptr[i + 1]; t++) {
      const j = indices[t];
      if (!queued[j]) {
        queued[j] = 1;
        into[size++] = j;
      }
    }
  }
  return size;
}

/**
 * Least-squares affine map [p q r; s t u] taking the sample's `from` positions to `to`
 * (normal equations on 3×3; a singular system, e.g. a sample on one line, falls back to a shift).
 */
function affineFit(sample: Int32Array, from: Float64Array, to: Float64Array): Float64Array {
  const m = new Float64Array(9);
  const bx = new Float64Array(3);
  const by = new Float64Array(3);
  for (let s = 0; s < sample.length; s++) {
    const row = [from[2 * sample[s]], from[2 * sample[s] + 1], 1];
    for (let a = 0; a < 3; a++) {
      for (let c = 0; c < 3; c++) m[3 * a + c] += row[a] * row[c];
      bx[a] += row[a] * to[2 * s];
      by[a] += row[a] * to[2 * s + 1];
    }
  }
  const px = solve3(m, bx);
  const py = solve3(m, by);
  if (px && py) return Float64Array.of(px[0], px[1], px[2], py[0], py[1], py[2]);
  const k = Math.max(1, sample.length);
  let dx = 0;
  let dy = 0;
  for (let s = 0; s < sample.length; s++) {
    dx += to[2 * s] - from[2 * sample[s]];
    dy += to[2 * s + 1] - from[2 * sample[s] + 1];
  }
  return Float64Array.of(1, 0, dx / k, 0, 1, dy / k);
}

/** Solves the 3×3 system by Cramer's rule; null when it is (nearly) singular. */
function solve3(m: Float64Array, b: Float64Array): Float64Array | null {
  const det = (a: ArrayLike<number>) =>
    a[0] * (a[4] * a[8] - a[5] * a[7]) - a[1] * (a[3] * a[8] - a[5] * a[6]) + a[2] * (a[3] * a[7] - a[4] * a[6]);
  const d = det(m);
  let scale = 0;
  for (let t = 0; t < 9; t++) scale = Math.max(scale, Math.abs(m[t]));
  if (!(Math.abs(d) > 1e-12 * scale ** 3)) return null;
  const out = new Float64Array(3);
  for (let c = 0; c < 3; c++) {
    const a = m.slice();
    for (let r = 0; r < 3; r++) a[3 * r + c] = b[r];
    out[c] = det(a) / d;
  }
  return out;
}
