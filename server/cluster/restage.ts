import type { Step, Stepwise } from '../common/step.js';

/**
 * Passes on an inner computation's steps under another stage name, keeping its progress, so a
 * pipeline reports only its own documented stages.
 * @param inner the computation
 * @param stage the stage name to report
 * @param outer when given, report this progress (of an enclosing loop) instead of the inner one
 */
export function* restageSteps<R>(inner: Stepwise<R>, stage: string, outer?: Step): Stepwise<R> {
  for (;;) {
    const next = inner.next();
    if (next.done) return next.value;
    const s: Step = outer ?? next.value;
    yield { stage, done: s.done, total: s.total };
  }
}
