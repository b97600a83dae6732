/**
 * Smooth-fit mode: one closed C² curve through the whole chain, for brush and pen
 * lettering, where curvature continuity matters more than point economy.
 *
 * 1. Fit. A periodic uniform cubic B-spline is fitted to the chain by least squares
 *    (Piegl & Tiller 1997, "The NURBS Book", 2nd ed., §9.4.1, here in the periodic
 *    variant: control points wrap, so the basis, and the normal matrix, are cyclic).
 *    Chain points start at normalised arc-length parameters; the normal equations are a
 *    cyclic banded system (half-bandwidth 3) solved by envelope Cholesky in O(n), plus
 *    a tiny second-difference penalty that only keeps the system positive definite.
 *    Parameters are then corrected by projecting each point onto the curve (Newton
 *    steps on (C(u) − P)·C′(u) = 0; Hoschek 1988, "Intrinsic parametrization for
 *    approximation", CAGD 5(1), the "parameter correction" iteration) and the control
 *    points solved again. The number of control points is raised until every chain
 *    point lies within the tolerance of the spline, then bisected down to the
 *    fewest that pass (fewer control points, fewer wiggles).
 * 2. Convert. Each span becomes one Bézier segment exactly (core/geometry/bspline.ts,
 *    Böhm's thirds-and-halves construction); the segments then join with C² continuity.
 * 3. Split. Every segment is cut exactly (de Casteljau) at its x and y extrema and its
 *    inflections, so each of those is an on-curve point of the spline itself; extremum
 *    points get exactly axis-aligned handles.
 * 4. Reduce. Between the points that must stay, consecutive pieces are replaced by
 *    single least-squares cubics (least-squares.ts, end points and end tangents fixed
 *    to the spline's) wherever one cubic stays within the tolerance of the chain
 *    points those pieces stood for, has no interior extremum, no significant
 *    inflection and no crossing handles; the fewest cubics per stretch are found by a
 *    shortest path over the candidate joins.
 *
 * Which extrema and inflections must stay: those that survive persistence
 * simplification (Edelsbrunner, Letscher & Zomorodian 2002, "Topological persistence
 * and simplification", Discrete Comput. Geom. 28): a pair of extrema whose coordinate
 * differs by less than EXTREMUM_PROMINENCE_UNITS, or a pair of inflections between
 * which the curve turns by less than INFLECTION_PERSISTENCE_DEGREES, is a wiggle of
 * the scan, not of the drawing. Such points may be merged away, but only into a cubic
 * whose interior extrema protrude by at most MERGED_PROTRUSION_LIMIT, so every
 * extremum of the final curve that protrudes further is an on-curve point with
 * axis-aligned handles.
 *
 * Contours with corners: each run between two detected corners gets its own open
 * spline (C² inside the run, its ends fixed to the corners), and the corners become
 * sharp nodes. Each corner is where its two sides meet: the sides are first fitted
 * with free ends, so that no corner estimate pulls on the tangents it is computed
 * from, then fitted again with their ends on the corners. A run whose data all lie
 * within the tolerance of a line is that line.
 *
 * Limits: the curvature is continuous inside a run, not across a corner; uniform knots
 * give a whole run the density its tightest turn needs, and a curvature jump in the
 * drawing (a straight bar running into a bowl) costs many control points. Joins of the
 * reduced curve are G1 (shared tangents), not G2: the curvature is continuous across
 * the pieces that were not merged, and matches the spline's only approximately across
 * merged ones (least-squares cubics with fixed tangents), and grid rounding reopens
 * small steps. Measured after rounding on traced Cantarell glyphs, the median relative
 * curvature step at smooth joins is not below the economy mode's (D 6.7 % against
 * 2.1 %, B 7.1 % against 10.9 %). A merged cubic may keep an interior extremum
 * protruding up to MERGED_PROTRUSION_LIMIT. When the control-point cap is reached
 * before the tolerance holds (see PeriodicSplineFit.withinTolerance), the spans keep
 * their measured errors above the tolerance and the quality report lists them.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cubic, derivative, evaluate, line, type CubicSegment, type LineSegment } from '../geometry/segment.ts';
import { uniformBSplineToBezier } from '../geometry/bspline.ts';
import { splitAt } from '../geometry/split.ts';
import { powerBasisOf } from '../geometry/power-basis.ts';
import { derivativeOfPolynomial, evaluatePolynomial } from '../geometry/polynomial.ts';
import { rootsInUnitInterval } from '../geometry/polynomial-roots.ts';
import { inflectionParameters, velocityCrossAcceleration } from '../geometry/curvature.ts';
import { addSymmetric, cyclicBandedMatrix, envelopeCholesky, solveWithCholesky } from '../geometry/envelope-cholesky.ts';
import { arcAt, chainPoint, indexAtArc, wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import { CORNER_SIDE_PX, intersectLines, type DetectedCorner } from './corners.ts';
import { EXTREMUM_PROMINENCE_UNITS, EXTREMUM_PROTRUSION_LIMIT, MIN_POINT_SPACING_UNITS, segmentExtrema, type ExtremumAxis } from './extrema.ts';
import { handlesCross } from './finishing.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { fitCubic, type CubicFit } from './least-squares.ts';
import { emptyStretchLine, fitStretchLine, rangeByArc } from './local-line.ts';
import { measureSpanError } from './span-error.ts';

/** Cubic B-spline: each chain point depends on 4 control points, so the normal matrix has half-bandwidth 3. */
const SPLINE_HALF_BANDWIDTH = 3;
/**
 * Fewest control points tried: 8, two per quadrant of a closed curve (measured: 8
 * hold a radius-300 circle to 0.18 units). A glyph contour needs at least that much
 * freedom for its four extremes; starting lower would only cost trial fits.
 */
export const MIN_CONTROL_POINTS = 8;
/** Each trial that misses the tolerance multiplies the control-point count by this (then bisection finds the fewest). */
const CONTROL_POINT_GROWTH = 1.25;
/** Cap: at least 3 chain points per span, so every span is determined by data rather than by the penalty. */
const MIN_POINTS_PER_SPAN = 3;
/**
 * Cap: no span shorter than 6 scan pixels. A cubic span of length h follows a turn of
 * radius ρ to about h⁴/(384ρ³) (the B-spline's fourth-order accuracy), so 6 px spans
 * hold even a 3 px radius within half a pixel; shorter spans only follow the noise and
 * the pixel staircase of the trace (measured with a 3 px cap and a tolerance below the
 * noise: a noisy circle grew to 3 px spans and 609 on-curve points).
 */
const MIN_SPAN_PX = 6;
/**
 * A growth step (×CONTROL_POINT_GROWTH) that lowers the largest distance by less than
 * 5 % means the error left is scan noise: a shape-limited error should fall by about
 * 60 % per step (fourth order in the span length: 1.25⁴ ≈ 2.4), a noise-limited one
 * hardly moves.
 */
const NOISE_FLOOR_IMPROVEMENT = 0.05;
/**
 * Growth stops after 3 such steps in a row: the largest distance is one point's, so a
 * single step can stall by chance while the shape still needs more control points
 * (measured: a superellipse stalled once at 13 control points, then fell below the
 * tolerance at 20).
 */
const NOISE_FLOOR_STEPS = 3;
/**
 * Solve-and-project rounds per trial, at most. Parameter correction converges only
 * linearly, and each trial stops as soon as a round improves the largest distance by
 * less than STALLED_IMPROVEMENT; 6 is a ceiling chosen for cost, not tuned.
 */
const PARAMETER_CORRECTION_ROUNDS = 6;
/** A round that improves the largest distance by less than this share ends the correction. */
const STALLED_IMPROVEMENT = 0.01;
/** Newton steps per point per projection (starting from the previous parameter, which is already close). */
const NEWTON_STEPS_PER_PROJECTION = 3;
/** Largest Newton step, in knot intervals: a point never jumps to a far part of the curve. */
const MAX_NEWTON_STEP = 0.5;
/**
 * Weight of the second-difference penalty, per chain point per control point: 1e-6.
 * It only guarantees a positive definite system (a span with no data under it); its
 * pull on the curve is about 1e-6 of the control polygon's second differences, far
 * below a font unit for any glyph-sized contour.
 */
const SMOOTHING_SHARE = 1e-6;
/**
 * Extremum or inflection points closer than 0.001 font units to a join (or to each
 * other) are moved onto it instead of cutting a sliver of a segment: a thousandth of
 * the grid, invisible, and far below the tolerance.
 */
const SNAP_DISTANCE_UNITS = 1e-3;
/**
 * Inflection pairs between which the curve turns by less than 2° are scan wiggles:
 * the same 2° below which a hand-drawn line counts as straight for the axis snap
 * (common practice, see fit-options.ts DEFAULT_AXIS_SNAP_DEGREES).
 */
export const INFLECTION_PERSISTENCE_DEGREES = 2;
const INFLECTION_PERSISTENCE_RADIANS = (INFLECTION_PERSISTENCE_DEGREES * Math.PI) / 180;
/**
 * A merged cubic may keep an interior extremum protruding at most 0.25 units beyond
 * its end points: half the outline check's limit (extrema.ts EXTREMUM_PROTRUSION_LIMIT,
 * 0.5), the other half left for grid rounding, which moves handles by up to half a
 * grid unit. Such an extremum is a wiggle of the scan along a flat stretch (a bar, a
 * stem), which persistence already declined to pin; requiring none at all kept every
 * wiggle as an on-curve point (measured: 17 on-curve points on a traced Cantarell "D"
 * against the economy mode's 10, 14 with this limit).
 */
