/**
 * Natural (C²) cubic spline interpolation through points, as cubic Bézier segments.
 *
 * Where Catmull–Rom is only C¹, the interpolating cubic spline has continuous
 * curvature at every point it passes through, which is what smooth letterforms need.
 * Each coordinate is interpolated separately over a common knot sequence uᵢ. The
 * unknown second derivatives Mᵢ = S″(uᵢ) satisfy, at each interior knot,
 *   hᵢ₋₁Mᵢ₋₁ + 2(hᵢ₋₁ + hᵢ)Mᵢ + hᵢMᵢ₊₁ = 6[(Pᵢ₊₁ − Pᵢ)/hᵢ − (Pᵢ − Pᵢ₋₁)/hᵢ₋₁],
 * with hᵢ = uᵢ₊₁ − uᵢ (Ahlberg, Nilson & Walsh 1967, "The Theory of Splines and Their
 * Applications"; de Boor 1978, "A Practical Guide to Splines", ch. IV). Open splines
 * take the natural end conditions M₀ = Mₙ₋₁ = 0 (tridiagonal system); closed splines
 * are periodic (cyclic system). Both are solved in O(n) (see tridiagonal.ts).
 *
 * Knots: 'chord-length' spacing hᵢ = |Pᵢ₊₁ − Pᵢ| (default; follows the geometry and
 * avoids overshoot for uneven spacing, Lee 1989, "Choosing nodes in parametric curve
 * interpolation", Computer-Aided Design 21(6)) or 'uniform' spacing hᵢ = 1.
 *
 * On knot interval i the spline in local t = (u − uᵢ)/hᵢ ∈ [0, 1] is the Bézier cubic
 * with handles Pᵢ + hᵢS′(uᵢ)/3 and Pᵢ₊₁ − hᵢS′(uᵢ₊₁)/3, where
 * S′(uᵢ) = (Pᵢ₊₁ − Pᵢ)/hᵢ − hᵢ(2Mᵢ + Mᵢ₊₁)/6 and S′(uᵢ₊₁) = (Pᵢ₊₁ − Pᵢ)/hᵢ + hᵢ(Mᵢ + 2Mᵢ₊₁)/6.
 * Derivatives with respect to u are therefore B′(t)/hᵢ and B″(t)/hᵢ².
 */
import type { Point } from './vector.ts';
import { distance } from './vector.ts';
import type { CubicSegment } from './segment.ts';
import { cubic } from './segment.ts';
import { withoutRepeatedPoints } from './point-sequence.ts';
import { solveCyclicTridiagonal, solveTridiagonal } from './tridiagonal.ts';

/** How knots are spaced. */
export type SplineParameterization = 'chord-length' | 'uniform';

/** Options for `naturalSpline`. */
export interface NaturalSplineOptions {
  /** Periodic spline through the points and back to the first; default false. */
  readonly closed?: boolean;
  /** Knot spacing; default 'chord-length'. */
  readonly parameterization?: SplineParameterization;
}

/** The spline as Bézier segments, with the knot spacing of each. */
export interface NaturalSpline {
  /** Segment i runs from point i to point i + 1 (the last returns to point 0 when closed). */
  readonly segments: readonly CubicSegment[];
  /** intervals[i] = hᵢ, the knot spacing of segment i; d/du = (1/hᵢ)·d/dt on it. */
  readonly intervals: readonly number[];
}

/**
 * A cubic Bézier's end derivative is 3 × its handle (B′(0) = 3(P1 − P0)), so a handle
 * is one third of the end derivative (here hᵢ·S′ in local t).
 */
const HANDLE_FRACTION = 1 / 3;

/** Factor 6 of the spline moment equations (from integrating S″ twice over an interval). */
const MOMENT_EQUATION_FACTOR = 6;

/**
 * The interpolating cubic spline through `points`.
 *
 * Guarantees: segment i starts exactly at the i-th (de-duplicated) point and ends
 * exactly at the next; in the knot parameter u the spline is C² at every interior
 * knot; open splines have S″ = 0 at both ends; closed splines are C² across the wrap
 * too. Limits: consecutive duplicate points are removed first (zero knot spacing);
 * open splines need 2 distinct points (2 points give a straight cubic), closed ones
 * 3; fewer give no segments.
 */
