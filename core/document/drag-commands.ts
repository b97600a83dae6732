/**
 * Dragging and nudging the selected points. A drag is a gesture: `beginDrag` records
 * the document at pointer-down, and each pointer move produces a transaction placing
 * the points at the starting positions plus the total offset (point-moves.ts), all
 * tagged 'point.drag' with the gesture's id so history makes the whole drag one undo
 * step. Arrow keys nudge by one unit, ten with shift, each press its own step.
 */
import type { Vec } from '../geometry/vector.ts';
import type { Change } from './change.ts';
import { contoursEqual } from './change.ts';
import type { GlyphDocument, Selection } from './glyph-document.ts';
import { glyphOf, selectedPointsByContour } from './glyph-document.ts';
import { movePoints } from './point-moves.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

/** Nudge distances in font units (common practice: one unit, ten with shift). */
export const NUDGE_UNITS = 1;
export const SHIFT_NUDGE_UNITS = 10;

/** One drag from pointer-down to pointer-up. */
export interface DragGesture {
  readonly id: string;
  /** The document at pointer-down: positions are computed from it. */
  readonly start: GlyphDocument;
  /** The points being dragged (the selection at pointer-down). */
  readonly points: Selection;
}

let gestureCount = 0;

/**
 * Starts a drag of the current selection. `id` names the gesture; by default a fresh
 * one is made from a counter (unique within this module's lifetime).
 */
export function beginDrag(document: GlyphDocument, id?: string): DragGesture {
  gestureCount += 1;
  return { id: id ?? `drag-${gestureCount}`, start: document, points: document.selection };
}

/**
 * The changes placing the given points of `from` at their positions moved by `offset`,
 * expressed against `current` (whose contours they replace).
 */
function moveChanges(from: GlyphDocument, current: GlyphDocument, points: Selection, offset: Vec, constrain: boolean): Change[] {
  const changes: Change[] = [];
  const glyphs = new Set(points.map((r) => r.glyph));
  for (const glyph of glyphs) {
    const contours = glyphOf(from, glyph).outline.contours;
    const now = glyphOf(current, glyph).outline.contours;
    for (const [contourIndex, selected] of selectedPointsByContour(points, glyph)) {
      const original = contours[contourIndex];
      const before = now[contourIndex];
      if (!original || !before) continue;
      const after = movePoints(original, selected, offset, constrain);
      if (!contoursEqual(before, after)) changes.push({ kind: 'contour.replace', glyph, contour: contourIndex, before, after });
    }
  }
  return changes;
}

/**
 * The transaction for a pointer move during `gesture`: the dragged points at their
 * starting positions plus `offset` (total since pointer-down, font units). With
 * `constrain` (shift), horizontal and vertical handles stay so and other motion keeps
 * to its larger axis.
 */
export function dragTo(document: GlyphDocument, gesture: DragGesture, offset: Vec, constrain = false): Transaction {
  return transaction('point.drag', moveChanges(gesture.start, document, gesture.points, offset, constrain), { gesture: gesture.id });
}

export type NudgeDirection = 'left' | 'right' | 'up' | 'down';

/**
 * Moves the selection one unit in `direction` (y up: 'up' is +y), ten with `shift`,
 * under the same rules as a drag. Null when nothing is selected. Consecutive nudges
 * are separate undo steps unless the caller passes a shared `gesture`.
 */
export function nudgeSelection(document: GlyphDocument, direction: NudgeDirection, options: { shift?: boolean; gesture?: string } = {}): Transaction | null {
  if (document.selection.length === 0) return null;
  const d = options.shift ? SHIFT_NUDGE_UNITS : NUDGE_UNITS;
  const offset = { left: { x: -d, y: 0 }, right: { x: d, y: 0 }, up: { x: 0, y: d }, down: { x: 0, y: -d } }[direction];
  const changes = moveChanges(document, document, document.selection, offset, false);
  return transaction('point.nudge', changes, options.gesture !== undefined ? { gesture: options.gesture } : {});
}

