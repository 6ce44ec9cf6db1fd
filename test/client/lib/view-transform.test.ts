import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ViewTransform } from '../../../client/lib/view-transform.js';

describe('ViewTransform', () => {
  it('maps data to screen and back', () => {
    const v = new ViewTransform();
    v.width = 800;
    v.height = 600;
    v.fit(-10, -5, 30, 15);
    fc.assert(
      fc.property(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }), (x, y) => {
        expect(v.dx(v.sx(x))).toBeCloseTo(x, 9);
        expect(v.dy(v.sy(y))).toBeCloseTo(y, 9);
      }),
    );
  });

  it('frames the fitted box inside the margin with y pointing up', () => {
    const v = new ViewTransform();
    v.width = 500;
    v.height = 300;
    v.fit(0, 0, 10, 10, 20);
    expect(v.sy(10)).toBeCloseTo(20, 9);
    expect(v.sy(0)).toBeCloseTo(280, 9);
    expect(v.sx(5)).toBeCloseTo(250, 9);
  });

  it('keeps the point under the pointer fixed while zooming', () => {
    const v = new ViewTransform();
    v.width = 640;
    v.height = 480;
    v.fit(0, 0, 1, 1);
    const before = [v.dx(100), v.dy(70)];
    v.zoomAt(100, 70, 3.7);
    expect(v.dx(100)).toBeCloseTo(before[0], 9);
    expect(v.dy(70)).toBeCloseTo(before[1], 9);
    expect(() => v.zoomAt(0, 0, 0)).toThrow(RangeError);
  });

  it('moves content with the drag', () => {
    const v = new ViewTransform();
    v.width = 200;
    v.height = 200;
    v.fit(0, 0, 10, 10);
    const x0 = v.sx(3), y0 = v.sy(4);
    v.panBy(15, -8);
    expect(v.sx(3)).toBeCloseTo(x0 + 15, 9);
    expect(v.sy(4)).toBeCloseTo(y0 - 8, 9);
  });
});
