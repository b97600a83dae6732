// The sheets one thread of a batch build holds between the steps of a build: each is
// decoded and traced on the thread that holds it, dealt its characters there, and
// planned there, so its boundaries never leave that thread — only the small answers
// do (how many letters it shows, the scale it gives, its fitted letters). The same
// code runs in the calling thread and in each worker (batch-worker.ts), so a sheet
// comes out the same wherever it was held. A sheet is let go once planned.
import { segmentSheet } from '../../core/raster/index.ts';
import { measureSheetMetrics, type SheetMetrics } from '../../core/metrics/index.ts';
import type { FitOptions } from '../../core/fit/index.ts';
import { planSheetFit, scaleReference, sheetUnitsPerPixel, type ScaleReference, type SheetFitPlan } from '../../core/pipeline/index.ts';
import { traceSheetFile, type PortableError, type TracedSheetScan, type TraceSheetTask } from './batch-tasks.ts';

/** What the thread that traced a sheet tells the build. */
export interface SheetTraceReport {
  /** Notes on how the file was read (pages skipped, resolution assumed…), for the user. */
  readonly decodeNotes: readonly string[];
  /** Letters found before characters were dealt (0 when tracing failed). */
  readonly letterCount: number;
  /** The tracer's error for a page with no ink, or null. */
  readonly traceError: PortableError | null;
}

/** How every sheet of a build is fitted. */
export interface SheetFitSettings {
  readonly fit: FitOptions;
  readonly capHeightUnits: number;
}

interface Held {
  readonly scan: TracedSheetScan;
  /** Set once the sheet's characters are dealt. */
  dealt?: { readonly scan: TracedSheetScan; readonly metrics: SheetMetrics };
}

export class HeldSheets {
  private readonly sheets = new Map<number, Held>();

  /** Sheets traced and not yet planned or let go. */
  get size(): number {
    return this.sheets.size;
  }

  /**
   * Decodes and traces sheet `sheet` and keeps it. Throws InputError for a file that
   * will not decode; a page with no ink is reported in `traceError` and not kept.
   */
  async trace(sheet: number, task: TraceSheetTask): Promise<SheetTraceReport> {
    const traced = await traceSheetFile(task);
    if (traced.scan === null) return { decodeNotes: traced.decodeNotes, letterCount: 0, traceError: traced.traceError };
    this.sheets.set(sheet, { scan: traced.scan });
    return { decodeNotes: traced.decodeNotes, letterCount: traced.scan.sheet.letters.length, traceError: null };
  }

  /**
   * Gives the sheet its characters (reading order) and measures it; returns the scale
   * reference it gives (null when it shows no flat-topped capitals).
   */
  deal(sheet: number, characters: string): ScaleReference | null {
    const held = this.held(sheet);
    const scan: TracedSheetScan = { ...held.scan, sheet: segmentSheet(held.scan.contours, { characters }) };
    const metrics = measureSheetMetrics(scan.sheet, scan.contours);
    held.dealt = { scan, metrics };
    return scaleReference(metrics, scan.resolution.dpiY);
  }

  /**
   * The dealt sheet's fitting plan at the build's one drawing scale (`reference`, or
   * the sheet's own letter height when no sheet gives one); the sheet is let go.
   */
  plan(sheet: number, reference: ScaleReference | null, settings: SheetFitSettings): SheetFitPlan {
    const dealt = this.held(sheet).dealt;
    if (!dealt) throw new Error(`Sheet ${sheet + 1} was planned before its characters were dealt.`);
    this.sheets.delete(sheet);
    const unitsPerPixel = sheetUnitsPerPixel(dealt.metrics, dealt.scan.resolution.dpiY, reference, settings.capHeightUnits);
    return planSheetFit(dealt.scan, { fit: settings.fit, unitsPerPixel, capHeightUnits: settings.capHeightUnits });
  }

  /** Lets the sheet go unfitted (the build stopped short of it). */
  release(sheet: number): void {
    this.sheets.delete(sheet);
  }

  private held(sheet: number): Held {
    const held = this.sheets.get(sheet);
    if (!held) throw new Error(`Sheet ${sheet + 1} is not held by this thread of the build.`);
    return held;
  }
}
