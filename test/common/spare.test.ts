import { describe, expect, it } from 'vitest';
import { inlineSpare, sharedFloat64, splitRange, splitRowsSteps, toShared, type Pending, type Spare } from '../../server/common/spare.js';

describe('splitRange', () => {
  it('cuts rows into equal shares, first 0 and last the total', () => {
    expect(splitRange(10, 2)).toEqual([0, 5, 10]);
    expect(splitRange(7, 3)).toEqual([0, 2, 5, 7]);
    expect(splitRange(0, 2)).toEqual([0, 0, 0]);
  });

  it('balances by cumulative weight: rows of a triangle split where half the area lies', () => {
    // Row i of a 100×100 upper triangle holds 100 − i entries; half of 5050 is reached at row 30
    // (cumulative 30·100 − 30·29/2 = 2565 ≥ 2525, while row 29 gives 2494).
    const w = 100;
    const cuts = splitRange(w, 2, (end) => end * w - (end * (end - 1)) / 2);
    expect(cuts).toEqual([0, 30, 100]);
  });
});

/** A spare whose tasks wait until `wait` and are counted: shows which rows went where. */
function countingSpare(tasks: Record<string, (i: any) => unknown>): Spare & { started: number } {
  const inner = inlineSpare(tasks);
  const s = {
    threads: 1,
    started: 0,
    start<O>(task: string, input: unknown): Pending<O> {
      s.started++;
      return inner.start<O>(task, input);
    },
  };
  return s;
}

describe('splitRowsSteps', () => {
  for (const threads of [0, 1]) {
    it(`visits every row exactly once and reports them all (${threads} spare threads)`, () => {
      const total = 1000;
      const seen = new Int32Array(total);
      const mark = (r0: number, r1: number) => { for (let r = r0; r < r1; r++) seen[r]++; };
      const counting = countingSpare({ mark: (i: { r0: number; r1: number }) => mark(i.r0, i.r1) });
      const spare: Spare = threads ? counting : inlineSpare({});
      const step = { stage: 't', done: 0, total };
      const gen = splitRowsSteps(total, step, {
        spare,
        slice: 37,
        weight: (end) => end * 2,
        far: (r0, r1) => spare.start('mark', { r0, r1 }),
        here: mark,
      });
      let steps = 0;
      for (let n = gen.next(); !n.done; n = gen.next()) steps++;
      expect(Array.from(seen).every((v) => v === 1)).toBe(true);
      expect(step.done).toBe(total);
      expect(steps).toBeGreaterThan(10);
      if (threads) expect(counting.started).toBeGreaterThan(1);
    });
  }
});

describe('inlineSpare and shared arrays', () => {
  it('runs a task when it is awaited and refuses unknown names', () => {
    const spare = inlineSpare({ twice: (i: number) => 2 * i });
    expect(spare.start<number>('twice', 21).wait()).toBe(42);
    expect(() => spare.start('nope', 1)).toThrow(/Unknown spare task "nope"/);
  });

  it('allocates on shared memory and copies plain arrays there once', () => {
    const a = sharedFloat64(4);
    expect(a.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(toShared(a)).toBe(a);
    const plain = Float32Array.from([1, 2, 3]);
    const copy = toShared(plain);
    expect(copy.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Array.from(copy)).toEqual([1, 2, 3]);
  });
});
