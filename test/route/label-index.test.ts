import { describe, expect, it } from 'vitest';
import { labelIndex } from '../../server/route/label-index.js';

describe('labelIndex', () => {
  it('numbers labels in code-unit order and counts their documents', () => {
    const r = labelIndex(['a', 'b', 'c', 'd', 'e', 'f'], ['spam', 'ham', 'spam', 'Ham', 'ham', 'Ham']);
    expect(r.names).toEqual(['Ham', 'ham', 'spam']);
    expect(Array.from(r.y)).toEqual([2, 1, 2, 0, 1, 0]);
    expect(Array.from(r.sizes)).toEqual([2, 2, 2]);
  });

  it('names every label with a single document in the error', () => {
    expect(() => labelIndex(['a', 'b', 'c', 'd'], ['x', 'x', 'y', 'z'])).toThrow(/"y" has only 1 document.*2 label\(s\) affected: "y", "z"/);
  });

  it('refuses an empty set with a message saying what is needed', () => {
    expect(() => labelIndex([], [])).toThrow(/at least 2 labels/);
  });
});
