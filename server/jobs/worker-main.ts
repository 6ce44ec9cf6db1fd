/**
 * Entry point of a job worker thread. It runs one task at a time, checking the shared cancel flag
 * between engine steps and posting progress at most every PROGRESS_INTERVAL_MS.
 */
import { parentPort } from 'node:worker_threads';
import type { FromWorker, ToWorker } from './api.js';
import { ProgressMeter } from './progress-meter.js';
import { SpareThread } from './spare-thread.js';
import { TASKS } from './tasks/index.js';

const PROGRESS_INTERVAL_MS = 100;

/** This worker's spare thread, started with the first task (see spare-thread.ts). */
let spare: SpareThread | null = null;

function transferables(x: unknown, out: ArrayBuffer[] = [], depth = 0): ArrayBuffer[] {
  if (depth > 4 || x === null || typeof x !== 'object') return out;
  if (ArrayBuffer.isView(x)) {
    if (x.buffer instanceof ArrayBuffer && !out.includes(x.buffer) && x.byteLength === x.buffer.byteLength) out.push(x.buffer);
    return out;
  }
  for (const v of Array.isArray(x) ? x : Object.values(x)) transferables(v, out, depth + 1);
  return out;
}

function post(msg: FromWorker, transfer: ArrayBuffer[] = []): void {
  parentPort!.postMessage(msg, transfer);
}

parentPort!.on('message', (msg: ToWorker) => {
  if (msg.type !== 'run') return;
  const cancel = new Int32Array(msg.cancel);
  const task = TASKS[msg.task];
  if (!task) {
    post({ type: 'failed', runId: msg.runId, error: { name: 'Error', message: `Unknown task ${msg.task}` } });
    return;
  }
  const meter = new ProgressMeter(task.stages);
  let lastPost = 0;
  try {
    spare ??= new SpareThread();
    const gen = task.run(msg.input, { spare });
    for (;;) {
      if (Atomics.load(cancel, 0) !== 0) {
        gen.return(undefined as never);
        post({ type: 'cancelled', runId: msg.runId });
        return;
      }
      const next = gen.next();
      if (next.done) {
        post({ type: 'done', runId: msg.runId, result: next.value }, transferables(next.value));
        return;
      }
      const progress = meter.update(next.value);
      const now = Date.now();
      if (now - lastPost >= PROGRESS_INTERVAL_MS) {
        lastPost = now;
        post({ type: 'progress', runId: msg.runId, progress });
      }
    }
  } catch (e) {
    const err = e as Error & { code?: string };
    post({ type: 'failed', runId: msg.runId, error: { name: err?.name ?? 'Error', message: String(err?.message ?? e), code: err?.code } });
  } finally {
    // A cancelled or failed run may leave spare tasks it will never wait for.
    spare?.forget();
  }
});
