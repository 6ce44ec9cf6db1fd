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
  /** ROUTE_RATE_LIMIT: routing requests per second allowed per key (bursts of twice that); 0 = no limit. @default 100 */
  routeRatePerKey: number;
}

/** True for addresses only this machine can reach. */
export function isLoopback(host: string): boolean {
  return host === 'localhost' || host === '::1' || host === '[::1]' || /^127\.\d+\.\d+\.\d+$/.test(host);
}

function intFromEnv(env: NodeJS.ProcessEnv, name: string, fallback: number, min: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < min) throw new RangeError(`${name} must be a whole number ≥ ${min}, got "${raw}".`);
  return n;
}

/**
 * Reads the configuration; throws RangeError with the variable's name when a value is unusable,
 * or when the server would be reachable from other machines without an ADMIN_TOKEN.
 */
export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const config = readValues(env);
  if (!isLoopback(config.host) && !config.adminToken) {
    throw new RangeError(
      `HOST=${config.host} would let other machines reach sheaf, so an ADMIN_TOKEN is required: set ADMIN_TOKEN to a long random secret (e.g. \`openssl rand -hex 32\`), or bind 127.0.0.1.`,
    );
  }
  if (config.adminToken !== null && config.adminToken.length < 16) {
    throw new RangeError('ADMIN_TOKEN must be at least 16 characters long; use a long random secret.');
  }
  return config;
}

function readValues(env: NodeJS.ProcessEnv): Config {
  return {
    port: intFromEnv(env, 'PORT', 8080, 0),
    host: env.HOST || '127.0.0.1',
    dataDir: resolve(env.DATA_DIR || './data'),
    maxUploadBytes: intFromEnv(env, 'MAX_UPLOAD_MB', 200, 1) * 1024 * 1024,
    noDemo: env.SHEAF_NO_DEMO === '1',
    workers: intFromEnv(env, 'JOB_WORKERS', availableParallelism(), 1),
    maxQueuedJobs: intFromEnv(env, 'MAX_QUEUED_JOBS', 100, 1),
    adminToken: env.ADMIN_TOKEN || null,
    routeRatePerKey: intFromEnv(env, 'ROUTE_RATE_LIMIT', 100, 0),
  };
}
