/**
 * `npm start`: serves the web UI and the API, keeping state under DATA_DIR.
 */
import { readConfig } from './config.js';
import { startServer } from './server.js';

async function main(): Promise<void> {
  let config;
  try {
    config = readConfig();
  } catch (e) {
    console.error(`[sheaf] ${(e as Error).message}`);
    process.exit(2);
  }
  const server = await startServer(config);
  console.log(`[sheaf] listening on ${server.url} (data in ${config.dataDir})`);
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[sheaf] ${signal}: stopping; running jobs are stopped and marked failed, to be started again`);
    server.close().then(
      () => process.exit(0),
      (e) => {
        console.error('[sheaf] error while stopping:', e);
        process.exit(1);
      },
    );
  };
  // A stray rejection is a bug to fix, not a reason to drop every other request in flight.
  process.on('unhandledRejection', (e) => console.error('[sheaf] unhandled rejection:', e));
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

main().catch((e) => {
  console.error('[sheaf] could not start:', e instanceof Error ? e.message : e);
  process.exit(1);
});
