/**
 * The fitted letters as an editable glyph document: one glyph per fitted letter,
 * spaced with the default sidebearings, with the sheet's measured heights as the
 * font's vertical metrics; and each letter's open warnings, from the outline checks on
 * its current outline plus the fit's tolerance warnings.
 */
import { createDocument, type DocumentGlyph, type FontMetrics, type GlyphDocument, type GlyphId } from '../../../core/document/index.ts';
import { checkOutline, type OutlineWarning } from '../../../core/checks/index.ts';
import { DEFAULT_SIDEBEARING_PER_CAP_HEIGHT, DEFAULT_UNITS_PER_EM, fontHeights, spaceGlyph } from '../../../core/metrics/index.ts';
import type { Point } from '../../../core/geometry/vector.ts';
import type { GlyphOutline } from '../../../core/outline/index.ts';
import type { FittedLetter, FittedSheet } from '../scan/trace-protocol.ts';

/** A letter in the editor: the glyph's id and how its font-unit frame sits on the scan. */
export interface EditableLetter {
  readonly id: GlyphId;
  readonly character: string;
  readonly letter: FittedLetter;
  /** Font units the outline was moved right by to sit at its left sidebearing. */
  readonly shiftX: number;
}

/** Glyph id of a fitted letter: stable across edits, unique on the sheet. */
export function letterGlyphId(letter: FittedLetter): GlyphId {
  return `letter-${letter.index + 1}`;
}

/**
 * Font metrics from the sheet: the measured heights, and for those the sheet does not
 * show the share of the cap height the command line's build gives them too
 * (core/metrics/font-heights.ts), with the line gap that tops the lines up to 1.2 em.
 * These are the defaults the designer's values override.
 */
export function fontMetricsOf(sheet: Pick<FittedSheet, 'metrics'>): FontMetrics {
  const { placeholders: _placeholders, ...metrics } = fontHeights(sheet.metrics, DEFAULT_UNITS_PER_EM);
  return metrics;
}

/** The document for a fitted sheet, and the letters it holds (letters that failed to fit are left out). */
export function letterDocument(sheet: FittedSheet): { document: GlyphDocument; letters: EditableLetter[] } {
  const metrics = fontMetricsOf(sheet);
  const sidebearing = DEFAULT_SIDEBEARING_PER_CAP_HEIGHT * metrics.capHeight;
  const glyphs: (DocumentGlyph & { id: GlyphId })[] = [];
  const letters: EditableLetter[] = [];
  for (const letter of sheet.letters) {
    if (!letter.outline) continue;
    const spaced = spaceGlyph(letter.outline, sidebearing, sidebearing);
    const firstBefore = letter.outline.contours[0]?.points[0];
    const firstAfter = spaced.outline.contours[0]?.points[0];
    const shiftX = firstBefore && firstAfter ? firstAfter.x - firstBefore.x : 0;
    const id = letterGlyphId(letter);
    const codePoint = letter.character.codePointAt(0);
    glyphs.push({ id, name: id, unicodes: codePoint === undefined ? [] : [codePoint], outline: spaced.outline, advanceWidth: spaced.advanceWidth });
    letters.push({ id, character: letter.character, letter, shiftX });
  }
  return { document: createDocument(glyphs, metrics), letters };
}

/** One open warning of a letter, wherever it came from. */
export interface LetterWarning {
  readonly kind: string;
  /** Where, in the glyph's font units. */
  readonly at: Point;
  readonly message: string;
  readonly source: 'checks' | 'fit';
  /** The outline check behind a 'checks' warning, for its one-click fix (core/document/warning-fixes.ts). */
  readonly check?: OutlineWarning;
}

/**
 * The open warnings for a letter's current outline: every outline check, and the fit's
 * tolerance warnings (how far the fit strayed from the scan, which only the fit knows),
 * moved into the spaced frame. Check warnings follow edits; the fit's are as fitted.
 */
export function letterWarnings(outline: GlyphOutline, letter: EditableLetter): LetterWarning[] {
  const checks: LetterWarning[] = checkOutline(outline).map((w) => ({ kind: w.kind, at: w.at, message: w.message, source: 'checks', check: w }));
  const fit: LetterWarning[] = letter.letter.warnings
    .filter((w) => w.kind === 'tolerance-exceeded')
    .map((w) => ({ kind: w.kind, at: { x: w.at.x + letter.shiftX, y: w.at.y }, message: w.message, source: 'fit' }));
  return [...checks, ...fit];
}
