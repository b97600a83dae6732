/**
 * Several sheets drawn for one font, traced and fitted together: the characters the
 * user typed are dealt to the letters in reading order across the sheets (rows top
 * to bottom, left to right, sheets in the order given), and all sheets share one
 * drawing scale, so letters drawn at the same size become glyphs of the same size.
 */
import { segmentSheet, splitCharacters, traceScan, type ScanImage, type TraceScanOptions, type TraceScanResult } from '../raster/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS, measureSheetMetrics, type SheetMetrics } from '../metrics/index.ts';
import type { FitOptions } from '../fit/index.ts';
import { fitTracedSheet, type TracedLetters } from './trace-letters.ts';
import { DraftFontError } from './draft-font.ts';

export interface TraceSheetsOptions {
  readonly scan?: TraceScanOptions;
  readonly fit?: FitOptions;
  readonly capHeightUnits?: number;
  /** Progress over all sheets, 0–1, with the sheet being worked on. */
  readonly onProgress?: (fraction: number, sheet: number) => void;
}

/**
 * Traces and fits `images` with `characters` dealt across them. Throws DraftFontError
 * when the number of characters and letters differ (naming both counts), and what
 * traceScan throws for a sheet with no ink.
 */
export function traceSheets(images: readonly ScanImage[], characters: string, options: TraceSheetsOptions = {}): TracedLetters[] {
  const traced: TraceScanResult[] = images.map((image, i) => {
    options.onProgress?.(i / (2 * images.length), i);
    return traceSheetScan(image, options.scan);
  });
  return fitTracedSheets(traced, characters, options);
}

/** Traces one sheet as traceSheets does. A 1-bit scan is fitted on smoothed boundaries, not on its pixel staircase (bilevel-smoothing.ts). */
export function traceSheetScan(image: ScanImage, scan: TraceScanOptions = {}): TraceScanResult {
  return traceScan(image, { smoothBilevel: true, ...scan });
}

/**
 * The second half of traceSheets: deals the characters to the letters of the traced
 * sheets and fits them. Throws DraftFontError when the counts differ.
 */
export function fitTracedSheets(traced: readonly TraceScanResult[], characters: string, options: Omit<TraceSheetsOptions, 'scan'> = {}): TracedLetters[] {
  const wanted = splitCharacters(characters);
  const counts = traced.map((t) => t.sheet.letters.length);
  const mismatch = letterCountMismatch(counts, wanted.length);
  if (mismatch) throw mismatch;
  let next = 0;
  const assigned = traced.map((t) => {
    const slice = wanted.slice(next, next + t.sheet.letters.length).join('');
    next += t.sheet.letters.length;
    return { ...t, sheet: segmentSheet(t.contours, { characters: slice }) };
  });

  const capHeightUnits = options.capHeightUnits ?? DEFAULT_CAP_HEIGHT_UNITS;
  const metrics = assigned.map((t) => measureSheetMetrics(t.sheet, t.contours));
  const referenceIndex = metrics.findIndex((m) => m.capHeight !== null);
  const reference = referenceIndex < 0 ? null : scaleReference(metrics[referenceIndex] as SheetMetrics, (assigned[referenceIndex] as TraceScanResult).resolution.dpiY);
  return assigned.map((t, i) => {
    options.onProgress?.(0.5 + i / (2 * traced.length), i);
    const unitsPerPixel = sheetUnitsPerPixel(metrics[i] as SheetMetrics, t.resolution.dpiY, reference, capHeightUnits);
    return fitTracedSheet(t, { ...(options.fit ? { fit: options.fit } : {}), unitsPerPixel, capHeightUnits });
  });
}

/**
 * The DraftFontError for sheets showing `counts` letters when `characterCount`
 * characters were given, or null when they agree.
 */
export function letterCountMismatch(counts: readonly number[], characterCount: number): DraftFontError | null {
  const total = counts.reduce((a, b) => a + b, 0);
  if (characterCount === total) return null;
  const several = counts.length > 1;
  const perSheet = several ? ` (${counts.join(' + ')} on the sheets in order)` : '';
  return new DraftFontError(`The ${several ? 'sheets show' : 'sheet shows'} ${total} letters${perSheet} but ${characterCount} characters were given. Give one character per letter, in reading order: rows top to bottom, left to right${several ? ', sheets in the order named' : ''}; letters that touch count as one.`);
}

/** The sheet whose drawn cap height sets every sheet's scale: its cap height in pixels and its vertical resolution. */
export interface ScaleReference {
  readonly capHeightPixels: number;
  readonly dpiY: number;
}

/**
 * The scale reference a sheet gives, or null when it shows no flat-topped capitals.
 * The reference is the first sheet, in the order given, that gives one.
 */
export function scaleReference(metrics: SheetMetrics, dpiY: number): ScaleReference | null {
  return metrics.capHeight === null ? null : { capHeightPixels: metrics.capHeight.pixels, dpiY };
}

/**
 * One drawing scale for all sheets: from the reference sheet's cap height, carried
 * to the others by their resolution (the same drawing scanned at twice the dpi has
 * twice the pixels per millimetre). With no reference on any sheet, each sheet's
 * typical letter height is taken as the cap height.
 */
export function sheetUnitsPerPixel(metrics: SheetMetrics, dpiY: number, reference: ScaleReference | null, capHeightUnits: number): number {
  if (reference === null) return capHeightUnits / (metrics.letterHeightPixels || 1);
  const referenceScale = capHeightUnits / reference.capHeightPixels;
  return referenceScale * (reference.dpiY / dpiY);
}
