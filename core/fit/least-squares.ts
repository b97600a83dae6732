/**
 * Least-squares fitting of one cubic Bézier to a stretch of the chain, with fixed end
 * points and fixed (or free) end tangents.
 *
 * The method is Schneider's (Schneider 1990, "An Algorithm for Automatically Fitting
 * Digitized Curves", Graphics Gems, Academic Press): parameters start at chord-length
 * values; with the end tangents fixed the only unknowns are the two handle lengths,
 * solved from the 2 × 2 normal equations of the squared distances; Newton–Raphson
 * steps on (B(u) − P)·B′(u) = 0 then move each point's parameter towards its nearest
 * curve point, and the handles are solved again. Where a corner leaves an end tangent
 * free, that handle's two coordinates are unknowns of the same linear least-squares
 * problem (up to 4 × 4). When the handle lengths come out non-positive or longer than
 * the polyline fitted, or the system is singular, Schneider's fallback applies: both
 * handles a third of the chord.
 *
 * Error: the largest true distance from the stretch's points to the cubic. The
 * parametric distance |B(uᵢ) − Pᵢ| is an upper bound on the true distance, so only the
 * points whose parametric distance exceeds the tolerance are measured exactly (with the
 * degree-5 nearest-point solve of core/geometry). The reported error is therefore exact
 * whenever it exceeds the tolerance, and an upper bound otherwise.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cubic, type CubicSegment } from '../geometry/segment.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import { wrapIndex, type BoundaryChain } from './boundary-chain.ts';

/**
 * Newton–Raphson reparameterisations per fit. Schneider's published implementation
 * stops after 4 (value from memory); alternating between handles and parameters
 * converges only linearly, though (measured: exact samples of a cubic, uniform in t,
 * still 1.7 units off after 4 rounds, 0.25 after 32), so final fits run up to 24
 * rounds, stopping once a round improves the error by less than 1 %, and the many
 * trial fits of the breakpoint search run 6.
 */
export const MAX_REPARAMETERIZATIONS = 24;
export const QUICK_REPARAMETERIZATIONS = 6;
/** A round improving the largest parametric distance by less than this share ends the iteration. */
const STALLED_IMPROVEMENT = 0.01;
/** Schneider's fallback handle length, as a share of the chord. */
const FALLBACK_HANDLE_SHARE = 1 / 3;
/** Handle lengths below this share of the chord count as degenerate (Schneider's ε test). */
const DEGENERATE_HANDLE_SHARE = 1e-3;
/**
 * A handle longer than the whole polyline it was fitted to (start, the stretch's points,
 * end) counts as degenerate too. The error is measured from the points to the curve, so
 * a cubic that runs far away and back between two of them is not seen by it. Few points
 * with nearly parallel end tangents make the normal equations nearly singular, and
 * their solution can put a handle anywhere: measured, two chain points between two
 * collinear lines of Linux Libertine's e at a 0.375-unit tolerance gave a handle 6·10⁸
 * units long, and rounding that contour to the grid ran out of memory. No drawn curve
 * needs one: the handle of a circular arc's cubic is (4/3)·tan(θ/4)·r against an arc
 * of θ·r, 0.33 of the arc at 90° and 0.42 at 180°.
 */
const MAX_HANDLE_REACH_SHARE = 1;
/**
 * After the first solve, a fit whose parametric error is this many tolerances is not
 * refined further (the reparameterisation cannot rescue it); used only to save time
 * when the caller searches over many candidate stretches.
 */
const HOPELESS_ERROR_FACTOR = 4;

export interface CubicFitRequest {
  readonly chain: BoundaryChain;
  /** Unwrapped index range of the chain points to fit (inclusive); may be empty (last < first). */
  readonly first: number;
  readonly last: number;
  readonly start: Point;
  readonly end: Point;
  /** Unit tangent at the start, along the direction of travel; null leaves it free. */
  readonly startTangent: Vec | null;
  /** Unit tangent at the end, along the direction of travel; null leaves it free. */
  readonly endTangent: Vec | null;
}

