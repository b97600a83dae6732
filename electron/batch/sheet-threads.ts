// The threads a batch build runs on, as the build sees them: each holds the sheets it
// traced and fits their letters itself (held-sheets.ts), so only small answers cross
// between threads. `--jobs N` is this thread (LocalSheetThread) and N − 1 workers
// (WorkerSheetThread), started at once so their start-up overlaps this thread's first
// sheet. This thread also hands single letters of its own sheets to a worker that has
// nothing else to do, so one sheet, or the last, is fitted on every thread.
import { setImmediate as nextTurn } from 'node:timers/promises';
import { assembleSheetFit, fitLetterJob, type FittedSheet, type LetterFitJob, type LetterFitOutcome, type ScaleReference } from '../../core/pipeline/index.ts';
import { HeldSheets, type SheetFitSettings, type SheetTraceReport } from './held-sheets.ts';
import type { TraceSheetTask } from './batch-tasks.ts';
import { WorkerSheetThread } from './worker-sheet-thread.ts';
import { batchWorkerScript, type WorkerScript } from './worker-script.ts';

/** One thread of a build, holding the sheets it traced until they are fitted. */
export interface SheetThread {
  /** Decodes and traces the sheet and holds it. Rejects with InputError for a file that will not decode. */
  trace(sheet: number, task: TraceSheetTask): Promise<SheetTraceReport>;
  /** Deals the held sheet its characters; resolves to the scale reference it gives. */
  deal(sheet: number, characters: string): Promise<ScaleReference | null>;
  /** Fits every letter of the dealt sheet at the build's scale and lets the sheet go; `onLetter` after each letter. */
  fit(sheet: number, reference: ScaleReference | null, settings: SheetFitSettings, onLetter: () => void): Promise<FittedSheet>;
  /** Lets the sheet go unfitted. */
  release(sheet: number): void;
}

/** A thread that can fit single letters of a sheet another thread holds. */
export interface LetterHelper {
  /** True while it has nothing of its own to do and room for another letter. */
  readonly canHelp: boolean;
  fitLetter(job: LetterFitJob): Promise<LetterFitOutcome>;
}

export interface BatchThreads {
  /** This thread first, then the workers. */
  readonly threads: readonly SheetThread[];
  close(): Promise<void>;
}

/** This thread's share of a build: its sheets held here, their letters fitted here or by idle helpers. */
export class LocalSheetThread implements SheetThread {
  private readonly held = new HeldSheets();

  constructor(private readonly helpers: () => readonly LetterHelper[] = () => []) {}

  trace(sheet: number, task: TraceSheetTask): Promise<SheetTraceReport> {
    return this.held.trace(sheet, task);
  }

  async deal(sheet: number, characters: string): Promise<ScaleReference | null> {
    return this.held.deal(sheet, characters);
  }

  async fit(sheet: number, reference: ScaleReference | null, settings: SheetFitSettings, onLetter: () => void): Promise<FittedSheet> {
    const { jobs, ...plan } = this.held.plan(sheet, reference, settings);
    return assembleSheetFit(plan, await fitLettersSharing(jobs, this.helpers, onLetter));
  }

  release(sheet: number): void {
    this.held.release(sheet);
  }
}

/**
 * Fits `jobs` in this thread from the first on, handing letters from the last back
 * to whichever helper has nothing to do, and yielding between letters so the
 * helpers' answers (and the rest of the build) are seen. The outcomes are in the
 * jobs' order, whoever fitted them.
 */
export async function fitLettersSharing(jobs: readonly LetterFitJob[], helpers: () => readonly LetterHelper[], onLetter: () => void = () => {}): Promise<LetterFitOutcome[]> {
  const outcomes: LetterFitOutcome[] = new Array<LetterFitOutcome>(jobs.length);
  const elsewhere: Array<Promise<void>> = [];
  let front = 0;
  let back = jobs.length;
  while (front < back) {
    for (const helper of helpers()) {
      // The letter being fitted here next is never handed out, so this thread always has one.
      while (helper.canHelp && back - front > 1) {
        const index = --back;
        const fitted = helper.fitLetter(jobs[index] as LetterFitJob).then((outcome) => {
          outcomes[index] = outcome;
          onLetter();
        });
        // Seen by Promise.all below; until then a helper's failure must not count as unhandled.
        fitted.catch(() => {});
        elsewhere.push(fitted);
      }
    }
    outcomes[front] = fitLetterJob(jobs[front] as LetterFitJob);
    front++;
    onLetter();
    await nextTurn();
  }
  await Promise.all(elsewhere);
  return outcomes;
}

/** The threads for `--jobs jobs`: this thread, and jobs − 1 workers started now. */
export function threadsForJobs(jobs: number, script: Promise<WorkerScript> = batchWorkerScript()): BatchThreads {
  const workers = Array.from({ length: Math.max(0, jobs - 1) }, () => new WorkerSheetThread(script));
  const local = new LocalSheetThread(() => workers);
  return { threads: [local, ...workers], close: async () => void (await Promise.all(workers.map((worker) => worker.close()))) };
}
