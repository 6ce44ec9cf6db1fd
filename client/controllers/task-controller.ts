import type { ReactiveController, ReactiveControllerHost } from 'lit';

/** Where a task stands. */
export enum TaskStatus {
  /** Never run. */
  Idle = 'idle',
  /** Running now. */
  Pending = 'pending',
  /** Finished with a value. */
  Complete = 'complete',
  /** Finished with an error. */
  Error = 'error',
}

/**
 * Runs one async job at a time for a component (loading a list, sending a form). Starting a new
 * run aborts the previous one through its AbortSignal, so a slow stale answer never overwrites a
 * newer one; disconnecting the host aborts too.
 */
export class TaskController<T> implements ReactiveController {
  /** Current status. */
  status: TaskStatus = TaskStatus.Idle;
  /** Value of the last completed run. */
  value: T | undefined;
  /** Error of the last failed run. */
  error: unknown;
  private abort: AbortController | null = null;
  private readonly host: ReactiveControllerHost;

  /** @param host the component to re-render on every status change */
  constructor(host: ReactiveControllerHost) {
    this.host = host;
    host.addController(this);
  }

  /**
   * Starts a run, aborting any run still going.
   * @param work the job; it should pass the signal to fetch
   * @returns the value, or undefined when the run failed or was superseded
   */
  async run(work: (signal: AbortSignal) => Promise<T>): Promise<T | undefined> {
    this.abort?.abort();
    const ctl = new AbortController();
    this.abort = ctl;
    this.status = TaskStatus.Pending;
    this.error = undefined;
    this.host.requestUpdate();
    try {
      const value = await work(ctl.signal);
      if (ctl.signal.aborted) return undefined;
      this.value = value;
      this.status = TaskStatus.Complete;
      return value;
    } catch (err) {
      if (ctl.signal.aborted) return undefined;
      this.error = err;
      this.status = TaskStatus.Error;
      return undefined;
    } finally {
      if (this.abort === ctl) {
        this.abort = null;
        this.host.requestUpdate();
      }
    }
  }

  /** Aborts the run in progress, if any, keeping the last value. */
  cancel(): void {
    if (!this.abort) return;
    this.abort.abort();
    this.abort = null;
    this.status = this.value === undefined ? TaskStatus.Idle : TaskStatus.Complete;
    this.host.requestUpdate();
  }

  /** @internal */
  hostDisconnected(): void {
    this.cancel();
  }
}
