// Measurements that compare a fitted outline with a reference outline (a font's own
// glyph): symmetric Hausdorff distance, on-curve points, extrema inside segments,
// corners (tangent turn above 20°) matched within a radius, near-miss kinks, and
// winding. Written for the round-trip tests; they use only core/geometry and
// core/outline, so the figures do not depend on the fitter's own report.

import type { PathCommand } from 'opentype.js/dist/opentype.js';
import { cubic, evaluate, line, signedArea, type Point } from '../../core/geometry/index.ts';
import { contourSegments, type GlyphOutline, type OutlineSegment } from '../../core/outline/index.ts';
import { segmentExtrema, turnAtJoin } from '../../core/fit/index.ts';

/** A closed contour as segments (font units, y up). */
export type SegmentContour = readonly OutlineSegment[];

/**
 * The contours of a font glyph's commands as line and cubic segments. Quadratics are
 * elevated exactly; zero-length lines (a closing lineto back onto the start) dropped.
 */
export function commandsToContours(commands: readonly PathCommand[]): OutlineSegment[][] {
  const contours: OutlineSegment[][] = [];
  let current: OutlineSegment[] = [];
  let start: Point = { x: 0, y: 0 };
  let pen: Point = { x: 0, y: 0 };
  const same = (a: Point, b: Point): boolean => Math.abs(a.x - b.x) < 1e-9 && Math.abs(a.y - b.y) < 1e-9;
  const close = (): void => {
    if (!same(pen, start)) current.push(line(pen, start));
    if (current.length > 0) contours.push(current);
    current = [];
  };
  for (const command of commands) {
    switch (command.type) {
      case 'M':
        if (current.length > 0) close();
        pen = { x: command.x, y: command.y };
        start = pen;
        break;
      case 'L': {
        const p = { x: command.x, y: command.y };
        if (!same(p, pen)) current.push(line(pen, p));
        pen = p;
        break;
      }
      case 'C': {
        const p = { x: command.x, y: command.y };
        current.push(cubic(pen, { x: command.x1, y: command.y1 }, { x: command.x2, y: command.y2 }, p));
        pen = p;
        break;
      }
      case 'Q': {
        const c = { x: command.x1, y: command.y1 };
        const p = { x: command.x, y: command.y };
        current.push(cubic(pen, { x: pen.x + (2 / 3) * (c.x - pen.x), y: pen.y + (2 / 3) * (c.y - pen.y) }, { x: p.x + (2 / 3) * (c.x - p.x), y: p.y + (2 / 3) * (c.y - p.y) }, p));
        pen = p;
        break;
      }
      case 'Z':
        close();
        pen = start;
        break;
    }
  }
  if (current.length > 0) close();
  return contours;
}

export function outlineToContours(outline: GlyphOutline): OutlineSegment[][] {
  return outline.contours.map((c) => contourSegments(c));
}

/** Points along every segment, at most `spacing` apart (end points included). */
export function samplePoints(contours: readonly SegmentContour[], spacing: number): Point[] {
  const points: Point[] = [];
  for (const contour of contours) {
    for (const segment of contour) {
      const polygon = segment.kind === 'line' ? Math.hypot(segment.p1.x - segment.p0.x, segment.p1.y - segment.p0.y) : Math.hypot(segment.p1.x - segment.p0.x, segment.p1.y - segment.p0.y) + Math.hypot(segment.p2.x - segment.p1.x, segment.p2.y - segment.p1.y) + Math.hypot(segment.p3.x - segment.p2.x, segment.p3.y - segment.p2.y);
      const count = Math.max(1, Math.ceil(polygon / spacing));
      for (let i = 0; i < count; i++) points.push(evaluate(segment, i / count));
    }
  }
  return points;
}

/** A uniform-grid index of polyline edges, for nearest-distance queries. */
class EdgeGrid {
  private readonly cells = new Map<number, number[]>();
  private readonly ax: number[] = [];
  private readonly ay: number[] = [];
  private readonly bx: number[] = [];
  private readonly by: number[] = [];
  constructor(points: readonly Point[][], private readonly cell: number) {
    for (const polyline of points) {
      for (let i = 0; i < polyline.length; i++) {
        const a = polyline[i]!;
        const b = polyline[(i + 1) % polyline.length]!;
        const id = this.ax.length;
        this.ax.push(a.x); this.ay.push(a.y); this.bx.push(b.x); this.by.push(b.y);
        const x0 = Math.floor(Math.min(a.x, b.x) / cell);
        const x1 = Math.floor(Math.max(a.x, b.x) / cell);
        const y0 = Math.floor(Math.min(a.y, b.y) / cell);
        const y1 = Math.floor(Math.max(a.y, b.y) / cell);
        for (let x = x0; x <= x1; x++) for (let y = y0; y <= y1; y++) {
          const key = x * 100003 + y;
          const list = this.cells.get(key);
          if (list) list.push(id);
          else this.cells.set(key, [id]);
        }
      }
    }
  }
  /** Distance from p to the nearest edge (searching rings of cells outwards). */
  distance(p: Point): number {
    const cx = Math.floor(p.x / this.cell);
    const cy = Math.floor(p.y / this.cell);
    let best = Infinity;
    for (let ring = 0; ring < 200; ring++) {
      for (let x = cx - ring; x <= cx + ring; x++) {
        for (let y = cy - ring; y <= cy + ring; y++) {
          if (Math.max(Math.abs(x - cx), Math.abs(y - cy)) !== ring) continue;
          const list = this.cells.get(x * 100003 + y);
          if (!list) continue;
          for (const id of list) {
            const ax = this.ax[id]!, ay = this.ay[id]!;
            const dx = this.bx[id]! - ax, dy = this.by[id]! - ay;
            const l2 = dx * dx + dy * dy;
            let t = l2 > 0 ? ((p.x - ax) * dx + (p.y - ay) * dy) / l2 : 0;
            t = t < 0 ? 0 : t > 1 ? 1 : t;
            const d = Math.hypot(ax + t * dx - p.x, ay + t * dy - p.y);
            if (d < best) best = d;
          }
        }
      }
      if (best <= ring * this.cell) break;
    }
    return best;
  }
}

