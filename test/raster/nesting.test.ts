// Nesting: which contour is a hole of which, at what depth, and with which direction.
// A font needs this tree (outer outlines and counters), and the direction of every
// contour must match its depth for the nonzero fill rule to paint the counters white.

import { describe, expect, it } from 'vitest';
import { nestContours, signedArea, traceScan, type Contour, type Point } from '../../core/raster/index.ts';
import { loadFont, renderGlyph, renderRings } from './reference-render.ts';
import { CANTARELL, describeWithFont } from './require-font.ts';

function expectWindingFollowsDepth(contours: readonly Contour[]): void {
  for (const contour of contours) {
    // Documented convention (core/raster/types.ts): even depth ⇒ positive shoelace area
    // in the y-down pixel frame (clockwise on screen), odd depth ⇒ negative.
    expect(Math.sign(contour.area)).toBe(contour.depth % 2 === 0 ? 1 : -1);
    expect(signedArea(contour.points)).toBeCloseTo(contour.area, 9);
  }
}

describe('contour nesting', () => {
  it('nests a ring in a ring in a ring to depths 0…5, each inside the previous, winding alternating', () => {
    const radii = [60, 50, 40, 30, 20, 10];
    const result = traceScan({ raster: renderRings(140, 140, 70.3, 69.6, radii), dpiX: 600 });
    const byDepth = [...result.contours].sort((a, b) => a.depth - b.depth);
    expect(byDepth.map((contour) => contour.depth)).toEqual([0, 1, 2, 3, 4, 5]);
    for (let depth = 1; depth < byDepth.length; depth++) {
      expect(result.contours[byDepth[depth]!.parent]).toBe(byDepth[depth - 1]);
    }
    expect(byDepth[0]!.parent).toBe(-1);
    // Each |area| is πr² to within a 0.1 px band around the circle (2πr · 0.1).
    byDepth.forEach((contour, depth) => expect(Math.abs(Math.abs(contour.area) - Math.PI * radii[depth]! ** 2)).toBeLessThan(2 * Math.PI * radii[depth]! * 0.1));
    expectWindingFollowsDepth(result.contours);
  });

  it('gives side-by-side shapes their own roots and holes the right parent', () => {
    const left = renderRings(200, 100, 50, 50, [40, 20]);
    const right = renderRings(200, 100, 150, 50, [40, 25, 10]);
    const data = new Uint8Array(200 * 100);
    for (let i = 0; i < data.length; i++) data[i] = Math.min(left.data[i]!, right.data[i]!);
    const { contours } = traceScan({ raster: { width: 200, height: 100, data }, dpiX: 600 });
    expect(contours).toHaveLength(5);
    const roots = contours.filter((contour) => contour.depth === 0);
    expect(roots).toHaveLength(2);
    for (const contour of contours) {
      if (contour.depth === 0) continue;
      const parent = contours[contour.parent]!;
      expect(parent.depth).toBe(contour.depth - 1);
      // The parent lies on the same side of the image as its child.
      expect(Math.sign(parent.points[0]!.x - 100)).toBe(Math.sign(contour.points[0]!.x - 100));
    }
    expectWindingFollowsDepth(contours);
  });

  it('reverses chains whose direction disagrees with their depth and keeps the rest as they were', () => {
    const square = (x: number, y: number, size: number): Point[] => [
      { x, y },
      { x: x + size, y },
      { x: x + size, y: y + size },
      { x, y: y + size },
    ];
    const outerWrongWay = [...square(0, 0, 10)].reverse();
    const holeRightWay = [...square(2, 2, 6)].reverse();
    const islandWrongWay = [...square(4, 4, 2)].reverse();
    const contours = nestContours([islandWrongWay, outerWrongWay, holeRightWay]);
    expect(contours.map((contour) => contour.depth)).toEqual([2, 0, 1]);
    expect(contours.map((contour) => contour.parent)).toEqual([2, -1, 1]);
    expect(contours[2]!.points).toBe(holeRightWay);
    expect(contours[1]!.points[0]).toEqual(outerWrongWay[0]);
    expectWindingFollowsDepth(contours);
  });
});

describeWithFont('nesting of traced letters', CANTARELL, () => {
  const font = loadFont(CANTARELL.path);
  const placement = { scale: 0.25, originX: 30.4, originY: 220.7 };

  it.each([
    ['B', 1, 2],
    ['o', 1, 1],
    ['8', 1, 2],
  ] as const)('finds "%s" as %i outline with %i counter(s) inside it', (character, outlines, counters) => {
    const raster = renderGlyph(260, 260, font.charToGlyph(character).path.commands, placement);
    const { contours } = traceScan({ raster, dpiX: 600 });
    const roots = contours.filter((contour) => contour.depth === 0);
    const holes = contours.filter((contour) => contour.depth === 1);
    expect(roots).toHaveLength(outlines);
    expect(holes).toHaveLength(counters);
    for (const hole of holes) expect(hole.parent).toBe(contours.indexOf(roots[0]!));
    expectWindingFollowsDepth(contours);
  });
});
