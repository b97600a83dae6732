// A fixed set of worker threads (node:worker_threads) running batch tasks
// (batch-tasks.ts), handed out in the order they were given. Each worker is sent up
// to TASKS_IN_FLIGHT_PER_WORKER tasks at once, so it starts the next as soon as it
// finishes one instead of waiting for this thread to answer. With `fitHere`, this
// thread fits letters too, one at a time between its other work, so `--jobs 2` is
// this thread and one worker (one worker's start-up less). The queue of tasks not
// yet handed out is what the caller caps: `room()` resolves once fewer than the cap
// are waiting, so a caller that awaits it before each task never piles up more than
// the cap (a build does this so sheets are not all decoded, nor all letters'
// boundaries held, at once).
import { Worker } from 'node:worker_threads';
import { fromPortableError, runBatchTask, type BatchTask, type BatchTaskResult } from './batch-tasks.ts';
import type { WorkerReply, WorkerRequest } from './worker-messages.ts';
import type { WorkerScript } from './worker-script.ts';

interface Pending {
  readonly id: number;
  readonly task: BatchTask;
  readonly resolve: (result: unknown) => void;
  readonly reject: (error: Error) => void;
}

interface Slot {
  readonly worker: Worker;
  /** Tasks sent and not yet answered, oldest first. */
  readonly running: Pending[];
}

/**
 * Tasks sent to a worker at once: two lets it start the next the moment it finishes
 * one, while this thread is busy; more would only hold letters away from a worker
 * that becomes free sooner.
 */
const TASKS_IN_FLIGHT_PER_WORKER = 2;

export interface WorkerPoolOptions {
  /** Fit letters in this thread too, between its other work. Default false. */
  readonly fitHere?: boolean;
}

export class WorkerPool {
  readonly size: number;
  private readonly fitHere: boolean;
  private fittingHere = false;
  private readonly slots: Slot[] = [];
  private readonly waiting: Pending[] = [];
  private readonly roomWaiters: Array<{ cap: number; resolve: () => void }> = [];
  private nextId = 0;
  private failure: Error | null = null;
  private closed = false;

  /** Starts `size` workers from `script`. */
  constructor(size: number, script: WorkerScript, options: WorkerPoolOptions = {}) {
    if (!Number.isInteger(size) || size < 1) throw new RangeError(`A worker pool needs a whole number of workers, at least 1, not ${String(size)}.`);
    this.size = size;
    this.fitHere = options.fitHere ?? false;
    for (let i = 0; i < size; i++) {
      const worker = script.eval === undefined ? new Worker(script.url) : new Worker(script.eval, { eval: true });
      const slot: Slot = { worker, running: [] };
      worker.on('message', (reply: WorkerReply) => this.settle(slot, reply));
      worker.on('error', (error) => this.fail(new Error(`A batch worker stopped: ${error.message}`, { cause: error })));
      worker.on('exit', (code) => {
        if (!this.closed) this.fail(new Error(`A batch worker exited unexpectedly (exit code ${code}).`));
      });
      this.slots.push(slot);
    }
  }

  /** Tasks given but not yet started by a worker. */
  get queued(): number {
    return this.waiting.length;
  }

  /** Runs `task` on the next free worker. Rejects with the task's own error (InputError, RasterError…) or the pool's failure. */
  run<T extends BatchTask>(task: T): Promise<BatchTaskResult<T>> {
    if (this.failure) return Promise.reject(this.failure);
    if (this.closed) return Promise.reject(new Error('The worker pool is closed.'));
    return new Promise<BatchTaskResult<T>>((resolve, reject) => {
      this.waiting.push({ id: this.nextId++, task, resolve: resolve as (result: unknown) => void, reject });
      this.dispatch();
    });
  }

  /** Resolves once fewer than `cap` tasks wait for a worker (at once if they already do, or the pool has failed). */
  room(cap: number): Promise<void> {
    if (this.waiting.length < cap || this.failure) return Promise.resolve();
    return new Promise((resolve) => this.roomWaiters.push({ cap, resolve }));
  }

  /** Stops every worker; tasks not finished are rejected. */
  async close(): Promise<void> {
    if (this.closed) return;
    this.closed = true;
    this.rejectAll(new Error('The worker pool was closed before the task finished.'));
    await Promise.all(this.slots.map((slot) => slot.worker.terminate()));
  }

  private dispatch(): void {
    if (this.failure || this.closed) return;
    // Fill the least loaded worker first, so work spreads evenly.
    for (let depth = 0; depth < TASKS_IN_FLIGHT_PER_WORKER; depth++) {
      for (const slot of this.slots) {
        if (slot.running.length > depth) continue;
        const next = this.waiting.shift();
        if (!next) break;
        slot.running.push(next);
        slot.worker.postMessage({ id: next.id, task: next.task } satisfies WorkerRequest<BatchTask>);
      }
    }
    if (this.fitHere && !this.fittingHere) {
      const index = this.waiting.findIndex((pending) => pending.task.kind === 'fit');
      const next = index < 0 ? undefined : this.waiting.splice(index, 1)[0];
      if (next) {
        this.fittingHere = true;
        // After the pending messages of the workers (setImmediate runs after I/O), so they are answered and given more first.
        setImmediate(() => {
          runBatchTask(next.task).then(next.resolve, next.reject).finally(() => {
            this.fittingHere = false;
            this.dispatch();
          });
        });
      }
    }
    this.wakeRoomWaiters();
  }

  private settle(slot: Slot, reply: WorkerReply): void {
    const index = slot.running.findIndex((pending) => pending.id === reply.id);
    if (index < 0) return;
    const [pending] = slot.running.splice(index, 1);
    if (!pending) return;
    if (reply.ok) pending.resolve(reply.result);
    else pending.reject(fromPortableError(reply.error));
    this.dispatch();
  }

  private fail(error: Error): void {
    if (this.failure || this.closed) return;
    this.failure = error;
    this.rejectAll(error);
    this.wakeRoomWaiters();
  }

  private rejectAll(error: Error): void {
    for (const slot of this.slots) for (const pending of slot.running.splice(0)) pending.reject(error);
    for (const pending of this.waiting.splice(0)) pending.reject(error);
  }

  private wakeRoomWaiters(): void {
    for (let i = this.roomWaiters.length - 1; i >= 0; i--) {
      const waiter = this.roomWaiters[i];
      if (waiter && (this.waiting.length < waiter.cap || this.failure || this.closed)) {
        this.roomWaiters.splice(i, 1);
        waiter.resolve();
      }
    }
  }
}
