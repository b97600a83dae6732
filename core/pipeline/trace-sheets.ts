/**
 * Several sheets drawn for one font, traced and fitted together: the characters the
 * user typed are dealt to the letters in reading order across the sheets (rows top
 * to bottom, left to right, sheets in the order given), and all sheets share one
 * drawing scale, so letters drawn at the same size become glyphs of the same size.
 */
import { segmentSheet, splitCharacters, traceScan, type ScanImage, type TraceScanOptions, type TraceScanResult } from '../raster/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS, measureSheetMetrics } from '../metrics/index.ts';
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
    // A 1-bit scan is fitted on smoothed boundaries, not on its pixel staircase (bilevel-smoothing.ts).
    return traceScan(image, { smoothBilevel: true, ...options.scan });
  });
  const wanted = splitCharacters(characters);
  const counts = traced.map((t) => t.sheet.letters.length);
  const total = counts.reduce((a, b) => a + b, 0);
  if (wanted.length !== total) {
    const perSheet = images.length > 1 ? ` (${counts.join(' + ')} on the sheets in order)` : '';
    throw new DraftFontError(`The ${images.length > 1 ? 'sheets show' : 'sheet shows'} ${total} letters${perSheet} but ${wanted.length} characters were given. Give one character per letter, in reading order: rows top to bottom, left to right${images.length > 1 ? ', sheets in the order named' : ''}; letters that touch count as one.`);
  }
  let next = 0;
  const assigned = traced.map((t) => {
    const slice = wanted.slice(next, next + t.sheet.letters.length).join('');
    next += t.sheet.letters.length;
    return { ...t, sheet: segmentSheet(t.contours, { characters: slice }) };
  });

  // One drawing scale: from the first sheet that shows flat-topped capitals, carried to
  // the others by their resolution (the same drawing scanned at twice the dpi has
  // twice the pixels per millimetre).
  const capHeightUnits = options.capHeightUnits ?? DEFAULT_CAP_HEIGHT_UNITS;
  const metrics = assigned.map((t) => measureSheetMetrics(t.sheet, t.contours));
  const reference = metrics.findIndex((m) => m.capHeight !== null);
  const scales = assigned.map((t, i) => {
    if (reference < 0) return capHeightUnits / (metrics[i]?.letterHeightPixels || 1);
    const referenceScale = capHeightUnits / (metrics[reference]?.capHeight?.pixels ?? 1);
    return referenceScale * ((assigned[reference]?.resolution.dpiY ?? 1) / t.resolution.dpiY);
  });
  return assigned.map((t, i) => {
    options.onProgress?.(0.5 + i / (2 * images.length), i);
    return fitTracedSheet(t, { ...(options.fit ? { fit: options.fit } : {}), unitsPerPixel: scales[i] ?? 1, capHeightUnits });
  });
}
