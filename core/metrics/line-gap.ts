/**
 * The default line gap: what tops the ascender-to-descender span up to a line
 * spacing of 1.2 em, the common default for text (common practice, from memory: the
 * CSS "normal" line height of most text faces lies near 1.2). The one rule the
 * command-line build and the app share, so the same drawing gives the same lines.
 */

/** Line spacing, in ems, the default line gap tops up to (common practice). */
export const DEFAULT_LINE_SPACING_EM = 1.2;

/** The line gap (0 or more, whole units) that makes ascender − descender + gap = 1.2 em. */
export function defaultLineGap(unitsPerEm: number, ascender: number, descender: number): number {
  return Math.max(0, Math.round(DEFAULT_LINE_SPACING_EM * unitsPerEm - (ascender - descender)));
}
