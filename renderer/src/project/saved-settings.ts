// The scan and fit settings (core/pipeline/pipeline-settings.ts) between the window
// and the project file. The file keeps the fit settings in `fit` and a scan's in its
// entry; a setting at its default is left out, so a project that keeps the defaults
// reads exactly as before the app could change them, and a file saved without them
// opens with the defaults. A tolerance outside the range the app offers (files could
// hold 0.05–100 units before the range was shared with the command line) is taken to
// the nearer end of the range.
import {
  DEFAULT_FIT_SETTINGS,
  DEFAULT_SCAN_SETTINGS,
  TOLERANCE_RANGE,
  validateFitSettings,
  validateScanSettings,
  type FitSettings,
  type PipelineSettings,
  type ScanSettings,
} from '../../../core/pipeline/index.ts';
import type { ProjectData, ProjectScan } from '../../../electron/io/project/project-schema.ts';

type SavedFit = ProjectData['fit'];
type SavedScanSettings = Pick<ProjectScan, 'threshold' | 'invert' | 'speckAreaMm2' | 'pinholeAreaMm2'>;

/** The settings a project's scan opens with. Throws the core SettingsError for a value no setting accepts. */
export function projectSettings(project: ProjectData, scan: ProjectScan | undefined): PipelineSettings {
  const tolerance = Math.min(Math.max(project.fit.tolerance, TOLERANCE_RANGE.min), TOLERANCE_RANGE.max);
  return {
    scan: validateScanSettings({ threshold: scan?.threshold, invert: scan?.invert, speckAreaMm2: scan?.speckAreaMm2, pinholeAreaMm2: scan?.pinholeAreaMm2 }),
    fit: validateFitSettings({ tolerance, cornerAngleDegrees: project.fit.cornerAngleDegrees, fitMode: project.fit.fitMode, fairJoins: project.fit.fairJoins }),
  };
}

/** The project's `fit` for `fit`, keeping what the window does not set (the axis snap) from `saved`. */
export function savedFitFields(saved: SavedFit, fit: FitSettings): SavedFit {
  const { fitMode: _mode, fairJoins: _fair, ...kept } = saved;
  return {
    ...kept,
    tolerance: fit.tolerance,
    cornerAngleDegrees: fit.cornerAngleDegrees,
    ...(fit.fitMode === DEFAULT_FIT_SETTINGS.fitMode ? {} : { fitMode: fit.fitMode }),
    ...(fit.fairJoins === DEFAULT_FIT_SETTINGS.fairJoins ? {} : { fairJoins: fit.fairJoins }),
  };
}

/** A scan entry's settings fields for `scan`: only those away from their defaults. */
export function savedScanFields(scan: ScanSettings): SavedScanSettings {
  return {
    ...(scan.threshold === DEFAULT_SCAN_SETTINGS.threshold ? {} : { threshold: scan.threshold }),
    ...(scan.invert === DEFAULT_SCAN_SETTINGS.invert ? {} : { invert: scan.invert }),
    ...(scan.speckAreaMm2 === DEFAULT_SCAN_SETTINGS.speckAreaMm2 ? {} : { speckAreaMm2: scan.speckAreaMm2 }),
    ...(scan.pinholeAreaMm2 === DEFAULT_SCAN_SETTINGS.pinholeAreaMm2 ? {} : { pinholeAreaMm2: scan.pinholeAreaMm2 }),
  };
}
