import { availableParallelism } from 'node:os';
import { resolve } from 'node:path';

/** Server settings, from the environment. */
export interface Config {
  /** PORT. @default 8080 (0 picks a free port) */
  port: number;
  /** HOST: the address to bind. @default 127.0.0.1 */
  host: string;
  /** DATA_DIR: where the SQLite database lives. @default ./data */
  dataDir: string;
  /** MAX_UPLOAD_MB: the largest upload accepted. @default 200 */
  maxUploadBytes: number;
  /** SHEAF_NO_DEMO=1 skips loading the demo corpus into an empty data directory. @default false */
  noDemo: boolean;
  /** JOB_WORKERS: worker threads for analyses and training. @default the number of cores */
  workers: number;
  /** MAX_QUEUED_JOBS: queued jobs beyond this are refused with 429. @default 100 */
  maxQueuedJobs: number;
  /** ADMIN_TOKEN: required for every request but health and routing when set. @default unset */
  adminToken: string | null;
}

function intFromEnv(env: NodeJS.ProcessEnv, name: string, fallback: number, min: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < min) throw new RangeError(`${name} must be a whole number ≥ ${min}, got "${raw}".`);
  return n;
}

/** Reads the configuration; throws RangeError with the variable's name when a value is unusable. */
export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  return {
    port: intFromEnv(env, 'PORT', 8080, 0),
    host: env.HOST || '127.0.0.1',
    dataDir: resolve(env.DATA_DIR || './data'),
    maxUploadBytes: intFromEnv(env, 'MAX_UPLOAD_MB', 200, 1) * 1024 * 1024,
    noDemo: env.SHEAF_NO_DEMO === '1',
    workers: intFromEnv(env, 'JOB_WORKERS', availableParallelism(), 1),
    maxQueuedJobs: intFromEnv(env, 'MAX_QUEUED_JOBS', 100, 1),
    adminToken: env.ADMIN_TOKEN || null,
  };
}
