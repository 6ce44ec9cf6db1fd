import { afterAll, describe, expect, it } from 'vitest';
import { analyse } from '../../server/cluster/analyse.js';
import { lsa } from '../../server/cluster/lsa.js';
import { seededRandom } from '../../server/common/random.js';
import { sharedFloat64, type Spare } from '../../server/common/spare.js';
import { SpareThread } from '../../server/jobs/spare-thread.js';
import { nearestNeighbors, project } from '../../server/map/index.js';
import { fitTfidf } from '../../server/text/index.js';
import { syntheticDocuments } from '../helpers/synthetic-corpus.js';

// The spare thread runs the built entry (global setup builds dist/ first), with the same engine code.
const spare = new SpareThread(new URL('../../dist/server/jobs/spare-main.js', import.meta.url));
afterAll(() => spare.close());

const docs = syntheticDocuments(10_000, 6, 40, 5).map((d) => d.text);
const { matrix, vectorizer } = fitTfidf(docs);

/** The thread, counting the tasks handed to it by name. */
function counted(): { spare: Spare; counts: Map<string, number> } {
  const counts = new Map<string, number>();
  return {
    counts,
    spare: {
      threads: spare.threads,
      start: <O>(task: string, input: unknown) => {
        counts.set(task, (counts.get(task) ?? 0) + 1);
        return spare.start<O>(task, input);
      },
    },
  };
}

describe('a spare thread', () => {
  it('gives LSA rows bit for bit equal to one thread, with and without a row sample for the range finder', () => {
    for (const rangeRows of [20_000, 4000]) {
      const alone = lsa(matrix, { dimensions: 40, random: seededRandom(3), rangeRows });
      const c = counted();
      const shared = lsa(matrix, { dimensions: 40, random: seededRandom(3), rangeRows, spare: c.spare });
      expect(shared.reduced.data).toEqual(alone.reduced.data);
      expect(shared.singularValues).toEqual(alone.singularValues);
      // Every kind of split was taken by the thread.
      for (const task of ['lsa.multiply', 'lsa.gram']) expect(c.counts.get(task)).toBeGreaterThan(0);
    }
  });

  it('gives the same whole analysis (curve, k, labels) as one thread', () => {
    const opts = { k: 'auto' as const, kMin: 2, kMax: 10, seed: 9, silhouetteSampleSize: 800 };
    const alone = analyse(matrix, vectorizer.labels, opts);
    const c = counted();
    const shared = analyse(matrix, vectorizer.labels, opts, c.spare);
    expect(c.counts.get('sweep.fresh')).toBe(9);
    expect(shared.silhouetteByK).toEqual(alone.silhouetteByK);
    expect(shared.referenceByK).toEqual(alone.referenceByK);
    expect(shared.k).toBe(alone.k);
    expect(shared.labels).toEqual(alone.labels);
    expect(shared.k).toBe(6);
  });

  it('gives the same neighbour graph as one thread (candidate pairs measured on the spare)', () => {
    const rows = lsa(matrix, { dimensions: 30, random: seededRandom(3) }).reduced;
    const alone = nearestNeighbors(rows, { k: 10, random: seededRandom(4) });
    const c = counted();
    const shared = nearestNeighbors(rows, { k: 10, random: seededRandom(4) }, c.spare);
    expect(c.counts.get('knn.join-share')).toBeGreaterThan(0);
    expect(shared.indices).toEqual(alone.indices);
    expect(shared.distances).toEqual(alone.distances);
  });

  it('gives the same map as one thread (trees, pairs, half the σ search, the principal axes and half the layout on the spare)', () => {
    const all = lsa(matrix, { dimensions: 30, random: seededRandom(3) }).reduced;
    const rows = { rows: 4000, cols: all.cols, data: all.data.slice(0, 4000 * all.cols) };
    const opts = { random: seededRandom(6), sliceEdges: 20_000, halvesFrom: 1000, epochs: 60 };
    const alone = project(rows, opts);
    const c = counted();
    const shared = project(rows, { ...opts, random: seededRandom(6) }, c.spare);
    for (const task of ['knn.tree', 'knn.join-share', 'knn.sample-own', 'knn.settle-own', 'graph.smooth', 'map.pca', 'layout.half']) expect(c.counts.get(task)).toBeGreaterThan(0);
    expect(shared).toEqual(alone);
  });

  it("passes a task's error back to the caller, and the thread keeps working", () => {
    expect(() => spare.start('no.such.task', {}).wait()).toThrow(/Unknown spare task "no.such.task"/);
    const out = sharedFloat64(4);
    const x = { rows: 1, cols: 2, indptr: new Uint32Array(new SharedArrayBuffer(8)), indices: new Uint32Array(new SharedArrayBuffer(0)), values: new Float32Array(new SharedArrayBuffer(0)) };
    expect(spare.start('lsa.multiply', { x, dense: new Float32Array(new SharedArrayBuffer(8)), w: 1, out, r0: 0, r1: 1 }).wait()).toBeUndefined();
  });

  it('drops the answers of tasks nobody will wait for once told to forget them', () => {
    const out = sharedFloat64(4);
    const x = { rows: 1, cols: 2, indptr: new Uint32Array(new SharedArrayBuffer(8)), indices: new Uint32Array(new SharedArrayBuffer(0)), values: new Float32Array(new SharedArrayBuffer(0)) };
    const input = { x, dense: new Float32Array(new SharedArrayBuffer(8)), w: 1, out, r0: 0, r1: 1 };
    spare.start('lsa.multiply', input);
    spare.start('lsa.multiply', input);
    spare.forget();
    // A later task is answered as usual; the two forgotten answers are dropped when they arrive.
    expect(spare.start('lsa.multiply', input).wait()).toBeUndefined();
    expect((spare as unknown as { answers: Map<number, unknown> }).answers.size).toBe(0);
  });

  it('refuses typed arrays that are not on shared memory (the results written there would be lost)', () => {
    expect(() => spare.start('lsa.gram', { a: new Float64Array(4), rows: 2, w: 2, out: sharedFloat64(4), i0: 0, i1: 2 })).toThrow(/not on shared memory/);
  });
});
