import { findABParams } from 'umap-js/dist/umap.js';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import { CELLS, CELL_BASE, CELL_SHIFT, gradientTables } from '../../server/map/gradient-table.js';
import { edgeState, sgdHalf, type EdgeState, type HalfRound } from '../../server/map/optimize-layout.js';

const CLIP = 4;
const ATTRACTION = 2 * CELLS;
const bits = new Float64Array(1);
const high = new Uint32Array(bits.buffer);
const HIGH = new Uint8Array(new Float64Array([1]).buffer)[7] === 0x3f ? 1 : 0;

/**
 * The layout's round as the kernel (server/map/layout-kernel.ts) must compute it, written out in
 * TypeScript: this was the loop itself before the kernel replaced it, and the kernel is checked
 * against it bit for bit.
 */
function referenceRound(st: EdgeState, part: HalfRound): void {
  const { rowStart, tail, pull, negatives, due, both, y, n, a, b, gamma, table, nearby, reach } = st;
  const { alpha, from, to, lo, hi, delta } = part;
  let rng = part.seed >>> 0;
  const repulse = 2 * gamma * b;
  const attract = -2 * a * b;
  const twoN = 2 * n;
  const share = nearby / 4294967296;
  for (let p = from; p < to; p++) {
    const px = 2 * p;
    // The point's position stays in locals through its edges and negative samples.
    let yx = y[px];
    let yy = y[px + 1];
    // Its window [wlo, whi] of nearby points, and each push's step: alpha times the weight that
    // keeps its mean that of a uniform draw, (1/n) over the mixture's chance of drawing that point.
    const wlo = p - reach < 0 ? 0 : p - reach;
    const whi = p + reach >= n ? n - 1 : p + reach;
    const span = whi - wlo + 1;
    const nearStep = alpha / (1 - share + (share * n) / span);
    const farStep = alpha / (1 - share);
    const nearScale = span / nearby;
    const farScale = n / (4294967296 - nearby);
    let owed = due[p];
    const end = rowStart[p + 1];
    for (let t = rowStart[p]; t < end; t++) {
      const k = tail[t];
      const kx = 2 * k;
      // 0 for a point of this half, 2n (the snapshot) for the other's: (k − lo) | (hi − 1 − k) is
      // negative exactly when k is outside [lo, hi).
      const tk = (((k - lo) | (hi - 1 - k)) >> 31) & twoN;
      let dx = yx - both[tk + kx];
      let dy = yy - both[tk + kx + 1];
      let d2 = dx * dx + dy * dy;
      if (d2 > 0) {
        bits[0] = d2;
        const cell = (high[HIGH] >>> CELL_SHIFT) - CELL_BASE;
        let coeff: number;
        if (cell >= 0 && cell < CELLS) {
          coeff = table[ATTRACTION + 2 * cell] + table[ATTRACTION + 2 * cell + 1] * d2;
        } else {
          const q = Math.exp((b - 1) * Math.log(d2));
          coeff = (attract * q) / (a * q * d2 + 1);
        }
        let gx = coeff * dx;
        let gy = coeff * dy;
        gx = gx > CLIP ? CLIP : gx < -CLIP ? -CLIP : gx;
        gy = gy > CLIP ? CLIP : gy < -CLIP ? -CLIP : gy;
        const step = pull[t] * alpha;
        gx *= step;
        gy *= step;
        yx += gx;
        yy += gy;
        if (k >= lo && k < hi) {
          y[kx] -= gx;
          y[kx + 1] -= gy;
        } else {
          delta[kx] -= gx;
          delta[kx + 1] -= gy;
        }
      }

      // This edge's share of the point's negative samples, right after its pull.
      owed += pull[t] * negatives;
      const count = Math.floor(owed);
      owed -= count;
      for (let q = 0; q < count; q++) {
        rng ^= rng << 13;
        rng ^= rng >>> 17;
        rng ^= rng << 5;
        const u = rng >>> 0;
        const o = u < nearby ? wlo + Math.floor(u * nearScale) : Math.floor((u - nearby) * farScale);
        if (o === p) continue; // d² = 0 and the same point: no push, as in the reference.
        const step = o >= wlo && o <= whi ? nearStep : farStep;
        const ox = ((((o - lo) | (hi - 1 - o)) >> 31) & twoN) + 2 * o;
        dx = yx - both[ox];
        dy = yy - both[ox + 1];
        d2 = dx * dx + dy * dy;
        if (d2 > 0) {
          bits[0] = d2;
          const cell = (high[HIGH] >>> CELL_SHIFT) - CELL_BASE;
          let coeff: number;
          if (cell >= 0 && cell < CELLS) {
            coeff = table[2 * cell] + table[2 * cell + 1] * d2;
          } else {
            coeff = repulse / ((0.001 + d2) * (a * Math.exp(b * Math.log(d2)) + 1));
          }
          let gx = coeff * dx;
          let gy = coeff * dy;
          gx = gx > CLIP ? CLIP : gx < -CLIP ? -CLIP : gx;
          gy = gy > CLIP ? CLIP : gy < -CLIP ? -CLIP : gy;
          yx += gx * step;
          yy += gy * step;
        } else {
          // Two distinct points on the same spot: the reference pushes by the clip value.
          yx += CLIP * step;
          yy += CLIP * step;
        }
      }
    }
    y[px] = yx;
    y[px + 1] = yy;
    due[p] = owed;
  }
}

