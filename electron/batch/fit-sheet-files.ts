// The sheets of a build, streamed: each file is decoded and traced (a few ahead, as
// many as run at once), its letters are given their characters and fitted, and its
// boundaries are let go once its letters are handed out — so memory holds a few
// sheets and a capped queue of letters, not every image of a large batch. The rules
// are those of core/pipeline traceSheets (characters dealt in reading order across
// the sheets, one drawing scale from the first sheet showing flat-topped capitals), and
// the result is the same whether the tasks run in this thread or on worker threads.
import { segmentSheet, splitCharacters, type TraceScanOptions } from '../../core/raster/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS, measureSheetMetrics, type SheetMetrics } from '../../core/metrics/index.ts';
import type { FitOptions } from '../../core/fit/index.ts';
import {
  assembleSheetFit,
  letterCountMismatch,
  planSheetFit,
  scaleReference,
  sheetUnitsPerPixel,
  type FittedSheet,
  type LetterFitOutcome,
  type ScaleReference,
} from '../../core/pipeline/index.ts';
import { decodeScanFile } from '../io/decode-scan.ts';
import { fromPortableError, type TracedSheetFile, type TracedSheetScan } from './batch-tasks.ts';
import type { BatchRunner } from './batch-runner.ts';

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

type AssignedScan = TracedSheetScan;

/**
 * Decodes, traces and fits `files` with `characters` dealt across them, on `runner`.
 * Throws InputError for a file that will not decode, RasterError for a sheet with no
 * ink (a file that will not decode, anywhere in the list, is reported first), and
 * DraftFontError when the numbers of characters and letters differ.
 */
export async function fitSheetFiles(files: readonly string[], characters: string, settings: SheetFileSettings, runner: BatchRunner, events: SheetFileEvents = {}): Promise<FittedSheet[]> {
  const wanted = splitCharacters(characters);
  const capHeightUnits = settings.capHeightUnits ?? DEFAULT_CAP_HEIGHT_UNITS;
  const progress = { sheetCount: files.length, sheetsTraced: 0, lettersFound: 0, lettersFitted: 0 };
  const report = (): void => events.onProgress?.({ ...progress });

  // Traces run this many sheets ahead of the one being dealt: enough to keep every worker busy.
  const ahead = runner.parallelism > 1 ? runner.parallelism : 0;
  const traces: Array<Promise<TracedSheetFile> | undefined> = [];
  const startTrace = (i: number): void => {
    const path = files[i];
    if (path === undefined || traces[i]) return;
    // The first sheet is traced in this thread while the workers start up, and is not copied between threads.
    const task = { kind: 'trace', path, dpi: settings.dpi, scan: settings.scan } as const;
    const traced = i === 0 ? runner.runHere(task) : runner.run(task);
    traced.catch(ignore);
    traces[i] = traced;
  };

  const counts: number[] = [];
  let dealt = 0;
  let enoughCharacters = true;
  let reference: ScaleReference | null = null;
  const waitingForScale: Array<{ scan: AssignedScan; metrics: SheetMetrics }> = [];
  const fitted: Array<Promise<FittedSheet>> = [];

  const fitSheet = async (scan: AssignedScan, metrics: SheetMetrics): Promise<void> => {
    const unitsPerPixel = sheetUnitsPerPixel(metrics, scan.resolution.dpiY, reference, capHeightUnits);
    const { jobs, ...plan } = planSheetFit(scan, { fit: settings.fit, unitsPerPixel, capHeightUnits });
    const outcomes: Array<Promise<LetterFitOutcome>> = [];
    for (const job of jobs) {
      await runner.room();
      const outcome = runner.run({ kind: 'fit', job }).then((result) => {
        progress.lettersFitted++;
        report();
        return result;
      });
      outcome.catch(ignore);
      outcomes.push(outcome);
    }
    const sheet = Promise.all(outcomes).then((results) => assembleSheetFit(plan, results));
    sheet.catch(ignore);
    fitted.push(sheet);
  };

  for (let i = 0; i <= ahead && i < files.length; i++) startTrace(i);
  for (let i = 0; i < files.length; i++) {
    startTrace(i);
    const traced = await (traces[i] as Promise<TracedSheetFile>);
    traces[i] = undefined;
    events.onDecodeNotes?.(i, traced.decodeNotes);
    if (traced.scan === null) {
      await reportUndecodableAfter(i, files, traces, events);
      throw fromPortableError(traced.traceError ?? { type: 'other', message: `Sheet ${i + 1} could not be traced.` });
    }
    startTrace(i + 1 + ahead);
    const count = traced.scan.sheet.letters.length;
    counts.push(count);
    progress.sheetsTraced++;
    progress.lettersFound += count;
    report();
    if (dealt + count > wanted.length) enoughCharacters = false;
    const slice = wanted.slice(dealt, dealt + count).join('');
    dealt += count;
    if (!enoughCharacters) continue;

    const scan: AssignedScan = { ...traced.scan, sheet: segmentSheet(traced.scan.contours, { characters: slice }) };
    const metrics = measureSheetMetrics(scan.sheet, scan.contours);
    reference ??= scaleReference(metrics, scan.resolution.dpiY);
    if (reference === null) {
      waitingForScale.push({ scan, metrics });
      continue;
    }
    for (const waiting of waitingForScale.splice(0)) await fitSheet(waiting.scan, waiting.metrics);
    await fitSheet(scan, metrics);
  }
  const mismatch = letterCountMismatch(counts, wanted.length);
  if (mismatch) throw mismatch;
  // No sheet shows flat-topped capitals: each is scaled by its own letter height.
  for (const waiting of waitingForScale.splice(0)) await fitSheet(waiting.scan, waiting.metrics);
  return Promise.all(fitted);
}

/**
 * Before a sheet with no ink is reported, the files after it are decoded: a file
 * that will not decode is the first thing to fix, and is reported instead (as
 * when every file was decoded before any was traced). Their notes are given too.
 */
async function reportUndecodableAfter(failed: number, files: readonly string[], traces: ReadonlyArray<Promise<TracedSheetFile> | undefined>, events: SheetFileEvents): Promise<void> {
  for (let j = failed + 1; j < files.length; j++) {
    const started = traces[j];
    const notes = started ? (await started).decodeNotes : (await decodeScanFile(files[j] as string)).notes;
    events.onDecodeNotes?.(j, notes);
  }
}

function ignore(): void {}
