/** Entry of a spare thread (see spare-thread.ts): runs tasks from the engines' shared table. */
import { workerData, type MessagePort } from 'node:worker_threads';
import { parentPort } from 'node:worker_threads';
import type { SpareAnswer } from './spare-thread.js';
import { SPARE_TASKS } from './spare-tasks.js';

const { port, signal } = workerData as { port: MessagePort; signal: Int32Array };

parentPort!.on('message', (msg: { seq: number; task: string; input: unknown }) => {
  let answer: SpareAnswer;
  try {
    const run = SPARE_TASKS[msg.task];
    if (!run) throw new RangeError(`Unknown spare task "${msg.task}"`);
    answer = { seq: msg.seq, ok: true, out: run(msg.input) };
  } catch (e) {
    const err = e as Error;
    answer = { seq: msg.seq, ok: false, name: err?.name ?? 'Error', message: String(err?.message ?? e) };
  }
  port.postMessage(answer);
  Atomics.add(signal, 0, 1);
  Atomics.notify(signal, 0);
});