const MERGED_PROTRUSION_LIMIT = EXTREMUM_PROTRUSION_LIMIT / 2;
/**
 * The search for one cubic over more pieces stops after this many consecutive
 * failures: a cubic that fails over two longer stretches practically never fits a
 * still longer one (a rule of thumb; it keeps the search near-linear).
 */
const FAILED_EXTENSIONS_BEFORE_STOP = 2;

/** What the smooth fit needs from the caller. */
export interface SmoothFitSettings {
  /** Largest allowed distance (font units) from a chain point to the outline. */
  readonly tolerance: number;
  /** One scan pixel in font units (caps how short a spline span may be). */
  readonly pixel: number;
}

/** The least-squares periodic spline, before conversion is reduced. */
export interface PeriodicSplineFit {
  /** Control polygon, font units; the curve is periodic (closed). */
  readonly controlPoints: readonly Point[];
  /** Its exact Bézier form: segment k is the span over parameters [k, k + 1). */
  readonly segments: readonly CubicSegment[];
  /** Spline parameter of each chain point after correction, in knot units (unwrapped, about 0 … n). */
  readonly parameters: Float64Array;
  /** Largest distance from a chain point to its projection on the spline (an upper bound on the true distance). */
  readonly maxDistance: number;
  /** False when the control-point cap was reached before maxDistance ≤ tolerance. */
  readonly withinTolerance: boolean;
}

/**
 * The least-squares periodic uniform cubic B-spline with the fewest control points
 * (between MIN_CONTROL_POINTS and the cap) whose distance to every chain point is at
 * most the tolerance. Guarantees: when `withinTolerance`, every chain point lies
 * within the tolerance of the curve. Limits: the count is found by growth and
 * bisection, assuming the error falls with more control points (almost always true,
 * not guaranteed); the fit is a local optimum of the alternating solve.
 */
export function fitPeriodicSpline(chain: BoundaryChain, settings: SmoothFitSettings): PeriodicSplineFit {
  checkSettings(settings);
  const { tolerance, pixel } = settings;
  const cap = Math.max(MIN_CONTROL_POINTS, Math.floor(Math.min(chain.count / MIN_POINTS_PER_SPAN, chain.perimeter / (MIN_SPAN_PX * pixel))));
  const best = fewestControlPoints(MIN_CONTROL_POINTS, cap, tolerance, (n) => fitWithControlPoints(chain, n));
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  const controlPoints: Point[] = [];
  for (let i = 0; i < best.cx.length; i++) controlPoints.push({ x: best.cx[i]! + ox, y: best.cy[i]! + oy });
  return {
    controlPoints,
    segments: uniformBSplineToBezier(controlPoints, { closed: true }),
    parameters: best.u,
    maxDistance: best.maxDistance,
    withinTolerance: best.maxDistance <= tolerance,
  };
}

/**
 * The trial with the fewest control points (from `min` up to `cap`) whose largest
 * distance is within the tolerance: grown by CONTROL_POINT_GROWTH until the tolerance
 * holds, the cap is reached or the error stalls at the noise floor, then bisected
 * down. Without a passing trial, the best one seen.
 */
function fewestControlPoints<T extends { readonly maxDistance: number }>(min: number, cap: number, tolerance: number, trialWith: (n: number) => T): T {
  let n = min;
  let best = trialWith(n);
  let failed = 0;
  let stalled = 0;
  while (best.maxDistance > tolerance && n < cap) {
    failed = n;
    n = Math.min(cap, Math.max(n + 1, Math.ceil(n * CONTROL_POINT_GROWTH)));
    const trial = trialWith(n);
    stalled = trial.maxDistance < best.maxDistance * (1 - NOISE_FLOOR_IMPROVEMENT) ? 0 : stalled + 1;
    if (trial.maxDistance < best.maxDistance) best = trial;
    // More control points no longer help: the error left is the scan's noise, not the shape.
    if (stalled >= NOISE_FLOOR_STEPS) break;
  }
  if (best.maxDistance <= tolerance && failed > 0) {
    let lo = failed;
    let hi = n;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      const trial = trialWith(mid);
      if (trial.maxDistance <= tolerance) {
        hi = mid;
        best = trial;
      } else {
        lo = mid;
      }
    }
  }
  return best;
}

/**
 * The chain fitted in smooth-fit mode (see the header): a closed contour of cubics,
 * all joins smooth, every node's two tangents one shared Vec, on-curve points at every
 * x/y extremum (with axis-aligned tangents) and every persistent inflection of the
 * spline, each span linked to the chain points it stands for and its error measured
 * (span-error.ts). Coordinates are font units. The result is ready for grid rounding
 * and the quality report.
 *
 * Guarantees: every merged span is within the tolerance of its chain points; a span
 * left as a piece of the spline inherits the spline's distance (≤ tolerance when the
 * spline fit was within tolerance), measured again and stored. Limits: see the header.
 */
export function fitSmoothContour(chain: BoundaryChain, settings: SmoothFitSettings, corners: readonly DetectedCorner[] = []): FittedContour {
  if (corners.length > 0) return fitSmoothRuns(chain, corners, settings);
  const spline = fitPeriodicSpline(chain, settings);
  const pieces = splitAtFeatures(spline.segments);
  markPersistentFeatures(pieces);
  const indices = nodeChainIndices(chain, pieces, spline.parameters, spline.segments.length);
  return reduce(chain, pieces, indices, settings.tolerance);
}

/**
 * The chain fitted in smooth-fit mode when it has corners (see the header, "Contours
 * with corners"): each run between consecutive corners fitted by fitRunSplines, cut
 * at its extrema and persistent inflections, and reduced to the fewest cubics; the
 * corners become sharp nodes (smooth false, tangents null, the corner record set,
 * pinned), lines stay lines. Corners must be sorted by chain index (detectCorners
 * sorts them). Guarantees: as fitSmoothContour, within each run; every corner node is
 * exactly its corner's estimate. Limits: the curvature is continuous inside a run
 * only (a corner is the end of two runs), and the spline's end tangents come from
 * data that stops at the rounded tip, so they are extrapolated across it.
 */
export function fitSmoothRuns(chain: BoundaryChain, corners: readonly DetectedCorner[], settings: SmoothFitSettings): FittedContour {
  const runs = fitRunSplines(chain, corners, settings);
  const nodes: PieceNode[] = [];
  const pieces: (CubicSegment | LineSegment)[] = [];
  const indices: number[] = [];
  runs.forEach((run, k) => {
    const previous = runs[(k - 1 + runs.length) % runs.length]!;
    const cornerNode = (tangent: Vec): PieceNode => ({
      point: run.fit.kind === 'line' ? run.fit.p0 : run.fit.segments[0]!.p0,
      parameter: 0,
      isExtremumX: false,
      isExtremumY: false,
      isInflection: false,
      tangent,
      pinned: true,
      corner: run.start,
      skipBefore: previous.endIndex - previous.last,
      skipAfter: run.first - run.startIndex,
    });
    if (run.fit.kind === 'line') {
      const d = run.fit;
      nodes.push(cornerNode(unit({ x: d.p1.x - d.p0.x, y: d.p1.y - d.p0.y })));
      pieces.push(d);
      indices.push(run.startIndex);
      return;
    }
    const spline = splitAtFeatures(run.fit.segments, false);
    markPersistentFeaturesInRun(spline, run.end.estimate);
    const runIndices = runNodeIndices(run, run.fit, spline.nodes);
    spline.nodes.forEach((node, i) => {
      nodes.push(i === 0 ? { ...cornerNode(node.tangent), parameter: node.parameter } : node);
      indices.push(runIndices[i]!);
    });
    pieces.push(...spline.pieces);
  });
  return reduce(chain, { nodes, pieces }, indices, settings.tolerance);
}

/**
 * Unwrapped chain index of each node of a split run: the corner's own index for the
 * start, then the data point whose spline parameter is nearest the node's, strictly
 * increasing and short of the end corner where the run has room.
 */
function runNodeIndices(run: CornerRun, fit: OpenSplineFit, nodes: readonly PieceNode[]): number[] {
  const indices = [run.startIndex];
  const u = fit.parameters;
  for (let j = 1; j < nodes.length; j++) {
    const tau = nodes[j]!.parameter;
    let best = 0;
    for (let k = 1; k < u.length; k++) if (Math.abs(u[k]! - tau) < Math.abs(u[best]! - tau)) best = k;
    const previous = indices[j - 1]!;
    const room = run.endIndex - (nodes.length - j);
    indices.push(Math.max(previous + 1, Math.min(fit.first + best, room)));
  }
  const sorted = Float64Array.from(u).sort();
  for (let j = 1; j < nodes.length; j++) linkDataStart(nodes[j]!, indices[j]!, fit.first + countBelow(sorted, nodes[j]!.parameter));
  return indices;
}

function checkSettings(settings: SmoothFitSettings): void {
  if (!(settings.tolerance > 0) || !Number.isFinite(settings.tolerance)) throw new RangeError(`smooth fit: tolerance must be a positive number of font units, got ${String(settings.tolerance)}`);
  if (!(settings.pixel > 0) || !Number.isFinite(settings.pixel)) throw new RangeError(`smooth fit: pixel must be a positive number of font units, got ${String(settings.pixel)}`);
}

// ---------------------------------------------------------------------------------------
// 1. The least-squares fit.

interface SplineTrial {
  /** Control points relative to the chain's origin. */
  readonly cx: Float64Array;
  readonly cy: Float64Array;
  readonly u: Float64Array;
  /** What the control-point search compares with the tolerance: the largest distance, for open runs scaled up on the corners' sides (CORNER_SIDE_TOLERANCE_SHARE). */
  readonly maxDistance: number;
  /** For open runs: the largest distance itself. */
  readonly pointDistance?: number;
}

