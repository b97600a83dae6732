/**
 * The settings a user chooses for the pipeline, with their ranges and defaults: how
 * ink is told from paper and which specks are removed (the scan settings), and how
 * closely and in which style the letters are fitted (the fit settings). The command
 * line's options and the app's settings panel both read their names' ranges and
 * defaults from here, so the two accept exactly the same values; the project file
 * saves them in this shape.
 *
 * Plain data: `validatePipelineSettings` checks a value that came from outside (a
 * project file, a message) and says which setting is wrong and what it accepts;
 * `traceScanOptionsOf` and `fitOptionsOf` turn valid settings into the options of the
 * raster stage and the fitter.
 */
import { DEFAULT_PINHOLE_AREA_MM2, DEFAULT_SPECK_AREA_MM2 } from '../raster/cleanup.ts';
import type { TraceScanOptions } from '../raster/trace-scan.ts';
import { DEFAULT_CORNER_ANGLE_DEGREES, DEFAULT_FAIRING, DEFAULT_FIT_MODE, DEFAULT_TOLERANCE, type FitMode, type FitOptions } from '../fit/fit-options.ts';

/** A closed range of accepted values. */
export interface SettingRange {
  readonly min: number;
  readonly max: number;
}

/**
 * How ink is told from paper: 'otsu', Otsu's global level (Otsu 1979); 'local',
 * Sauvola's adaptive threshold for uneven paper; or a grey level 0–255 (ink is every
 * pixel at or below it).
 */
export type ThresholdSetting = 'otsu' | 'local' | number;

export interface ScanSettings {
  readonly threshold: ThresholdSetting;
  /** Light ink on dark paper. */
  readonly invert: boolean;
  /** Ink specks smaller than this (mm² on the paper) are erased; 0 keeps every speck. */
  readonly speckAreaMm2: number;
  /** Pinholes in the ink smaller than this (mm²) are filled; 0 fills none. */
  readonly pinholeAreaMm2: number;
}

export interface FitSettings {
  /** Largest distance from the traced ink to the outline, font units (never under 0.75 scan px: core/pipeline MIN_TOLERANCE_PIXELS). */
  readonly tolerance: number;
  /** Tangent turns sharper than this many degrees are corners. */
  readonly cornerAngleDegrees: number;
  readonly fitMode: FitMode;
  /**
   * Make smooth joins curvature-continuous where the tolerance allows. Smooth mode
   * always fairs (core/fit/fit-options.ts SMOOTH_MODE_FAIRING), so this asks for it
   * in economy mode; as on the command line, where `--fair-joins` only turns it on.
   */
  readonly fairJoins: boolean;
}

export interface PipelineSettings {
  readonly scan: ScanSettings;
  readonly fit: FitSettings;
}

/** Grey levels of an 8-bit scan. */
export const GREY_LEVEL_RANGE: SettingRange = { min: 0, max: 255 };
/** Cleanup sizes, mm²: 100 mm² is a 1 cm square, never a speck. */
export const CLEANUP_AREA_RANGE: SettingRange = { min: 0, max: 100 };
/** Tolerance, font units: below 0.1 is finer than the unit grid can hold; above 50 the drawing is lost. */
export const TOLERANCE_RANGE: SettingRange = { min: 0.1, max: 50 };
/** Corner angle, degrees: a turn must be more than nothing and less than a reversal. */
export const CORNER_ANGLE_RANGE: SettingRange = { min: 1, max: 179 };
/** The fit modes, in the order they are offered. */
export const FIT_MODES: readonly FitMode[] = ['economy', 'smooth'];

export const DEFAULT_SCAN_SETTINGS: ScanSettings = {
  threshold: 'otsu',
  invert: false,
  speckAreaMm2: DEFAULT_SPECK_AREA_MM2,
  pinholeAreaMm2: DEFAULT_PINHOLE_AREA_MM2,
};

export const DEFAULT_FIT_SETTINGS: FitSettings = {
  tolerance: DEFAULT_TOLERANCE,
  cornerAngleDegrees: DEFAULT_CORNER_ANGLE_DEGREES,
  fitMode: DEFAULT_FIT_MODE,
  fairJoins: DEFAULT_FAIRING,
};

export const DEFAULT_PIPELINE_SETTINGS: PipelineSettings = { scan: DEFAULT_SCAN_SETTINGS, fit: DEFAULT_FIT_SETTINGS };

/** A setting that is not one its range or choices allow; the message names it and what it accepts. */
export class SettingsError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SettingsError';
  }
}

/** Whether `value` is a number within `range`. */
export function inRange(value: unknown, range: SettingRange): value is number {
  return typeof value === 'number' && Number.isFinite(value) && value >= range.min && value <= range.max;
}

function numberIn(what: string, value: unknown, range: SettingRange, unit: string): number {
  if (!inRange(value, range)) throw new SettingsError(`The ${what} must be a number from ${range.min} to ${range.max}${unit}, not ${describe(value)}.`);
  return value;
}

