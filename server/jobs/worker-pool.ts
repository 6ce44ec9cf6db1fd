import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { CancelledError, TaskError, type FromWorker, type Progress } from './api.js';

/** Options of the worker pool. */
export interface WorkerPoolOptions {
  /** Number of worker threads. @default os.availableParallelism() */
  size: number;
  /**
   * How long a cancelled run may keep going before its worker is terminated and replaced; engine
   * steps are short, so this only bites when a step is not.
   * @default 1500
   */
  cancelGraceMs: number;
  /** The worker entry module. @default ./worker-main.js beside this file */
  workerUrl: URL;
}

export const DEFAULT_WORKER_POOL_OPTIONS: WorkerPoolOptions = {
  size: availableParallelism(),
  cancelGraceMs: 1500,
  workerUrl: new URL('./worker-main.js', import.meta.url),
};

interface Run {
  id: number;
  task: string;
  input: unknown;
  onProgress: (p: Progress) => void;
  signal?: AbortSignal;
  cancel: SharedArrayBuffer;
  resolve: (v: unknown) => void;
  reject: (e: unknown) => void;
}

interface Slot {
  worker: Worker;
  run: Run | null;
}

/**
 * A fixed set of worker threads running step-wise tasks, so long computations never block the
 * HTTP thread. Runs wait in FIFO order for a free worker. Cancelling sets a shared flag the worker
 * checks between steps; if the worker has not stopped within `cancelGraceMs`, it is terminated and
 * replaced, so a cancel always takes effect within about two seconds.
 */
export class WorkerPool {
  private readonly opts: WorkerPoolOptions;
  private readonly slots: Slot[] = [];
  private readonly waiting: Run[] = [];
  private nextId = 1;
  private closed = false;

  constructor(opts: Partial<WorkerPoolOptions> = {}) {
    this.opts = { ...DEFAULT_WORKER_POOL_OPTIONS, ...opts };
    if (!Number.isInteger(this.opts.size) || this.opts.size < 1) throw new RangeError(`Worker pool size must be a positive integer, got ${this.opts.size}`);
    for (let i = 0; i < this.opts.size; i++) this.slots.push({ worker: this.spawn(), run: null });
  }

  /** Number of worker threads. */
  get size(): number {
    return this.slots.length;
  }

  /** Runs are in progress or waiting. */
  get busy(): number {
    return this.slots.filter((s) => s.run).length + this.waiting.length;
  }

  private spawn(): Worker {
    const worker = new Worker(this.opts.workerUrl, { resourceLimits: { maxOldGenerationSizeMb: 8192 } });
    worker.on('message', (msg: FromWorker) => this.onMessage(worker, msg));
    worker.on('error', (err) => this.onCrash(worker, err));
    worker.on('exit', (code) => {
      if (!this.closed) this.onCrash(worker, new Error(`worker exited with code ${code}`));
    });
    worker.unref();
    return worker;
  }

  /**
   * Runs `task` with `input` on a worker.
   * @returns the task's result; rejects with CancelledError when `signal` aborts, TaskError when the task throws.
   */
  run<T>(task: string, input: unknown, onProgress: (p: Progress) => void = () => {}, signal?: AbortSignal): Promise<T> {
    if (this.closed) return Promise.reject(new Error('The worker pool is closed.'));
    if (signal?.aborted) return Promise.reject(new CancelledError());
    return new Promise<T>((resolve, reject) => {
      const run: Run = {
        id: this.nextId++,
        task,
        input,
        onProgress,
        signal,
        cancel: new SharedArrayBuffer(4),
        resolve: resolve as (v: unknown) => void,
        reject,
      };
      signal?.addEventListener('abort', () => this.cancel(run), { once: true });
      this.waiting.push(run);
      this.dispatch();
    });
  }

  private dispatch(): void {
    for (const slot of this.slots) {
      if (slot.run || this.waiting.length === 0) continue;
      const run = this.waiting.shift()!;
      slot.run = run;
      slot.worker.postMessage({ type: 'run', runId: run.id, task: run.task, input: run.input, cancel: run.cancel });
    }
  }

  private cancel(run: Run): void {
    const queued = this.waiting.indexOf(run);
    if (queued >= 0) {
      this.waiting.splice(queued, 1);
      run.reject(new CancelledError());
      return;
    }
    const slot = this.slots.find((s) => s.run === run);
    if (!slot) return;
    Atomics.store(new Int32Array(run.cancel), 0, 1);
    setTimeout(() => {
      if (slot.run !== run) return;
      // The worker is stuck inside one long step: replace it.
      const old = slot.worker;
      slot.worker = this.spawn();
      slot.run = null;
      old.removeAllListeners('exit');
      void old.terminate();
      run.reject(new CancelledError());
      this.dispatch();
    }, this.opts.cancelGraceMs).unref();
  }

  private onMessage(worker: Worker, msg: FromWorker): void {
    const slot = this.slots.find((s) => s.worker === worker);
    const run = slot?.run;
    if (!slot || !run || run.id !== msg.runId) return;
    if (msg.type === 'progress') {
      run.onProgress(msg.progress);
      return;
    }
    slot.run = null;
    if (msg.type === 'done') run.resolve(msg.result);
    else if (msg.type === 'cancelled') run.reject(new CancelledError());
    else run.reject(new TaskError(msg.error.message, msg.error.name, msg.error.code));
    this.dispatch();
  }

  private onCrash(worker: Worker, err: Error): void {
    const slot = this.slots.find((s) => s.worker === worker);
    if (!slot || this.closed) return;
    const run = slot.run;
    slot.worker = this.spawn();
    slot.run = null;
    run?.reject(new TaskError(`The worker running this job stopped unexpectedly (${err.message}).`, 'WorkerCrash'));
    this.dispatch();
  }

  /** Stops all workers; waiting and running tasks are rejected. */
  async close(): Promise<void> {
    this.closed = true;
    for (const run of this.waiting.splice(0)) run.reject(new Error('The server is shutting down.'));
    await Promise.all(
      this.slots.map(async (s) => {
        s.run?.reject(new Error('The server is shutting down.'));
        s.run = null;
        await s.worker.terminate();
      }),
    );
  }
}
