import type { Dense } from '../common/matrix.js';
import type { Random } from '../common/random.js';
import { randomNormal } from '../common/random.js';

/** Rows used to estimate the principal axes; more adds time, not accuracy worth having for a start. */
const PCA_SAMPLE = 2000;
/** Power-iteration rounds on the d×d covariance (d ≈ 100, so each round is ~10⁴ operations). */
const POWER_ROUNDS = 100;
/** The starting layout spans [-10, 10], the scale UMAP's reference implementation starts from. */
const EXTENT = 10;

/**
 * A starting layout from the two leading principal axes of the rows, scaled to span [-10, 10],
 * plus a tiny jitter (σ = 1e-4) so identical rows do not start on the same spot.
 * The axes come from the covariance of a seeded sample of at most 2,000 rows, found by subspace
 * (power) iteration; every row is then projected on them.
 * @param x rows (n×d)
 * @param random uniform numbers in [0, 1)
 * @returns n×2 positions, interleaved
 */
export function pcaLayout(x: Dense, random: Random): Float64Array {
  const { rows: n, cols: d, data } = x;
  const out = new Float64Array(2 * n);
  if (n === 0) return out;
  const m = Math.min(n, PCA_SAMPLE);
  const pick = new Int32Array(m);
  if (m === n) for (let i = 0; i < n; i++) pick[i] = i;
  else for (let i = 0; i < m; i++) pick[i] = Math.floor(random() * n);

  const mean = new Float64Array(d);
  for (let t = 0; t < m; t++) for (let c = 0; c < d; c++) mean[c] += data[pick[t] * d + c];
  for (let c = 0; c < d; c++) mean[c] /= m;
  const cov = new Float64Array(d * d);
  const centred = new Float64Array(d);
  for (let t = 0; t < m; t++) {
    const row = pick[t] * d;
    for (let c = 0; c < d; c++) centred[c] = data[row + c] - mean[c];
    for (let a = 0; a < d; a++) {
      const va = centred[a];
      if (va === 0) continue;
      for (let b = a; b < d; b++) cov[a * d + b] += va * centred[b];
    }
  }
  for (let a = 0; a < d; a++) for (let b = 0; b < a; b++) cov[a * d + b] = cov[b * d + a];

  const axes = [new Float64Array(d), new Float64Array(d)];
  for (const v of axes) for (let c = 0; c < d; c++) v[c] = random() - 0.5;
  const tmp = new Float64Array(d);
  for (let round = 0; round < POWER_ROUNDS; round++) {
    for (let e = 0; e < 2; e++) {
      const v = axes[e];
      for (let a = 0; a < d; a++) {
        let s = 0;
        for (let b = 0; b < d; b++) s += cov[a * d + b] * v[b];
        tmp[a] = s;
      }
      v.set(tmp);
    }
    orthonormalise(axes[0], axes[1]);
  }

  let maxAbs = 0;
  for (let i = 0; i < n; i++) {
    const row = i * d;
    for (let e = 0; e < 2; e++) {
      const v = axes[e];
      let s = 0;
      for (let c = 0; c < d; c++) s += (data[row + c] - mean[c]) * v[c];
      out[2 * i + e] = s;
      if (Math.abs(s) > maxAbs) maxAbs = Math.abs(s);
    }
  }
  const scale = maxAbs > 0 ? EXTENT / maxAbs : 1;
  for (let t = 0; t < 2 * n; t++) out[t] = out[t] * scale + 1e-4 * randomNormal(random);
  return out;
}

/**
 * A starting layout drawn uniformly from [-10, 10]², as umap-js starts.
 * @param n number of points
 * @param random uniform numbers in [0, 1)
 */
export function randomLayout(n: number, random: Random): Float64Array {
  const out = new Float64Array(2 * n);
  for (let t = 0; t < 2 * n; t++) out[t] = random() * 2 * EXTENT - EXTENT;
  return out;
}

/** Gram–Schmidt on two vectors; a vector that collapses to zero is replaced by a unit axis. */
function orthonormalise(u: Float64Array, v: Float64Array): void {
  normalise(u, 0);
  let dot = 0;
  for (let c = 0; c < u.length; c++) dot += u[c] * v[c];
  for (let c = 0; c < u.length; c++) v[c] -= dot * u[c];
  normalise(v, u.length > 1 && Math.abs(u[1]) < 0.9 ? 1 : 0);
}

function normalise(v: Float64Array, fallbackAxis: number): void {
  let s = 0;
  for (let c = 0; c < v.length; c++) s += v[c] * v[c];
  if (s > 1e-300) {
    const inv = 1 / Math.sqrt(s);
    for (let c = 0; c < v.length; c++) v[c] *= inv;
  } else {
    v.fill(0);
    v[fallbackAxis] = 1;
  }
}
