/**
 * Exact agglomerative clustering on a condensed distance array, by the nearest-neighbour chain
 * (Müllner 2011, "Modern hierarchical, agglomerative clustering algorithms", arXiv:1109.2378)
 * with Lance–Williams updates (Lance & Williams 1967) written into the same array.
 *
 * The result follows SciPy's linkage-matrix layout and cluster-id convention exactly, so a tree
 * can be compared with `scipy.cluster.hierarchy.linkage` row by row.
 */
import { assertUnreachable } from '../common/matrix.js';
import { drain, type Stepwise } from '../common/step.js';
import type { Linkage, LinkageMatrix } from './api.js';
import { condensedIndex } from './condensed-distances.js';

/**
 * Builds the full agglomerative tree of `n` items from their condensed distances, yielding a
 * `"merge"` step every few thousand merges.
 *
 * `dist` is overwritten (it is the working matrix; no other n×n array is allocated).
 * With `weights`, item i stands for a group of `weights[i]` points and the Lance–Williams
 * updates use those sizes; the caller then supplies the matching starting distances (see
 * agglomerate.ts). Heights are non-decreasing for these three linkages (all are reducible),
 * which is what lets the nearest-neighbour chain find the same tree as the naive algorithm.
 *
 * Ties: merges are sorted stably by height, as SciPy does; with tied distances SciPy and this
 * code may pick different (equally valid) pairs.
 *
 * @param dist condensed distances (`condensedDistances` layout, condensed-distances.ts), overwritten.
 * @param n number of items.
 * @param linkage `'average'` (UPGMA), `'complete'` or `'ward'` (Ward 1963; expects Euclidean distances).
 * @param weights optional group size per item, each > 0. @default all 1
 * @returns SciPy-layout linkage matrix.
 */
export function* linkageSteps(dist: Float64Array, n: number, linkage: Linkage, weights?: ArrayLike<number>): Stepwise<LinkageMatrix> {
  if (!Number.isInteger(n) || n < 2) throw new RangeError(`Agglomerative clustering needs at least 2 items; got ${n}`);
  if (dist.length !== (n * (n - 1)) / 2) throw new RangeError(`Expected ${(n * (n - 1)) / 2} condensed distances for ${n} items; got ${dist.length}`);
  if (weights && weights.length !== n) throw new RangeError(`Expected ${n} weights; got ${weights.length}`);
  const update = lanceWilliams(linkage);
  const size = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const w = weights ? weights[i] : 1;
    if (!(w > 0)) throw new RangeError(`Item ${i} has weight ${w}; weights must be positive`);
    size[i] = w;
  }
  const raw = new Float64Array((n - 1) * 4);
  const chain = new Int32Array(n);
  let chainLength = 0;

  for (let step = 0; step < n - 1; step++) {
    let x = 0;
    let y = 0;
    let best = Infinity;
    if (chainLength === 0) {
      let first = 0;
      while (size[first] === 0) first++;
      chain[chainLength++] = first;
    }
    for (;;) {
      x = chain[chainLength - 1];
      if (chainLength > 1) {
        y = chain[chainLength - 2];
        best = dist[condensedIndex(n, x, y)];
      } else {
        best = Infinity;
      }
      // Row x of the condensed triangle: column entries for i < x, then a contiguous run for i > x.
      for (let i = 0; i < x; i++) {
        if (size[i] === 0) continue;
        const v = dist[n * i - (i * (i + 1)) / 2 + (x - i - 1)];
        if (v < best) {
          best = v;
          y = i;
        }
      }
      const base = n * x - (x * (x + 1)) / 2 - x - 1;
      for (let i = x + 1; i < n; i++) {
        if (size[i] === 0) continue;
        const v = dist[base + i];
        if (v < best) {
          best = v;
          y = i;
        }
      }
      if (chainLength > 1 && y === chain[chainLength - 2]) break;
      chain[chainLength++] = y;
    }
    chainLength -= 2;
    if (x > y) {
      const t = x;
      x = y;
      y = t;
    }
    const nx = size[x];
    const ny = size[y];
    raw[step * 4] = x;
    raw[step * 4 + 1] = y;
    raw[step * 4 + 2] = best;
    raw[step * 4 + 3] = nx + ny;
    size[x] = 0;
    size[y] = nx + ny;
    // The merged group lives on in slot y; slot x is retired.
    // x < y. Positions of (i, x) and (i, y) walk down columns for i < x (and i < y), along rows after.
    const rowX = n * x - (x * (x + 1)) / 2 - x - 1;
    const rowY = n * y - (y * (y + 1)) / 2 - y - 1;
    for (let i = 0; i < n; i++) {
      const ni = size[i];
      if (ni === 0 || i === y) continue;
      const ix = i < x ? n * i - (i * (i + 1)) / 2 + (x - i - 1) : rowX + i;
      const iy = i < y ? n * i - (i * (i + 1)) / 2 + (y - i - 1) : rowY + i;
      dist[iy] = update(dist[ix], dist[iy], best, nx, ny, ni);
    }
    // Each merge costs O(n) (plus the chain's scans, amortised O(n)); 2^22/n merges is a few ms.
    if ((step + 1) % Math.max(1, Math.floor(4_194_304 / n)) === 0 || step === n - 2) yield { stage: 'merge', done: step + 1, total: n - 1 };
  }
  return relabel(raw, n);
}

