/**
 * Selecting points: by click (the nearest point within a pick radius), by marquee
 * (every point inside a rectangle), or by a given list, each replacing the selection
 * or adding to, removing from or toggling within it (shift and alt clicks). Selection
 * transactions are tagged 'selection.set'; history makes no undo step for them.
 */
import type { Point } from '../geometry/vector.ts';
import { squaredDistance } from '../geometry/vector.ts';
import type { GlyphDocument, GlyphId, PointRef, Selection } from './glyph-document.ts';
import { comparePointRefs, glyphOf, isSelected, normalizeSelection } from './glyph-document.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

/** How a pick combines with the current selection. */
export type SelectionMode = 'replace' | 'add' | 'remove' | 'toggle';

/** An axis-aligned rectangle in font units; corners in any order. */
export interface Rect {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/** The selection `current` combined with `picked` under `mode`. */
export function combineSelection(current: Selection, picked: readonly PointRef[], mode: SelectionMode): Selection {
  const chosen = normalizeSelection(picked);
  switch (mode) {
    case 'replace':
      return chosen;
    case 'add':
      return normalizeSelection([...current, ...chosen]);
    case 'remove':
      return current.filter((r) => !isSelected(chosen, r));
    case 'toggle':
      return normalizeSelection([...current.filter((r) => !isSelected(chosen, r)), ...chosen.filter((r) => !isSelected(current, r))]);
  }
}

/** The transaction setting the selection to `after`. */
export function setSelection(document: GlyphDocument, after: Selection): Transaction {
  const normalized = normalizeSelection(after);
  return transaction('selection.set', [{ kind: 'selection.set', before: document.selection, after: normalized }]);
}

/** Selects `refs` under `mode`. */
export function selectPoints(document: GlyphDocument, refs: readonly PointRef[], mode: SelectionMode = 'replace'): Transaction {
  return setSelection(document, combineSelection(document.selection, refs, mode));
}

/**
 * The point of `glyph` nearest to `at` within `radius` (font units), or null. On a tie
 * the off-curve point wins (a handle drawn over its on-curve point is still pickable),
 * then the earlier point.
 */
export function pointAt(document: GlyphDocument, glyph: GlyphId, at: Point, radius: number): PointRef | null {
  let best: { ref: PointRef; distance: number; off: boolean } | null = null;
  glyphOf(document, glyph).outline.contours.forEach((contour, c) => {
    contour.points.forEach((p, i) => {
      const distance = squaredDistance(p, at);
      if (distance > radius * radius) return;
      const off = p.kind === 'off';
      if (best === null || distance < best.distance || (distance === best.distance && off && !best.off)) {
        best = { ref: { glyph, contour: c, point: i }, distance, off };
      }
    });
  });
  return (best as { ref: PointRef } | null)?.ref ?? null;
}

/**
 * A click at `at`: the nearest point within `radius` picked under `mode`. A click on
 * nothing clears the selection in 'replace' mode and leaves it otherwise.
 */
export function selectAt(document: GlyphDocument, glyph: GlyphId, at: Point, radius: number, mode: SelectionMode = 'replace'): Transaction {
  const hit = pointAt(document, glyph, at, radius);
  return selectPoints(document, hit ? [hit] : [], mode);
}

/** Every point of `glyph` inside `rect` (edges included). */
export function pointsInRect(document: GlyphDocument, glyph: GlyphId, rect: Rect): PointRef[] {
  const xMin = Math.min(rect.x0, rect.x1);
  const xMax = Math.max(rect.x0, rect.x1);
  const yMin = Math.min(rect.y0, rect.y1);
  const yMax = Math.max(rect.y0, rect.y1);
  const refs: PointRef[] = [];
  glyphOf(document, glyph).outline.contours.forEach((contour, c) => {
    contour.points.forEach((p, i) => {
      if (p.x >= xMin && p.x <= xMax && p.y >= yMin && p.y <= yMax) refs.push({ glyph, contour: c, point: i });
    });
  });
  return refs.sort(comparePointRefs);
}

/** A marquee: every point of `glyph` inside `rect`, picked under `mode`. */
export function selectInRect(document: GlyphDocument, glyph: GlyphId, rect: Rect, mode: SelectionMode = 'replace'): Transaction {
  return selectPoints(document, pointsInRect(document, glyph, rect), mode);
}
