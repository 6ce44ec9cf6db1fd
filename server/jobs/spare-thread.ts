/**
 * A spare thread for engine code (see server/common/spare.ts): a worker that runs named tasks
 * from the shared table and answers on a message port the caller reads synchronously, so a
 * synchronous engine loop can hand half its rows to the other core and block for them.
 */
import { MessageChannel, receiveMessageOnPort, Worker, type MessagePort } from 'node:worker_threads';
import type { Pending, Spare } from '../common/spare.js';

/** What the spare thread answers for task number `seq`. */
export type SpareAnswer = { seq: number; ok: true; out: unknown } | { seq: number; ok: false; name: string; message: string };

/** How long `wait` blocks between looks at the port; a safety net only, answers also notify. */
const WAIT_SLICE_MS = 50;

/**
 * Typed arrays cross to the spare by structured clone: on shared memory they are shared, others
 * would be copied and anything the task writes into them lost. So only shared ones may cross.
 */
function assertShared(x: unknown, task: string, depth = 0): void {
  if (depth > 3 || x === null || typeof x !== 'object' || Array.isArray(x)) return;
  if (ArrayBuffer.isView(x)) {
    if (!(x.buffer instanceof SharedArrayBuffer)) throw new TypeError(`spare task "${task}" was given a typed array that is not on shared memory`);
    return;
  }
  for (const v of Object.values(x)) assertShared(v, task, depth + 1);
}

/** A spare thread. Create one per job worker (or per bench) and reuse it; `close` ends it. */
export class SpareThread implements Spare {
  readonly threads = 1;
  private readonly worker: Worker;
  private readonly port: MessagePort;
  /** [0]: answers posted so far, bumped and notified by the spare after each answer. */
  private readonly signal = new Int32Array(new SharedArrayBuffer(4));
  private readonly answers = new Map<number, SpareAnswer>();
  private nextSeq = 1;
  /** Answers to tasks numbered below this are dropped: their caller is gone (see `forget`). */
  private forgottenBelow = 0;
  private failure: Error | null = null;

  constructor(entry: URL = new URL('./spare-main.js', import.meta.url)) {
    const { port1, port2 } = new MessageChannel();
    this.port = port1;
    this.worker = new Worker(entry, { workerData: { port: port2, signal: this.signal }, transferList: [port2] });
    this.worker.on('error', (e) => { this.failure = e; Atomics.add(this.signal, 0, 1); Atomics.notify(this.signal, 0); });
    this.worker.on('exit', (code) => { this.failure ??= new Error(`the spare thread exited with code ${code}`); });
    this.worker.unref();
  }

  start<O>(task: string, input: unknown): Pending<O> {
    if (this.failure) throw this.failure;
    assertShared(input, task);
    const seq = this.nextSeq++;
    this.worker.postMessage({ seq, task, input });
    return { wait: () => this.answer(seq) as O };
  }

  private answer(seq: number): unknown {
    for (;;) {
      const seen = Atomics.load(this.signal, 0);
      for (let m = receiveMessageOnPort(this.port); m; m = receiveMessageOnPort(this.port)) {
        const a = m.message as SpareAnswer;
        if (a.seq >= this.forgottenBelow) this.answers.set(a.seq, a);
      }
      const a = this.answers.get(seq);
      if (a) {
        this.answers.delete(seq);
        if (a.ok) return a.out;
        const err = new Error(a.message);
        err.name = a.name;
        throw err;
      }
      if (this.failure) throw this.failure;
      Atomics.wait(this.signal, 0, seen, WAIT_SLICE_MS);
    }
  }

  /**
   * Drops every answer not yet waited for, now and when it arrives: call when the computation that
   * started them has ended (a cancelled job leaves tasks it will never wait for).
   */
  forget(): void {
    this.forgottenBelow = this.nextSeq;
    this.answers.clear();
  }

  /** Ends the thread. */
  async close(): Promise<void> {
    this.port.close();
    await this.worker.terminate();
  }
}
