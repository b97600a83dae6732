// Outlines as the pen calls a font parser makes for them (moveTo, lineTo, curveTo,
// closePath), so an outline in Stemline's model can be compared point for point
// with what fontTools draws from a font file. Written independently of the writer:
// rounding here is plain Math.round of each coordinate.
import { contourSegments, type GlyphOutline } from '../../core/outline/index.ts';
import type { PenCommand } from './inspect.ts';

type Transform = (v: number) => number;

/**
 * The pen calls for `outline`, each coordinate passed through `transform` (identity
 * by default): the last line back to the start is implied by closePath in CFF, so it
 * is not a call.
 */
export function penCommandsOf(outline: GlyphOutline, transform: Transform = (v) => v): PenCommand[] {
  const commands: PenCommand[] = [];
  const p = (pt: { x: number; y: number }) => [transform(pt.x), transform(pt.y)];
  for (const contour of outline.contours) {
    const segments = contourSegments(contour);
    if (segments.length === 0) continue;
    commands.push(['moveTo', [p(segments[0]!.p0)]]);
    segments.forEach((s, i) => {
      if (s.kind === 'line') {
        if (i < segments.length - 1) commands.push(['lineTo', [p(s.p1)]]);
      } else commands.push(['curveTo', [p(s.p1), p(s.p2), p(s.p3)]]);
    });
    commands.push(['closePath', []]);
  }
  return commands;
}

/** Whole-unit rounding without negative zero. */
export const roundToUnit: Transform = (v) => Math.round(v) + 0;

/**
 * Pen calls with what does not change the drawing removed: zero-length lines and
 * curves, an explicit last line back to the contour's start (closePath draws it),
 * and contours that are a single point.
 */
export function normalizePen(commands: readonly PenCommand[]): PenCommand[] {
  const out: PenCommand[] = [];
  let start: number[] = [0, 0];
  let current: number[] = [0, 0];
  const same = (a: number[], b: number[]) => a[0] === b[0] && a[1] === b[1];
  for (const [op, points] of commands) {
    if (op === 'moveTo') {
      start = points[0]!;
      current = start;
      out.push([op, points]);
    } else if (op === 'lineTo' || op === 'curveTo') {
      const end = points[points.length - 1]!;
      if (points.every((pt) => same(pt, current))) continue;
      out.push([op, points]);
      current = end;
    } else if (op === 'closePath' || op === 'endPath') {
      const last = out[out.length - 1];
      if (last && last[0] === 'lineTo' && same(last[1][0]!, start)) out.pop();
      // A contour of a single point (DejaVu Sans carries some as marks) draws nothing.
      if (out[out.length - 1]?.[0] === 'moveTo') out.pop();
      else out.push(['closePath', []]);
    }
  }
  return out;
}
