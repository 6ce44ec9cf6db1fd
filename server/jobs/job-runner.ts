import { EventEmitter } from 'node:events';
import type { JobKind, JobRecord, Store } from '../store/api.js';
import { CancelledError, TaskError, type Progress } from './api.js';
import type { WorkerPool } from './worker-pool.js';

/** What a job handler gets: the pool, a cancel signal and a way to report progress. */
export interface JobContext {
  pool: WorkerPool;
  signal: AbortSignal;
  report(p: Progress): void;
}

/** Runs one kind of job: loads its input from the store, computes, stores the result. */
export interface JobHandler {
  run(job: JobRecord, ctx: JobContext): Promise<void>;
}

/** An event on a job's stream: progress while it runs, then exactly one `end`. */
export type JobEvent = { type: 'progress'; progress: Progress } | { type: 'end'; job: JobRecord };

export interface JobRunnerOptions {
  /** How many jobs run at once on this server. @default the pool size */
  concurrency: number;
  /** Least time between progress writes to the store, per job. @default 250 */
  progressWriteMs: number;
  /** How often to look for queued jobs (others' replicas may enqueue). @default 1000 */
  pollMs: number;
}

/**
 * Takes queued jobs from the store (the queue lives there, so several replicas can share it),
 * runs them through their handlers, records progress and outcome, and fans events out to
 * listeners (the SSE streams).
 */
export class JobRunner {
  private readonly events = new EventEmitter();
  private readonly running = new Map<string, AbortController>();
  private readonly opts: JobRunnerOptions;
  private timer: NodeJS.Timeout | null = null;
  private pumping = false;
  private stopped = false;

  constructor(
    private readonly store: Store,
    private readonly pool: WorkerPool,
    private readonly handlers: Record<JobKind, JobHandler>,
    opts: Partial<JobRunnerOptions> = {},
  ) {
    this.opts = { concurrency: pool.size, progressWriteMs: 250, pollMs: 1000, ...opts };
    this.events.setMaxListeners(0);
  }

  /** Fails jobs a crash left running, then starts taking queued ones. */
  async start(): Promise<void> {
    await this.store.failInterrupted('The server stopped while this job was running; start it again.');
    this.timer = setInterval(() => void this.pump(), this.opts.pollMs);
    this.timer.unref();
    void this.pump();
  }

  /** Puts a job in the queue. */
  async enqueue(id: string, kind: JobKind, targetId: string): Promise<void> {
    await this.store.createJob(id, kind, targetId);
    void this.pump();
  }

  /** Requests cancellation; true when the job was queued or running here. */
  async cancel(id: string): Promise<boolean> {
    if (await this.store.cancelQueued(id)) {
      const job = await this.store.getJob(id);
      if (job) this.events.emit(id, { type: 'end', job } satisfies JobEvent);
      return true;
    }
    const ctl = this.running.get(id);
    if (!ctl) return false;
    ctl.abort();
    return true;
  }

  /** Listens to a job's events; returns the function that stops listening. */
  subscribe(id: string, listener: (e: JobEvent) => void): () => void {
    this.events.on(id, listener);
    return () => this.events.off(id, listener);
  }

  /** Number of jobs running on this server. */
  get active(): number {
    return this.running.size;
  }

  private async pump(): Promise<void> {
    if (this.pumping || this.stopped) return;
    this.pumping = true;
    try {
      while (!this.stopped && this.running.size < this.opts.concurrency) {
        const job = await this.store.claimJob(Object.keys(this.handlers) as JobKind[]);
        if (!job) break;
        void this.execute(job);
      }
    } finally {
      this.pumping = false;
    }
  }

  private async execute(job: JobRecord): Promise<void> {
    const ctl = new AbortController();
    this.running.set(job.id, ctl);
    let lastWrite = 0;
    const report = (progress: Progress) => {
      this.events.emit(job.id, { type: 'progress', progress } satisfies JobEvent);
      const now = Date.now();
      if (now - lastWrite >= this.opts.progressWriteMs) {
        lastWrite = now;
        void this.store.updateProgress(job.id, progress.stage, progress.fraction);
      }
    };
    try {
      await this.handlers[job.kind].run(job, { pool: this.pool, signal: ctl.signal, report });
      await this.store.finishJob(job.id, 'done');
    } catch (e) {
      if (this.stopped) {
        await this.store.finishJob(job.id, 'failed', { code: 'interrupted', message: 'The server was stopped while this job was running; start it again.' });
      } else if (e instanceof CancelledError || ctl.signal.aborted) {
        await this.store.finishJob(job.id, 'cancelled');
      } else {
        await this.store.finishJob(job.id, 'failed', describeFailure(e));
      }
    } finally {
      this.running.delete(job.id);
      const final = await this.store.getJob(job.id);
      if (final) this.events.emit(job.id, { type: 'end', job: final } satisfies JobEvent);
      void this.pump();
    }
  }

  /**
   * Stops taking jobs and stops the running ones, which end `failed` with the reason (so a person
   * sees they must be started again); waits until their outcome is recorded.
   */
  async stop(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    const ids = [...this.running.keys()];
    for (const ctl of this.running.values()) ctl.abort();
    const deadline = Date.now() + 5000;
    while (ids.some((id) => this.running.has(id)) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
  }
}

/** Turns a job failure into the `{code, message}` shown to people: input problems are `unprocessable`. */
export function describeFailure(e: unknown): { code: string; message: string } {
  if (e instanceof TaskError) {
    if (e.errorName === 'RangeError') return { code: 'unprocessable', message: e.message };
    return { code: e.code ?? 'internal', message: e.message };
  }
  if (e instanceof RangeError) return { code: 'unprocessable', message: e.message };
  const code = (e as { code?: unknown })?.code;
  return { code: typeof code === 'string' ? code : 'internal', message: e instanceof Error ? e.message : String(e) };
}
