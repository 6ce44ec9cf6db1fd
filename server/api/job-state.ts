import type { JobRecord, JobStatus } from '../store/api.js';

/**
 * The `status`, `progress` and `error` fields that analyses and routers show for their job.
 * @param fallback the status to show when the job row is gone.
 */
export function jobState(job: JobRecord | null, fallback: JobStatus) {
  return {
    status: job?.status ?? fallback,
    progress: { stage: job?.stage || job?.status || fallback, fraction: job?.status === 'done' ? 1 : (job?.fraction ?? 0) },
    error: job?.error ?? null,
  };
}