function describe(value: unknown): string {
  return typeof value === 'string' ? `"${value}"` : value === undefined ? 'nothing' : JSON.stringify(value) ?? String(value);
}

function record(what: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw new SettingsError(`The ${what} must be an object of settings, not ${describe(value)}.`);
  return value as Record<string, unknown>;
}

/** Checks scan settings from outside; missing fields take their defaults. Throws SettingsError naming the first bad one. */
export function validateScanSettings(input: unknown): ScanSettings {
  const value = record('scan settings', input ?? {});
  const threshold = value.threshold ?? DEFAULT_SCAN_SETTINGS.threshold;
  if (threshold !== 'otsu' && threshold !== 'local' && !(Number.isInteger(threshold) && inRange(threshold, GREY_LEVEL_RANGE))) {
    throw new SettingsError(`The threshold must be "otsu", "local" or a whole grey level from ${GREY_LEVEL_RANGE.min} to ${GREY_LEVEL_RANGE.max}, not ${describe(threshold)}.`);
  }
  const invert = value.invert ?? DEFAULT_SCAN_SETTINGS.invert;
  if (typeof invert !== 'boolean') throw new SettingsError(`The invert setting must be true or false, not ${describe(invert)}.`);
  return {
    threshold: threshold as ThresholdSetting,
    invert,
    speckAreaMm2: numberIn('speck size', value.speckAreaMm2 ?? DEFAULT_SCAN_SETTINGS.speckAreaMm2, CLEANUP_AREA_RANGE, ' mm² (0 keeps every speck)'),
    pinholeAreaMm2: numberIn('pinhole size', value.pinholeAreaMm2 ?? DEFAULT_SCAN_SETTINGS.pinholeAreaMm2, CLEANUP_AREA_RANGE, ' mm² (0 fills none)'),
  };
}

/** Checks fit settings from outside; missing fields take their defaults. Throws SettingsError naming the first bad one. */
export function validateFitSettings(input: unknown): FitSettings {
  const value = record('fit settings', input ?? {});
  const fitMode = value.fitMode ?? DEFAULT_FIT_SETTINGS.fitMode;
  if (!FIT_MODES.includes(fitMode as FitMode)) throw new SettingsError(`The fit mode must be ${FIT_MODES.map((m) => `"${m}"`).join(' or ')}, not ${describe(fitMode)}.`);
  const fairJoins = value.fairJoins ?? DEFAULT_FIT_SETTINGS.fairJoins;
  if (typeof fairJoins !== 'boolean') throw new SettingsError(`The fairing setting must be true or false, not ${describe(fairJoins)}.`);
  return {
    tolerance: numberIn('tolerance', value.tolerance ?? DEFAULT_FIT_SETTINGS.tolerance, TOLERANCE_RANGE, ' font units'),
    cornerAngleDegrees: numberIn('corner angle', value.cornerAngleDegrees ?? DEFAULT_FIT_SETTINGS.cornerAngleDegrees, CORNER_ANGLE_RANGE, '°'),
    fitMode: fitMode as FitMode,
    fairJoins,
  };
}

/** Checks settings from outside (a project, a message); missing parts take their defaults. Throws SettingsError. */
export function validatePipelineSettings(input: unknown): PipelineSettings {
  const value = record('settings', input ?? {});
  return { scan: validateScanSettings(value.scan), fit: validateFitSettings(value.fit) };
}

/** The raster stage's options for `settings`. */
export function traceScanOptionsOf(settings: ScanSettings): TraceScanOptions {
  const threshold = settings.threshold === 'otsu' ? { method: 'otsu' as const } : settings.threshold === 'local' ? { method: 'sauvola' as const } : { method: 'manual' as const, level: settings.threshold };
  return { ...threshold, invert: settings.invert, speckAreaMm2: settings.speckAreaMm2, pinholeAreaMm2: settings.pinholeAreaMm2 };
}

/** The fitter's options for `settings` (fairing asked for only when on: smooth mode fairs by itself). */
export function fitOptionsOf(settings: FitSettings): FitOptions {
  return { tolerance: settings.tolerance, cornerAngleDegrees: settings.cornerAngleDegrees, mode: settings.fitMode, ...(settings.fairJoins ? { fairing: true } : {}) };
}

/** Whether two scan settings trace the same ink. */
export function sameScanSettings(a: ScanSettings, b: ScanSettings): boolean {
  return a.threshold === b.threshold && a.invert === b.invert && a.speckAreaMm2 === b.speckAreaMm2 && a.pinholeAreaMm2 === b.pinholeAreaMm2;
}

/** Whether two fit settings fit the same outlines. */
export function sameFitSettings(a: FitSettings, b: FitSettings): boolean {
  return a.tolerance === b.tolerance && a.cornerAngleDegrees === b.cornerAngleDegrees && a.fitMode === b.fitMode && a.fairJoins === b.fairJoins;
}