/** Least squares with n control points, with parameter correction (see the header). */
function fitWithControlPoints(chain: BoundaryChain, n: number): SplineTrial {
  const m = chain.count;
  const u = new Float64Array(m);
  for (let i = 0; i < m; i++) u[i] = (chain.arc[i]! / chain.perimeter) * n;
  let control = solveControlPoints(chain, u, n);
  let distance = projectParameters(chain, control.cx, control.cy, u);
  for (let round = 1; round < PARAMETER_CORRECTION_ROUNDS; round++) {
    const next = solveControlPoints(chain, u, n);
    const trialU = Float64Array.from(u);
    const d = projectParameters(chain, next.cx, next.cy, trialU);
    // Each solve and each projection lowers the sum of squares; the largest distance
    // usually follows. Keep the better of the two by the largest distance.
    if (d < distance) {
      control = next;
      u.set(trialU);
    }
    const improved = d < distance * (1 - STALLED_IMPROVEMENT);
    distance = Math.min(distance, d);
    if (!improved) break;
  }
  return { cx: control.cx, cy: control.cy, u, maxDistance: distance };
}

/** Uniform cubic B-spline basis on one span, t ∈ [0, 1]: weights of D_{k−1}, D_k, D_{k+1}, D_{k+2}. */
function basis(t: number, out: Float64Array): void {
  const s = 1 - t;
  const t2 = t * t;
  const t3 = t2 * t;
  out[0] = (s * s * s) / 6;
  out[1] = (3 * t3 - 6 * t2 + 4) / 6;
  out[2] = (-3 * t3 + 3 * t2 + 3 * t + 1) / 6;
  out[3] = t3 / 6;
}

/** The control point index of basis weight r on the span starting at knot k. */
function controlIndex(k: number, r: number, n: number): number {
  return (((k - 1 + r) % n) + n) % n;
}

/** Solves the (penalised) normal equations for the control points at fixed parameters. */
function solveControlPoints(chain: BoundaryChain, u: Float64Array, n: number): { cx: Float64Array; cy: Float64Array } {
  const matrix = cyclicBandedMatrix(n, SPLINE_HALF_BANDWIDTH);
  const rx = new Float64Array(n);
  const ry = new Float64Array(n);
  const b = new Float64Array(4);
  const index = new Int32Array(4);
  const m = chain.count;
  for (let i = 0; i < m; i++) {
    const ui = u[i]!;
    const k = Math.floor(ui);
    basis(ui - k, b);
    for (let r = 0; r < 4; r++) index[r] = controlIndex(k, r, n);
    for (let r = 0; r < 4; r++) {
      const br = b[r]!;
      rx[index[r]!]! += br * chain.xs[i]!;
      ry[index[r]!]! += br * chain.ys[i]!;
      for (let c = 0; c <= r; c++) {
        // Two different weights landing on one control point (only when n < 4) fill the diagonal twice.
        const v = r !== c && index[r] === index[c] ? 2 * br * b[c]! : br * b[c]!;
        addSymmetric(matrix, index[r]!, index[c]!, v);
      }
    }
  }
  // λ Σ |D_{j−1} − 2D_j + D_{j+1}|², added as the normal matrix of the second differences.
  const lambda = (SMOOTHING_SHARE * m) / n;
  const w = [1, -2, 1];
  for (let j = 0; j < n; j++) {
    for (let r = 0; r < 3; r++) {
      for (let c = 0; c <= r; c++) {
        const a = (((j - 1 + r) % n) + n) % n;
        const z = (((j - 1 + c) % n) + n) % n;
        const v = lambda * w[r]! * w[c]!;
        addSymmetric(matrix, a, z, r !== c && a === z ? 2 * v : v);
      }
    }
  }
  const factor = envelopeCholesky(matrix);
  return { cx: solveWithCholesky(factor, rx), cy: solveWithCholesky(factor, ry) };
}

/**
 * Moves each parameter to the nearest curve point nearby (Newton on the foot-point
 * condition, steps clamped) and returns the largest remaining distance.
 */
function projectParameters(chain: BoundaryChain, cx: Float64Array, cy: Float64Array, u: Float64Array): number {
  const n = cx.length;
  const at = new Float64Array(6);
  let worst = 0;
  for (let i = 0; i < chain.count; i++) {
    const px = chain.xs[i]!;
    const py = chain.ys[i]!;
    let ui = u[i]!;
    for (let step = 0; step < NEWTON_STEPS_PER_PROJECTION; step++) {
      splineAt(cx, cy, n, ui, at);
      const ex = at[0]! - px;
      const ey = at[1]! - py;
      const f = ex * at[2]! + ey * at[3]!;
      const fPrime = at[2]! * at[2]! + at[3]! * at[3]! + ex * at[4]! + ey * at[5]!;
      if (!(fPrime > 0)) break;
      const delta = Math.max(-MAX_NEWTON_STEP, Math.min(MAX_NEWTON_STEP, f / fPrime));
      ui -= delta;
    }
    u[i] = ui;
    splineAt(cx, cy, n, ui, at);
    const d = Math.hypot(at[0]! - px, at[1]! - py);
    if (d > worst) worst = d;
  }
  return worst;
}

/** Position, first and second derivative (with respect to u) of the periodic spline at u. */
function splineAt(cx: Float64Array, cy: Float64Array, n: number, u: number, out: Float64Array): void {
  const k = Math.floor(u);
  splineSpanAt(cx, cy, controlIndex(k, 0, n), controlIndex(k, 1, n), controlIndex(k, 2, n), controlIndex(k, 3, n), u - k, out);
}

// ---------------------------------------------------------------------------------------
// 1′. Open splines for the runs between corners.

/**
 * Fewest control points of an open run's spline: 4, a single cubic span (its two
 * constrained end points leave exactly the two handles free, the classic one-cubic
 * fit with free end tangents).
 */
const MIN_OPEN_CONTROL_POINTS = 4;

/** The least-squares open spline of one run between two corners, before reduction. */
export interface OpenSplineFit {
  readonly kind: 'spline';
  /**
   * Control polygon P₀ … P_{n−1} of a floating uniform cubic B-spline (font units),
   * with (P₀ + 4P₁ + P₂)/6 the start corner and (P_{n−3} + 4P_{n−2} + P_{n−1})/6 the end corner.
   */
  readonly controlPoints: readonly Point[];
  /** Its exact Bézier form, n − 3 segments, C² at every internal join; starts exactly at the start corner, ends exactly at the end corner. */
  readonly segments: readonly CubicSegment[];
  /** Unwrapped chain indices of the data fitted: the run without the corners' rounded tips. */
  readonly first: number;
  readonly last: number;
  /** Spline parameter of each data point (index − first) after correction, knot units in [0, n − 3]. */
  readonly parameters: Float64Array;
  /** Largest distance from a data point to its projection on the spline (an upper bound on the true distance). */
  readonly maxDistance: number;
  /** False when the control-point cap was reached before maxDistance ≤ tolerance. */
  readonly withinTolerance: boolean;
}

/** One run of a cornered contour, from corner `start` to corner `end`, as fitted. */
export interface CornerRun {
  readonly start: DetectedCorner;
  readonly end: DetectedCorner;
  /** Unwrapped chain indices of the two corners (startIndex < endIndex ≤ startIndex + count). */
  readonly startIndex: number;
  readonly endIndex: number;
  /** Unwrapped chain indices of the data: the run less the corners' rounding zones (empty when last < first). */
  readonly first: number;
  readonly last: number;
  /** A line when every data point lies within the tolerance of the chord between the corners; otherwise the open spline. */
  readonly fit: LineSegment | OpenSplineFit;
}

/**
 * Each run between consecutive corners fitted on its own (see the header, "Contours
 * with corners"): a line where the chord between the two corner estimates holds the
 * tolerance, otherwise the open least-squares spline with the fewest control points
 * that holds it. Corners must be sorted by index (as detectCorners returns them); runs
 * start at corners[0]. Each corner is moved to where its sides, fitted with free ends
 * (at least as many control points as the first fit at the detector's estimates
 * needed), meet (sidesMeet); measured on a noisy S-band this puts the corners within
 * 0.2 units of the drawn ones and the turns within 1° (refining from the constrained
 * fits instead converged slowly and left 0.3–0.7 units and 2.2°). Guarantees: each run starts exactly at its start corner's
 * estimate and ends exactly at its end corner's; a spline run is C² inside; when
 * `withinTolerance`, every data point lies within the tolerance of it.
 */
export function fitRunSplines(chain: BoundaryChain, corners: readonly DetectedCorner[], settings: SmoothFitSettings): CornerRun[] {
  checkSettings(settings);
  if (corners.length === 0) throw new RangeError('smooth fit: fitRunSplines needs at least one corner');
  const count = corners.length;
  const straight = corners.map((corner, k) => {
    const [first, last] = runData(chain, corners, k);
    return last < first || distanceToRegressionLine(chain, first, last) <= settings.tolerance;
  });
  // First fit: the corners at the detector's estimates; it sets how many control
  // points each side needs.
  const estimates = corners.map((corner) => corner.estimate);
  const first = fitRunsTo(chain, corners, estimates, straight, settings, { free: false, fewest: null });
  const counts = first.map((run) => (run.fit.kind === 'spline' ? run.fit.controlPoints.length : MIN_OPEN_CONTROL_POINTS));
  // The corners from the sides alone: each curved run fitted again with free ends (and
  // at least as many control points), so no corner estimate pulls on the side
  // tangents it is then computed from.
  const sides = fitRunsTo(chain, corners, estimates, straight, settings, { free: true, fewest: counts });
  const points = corners.map((corner, k) => sidesMeet(chain, corner, sides[(k - 1 + count) % count]!, sides[k]!) ?? corner.estimate);
  let runs = fitRunsTo(chain, corners, points, straight, settings, { free: false, fewest: counts });
  // A straight run whose corners could not be moved onto its line may stray from the chord.
  const strayed = runs.map((run) => run.fit.kind === 'line' && run.last >= run.first && measureSpanError(chain, run.fit, run.first, run.last, settings.tolerance) > settings.tolerance);
  if (strayed.some(Boolean)) runs = fitRunsTo(chain, corners, points, straight.map((s, k) => s && !strayed[k]), settings, { free: false, fewest: counts });
  return runs;
}

