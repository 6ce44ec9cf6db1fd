import { describe, expect, it } from 'vitest';
import type { Assignment, Cluster } from '../../../client/api/types.js';
import { buildMapData, filterPositions, membersOf, misfitsOf, themeStyles } from '../../../client/lib/map-data.js';
import { NO_CONTENT_STYLE, themeStyle } from '../../../client/lib/palette.js';

const cluster = (id: string, extra: Partial<Cluster> = {}): Cluster => ({ id, name: null, size: 0, terms: [], representativeIds: [], silhouette: 0, ...extra });
const clusters = [cluster('c1'), cluster('c2')];
const rows: Assignment[] = [
  { documentId: 'd1', clusterId: 'c1', x: 0, y: 0, silhouette: 0.5 },
  { documentId: 'd2', clusterId: 'c2', x: 1, y: 1, silhouette: -0.2 },
  { documentId: 'd3', clusterId: 'c2', x: 2, y: 2, silhouette: -0.6 },
  { documentId: 'd4', clusterId: 'gone', x: 3, y: 3, silhouette: null },
  { documentId: 'd5', clusterId: 'c2', x: 4, y: 4, silhouette: 0.1 },
];

describe('map data', () => {
  it('lays assignments into typed arrays in corpus order', () => {
    const d = buildMapData(rows, clusters);
    expect(d.ids).toEqual(['d1', 'd2', 'd3', 'd4', 'd5']);
    expect(Array.from(d.xs)).toEqual([0, 1, 2, 3, 4]);
    expect(Array.from(d.themeOf)).toEqual([0, 1, 1, 2, 1]);
    expect(Array.from(d.counts)).toEqual([1, 3, 1]);
    expect(Number.isNaN(d.silhouette[3])).toBe(true);
    expect(d.indexOf.get('d3')).toBe(2);
  });

  // Rousseeuw (1987): s(i) < 0 means i lies on average closer to another cluster than its own.
  it('lists misfits as negative-silhouette members, worst first', () => {
    const d = buildMapData(rows, clusters);
    expect(Array.from(misfitsOf(d, 1, 10))).toEqual([2, 1]);
    expect(Array.from(misfitsOf(d, 1, 1))).toEqual([2]);
    expect(Array.from(misfitsOf(d, 0, 10))).toEqual([]);
  });

  it('filters by theme and by a search mask together', () => {
    const d = buildMapData(rows, clusters);
    expect(Array.from(membersOf(d, 1))).toEqual([1, 2, 4]);
    expect(Array.from(filterPositions(d, -1, null))).toEqual([0, 1, 2, 3, 4]);
    expect(Array.from(filterPositions(d, 1, Uint8Array.from([1, 0, 1, 1, 0])))).toEqual([2]);
  });

  it('keeps each theme’s colour when others disappear, and gives a new theme the first freed colour', () => {
    const memory = new Map<string, number>();
    const before = themeStyles([cluster('a'), cluster('b'), cluster('c')], memory);
    const after = themeStyles([cluster('a'), cluster('c'), cluster('m')], memory);
    expect(after[0]).toEqual(before[0]);
    expect(after[1]).toEqual(before[2]);
    expect(after[2]).toEqual(themeStyle(1));
    expect(after[3]).toEqual(NO_CONTENT_STYLE);
  });

  it('paints the no-content theme grey, not with a palette hue', () => {
    const styles = themeStyles([cluster('a'), cluster('z', { noContent: true })], new Map());
    expect(styles[1]).toEqual(NO_CONTENT_STYLE);
  });
});
