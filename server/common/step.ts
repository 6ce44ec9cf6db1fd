/**
 * A unit of progress reported by long engine computations.
 *
 * Engine functions that may run for more than a moment are generators that yield a `Step`
 * after each bounded slice of work. Whoever drains the generator decides what to do between
 * slices: report progress, check a cancel signal, or nothing at all.
 */
export interface Step {
  /** Short machine name of the phase, e.g. `"knn"` or `"sweep-k"`. */
  stage: string;
  /** Units of the phase completed so far. */
  done: number;
  /** Units in the whole phase (`done === total` when the phase ends). */
  total: number;
}

/** A step-wise computation that finally returns `R`. */
export type Stepwise<R> = Generator<Step, R, void>;

/**
 * Runs a step-wise computation to the end and returns its result.
 * The plain (non-generator) form of every engine function is this applied to its generator,
 * so there is exactly one copy of each loop.
 */
export function drain<R>(gen: Stepwise<R>): R {
  for (;;) {
    const next = gen.next();
    if (next.done) return next.value;
  }
}