/** A random graph over n points whose positions include coincident, very close and very far points. */
function setup(n: number, seed: number) {
  const random = seededRandom(seed);
  const rowStart: number[] = [0];
  const tail: number[] = [];
  const pull: number[] = [];
  for (let p = 0; p < n; p++) {
    const degree = 1 + Math.floor(random() * 6);
    for (let e = 0; e < degree; e++) {
      // Mostly near in the order, as the breadth-first numbering makes them; some anywhere.
      const q = random() < 0.8 ? Math.min(n - 1, Math.max(0, p + Math.floor((random() - 0.5) * 40))) : Math.floor(random() * n);
      tail.push(q);
      pull.push(Math.fround(0.05 + 0.95 * random()));
    }
    rowStart.push(tail.length);
  }
  const positions = new Float64Array(2 * n);
  for (let i = 0; i < 2 * n; i++) positions[i] = (random() - 0.5) * 20;
  // Coincident points (d² = 0), points closer than the tables reach (d² < 2⁻¹⁶) and farther (d² > 2¹⁶).
  for (let i = 0; i < 10; i++) {
    positions[2 * (i + 10)] = positions[2 * i];
    positions[2 * (i + 10) + 1] = positions[2 * i + 1];
    positions[2 * (i + 30)] = positions[2 * i] + 1e-4;
    positions[2 * (i + 30) + 1] = positions[2 * i + 1];
    positions[2 * (i + 50)] = 400 + random();
    // Edges onto them, so the pulls meet those distances too (every point has at least one edge).
    tail[rowStart[i]] = i + 10;
    tail[rowStart[i + 20]] = i + 30;
    tail[rowStart[i + 40]] = i + 50;
  }
  return { rowStart, tail, pull, positions };
}

function fill(g: ReturnType<typeof setup>, n: number, a: number, b: number, share: number): EdgeState {
  const st = edgeState(n, g.tail.length, gradientTables(a, b, 1.3));
  st.rowStart.set(g.rowStart);
  st.tail.set(g.tail);
  st.pull.set(g.pull);
  st.both.set(g.positions);
  Object.assign(st, { a, b, gamma: 1.3, negatives: 5, nearby: share * 4294967296, reach: 60 });
  return st;
}

describe('the layout kernel', () => {
  it('moves the points bit for bit as the TypeScript loop does: halves, nearby draws, coincident and far points', () => {
    const n = 600;
    const g = setup(n, 11);
    for (const [minDist, spread, share] of [[0.1, 1, 0.25], [0.5, 2, 0], [0.1, 1, 0.6]]) {
      const { a, b } = findABParams(spread, minDist);
      const kernel = fill(g, n, a, b, share);
      const script = fill(g, n, a, b, share);
      const seeds = seededRandom(5);
      const mid = 317;
      for (let round = 0; round < 12; round++) {
        const alpha = 1 - round / 12;
        for (const st of [kernel, script]) st.snap.set(st.y);
        for (const [i, lo, hi] of [[0, 0, mid], [1, mid, n]]) {
          const seed = (Math.floor(seeds() * 4294967296) | 1) >>> 0;
          const part = (st: EdgeState): HalfRound => ({ alpha, from: lo, to: hi, lo, hi, delta: st.deltas[i], block: st.blocks[i], seed });
          sgdHalf(kernel, part(kernel));
          referenceRound(script, part(script));
        }
      }
      expect(Array.from(kernel.both)).toEqual(Array.from(script.both));
      expect(Array.from(kernel.deltas[0])).toEqual(Array.from(script.deltas[0]));
      expect(Array.from(kernel.deltas[1])).toEqual(Array.from(script.deltas[1]));
      expect(Array.from(kernel.due)).toEqual(Array.from(script.due));
      // The points moved, and stayed finite.
      expect(kernel.both.subarray(0, 2 * n).every(Number.isFinite)).toBe(true);
      expect(kernel.both.subarray(0, 2 * n).some((v, i) => v !== g.positions[i])).toBe(true);
    }
  });
});
