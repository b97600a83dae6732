/**
 * The atomic changes a transaction is made of, each carrying what it replaces so that
 * its inverse is known without looking at the document: undo replays the inverses in
 * reverse order. Contours are replaced whole (a contour is a few dozen points, and a
 * whole-contour change keeps insertions and deletions as simple as moves); the
 * document's other contours, glyphs and metrics are shared untouched.
 */
import type { OutlineContour, OutlinePoint } from '../outline/index.ts';
import { DocumentError } from './document-error.ts';
import type { DocumentGlyph, GlyphDocument, GlyphId, MetricName, MetricOverrides, PointRef, Selection } from './glyph-document.ts';
import { comparePointRefs, glyphOf, resolveMetrics } from './glyph-document.ts';

/** Contour `contour` of `glyph` goes from `before` to `after`. */
export interface ContourReplace {
  readonly kind: 'contour.replace';
  readonly glyph: GlyphId;
  readonly contour: number;
  readonly before: OutlineContour;
  readonly after: OutlineContour;
}

/** `value` is inserted as contour `contour` of `glyph` (later contours move up by one). */
export interface ContourInsert {
  readonly kind: 'contour.insert';
  readonly glyph: GlyphId;
  readonly contour: number;
  readonly value: OutlineContour;
}

/** Contour `contour` of `glyph`, which is `value`, is removed (later contours move down). */
export interface ContourRemove {
  readonly kind: 'contour.remove';
  readonly glyph: GlyphId;
  readonly contour: number;
  readonly value: OutlineContour;
}

/** The advance width of `glyph` goes from `before` to `after`. */
export interface AdvanceSet {
  readonly kind: 'advance.set';
  readonly glyph: GlyphId;
  readonly before: number;
  readonly after: number;
}

/** The designer's vertical metrics go from `before` to `after`; the metrics in force follow. */
export interface MetricsSet {
  readonly kind: 'metrics.set';
  readonly before: MetricOverrides;
  readonly after: MetricOverrides;
}

/** The selection goes from `before` to `after` (both normalized). */
export interface SelectionSet {
  readonly kind: 'selection.set';
  readonly before: Selection;
  readonly after: Selection;
}

export type Change = ContourReplace | ContourInsert | ContourRemove | AdvanceSet | MetricsSet | SelectionSet;

/** The change that undoes `change`. */
export function invertChange(change: Change): Change {
  switch (change.kind) {
    case 'contour.replace':
      return { ...change, before: change.after, after: change.before };
    case 'contour.insert':
      return { kind: 'contour.remove', glyph: change.glyph, contour: change.contour, value: change.value };
    case 'contour.remove':
      return { kind: 'contour.insert', glyph: change.glyph, contour: change.contour, value: change.value };
    case 'advance.set':
      return { ...change, before: change.after, after: change.before };
    case 'metrics.set':
      return { ...change, before: change.after, after: change.before };
    case 'selection.set':
      return { ...change, before: change.after, after: change.before };
  }
}

/** True when the change only touches the selection. */
export function isSelectionChange(change: Change): change is SelectionSet {
  return change.kind === 'selection.set';
}

/** Point-by-point equality of two contours (positions, kinds, smooth flags). */
export function contoursEqual(a: OutlineContour, b: OutlineContour): boolean {
  if (a === b) return true;
  if (a.points.length !== b.points.length) return false;
  return a.points.every((p, i) => pointsIdentical(p, b.points[i] as OutlinePoint));
}

function pointsIdentical(a: OutlinePoint, b: OutlinePoint): boolean {
  return a.x === b.x && a.y === b.y && a.kind === b.kind && a.smooth === b.smooth;
}

/** Equality of two sets of designer's metrics (a metric absent and one set to undefined are the same). */
export function overridesEqual(a: MetricOverrides, b: MetricOverrides): boolean {
  if (a === b) return true;
  const names = new Set([...Object.keys(a), ...Object.keys(b)] as MetricName[]);
  return [...names].every((name) => a[name] === b[name]);
}

/** Equality of two normalized selections. */
export function selectionsEqual(a: Selection, b: Selection): boolean {
  return a === b || (a.length === b.length && a.every((r, i) => comparePointRefs(r, b[i] as PointRef) === 0));
}

