// The sheets of a build, streamed over its threads with sheet affinity: each sheet is
// given whole to one thread (sheet-threads.ts), which decodes, traces, deals, plans and
// fits it, so its boundaries stay where they were traced and only small answers cross
// between threads. This thread decides who takes which sheet, deals the characters in
// reading order across the sheets and settles the one drawing scale (from the first
// sheet showing flat-topped capitals) — the rules of core/pipeline traceSheets — so the
// result is the same for any number of threads. Each thread holds at most
// SHEETS_IN_HAND sheets, so memory holds a few sheets, not every image of a large batch.
import { splitCharacters, type TraceScanOptions } from '../../core/raster/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS } from '../../core/metrics/index.ts';
import type { FitOptions } from '../../core/fit/index.ts';
import { letterCountMismatch, type FittedSheet, type ScaleReference } from '../../core/pipeline/index.ts';
import { decodeScanFile } from '../io/decode-scan.ts';
import { fromPortableError } from './batch-tasks.ts';
import type { SheetFitSettings, SheetTraceReport } from './held-sheets.ts';
import type { SheetThread } from './sheet-threads.ts';

export interface SheetFileSettings {
  readonly scan: TraceScanOptions;
  /** The resolution to use over the files' own (`--dpi`). */
  readonly dpi: number | undefined;
  readonly fit: FitOptions;
  readonly capHeightUnits?: number;
}

/** How far a build has come, for a progress display. */
export interface BatchProgress {
  readonly sheetCount: number;
  readonly sheetsTraced: number;
  /** Letters on the sheets traced so far. */
  readonly lettersFound: number;
  readonly lettersFitted: number;
}

export interface SheetFileEvents {
  /** Notes on how a sheet's file was read, in the order of the sheets. */
  readonly onDecodeNotes?: (sheet: number, notes: readonly string[]) => void;
  readonly onProgress?: (progress: BatchProgress) => void;
}

/**
 * Sheets a thread holds at once, traced or being traced and not yet fitted: two, so
 * a worker has its next sheet to trace while it fits one and never waits for this
 * thread between them. Sheets waiting for a later sheet's scale are not counted.
 */
export const SHEETS_IN_HAND = 2;

/** What this thread knows of one of the threads. */
interface ThreadState {
  readonly thread: SheetThread;
  /** Sheets given and not yet fitted, released or set aside to wait for the scale. */
  inHand: number;
  /** Traces sent and not yet answered. */
  tracing: number;
}

/**
 * Decodes, traces and fits `files` with `characters` dealt across them, on `threads`
 * (this thread first). Throws InputError for a file that will not decode, RasterError
 * for a sheet with no ink (a file that will not decode, anywhere in the list, is
 * reported first), and DraftFontError when the numbers of characters and letters differ.
 */
