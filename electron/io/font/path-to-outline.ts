/// <reference path="./opentype-js.d.ts" />
// Turns a parsed glyph's outline commands into the shared outline model. CFF glyphs
// arrive as M/L/C/Z and map across directly. TrueType glyphs arrive as M/L/Q/Z: every
// quadratic becomes the cubic equal to it at every t (degree elevation,
// core/geometry quadToCubic), the on-curve points TrueType leaves implied between
// two off-curve points arrive as computed midpoints and stay on-curve points (a
// cubic outline needs an on-curve point there), and the zero-length lines opentype.js
// emits — after each moveto and at each implied point — are dropped. A last line
// back to the start is not kept as a segment: the model closes every contour itself.
import type { PathCommand } from 'opentype.js/dist/opentype.js';
import { cubic, line, quad, quadToCubic, type Point } from '../../../core/geometry/index.ts';
import { contourFromSegments, type GlyphOutline, type OutlineContour, type OutlineSegment } from '../../../core/outline/index.ts';

const samePoint = (a: Point, b: Point) => a.x === b.x && a.y === b.y;

function finishContour(segments: OutlineSegment[], start: Point, current: Point): OutlineContour | undefined {
  if (segments.length === 0) return undefined;
  // An open end is closed by a line, as every rasterizer closes it.
  if (!samePoint(current, start)) segments.push(line(current, start));
  return contourFromSegments(segments);
}

/** The outline of `commands` (font units, y up), smooth flags all false (see smooth-joins.ts). */
export function pathToOutline(commands: readonly PathCommand[]): GlyphOutline {
  const contours: OutlineContour[] = [];
  let segments: OutlineSegment[] = [];
  let start: Point = { x: 0, y: 0 };
  let current: Point = start;
  const close = () => {
    const contour = finishContour(segments, start, current);
    if (contour !== undefined) contours.push(contour);
    segments = [];
    current = start;
  };
  for (const command of commands) {
    switch (command.type) {
      case 'M':
        close();
        start = { x: command.x, y: command.y };
        current = start;
        break;
      case 'L': {
        const end = { x: command.x, y: command.y };
        if (!samePoint(current, end)) segments.push(line(current, end));
        current = end;
        break;
      }
      case 'Q': {
        const control = { x: command.x1, y: command.y1 };
        const end = { x: command.x, y: command.y };
        if (!(samePoint(current, control) && samePoint(control, end))) segments.push(quadToCubic(quad(current, control, end)));
        current = end;
        break;
      }
      case 'C': {
        const c1 = { x: command.x1, y: command.y1 };
        const c2 = { x: command.x2, y: command.y2 };
        const end = { x: command.x, y: command.y };
        if (!(samePoint(current, c1) && samePoint(c1, c2) && samePoint(c2, end))) segments.push(cubic(current, c1, c2, end));
        current = end;
        break;
      }
      case 'Z':
        close();
        break;
    }
  }
  close();
  return { contours };
}
