import { describe, expect, it } from 'vitest';
import { microClustersSteps } from '../../server/cluster/micro-clusters.js';
import type { Dense } from '../../server/common/matrix.js';
import { randomNormal, seededRandom } from '../../server/common/random.js';
import { drain } from '../../server/common/step.js';

function blobs(centres: number, n: number, dims: number, noise: number, seed: number): { x: Dense; truth: Int32Array } {
  const random = seededRandom(seed);
  const dirs = Array.from({ length: centres }, () => Array.from({ length: dims }, () => randomNormal(random)));
  const data = new Float32Array(n * dims);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = Math.floor(random() * centres);
    truth[i] = c;
    let s = 0;
    for (let t = 0; t < dims; t++) {
      data[i * dims + t] = dirs[c][t] + noise * randomNormal(random);
      s += data[i * dims + t] ** 2;
    }
    for (let t = 0; t < dims; t++) data[i * dims + t] /= Math.sqrt(s);
  }
  return { x: { rows: n, cols: dims, data }, truth };
}

describe('microClustersSteps', () => {
  it('makes about m non-empty groups, each inside one well-separated blob', () => {
    const { x, truth } = blobs(6, 3000, 16, 0.25, 2);
    const { labels, count } = drain(microClustersSteps(x, 100, seededRandom(3), 6));
    expect(count).toBeGreaterThanOrEqual(90);
    expect(count).toBeLessThanOrEqual(110);
    const blobOf = new Int32Array(count).fill(-1);
    const sizes = new Int32Array(count);
    for (let i = 0; i < x.rows; i++) {
      expect(labels[i]).toBeGreaterThanOrEqual(0);
      expect(labels[i]).toBeLessThan(count);
      sizes[labels[i]]++;
      if (blobOf[labels[i]] < 0) blobOf[labels[i]] = truth[i];
      expect(blobOf[labels[i]]).toBe(truth[i]);
    }
    expect(sizes.every((s) => s > 0)).toBe(true);
  });

  it('is deterministic for a seed and reports "micro-clusters" progress up to done = total', () => {
    const { x } = blobs(4, 1500, 8, 0.8, 5);
    const a = drain(microClustersSteps(x, 49, seededRandom(7), 4));
    const gen = microClustersSteps(x, 49, seededRandom(7), 4);
    let next = gen.next();
    let last = { stage: '', done: 0, total: 0 };
    for (; !next.done; next = gen.next()) {
      expect(next.value.stage).toBe('micro-clusters');
      expect(next.value.done).toBeGreaterThanOrEqual(last.done);
      last = next.value;
    }
    expect(last.done).toBe(last.total);
    expect(Array.from(next.value.labels)).toEqual(Array.from(a.labels));
  });

  it('rejects a group count outside 1..rows', () => {
    const { x } = blobs(2, 10, 3, 0.1, 1);
    expect(() => drain(microClustersSteps(x, 11, seededRandom(1), 3))).toThrow(/choose 1 to 10/);
    expect(() => drain(microClustersSteps(x, 0, seededRandom(1), 3))).toThrow(RangeError);
  });
});