export interface CubicFit {
  readonly segment: CubicSegment;
  /** Largest distance from a fitted point to the cubic: exact above the tolerance, an upper bound below. */
  readonly maxError: number;
  /** Unwrapped index of the worst point (or −1 for an empty stretch). */
  readonly worstIndex: number;
}

let parameterScratch = new Float64Array(1024);

function parameters(size: number): Float64Array {
  if (parameterScratch.length < size) parameterScratch = new Float64Array(Math.max(size, 2 * parameterScratch.length));
  return parameterScratch;
}

/**
 * The least-squares cubic for the request, judged against `tolerance`.
 *
 * Guarantees: the cubic starts exactly at `start` and ends exactly at `end`; where a
 * tangent is given, the handle lies on the ray from the end point along it (towards
 * the curve), so two fits sharing a tangent at a join are G1 there by construction;
 * handle lengths are positive. `maxError` ≤ tolerance implies every fitted point is
 * within tolerance of the cubic. Limit: the least-squares optimum is over handle
 * lengths and parameters jointly but found by alternation, so it is a local optimum.
 *
 * `quick`: the few reparameterisation rounds of a trial fit (QUICK_REPARAMETERIZATIONS),
 * with hopeless fits given up early. `verdictOnly`: the caller only asks whether the
 * fit is within the tolerance, so measuring stops at the first point found beyond it;
 * a failing fit's maxError is then that point's distance (still above the tolerance,
 * but not necessarily the largest), while a passing fit's is unaffected. Quick fits
 * are always measured this way.
 */
export function fitCubic(request: CubicFitRequest, tolerance: number, quick = false, verdictOnly = false): CubicFit {
  const { chain, first, last, start, end } = request;
  const m = last - first + 1;
  const chord = Math.hypot(end.x - start.x, end.y - start.y);
  if (m <= 0 || chord === 0) {
    const segment = fallbackCubic(request, chord);
    return { segment, maxError: m <= 0 ? 0 : measureErrors(segment, chain, first, last, undefined, tolerance).maxError, worstIndex: m <= 0 ? -1 : first };
  }
  const u = parameters(m);
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  // Chord-length parameters, the start and end points included in the polygon.
  const firstPoint = wrapIndex(chain, first);
  const lastPoint = wrapIndex(chain, last);
  const lead = Math.hypot(chain.xs[firstPoint]! + ox - start.x, chain.ys[firstPoint]! + oy - start.y);
  const tail = Math.hypot(chain.xs[lastPoint]! + ox - end.x, chain.ys[lastPoint]! + oy - end.y);
  const reach = chordLengthParameters(chain, first, m, lead, tail, u);

  let segment = solveHandles(request, u, m, chord, reach);
  const rounds = quick ? QUICK_REPARAMETERIZATIONS : MAX_REPARAMETERIZATIONS;
  let previousError = Infinity;
  for (let iteration = 0; iteration < rounds; iteration++) {
    const error = reparameterize(segment, chain, first, m, u);
    if (error <= tolerance * 0.25 || error > previousError * (1 - STALLED_IMPROVEMENT)) break;
    if (quick && iteration === 0 && error > HOPELESS_ERROR_FACTOR * tolerance) return { segment, maxError: error, worstIndex: first };
    previousError = error;
    segment = solveHandles(request, u, m, chord, reach);
  }
  const measured = measureErrors(segment, chain, first, last, u, tolerance, quick || verdictOnly);
  return { segment, maxError: measured.maxError, worstIndex: measured.worstIndex };
}

/**
 * Chord-length parameters of the m points from `first`, with the distances `lead`
 * (from the curve's start to the first point) and `tail` (last point to the end)
 * included in the polygon, written into u. Returns the polygon's length.
 */
