// The scan and fit settings a user chooses in the app and on the command line: one
// set of names, ranges and defaults, bad values refused with what was wrong and what
// is accepted, and the options they give the raster stage and the fitter.
import { describe, expect, it } from 'vitest';
import {
  assembleSheetFit,
  CORNER_ANGLE_RANGE,
  DEFAULT_PIPELINE_SETTINGS,
  fitLetterJob,
  fitOptionsOf,
  fitTracedSheet,
  planForLetters,
  planSheetFit,
  SettingsError,
  TOLERANCE_RANGE,
  traceScanOptionsOf,
  validateFitSettings,
  validatePipelineSettings,
  validateScanSettings,
} from '../../core/pipeline/index.ts';
import { DEFAULT_CORNER_ANGLE_DEGREES, DEFAULT_TOLERANCE } from '../../core/fit/index.ts';
import { DEFAULT_SPECK_AREA_MM2, traceScan, type GreyRaster } from '../../core/raster/index.ts';
import { fitOptionsFrom } from '../../electron/cli/commands/fit-cli-options.ts';
import { scanSettingsFrom } from '../../electron/cli/commands/scan-options.ts';

describe('pipeline settings', () => {
  it('default to what the command line uses without options', () => {
    expect(validatePipelineSettings({})).toEqual(DEFAULT_PIPELINE_SETTINGS);
    expect(DEFAULT_PIPELINE_SETTINGS.fit.tolerance).toBe(DEFAULT_TOLERANCE);
    expect(DEFAULT_PIPELINE_SETTINGS.fit.cornerAngleDegrees).toBe(DEFAULT_CORNER_ANGLE_DEGREES);
    expect(DEFAULT_PIPELINE_SETTINGS.scan.speckAreaMm2).toBe(DEFAULT_SPECK_AREA_MM2);
    expect(traceScanOptionsOf(DEFAULT_PIPELINE_SETTINGS.scan)).toMatchObject({ method: 'otsu', invert: false });
    expect(fitOptionsOf(DEFAULT_PIPELINE_SETTINGS.fit)).toEqual({ tolerance: DEFAULT_TOLERANCE, cornerAngleDegrees: DEFAULT_CORNER_ANGLE_DEGREES, mode: 'economy' });
  });

  it('refuse bad values with the setting named and the range it accepts', () => {
    expect(() => validateFitSettings({ tolerance: 0 })).toThrow(SettingsError);
    expect(() => validateFitSettings({ tolerance: 0 })).toThrow('The tolerance must be a number from 0.1 to 50 font units, not 0.');
    expect(() => validateFitSettings({ tolerance: '2' })).toThrow('not "2"');
    expect(() => validateFitSettings({ cornerAngleDegrees: 180 })).toThrow('The corner angle must be a number from 1 to 179°, not 180.');
    expect(() => validateFitSettings({ fitMode: 'fast' })).toThrow('The fit mode must be "economy" or "smooth", not "fast".');
    expect(() => validateFitSettings({ fairJoins: 'yes' })).toThrow('The fairing setting must be true or false');
    expect(() => validateScanSettings({ threshold: 256 })).toThrow('The threshold must be "otsu", "local" or a whole grey level from 0 to 255, not 256.');
    expect(() => validateScanSettings({ threshold: 12.5 })).toThrow(/whole grey level/);
    expect(() => validateScanSettings({ speckAreaMm2: -1 })).toThrow('The speck size must be a number from 0 to 100 mm² (0 keeps every speck), not -1.');
    expect(() => validateScanSettings({ pinholeAreaMm2: Number.NaN })).toThrow(/pinhole size/);
    expect(() => validatePipelineSettings([])).toThrow('The settings must be an object of settings');
  });

  it('accept the ends of every range, and a grey level, local or Otsu threshold', () => {
    expect(validateFitSettings({ tolerance: TOLERANCE_RANGE.min, cornerAngleDegrees: CORNER_ANGLE_RANGE.max }).tolerance).toBe(0.1);
    expect(validateFitSettings({ tolerance: TOLERANCE_RANGE.max }).tolerance).toBe(50);
    expect(traceScanOptionsOf(validateScanSettings({ threshold: 0 }))).toMatchObject({ method: 'manual', level: 0 });
    expect(traceScanOptionsOf(validateScanSettings({ threshold: 'local' }))).toMatchObject({ method: 'sauvola' });
    expect(fitOptionsOf(validateFitSettings({ fitMode: 'smooth', fairJoins: true }))).toMatchObject({ mode: 'smooth', fairing: true });
  });

  it('are the command line\'s ranges: trace and build accept and refuse the same values', () => {
    expect(fitOptionsFrom('trace', { tolerance: String(TOLERANCE_RANGE.min) }).tolerance).toBe(TOLERANCE_RANGE.min);
    expect(() => fitOptionsFrom('trace', { tolerance: String(TOLERANCE_RANGE.max + 0.01) })).toThrow('--tolerance takes a number from 0.1 to 50');
    expect(() => fitOptionsFrom('trace', { 'corner-angle': String(CORNER_ANGLE_RANGE.min - 0.5) })).toThrow('--corner-angle takes a number from 1 to 179');
    expect(() => scanSettingsFrom('trace', { 'speck-area': '100.5' })).toThrow('--speck-area takes a number from 0 to 100');
    expect(scanSettingsFrom('trace', { threshold: '255' }).trace).toMatchObject({ method: 'manual', level: 255 });
  });
});

describe('fitting some letters of a sheet', () => {
  /** Three blocks on whole pixels, one of them with a notch so the outlines differ. */
  function sheet(): GreyRaster {
    const width = 300;
    const height = 120;
    const data = new Uint8Array(width * height).fill(255);
    const block = (x: number, y: number, w: number, h: number, value = 0) => { for (let r = y; r < y + h; r++) for (let c = x; c < x + w; c++) data[r * width + c] = value; };
    block(20, 20, 60, 80);
    block(120, 40, 50, 60);
    block(210, 20, 60, 80);
    block(230, 20, 20, 30, 255);
    return { width, height, data, dpi: 300 };
  }

  it('gives each letter exactly the outline it gets when the whole sheet is fitted', () => {
    const scan = traceScan({ raster: sheet() }, { characters: 'HxH' });
    const all = fitTracedSheet(scan);
    const part = planForLetters(planSheetFit(scan), [2, 0, 7]);
    const some = assembleSheetFit(part, part.jobs.map(fitLetterJob));
    expect(some.letters.map((l) => l.index)).toEqual([0, 2]);
    expect(some.unitsPerPixel).toBe(all.unitsPerPixel);
    expect(some.letters[1]?.outline).toEqual(all.letters[2]?.outline);
    expect(some.letters[0]?.outline).toEqual(all.letters[0]?.outline);
  });
});
