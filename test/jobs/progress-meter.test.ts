import { describe, expect, it } from 'vitest';
import { ProgressMeter } from '../../server/jobs/progress-meter.js';

describe('progress meter', () => {
  const stages = [
    { name: 'a', weight: 1 },
    { name: 'b', weight: 3, parts: [{ name: 'b1', weight: 1 }, { name: 'b2', weight: 1 }] },
  ];

  it('weights stages and fills a stage’s share by its inner phases in order', () => {
    const m = new ProgressMeter(stages);
    expect(m.update({ stage: 'a', done: 1, total: 2 }).fraction).toBeCloseTo(0.125);
    expect(m.update({ stage: 'b', done: 0, total: 1 })).toEqual({ stage: 'b', fraction: 0.25 });
    expect(m.update({ stage: 'b1', done: 1, total: 1 })).toEqual({ stage: 'b', fraction: 0.625, detail: 'b1' });
    expect(m.update({ stage: 'b2', done: 1, total: 2 }).fraction).toBeCloseTo(0.8125);
    expect(m.update({ stage: 'b2', done: 2, total: 2 }).fraction).toBeCloseTo(1);
  });

  it('never goes backwards, whatever order steps come in', () => {
    const m = new ProgressMeter(stages);
    let last = 0;
    for (const s of [
      { stage: 'a', done: 2, total: 2 },
      { stage: 'a', done: 0, total: 2 },
      { stage: 'b', done: 0, total: 1 },
      { stage: 'b2', done: 1, total: 1 },
      { stage: 'b1', done: 0, total: 1 },
      { stage: 'unknown', done: 5, total: 9 },
    ]) {
      const f = m.update(s).fraction;
      expect(f).toBeGreaterThanOrEqual(last);
      last = f;
    }
  });
});