function chordLengthParameters(chain: BoundaryChain, first: number, m: number, lead: number, tail: number, u: Float64Array): number {
  const n = chain.count;
  let i = wrapIndex(chain, first);
  const arc = chain.arc;
  let offset = 0; // perimeter laps added when the stretch crosses the seam
  const start = arc[i]!;
  for (let k = 0; k < m; k++) {
    u[k] = lead + arc[i]! + offset - start;
    i++;
    if (i === n) {
      i = 0;
      offset += chain.perimeter;
    }
  }
  const total = u[m - 1]! + tail || 1;
  for (let k = 0; k < m; k++) u[k] = u[k]! / total;
  return total;
}

/** Straight-chord cubic with handles a third of the chord along the tangents (or the chord). */
function fallbackCubic(request: CubicFitRequest, chord: number): CubicSegment {
  const { start, end } = request;
  const dx = chord === 0 ? 0 : (end.x - start.x) / chord;
  const dy = chord === 0 ? 0 : (end.y - start.y) / chord;
  const t0 = request.startTangent ?? { x: dx, y: dy };
  const t1 = request.endTangent ?? { x: dx, y: dy };
  const h = chord * FALLBACK_HANDLE_SHARE;
  return cubic(start, { x: start.x + t0.x * h, y: start.y + t0.y * h }, { x: end.x - t1.x * h, y: end.y - t1.y * h }, end);
}

/**
 * Scratch space of the handle solve (one fit runs at a time: the fitter is
 * single-threaded and each worker has its own module): the normal matrix (row-major
 * 4 × 4, n × n block used), its right-hand side and the solution.
 */
const normalMatrix = new Float64Array(16);
const normalRhs = new Float64Array(4);
const handleSolution = new Float64Array(4);

/**
 * Solves the linear least-squares problem for the handles at fixed parameters.
 * Unknowns: α₁ (fixed start tangent) or P₁ (free), α₂ or P₂. The normal equations are
 * summed in scalars, one loop per combination of fixed and free ends: this is the
 * fitter's innermost loop (it runs once per point and reparameterisation round of
 * every trial fit), and the columns of a free handle are (b, 0) and (0, b), whose zero
 * products need not be summed.
 */