export function naturalSpline(points: readonly Point[], options: NaturalSplineOptions = {}): NaturalSpline {
  const closed = options.closed ?? false;
  const parameterization = options.parameterization ?? 'chord-length';
  const pts = withoutRepeatedPoints(points, closed);
  const n = pts.length;
  if (n < (closed ? 3 : 2)) return { segments: [], intervals: [] };
  const at = (i: number): Point => pts[((i % n) + n) % n] as Point;
  const intervalCount = closed ? n : n - 1;
  const intervals: number[] = [];
  for (let i = 0; i < intervalCount; i++) intervals.push(parameterization === 'uniform' ? 1 : distance(at(i), at(i + 1)));

  const momentsX = closed ? periodicMoments(pts.map((p) => p.x), intervals) : naturalMoments(pts.map((p) => p.x), intervals);
  const momentsY = closed ? periodicMoments(pts.map((p) => p.y), intervals) : naturalMoments(pts.map((p) => p.y), intervals);

  const segments: CubicSegment[] = [];
  for (let i = 0; i < intervalCount; i++) {
    const h = intervals[i] ?? 1;
    const p0 = at(i);
    const p1 = at(i + 1);
    const j = (i + 1) % momentsX.length;
    const handle = (a: number, b: number, ma: number, mb: number): [number, number] => {
      const slope = (b - a) / h;
      const startDerivative = slope - (h * (2 * ma + mb)) / MOMENT_EQUATION_FACTOR;
      const endDerivative = slope + (h * (ma + 2 * mb)) / MOMENT_EQUATION_FACTOR;
      return [a + h * startDerivative * HANDLE_FRACTION, b - h * endDerivative * HANDLE_FRACTION];
    };
    const [c1x, c2x] = handle(p0.x, p1.x, momentsX[i] ?? 0, momentsX[j] ?? 0);
    const [c1y, c2y] = handle(p0.y, p1.y, momentsY[i] ?? 0, momentsY[j] ?? 0);
    segments.push(cubic(p0, { x: c1x, y: c1y }, { x: c2x, y: c2y }, p1));
  }
  return { segments, intervals };
}

/** Second derivatives at the n knots of an open spline with M₀ = Mₙ₋₁ = 0. */
function naturalMoments(values: readonly number[], h: readonly number[]): number[] {
  const n = values.length;
  if (n <= 2) return new Array<number>(n).fill(0);
  const lower: number[] = [];
  const diagonal: number[] = [];
  const upper: number[] = [];
  const rhs: number[] = [];
  for (let i = 1; i <= n - 2; i++) {
    const hPrev = h[i - 1] ?? 1;
    const hNext = h[i] ?? 1;
    lower.push(hPrev);
    diagonal.push(2 * (hPrev + hNext));
    upper.push(hNext);
    rhs.push(
      MOMENT_EQUATION_FACTOR *
        (((values[i + 1] ?? 0) - (values[i] ?? 0)) / hNext - ((values[i] ?? 0) - (values[i - 1] ?? 0)) / hPrev),
    );
  }
  return [0, ...solveTridiagonal(lower, diagonal, upper, rhs), 0];
}

/** Second derivatives at the n knots of a periodic spline (knot n ≡ knot 0). */
function periodicMoments(values: readonly number[], h: readonly number[]): number[] {
  const n = values.length;
  const value = (i: number): number => values[((i % n) + n) % n] ?? 0;
  const lower: number[] = [];
  const diagonal: number[] = [];
  const upper: number[] = [];
  const rhs: number[] = [];
  for (let i = 0; i < n; i++) {
    const hPrev = h[(i - 1 + n) % n] ?? 1;
    const hNext = h[i] ?? 1;
    lower.push(hPrev);
    diagonal.push(2 * (hPrev + hNext));
    upper.push(hNext);
    rhs.push(MOMENT_EQUATION_FACTOR * ((value(i + 1) - value(i)) / hNext - (value(i) - value(i - 1)) / hPrev));
  }
  return solveCyclicTridiagonal(lower, diagonal, upper, rhs);
}
