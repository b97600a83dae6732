// This thread's end of one batch worker (batch-worker.ts): a SheetThread whose sheets
// are held and fitted in the worker, and a LetterHelper that fits single letters sent
// to it as packed jobs whose points are transferred, not copied. Requests are
// numbered and posted at once (the worker queues them), so it never waits for this
// thread between them. If the worker stops, every request not answered, and every
// later one, is rejected with that failure.
import { Worker } from 'node:worker_threads';
import type { FittedSheet, LetterFitJob, LetterFitOutcome, ScaleReference } from '../../core/pipeline/index.ts';
import { fromPortableError, type TraceSheetTask } from './batch-tasks.ts';
import type { SheetFitSettings, SheetTraceReport } from './held-sheets.ts';
import { packLetterJob } from './packed-letter-job.ts';
import type { LetterHelper, SheetThread } from './sheet-threads.ts';
import type { WorkerAnswers, WorkerReply, WorkerRequest, WorkerTask } from './worker-messages.ts';
import type { WorkerScript } from './worker-script.ts';

/**
 * Single letters a worker is given at once while helping: two, so it starts the next
 * the moment it finishes one instead of waiting for this thread's answer; more would
 * leave this thread waiting at the end of a sheet for letters still queued there.
 */
export const LETTERS_IN_FLIGHT = 2;

interface Pending {
  readonly resolve: (result: unknown) => void;
  readonly reject: (error: Error) => void;
  readonly onLetter?: () => void;
  readonly isLetter: boolean;
}

export class WorkerSheetThread implements SheetThread, LetterHelper {
  private readonly worker: Promise<Worker>;
  private readonly pending = new Map<number, Pending>();
  private nextId = 0;
  private sheetRequests = 0;
  private letterRequests = 0;
  private failure: Error | null = null;
  private closed = false;

  /** Starts the worker as soon as its script is known. */
  constructor(script: Promise<WorkerScript> | WorkerScript) {
    this.worker = Promise.resolve(script).then((resolved) => {
      const worker = resolved.eval === undefined ? new Worker(resolved.url) : new Worker(resolved.eval, { eval: true });
      worker.on('message', (reply: WorkerReply) => this.settle(reply));
      worker.on('error', (error) => this.fail(new Error(`A batch worker stopped: ${error.message}`, { cause: error })));
      worker.on('exit', (code) => {
        if (!this.closed) this.fail(new Error(`A batch worker exited unexpectedly (exit code ${code}).`));
      });
      if (this.closed) void worker.terminate();
      return worker;
    });
    this.worker.catch((error: unknown) => this.fail(error instanceof Error ? error : new Error(String(error))));
  }

  get canHelp(): boolean {
    return this.failure === null && !this.closed && this.sheetRequests === 0 && this.letterRequests < LETTERS_IN_FLIGHT;
  }

  trace(sheet: number, task: TraceSheetTask): Promise<SheetTraceReport> {
    return this.request({ kind: 'trace', sheet, task });
  }

  deal(sheet: number, characters: string): Promise<ScaleReference | null> {
    return this.request({ kind: 'deal', sheet, characters });
  }

  fit(sheet: number, reference: ScaleReference | null, settings: SheetFitSettings, onLetter: () => void): Promise<FittedSheet> {
    return this.request({ kind: 'fit', sheet, reference, settings }, [], onLetter);
  }

  fitLetter(job: LetterFitJob): Promise<LetterFitOutcome> {
    const { packed, transfer } = packLetterJob(job);
    return this.request({ kind: 'letter', job: packed }, transfer);
  }

  release(sheet: number): void {
    this.request({ kind: 'release', sheet }).catch(() => {});
  }

  /** Stops the worker; requests not answered are rejected. */
  async close(): Promise<void> {
    if (this.closed) return;
    this.closed = true;
    this.rejectAll(new Error('The batch build stopped before the worker answered.'));
    const worker = await this.worker.catch(() => null);
    await worker?.terminate();
  }

  private request<T extends WorkerTask>(task: T, transfer: ArrayBuffer[] = [], onLetter?: () => void): Promise<WorkerAnswers[T['kind']]> {
    if (this.failure) return Promise.reject(this.failure);
    if (this.closed) return Promise.reject(new Error('The batch worker is closed.'));
    const id = this.nextId++;
    const isLetter = task.kind === 'letter';
    if (isLetter) this.letterRequests++;
    else this.sheetRequests++;
    const answered = new Promise<WorkerAnswers[T['kind']]>((resolve, reject) => {
      this.pending.set(id, { resolve: resolve as (result: unknown) => void, reject, isLetter, ...(onLetter ? { onLetter } : {}) });
    });
    void this.worker.then((worker) => {
      if (!this.closed && !this.failure) worker.postMessage({ ...task, id } satisfies WorkerRequest, transfer);
    }, () => {});
    return answered;
  }

  private settle(reply: WorkerReply): void {
    const pending = this.pending.get(reply.id);
    if (!pending) return;
    if (reply.kind === 'letter-fitted') {
      pending.onLetter?.();
      return;
    }
    this.pending.delete(reply.id);
    this.forget(pending);
    if (reply.kind === 'done') pending.resolve(reply.result);
    else pending.reject(fromPortableError(reply.error));
  }

  private forget(pending: Pending): void {
    if (pending.isLetter) this.letterRequests--;
    else this.sheetRequests--;
  }

  private fail(error: Error): void {
    if (this.failure || this.closed) return;
    this.failure = error;
    this.rejectAll(error);
  }

  private rejectAll(error: Error): void {
    for (const pending of this.pending.values()) pending.reject(error);
    this.pending.clear();
    this.sheetRequests = 0;
    this.letterRequests = 0;
  }
}