function solveHandles(request: CubicFitRequest, u: Float64Array, m: number, chord: number, reach: number): CubicSegment {
  const { chain, first, start, end, startTangent, endTangent } = request;
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  const xs = chain.xs;
  const ys = chain.ys;
  const sx = start.x;
  const sy = start.y;
  const ex = end.x;
  const ey = end.y;
  const n1 = startTangent ? 1 : 2;
  const n = n1 + (endTangent ? 1 : 2);
  // Upper triangle of the normal matrix and the right-hand side.
  let a00 = 0, a01 = 0, a02 = 0, a03 = 0, a11 = 0, a12 = 0, a13 = 0, a22 = 0, a23 = 0, a33 = 0;
  let r0 = 0, r1 = 0, r2 = 0, r3 = 0;
  const count = chain.count;
  let i = wrapIndex(chain, first) - 1;
  if (startTangent && endTangent) {
    const t0x = startTangent.x;
    const t0y = startTangent.y;
    const t1x = endTangent.x;
    const t1y = endTangent.y;
    for (let k = 0; k < m; k++) {
      const t = u[k]!;
      const s = 1 - t;
      const b0 = s * s * s;
      const b1 = 3 * s * s * t;
      const b2 = 3 * s * t * t;
      const b3 = t * t * t;
      i++;
      if (i === count) i = 0;
      let rx = xs[i]! + ox - b0 * sx - b3 * ex;
      let ry = ys[i]! + oy - b0 * sy - b3 * ey;
      rx -= b1 * sx;
      ry -= b1 * sy;
      rx -= b2 * ex;
      ry -= b2 * ey;
      const c0x = b1 * t0x;
      const c0y = b1 * t0y;
      const c1x = -b2 * t1x;
      const c1y = -b2 * t1y;
      r0 += c0x * rx + c0y * ry;
      a00 += c0x * c0x + c0y * c0y;
      a01 += c0x * c1x + c0y * c1y;
      r1 += c1x * rx + c1y * ry;
      a11 += c1x * c1x + c1y * c1y;
    }
  } else if (endTangent) {
    const t1x = endTangent.x;
    const t1y = endTangent.y;
    for (let k = 0; k < m; k++) {
      const t = u[k]!;
      const s = 1 - t;
      const b0 = s * s * s;
      const b1 = 3 * s * s * t;
      const b2 = 3 * s * t * t;
      const b3 = t * t * t;
      i++;
      if (i === count) i = 0;
      let rx = xs[i]! + ox - b0 * sx - b3 * ex;
      let ry = ys[i]! + oy - b0 * sy - b3 * ey;
      rx -= b2 * ex;
      ry -= b2 * ey;
      const c2x = -b2 * t1x;
      const c2y = -b2 * t1y;
      const b11 = b1 * b1;
      r0 += b1 * rx;
      a00 += b11;
      a02 += b1 * c2x;
      r1 += b1 * ry;
      a11 += b11;
      a12 += b1 * c2y;
      r2 += c2x * rx + c2y * ry;
      a22 += c2x * c2x + c2y * c2y;
    }
  } else if (startTangent) {
    const t0x = startTangent.x;
    const t0y = startTangent.y;
    for (let k = 0; k < m; k++) {
      const t = u[k]!;
      const s = 1 - t;
      const b0 = s * s * s;
      const b1 = 3 * s * s * t;
      const b2 = 3 * s * t * t;
      const b3 = t * t * t;
      i++;
      if (i === count) i = 0;
      let rx = xs[i]! + ox - b0 * sx - b3 * ex;
      let ry = ys[i]! + oy - b0 * sy - b3 * ey;
      rx -= b1 * sx;
      ry -= b1 * sy;
      const c0x = b1 * t0x;
      const c0y = b1 * t0y;
      const b22 = b2 * b2;
      r0 += c0x * rx + c0y * ry;
      a00 += c0x * c0x + c0y * c0y;
      a01 += c0x * b2;
      a02 += c0y * b2;
      r1 += b2 * rx;
      a11 += b22;
      r2 += b2 * ry;
      a22 += b22;
    }
  } else {
    for (let k = 0; k < m; k++) {
      const t = u[k]!;
      const s = 1 - t;
      const b0 = s * s * s;
      const b1 = 3 * s * s * t;
      const b2 = 3 * s * t * t;
      const b3 = t * t * t;
      i++;
      if (i === count) i = 0;
      const rx = xs[i]! + ox - b0 * sx - b3 * ex;
      const ry = ys[i]! + oy - b0 * sy - b3 * ey;
      const b11 = b1 * b1;
      const b12 = b1 * b2;
      const b22 = b2 * b2;
      r0 += b1 * rx;
      r1 += b1 * ry;
      r2 += b2 * rx;
      r3 += b2 * ry;
      a00 += b11;
      a11 += b11;
      a02 += b12;
      a13 += b12;
      a22 += b22;
      a33 += b22;
    }
  }
  const a = normalMatrix;
  a[0] = a00; a[1] = a01; a[2] = a02; a[3] = a03;
  a[5] = a11; a[6] = a12; a[7] = a13;
  a[10] = a22; a[11] = a23;
  a[15] = a33;
  for (let p = 0; p < n; p++) for (let q = 0; q < p; q++) a[p * 4 + q] = a[q * 4 + p]!;
  normalRhs[0] = r0; normalRhs[1] = r1; normalRhs[2] = r2; normalRhs[3] = r3;
  const z = handleSolution;
  if (!solveSymmetric(a, normalRhs, n, z)) return fallbackCubic(request, chord);
  const longest = MAX_HANDLE_REACH_SHARE * reach;
  let p1: Point;
  let p2: Point;
  if (startTangent) {
    const alpha = z[0]!;
    if (!(alpha > DEGENERATE_HANDLE_SHARE * chord && alpha <= longest)) return fallbackCubic(request, chord);
    p1 = { x: start.x + alpha * startTangent.x, y: start.y + alpha * startTangent.y };
  } else {
    p1 = { x: z[0]!, y: z[1]! };
    if (!(Math.hypot(p1.x - sx, p1.y - sy) <= longest)) return fallbackCubic(request, chord);
  }
  if (endTangent) {
    const alpha = z[n1]!;
    if (!(alpha > DEGENERATE_HANDLE_SHARE * chord && alpha <= longest)) return fallbackCubic(request, chord);
    p2 = { x: end.x - alpha * endTangent.x, y: end.y - alpha * endTangent.y };
  } else {
    p2 = { x: z[n1]!, y: z[n1 + 1]! };
    if (!(Math.hypot(p2.x - ex, p2.y - ey) <= longest)) return fallbackCubic(request, chord);
  }
  return cubic(start, p1, p2, end);
}

