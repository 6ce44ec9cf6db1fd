import type { Context } from 'hono';
import { streamSSE } from 'hono/streaming';
import type { JobRunner, JobEvent } from '../jobs/job-runner.js';
import type { JobRecord, Store } from '../store/api.js';

const HEARTBEAT_MS = 15_000;

function isFinal(job: JobRecord): boolean {
  return job.status === 'done' || job.status === 'failed' || job.status === 'cancelled';
}

/**
 * Server-Sent Events of a job: `{"stage","fraction"}` while it runs, then one final
 * `{"status", "error"?}` event, after which the stream closes. A client that connects late gets
 * the current state first; one that connects after the end gets only the final event.
 */
export function jobEventStream(c: Context, store: Store, runner: JobRunner, jobId: string): Response {
  return streamSSE(c, async (stream) => {
    const queue: JobEvent[] = [];
    let wake: (() => void) | null = null;
    const unsubscribe = runner.subscribe(jobId, (e) => {
      queue.push(e);
      wake?.();
    });
    const finalEvent = (job: JobRecord) => stream.writeSSE({ event: 'end', data: JSON.stringify({ status: job.status, error: job.error }) });
    try {
      const job = await store.getJob(jobId);
      if (!job) return;
      if (isFinal(job)) {
        await finalEvent(job);
        return;
      }
      await stream.writeSSE({ event: 'progress', data: JSON.stringify({ stage: job.stage || job.status, fraction: job.fraction, status: job.status }) });
      let aborted = false;
      stream.onAbort(() => {
        aborted = true;
        wake?.();
      });
      while (!aborted) {
        if (queue.length === 0) {
          const timer = setTimeout(() => wake?.(), HEARTBEAT_MS);
          await new Promise<void>((resolve) => (wake = resolve));
          clearTimeout(timer);
          wake = null;
          if (queue.length === 0 && !aborted) {
            // Heartbeat; also catches an end this server did not see (another replica ran the job).
            const now = await store.getJob(jobId);
            if (now && isFinal(now)) {
              await finalEvent(now);
              return;
            }
            await stream.write(': keep-alive\n\n');
          }
          continue;
        }
        // Only the newest progress matters; the end event is always delivered.
        const events = queue.splice(0);
        const end = events.find((e) => e.type === 'end');
        if (end && end.type === 'end') {
          await finalEvent(end.job);
          return;
        }
        const last = events[events.length - 1];
        if (last.type === 'progress') {
          await stream.writeSSE({ event: 'progress', data: JSON.stringify({ ...last.progress, status: 'running' }) });
        }
      }
    } finally {
      unsubscribe();
    }
  });
}
