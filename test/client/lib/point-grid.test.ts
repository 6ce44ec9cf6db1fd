import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PointGrid, pointInPolygon } from '../../../client/lib/point-grid.js';

function bruteNearest(xs: Float32Array, ys: Float32Array, x: number, y: number, r: number): number {
  let best = -1;
  let bestD = r * r;
  for (let i = 0; i < xs.length; i++) {
    const d = (xs[i] - x) ** 2 + (ys[i] - y) ** 2;
    if (d < bestD || (d === bestD && best < 0)) {
      best = i;
      bestD = d;
    }
  }
  return best;
}

const coord = fc.float({ min: -100, max: 100, noNaN: true, noDefaultInfinity: true });
const cloud = fc.array(fc.tuple(coord, coord), { minLength: 0, maxLength: 300 });

describe('PointGrid', () => {
  it('finds the same nearest point as a full scan (or one at the same distance)', () => {
    fc.assert(
      fc.property(cloud, coord, coord, fc.float({ min: 0.5, max: 40, noNaN: true }), (pts, qx, qy, r) => {
        const xs = Float32Array.from(pts.map((p) => p[0]));
        const ys = Float32Array.from(pts.map((p) => p[1]));
        const g = new PointGrid(xs, ys, 4);
        const got = g.nearest(qx, qy, r);
        const want = bruteNearest(xs, ys, qx, qy, r);
        if (want < 0) expect(got).toBe(-1);
        else {
          expect(got).toBeGreaterThanOrEqual(0);
          const dGot = (xs[got] - qx) ** 2 + (ys[got] - qy) ** 2;
          const dWant = (xs[want] - qx) ** 2 + (ys[want] - qy) ** 2;
          expect(dGot).toBeCloseTo(dWant, 9);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('selects exactly the points inside a box, edges included', () => {
    fc.assert(
      fc.property(cloud, coord, coord, coord, coord, (pts, ax, ay, bx, by) => {
        const xs = Float32Array.from(pts.map((p) => p[0]));
        const ys = Float32Array.from(pts.map((p) => p[1]));
        const got = Array.from(new PointGrid(xs, ys).inBox(ax, ay, bx, by));
        const want: number[] = [];
        for (let i = 0; i < xs.length; i++) {
          if (xs[i] >= Math.min(ax, bx) && xs[i] <= Math.max(ax, bx) && ys[i] >= Math.min(ay, by) && ys[i] <= Math.max(ay, by)) want.push(i);
        }
        expect(got).toEqual(want);
      }),
      { numRuns: 200 },
    );
  });

  it('selects the points inside a lasso polygon, matching a direct test of every point', () => {
    const xs = new Float32Array(400);
    const ys = new Float32Array(400);
    for (let i = 0; i < 400; i++) {
      xs[i] = (i % 20) - 10;
      ys[i] = Math.floor(i / 20) - 10;
    }
    // A concave "L" shape.
    const poly = [-5.5, -5.5, 5.5, -5.5, 5.5, -0.5, 0.5, -0.5, 0.5, 5.5, -5.5, 5.5];
    const got = Array.from(new PointGrid(xs, ys).inPolygon(poly));
    const want: number[] = [];
    for (let i = 0; i < 400; i++) if (pointInPolygon(xs[i], ys[i], poly)) want.push(i);
    expect(got).toEqual(want);
    // Hand count: the 11×11 lattice square from −5 to 5 minus the 5×5 corner x∈1..5, y∈0..5 → 121 − 30 = 91.
    expect(got.length).toBe(91);
  });

  it('handles an empty set and points that all coincide', () => {
    expect(new PointGrid(new Float32Array(0), new Float32Array(0)).nearest(0, 0, 1)).toBe(-1);
    const same = new PointGrid(new Float32Array([2, 2, 2]), new Float32Array([3, 3, 3]));
    expect(same.nearest(2, 3, 0.1)).toBe(0);
    expect(Array.from(same.inBox(0, 0, 5, 5))).toEqual([0, 1, 2]);
  });

  it('refuses coordinate arrays of different lengths', () => {
    expect(() => new PointGrid(new Float32Array(2), new Float32Array(3))).toThrow(RangeError);
  });

  it('indexes 50,000 points and answers hover queries on them', () => {
    const n = 50_000;
    const xs = new Float32Array(n);
    const ys = new Float32Array(n);
    let s = 1;
    const rnd = () => ((s = (s * 16807) % 2147483647) / 2147483647);
    for (let i = 0; i < n; i++) {
      xs[i] = rnd() * 100;
      ys[i] = rnd() * 100;
    }
    const g = new PointGrid(xs, ys);
    expect(g.size).toBe(n);
    for (let q = 0; q < 50; q++) {
      const x = rnd() * 100, y = rnd() * 100;
      expect(g.nearest(x, y, 2)).toBe(bruteNearest(xs, ys, x, y, 2));
    }
  });
});
