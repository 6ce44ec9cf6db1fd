/**
 * The real server (dist/server/main.js) in a child process for a bench: 127.0.0.1 on a free port,
 * a fresh DATA_DIR, no demo corpus; extra environment from the caller.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface BenchServer {
  /** Base address, e.g. http://127.0.0.1:41234 */
  base: string;
  process: ChildProcess;
  /** Stops the server and removes its DATA_DIR. */
  stop(): Promise<void>;
}

export async function startBenchServer(env: Record<string, string> = {}): Promise<BenchServer> {
  const dataDir = await mkdtemp(join(tmpdir(), 'sheaf-bench-'));
  const server = spawn(process.execPath, ['dist/server/main.js'], {
    env: { ...process.env, PORT: '0', HOST: '127.0.0.1', DATA_DIR: dataDir, SHEAF_NO_DEMO: '1', ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const base = await new Promise<string>((resolve, reject) => {
    let out = '';
    server.once('exit', (code) => reject(new Error(`the server exited with code ${code} before listening`)));
    server.stdout!.on('data', (d) => {
      out += d;
      const m = /listening on (http:\/\/\S+)/.exec(out);
      if (m) resolve(m[1]);
    });
  });
  return {
    base,
    process: server,
    async stop() {
      if (server.exitCode === null) {
        server.kill('SIGTERM');
        await new Promise((res) => server.once('exit', res));
      }
      await rm(dataDir, { recursive: true, force: true });
    },
  };
}
