import type { Assignment, Cluster } from '../api/types.js';
import { NO_CONTENT_STYLE, themeStyle, type ThemeStyle } from './palette.js';

/** An analysis's assignments in typed arrays, indexed by position in corpus order. */
export interface MapData {
  /** Document id at each position. */
  ids: string[];
  /** Position of each document id. */
  indexOf: Map<string, number>;
  xs: Float32Array;
  ys: Float32Array;
  /** Position of the document's theme in the clusters list; `clusters.length` when the theme is unknown. */
  themeOf: Int32Array;
  /** Silhouette of each document (NaN when the server gave none). */
  silhouette: Float32Array;
  /** Documents per theme position (last slot: unknown theme). */
  counts: Uint32Array;
}

/**
 * Converts the assignments answer into typed arrays for the map and the lists.
 * @param rows `GET /analyses/:aid/assignments`
 * @param clusters the analysis's clusters
 */
export function buildMapData(rows: readonly Assignment[], clusters: readonly Cluster[]): MapData {
  const n = rows.length;
  const clusterPos = new Map<string, number>();
  clusters.forEach((c, i) => clusterPos.set(c.id, i));
  const ids = new Array<string>(n);
  const indexOf = new Map<string, number>();
  const xs = new Float32Array(n);
  const ys = new Float32Array(n);
  const themeOf = new Int32Array(n);
  const silhouette = new Float32Array(n);
  const counts = new Uint32Array(clusters.length + 1);
  for (let i = 0; i < n; i++) {
    const r = rows[i];
    ids[i] = r.documentId;
    indexOf.set(r.documentId, i);
    xs[i] = Number.isFinite(r.x) ? r.x : 0;
    ys[i] = Number.isFinite(r.y) ? r.y : 0;
    const t = clusterPos.get(r.clusterId) ?? clusters.length;
    themeOf[i] = t;
    counts[t]++;
    silhouette[i] = typeof r.silhouette === 'number' ? r.silhouette : NaN;
  }
  return { ids, indexOf, xs, ys, themeOf, silhouette, counts };
}

/**
 * Draw styles per theme position, plus a last grey one for documents of an unknown theme.
 * Colours stick to cluster ids through `memory`, so a merge or a reload does not repaint the
 * themes that did not change.
 * @param clusters the analysis's clusters
 * @param memory cluster id → palette slot, kept across updates of one analysis (mutated)
 */
export function themeStyles(clusters: readonly Cluster[], memory: Map<string, number>): ThemeStyle[] {
  const used = new Set<number>();
  for (const c of clusters) {
    const slot = memory.get(c.id);
    if (slot !== undefined) used.add(slot);
  }
  let next = 0;
  const out: ThemeStyle[] = clusters.map((c) => {
    if (c.noContent) return NO_CONTENT_STYLE;
    let slot = memory.get(c.id);
    if (slot === undefined) {
      while (used.has(next)) next++;
      slot = next;
      used.add(slot);
      memory.set(c.id, slot);
    }
    return themeStyle(slot);
  });
  out.push(NO_CONTENT_STYLE);
  return out;
}

/**
 * Positions of a theme's documents, in corpus order.
 * @param data map data
 * @param theme theme position
 */
export function membersOf(data: MapData, theme: number): Uint32Array {
  const out = new Uint32Array(data.counts[theme] ?? 0);
  let k = 0;
  for (let i = 0; i < data.themeOf.length; i++) if (data.themeOf[i] === theme) out[k++] = i;
  return out;
}

/**
 * A theme's misfits: documents with a negative silhouette (closer on average to another theme
 * than to their own; Rousseeuw 1987), worst first.
 * @param data map data
 * @param theme theme position
 * @param limit most to return
 */
export function misfitsOf(data: MapData, theme: number, limit: number): Uint32Array {
  const found: number[] = [];
  for (let i = 0; i < data.themeOf.length; i++) if (data.themeOf[i] === theme && data.silhouette[i] < 0) found.push(i);
  found.sort((a, b) => data.silhouette[a] - data.silhouette[b] || a - b);
  return Uint32Array.from(found.slice(0, limit));
}

/**
 * Positions that pass every filter, ascending.
 * @param data map data
 * @param theme theme position, or -1 for all
 * @param matches search mask, or null for no search
 */
export function filterPositions(data: MapData, theme: number, matches: Uint8Array | null): Uint32Array {
  const out: number[] = [];
  for (let i = 0; i < data.themeOf.length; i++) {
    if (theme >= 0 && data.themeOf[i] !== theme) continue;
    if (matches && !matches[i]) continue;
    out.push(i);
  }
  return Uint32Array.from(out);
}
