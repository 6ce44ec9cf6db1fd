import { describe, expect, it } from 'vitest';
import { bucketByStyle } from '../../../client/lib/point-buckets.js';

describe('bucketByStyle', () => {
  it('groups point indices by style, keeping ascending order inside each group', () => {
    const { order, start } = bucketByStyle(Int32Array.from([2, 0, 2, 1, 0]), 3);
    expect(Array.from(start)).toEqual([0, 2, 3, 5]);
    expect(Array.from(order)).toEqual([1, 4, 3, 0, 2]);
  });
  it('refuses a style outside the list', () => {
    expect(() => bucketByStyle(Int32Array.from([0, 3]), 3)).toThrow(/style 3/);
  });
});
