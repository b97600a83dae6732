/**
 * How points move when the user drags or nudges them: the rules a type designer
 * expects from an outline editor (common practice).
 *
 * - A moved on-curve point carries its handles (the off-curve points next to it).
 * - A handle moved on its own, next to a smooth on-curve point, turns the opposite
 *   handle so the two stay collinear (the opposite handle keeps its length); when the
 *   opposite side is a line, the handle slides along the line's direction instead.
 * - A smooth on-curve point that stays put while the far end of its line moves turns
 *   its handle on the other side to follow the line.
 * - With `constrain` (shift held), a horizontal or vertical handle stays horizontal or
 *   vertical, and every other motion is reduced to its larger axis.
 *
 * Positions are computed from the gesture's starting contour and the total offset,
 * never by accumulating per-move steps, so a long drag neither drifts nor loses
 * collinearity to rounding.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { add, dot, length, normalize, scale, sub } from '../geometry/vector.ts';
import type { OutlineContour, OutlinePoint } from '../outline/index.ts';
import { wrap } from './contour-edit.ts';

/** The offset reduced to its larger axis (ties go to x). */
export function constrainToAxis(offset: Vec): Vec {
  return Math.abs(offset.x) >= Math.abs(offset.y) ? { x: offset.x, y: 0 } : { x: 0, y: offset.y };
}

/** The on-curve point a handle belongs to: the neighbour that is on-curve. */
function anchorOf(points: readonly OutlinePoint[], index: number): number {
  const n = points.length;
  const before = wrap(index - 1, n);
  return points[before]?.kind === 'on' ? before : wrap(index + 1, n);
}

function at(points: readonly OutlinePoint[], i: number): OutlinePoint {
  return points[wrap(i, points.length)] as OutlinePoint;
}

function moved(p: OutlinePoint, to: Point): OutlinePoint {
  return { x: to.x, y: to.y, kind: p.kind, smooth: p.smooth };
}

/**
 * The contour with the points at `selected` (indices into `contour.points`) moved by
 * `offset` under the rules above. `contour` is the state at the start of the gesture.
 */
export function movePoints(contour: OutlineContour, selected: ReadonlySet<number>, offset: Vec, constrain = false): OutlineContour {
  const points = contour.points;
  const n = points.length;
  if (n === 0 || selected.size === 0) return contour;
  const translation = constrain ? constrainToAxis(offset) : offset;
  const next: (OutlinePoint | undefined)[] = new Array(n);
  const carried = new Set<number>(); // points moved by plain translation

  // On-curve points and their handles translate.
  for (const i of selected) {
    const p = points[i];
    if (p?.kind !== 'on') continue;
    for (const k of [i, wrap(i - 1, n), wrap(i + 1, n)]) {
      if (k !== i && at(points, k).kind !== 'off') continue;
      carried.add(k);
    }
  }
  for (const k of carried) next[k] = moved(points[k] as OutlinePoint, add(points[k] as OutlinePoint, translation));

  // Handles dragged on their own.
  for (const i of selected) {
    const handle = points[i];
    if (handle?.kind !== 'off' || carried.has(i)) continue;
    const anchorIndex = anchorOf(points, i);
    const anchor = points[anchorIndex] as OutlinePoint;
    let step = translation;
    if (constrain) {
      if (handle.y === anchor.y && handle.x !== anchor.x) step = { x: offset.x, y: 0 };
      else if (handle.x === anchor.x && handle.y !== anchor.y) step = { x: 0, y: offset.y };
    }
    let target = add(handle, step);
    if (anchor.smooth) {
      const oppositeIndex = wrap(anchorIndex + (anchorIndex === wrap(i - 1, n) ? -1 : 1), n);
      const opposite = points[oppositeIndex] as OutlinePoint;
      if (opposite.kind === 'on' && oppositeIndex !== i) {
        // The other side is a line: the handle stays on the line's extension.
        const direction = normalize(sub(anchor, next[oppositeIndex] ?? opposite));
        target = add(anchor, scale(direction, Math.max(0, dot(sub(target, anchor), direction))));
      } else if (opposite.kind === 'off' && !selected.has(oppositeIndex) && !carried.has(oppositeIndex)) {
        const direction = normalize(sub(target, anchor));
        const reach = length(sub(opposite, anchor));
        if (direction.x !== 0 || direction.y !== 0) next[oppositeIndex] = moved(opposite, sub(anchor, scale(direction, reach)));
      }
    }
    next[i] = moved(handle, target);
  }

  // Smooth points that stay put while the far end of their line moves.
  for (let q = 0; q < n; q++) {
    const anchor = points[q] as OutlinePoint;
    if (anchor.kind !== 'on' || !anchor.smooth || next[q] !== undefined) continue;
    for (const side of [-1, 1]) {
      const lineEnd = wrap(q + side, n);
      const handleIndex = wrap(q - side, n);
      const end = next[lineEnd];
      if (points[lineEnd]?.kind !== 'on' || end === undefined || lineEnd === handleIndex) continue;
      const handle = points[handleIndex] as OutlinePoint;
      if (handle.kind !== 'off' || next[handleIndex] !== undefined) continue;
      const direction = normalize(sub(anchor, end));
      if (direction.x === 0 && direction.y === 0) continue;
      next[handleIndex] = moved(handle, add(anchor, scale(direction, length(sub(handle, anchor)))));
    }
  }

  return { points: points.map((p, i) => next[i] ?? p) };
}
