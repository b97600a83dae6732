// Compares outlines given as pen calls contour by contour, allowing each contour to
// start at a different on-curve point (TrueType parsers choose different starting
// points for contours that begin off-curve) and up to a coordinate tolerance.
import type { PenCommand } from './inspect.ts';

type Pt = readonly number[];
/** A closed contour as segments, each its points after the start (1 for a line, 3 for a curve). */
type ClosedContour = Pt[][];

function closedContours(commands: readonly PenCommand[]): { starts: Pt[]; contours: ClosedContour[] } {
  const starts: Pt[] = [];
  const contours: ClosedContour[] = [];
  let current: Pt = [0, 0];
  for (const [op, points] of commands) {
    if (op === 'moveTo') {
      starts.push(points[0]!);
      contours.push([]);
      current = points[0]!;
    } else if (op === 'lineTo' || op === 'curveTo') {
      contours[contours.length - 1]!.push(points);
      current = points[points.length - 1]!;
    } else {
      const start = starts[starts.length - 1]!;
      if (current[0] !== start[0] || current[1] !== start[1]) contours[contours.length - 1]!.push([start]);
    }
  }
  return { starts, contours };
}

const close = (a: Pt, b: Pt, tolerance: number) => Math.abs(a[0]! - b[0]!) <= tolerance && Math.abs(a[1]! - b[1]!) <= tolerance;

function segmentsMatch(a: Pt[], b: Pt[], tolerance: number): boolean {
  return a.length === b.length && a.every((p, i) => close(p, b[i]!, tolerance));
}

/** Whether contour `b` (from start `bStart`) is contour `a` (from `aStart`) rotated, within `tolerance`. */
function sameContour(aStart: Pt, a: ClosedContour, bStart: Pt, b: ClosedContour, tolerance: number): boolean {
  if (a.length !== b.length) return false;
  const bStarts = [bStart, ...b.slice(0, -1).map((s) => s[s.length - 1]!)];
  for (let shift = 0; shift < b.length; shift++) {
    if (!close(aStart, bStarts[shift]!, tolerance)) continue;
    if (a.every((segment, i) => segmentsMatch(segment, b[(i + shift) % b.length]!, tolerance))) return true;
  }
  return false;
}

/** A description of the first difference between two glyph drawings, or undefined when they match. */
export function contourDifference(expected: readonly PenCommand[], actual: readonly PenCommand[], tolerance: number): string | undefined {
  const a = closedContours(expected);
  const b = closedContours(actual);
  if (a.contours.length !== b.contours.length) return `${a.contours.length} contours expected, ${b.contours.length} found`;
  for (let i = 0; i < a.contours.length; i++) {
    if (!sameContour(a.starts[i]!, a.contours[i]!, b.starts[i]!, b.contours[i]!, tolerance)) return `contour ${i + 1} differs`;
  }
  return undefined;
}
