// A new, empty project with the defaults a lettering job starts from.
import { CURRENT_FORMAT_VERSION, PROJECT_FORMAT_NAME, type ProjectData } from './project-schema.ts';
import { DEFAULT_UNITS_PER_EM } from '../../../core/metrics/units-per-em.ts';
import { DEFAULT_AXIS_SNAP_DEGREES, DEFAULT_CORNER_ANGLE_DEGREES, DEFAULT_TOLERANCE } from '../../../core/fit/fit-options.ts';

/**
 * Default vertical metrics for 1000 units per em (common practice for Latin text
 * faces, from memory): cap height 700, x-height 500, ascender 750, descender −250.
 * Measured values replace them once scans are traced.
 */
const DEFAULT_VERTICAL_METRICS = { capHeight: 700, xHeight: 500, ascender: 750, descender: -250 } as const;

export function newProject(familyName = 'Untitled'): ProjectData {
  return {
    format: PROJECT_FORMAT_NAME,
    formatVersion: CURRENT_FORMAT_VERSION,
    font: { familyName, styleName: 'Regular', unitsPerEm: DEFAULT_UNITS_PER_EM, ...DEFAULT_VERTICAL_METRICS, lineGap: 0 },
    fit: { tolerance: DEFAULT_TOLERANCE, cornerAngleDegrees: DEFAULT_CORNER_ANGLE_DEGREES, axisSnapDegrees: DEFAULT_AXIS_SNAP_DEGREES },
    scans: [],
    glyphs: [],
  };
}
