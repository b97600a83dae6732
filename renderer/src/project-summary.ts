// What the project overview shows about a project, derived from project state.
// Until scans are imported a project is empty: no glyphs, default font settings.

/** Units per em of a new project's font: 1000 is the CFF/PostScript convention. */
export const DEFAULT_UNITS_PER_EM = 1000;

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
