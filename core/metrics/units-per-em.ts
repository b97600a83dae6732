/**
 * Units per em of a new font: 1000, the CFF/PostScript convention (a FontMatrix of
 * 0.001, Adobe Technical Note #5176, Top DICT FontMatrix default). The one default
 * the project file, the font writer, the CLI and the UI share.
 */
export const DEFAULT_UNITS_PER_EM = 1000;