/** Unwrapped data range of run k (from corner k to corner k + 1): the chain points between the corners' rounding zones. */
function runData(chain: BoundaryChain, corners: readonly DetectedCorner[], k: number): [number, number] {
  const start = corners[k]!;
  const end = corners[(k + 1) % corners.length]!;
  const startIndex = start.index;
  const endIndex = k + 1 < corners.length ? end.index : end.index + chain.count;
  const from = arcAt(chain, startIndex) + start.roundingZone;
  const to = arcAt(chain, endIndex) - end.roundingZone;
  const [first, last] = rangeByArc(chain, from, to);
  const clampedFirst = Math.max(first, startIndex + 1);
  return [clampedFirst, to <= from ? clampedFirst - 1 : Math.min(last, endIndex - 1)];
}

/** Largest distance from the points [first, last] to their orthogonal-regression line (local-line.ts). */
function distanceToRegressionLine(chain: BoundaryChain, first: number, last: number): number {
  const regression = fitStretchLine(chain, first, last, emptyStretchLine());
  const nx = -Math.sin(regression.angle);
  const ny = Math.cos(regression.angle);
  let worst = 0;
  for (let k = first; k <= last; k++) {
    const i = wrapIndex(chain, k);
    worst = Math.max(worst, Math.abs((chain.xs[i]! - regression.centreX) * nx + (chain.ys[i]! - regression.centreY) * ny));
  }
  return worst;
}

/** Every run fitted with the corners at `points`: the chord where the run is `straight`, else the open spline (see fitRunSplines). */
function fitRunsTo(chain: BoundaryChain, corners: readonly DetectedCorner[], points: readonly Point[], straight: readonly boolean[], settings: SmoothFitSettings, search: { readonly free: boolean; readonly fewest: readonly number[] | null }): CornerRun[] {
  const runs: CornerRun[] = [];
  const count = corners.length;
  for (let k = 0; k < count; k++) {
    const start = corners[k]!;
    const end = corners[(k + 1) % count]!;
    const startPoint = points[k]!;
    const endPoint = points[(k + 1) % count]!;
    const startIndex = start.index;
    const endIndex = k + 1 < count ? end.index : end.index + chain.count;
    const [first, last] = runData(chain, corners, k);
    const side = CORNER_SIDE_PX * settings.pixel;
    const sideFirst = indexAtArc(chain, arcAt(chain, startIndex) + start.roundingZone + side);
    const sideLast = indexAtArc(chain, arcAt(chain, endIndex) - end.roundingZone - side) + 1;
    const fit = last < first || straight[k] ? line(startPoint, endPoint) : fitOpenSpline(chain, { first, last, startIndex, endIndex, start: startPoint, end: endPoint, sideFirst, sideLast }, settings, search.free, search.fewest?.[k] ?? MIN_OPEN_CONTROL_POINTS);
    runs.push({ start, end, startIndex, endIndex, first, last, fit });
  }
  return runs;
}

/**
 * Where the two fitted sides of a corner meet: the intersection of their tangent
 * lines taken where their data begin (outside the rounded tip), a line side's own
 * line; undefined when they do not meet within the corner's reach of the traced apex,
 * or meet behind a side (the tests of corner-sharpening.ts).
 */
function sidesMeet(chain: BoundaryChain, corner: DetectedCorner, incoming: CornerRun, outgoing: CornerRun): Point | undefined {
  const a = runSide(chain, incoming, true);
  const b = runSide(chain, outgoing, false);
  if (!a || !b) return undefined;
  const meet = intersectLines(a.point, a.direction, b.point, b.direction);
  if (!meet) return undefined;
  const apex = chainPoint(chain, corner.index);
  if (distance(meet, apex) > corner.reach) return undefined;
  if ((meet.x - a.point.x) * a.direction.x + (meet.y - a.point.y) * a.direction.y < -corner.roundingZone) return undefined;
  if ((b.point.x - meet.x) * b.direction.x + (b.point.y - meet.y) * b.direction.y < -corner.roundingZone) return undefined;
  return meet;
}

/**
 * A run's tangent line at its end (atEnd) or start, where its data stop or begin; for
 * a line run, the orthogonal-regression line of its data (local-line.ts), since the
 * chord only joins the two corner estimates being refined.
 */
function runSide(chain: BoundaryChain, run: CornerRun, atEnd: boolean): { point: Point; direction: Vec } | undefined {
  const fit = run.fit;
  if (fit.kind === 'line') {
    if (run.last - run.first < 1) return undefined;
    const regression = fitStretchLine(chain, run.first, run.last, emptyStretchLine());
    return { point: { x: regression.centreX + chain.origin.x, y: regression.centreY + chain.origin.y }, direction: { x: Math.cos(regression.angle), y: Math.sin(regression.angle) } };
  }
  const u = fit.parameters[atEnd ? fit.parameters.length - 1 : 0]!;
  const k = Math.min(fit.segments.length - 1, Math.max(0, Math.floor(u)));
  const segment = fit.segments[k]!;
  const direction = unit(derivative(segment, u - k));
  return direction.x === 0 && direction.y === 0 ? undefined : { point: evaluate(segment, u - k), direction };
}

/** What an open spline is fitted to: the data range, and the corners it must start and end at. */
interface OpenRunRequest {
  readonly first: number;
  readonly last: number;
  /** Unwrapped chain indices of the corners (for the initial parameters). */
  readonly startIndex: number;
  readonly endIndex: number;
  /** Font units. */
  readonly start: Point;
  readonly end: Point;
  /** Data points up to sideFirst and from sideLast on lie on the corners' sides (CORNER_SIDE_PX next to the rounded tips). */
  readonly sideFirst: number;
  readonly sideLast: number;
}

/**
 * Largest bias allowed on each corner's side, as a share of the tolerance: 0.1. The
 * end tangents and end points of a least-squares spline are its least determined
 * parts (an end has data on one side only), and the corner is decided there. The
 * bias is the mean signed distance of the side's points from the spline, which
 * averages the scan noise away (σ/√n, about 0.04 units for 12 points at σ = 0.15)
 * and leaves the model error. Held only to the tolerance, the S-band's sides ended
 * 2.7° off their drawn directions (10 control points per run, measured), and a cap on
 * the largest distance on the sides at half the tolerance did not change that.
 */
const CORNER_SIDE_BIAS_SHARE = 0.1;

function fitOpenSpline(chain: BoundaryChain, request: OpenRunRequest, settings: SmoothFitSettings, free: boolean, fewest: number): OpenSplineFit {
  const { tolerance, pixel } = settings;
  const m = request.last - request.first + 1;
  const runArc = arcAt(chain, request.endIndex) - arcAt(chain, request.startIndex);
  const spanCap = Math.floor(Math.min(m / MIN_POINTS_PER_SPAN, runArc / (MIN_SPAN_PX * pixel)));
  const cap = Math.max(MIN_OPEN_CONTROL_POINTS, spanCap + 3);
  const min = Math.min(cap, Math.max(MIN_OPEN_CONTROL_POINTS, fewest));
  let best = fewestControlPoints(min, cap, tolerance, (n) => fitOpenWithControlPoints(chain, request, n, free));
  // The tolerance comes first: when the sides' bias cannot be met, search by the distance alone.
  if ((best.pointDistance ?? best.maxDistance) > tolerance) {
    best = fewestControlPoints(min, cap, tolerance, (n) => {
      const trial = fitOpenWithControlPoints(chain, request, n, free);
      return { ...trial, maxDistance: trial.pointDistance ?? trial.maxDistance };
    });
  }
  const maxDistance = best.pointDistance ?? best.maxDistance;
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  const controlPoints: Point[] = [];
  for (let i = 0; i < best.cx.length; i++) controlPoints.push({ x: best.cx[i]! + ox, y: best.cy[i]! + oy });
  const segments = uniformBSplineToBezier(controlPoints, { ends: 'floating' });
  if (!free) {
    // The constraints put the ends on the corners up to rounding; make them exact.
    const head = segments[0]!;
    segments[0] = cubic(request.start, head.p1, head.p2, segments.length === 1 ? request.end : head.p3);
    const tail = segments[segments.length - 1]!;
    if (segments.length > 1) segments[segments.length - 1] = cubic(tail.p0, tail.p1, tail.p2, request.end);
  }
  return { kind: 'spline', controlPoints, segments, first: request.first, last: request.last, parameters: best.u, maxDistance, withinTolerance: maxDistance <= tolerance };
}

