import type { Config } from '../config.js';
import type { JobRunner } from '../jobs/job-runner.js';
import type { WorkerPool } from '../jobs/worker-pool.js';
import type { Store } from '../store/api.js';

/** What the HTTP layer is given to work with. */
export interface AppDeps {
  config: Config;
  store: Store;
  runner: JobRunner;
  pool: WorkerPool;
  version: string;
}
