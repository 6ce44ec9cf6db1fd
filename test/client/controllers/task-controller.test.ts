import { describe, expect, it } from 'vitest';
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { TaskController, TaskStatus } from '../../../client/controllers/task-controller.js';

/** The smallest host the controller contract needs (Lit's ReactiveControllerHost). */
class Host implements ReactiveControllerHost {
  controllers: ReactiveController[] = [];
  updates = 0;
  addController(c: ReactiveController) {
    this.controllers.push(c);
  }
  removeController() {}
  requestUpdate() {
    this.updates++;
  }
  get updateComplete() {
    return Promise.resolve(true);
  }
}

function deferred<T>() {
  let resolve!: (v: T) => void;
  const promise = new Promise<T>((r) => (resolve = r));
  return { promise, resolve };
}

describe('TaskController', () => {
  it('goes from idle to pending to complete and keeps the value', async () => {
    const host = new Host();
    const t = new TaskController<number>(host);
    expect(t.status).toBe(TaskStatus.Idle);
    const run = t.run(async () => 7);
    expect(t.status).toBe(TaskStatus.Pending);
    expect(await run).toBe(7);
    expect(t.status).toBe(TaskStatus.Complete);
    expect(t.value).toBe(7);
    expect(host.updates).toBeGreaterThanOrEqual(2);
  });

  it('aborts a stale run when a new one starts, so the old answer is dropped', async () => {
    const t = new TaskController<string>(new Host());
    const slow = deferred<string>();
    let firstSignal: AbortSignal | null = null;
    const first = t.run((signal) => {
      firstSignal = signal;
      return slow.promise;
    });
    const second = t.run(async () => 'new');
    expect(firstSignal!.aborted).toBe(true);
    expect(await second).toBe('new');
    slow.resolve('old');
    expect(await first).toBeUndefined();
    expect(t.value).toBe('new');
  });

  it('records an error without throwing', async () => {
    const t = new TaskController<number>(new Host());
    expect(await t.run(async () => Promise.reject(new Error('boom')))).toBeUndefined();
    expect(t.status).toBe(TaskStatus.Error);
    expect((t.error as Error).message).toBe('boom');
  });

  it('aborts the run in progress when the host disconnects', async () => {
    const host = new Host();
    const t = new TaskController<number>(host);
    let signal: AbortSignal | null = null;
    void t.run((s) => {
      signal = s;
      return new Promise(() => {});
    });
    host.controllers.forEach((c) => c.hostDisconnected?.());
    expect(signal!.aborted).toBe(true);
    expect(t.status).toBe(TaskStatus.Idle);
  });
});