/** Least squares with n control points for an open run, with parameter correction (as fitWithControlPoints). */
function fitOpenWithControlPoints(chain: BoundaryChain, request: OpenRunRequest, n: number, free = false): SplineTrial {
  const m = request.last - request.first + 1;
  const spans = n - 3;
  const s0 = arcAt(chain, free ? request.first : request.startIndex);
  const length = arcAt(chain, free ? request.last : request.endIndex) - s0 || 1;
  const u = new Float64Array(m);
  for (let k = 0; k < m; k++) u[k] = Math.min(spans, Math.max(0, ((arcAt(chain, request.first + k) - s0) / length) * spans));
  const a = free ? null : { x: request.start.x - chain.origin.x, y: request.start.y - chain.origin.y };
  const b = free ? null : { x: request.end.x - chain.origin.x, y: request.end.y - chain.origin.y };
  const solve = (): { cx: Float64Array; cy: Float64Array } => solveOpenControlPoints(chain, request.first, u, n, a, b);
  const sides = { first: request.sideFirst - request.first, last: request.sideLast - request.first };
  const project = (cx: Float64Array, cy: Float64Array, parameters: Float64Array): { score: number; distance: number } => {
    const d = projectOpenParameters(chain, request.first, cx, cy, parameters, sides);
    return { score: Math.max(d.all, d.sides / CORNER_SIDE_BIAS_SHARE), distance: d.all };
  };
  let control = solve();
  let measured = project(control.cx, control.cy, u);
  for (let round = 1; round < PARAMETER_CORRECTION_ROUNDS; round++) {
    const next = solve();
    const trialU = Float64Array.from(u);
    const d = project(next.cx, next.cy, trialU);
    const improved = d.score < measured.score * (1 - STALLED_IMPROVEMENT);
    if (d.score < measured.score) {
      control = next;
      u.set(trialU);
      measured = d;
    }
    if (!improved) break;
  }
  return { cx: control.cx, cy: control.cy, u, maxDistance: measured.score, pointDistance: measured.distance };
}

/**
 * A control point of the constrained open spline as a combination of the unknowns
 * (P₁ … P_{n−2}, numbered 0 … n − 3) plus a multiple of a corner: the end-point
 * constraints give P₀ = 6A − 4P₁ − P₂ and P_{n−1} = 6B − 4P_{n−2} − P_{n−3}.
 */
function expandControlPoint(r: number, n: number, terms: { index: number[]; weight: number[]; a: number; b: number }, free: boolean): void {
  terms.index.length = 0;
  terms.weight.length = 0;
  terms.a = 0;
  terms.b = 0;
  if (free) {
    terms.index.push(r);
    terms.weight.push(1);
  } else if (r === 0) {
    terms.index.push(0, 1);
    terms.weight.push(-4, -1);
    terms.a = 6;
  } else if (r === n - 1) {
    terms.index.push(n - 3, n - 4);
    terms.weight.push(-4, -1);
    terms.b = 6;
  } else {
    terms.index.push(r - 1);
    terms.weight.push(1);
  }
}

/**
 * Solves the penalised normal equations of the open spline at fixed parameters, the
 * two end-point constraints eliminated (see expandControlPoint); returns the whole
 * control polygon, relative to the chain's origin. The system stays banded
 * (half-bandwidth 3): the eliminated points only couple unknowns of their own span.
 */
function solveOpenControlPoints(chain: BoundaryChain, first: number, u: Float64Array, n: number, a: Point | null, b: Point | null): { cx: Float64Array; cy: Float64Array } {
  const free = a === null || b === null;
  const size = free ? n : n - 2;
  const spans = n - 3;
  const matrix = cyclicBandedMatrix(size, SPLINE_HALF_BANDWIDTH);
  const rx = new Float64Array(size);
  const ry = new Float64Array(size);
  const terms = { index: [] as number[], weight: [] as number[], a: 0, b: 0 };
  const rowIndex: number[] = [];
  const rowWeight: number[] = [];
  // Adds one observation Σ w_r P_r ≈ (x, y), with weight `scale`, to the normal equations.
  const observe = (firstControl: number, weights: ArrayLike<number>, x: number, y: number, scale: number): void => {
    rowIndex.length = 0;
    rowWeight.length = 0;
    let tx = x;
    let ty = y;
    for (let r = 0; r < weights.length; r++) {
      const w = weights[r]!;
      if (w === 0) continue;
      expandControlPoint(firstControl + r, n, terms, free);
      if (!free) {
        tx -= w * (terms.a * a.x + terms.b * b.x);
        ty -= w * (terms.a * a.y + terms.b * b.y);
      }
      terms.index.forEach((j, q) => {
        const at = rowIndex.indexOf(j);
        if (at >= 0) rowWeight[at]! += w * terms.weight[q]!;
        else {
          rowIndex.push(j);
          rowWeight.push(w * terms.weight[q]!);
        }
      });
    }
    for (let p = 0; p < rowIndex.length; p++) {
      const cp = rowWeight[p]! * scale;
      rx[rowIndex[p]!]! += cp * tx;
      ry[rowIndex[p]!]! += cp * ty;
      for (let q = 0; q <= p; q++) addSymmetric(matrix, rowIndex[p]!, rowIndex[q]!, cp * rowWeight[q]!);
    }
  };
  // The data rows, written out (observe's general path is for the few penalty rows):
  // span k's weights fall on unknowns k − 1 … k + 2 (free: k … k + 3), the eliminated
  // end points spreading theirs as expandControlPoint says.
  const basisWeights = new Float64Array(4);
  const local = new Float64Array(4);
  const shift = free ? 0 : -1;
  for (let i = 0; i < u.length; i++) {
    const k = Math.min(spans - 1, Math.max(0, Math.floor(u[i]!)));
    basis(u[i]! - k, basisWeights);
    const c = wrapIndex(chain, first + i);
    let tx = chain.xs[c]!;
    let ty = chain.ys[c]!;
    local.fill(0);
    for (let r = 0; r < 4; r++) {
      const w = basisWeights[r]!;
      const control = k + r;
      if (!free && control === 0) {
        // P₀ = 6A − 4P₁ − P₂; here k = 0, so P₁ and P₂ (unknowns 0 and 1) sit at local 1 and 2.
        local[1]! -= 4 * w;
        local[2]! -= w;
        tx -= 6 * w * a.x;
        ty -= 6 * w * a.y;
      } else if (!free && control === n - 1) {
        // P_{n−1} = 6B − 4P_{n−2} − P_{n−3}; here k = n − 4, so they sit at local 2 and 1.
        local[2]! -= 4 * w;
        local[1]! -= w;
        tx -= 6 * w * b.x;
        ty -= 6 * w * b.y;
      } else {
        local[r]! += w;
      }
    }
    const base = k + shift;
    for (let p = 0; p < 4; p++) {
      const j = base + p;
      const wp = local[p]!;
      if (wp === 0 || j < 0 || j >= size) continue;
      rx[j]! += wp * tx;
      ry[j]! += wp * ty;
      for (let q = 0; q <= p; q++) {
        const wq = local[q]!;
        if (wq !== 0 && base + q >= 0) addSymmetric(matrix, j, base + q, wp * wq);
      }
    }
  }
  // λ Σ |P_{j−1} − 2P_j + P_{j+1}|² over the whole polygon, as in the periodic fit.
  const lambda = (SMOOTHING_SHARE * u.length) / n;
  const second = [1, -2, 1];
  for (let j = 1; j < n - 1; j++) observe(j - 1, second, 0, 0, lambda);
  const factor = envelopeCholesky(matrix);
  const qx = solveWithCholesky(factor, rx);
  const qy = solveWithCholesky(factor, ry);
  if (free) return { cx: qx, cy: qy };
  const cx = new Float64Array(n);
  const cy = new Float64Array(n);
  for (let j = 0; j < size; j++) {
    cx[j + 1] = qx[j]!;
    cy[j + 1] = qy[j]!;
  }
  cx[0] = 6 * a.x - 4 * cx[1]! - cx[2]!;
  cy[0] = 6 * a.y - 4 * cy[1]! - cy[2]!;
  cx[n - 1] = 6 * b.x - 4 * cx[n - 2]! - cx[n - 3]!;
  cy[n - 1] = 6 * b.y - 4 * cy[n - 2]! - cy[n - 3]!;
  return { cx, cy };
}

/**
 * As projectParameters, for the open spline: parameters stay within [0, n − 3].
 * Returns the largest distance over all points, and the larger absolute mean signed
 * distance over the two sides (the points up to `sides.first` and from `sides.last`,
 * offsets from `first`).
 */
function projectOpenParameters(chain: BoundaryChain, first: number, cx: Float64Array, cy: Float64Array, u: Float64Array, sides: { first: number; last: number }): { all: number; sides: number } {
  const spans = cx.length - 3;
  const at = new Float64Array(6);
  let worst = 0;
  let startSum = 0;
  let startCount = 0;
  let endSum = 0;
  let endCount = 0;
  for (let k = 0; k < u.length; k++) {
    const i = wrapIndex(chain, first + k);
    const px = chain.xs[i]!;
    const py = chain.ys[i]!;
    let uk = u[k]!;
    for (let step = 0; step < NEWTON_STEPS_PER_PROJECTION; step++) {
      openSplineAt(cx, cy, uk, at);
      const ex = at[0]! - px;
      const ey = at[1]! - py;
      const f = ex * at[2]! + ey * at[3]!;
      const fPrime = at[2]! * at[2]! + at[3]! * at[3]! + ex * at[4]! + ey * at[5]!;
      if (!(fPrime > 0)) break;
      uk = Math.min(spans, Math.max(0, uk - Math.max(-MAX_NEWTON_STEP, Math.min(MAX_NEWTON_STEP, f / fPrime))));
    }
    u[k] = uk;
    openSplineAt(cx, cy, uk, at);
    const d = Math.hypot(at[0]! - px, at[1]! - py);
    if (d > worst) worst = d;
    if (k <= sides.first || k >= sides.last) {
      const speed = Math.hypot(at[2]!, at[3]!) || 1;
      const signed = ((px - at[0]!) * -at[3]! + (py - at[1]!) * at[2]!) / speed;
      if (k <= sides.first) {
        startSum += signed;
        startCount++;
      } else {
        endSum += signed;
        endCount++;
      }
    }
  }
  return { all: worst, sides: Math.max(startCount > 0 ? Math.abs(startSum / startCount) : 0, endCount > 0 ? Math.abs(endSum / endCount) : 0) };
}

