// What the project overview shows about a project, derived from project state.
// Until scans are imported a project is empty: no glyphs, default font settings.

import { DEFAULT_UNITS_PER_EM } from '../../core/metrics/units-per-em.ts';

export interface ProjectSummary {
  title: string;
  scanCount: number;
  glyphCount: number;
  unitsPerEm: number;
}

/** The summary of a project that has just been created. */
export function emptyProjectSummary(): ProjectSummary {
  return { title: 'Untitled project', scanCount: 0, glyphCount: 0, unitsPerEm: DEFAULT_UNITS_PER_EM };
}
