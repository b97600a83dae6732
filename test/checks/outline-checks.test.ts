// The outline checks flag what a type designer would (common practice in the trade):
// extremes without on-curve points, near-miss kinks, crossing handles, off-grid
// points, degenerate segments and contours running the wrong way — and nothing on a
// clean outline. Professionally drawn fonts (Debian fonts-cantarell) carry no
// wrong-direction contours, which the check must agree with.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { checkOutline, contourDepths } from '../../core/checks/index.ts';
import { contourFromSegments, reverseContour, type GlyphOutline } from '../../core/outline/index.ts';
import { cubic, line } from '../../core/geometry/index.ts';
import { readFont } from '../../electron/io/font/read-font.ts';
import { CANTARELL, DEJAVU_SANS, describeWithFont, type ReferenceFont } from '../raster/require-font.ts';

/** Handle factor of the four-arc circle, 4/3·(√2 − 1) (the standard Bézier circle approximation). */
const K = (4 / 3) * (Math.SQRT2 - 1);

function circle(cx: number, cy: number, r: number): GlyphOutline['contours'][number] {
  const h = Math.round(K * r);
  const right = { x: cx + r, y: cy };
  const top = { x: cx, y: cy + r };
  const left = { x: cx - r, y: cy };
  const bottom = { x: cx, y: cy - r };
  return contourFromSegments(
    [
      cubic(right, { x: cx + r, y: cy + h }, { x: cx + h, y: cy + r }, top),
      cubic(top, { x: cx - h, y: cy + r }, { x: cx - r, y: cy + h }, left),
      cubic(left, { x: cx - r, y: cy - h }, { x: cx - h, y: cy - r }, bottom),
      cubic(bottom, { x: cx + h, y: cy - r }, { x: cx + r, y: cy - h }, right),
    ],
    [true, true, true, true],
  );
}

function square(x0: number, y0: number, x1: number, y1: number) {
  const a = { x: x0, y: y0 };
  const b = { x: x1, y: y0 };
  const c = { x: x1, y: y1 };
  const d = { x: x0, y: y1 };
  return contourFromSegments([line(a, b), line(b, c), line(c, d), line(d, a)]); // counter-clockwise, y up
}

const kinds = (outline: GlyphOutline) => checkOutline(outline).map((w) => w.kind);

describe('outline checks', () => {
  it('find nothing wrong with a clean ring: extrema on-curve, smooth joins, outer CCW and hole CW', () => {
    const ring = { contours: [circle(500, 350, 300), reverseContour(circle(500, 350, 150))] };
    expect(contourDepths(ring)).toEqual([0, 1]);
    expect(checkOutline(ring)).toEqual([]);
  });

  it('flag a circle whose on-curve points sit at 45° instead of at its extremes', () => {
    const r = 300;
    const d = r / Math.SQRT2;
    // The same circle split at 45°: each arc's handle factor for a 90° arc.
    const h = K * r;
    const at = (deg: number) => ({ x: Math.round(500 + r * Math.cos((deg * Math.PI) / 180)), y: Math.round(350 + r * Math.sin((deg * Math.PI) / 180)) });
    const tangent = (deg: number, sign: number) => ({ x: -Math.sin((deg * Math.PI) / 180) * h * sign, y: Math.cos((deg * Math.PI) / 180) * h * sign });
    const arcs = [45, 135, 225, 315].map((start) => {
      const p0 = at(start);
      const p3 = at(start + 90);
      const t0 = tangent(start, 1);
      const t3 = tangent(start + 90, -1);
      return cubic(p0, { x: Math.round(p0.x + t0.x), y: Math.round(p0.y + t0.y) }, { x: Math.round(p3.x + t3.x), y: Math.round(p3.y + t3.y) }, p3);
    });
    expect(d).toBeGreaterThan(0);
    const found = kinds({ contours: [contourFromSegments(arcs, [true, true, true, true])] });
    expect(found.filter((k) => k === 'extremum-inside-segment')).toHaveLength(4);
  });

  it('flag a join that turns a few degrees (a near-miss kink) but not a real corner', () => {
    const a = { x: 0, y: 0 };
    const b = { x: 400, y: 0 };
    const kinked = { x: 800, y: 28 }; // 4° off straight
    const contour = contourFromSegments([line(a, b), line(b, kinked), line(kinked, { x: 400, y: 600 }), line({ x: 400, y: 600 }, a)]);
    const warnings = checkOutline({ contours: [contour] }).filter((w) => w.kind === 'near-miss-kink');
    expect(warnings).toHaveLength(1);
    expect(warnings[0]?.at).toEqual(b);
    expect(warnings[0]?.value).toBeCloseTo((Math.atan2(28, 400) * 180) / Math.PI, 6);
  });

  it('flag crossing handles, off-grid points and degenerate segments', () => {
    const p0 = { x: 0, y: 0 };
    const p3 = { x: 400, y: 0 };
    const crossing = cubic(p0, { x: 500, y: 300 }, { x: -100, y: 300 }, p3);
    const contour = contourFromSegments([crossing, line(p3, { x: 400.5, y: -300 }), line({ x: 400.5, y: -300 }, { x: 400.5, y: -300.25 }), line({ x: 400.5, y: -300.25 }, p0)]);
    const found = kinds({ contours: [contour] });
    expect(found).toContain('crossing-handles');
    expect(found).toContain('off-grid-point');
    expect(found).toContain('tiny-segment');
  });

  it('flag an outer contour running clockwise and a hole running counter-clockwise', () => {
    const wrong = { contours: [reverseContour(square(0, 0, 600, 700)), square(100, 100, 500, 600)] };
    const warnings = checkOutline(wrong).filter((w) => w.kind === 'wrong-direction');
    expect(warnings.map((w) => w.contour)).toEqual([0, 1]);
    expect(checkOutline({ contours: [square(0, 0, 600, 700), reverseContour(square(100, 100, 500, 600))] })).toEqual([]);
  });
});

for (const reference of [CANTARELL, DEJAVU_SANS] satisfies ReferenceFont[]) {
  describeWithFont(`outline checks on ${reference.label}`, reference, () => {
    it('find every contour of A–Z a–z 0–9 running the CFF way (TrueType contours are reversed on reading)', () => {
      const font = readFont(readFileSync(reference.path), reference.path);
      const wanted = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
      const glyphs = font.glyphs.filter((g) => g.character !== '' && wanted.includes(g.character));
      expect(glyphs).toHaveLength(wanted.length);
      const wrong = glyphs.flatMap((g) => checkOutline(g.outline).filter((w) => w.kind === 'wrong-direction').map((w) => `${g.character}: ${w.message}`));
      expect(wrong).toEqual([]);
    });
  });
}
