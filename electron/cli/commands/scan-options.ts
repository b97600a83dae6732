// The scan options every tracing command shares: threshold, invert, cleanup sizes,
// resolution override and the characters drawn on the sheet.
import type { TraceScanOptions } from '../../../core/raster/index.ts';
import { CLEANUP_AREA_RANGE, GREY_LEVEL_RANGE } from '../../../core/pipeline/index.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { numberOption } from '../parse-options.ts';

/** Resolutions accepted as an override: below 50 dpi nothing traceable remains; above 12,000 no scanner goes. */
const DPI_RANGE = { min: 50, max: 12_000 } as const;

export const scanOptionSpec = {
  threshold: { type: 'string' },
  invert: { type: 'boolean' },
  'speck-area': { type: 'string' },
  'pinhole-area': { type: 'string' },
  dpi: { type: 'string' },
  characters: { type: 'string' },
} as const;

export const SCAN_OPTIONS_HELP = [
  '--threshold otsu|local|0-255   how ink is told from paper (default otsu; local adapts to uneven paper)',
  '--invert                       light ink on dark paper',
  '--speck-area MM2               remove ink specks smaller than this (default 0.02 mm²)',
  '--pinhole-area MM2             fill paper pinholes in ink smaller than this (default 0.02 mm²)',
  '--dpi N                        the scan resolution, when the file does not record it or records it wrongly',
  '--characters TEXT              characters drawn on the sheet, in reading order',
];

interface ScanValues {
  threshold?: string | undefined;
  invert?: boolean | undefined;
  'speck-area'?: string | undefined;
  'pinhole-area'?: string | undefined;
  dpi?: string | undefined;
  characters?: string | undefined;
}

/** Turns parsed option values into trace settings, or throws CliUsageError. */
export function scanSettingsFrom(command: string, values: ScanValues): { trace: TraceScanOptions; dpi: number | undefined } {
  const trace: { -readonly [K in keyof TraceScanOptions]: TraceScanOptions[K] } = { invert: values.invert === true };
  const threshold = values.threshold ?? 'otsu';
  if (threshold === 'otsu') trace.method = 'otsu';
  else if (threshold === 'local') trace.method = 'sauvola';
  else if (/^\d{1,3}$/.test(threshold) && Number(threshold) <= GREY_LEVEL_RANGE.max) {
    trace.method = 'manual';
    trace.level = Number(threshold);
  } else {
    throw new CliUsageError(`stemline ${command}: --threshold takes otsu, local or a grey level from 0 to 255, not "${threshold}".`);
  }
  const speck = numberOption(command, 'speck-area', values['speck-area'], CLEANUP_AREA_RANGE.min, CLEANUP_AREA_RANGE.max);
  if (speck !== undefined) trace.speckAreaMm2 = speck;
  const pinhole = numberOption(command, 'pinhole-area', values['pinhole-area'], CLEANUP_AREA_RANGE.min, CLEANUP_AREA_RANGE.max);
  if (pinhole !== undefined) trace.pinholeAreaMm2 = pinhole;
  if (values.characters !== undefined) trace.characters = values.characters;
  return { trace, dpi: numberOption(command, 'dpi', values.dpi, DPI_RANGE.min, DPI_RANGE.max) };
}