/** Position, first and second derivative of the floating open spline P₀ … P_{n−1} at u ∈ [0, n − 3]. */
function openSplineAt(cx: Float64Array, cy: Float64Array, u: number, out: Float64Array): void {
  const k = Math.min(cx.length - 4, Math.max(0, Math.floor(u)));
  splineSpanAt(cx, cy, k, k + 1, k + 2, k + 3, u - k, out);
}

/**
 * Position (out[0], out[1]), first (out[2], out[3]) and second derivative (out[4],
 * out[5]) at t ∈ [0, 1] of the uniform cubic B-spline span with control points
 * i0 … i3. Written out without temporaries: this is the inner loop of every
 * projection.
 */
function splineSpanAt(cx: Float64Array, cy: Float64Array, i0: number, i1: number, i2: number, i3: number, t: number, out: Float64Array): void {
  const s = 1 - t;
  const t2 = t * t;
  const t3 = t2 * t;
  const b0 = (s * s * s) / 6;
  const b1 = (3 * t3 - 6 * t2 + 4) / 6;
  const b2 = (-3 * t3 + 3 * t2 + 3 * t + 1) / 6;
  const b3 = t3 / 6;
  const d0 = -(s * s) / 2;
  const d1 = (3 * t2 - 4 * t) / 2;
  const d2 = (-3 * t2 + 2 * t + 1) / 2;
  const d3 = t2 / 2;
  const e0 = s;
  const e1 = 3 * t - 2;
  const e2 = 1 - 3 * t;
  const e3 = t;
  const x0 = cx[i0]!, x1 = cx[i1]!, x2 = cx[i2]!, x3 = cx[i3]!;
  const y0 = cy[i0]!, y1 = cy[i1]!, y2 = cy[i2]!, y3 = cy[i3]!;
  out[0] = b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3;
  out[1] = b0 * y0 + b1 * y1 + b2 * y2 + b3 * y3;
  out[2] = d0 * x0 + d1 * x1 + d2 * x2 + d3 * x3;
  out[3] = d0 * y0 + d1 * y1 + d2 * y2 + d3 * y3;
  out[4] = e0 * x0 + e1 * x1 + e2 * x2 + e3 * x3;
  out[5] = e0 * y0 + e1 * y1 + e2 * y2 + e3 * y3;
}

// ---------------------------------------------------------------------------------------
// 3. Splitting at extrema and inflections.

/** An on-curve point of the split spline. */
interface PieceNode {
  readonly point: Point;
  /** Spline parameter (knot units, in [0, n)). */
  readonly parameter: number;
  isExtremumX: boolean;
  isExtremumY: boolean;
  isInflection: boolean;
  tangent: Vec;
  pinned: boolean;
  /** Set at a corner between two runs: a sharp join, tangents free in the reduction. */
  corner: DetectedCorner | null;
  /**
   * The span after the node stands for the chain points from index + skipAfter, the
   * span before it for those up to index − skipBefore: at a corner the rounded tip
   * is left out; at a smooth node the split follows the spline parameter (see
   * linkDataStart), so either may be negative.
   */
  skipBefore: number;
  skipAfter: number;
}

/** The split spline: pieces[i] runs from nodes[i] to nodes[(i + 1) % count] (open: the last piece ends at the run's end). */
interface SplitSpline {
  readonly nodes: PieceNode[];
  readonly pieces: CubicSegment[];
}

/** Nodes and pieces round a whole contour, lines allowed between corners (what the reduction works on). */
interface ContourPieces {
  readonly nodes: readonly PieceNode[];
  readonly pieces: readonly (CubicSegment | LineSegment)[];
}

/** Where in a segment a feature was found. */
interface Feature {
  t: number;
  point: Point;
  x: boolean;
  y: boolean;
  inflection: boolean;
}

/**
 * The spline's segments cut at every x/y extremum and inflection (features within
 * SNAP_DISTANCE_UNITS of a join are moved onto the join), with every feature checked
 * for a real sign change and every node's handles made collinear with its tangent
 * (axis-aligned at extrema). An open run (`closed` false) runs between two corners:
 * its first node is the start corner, whose handle is left as the spline has it,
 * features at either end are dropped (the corner is a node anyway) and the end
 * corner is not listed.
 */
function splitAtFeatures(segments: readonly CubicSegment[], closed = true): SplitSpline {
  const n = segments.length;
  const joinFlags = segments.map(() => ({ x: false, y: false, inflection: false }));
  const interior: Feature[][] = segments.map(() => []);
  segments.forEach((segment, k) => {
    const power = powerBasisOf(segment, segment.p0);
    const found: [keyof Omit<Feature, 't' | 'point'>, number[]][] = [
      ['x', rootsInUnitInterval(derivativeOfPolynomial(power.x), 'closed')],
      ['y', rootsInUnitInterval(derivativeOfPolynomial(power.y), 'closed')],
      ['inflection', rootsInUnitInterval(velocityCrossAcceleration(segment), 'closed')],
    ];
    for (const [kind, roots] of found) {
      for (const t of roots) {
        const point = evaluate(segment, t);
        if (distance(point, segment.p0) <= SNAP_DISTANCE_UNITS) {
          if (closed || k > 0) joinFlags[k]![kind] = true;
        } else if (distance(point, segment.p3) <= SNAP_DISTANCE_UNITS) {
          if (closed || k + 1 < n) joinFlags[(k + 1) % n]![kind] = true;
        } else {
          const list = interior[k]!;
          const near = list.find((f) => distance(f.point, point) <= SNAP_DISTANCE_UNITS);
          if (near) near[kind] = true;
          else list.push({ t, point, x: kind === 'x', y: kind === 'y', inflection: kind === 'inflection' });
        }
      }
    }
  });
  const nodes: PieceNode[] = [];
  const pieces: CubicSegment[] = [];
  segments.forEach((segment, k) => {
    const flags = joinFlags[k]!;
    nodes.push({ point: segment.p0, parameter: k, isExtremumX: flags.x, isExtremumY: flags.y, isInflection: flags.inflection, tangent: { x: 0, y: 0 }, pinned: false, corner: null, skipBefore: 0, skipAfter: 0 });
    const features = interior[k]!.sort((a, b) => a.t - b.t);
    let rest = segment;
    let restStart = 0;
    for (const f of features) {
      const [left, right] = splitAt(rest, (f.t - restStart) / (1 - restStart));
      pieces.push(left);
      nodes.push({ point: left.p3, parameter: k + f.t, isExtremumX: f.x, isExtremumY: f.y, isInflection: f.inflection, tangent: { x: 0, y: 0 }, pinned: false, corner: null, skipBefore: 0, skipAfter: 0 });
      rest = right;
      restStart = f.t;
    }
    pieces.push(rest);
  });
  // Keep only features where the quantity really changes sign: between two nodes no
  // root is left inside a piece, so each piece's midpoint shows the sign on that side.
  const count = nodes.length;
  const sign = (piece: CubicSegment, quantity: 'x' | 'y' | 'inflection'): number => {
    if (quantity === 'inflection') return Math.sign(evaluatePolynomial(velocityCrossAcceleration(piece), 0.5));
    const d = derivative(piece, 0.5);
    return Math.sign(quantity === 'x' ? d.x : d.y);
  };
  nodes.forEach((node, i) => {
    if (!closed && i === 0) return;
    const before = pieces[(i - 1 + count) % count]!;
    const after = pieces[i]!;
    if (node.isExtremumX) node.isExtremumX = sign(before, 'x') * sign(after, 'x') < 0;
    if (node.isExtremumY) node.isExtremumY = sign(before, 'y') * sign(after, 'y') < 0;
    if (node.isInflection) node.isInflection = sign(before, 'inflection') * sign(after, 'inflection') < 0;
  });
  // Tangents: the direction through the two handles (collinear by C¹ construction), axis-aligned at extrema.
  nodes.forEach((node, i) => {
    if (!closed && i === 0) {
      // The start corner: its tangent is the spline's, its handle stays.
      const first = pieces[0]!;
      node.tangent = unit({ x: first.p1.x - first.p0.x, y: first.p1.y - first.p0.y });
      return;
    }
    const b = (i - 1 + count) % count;
    const before = pieces[b]!;
    const after = pieces[i]!;
    let d = { x: after.p1.x - before.p2.x, y: after.p1.y - before.p2.y };
    if (d.x === 0 && d.y === 0) d = { x: after.p2.x - before.p1.x, y: after.p2.y - before.p1.y };
    let tangent: Vec;
    if (node.isExtremumY) tangent = { x: d.x >= 0 ? 1 : -1, y: 0 };
    else if (node.isExtremumX) tangent = { x: 0, y: d.y >= 0 ? 1 : -1 };
    else {
      const l = Math.hypot(d.x, d.y) || 1;
      tangent = { x: d.x / l, y: d.y / l };
    }
    node.tangent = tangent;
    const p = node.point;
    const inLength = distance(before.p2, p);
    const outLength = distance(after.p1, p);
    pieces[b] = cubic(before.p0, before.p1, { x: p.x - inLength * tangent.x, y: p.y - inLength * tangent.y }, p);
    const updatedAfter = pieces[i]!; // the same piece when the contour has one node
    pieces[i] = cubic(p, { x: p.x + outLength * tangent.x, y: p.y + outLength * tangent.y }, updatedAfter.p2, updatedAfter.p3);
  });
  return { nodes, pieces };
}

function distance(a: Point, b: Point): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

function unit(v: Vec): Vec {
  const l = Math.hypot(v.x, v.y);
  return l > 0 ? { x: v.x / l, y: v.y / l } : { x: 0, y: 0 };
}