function stale(message: string): never {
  throw new DocumentError('stale-change', `${message} The transaction was built from a different state; build it again from the current one.`);
}

function withGlyph(document: GlyphDocument, id: GlyphId, glyph: DocumentGlyph): GlyphDocument {
  return { ...document, glyphs: { ...document.glyphs, [id]: glyph } };
}

function withContours(document: GlyphDocument, id: GlyphId, glyph: DocumentGlyph, contours: readonly OutlineContour[]): GlyphDocument {
  return withGlyph(document, id, { ...glyph, outline: { ...glyph.outline, contours } });
}

/**
 * The document with one change applied. Checks that the document holds the change's
 * "before" value and throws DocumentError('stale-change') when it does not, so a
 * transaction can never be applied to a state it was not made for.
 */
export function applyChange(document: GlyphDocument, change: Change): GlyphDocument {
  if (change.kind === 'selection.set') {
    if (!selectionsEqual(document.selection, change.before)) stale('The selection is not the one this change starts from.');
    return { ...document, selection: change.after };
  }
  if (change.kind === 'metrics.set') {
    if (!overridesEqual(document.metricOverrides, change.before)) stale('The font\'s typed metrics are not the ones this change starts from.');
    return { ...document, metricOverrides: change.after, metrics: resolveMetrics(document.measuredMetrics, change.after) };
  }
  const glyph = glyphOf(document, change.glyph);
  const contours = glyph.outline.contours;
  switch (change.kind) {
    case 'contour.replace': {
      const current = contours[change.contour];
      if (current === undefined || !contoursEqual(current, change.before)) stale(`Contour ${change.contour} of "${change.glyph}" is not the one this change replaces.`);
      const next = contours.slice();
      next[change.contour] = change.after;
      return withContours(document, change.glyph, glyph, next);
    }
    case 'contour.insert': {
      if (change.contour < 0 || change.contour > contours.length) stale(`Glyph "${change.glyph}" has no place for contour ${change.contour}.`);
      const next = contours.slice();
      next.splice(change.contour, 0, change.value);
      return withContours(document, change.glyph, glyph, next);
    }
    case 'contour.remove': {
      const current = contours[change.contour];
      if (current === undefined || !contoursEqual(current, change.value)) stale(`Contour ${change.contour} of "${change.glyph}" is not the one this change removes.`);
      const next = contours.slice();
      next.splice(change.contour, 1);
      return withContours(document, change.glyph, glyph, next);
    }
    case 'advance.set': {
      if (glyph.advanceWidth !== change.before) stale(`The advance width of "${change.glyph}" is ${glyph.advanceWidth}, not ${change.before}.`);
      return withGlyph(document, change.glyph, { ...glyph, advanceWidth: change.after });
    }
  }
}

/**
 * Changes `first` followed by `second`, with consecutive replacements of the same
 * contour (or advance) collapsed into one from the first "before" to the last "after"
 * — how a 100-move drag becomes one change per contour. Replacements are not
 * collapsed across an insertion or removal in the same glyph (contour indices shift).
 * @internal used by history.ts
 */
export function composeChanges(first: readonly Change[], second: readonly Change[]): Change[] {
  const result: Change[] = first.slice();
  outer: for (const change of second) {
    if (change.kind === 'contour.replace' || change.kind === 'advance.set') {
      for (let i = result.length - 1; i >= 0; i--) {
        const earlier = result[i] as Change;
        if (earlier.kind === 'selection.set' || earlier.kind === 'metrics.set' || earlier.glyph !== change.glyph) continue;
        if (earlier.kind === 'contour.insert' || earlier.kind === 'contour.remove') break;
        if (earlier.kind === 'contour.replace' && change.kind === 'contour.replace' && earlier.contour === change.contour) {
          result[i] = { ...earlier, after: change.after };
          continue outer;
        }
        if (earlier.kind === 'advance.set' && change.kind === 'advance.set') {
          result[i] = { ...earlier, after: change.after };
          continue outer;
        }
      }
    }
    result.push(change);
  }
  return result;
}
