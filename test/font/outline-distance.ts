// How far apart two outlines are: the symmetric Hausdorff distance between them,
// measured by sampling every segment of each densely and finding the nearest point
// on the other outline's segments exactly (core/geometry nearestPoint). Contours are
// paired in order, as a write/read round trip keeps them. Segments whose control box
// is already further away than the best candidate are skipped (a Bézier segment lies
// inside its control points' box), which keeps the exact search fast.
import { controlPolygonBounds, evaluate, nearestPoint, type BoundingBox, type Point, type Segment } from '../../core/geometry/index.ts';
import { contourSegments, type GlyphOutline } from '../../core/outline/index.ts';

/** Samples per segment: 32 puts samples a few units apart on the longest curves of a 2048-unit-em letter; between them the nearest-point search is exact. */
export const SAMPLES_PER_SEGMENT = 32;

function distanceToBox(p: Point, box: BoundingBox): number {
  const dx = Math.max(box.minX - p.x, 0, p.x - box.maxX);
  const dy = Math.max(box.minY - p.y, 0, p.y - box.maxY);
  return Math.hypot(dx, dy);
}

function distanceToSegments(p: Point, segments: readonly Segment[], boxes: readonly BoundingBox[], hint: number): number {
  let best = nearestPoint(segments[hint % segments.length]!, p).distance;
  segments.forEach((segment, i) => {
    if (distanceToBox(p, boxes[i]!) >= best) return;
    best = Math.min(best, nearestPoint(segment, p).distance);
  });
  return best;
}

function oneSided(from: readonly Segment[], to: readonly Segment[]): number {
  const boxes = to.map(controlPolygonBounds);
  let worst = 0;
  from.forEach((segment, k) => {
    for (let i = 0; i <= SAMPLES_PER_SEGMENT; i++) worst = Math.max(worst, distanceToSegments(evaluate(segment, i / SAMPLES_PER_SEGMENT), to, boxes, k));
  });
  return worst;
}

/** The symmetric sampled Hausdorff distance, contour by contour; Infinity when the contour counts differ. */
export function outlineDistance(a: GlyphOutline, b: GlyphOutline): number {
  if (a.contours.length !== b.contours.length) return Infinity;
  let worst = 0;
  a.contours.forEach((contour, i) => {
    const sa = contourSegments(contour);
    const sb = contourSegments(b.contours[i]!);
    if (sa.length === 0 || sb.length === 0) {
      if (sa.length !== sb.length) worst = Infinity;
      return;
    }
    worst = Math.max(worst, oneSided(sa, sb), oneSided(sb, sa));
  });
  return worst;
}
