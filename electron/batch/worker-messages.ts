// The messages between a batch build and its worker threads. Each request is numbered
// and answered once with the same number, carrying the result or the error; a request
// to fit a held sheet is also answered with a progress message after each letter.
// The worker answers its requests one at a time, in the order they were sent.
import type { LetterFitOutcome, FittedSheet, ScaleReference } from '../../core/pipeline/index.ts';
import type { PortableError, TraceSheetTask } from './batch-tasks.ts';
import type { SheetFitSettings, SheetTraceReport } from './held-sheets.ts';
import type { PackedLetterJob } from './packed-letter-job.ts';

/** What a worker is asked to do. */
export type WorkerTask =
  /** Decode and trace a sheet, and hold it. */
  | { readonly kind: 'trace'; readonly sheet: number; readonly task: TraceSheetTask }
  /** Deal a held sheet its characters. */
  | { readonly kind: 'deal'; readonly sheet: number; readonly characters: string }
  /** Plan and fit every letter of a held sheet, and let it go. */
  | { readonly kind: 'fit'; readonly sheet: number; readonly reference: ScaleReference | null; readonly settings: SheetFitSettings }
  /** Fit one letter of a sheet held by another thread. */
  | { readonly kind: 'letter'; readonly job: PackedLetterJob }
  /** Let a held sheet go unfitted. */
  | { readonly kind: 'release'; readonly sheet: number };

/** What each kind of task answers. */
export interface WorkerAnswers {
  readonly trace: SheetTraceReport;
  /** The scale reference the sheet gives. */
  readonly deal: ScaleReference | null;
  readonly fit: FittedSheet;
  readonly letter: LetterFitOutcome;
  readonly release: null;
}

export type WorkerRequest = WorkerTask & { readonly id: number };

export type WorkerReply =
  | { readonly id: number; readonly kind: 'done'; readonly result: unknown }
  | { readonly id: number; readonly kind: 'failed'; readonly error: PortableError }
  /** One more letter of the sheet being fitted for request `id` is done. */
  | { readonly id: number; readonly kind: 'letter-fitted' };
