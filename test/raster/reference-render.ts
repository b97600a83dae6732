// Independent rendering for the raster tests: shapes and glyph outlines are rasterized
// by @napi-rs/canvas (Skia), never by Stemline code, so that the tracer is checked
// against an outside anti-aliasing rasterizer. Canvas pixel (i, j) covers
// [i, i + 1] × [j, j + 1] with y down, which is Stemline's pixel frame, so canvas
// coordinates and traced coordinates compare directly.

import { readFileSync } from 'node:fs';
import { createCanvas, type SKRSContext2D } from '@napi-rs/canvas';
import opentype, { type Font, type PathCommand } from 'opentype.js/dist/opentype.js';
import type { GreyRaster, Point } from '../../core/raster/index.ts';

/** A white canvas with a black fill style, ready to draw on. */
export function whiteCanvas(width: number, height: number): { context: SKRSContext2D; toGrey: () => GreyRaster } {
  const canvas = createCanvas(width, height);
  const context = canvas.getContext('2d');
  context.fillStyle = '#ffffff';
  context.fillRect(0, 0, width, height);
  context.fillStyle = '#000000';
  return {
    context,
    toGrey: () => {
      const rgba = context.getImageData(0, 0, width, height).data;
      const data = new Uint8Array(width * height);
      for (let i = 0; i < data.length; i++) data[i] = rgba[i * 4]!; // red channel as grey
      return { width, height, data };
    },
  };
}

/**
 * Skia's single-sample anti-aliasing of curved edges is itself approximate: on a disc
 * edge we measured a pixel at grey 92 whose exact area coverage gives 36, i.e. edge
 * errors up to ≈ 0.25 px. Reference renders are therefore drawn this many times larger
 * and box-filtered down in renderAntialiased: box filtering is exact area averaging,
 * and Skia's per-sample error shrinks by the same factor (to ≈ 0.03 px at 8×).
 */
export const REFERENCE_SUPERSAMPLING = 8;
/**
 * Supersampling for the disc test, whose 0.1 px bound leaves little room above the
 * method's own 0.086 px: at 16× Skia's residual error is ≈ 0.015 px.
 */
export const FINE_REFERENCE_SUPERSAMPLING = 16;

/**
 * Draws with `draw` (in final-pixel coordinates; the context is pre-scaled) at
 * `supersampling`× resolution, black on white, and box-filters down to width × height:
 * each output pixel is the mean of its supersampling² samples (red channel), i.e. the
 * exact area coverage of the supersampled render.
 */
export function renderAntialiased(width: number, height: number, draw: (context: SKRSContext2D) => void, supersampling = REFERENCE_SUPERSAMPLING): GreyRaster {
  const bigWidth = width * supersampling;
  const bigHeight = height * supersampling;
  const { context } = whiteCanvas(bigWidth, bigHeight);
  context.setTransform(supersampling, 0, 0, supersampling, 0, 0);
  draw(context);
  const rgba = context.getImageData(0, 0, bigWidth, bigHeight).data;
  // Release the large native surface now: the garbage collector does not see Skia's
  // memory, so a run of renders would otherwise hold gigabytes until it happens to run.
  context.canvas.width = 1;
  context.canvas.height = 1;
  const sums = new Float64Array(width * height);
  for (let row = 0; row < bigHeight; row++) {
    const target = Math.floor(row / supersampling) * width;
    for (let col = 0; col < bigWidth; col++) sums[target + Math.floor(col / supersampling)]! += rgba[(row * bigWidth + col) * 4]!;
  }
  const samples = supersampling * supersampling;
  const data = new Uint8Array(width * height);
  for (let i = 0; i < data.length; i++) data[i] = Math.round(sums[i]! / samples);
  return { width, height, data };
}

/** A black disc of radius r centred at (cx, cy), anti-aliased, on white. */
export function renderDisc(width: number, height: number, cx: number, cy: number, radius: number): GreyRaster {
  return renderAntialiased(
    width,
    height,
    (context) => {
      context.beginPath();
      context.arc(cx, cy, radius, 0, 2 * Math.PI);
      context.fill();
    },
    FINE_REFERENCE_SUPERSAMPLING,
  );
}

/** Concentric black and white discs: radii[0] black, radii[1] white, … (largest first). */
export function renderRings(width: number, height: number, cx: number, cy: number, radii: readonly number[]): GreyRaster {
  return renderAntialiased(width, height, (context) => {
    radii.forEach((radius, index) => {
      context.fillStyle = index % 2 === 0 ? '#000000' : '#ffffff';
      context.beginPath();
      context.arc(cx, cy, radius, 0, 2 * Math.PI);
      context.fill();
    });
  });
}

