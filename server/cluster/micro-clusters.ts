/**
 * Many small groups of nearby documents, cheaply: the first stage of agglomerative clustering on
 * large inputs (see agglomerate.ts).
 *
 * A flat spherical k-means into m ≈ 256 groups costs n·m·d per pass (1.3·10⁹ multiply-adds at
 * 50,000 × 100) plus k-means++ seeding of the same order, tens of seconds in JavaScript. Two
 * levels cost about n·(g + m/g)·d: first g = ⌈√m⌉ coarse groups, then each coarse group split
 * into a share of m proportional to its size. The groups only need to be small and tight, not
 * optimal, so a few Lloyd iterations at each level are enough.
 */
import type { Dense } from '../common/matrix.js';
import type { Random } from '../common/random.js';
import type { Stepwise } from '../common/step.js';
import { sphericalKmeansSteps } from './spherical-kmeans.js';

/**
 * Partitions unit rows into about `m` micro-clusters in two levels of spherical k-means.
 * Yields `"micro-clusters"` steps (done counts coarse groups split, of g + 1 units).
 * @param x unit-norm rows.
 * @param m wanted number of micro-clusters, 1 ≤ m ≤ rows; the result may have slightly more or
 *   fewer (shares are rounded), never more than the rows.
 * @param random source of randomness.
 * @param iterations Lloyd iterations at each level.
 * @returns micro-cluster index per row and the number of micro-clusters (indices 0..count−1; none empty
 *   unless k-means left one empty, which the caller must tolerate).
 */
export function* microClustersSteps(x: Dense, m: number, random: Random, iterations: number): Stepwise<{ labels: Int32Array; count: number }> {
  const n = x.rows;
  const d = x.cols;
  if (!Number.isInteger(m) || m < 1 || m > n) throw new RangeError(`Cannot make ${m} micro-clusters of ${n} rows; choose 1 to ${n}`);
  const g = Math.min(n, Math.ceil(Math.sqrt(m)));
  const total = g + 1;
  const opts = { random, restarts: 1, maxIterations: iterations, seedTrials: 1, stage: 'micro-clusters' };
  const coarseGen = sphericalKmeansSteps(x, g, opts);
  let next = coarseGen.next();
  for (; !next.done; next = coarseGen.next()) yield { stage: 'micro-clusters', done: 0, total };
  const coarse = next.value.labels;

  // Rows of each coarse group, by counting sort.
  const start = new Int32Array(g + 1);
  for (let i = 0; i < n; i++) start[coarse[i] + 1]++;
  for (let c = 0; c < g; c++) start[c + 1] += start[c];
  const order = new Int32Array(n);
  const fill = start.slice(0, g);
  for (let i = 0; i < n; i++) order[fill[coarse[i]]++] = i;

  const labels = new Int32Array(n);
  let count = 0;
  for (let c = 0; c < g; c++) {
    const rows = order.subarray(start[c], start[c + 1]);
    const size = rows.length;
    if (size === 0) continue;
    const share = Math.min(size, Math.max(1, Math.round((m * size) / n)));
    if (share === 1) {
      for (const i of rows) labels[i] = count;
      count++;
    } else {
      const sub: Dense = { rows: size, cols: d, data: new Float32Array(size * d) };
      for (let r = 0; r < size; r++) sub.data.set(x.data.subarray(rows[r] * d, (rows[r] + 1) * d), r * d);
      const fineGen = sphericalKmeansSteps(sub, share, opts);
      let step = fineGen.next();
      for (; !step.done; step = fineGen.next()) yield { stage: 'micro-clusters', done: c + 1, total };
      const fine = step.value.labels;
      for (let r = 0; r < size; r++) labels[rows[r]] = count + fine[r];
      count += share;
    }
    yield { stage: 'micro-clusters', done: c + 1, total };
  }
  yield { stage: 'micro-clusters', done: total, total };
  return { labels, count };
}
