/**
 * Work handed to another thread without leaving synchronous engine code.
 *
 * Engine functions are synchronous generators, so a second core is reached through a blocking
 * hand-off: `start` gives a named task and its input to a spare thread and returns at once; the
 * caller does its own share, then `wait()` blocks until the spare's answer is in. Tasks are pure
 * functions looked up by name in a table both threads import, so the engine never imports the
 * thread machinery (server/jobs provides it). Large arrays are shared, not copied: allocate them
 * with {@link sharedFloat64} and friends, and a task writes its rows straight into them.
 *
 * Splits must not depend on how many threads there are: a task computes exactly what the caller
 * would have computed in that range, so results are the same with or without a spare.
 */

/** A task a spare thread can run: a pure function of structured-cloneable input. */
export type SpareTask = (input: any) => unknown;

/** A table of tasks by name. */
export type SpareTasks = Readonly<Record<string, SpareTask>>;

/** A started task. */
export interface Pending<O> {
  /** Blocks until the task is done; returns its result or throws its error. Call once. */
  wait(): O;
}

/** Somewhere to run tasks besides the calling thread. */
export interface Spare {
  /** Threads that run tasks besides the caller's (0: tasks run inline, in `wait`). */
  readonly threads: number;
  /** Starts `task` (a name in the shared task table) on `input`. */
  start<O>(task: string, input: unknown): Pending<O>;
}

/**
 * A spare with no thread: each task runs in the caller's thread when it is awaited. The default of
 * every engine function that takes a spare, so results never depend on having one.
 * @param tasks the task table to look names up in
 */
export function inlineSpare(tasks: SpareTasks): Spare {
  return {
    threads: 0,
    start<O>(task: string, input: unknown): Pending<O> {
      const run = tasks[task];
      if (!run) throw new RangeError(`Unknown spare task "${task}"`);
      return { wait: () => run(input) as O };
    },
  };
}

/** True when typed arrays on shared memory can be made here (always on Node 20). */
const canShare = typeof SharedArrayBuffer === 'function';

/** A zeroed Float64Array on shared memory (a plain one where sharing is unavailable). */
export function sharedFloat64(length: number): Float64Array {
  return canShare ? new Float64Array(new SharedArrayBuffer(8 * length)) : new Float64Array(length);
}

/** A zeroed Float32Array on shared memory. */
export function sharedFloat32(length: number): Float32Array {
  return canShare ? new Float32Array(new SharedArrayBuffer(4 * length)) : new Float32Array(length);
}

/** A zeroed Int32Array on shared memory. */
export function sharedInt32(length: number): Int32Array {
  return canShare ? new Int32Array(new SharedArrayBuffer(4 * length)) : new Int32Array(length);
}

/** A zeroed Uint32Array on shared memory. */
export function sharedUint32(length: number): Uint32Array {
  return canShare ? new Uint32Array(new SharedArrayBuffer(4 * length)) : new Uint32Array(length);
}

/** A zeroed Uint8Array on shared memory. */
export function sharedUint8(length: number): Uint8Array {
  return canShare ? new Uint8Array(new SharedArrayBuffer(length)) : new Uint8Array(length);
}

/** `a` itself when already on shared memory, else a shared copy. */
export function toShared<T extends Float64Array | Float32Array | Int32Array | Uint32Array>(a: T): T {
  if (!canShare || a.buffer instanceof SharedArrayBuffer) return a;
  const Ctor = a.constructor as new (b: SharedArrayBuffer) => T;
  const out = new Ctor(new SharedArrayBuffer(a.byteLength));
  (out as unknown as { set(x: T): void }).set(a);
  return out;
}

/**
 * Cut points splitting `0..total` into `parts` ranges of about equal `weight(i)` (rows by default),
 * so that each thread gets a like share of work. Always `parts + 1` entries, first 0, last total.
 */
export function splitRange(total: number, parts: number, weight?: (end: number) => number): number[] {
  const cuts = [0];
  if (!weight) {
    for (let p = 1; p < parts; p++) cuts.push(Math.round((total * p) / parts));
  } else {
    // weight(end) is the cumulative weight of 0..end; bisect for each share.
    const all = weight(total);
    for (let p = 1; p < parts; p++) {
      const goal = (all * p) / parts;
      let lo = cuts[cuts.length - 1], hi = total;
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (weight(mid) < goal) lo = mid + 1;
        else hi = mid;
      }
      cuts.push(lo);
    }
  }
  cuts.push(total);
  return cuts;
}

/** Options of {@link splitRowsSteps}. */
export interface SplitRowsOptions {
  /** Where the far share of each chunk runs. */
  spare: Spare;
  /** Rows per slice done here between two steps. */
  slice: number;
  /** Cumulative work of rows 0..end, to balance shares; rows count alike without it. */
  weight?: (end: number) => number;
  /** Starts rows r0..r1 on the spare. */
  far: (r0: number, r1: number) => Pending<unknown>;
  /** Does rows r0..r1 here. */
  here: (r0: number, r1: number) => void;
}

/**
 * Rows 0..total done in slices of `slice` rows here, a step yielded after each (with `step.done`
 * advanced by the rows finished). With a spare thread, the rows are cut into chunks of a few
 * slices; the spare takes the second half of each chunk (by weight) while this thread does the
 * first, so both cores work and a cancel still lands within one slice or so.
 * @returns when every row is done
 */
export function* splitRowsSteps<S extends { done: number }>(total: number, step: S, o: SplitRowsOptions): Generator<S, void, void> {
  const weight = o.weight ?? ((end: number) => end);
  if (o.spare.threads === 0 || total < 2 * o.slice) {
    for (let r0 = 0; r0 < total; r0 += o.slice) {
      const r1 = Math.min(total, r0 + o.slice);
      o.here(r0, r1);
      step.done += r1 - r0;
      yield { ...step };
    }
    return;
  }
  const chunk = 8 * o.slice;
  for (let c0 = 0; c0 < total; c0 += chunk) {
    const c1 = Math.min(total, c0 + chunk);
    const [, cut] = splitRange(c1 - c0, 2, (end) => weight(c0 + end) - weight(c0));
    const mid = c0 + cut;
    const far = mid < c1 ? o.far(mid, c1) : null;
    for (let r0 = c0; r0 < mid; r0 += o.slice) {
      const r1 = Math.min(mid, r0 + o.slice);
      o.here(r0, r1);
      step.done += r1 - r0;
      yield { ...step };
    }
    far?.wait();
    step.done += c1 - mid;
    yield { ...step };
  }
}
