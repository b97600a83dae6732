/**
 * Distance from a stretch of the chain to the segment fitted to it: the one error
 * measure every finishing stage re-checks after it changes a segment.
 */
import type { CubicSegment, LineSegment } from '../geometry/segment.ts';
import { wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import { cubicErrorOnStretch } from './least-squares.ts';

/**
 * Largest distance from the chain points [first, last] to the segment: exact for
 * lines (distance to the segment, not the infinite line); for cubics exact whenever it
 * exceeds `tolerance` and an upper bound otherwise (least-squares.ts).
 */
export function measureSpanError(chain: BoundaryChain, segment: LineSegment | CubicSegment, first: number, last: number, tolerance: number): number {
  if (segment.kind === 'cubic') return cubicErrorOnStretch(segment, chain, first, last, tolerance).maxError;
  const ax = segment.p0.x - chain.origin.x;
  const ay = segment.p0.y - chain.origin.y;
  const dx = segment.p1.x - segment.p0.x;
  const dy = segment.p1.y - segment.p0.y;
  const lengthSquared = dx * dx + dy * dy;
  let worst = 0;
  for (let k = first; k <= last; k++) {
    const i = wrapIndex(chain, k);
    const px = chain.xs[i]! - ax;
    const py = chain.ys[i]! - ay;
    let t = lengthSquared > 0 ? (px * dx + py * dy) / lengthSquared : 0;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const d = Math.hypot(px - t * dx, py - t * dy);
    if (d > worst) worst = d;
  }
  return worst;
}
