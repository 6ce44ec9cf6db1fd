import { findABParams } from 'umap-js/dist/umap.js';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import { gradientTables } from '../../server/map/gradient-table.js';
import { edgeState, sgdHalf, type HalfRound } from '../../server/map/optimize-layout.js';

// UMAP's repulsive gradient for one negative sample (McInnes, Healy & Melville 2018, §3.2, with the
// reference implementation's 0.001 guard and its clip of each component to ±4), computed here
// from the formula, not from our tables.
function push(a: number, b: number, dx: number, dy: number): [number, number] {
  const d2 = dx * dx + dy * dy;
  const coeff = (2 * b) / ((0.001 + d2) * (a * Math.pow(d2, b) + 1));
  const clip = (g: number) => Math.max(-4, Math.min(4, g));
  return [clip(coeff * dx), clip(coeff * dy)];
}

describe('layout rounds (sgdHalf)', () => {
  it('push a point on average as uniform negative samples would, nearby draws with less spread', () => {
    // Points along a spiral in index order, so that the points near in the order (what the
    // layout's breadth-first numbering gives) are near on the map. Point p has one edge, to a
    // point on its own spot (no pull), so a round moves it only by its negative samples.
    const n = 3000;
    const p = 1500;
    const { a, b } = findABParams(1, 0.1);
    const base = new Float64Array(4 * n);
    const jitter = seededRandom(3);
    for (let i = 0; i < n; i++) {
      const angle = i * 0.004;
      const radius = 1 + i * 0.002;
      base[2 * i] = radius * Math.cos(angle) + 0.05 * jitter();
      base[2 * i + 1] = radius * Math.sin(angle) + 0.05 * jitter();
    }
    const tailPoint = p + 1;
    base[2 * tailPoint] = base[2 * p];
    base[2 * tailPoint + 1] = base[2 * p + 1];

    // The mean push per draw of uniform draws over all n points (the head itself pushes nothing).
    let ex = 0;
    let ey = 0;
    for (let o = 0; o < n; o++) {
      if (o === p) continue;
      const [gx, gy] = push(a, b, base[2 * p] - base[2 * o], base[2 * p + 1] - base[2 * o + 1]);
      ex += gx / n;
      ey += gy / n;
    }

    const negatives = 5;
    const alpha = 1e-6;
    // Point p heads the one edge; the state's arrays live in the layout kernel's memory.
    const state = edgeState(n, 1, gradientTables(a, b, 1));
    for (let i = p + 1; i <= n; i++) state.rowStart[i] = 1;
    state.tail[0] = tailPoint;
    state.pull[0] = 1;
    Object.assign(state, { a, b, gamma: 1, negatives, reach: 100 });
    const both = state.both;
    const run = (share: number) => {
      state.nearby = share * 4294967296;
      // Seeds as the layout makes them: odd 32-bit draws from the map's random stream.
      const seeds = seededRandom(7);
      const sums: [number, number][] = [];
      for (let round = 0; round < 20_000; round++) {
        both.set(base);
        state.due.fill(0.5);
        const part: HalfRound = { alpha, from: p, to: p + 1, lo: 0, hi: n, delta: state.deltas[0], block: state.blocks[0], seed: (Math.floor(seeds() * 4294967296) | 1) >>> 0 };
        sgdHalf(state, part);
        sums.push([(both[2 * p] - base[2 * p]) / alpha / negatives, (both[2 * p + 1] - base[2 * p + 1]) / alpha / negatives]);
      }
      const mean = [0, 1].map((c) => sums.reduce((s, v) => s + v[c], 0) / sums.length);
      const se = [0, 1].map((c) => Math.sqrt(sums.reduce((s, v) => s + (v[c] - mean[c]) ** 2, 0) / (sums.length - 1) / sums.length));
      return { mean, se };
    };
    const uniform = run(0);
    const nearby = run(0.25);
    for (const r of [uniform, nearby]) {
      // Within four standard errors of the exact mean, plus the tables' error (≤ 6.5e-4 relative).
      expect(Math.abs(r.mean[0] - ex)).toBeLessThan(4 * r.se[0] + 1e-3 * Math.abs(ex));
      expect(Math.abs(r.mean[1] - ey)).toBeLessThan(4 * r.se[1] + 1e-3 * Math.abs(ey));
    }
    console.log(`exact ${ex.toFixed(4)}, ${ey.toFixed(4)}; uniform ${uniform.mean.map((v) => v.toFixed(4))} ± ${uniform.se.map((v) => v.toFixed(4))}; nearby ${nearby.mean.map((v) => v.toFixed(4))} ± ${nearby.se.map((v) => v.toFixed(4))}`);
    expect(Math.hypot(nearby.se[0], nearby.se[1])).toBeLessThan(Math.hypot(uniform.se[0], uniform.se[1]));
  });
});