/**
 * Gaussian elimination with partial pivoting on the n × n block of a 4 × 4 row-major
 * matrix, in place (matrix and rhs are overwritten); the solution goes into x. False
 * when the matrix is singular to working precision.
 */
function solveSymmetric(a: Float64Array, b: Float64Array, n: number, x: Float64Array): boolean {
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(a[i * 4 + i]!));
  if (scale === 0) return false;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(a[row * 4 + col]!) > Math.abs(a[pivot * 4 + col]!)) pivot = row;
    if (Math.abs(a[pivot * 4 + col]!) < 1e-12 * scale) return false;
    if (pivot !== col) {
      for (let k = 0; k < n; k++) {
        const tmp = a[col * 4 + k]!;
        a[col * 4 + k] = a[pivot * 4 + k]!;
        a[pivot * 4 + k] = tmp;
      }
      const tmp = b[col]!;
      b[col] = b[pivot]!;
      b[pivot] = tmp;
    }
    for (let row = col + 1; row < n; row++) {
      const f = a[row * 4 + col]! / a[col * 4 + col]!;
      for (let k = col; k < n; k++) a[row * 4 + k]! -= f * a[col * 4 + k]!;
      b[row]! -= f * b[col]!;
    }
  }
  for (let row = n - 1; row >= 0; row--) {
    let sum = b[row]!;
    for (let k = row + 1; k < n; k++) sum -= a[row * 4 + k]! * x[k]!;
    x[row] = sum / a[row * 4 + row]!;
  }
  return true;
}

/**
 * One Newton–Raphson step per point on f(u) = (B(u) − P)·B′(u) (Schneider 1990),
 * parameters clamped to [0, 1]. Returns the largest parametric distance after the step.
 */
function reparameterize(segment: CubicSegment, chain: BoundaryChain, first: number, m: number, u: Float64Array): number {
  const { p0, p1, p2, p3 } = segment;
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  // Power-basis coefficients: B(t) = a·t³ + b·t² + c·t + p0.
  const ax = p3.x - 3 * p2.x + 3 * p1.x - p0.x;
  const ay = p3.y - 3 * p2.y + 3 * p1.y - p0.y;
  const bx = 3 * (p2.x - 2 * p1.x + p0.x);
  const by = 3 * (p2.y - 2 * p1.y + p0.y);
  const cx = 3 * (p1.x - p0.x);
  const cy = 3 * (p1.y - p0.y);
  let worst = 0;
  const count = chain.count;
  let i = wrapIndex(chain, first) - 1;
  for (let k = 0; k < m; k++) {
    i++;
    if (i === count) i = 0;
    const px = chain.xs[i]! + ox;
    const py = chain.ys[i]! + oy;
    let t = u[k]!;
    const ex = ((ax * t + bx) * t + cx) * t + p0.x - px;
    const ey = ((ay * t + by) * t + cy) * t + p0.y - py;
    const dx = (3 * ax * t + 2 * bx) * t + cx;
    const dy = (3 * ay * t + 2 * by) * t + cy;
    const ddx = 6 * ax * t + 2 * bx;
    const ddy = 6 * ay * t + 2 * by;
    const f = ex * dx + ey * dy;
    const fPrime = dx * dx + dy * dy + ex * ddx + ey * ddy;
    if (fPrime > 0) {
      t -= f / fPrime;
      t = t < 0 ? 0 : t > 1 ? 1 : t;
      u[k] = t;
    }
    const qx = ((ax * t + bx) * t + cx) * t + p0.x - px;
    const qy = ((ay * t + by) * t + cy) * t + p0.y - py;
    const d = qx * qx + qy * qy;
    if (d > worst) worst = d;
  }
  return Math.sqrt(worst);
}

