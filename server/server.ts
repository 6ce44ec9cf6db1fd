import { serve, type ServerType } from '@hono/node-server';
import { readFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { createApp } from './app.js';
import type { Config } from './config.js';
import { loadDemoCorpus } from './demo/load-demo.js';
import { analysisJobHandler } from './jobs/handlers/analysis-handler.js';
import { trainingJobHandler } from './jobs/handlers/training-handler.js';
import { JobRunner } from './jobs/job-runner.js';
import { WorkerPool } from './jobs/worker-pool.js';
import { openSqliteStore } from './store/index.js';

const VERSION: string = JSON.parse(readFileSync(fileURLToPath(new URL('../../package.json', import.meta.url)), 'utf8')).version;

/** A running server and the way to stop it. */
export interface RunningServer {
  url: string;
  port: number;
  close(): Promise<void>;
}

/**
 * Opens the store, starts the workers and the job runner, loads the demo corpus into an empty
 * data directory (unless told not to), and listens.
 */
export async function startServer(config: Config): Promise<RunningServer> {
  const store = openSqliteStore(config.dataDir);
  const pool = new WorkerPool({ size: config.workers });
  const runner = new JobRunner(store, pool, {
    analysis: analysisJobHandler(store),
    training: trainingJobHandler(store),
  });
  await runner.start();
  // Only into a data directory that never had it: a deleted demo corpus stays deleted.
  if (!config.noDemo && (await store.getSetting('demo-loaded')) === null) {
    if ((await store.listCorpora()).length === 0) await loadDemoCorpus(store);
    await store.setSetting('demo-loaded', new Date().toISOString());
  }
  const app = createApp({ config, store, runner, pool, version: VERSION });
  const server: ServerType = await new Promise((resolve) => {
    const s = serve({ fetch: app.fetch, port: config.port, hostname: config.host }, () => resolve(s));
  });
  const port = (server.address() as AddressInfo).port;
  const host = config.host.includes(':') ? `[${config.host}]` : config.host;
  let closing: Promise<void> | null = null;
  return {
    url: `http://${host}:${port}`,
    port,
    close() {
      closing ??= (async () => {
        await new Promise<void>((resolve) => server.close(() => resolve()));
        await runner.stop();
        await pool.close();
        await store.close();
      })();
      return closing;
    },
  };
}
