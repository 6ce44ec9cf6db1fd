/**
 * Starts the real, built server (dist/server/main.js) as a child process on a free port with a
 * temporary DATA_DIR, for integration and browser tests. The suite's global setup builds dist/.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface TestServer {
  url: string;
  dataDir: string;
  proc: ChildProcess;
  /** Everything the server printed so far. */
  output(): string;
  /** SIGTERM and wait; removes the data directory unless `keepData`. */
  stop(opts?: { keepData?: boolean }): Promise<void>;
}

export interface StartOptions {
  env?: Record<string, string>;
  /** Reuse this data directory (e.g. after a crash) instead of a fresh one. */
  dataDir?: string;
  /** Load the demo corpus (off by default so tests start empty). */
  demo?: boolean;
  /** Give up waiting for the server after this long. @default 30000 */
  timeoutMs?: number;
}

export async function startServer(opts: StartOptions = {}): Promise<TestServer> {
  const dataDir = opts.dataDir ?? (await mkdtemp(join(tmpdir(), 'sheaf-test-')));
  const proc = spawn(process.execPath, ['dist/server/main.js'], {
    env: {
      ...process.env,
      PORT: '0',
      HOST: '127.0.0.1',
      DATA_DIR: dataDir,
      SHEAF_NO_DEMO: opts.demo ? '0' : '1',
      ...opts.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  proc.stdout!.on('data', (d) => (out += d));
  proc.stderr!.on('data', (d) => (out += d));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start in time:\n${out}`)), opts.timeoutMs ?? 30_000);
    const check = () => {
      const m = /listening on (http:\/\/\S+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    proc.stdout!.on('data', check);
    proc.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with code ${code} before listening:\n${out}`));
    });
  });
  let stopped: Promise<void> | null = null;
  return {
    url,
    dataDir,
    proc,
    output: () => out,
    stop(o = {}) {
      stopped ??= (async () => {
        if (proc.exitCode === null && proc.signalCode === null) {
          const exited = new Promise<void>((resolve) => proc.once('exit', () => resolve()));
          proc.kill('SIGTERM');
          const timer = setTimeout(() => proc.kill('SIGKILL'), 10_000);
          await exited;
          clearTimeout(timer);
        }
        if (!o.keepData) await rm(dataDir, { recursive: true, force: true });
      })();
      return stopped;
    },
  };
}

/** fetch + JSON, for brevity in tests. */
export async function api(base: string, path: string, init: RequestInit & { json?: unknown } = {}): Promise<{ status: number; body: any; headers: Headers }> {
  const { json, ...rest } = init;
  const res = await fetch(base + '/api/v1' + path, {
    ...rest,
    headers: { ...(json !== undefined ? { 'content-type': 'application/json' } : {}), ...(rest.headers as Record<string, string>) },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
  });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON: keep the text */
  }
  return { status: res.status, body, headers: res.headers };
}

/** Polls an analysis or router until it leaves queued/running (bounded). */
export async function waitForJob(base: string, path: string, timeoutMs = 120_000, headers: Record<string, string> = {}): Promise<any> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const r = await api(base, path, { headers });
    if (r.status !== 200) throw new Error(`GET ${path} answered ${r.status}: ${JSON.stringify(r.body)}`);
    if (r.body.status !== 'queued' && r.body.status !== 'running') return r.body;
    if (Date.now() > end) throw new Error(`${path} still ${r.body.status} after ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 100));
  }
}