/**
 * Pins the extrema and inflections that survive persistence simplification (see the
 * header): per axis, the cyclic sequence of extremum values; for inflections, the
 * turns between consecutive ones.
 */
function markPersistentFeatures(spline: SplitSpline): void {
  const { nodes } = spline;
  const count = nodes.length;
  const turnOfPiece = (i: number): number => {
    const a = nodes[i]!.tangent;
    const b = nodes[(i + 1) % count]!.tangent;
    return Math.atan2(a.x * b.y - a.y * b.x, a.x * b.x + a.y * b.y);
  };
  for (const axis of ['x', 'y'] as const) {
    const at = nodes.map((node, i) => ((axis === 'x' ? node.isExtremumX : node.isExtremumY) ? i : -1)).filter((i) => i >= 0);
    const value = (i: number): number => (axis === 'x' ? nodes[i]!.point.x : nodes[i]!.point.y);
    const deltas = at.map((i, k) => value(at[(k + 1) % at.length]!) - value(i));
    persistentTurningPoints(deltas, EXTREMUM_PROMINENCE_UNITS, 2).forEach((keep, k) => {
      if (keep) nodes[at[k]!]!.pinned = true;
    });
  }
  const at = nodes.map((node, i) => (node.isInflection ? i : -1)).filter((i) => i >= 0);
  const deltas = at.map((i, k) => {
    let j = at[(k + 1) % at.length]!;
    if (j <= i) j += count;
    let turn = 0;
    for (let p = i; p < j; p++) turn += turnOfPiece(p % count);
    return turn;
  });
  persistentTurningPoints(deltas, INFLECTION_PERSISTENCE_RADIANS, 0).forEach((keep, k) => {
    if (keep) nodes[at[k]!]!.pinned = true;
  });
  // A closed curve always has extrema; this only guards degenerate input.
  if (!nodes.some((node) => node.pinned) && nodes[0]) nodes[0].pinned = true;
}

/**
 * Persistence simplification of a cyclic sequence of turning points given by the
 * changes d_k from point k to point k + 1: the smallest change below `threshold` is
 * removed with its two end points (its neighbours' changes absorb it), repeatedly,
 * while more than `minimumCount` points remain. Returns which points are kept.
 */
export function persistentTurningPoints(deltas: readonly number[], threshold: number, minimumCount: number): boolean[] {
  const alive = deltas.map(() => true);
  // Cyclic list of live points, each with the change to the next live point.
  const next = deltas.map((_, k) => (k + 1) % deltas.length);
  const previous = deltas.map((_, k) => (k - 1 + deltas.length) % deltas.length);
  const change = deltas.slice();
  let live = deltas.length;
  while (live >= 2 && live - 2 >= minimumCount) {
    let smallest = -1;
    for (let k = 0; k < deltas.length; k++) if (alive[k] && (smallest < 0 || Math.abs(change[k]!) < Math.abs(change[smallest]!))) smallest = k;
    if (smallest < 0 || !(Math.abs(change[smallest]!) < threshold)) break;
    const a = smallest;
    const b = next[a]!;
    alive[a] = false;
    alive[b] = false;
    live -= 2;
    if (live === 0) break;
    const before = previous[a]!;
    const after = next[b]!;
    change[before] = change[before]! + change[a]! + change[b]!;
    next[before] = after;
    previous[after] = before;
  }
  return alive;
}

/**
 * markPersistentFeatures for an open run between two corners (`end`: the end corner's
 * point): per axis the sequence of extremum values, and the turns between
 * inflections, each from the start corner to the end corner, simplified by
 * persistentTurningPointsOpen. The start corner is pinned.
 */
function markPersistentFeaturesInRun(spline: SplitSpline, end: Point): void {
  const { nodes, pieces } = spline;
  const pointAt = (i: number): Point => (i < nodes.length ? nodes[i]!.point : end);
  for (const axis of ['x', 'y'] as const) {
    const at = nodes.map((node, i) => (i > 0 && (axis === 'x' ? node.isExtremumX : node.isExtremumY) ? i : -1)).filter((i) => i >= 0);
    const value = (i: number): number => (axis === 'x' ? pointAt(i).x : pointAt(i).y);
    const sequence = [0, ...at, nodes.length];
    const deltas = sequence.slice(1).map((i, k) => value(i) - value(sequence[k]!));
    persistentTurningPointsOpen(deltas, EXTREMUM_PROMINENCE_UNITS).forEach((keep, k) => {
      if (keep) nodes[at[k]!]!.pinned = true;
    });
  }
  const turnOfPiece = (piece: CubicSegment): number => {
    const a = derivative(piece, 0);
    const b = derivative(piece, 1);
    return Math.atan2(a.x * b.y - a.y * b.x, a.x * b.x + a.y * b.y);
  };
  const at = nodes.map((node, i) => (i > 0 && node.isInflection ? i : -1)).filter((i) => i >= 0);
  const sequence = [0, ...at, nodes.length];
  const deltas = sequence.slice(1).map((j, k) => {
    let turn = 0;
    for (let p = sequence[k]!; p < j; p++) turn += turnOfPiece(pieces[p]!);
    return turn;
  });
  persistentTurningPointsOpen(deltas, INFLECTION_PERSISTENCE_RADIANS).forEach((keep, k) => {
    if (keep) nodes[at[k]!]!.pinned = true;
  });
  nodes[0]!.pinned = true;
}

/**
 * Persistence simplification on an open sequence whose two ends are fixed (the
 * corners of a run): `deltas[k]` is the change from point k to point k + 1, for
 * points 0 … K + 1, where 0 and K + 1 are the ends. The smallest change below the
 * threshold is cancelled: between two interior points both go (as in
 * persistentTurningPoints); between an end and an interior point only the interior
 * one goes, and the end, which always stays, absorbs the change (the function on an
 * interval, whose boundary points pair with interior extrema like any critical
 * point: Edelsbrunner & Harer 2010, "Computational Topology", §VII.1). Returns which
 * of the K interior points are kept.
 */
export function persistentTurningPointsOpen(deltas: readonly number[], threshold: number): boolean[] {
  const last = deltas.length; // index of the end point
  const alive = Array.from({ length: last + 1 }, () => true);
  const next = Array.from({ length: last + 1 }, (_, k) => k + 1);
  const previous = Array.from({ length: last + 1 }, (_, k) => k - 1);
  const change = [...deltas, 0];
  for (;;) {
    let smallest = -1;
    for (let k = 0; k < last; k = next[k]!) {
      if (next[k] === last && k === 0) break;
      if (smallest < 0 || Math.abs(change[k]!) < Math.abs(change[smallest]!)) smallest = k;
    }
    if (smallest < 0 || !(Math.abs(change[smallest]!) < threshold)) break;
    const a = smallest;
    const b = next[a]!;
    if (a === 0) {
      // Start and its neighbour: the neighbour goes.
      alive[b] = false;
      change[0] = change[0]! + change[b]!;
      next[0] = next[b]!;
      previous[next[b]!] = 0;
    } else if (b === last) {
      alive[a] = false;
      const before = previous[a]!;
      change[before] = change[before]! + change[a]!;
      next[before] = last;
      previous[last] = before;
    } else {
      alive[a] = false;
      alive[b] = false;
      const before = previous[a]!;
      const after = next[b]!;
      change[before] = change[before]! + change[a]! + change[b]!;
      next[before] = after;
      previous[after] = before;
    }
  }
  return alive.slice(1, last);
}

// ---------------------------------------------------------------------------------------
// Links to the chain.

/**
 * Unwrapped chain index of each node: the chain point whose spline parameter is
 * nearest the node's, strictly increasing round the contour (each node at least one
 * point past the one before).
 */
function nodeChainIndices(chain: BoundaryChain, spline: SplitSpline, parameters: Float64Array, n: number): number[] {
  const m = chain.count;
  const wrapped = Float64Array.from(parameters, (u) => ((u % n) + n) % n);
  const order = Int32Array.from({ length: m }, (_, i) => i).sort((a, b) => wrapped[a]! - wrapped[b]!);
  const nearest = (tau: number): number => {
    let lo = 0;
    let hi = m - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (wrapped[order[mid]!]! < tau) lo = mid + 1;
      else hi = mid;
    }
    let best = order[lo]!;
    let bestGap = Infinity;
    for (const q of [lo - 1, lo, lo + 1]) {
      const i = order[((q % m) + m) % m]!;
      const raw = Math.abs(wrapped[i]! - tau);
      const gap = Math.min(raw, n - raw);
      if (gap < bestGap) {
        bestGap = gap;
        best = i;
      }
    }
    return best;
  };
  const indices: number[] = [];
  spline.nodes.forEach((node, j) => {
    const i = nearest(node.parameter);
    if (j === 0) {
      indices.push(i);
      return;
    }
    const previous = indices[j - 1]!;
    // The lap that puts the point nearest where the parameter says it should be.
    const expected = indices[0]! + (node.parameter / n) * m;
    const unwrapped = i + m * Math.round((expected - i) / m);
    indices.push(Math.max(unwrapped, previous + 1));
  });
  // Each span's data: the points whose projections fall on its stretch of the spline.
  const sorted = Float64Array.from(parameters).sort();
  spline.nodes.forEach((node, j) => {
    const before = countBelow(sorted, node.parameter);
    linkDataStart(node, indices[j]!, before + m * Math.round((indices[j]! - before) / m));
  });
  return indices;
}

