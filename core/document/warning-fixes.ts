/**
 * One-click fixes for the outline warnings (core/checks), as transactions the editor
 * dispatches and undo replays.
 *
 * The warnings panel offers a fix where one exists without asking the designer for a
 * decision:
 * - an extremum inside a segment: the segment is split exactly at the extremum (de
 *   Casteljau), which puts an on-curve point there with axis-aligned handles, and the
 *   new point and the split's four new handles are rounded to the unit grid with the
 *   two handles kept on the point's axis, so the join stays exactly smooth;
 * - a near-miss kink: the join is made smooth (its handles turned onto one line,
 *   point-commands.ts makeSmooth);
 * - an off-grid point: every point of the glyph is snapped to the unit grid;
 * - a contour running the wrong way: it is reversed.
 * Crossing handles and tiny segments need the designer's judgement (which handle to
 * shorten, which point to keep) and have no fix here; the panel zooms to them.
 */
import type { Point } from '../geometry/vector.ts';
import { splitAt } from '../geometry/split.ts';
import { segmentExtrema } from '../fit/index.ts';
import type { OutlineWarning } from '../checks/index.ts';
import { reverseContour, type OutlineContour } from '../outline/index.ts';
import { contoursEqual, type Change } from './change.ts';
import { replaceSegments, segmentRing } from './contour-edit.ts';
import { DocumentError } from './document-error.ts';
import { glyphOf, type GlyphDocument, type GlyphId } from './glyph-document.ts';
import { makeSmooth, snapToGrid } from './point-commands.ts';
import { transaction, type Transaction } from './transaction.ts';

/** A warning's place is matched to the outline within this distance, units (warnings report rounded positions). */
const MATCH_UNITS = 0.51;

/** Warning kinds with a one-click fix. */
export type FixableWarningKind = 'extremum-inside-segment' | 'near-miss-kink' | 'off-grid-point' | 'wrong-direction';

/** True when fixWarning has a fix for this warning's kind. */
export function hasFix(warning: OutlineWarning): warning is OutlineWarning & { kind: FixableWarningKind } {
  return warning.kind === 'extremum-inside-segment' || warning.kind === 'near-miss-kink' || warning.kind === 'off-grid-point' || warning.kind === 'wrong-direction';
}

function contourOf(document: GlyphDocument, glyph: GlyphId, contour: number): OutlineContour {
  const found = glyphOf(document, glyph).outline.contours[contour];
  if (!found) throw new DocumentError('unknown-point', `Glyph "${glyph}" has no contour ${contour + 1}; the warning is out of date. Check the glyph again.`);
  return found;
}

function replaceChange(glyph: GlyphId, contour: number, before: OutlineContour, after: OutlineContour): Change[] {
  return contoursEqual(before, after) ? [] : [{ kind: 'contour.replace', glyph, contour, before, after }];
}

function near(a: Point, b: Point): boolean {
  return Math.hypot(a.x - b.x, a.y - b.y) <= MATCH_UNITS;
}

/** The extremum fix: split at the extremum, then round the new coordinates keeping the handles on the point's axis. */
function splitAtExtremum(document: GlyphDocument, glyph: GlyphId, warning: OutlineWarning): Change[] {
  const before = contourOf(document, glyph, warning.contour);
  const ring = segmentRing(before);
  for (let s = 0; s < ring.segments.length; s++) {
    const segment = ring.segments[s]!;
    if (segment.kind !== 'cubic') continue;
    const extremum = segmentExtrema(segment).find((e) => near(e.point, warning.at));
    if (!extremum) continue;
    const [first, second] = splitAt(segment, extremum.t);
    if (first.kind !== 'cubic' || second.kind !== 'cubic') return [];
    const r = Math.round;
    const point = { x: r(first.p3.x), y: r(first.p3.y) };
    // An x-extremum has a vertical tangent: both handles keep the point's x (and a
    // y-extremum its y), so the rounded join is exactly smooth.
    const onAxis = (h: Point): Point => (extremum.axis === 'x' ? { x: point.x, y: r(h.y) } : { x: r(h.x), y: point.y });
    const halves = [
      { ...first, p1: { x: r(first.p1.x), y: r(first.p1.y) }, p2: onAxis(first.p2), p3: point },
      { ...second, p0: point, p1: onAxis(second.p1), p2: { x: r(second.p2.x), y: r(second.p2.y) } },
    ];
    const after = replaceSegments(ring, s, 1, halves, [ring.smooth[s] ?? false, true]);
    return replaceChange(glyph, warning.contour, before, after);
  }
  return [];
}

/** The kink fix: the on-curve point at the warning's place made smooth. */
function smoothKink(document: GlyphDocument, glyph: GlyphId, warning: OutlineWarning): Change[] {
  const before = contourOf(document, glyph, warning.contour);
  const index = before.points.findIndex((p) => p.kind === 'on' && near(p, warning.at));
  if (index < 0) return [];
  // A point marked smooth whose handles are not collinear: clear the flag so that makeSmooth aligns them.
  const unflagged: OutlineContour = { points: before.points.map((p, i) => (i === index ? { ...p, smooth: false } : p)) };
  return replaceChange(glyph, warning.contour, before, makeSmooth(unflagged, index));
}

/**
 * The fix for `warning` on glyph `glyph`, or null when its kind has none or the
 * outline no longer has what the warning pointed at (the glyph changed since it was
 * checked). Throws DocumentError for an unknown glyph or contour.
 */
export function fixWarning(document: GlyphDocument, glyph: GlyphId, warning: OutlineWarning): Transaction | null {
  switch (warning.kind) {
    case 'extremum-inside-segment': {
      const changes = splitAtExtremum(document, glyph, warning);
      return changes.length === 0 ? null : transaction('warning.fix', changes);
    }
    case 'near-miss-kink': {
      const changes = smoothKink(document, glyph, warning);
      return changes.length === 0 ? null : transaction('warning.fix', changes);
    }
    case 'off-grid-point': {
      const snapped = snapToGrid(document, { glyph });
      return snapped ? transaction('warning.fix', snapped.changes) : null;
    }
    case 'wrong-direction': {
      const before = contourOf(document, glyph, warning.contour);
      return transaction('warning.fix', replaceChange(glyph, warning.contour, before, reverseContour(before)));
    }
    default:
      return null;
  }
}
