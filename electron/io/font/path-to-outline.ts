/// <reference path="./opentype-js.d.ts" />
// Turns a parsed glyph's outline commands into the shared outline model. CFF glyphs
// arrive as M/L/C/Z and map across directly. TrueType glyphs arrive as M/L/Q/Z: every
// quadratic becomes the cubic equal to it at every t (degree elevation, the handles
// of core/geometry quadToCubic: c1 = p0 + ⅔(q − p0), c2 = p2 + ⅔(q − p2)), the
// on-curve points TrueType leaves implied between two off-curve points arrive as
// computed midpoints and stay on-curve points (a cubic outline needs an on-curve
// point there), and the zero-length lines opentype.js emits — after each moveto and
// at each implied point — are dropped. A last line back to the start is not kept as
// a segment: the model closes every contour itself. Smooth joins are recovered as
// the points are made (smooth-joins.ts).
//
// Reading a large font makes millions of points, so this builds each point object
// once, straight from the commands, with no segment objects in between: reading
// DejaVu Sans (6,253 glyphs) spent more time collecting the garbage of those than
// in anything else.
import type { PathCommand } from 'opentype.js/dist/opentype.js';
import type { GlyphOutline, OutlineContour, OutlinePoint, PointKind } from '../../../core/outline/index.ts';
import { isSmoothJoinAt } from './smooth-joins.ts';

/**
 * Where degree elevation puts a cubic's handles along the quadratic's
 * (core/geometry/elevate.ts), and the weight of the other end: the handle is
 * (1 − t)·a + t·b, core/geometry lerp's formula written out so that no point object
 * is made for it and the result is the same to the last bit.
 */
const TWO_THIRDS = 2 / 3;
const ONE_MINUS_TWO_THIRDS = 1 - TWO_THIRDS;

/** A point while its contour is being built: its smooth flag is set once the contour is complete. */
interface BuildingPoint {
  x: number;
  y: number;
  kind: PointKind;
  smooth: boolean;
}

const onPoint = (x: number, y: number): BuildingPoint => ({ x, y, kind: 'on', smooth: false });
const offPoint = (x: number, y: number): BuildingPoint => ({ x, y, kind: 'off', smooth: false });

/** Which way contours run in the result: as the font draws them, or reversed (each keeping its first point). */
export type ContourDirection = 'as-drawn' | 'reversed';

/**
 * The outline of `commands` (font units, y up), with smooth joins marked. With
 * 'reversed', every contour runs the other way from the same first on-curve point
 * (TrueType contours run clockwise around ink, the opposite of the CFF direction
 * the model uses).
 */
export function pathToOutline(commands: readonly PathCommand[], direction: ContourDirection = 'as-drawn'): GlyphOutline {
  const contours: OutlineContour[] = [];
  let points: BuildingPoint[] = [];
  let startX = 0;
  let startY = 0;
  let x = 0;
  let y = 0;

  // Ends the contour: an open end is closed by a line, as every rasterizer closes it.
  const close = () => {
    if (points.length > 0) {
      if (x !== startX || y !== startY) points.push(onPoint(x, y));
      contours.push(finishContour(points, direction));
    }
    points = [];
    x = startX;
    y = startY;
  };

  for (const command of commands) {
    switch (command.type) {
      case 'M':
        close();
        startX = x = command.x;
        startY = y = command.y;
        break;
      case 'L':
        if (command.x !== x || command.y !== y) points.push(onPoint(x, y));
        x = command.x;
        y = command.y;
        break;
      case 'Q': {
        const { x1, y1 } = command;
        if (!(x === x1 && y === y1 && x1 === command.x && y1 === command.y)) {
          points.push(
            onPoint(x, y),
            offPoint(ONE_MINUS_TWO_THIRDS * x + TWO_THIRDS * x1, ONE_MINUS_TWO_THIRDS * y + TWO_THIRDS * y1),
            offPoint(ONE_MINUS_TWO_THIRDS * command.x + TWO_THIRDS * x1, ONE_MINUS_TWO_THIRDS * command.y + TWO_THIRDS * y1),
          );
        }
        x = command.x;
        y = command.y;
        break;
      }
      case 'C': {
        const { x1, y1, x2, y2 } = command;
        if (!(x === x1 && y === y1 && x1 === x2 && y1 === y2 && x2 === command.x && y2 === command.y)) {
          points.push(onPoint(x, y), offPoint(x1, y1), offPoint(x2, y2));
        }
        x = command.x;
        y = command.y;
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

/** Sets the smooth flags of the complete contour `points` (owned here), then reverses it when asked. */
function finishContour(points: BuildingPoint[], direction: ContourDirection): OutlineContour {
  for (let k = 0; k < points.length; k++) {
    const point = points[k]!;
    if (point.kind === 'on' && points.length > 1) point.smooth = isSmoothJoinAt(points, k);
  }
  if (direction === 'reversed') {
    // [first, ...rest reversed]: the same contour the other way, from the same first point.
    for (let i = 1, j = points.length - 1; i < j; i++, j--) {
      const swap = points[i]!;
      points[i] = points[j]!;
      points[j] = swap;
    }
  }
  return { points: points as OutlinePoint[] };
}
