import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { api } from '../api/client.js';
import type { JobStatus, ProgressEvent } from '../api/types.js';

/** Where the followed job stands, as far as the page knows. */
export enum JobPhase {
  /** Not following anything. */
  Idle = 'idle',
  /** Queued or running; progress arrives. */
  Running = 'running',
  /** Finished with a result. */
  Done = 'done',
  /** Ended with an error. */
  Failed = 'failed',
  /** Stopped on request. */
  Cancelled = 'cancelled',
}

/** Which kind of job, for the URL of its events and cancel endpoints. */
export type JobKind = 'analyses' | 'routers';

function phaseOf(status: JobStatus): JobPhase {
  switch (status) {
    case 'queued':
    case 'running':
      return JobPhase.Running;
    case 'done':
      return JobPhase.Done;
    case 'failed':
      return JobPhase.Failed;
    case 'cancelled':
      return JobPhase.Cancelled;
    default:
      return JobPhase.Running;
  }
}

/** Longest the fallback poll runs (the stream normally ends the follow much sooner). */
const POLL_LIMIT = 24 * 60 * 60;

/**
 * Follows a long job (an analysis or router training) through its Server-Sent Events stream and
 * keeps `stage`/`fraction`/`phase` current for the progress bar. If the stream breaks, it falls
 * back to polling the job once a second. `follow()` of another job, `stop()` or disconnecting the
 * host aborts the old follow.
 */
export class JobController implements ReactiveController {
  /** Current phase. */
  phase: JobPhase = JobPhase.Idle;
  /** Machine name of the current stage. */
  stage = '';
  /** Engine phase inside the stage, if reported. */
  detail = '';
  /** Fraction done, 0..1. */
  fraction = 0;
  /** Id of the followed job. */
  jobId: string | null = null;
  private abort: AbortController | null = null;
  private source: EventSource | null = null;
  private readonly host: ReactiveControllerHost;
  private readonly kind: JobKind;
  private readonly onEnd: (id: string, phase: JobPhase) => void;

  /**
   * @param host component to re-render on progress
   * @param kind `analyses` or `routers`
   * @param onEnd called once when the job reaches a final state
   */
  constructor(host: ReactiveControllerHost, kind: JobKind, onEnd: (id: string, phase: JobPhase) => void) {
    this.host = host;
    this.kind = kind;
    this.onEnd = onEnd;
    host.addController(this);
  }

  /**
   * Starts following a job (stopping any earlier follow).
   * @param id job id
   */
  follow(id: string): void {
    this.stop();
    const ctl = new AbortController();
    this.abort = ctl;
    this.jobId = id;
    this.phase = JobPhase.Running;
    this.stage = 'queued';
    this.fraction = 0;
    this.host.requestUpdate();
    const es = new EventSource(api.eventsUrl(this.kind, id));
    this.source = es;
    const onData = (ev: MessageEvent) => {
      if (ctl.signal.aborted) return;
      let data: ProgressEvent;
      try {
        data = JSON.parse(ev.data as string) as ProgressEvent;
      } catch {
        return;
      }
      this.apply(id, data, ctl);
    };
    es.addEventListener('message', onData);
    es.addEventListener('progress', onData as EventListener);
    es.addEventListener('status', onData as EventListener);
    es.addEventListener('end', onData as EventListener);
    es.addEventListener('error', () => {
      if (ctl.signal.aborted || this.phase !== JobPhase.Running) return;
      // The stream closed or never opened: ask the job itself instead.
      es.close();
      void this.poll(id, ctl.signal);
    });
  }

  private apply(id: string, data: ProgressEvent, ctl: AbortController): void {
    if (typeof data.stage === 'string') {
      this.stage = data.stage;
      this.detail = typeof data.detail === 'string' ? data.detail : '';
    }
    if (typeof data.fraction === 'number' && Number.isFinite(data.fraction)) this.fraction = Math.min(1, Math.max(0, data.fraction));
    if (data.status) {
      const phase = phaseOf(data.status);
      if (phase !== JobPhase.Running) {
        this.finish(id, phase, ctl);
        return;
      }
    }
    this.host.requestUpdate();
  }

  private finish(id: string, phase: JobPhase, ctl: AbortController): void {
    if (ctl.signal.aborted) return;
    this.phase = phase;
    if (phase === JobPhase.Done) this.fraction = 1;
    this.source?.close();
    this.source = null;
    this.abort = null;
    ctl.abort();
    this.host.requestUpdate();
    this.onEnd(id, phase);
  }

  private async poll(id: string, signal: AbortSignal): Promise<void> {
    const ctl = this.abort;
    if (!ctl) return;
    for (let i = 0; i < POLL_LIMIT && !signal.aborted; i++) {
      try {
        const job = this.kind === 'analyses' ? await api.getAnalysis(id, signal) : await api.getRouter(id, signal);
        if (signal.aborted) return;
        this.apply(id, { stage: job.progress?.stage, detail: job.progress?.detail, fraction: job.progress?.fraction, status: job.status }, ctl);
        if (this.phase !== JobPhase.Running) return;
      } catch {
        if (signal.aborted) return;
      }
      await new Promise<void>((resolve) => {
        const t = setTimeout(resolve, 1000);
        signal.addEventListener('abort', () => (clearTimeout(t), resolve()), { once: true });
      });
    }
  }

  /** Asks the server to cancel the followed job; the stream then reports `cancelled`. */
  async cancel(): Promise<void> {
    if (!this.jobId || this.phase !== JobPhase.Running) return;
    if (this.kind === 'analyses') await api.cancelAnalysis(this.jobId);
    else await api.cancelRouter(this.jobId);
  }

  /** Stops following without touching the job. */
  stop(): void {
    this.abort?.abort();
    this.abort = null;
    this.source?.close();
    this.source = null;
  }

  /** @internal */
  hostDisconnected(): void {
    this.stop();
  }
}