export async function fitSheetFiles(files: readonly string[], characters: string, settings: SheetFileSettings, threads: readonly SheetThread[], events: SheetFileEvents = {}): Promise<FittedSheet[]> {
  if (threads.length === 0) throw new RangeError('A build needs at least one thread.');
  const wanted = splitCharacters(characters);
  const fitSettings: SheetFitSettings = { fit: settings.fit, capHeightUnits: settings.capHeightUnits ?? DEFAULT_CAP_HEIGHT_UNITS };
  const progress = { sheetCount: files.length, sheetsTraced: 0, lettersFound: 0, lettersFitted: 0 };
  const report = (): void => events.onProgress?.({ ...progress });
  const onLetter = (): void => {
    progress.lettersFitted++;
    report();
  };

  const states: ThreadState[] = threads.map((thread) => ({ thread, inHand: 0, tracing: 0 }));
  const owner: ThreadState[] = [];
  const traces = files.map(() => deferred<SheetTraceReport>());
  // Awaited in order below; a later file failing meanwhile is not an unhandled rejection.
  for (const trace of traces) trace.promise.catch(ignore);
  let nextToGive = 0;
  let stopped = false;

  const give = (sheet: number, state: ThreadState): void => {
    owner[sheet] = state;
    state.inHand++;
    state.tracing++;
    const traced = state.thread.trace(sheet, { kind: 'trace', path: files[sheet] as string, dpi: settings.dpi, scan: settings.scan });
    traced.then(traces[sheet]?.resolve, traces[sheet]?.reject).finally(() => {
      state.tracing--;
      handOut();
    });
  };
  /**
   * Gives out sheets in order, one trace at a time per thread: to a thread with no
   * sheet in hand; to a worker, one ahead while it fits another, when at least two are
   * left (the last is left for whichever thread finishes first, so none ends holding
   * two sheets while another waits); and, when this thread is the only one, one ahead
   * too, so the next file is decoded while this one is fitted.
   */
  const handOut = (): void => {
    for (const [index, state] of states.entries()) {
      while (!stopped && nextToGive < files.length && state.inHand < SHEETS_IN_HAND && state.tracing === 0) {
        const ahead = states.length === 1 || (index > 0 && files.length - nextToGive >= 2);
        if (state.inHand > 0 && !ahead) break;
        give(nextToGive++, state);
      }
    }
  };
  const letGo = (state: ThreadState): void => {
    state.inHand--;
    handOut();
  };
  const fitOn = (sheet: number, reference: ScaleReference | null): Promise<FittedSheet> => {
    const state = owner[sheet] as ThreadState;
    const fitted = state.thread.fit(sheet, reference, fitSettings, onLetter).finally(() => {
      letGo(state);
    });
    fitted.catch(ignore);
    return fitted;
  };

  const counts: number[] = [];
  let dealt = 0;
  let enoughCharacters = true;
  let reference: ScaleReference | null = null;
  const waitingForScale: number[] = [];
  const fitted: Array<Promise<FittedSheet>> = [];
  try {
    handOut();
    for (let i = 0; i < files.length; i++) {
      const traced = await (traces[i] as Deferred<SheetTraceReport>).promise;
      events.onDecodeNotes?.(i, traced.decodeNotes);
      if (traced.traceError !== null) {
        stopped = true;
        await reportUndecodableAfter(i, files, traces, owner, events);
        throw fromPortableError(traced.traceError);
      }
      const count = traced.letterCount;
      counts.push(count);
      progress.sheetsTraced++;
      progress.lettersFound += count;
      report();
      const state = owner[i] as ThreadState;
      if (dealt + count > wanted.length) enoughCharacters = false;
      const slice = wanted.slice(dealt, dealt + count).join('');
      dealt += count;
      if (!enoughCharacters) {
        // Traced only to count its letters for the message.
        state.thread.release(i);
        letGo(state);
        continue;
      }
      const given = state.thread.deal(i, slice);
      given.catch(ignore);
      if (reference !== null) {
        fitted[i] = fitOn(i, reference);
        continue;
      }
      // Until a sheet gives the scale, each sheet's own answer is needed before the next is dealt.
      reference = await given;
      if (reference === null) {
        waitingForScale.push(i);
        letGo(state);
        continue;
      }
      for (const waiting of waitingForScale.splice(0)) {
        (owner[waiting] as ThreadState).inHand++;
        fitted[waiting] = fitOn(waiting, reference);
      }
      fitted[i] = fitOn(i, reference);
    }
    const mismatch = letterCountMismatch(counts, wanted.length);
    if (mismatch) throw mismatch;
    // No sheet shows flat-topped capitals: each is scaled by its own letter height.
    for (const waiting of waitingForScale.splice(0)) {
      (owner[waiting] as ThreadState).inHand++;
      fitted[waiting] = fitOn(waiting, null);
    }
    return await Promise.all(fitted);
  } finally {
    stopped = true;
  }
}

/**
 * Before a sheet with no ink is reported, the files after it are decoded: a file
 * that will not decode is the first thing to fix, and is reported instead (as
 * when every file was decoded before any was traced). Their notes are given too.
 */
async function reportUndecodableAfter(failed: number, files: readonly string[], traces: ReadonlyArray<Deferred<SheetTraceReport>>, owner: readonly unknown[], events: SheetFileEvents): Promise<void> {
  for (let j = failed + 1; j < files.length; j++) {
    const notes = owner[j] !== undefined ? (await (traces[j] as Deferred<SheetTraceReport>).promise).decodeNotes : (await decodeScanFile(files[j] as string)).notes;
    events.onDecodeNotes?.(j, notes);
  }
}

interface Deferred<T> {
  readonly promise: Promise<T>;
  readonly resolve: (value: T) => void;
  readonly reject: (error: unknown) => void;
}

function deferred<T>(): Deferred<T> {
  let resolve: (value: T) => void = ignore;
  let reject: (error: unknown) => void = ignore;
  const promise = new Promise<T>((ok, fail) => {
    resolve = ok;
    reject = fail;
  });
  return { promise, resolve, reject };
}

function ignore(): void {}