/** How many of the ascending values lie below `value` (binary search). */
function countBelow(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Sets a smooth node's data links from `start`, the unwrapped index of the first chain
 * point whose spline parameter is at or past the node's: the span after the node
 * stands for the points from there, the span before it for those up to start − 1.
 * So every chain point is measured against the piece its projection falls on, even
 * where a node's chain index was pushed along to keep indices strictly increasing
 * (two nodes closer than the point spacing).
 */
function linkDataStart(node: PieceNode, index: number, start: number): void {
  node.skipAfter = start - index;
  node.skipBefore = index - (start - 1);
}

// ---------------------------------------------------------------------------------------
// 4. Reduction.

/** One cubic standing for pieces [from, to) of the split spline (positions unwrapped). */
interface Stretch {
  readonly from: number;
  readonly to: number;
  readonly segment: CubicSegment | LineSegment;
}

function reduce(chain: BoundaryChain, spline: ContourPieces, indices: readonly number[], tolerance: number): FittedContour {
  const { nodes, pieces } = spline;
  const count = nodes.length;
  const m = chain.count;
  const start = nodes.findIndex((node) => node.pinned);
  // Positions p = start … start + count, node p % count, chain index unwrapped past the seam.
  const indexAt = (p: number): number => indices[p % count]! + m * Math.floor(p / count);
  const nodeAt = (p: number): PieceNode => nodes[p % count]!;
  const stretches: Stretch[] = [];
  let runStart = start;
  for (let p = start + 1; p <= start + count; p++) {
    if (!nodeAt(p).pinned && p < start + count) continue;
    stretches.push(...fewestCubics(chain, runStart, p, nodeAt, indexAt, pieces, tolerance));
    runStart = p;
  }
  const fitNodes: FitNode[] = [];
  const spans: FitSpan[] = [];
  for (const stretch of stretches) {
    const node = nodeAt(stretch.from);
    const extremum: ExtremumAxis | null = node.isExtremumY ? 'y' : node.isExtremumX ? 'x' : null;
    if (node.corner) fitNodes.push({ point: node.point, smooth: false, tangentIn: null, tangentOut: null, extremum: null, corner: node.corner, index: indexAt(stretch.from), pinned: true });
    else fitNodes.push({ point: node.point, smooth: true, tangentIn: node.tangent, tangentOut: node.tangent, extremum, corner: null, index: indexAt(stretch.from), pinned: node.pinned });
    const first = indexAt(stretch.from) + node.skipAfter;
    const last = indexAt(stretch.to) - nodeAt(stretch.to).skipBefore;
    const segment = stretch.segment;
    const carrier = segment.kind === 'line' ? { through: segment.p0, direction: unit({ x: segment.p1.x - segment.p0.x, y: segment.p1.y - segment.p0.y }) } : null;
    spans.push({ segment, first, last, maxError: measureSpanError(chain, segment, first, last, tolerance), carrier });
  }
  return { nodes: fitNodes, spans };
}

/**
 * The fewest cubics from position a to position b (both pinned or the seam): a
 * shortest path over the joins in between, where an edge is either one piece of the
 * spline as it is or one cubic fitted over several pieces that passes `mergeable`.
 * Paths with fewer crowded stops (on-curve points within MIN_POINT_SPACING_UNITS of
 * a pinned end, which a designer would merge by hand) come first, then fewer cubics;
 * ties go to the path with the smaller largest error.
 */
function fewestCubics(
  chain: BoundaryChain,
  a: number,
  b: number,
  nodeAt: (p: number) => PieceNode,
  indexAt: (p: number) => number,
  pieces: readonly (CubicSegment | LineSegment)[],
  tolerance: number,
): Stretch[] {
  const length = b - a;
  const count = pieces.length;
  // A stop at an unpinned node within MIN_POINT_SPACING_UNITS of the stretch's pinned
  // ends (a knot or a wiggle next to an extremum or a corner) is a crowded stop.
  const crowded = (c: number): number => {
    if (c === 0 || c === length) return 0;
    const p = nodeAt(a + c).point;
    return distance(p, nodeAt(a).point) < MIN_POINT_SPACING_UNITS || distance(p, nodeAt(b).point) < MIN_POINT_SPACING_UNITS ? 1 : 0;
  };
  const best: { crowded: number; segments: number; error: number; from: number; segment: CubicSegment | null }[] = [{ crowded: 0, segments: 0, error: 0, from: -1, segment: null }];
  for (let c = 1; c <= length; c++) best.push({ crowded: Infinity, segments: Infinity, error: Infinity, from: -1, segment: null });
  const offer = (from: number, to: number, segment: CubicSegment | null, error: number): void => {
    const base = best[from]!;
    const candidate = best[to]!;
    const stops = base.crowded + crowded(to);
    const segments = base.segments + 1;
    const worst = Math.max(base.error, error);
    const better = stops !== candidate.crowded ? stops < candidate.crowded : segments !== candidate.segments ? segments < candidate.segments : worst < candidate.error;
    if (better) best[to] = { crowded: stops, segments, error: worst, from, segment };
  };
  for (let from = 0; from < length; from++) {
    if (best[from]!.segments === Infinity) continue;
    offer(from, from + 1, null, 0);
    let failures = 0;
    for (let to = from + 2; to <= length && failures < FAILED_EXTENSIONS_BEFORE_STOP; to++) {
      const start = nodeAt(a + from);
      const end = nodeAt(a + to);
      const fit = mergedCubic(chain, start, end, indexAt(a + from) + start.skipAfter, indexAt(a + to) - end.skipBefore, tolerance);
      if (fit) {
        failures = 0;
        offer(from, to, fit.segment, fit.maxError);
      } else {
        failures++;
      }
    }
  }
  const out: Stretch[] = [];
  for (let to = length; to > 0; ) {
    const step = best[to]!;
    const from = step.from;
    out.push({ from: a + from, to: a + to, segment: step.segment ?? pieces[(a + from) % count]! });
    to = from;
  }
  return out.reverse();
}

/**
 * The least-squares cubic from node `start` to node `end` over the chain points
 * [first, last], if it passes `mergeable`. A corner's tangent is free; where the
 * free tangent leaves an extremum inside the cubic that the corner itself stands for
 * (within MIN_POINT_SPACING_UNITS of it, or level with it to within
 * EXTREMUM_PROMINENCE_UNITS), that tangent is turned to the axis and the cubic
 * fitted again, as the economy mode does next to corners (extrema.ts, enforceExtrema).
 */
function mergedCubic(chain: BoundaryChain, start: PieceNode, end: PieceNode, first: number, last: number, tolerance: number): CubicFit | undefined {
  if (last < first) return undefined;
  const request = { chain, first, last, start: start.point, end: end.point, startTangent: start.corner ? null : start.tangent, endTangent: end.corner ? null : end.tangent };
  const fit = fitCubic(request, tolerance);
  if (mergeable(fit, tolerance)) return fit;
  if (fit.maxError > tolerance || (!start.corner && !end.corner)) return undefined;
  const segment = fit.segment;
  let { startTangent, endTangent } = request;
  for (const e of interiorExtrema(segment)) {
    const standsFor = (corner: Point): boolean => distance(e.point, corner) < MIN_POINT_SPACING_UNITS || Math.abs(e.axis === 'x' ? e.point.x - corner.x : e.point.y - corner.y) <= EXTREMUM_PROMINENCE_UNITS;
    if (start.corner && startTangent === null && standsFor(segment.p0)) startTangent = axisTangent(derivative(segment, 0), e.axis);
    else if (end.corner && endTangent === null && standsFor(segment.p3)) endTangent = axisTangent(derivative(segment, 1), e.axis);
  }
  if (startTangent === request.startTangent && endTangent === request.endTangent) return undefined;
  const turned = fitCubic({ ...request, startTangent, endTangent }, tolerance);
  return mergeable(turned, tolerance) ? turned : undefined;
}

/** The axis direction (along `d`'s sense) of the tangent at an extremum on `axis`: horizontal for a 'y' extremum, vertical for an 'x' one. */
function axisTangent(d: Vec, axis: ExtremumAxis): Vec {
  return axis === 'y' ? { x: d.x >= 0 ? 1 : -1, y: 0 } : { x: 0, y: d.y >= 0 ? 1 : -1 };
}

/** The extrema of a cubic farther than SNAP_DISTANCE_UNITS from both its ends. */
function interiorExtrema(segment: CubicSegment): ReturnType<typeof segmentExtrema> {
  return segmentExtrema(segment).filter((e) => distance(e.point, segment.p0) > SNAP_DISTANCE_UNITS && distance(e.point, segment.p3) > SNAP_DISTANCE_UNITS);
}

/** One cubic may replace several pieces: within tolerance, no interior extremum, no significant inflection, handles not crossing. */
function mergeable(fit: CubicFit, tolerance: number): boolean {
  const segment = fit.segment;
  if (fit.maxError > tolerance || handlesCross(segment)) return false;
  return interiorExtrema(segment).every((e) => e.protrusion <= MERGED_PROTRUSION_LIMIT) && !hasSignificantInflection(segment);
}

/** True when the cubic inflects with the curve turning by at least the persistence angle on both sides of the inflection. */
function hasSignificantInflection(segment: CubicSegment): boolean {
  const roots = inflectionParameters(segment);
  if (roots.length === 0) return false;
  const ts = [0, ...roots, 1];
  const angles = ts.map((t) => {
    const d = derivative(segment, t);
    return Math.atan2(d.y, d.x);
  });
  const turns = angles.slice(1).map((angle, i) => {
    let turn = angle - angles[i]!;
    while (turn > Math.PI) turn -= 2 * Math.PI;
    while (turn < -Math.PI) turn += 2 * Math.PI;
    return Math.abs(turn);
  });
  return roots.some((_, i) => turns[i]! >= INFLECTION_PERSISTENCE_RADIANS && turns[i + 1]! >= INFLECTION_PERSISTENCE_RADIANS);
}