/**
 * Largest distance from the points of [first, last] to the cubic: parametric distance
 * at `u` (when given), replaced by the exact nearest-point distance wherever it exceeds
 * `tolerance` (or everywhere when `u` is absent). With `stopAtFirstFailure`, returns
 * as soon as one point is farther than the tolerance (the error is then that point's,
 * enough to reject the fit).
 */
export function measureErrors(segment: CubicSegment, chain: BoundaryChain, first: number, last: number, u: Float64Array | undefined, tolerance: number, stopAtFirstFailure = false): { maxError: number; worstIndex: number } {
  const { p0, p1, p2, p3 } = segment;
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  let worst = 0;
  let worstIndex = first;
  const count = chain.count;
  let i = wrapIndex(chain, first) - 1;
  for (let k = first; k <= last; k++) {
    i++;
    if (i === count) i = 0;
    const px = chain.xs[i]! + ox;
    const py = chain.ys[i]! + oy;
    let d = Infinity;
    if (u) {
      const t = u[k - first]!;
      const s = 1 - t;
      const b0 = s * s * s;
      const b1 = 3 * s * s * t;
      const b2 = 3 * s * t * t;
      const b3 = t * t * t;
      d = Math.hypot(b0 * p0.x + b1 * p1.x + b2 * p2.x + b3 * p3.x - px, b0 * p0.y + b1 * p1.y + b2 * p2.y + b3 * p3.y - py);
    }
    if (d > tolerance) d = nearestPoint(segment, { x: px, y: py }).distance;
    if (d > worst) {
      worst = d;
      worstIndex = k;
      if (stopAtFirstFailure && d > tolerance) break;
    }
  }
  return { maxError: worst, worstIndex };
}

/** Newton steps used when only measuring a given cubic against a stretch. */
const MEASURING_NEWTON_STEPS = 4;

/**
 * Largest distance from the points of [first, last] to a given cubic: chord-length
 * parameters refined by Newton steps give upper bounds, and every point above
 * `tolerance` is measured exactly. Exact whenever the result exceeds the tolerance.
 */
export function cubicErrorOnStretch(segment: CubicSegment, chain: BoundaryChain, first: number, last: number, tolerance: number): { maxError: number; worstIndex: number } {
  const m = last - first + 1;
  if (m <= 0) return { maxError: 0, worstIndex: -1 };
  const u = parameters(m);
  const firstPoint = wrapIndex(chain, first);
  const lastPoint = wrapIndex(chain, last);
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  const lead = Math.hypot(chain.xs[firstPoint]! + ox - segment.p0.x, chain.ys[firstPoint]! + oy - segment.p0.y);
  const tail = Math.hypot(chain.xs[lastPoint]! + ox - segment.p3.x, chain.ys[lastPoint]! + oy - segment.p3.y);
  chordLengthParameters(chain, first, m, lead, tail, u);
  for (let step = 0; step < MEASURING_NEWTON_STEPS; step++) reparameterize(segment, chain, first, m, u);
  return measureErrors(segment, chain, first, last, u, tolerance);
}
