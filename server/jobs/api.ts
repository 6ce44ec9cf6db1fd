/**
 * Types shared by the job machinery: what crosses between the HTTP thread and the workers.
 */
import type { Spare } from '../common/spare.js';
import type { Stepwise } from '../common/step.js';

/** Progress as shown to people: the phase and the fraction of the whole job done. */
export interface Progress {
  stage: string;
  /** 0..1 over the whole task, never decreasing. */
  fraction: number;
  /** The engine's own sub-phase, e.g. `knn` inside `map`. */
  detail?: string;
}

/** A step-wise computation run in a worker: input in, result out (both structured-cloneable). */
export interface TaskDefinition<I = unknown, O = unknown> {
  /**
   * Phases in order with their rough share of the running time, for the progress fraction. A phase
   * that runs an engine with phases of its own may list them as `parts`, so its share fills in order.
   */
  stages: readonly { name: string; weight: number; parts?: readonly { name: string; weight: number }[] }[];
  /**
   * The computation. `spare` is a thread of the worker's own that engines may hand part of their
   * rows to (see server/common/spare.ts); results do not depend on it.
   */
  run(input: I, env: TaskEnv): Stepwise<O>;
}

/** What a worker gives each task besides its input. */
export interface TaskEnv {
  spare: Spare;
}

/** Messages from the HTTP thread to a worker. */
export type ToWorker = { type: 'run'; runId: number; task: string; input: unknown; cancel: SharedArrayBuffer };

/** Messages from a worker to the HTTP thread. */
export type FromWorker =
  | { type: 'progress'; runId: number; progress: Progress }
  | { type: 'done'; runId: number; result: unknown }
  | { type: 'failed'; runId: number; error: { name: string; message: string; code?: string } }
  | { type: 'cancelled'; runId: number };

/** Thrown by `WorkerPool.run` when the run was cancelled. */
export class CancelledError extends Error {
  constructor() {
    super('The job was cancelled.');
    this.name = 'CancelledError';
  }
}

/** A failure inside a task, carrying the error class name so callers can map input errors (RangeError) to 422. */
export class TaskError extends Error {
  constructor(
    message: string,
    readonly errorName: string,
    readonly code?: string,
  ) {
    super(message);
    this.name = 'TaskError';
  }
}
