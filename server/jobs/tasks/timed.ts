import type { Stepwise } from '../../common/step.js';

/**
 * Runs an engine generator as one named task stage: announces the stage (the engine's own phases
 * then show as its `detail`) and adds the stage's wall time to `timings`.
 */
export function* timed<R>(stage: string, gen: Stepwise<R>, timings: Record<string, number>): Stepwise<R> {
  const t0 = performance.now();
  yield { stage, done: 0, total: 1 };
  for (;;) {
    const next = gen.next();
    if (next.done) {
      timings[stage] = (timings[stage] ?? 0) + (performance.now() - t0) / 1000;
      yield { stage, done: 1, total: 1 };
      return next.value;
    }
    yield next.value;
  }
}