/** A glyph outline filled (nonzero) at the given placement, anti-aliased, on white. */
export function renderGlyph(width: number, height: number, commands: readonly PathCommand[], placement: FontPlacement): GreyRaster {
  return renderAntialiased(width, height, (context) => {
    context.beginPath();
    addGlyphPath(context, commands, placement);
    context.fill('nonzero');
  });
}

/** Loads a font file with opentype.js. */
export function loadFont(path: string): Font {
  const buffer = readFileSync(path);
  return opentype.parse(buffer.buffer.slice(buffer.byteOffset, buffer.byteOffset + buffer.byteLength));
}

/** Maps font units (y up) to the pixel frame: (x·s + ox, oy − y·s). */
export interface FontPlacement {
  readonly scale: number;
  readonly originX: number;
  /** The baseline's y in pixels. */
  readonly originY: number;
}

export function toPixel(placement: FontPlacement, x: number, y: number): Point {
  return { x: x * placement.scale + placement.originX, y: placement.originY - y * placement.scale };
}

/** Appends a glyph outline to the context's current path (call fill() after). */
export function addGlyphPath(context: SKRSContext2D, commands: readonly PathCommand[], placement: FontPlacement): void {
  for (const command of commands) {
    switch (command.type) {
      case 'M': {
        const p = toPixel(placement, command.x, command.y);
        context.moveTo(p.x, p.y);
        break;
      }
      case 'L': {
        const p = toPixel(placement, command.x, command.y);
        context.lineTo(p.x, p.y);
        break;
      }
      case 'C': {
        const c1 = toPixel(placement, command.x1, command.y1);
        const c2 = toPixel(placement, command.x2, command.y2);
        const p = toPixel(placement, command.x, command.y);
        context.bezierCurveTo(c1.x, c1.y, c2.x, c2.y, p.x, p.y);
        break;
      }
      case 'Q': {
        const c = toPixel(placement, command.x1, command.y1);
        const p = toPixel(placement, command.x, command.y);
        context.quadraticCurveTo(c.x, c.y, p.x, p.y);
        break;
      }
      case 'Z':
        context.closePath();
        break;
    }
  }
}

/** Number of closed contours in a glyph outline (one per moveto). */
export function contourCount(commands: readonly PathCommand[]): number {
  return commands.filter((command) => command.type === 'M').length;
}

/**
 * The glyph outline flattened to polylines in pixels, each curve subdivided until its
 * control points are within `tolerance` px of the chord (a bound on the distance
 * between curve and chord), so distances to the polylines are within `tolerance` of
 * distances to the true outline.
 */
export function flattenOutline(commands: readonly PathCommand[], placement: FontPlacement, tolerance: number): Point[][] {
  const polylines: Point[][] = [];
  let current: Point[] = [];
  let start: Point = { x: 0, y: 0 };
  let pen: Point = { x: 0, y: 0 };
  for (const command of commands) {
    switch (command.type) {
      case 'M':
        if (current.length > 1) polylines.push(current);
        pen = toPixel(placement, command.x, command.y);
        start = pen;
        current = [pen];
        break;
      case 'L':
        pen = toPixel(placement, command.x, command.y);
        current.push(pen);
        break;
      case 'C': {
        const c1 = toPixel(placement, command.x1, command.y1);
        const c2 = toPixel(placement, command.x2, command.y2);
        const end = toPixel(placement, command.x, command.y);
        flattenCubic(pen, c1, c2, end, tolerance, current);
        pen = end;
        break;
      }
      case 'Q': {
        const c = toPixel(placement, command.x1, command.y1);
        const end = toPixel(placement, command.x, command.y);
        // Degree elevation: the quadratic (p, c, e) is the cubic (p, p + 2/3(c − p), e + 2/3(c − e), e).
        const c1 = { x: pen.x + (2 / 3) * (c.x - pen.x), y: pen.y + (2 / 3) * (c.y - pen.y) };
        const c2 = { x: end.x + (2 / 3) * (c.x - end.x), y: end.y + (2 / 3) * (c.y - end.y) };
        flattenCubic(pen, c1, c2, end, tolerance, current);
        pen = end;
        break;
      }
      case 'Z':
        current.push(start);
        pen = start;
        break;
    }
  }
  if (current.length > 1) polylines.push(current);
  return polylines;
}

function distanceToLine(p: Point, a: Point, b: Point): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const length = Math.hypot(dx, dy);
  if (length === 0) return Math.hypot(p.x - a.x, p.y - a.y);
  return Math.abs((p.x - a.x) * dy - (p.y - a.y) * dx) / length;
}