/** `linkageSteps` run to the end. Same parameters. */
export function linkageFromCondensed(dist: Float64Array, n: number, linkage: Linkage, weights?: ArrayLike<number>): LinkageMatrix {
  return drain(linkageSteps(dist, n, linkage, weights));
}

/** d(i, x∪y) from d(i, x), d(i, y), d(x, y) and the group sizes. */
type Update = (dxi: number, dyi: number, dxy: number, nx: number, ny: number, ni: number) => number;

function lanceWilliams(linkage: Linkage): Update {
  switch (linkage) {
    case 'average':
      return (dxi, dyi, _dxy, nx, ny) => (nx * dxi + ny * dyi) / (nx + ny);
    case 'complete':
      return (dxi, dyi) => (dxi > dyi ? dxi : dyi);
    case 'ward':
      return (dxi, dyi, dxy, nx, ny, ni) => {
        const t = 1 / (nx + ny + ni);
        const s = (ni + nx) * t * dxi * dxi + (ni + ny) * t * dyi * dyi - ni * t * dxy * dxy;
        return Math.sqrt(s > 0 ? s : 0);
      };
    default:
      return assertUnreachable(linkage);
  }
}

/**
 * Puts merges in SciPy's canonical form: sorted stably by height, each merge naming the two
 * clusters it joins (items 0..n−1, then n + r for the cluster formed by row r), smaller id first.
 */
function relabel(raw: Float64Array, n: number): LinkageMatrix {
  const order = Array.from({ length: n - 1 }, (_, r) => r);
  order.sort((a, b) => raw[a * 4 + 2] - raw[b * 4 + 2] || a - b);
  const parent = new Int32Array(2 * n - 1);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  const find = (v: number): number => {
    let root = v;
    while (parent[root] !== root) root = parent[root];
    while (parent[v] !== root) {
      const next = parent[v];
      parent[v] = root;
      v = next;
    }
    return root;
  };
  const merges = new Float64Array((n - 1) * 4);
  for (let r = 0; r < n - 1; r++) {
    const src = order[r] * 4;
    const a = find(raw[src]);
    const b = find(raw[src + 1]);
    merges[r * 4] = Math.min(a, b);
    merges[r * 4 + 1] = Math.max(a, b);
    merges[r * 4 + 2] = raw[src + 2];
    merges[r * 4 + 3] = raw[src + 3];
    parent[a] = n + r;
    parent[b] = n + r;
  }
  return { n, merges };
}

/**
 * Cuts a tree into exactly `k` clusters by undoing its last k − 1 merges.
 * Clusters are numbered 0..k−1 in order of their first item, so equal partitions get equal labels.
 * @param tree a linkage matrix (from `linkageFromCondensed`).
 * @param k number of clusters, 1 ≤ k ≤ n.
 * @returns cluster index per item.
 */
export function cutTree(tree: LinkageMatrix, k: number): Int32Array {
  const { n, merges } = tree;
  if (!Number.isInteger(k) || k < 1 || k > n) throw new RangeError(`Cannot cut a tree of ${n} items into ${k} clusters; choose k between 1 and ${n}`);
  const parent = new Int32Array(2 * n - 1);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  for (let r = 0; r < n - k; r++) {
    parent[merges[r * 4]] = n + r;
    parent[merges[r * 4 + 1]] = n + r;
  }
  const rootLabel = new Int32Array(2 * n - 1).fill(-1);
  const labels = new Int32Array(n);
  let next = 0;
  for (let i = 0; i < n; i++) {
    let root = i;
    while (parent[root] !== root) root = parent[root];
    for (let v = i; parent[v] !== root; ) {
      const up = parent[v];
      parent[v] = root;
      v = up;
    }
    if (rootLabel[root] < 0) rootLabel[root] = next++;
    labels[i] = rootLabel[root];
  }
  return labels;
}
