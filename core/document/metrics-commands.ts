/**
 * Spacing commands: set a glyph's left or right sidebearing or its advance width.
 * Sidebearings are computed from the outline (glyph-document.ts), so setting the left
 * one moves the outline horizontally and the advance with it (the right sidebearing
 * stays), and setting the right one changes only the advance — as in every font
 * editor's metrics fields (common practice).
 */
import { mapContour } from '../outline/index.ts';
import type { Change } from './change.ts';
import { DocumentError } from './document-error.ts';
import type { GlyphDocument, GlyphId } from './glyph-document.ts';
import { glyphOf, glyphSidebearings } from './glyph-document.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

function finite(value: number, what: string): void {
  if (!Number.isFinite(value)) throw new DocumentError('bad-argument', `The ${what} must be a finite number of units, not ${value}.`);
}

/**
 * Moves the outline so its ink starts `value` units from the origin, and the advance
 * by the same amount, keeping the right sidebearing. Null for a glyph without ink or
 * when nothing would change.
 */
export function setLeftSidebearing(document: GlyphDocument, glyph: GlyphId, value: number): Transaction | null {
  finite(value, 'left sidebearing');
  const current = glyphOf(document, glyph);
  const bearings = glyphSidebearings(current);
  if (!bearings) return null;
  const shift = value - bearings.left;
  if (shift === 0) return null;
  const changes: Change[] = current.outline.contours.map((before, contour) => ({
    kind: 'contour.replace' as const,
    glyph,
    contour,
    before,
    after: mapContour(before, (p) => ({ x: p.x + shift, y: p.y })),
  }));
  changes.push({ kind: 'advance.set', glyph, before: current.advanceWidth, after: current.advanceWidth + shift });
  return transaction('metrics.sidebearing', changes);
}

/**
 * Sets the advance so the ink ends `value` units before it. Null for a glyph without
 * ink (set its advance instead) or when nothing would change.
 */
export function setRightSidebearing(document: GlyphDocument, glyph: GlyphId, value: number): Transaction | null {
  finite(value, 'right sidebearing');
  const current = glyphOf(document, glyph);
  const bearings = glyphSidebearings(current);
  if (!bearings) return null;
  const after = current.advanceWidth + (value - bearings.right);
  if (after === current.advanceWidth) return null;
  return transaction('metrics.sidebearing', [{ kind: 'advance.set', glyph, before: current.advanceWidth, after }]);
}

/** Sets the advance width; the outline stays, so the right sidebearing changes. */
export function setAdvanceWidth(document: GlyphDocument, glyph: GlyphId, value: number): Transaction | null {
  finite(value, 'advance width');
  const current = glyphOf(document, glyph);
  if (value === current.advanceWidth) return null;
  return transaction('metrics.advance', [{ kind: 'advance.set', glyph, before: current.advanceWidth, after: value }]);
}