/** Flattening of contours to closed polylines by dense sampling (spacing in font units). */
function polylines(contours: readonly SegmentContour[], spacing: number): Point[][] {
  return contours.map((c) => samplePoints([c], spacing));
}

/**
 * Symmetric Hausdorff distance between two outlines, measured on samples `spacing`
 * apart against the other outline's polyline (sampled 4× finer): the larger of the
 * two directed distances.
 */
export function hausdorff(a: readonly SegmentContour[], b: readonly SegmentContour[], spacing = 0.5): number {
  const gridA = new EdgeGrid(polylines(a, spacing / 4), 8);
  const gridB = new EdgeGrid(polylines(b, spacing / 4), 8);
  let worst = 0;
  for (const p of samplePoints(a, spacing)) worst = Math.max(worst, gridB.distance(p));
  for (const p of samplePoints(b, spacing)) worst = Math.max(worst, gridA.distance(p));
  return worst;
}

export function onCurveCount(contours: readonly SegmentContour[]): number {
  return contours.reduce((total, c) => total + c.length, 0);
}

/** Cubics with an x or y extremum inside that sticks out more than `limit` past their end points. */
export function extremaInside(contours: readonly SegmentContour[], limit = 0.5): number {
  let count = 0;
  for (const c of contours) for (const s of c) if (s.kind === 'cubic' && segmentExtrema(s).some((e) => e.protrusion > limit)) count++;
  return count;
}

/** Turn (degrees) at every on-curve point, with the point. */
export function joins(contours: readonly SegmentContour[]): { point: Point; turn: number }[] {
  const out: { point: Point; turn: number }[] = [];
  for (const c of contours) {
    c.forEach((segment, i) => {
      const before = c[(i - 1 + c.length) % c.length]!;
      out.push({ point: segment.p0, turn: turnAtJoin(before, segment) });
    });
  }
  return out;
}

export function corners(contours: readonly SegmentContour[], minTurnDegrees = 20): Point[] {
  return joins(contours).filter((j) => j.turn > minTurnDegrees).map((j) => j.point);
}

/**
 * Places where the outline turns by more than `minTurnDegrees` within `window` units
 * of arc: corners, and also the micro-rounds some fonts draw at a corner (two points
 * three units apart with the turn inside the tiny curve between them, as at the top
 * corners of Linux Libertine's T), which a scan at 1 px per unit cannot tell from a
 * corner. Sampled every half unit; each returned point is a sample where the chord
 * directions over the half-windows before and after it differ by more than the angle.
 */
export function turnZones(contours: readonly SegmentContour[], minTurnDegrees = 20, window = 4): Point[] {
  const out: Point[] = [];
  const half = window / 2;
  const step = 0.5;
  const reach = Math.max(1, Math.round(half / step));
  for (const c of contours) {
    const raw = samplePoints([c], step);
    const points = raw.filter((p, i) => i === 0 || Math.hypot(p.x - raw[i - 1]!.x, p.y - raw[i - 1]!.y) > 1e-9);
    const n = points.length;
    if (n < 2 * reach + 1) continue;
    for (let i = 0; i < n; i++) {
      const a = points[(i - reach + n) % n]!;
      const b = points[i]!;
      const d = points[(i + reach) % n]!;
      const turn = Math.abs(Math.atan2((b.x - a.x) * (d.y - b.y) - (b.y - a.y) * (d.x - b.x), (b.x - a.x) * (d.x - b.x) + (b.y - a.y) * (d.y - b.y)));
      if ((turn * 180) / Math.PI > minTurnDegrees) out.push(b);
    }
  }
  return out;
}

export function kinks(contours: readonly SegmentContour[], min = 0.3, max = 8): number {
  return joins(contours).filter((j) => j.turn >= min && j.turn <= max).length;
}

/** How many of `points` have one of `others` within `radius`. */
export function matched(points: readonly Point[], others: readonly Point[], radius: number): number {
  return points.filter((p) => others.some((q) => Math.hypot(p.x - q.x, p.y - q.y) <= radius)).length;
}

/** Signed areas of the contours (positive counter-clockwise, y up). */
export function contourAreas(contours: readonly SegmentContour[]): number[] {
  return contours.map((c) => signedArea(c));
}