function flattenCubic(p0: Point, p1: Point, p2: Point, p3: Point, tolerance: number, out: Point[]): void {
  const flat = distanceToLine(p1, p0, p3) <= tolerance && distanceToLine(p2, p0, p3) <= tolerance;
  const chordShort = Math.hypot(p3.x - p0.x, p3.y - p0.y) <= tolerance;
  if (flat || chordShort) {
    out.push(p3);
    return;
  }
  // de Casteljau split at t = 1/2.
  const mid = (a: Point, b: Point): Point => ({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 });
  const p01 = mid(p0, p1);
  const p12 = mid(p1, p2);
  const p23 = mid(p2, p3);
  const p012 = mid(p01, p12);
  const p123 = mid(p12, p23);
  const centre = mid(p012, p123);
  flattenCubic(p0, p01, p012, centre, tolerance, out);
  flattenCubic(centre, p123, p23, p3, tolerance, out);
}

/** Distance from p to the nearest segment of any polyline (brute force). */
export function distanceToPolylines(p: Point, polylines: readonly Point[][]): number {
  let best = Infinity;
  for (const line of polylines) {
    for (let i = 1; i < line.length; i++) {
      const a = line[i - 1]!;
      const b = line[i]!;
      const dx = b.x - a.x;
      const dy = b.y - a.y;
      const lengthSquared = dx * dx + dy * dy;
      let t = lengthSquared > 0 ? ((p.x - a.x) * dx + (p.y - a.y) * dy) / lengthSquared : 0;
      t = t < 0 ? 0 : t > 1 ? 1 : t;
      const ex = a.x + t * dx - p.x;
      const ey = a.y + t * dy - p.y;
      const distanceSquared = ex * ex + ey * ey;
      if (distanceSquared < best) best = distanceSquared;
    }
  }
  return Math.sqrt(best);
}

/** A corner of an outline whose wedge (of ink or of paper) is sharper than a limit. */
export interface AcuteCorner {
  readonly apex: Point;
  /** Opening angle of the wedge, radians. */
  readonly angle: number;
  /** Distance from the apex within which the wedge is narrower than one pixel. */
  readonly subPixelRadius: number;
}

/**
 * On-curve joints of the outline where the two tangents meet at an opening angle
 * below `maxAngle` (a spike of ink or a notch of paper). Tangents come from the
 * nearest distinct control point on each side; zero-length segments are skipped.
 */
export function acuteCorners(commands: readonly PathCommand[], placement: FontPlacement, maxAngle: number): AcuteCorner[] {
  interface Segment { readonly start: Point; readonly startTangent: Point; readonly endTangent: Point; readonly end: Point }
  const corners: AcuteCorner[] = [];
  const contours: Segment[][] = [];
  let current: Segment[] = [];
  let pen: Point = { x: 0, y: 0 };
  let start: Point = pen;
  const same = (a: Point, b: Point): boolean => Math.hypot(a.x - b.x, a.y - b.y) < 1e-9;
  const push = (controls: Point[]): void => {
    const points = [pen, ...controls].filter((point, index, all) => index === 0 || !same(point, all[index - 1]!));
    const end = controls[controls.length - 1]!;
    if (points.length >= 2) current.push({ start: pen, startTangent: points[1]!, endTangent: points[points.length - 2]!, end });
    pen = end;
  };
  for (const command of commands) {
    if (command.type === 'M') {
      if (current.length > 0) contours.push(current);
      current = [];
      pen = toPixel(placement, command.x, command.y);
      start = pen;
    } else if (command.type === 'L') push([toPixel(placement, command.x, command.y)]);
    else if (command.type === 'Q') push([toPixel(placement, command.x1, command.y1), toPixel(placement, command.x, command.y)]);
    else if (command.type === 'C') push([toPixel(placement, command.x1, command.y1), toPixel(placement, command.x2, command.y2), toPixel(placement, command.x, command.y)]);
    else if (!same(pen, start)) push([start]);
  }
  if (current.length > 0) contours.push(current);
  for (const segments of contours) {
    for (let i = 0; i < segments.length; i++) {
      const incoming = segments[i]!;
      const outgoing = segments[(i + 1) % segments.length]!;
      const apex = incoming.end;
      const back = { x: incoming.endTangent.x - apex.x, y: incoming.endTangent.y - apex.y };
      const forward = { x: outgoing.startTangent.x - apex.x, y: outgoing.startTangent.y - apex.y };
      const angle = Math.acos(Math.max(-1, Math.min(1, (back.x * forward.x + back.y * forward.y) / (Math.hypot(back.x, back.y) * Math.hypot(forward.x, forward.y)))));
      if (angle < maxAngle) corners.push({ apex, angle, subPixelRadius: 0.5 / Math.tan(angle / 2) });
    }
  }
  return corners;
}
