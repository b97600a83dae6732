/**
 * Outlines as JSON for project files and the worker boundary: a compact, versionless
 * shape `{ contours: [[x, y, "on"|"on-smooth"|"off"], …] }` with strict validation on
 * the way in, so a hand-edited or half-synced project file gives a clear error rather
 * than a broken outline.
 */
import type { GlyphOutline } from './glyph-outline.ts';
import type { OutlinePoint } from './outline-point.ts';
import { contourSegments } from './outline-contour.ts';
import { OutlineError } from './outline-error.ts';

type PointTag = 'on' | 'on-smooth' | 'off';
export type PointJson = [number, number, PointTag];
export interface GlyphOutlineJson {
  contours: PointJson[][];
}

function tagOf(point: OutlinePoint): PointTag {
  if (point.kind === 'off') return 'off';
  return point.smooth ? 'on-smooth' : 'on';
}

export function outlineToJson(outline: GlyphOutline): GlyphOutlineJson {
  return { contours: outline.contours.map((c) => c.points.map((p): PointJson => [p.x, p.y, tagOf(p)])) };
}

/** Reads an outline from parsed JSON; throws OutlineError saying what is wrong and where. */
export function outlineFromJson(data: unknown): GlyphOutline {
  if (typeof data !== 'object' || data === null || !Array.isArray((data as { contours?: unknown }).contours)) {
    throw new OutlineError('bad-outline-data', 'Outline data must be an object with a "contours" list.');
  }
  const contours = (data as { contours: unknown[] }).contours.map((rawContour, c) => {
    if (!Array.isArray(rawContour)) throw new OutlineError('bad-outline-data', `Contour ${c + 1} is not a list of points.`);
    const points = rawContour.map((raw, p): OutlinePoint => {
      const where = `point ${p + 1} of contour ${c + 1}`;
      if (!Array.isArray(raw) || raw.length !== 3) throw new OutlineError('bad-outline-data', `The ${where} must be [x, y, kind].`);
      const [x, y, tag] = raw as unknown[];
      if (typeof x !== 'number' || typeof y !== 'number' || !Number.isFinite(x) || !Number.isFinite(y)) {
        throw new OutlineError('bad-outline-data', `The ${where} has a coordinate that is not a finite number.`);
      }
      if (tag !== 'on' && tag !== 'on-smooth' && tag !== 'off') {
        throw new OutlineError('bad-outline-data', `The ${where} has kind ${JSON.stringify(tag)}; use "on", "on-smooth" or "off".`);
      }
      return { x, y, kind: tag === 'off' ? 'off' : 'on', smooth: tag === 'on-smooth' };
    });
    const contour = { points };
    contourSegments(contour); // validates the on/off pattern
    return contour;
  });
  return { contours };
}
