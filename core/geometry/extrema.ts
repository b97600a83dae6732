/**
 * Parameters where a segment's x or y coordinate is extremal.
 *
 * Type design wants on-curve points at horizontal and vertical extremes (they hint and
 * rasterise well), and tight bounding boxes need the same parameters. They are the
 * roots in (0, 1) of x′(t) and y′(t): at most two per coordinate for a cubic, one for
 * a quadratic, none for a line.
 */
import type { Segment } from './segment.ts';
import { powerBasisOf } from './power-basis.ts';
import { derivativeOfPolynomial } from './polynomial.ts';
import { rootsInUnitInterval } from './polynomial-roots.ts';

/** Extremum parameters per coordinate, each list ascending and inside (0, 1). */
export interface ExtremaParameters {
  readonly x: readonly number[];
  readonly y: readonly number[];
}

/**
 * The parameters in the open interval (0, 1) where x′(t) = 0 and where y′(t) = 0.
 *
 * Guarantees: every such root resolvable in double precision is found (see
 * `realRootsInInterval`), a double root (x′ touching zero, i.e. a stationary point
 * that is not an extremum) is listed once, and a coordinate that is constant along the
 * segment has no extrema. The end points t = 0 and t = 1 are never listed.
 */
export function extremaParameters(segment: Segment): ExtremaParameters {
  const curve = powerBasisOf(segment, segment.p0);
  return {
    x: rootsInUnitInterval(derivativeOfPolynomial(curve.x), 'open'),
    y: rootsInUnitInterval(derivativeOfPolynomial(curve.y), 'open'),
  };
}

/** All extremum parameters of both coordinates, merged, ascending, without duplicates. */
export function allExtremaParameters(segment: Segment): number[] {
  const { x, y } = extremaParameters(segment);
  const merged = [...x, ...y].sort((a, b) => a - b);
  return merged.filter((t, i) => i === 0 || t !== merged[i - 1]);
}
