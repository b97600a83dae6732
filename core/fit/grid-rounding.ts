/**
 * Rounding the fitted contour to the coordinate grid (integer font units by default)
 * without breaking smooth joins, leaving the tolerance or reopening curvature steps.
 *
 * Rounding each coordinate on its own turns a smooth join into a small kink: two
 * handles 40 units long, each moved by up to half a unit, meet at up to about 1°,
 * which shows in a curvature comb and in outline checks. Rounding is therefore done
 * per on-curve point together with its two handles:
 *
 * - smooth joins with a cubic on at least one side are searched (below): axis-aligned
 *   ones (every extremum, every join with a horizontal or vertical line) keep the
 *   rounded on-curve point and handles on its axis, so they stay exactly smooth, and
 *   only the handle lengths are chosen; sloped joins between two cubics choose the
 *   on-curve point and both handles;
 * - smooth joins between a sloped line and a cubic: the line's two ends and its join
 *   handles are chosen together (alignSlopedLines) so that the line's reduced
 *   direction is short enough for a handle to lie on it exactly; where the tolerance
 *   leaves no such choice, the handle is the grid point near its ideal position that
 *   best continues the rounded line;
 * - corners: every coordinate rounded on its own, and then a corner handle whose
 *   rounding made its cubic bulge past its end points is moved by a cell
 *   (unbulgeCornerHandles).
 *
 * The search at a smooth join. A handle may slide along its tangent (up to
 * {@link HANDLE_SLIDE_CELLS} cells, and may turn by up to a cell at its tip): that is
 * the freedom that makes collinear grid triples easy to find, since lattice points lie
 * close to a line of arbitrary slope only here and there along it. The on-curve point
 * stays at its rounded position (at most half a cell from the ideal in each axis)
 * unless no acceptable triple exists there; then the 3 × 3 cells round it are tried.
 * Candidates are ranked by, in this order of priority:
 * (a) both adjacent spans within the tolerance of the chain (measured again with
 *     span-error.ts) and no new crossing handles: a hard requirement while any
 *     candidate meets it; next, no extremum protruding past the limit of extrema.ts in
 *     an adjacent span that did not have one before rounding (a candidate within the
 *     tolerance that adds one is taken only when no stage offers one that does not);
 * (b) collinearity: the turn between the two handle directions at most
 *     {@link COLLINEAR_DEGREES} (exactly 0 on axis-aligned joins), else as small as
 *     the grid allows;
 * (c) the smallest change of the curvature step |κ_in − κ_out| at this join and its two
 *     neighbours (whose end curvatures this join's handles also set), relative to the
 *     step before rounding, in the curvature scale of fairing.ts's joinCurvatures;
 * (d) the smallest displacement from the ideal positions.
 * (c) and (d) are weighed together ({@link G2_CURVATURE_WEIGHT}). Joins are searched in
 * contour order, each against its neighbours' rounded positions where those are
 * already chosen and their ideal ones otherwise, so every span is checked against its
 * final ends when its second end is chosen; a span still over the tolerance afterwards
 * has both its ends searched again once.
 *
 * Limits: the search is greedy (one join at a time), so a combination of neighbouring
 * choices that only works jointly is not found; where no candidate keeps a span
 * within the tolerance, the one with the smallest error is used and fit-contour.ts
 * fits again with a larger reserve. Sloped joins whose handles are only a few cells
 * long may have no triple within {@link COLLINEAR_DEGREES}; the smallest turn found is
 * used and the report lists the join if it exceeds the kink threshold.
 *
 * Sloped line joins are exact only where a short lattice direction lies within the
 * tolerance: a join end moved along its line costs its whole displacement in error
 * (the line and the cubic each leave the chain points past their new ends), so the
 * ends stay within about a unit of the ideal and a short direction must be there by
 * chance. Where there is none, the handle goes to a lattice point farther along the
 * rounded line that continues it within {@link NEAR_COLLINEAR_DEGREES}, under the
 * kink threshold, where the cubic still fits (its corner end's handle may move a
 * little to help). Where no such point fits either, the join slides back along its
 * line by up to a few cells, the cubic taking over the stretch the line gives up with a
 * handle longer by as much, which finds lattice points near the line's direction that
 * the short one could not (slideLineJoins); only where no slide fits does the
 * nearest-collinear handle remain. Measured on the round trip of Linux Libertine (A–Z
 * a–z 0–9, clean 1 px per unit): near-miss kinks at such joins 40 → 13 with the longer
 * handle, and all near-miss kinks 10 → 4 with the slide (rough copy 12 → 3); the font's
 * own outlines have 89.
 *
 * Lines stay exactly horizontal or vertical: their end points had equal coordinates
 * before rounding and round alike. The error against the chain is measured again.
 * Inputs are not modified.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { controlPoints, cubic, evaluate, line, type CubicSegment } from '../geometry/segment.ts';
import { boxContains } from '../geometry/bounds.ts';
import { curvature } from '../geometry/curvature.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import type { BoundaryChain } from './boundary-chain.ts';
import { G2_RELATIVE_TOLERANCE } from './fairing.ts';
import { EXTREMUM_PROTRUSION_LIMIT, segmentExtrema } from './extrema.ts';
import { handlesCross } from './finishing.ts';
import { KINK_MIN_DEGREES } from './quality-report.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { measureSpanError } from './span-error.ts';

/** Search radius (grid cells) around the ideal on-curve point when its rounded position has no acceptable triple. */
const POINT_SEARCH_RADIUS = 1;

/**
 * How far (grid cells) a handle may slide along its tangent either way (never below
 * one cell long): 3. Sliding a handle by d moves the curve by at most 4/9·d (the
 * largest Bernstein weight of an inner control point, 3t(1 − t)² at t = 1/3), so 3
 * cells is at most 1.3 units and the tolerance check decides. Measured over the
 * fit-test shapes and the round-trip subset: with 2 cells some sloped joins found no
 * triple within {@link COLLINEAR_DEGREES} (worst 0.14°), with 3 all did; 4 changed
 * nothing.
 */
const HANDLE_SLIDE_CELLS = 3;
/** A searched handle's tip may leave its ideal tangent line by up to this many cells (the tangent may turn that much). */
const HANDLE_ACROSS_CELLS = 1;
/** Handle lengths tried on each side of the rounded length at an axis-aligned join (cells). */
const AXIS_LENGTH_STEPS = 2;

/**
 * A sloped smooth join counts as collinear when its two handle directions differ by at
 * most 0.05°: a sixth of the 0.3° near-miss kink threshold (quality-report.ts), so no
 * accepted join comes near a kink warning, and small beside what the grid itself
 * does to a direction (an integer handle 40 units long points only to within about
 * 0.7° of where the fit wanted). Our own choice.
 */
export const COLLINEAR_DEGREES = 0.05;

/**
 * Weight of the relative curvature-step change (criterion c) against the displacement
 * cost (criterion d, squared cells) at a join that was G2 before rounding (step within
 * fairing.ts's G2_RELATIVE_TOLERANCE): 3, so a step of 10 % reopened there weighs as
 * much as moving the on-curve point by about half a cell; elsewhere 1 (a step that was
 * already there matters less than where the outline sits). Measured over the fit-test
 * shapes, the round-trip subset and its faired contours (median step at G2 joins
 * after rounding; 2.2 % with the old rounding): weight 1 → 2.0 %, 3 → 1.6 %,
 * 10 → 1.0 %; but 10 cost fidelity on the round trip at 0.5 px per unit, where the
 * 3-unit tolerance leaves room to trade (Cantarell Hausdorff p95 1.54 → 1.88 units;
 * 1.58 with 3). Our own choice.
 */
const G2_CURVATURE_WEIGHT = 3;
const CURVATURE_WEIGHT = 1;
/** Displacement weight of a handle against the on-curve point, (4/9)²: how much of a handle's move reaches the curve. */
const HANDLE_SHIFT_WEIGHT = 0.2;
/** Tie-break within the collinear bucket: an exactly collinear triple is preferred at equal cost by up to this much. */
const TURN_TIE_BREAK = 0.01;
/** Candidates whose spans are measured against the chain per stage of the search (the best-ranked first). */
const CHECKED_CANDIDATES = 12;
/** Parameters sampled per span for its largest |κ| (the curvature scale), as in fairing.ts. */
const SPAN_CURVATURE_SAMPLES = 33;
/** Floor of the curvature scale as a share of the largest |κ| on the adjacent spans (fairing.ts's LOW_CURVATURE_SHARE). */
const LOW_CURVATURE_SHARE = 0.1;

/** The handle positions chosen for one on-curve point. */
interface RoundedJoin {
  readonly point: Point;
  /** The handle of the arriving cubic (its p2), if that span is a cubic. */
  readonly handleIn: Point | undefined;
  /** The handle of the leaving cubic (its p1), if that span is a cubic. */
  readonly handleOut: Point | undefined;
}

/** A candidate triple with its ranking. */
interface Candidate extends RoundedJoin {
  /** 0: collinear within COLLINEAR_DEGREES (or axis-aligned); 1: not. */
  readonly bucket: 0 | 1;
  /** Turn between the handle directions, degrees. */
  readonly turn: number;
  /** Criteria (c) and (d) combined. */
  readonly cost: number;
}

/**
 * How far a control point of the contour to round may lie outside the traced
 * boundary's bounding box, as a share of the box's larger side: 1. A drawn curve's
 * handles stay near it (a cubic's curve lies in its control points' hull, and a
 * half-circle's handles stand 1/3 of its radius out); the rounding's searches run over
 * lattice points along each handle, so a handle thousands of times too long (a
 * degenerate fit, see least-squares.ts) would exhaust memory instead of failing.
 */
const CONTROL_POINT_REACH_SHARE = 1;

/** Throws a clear error when a control point of `contour` is not finite or lies far outside the chain's bounding box (see CONTROL_POINT_REACH_SHARE). */
function checkControlPoints(chain: BoundaryChain, contour: FittedContour): void {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < chain.count; i++) {
    minX = Math.min(minX, chain.xs[i]!);
    maxX = Math.max(maxX, chain.xs[i]!);
    minY = Math.min(minY, chain.ys[i]!);
    maxY = Math.max(maxY, chain.ys[i]!);
  }
  const { x: ox, y: oy } = chain.origin;
  const ink = { minX: minX + ox, minY: minY + oy, maxX: maxX + ox, maxY: maxY + oy };
  const reach = CONTROL_POINT_REACH_SHARE * Math.max(maxX - minX, maxY - minY, 1);
  for (const { segment } of contour.spans) {
    for (const p of controlPoints(segment)) {
      if (Number.isFinite(p.x) && Number.isFinite(p.y) && boxContains(ink, p, reach)) continue;
      throw new Error(
        `the fitted outline has a control point at (${p.x.toFixed(1)}, ${p.y.toFixed(1)}), far outside the traced ink (${ink.minX.toFixed(0)}…${ink.maxX.toFixed(0)} × ${ink.minY.toFixed(0)}…${ink.maxY.toFixed(0)}): fit this letter again at another tolerance, or draw the contour with Draw through points`,
      );
    }
  }
}

/**
 * The contour with every coordinate a multiple of `grid` (see the header for how
 * smooth joins are kept). Node tangents are replaced by the rounded handles'
 * directions; span errors are re-measured against the chain (exact above `tolerance`).
 * Throws when a control point lies far outside the chain (CONTROL_POINT_REACH_SHARE).
 */
export function roundToGrid(chain: BoundaryChain, contour: FittedContour, grid: number, tolerance: number, axisSnap = 0): FittedContour {
  checkControlPoints(chain, contour);
  const snap = (v: number): number => Math.round(v / grid) * grid;
  const { nodes, spans } = contour;
  const n = nodes.length;
  const ideal: RoundedJoin[] = nodes.map((node, i) => {
    const before = spans[(i - 1 + n) % n]!.segment;
    const after = spans[i]!.segment;
    return { point: node.point, handleIn: before.kind === 'cubic' ? before.p2 : undefined, handleOut: after.kind === 'cubic' ? after.p1 : undefined };
  });
  const searched = nodes.map((node, i) => searchable(node, ideal[i]!));
  // Joins that are not searched are rounded on their own; searched ones start ideal.
  const joins: RoundedJoin[] = nodes.map((node, i) => {
    if (searched[i]) return ideal[i]!;
    const before = spans[(i - 1 + n) % n]!.segment;
    const after = spans[i]!.segment;
    // A line end may move by a cell only when the line's other end is a corner (it does
    // not move with this one); two smooth ends moving independently would turn the line.
    const otherEnd = before.kind === 'line' ? nodes[(i - 1 + n) % n]! : after.kind === 'line' ? nodes[(i + 1) % n]! : undefined;
    const mayMove = otherEnd === undefined || !otherEnd.smooth;
    const { handleIn, handleOut } = ideal[i]!;
    return roundJoin(node, handleIn, handleOut, before.kind === 'line' ? before.p0 : undefined, after.kind === 'line' ? after.p1 : undefined, grid, snap, mayMove);
  });
  const search = new JoinSearch(chain, contour, ideal, joins, grid, tolerance, axisSnap);
  alignSlopedLines(contour, ideal, joins, grid, tolerance, snap, (s, segment) => search.measure(s, segment));
  for (let i = 0; i < n; i++) {
    if (!searched[i]) continue;
    joins[i] = search.choose(i);
    search.pending[i] = false;
  }
  const segmentOf = (i: number): FitSpan['segment'] => {
    const start = joins[i]!;
    const end = joins[(i + 1) % n]!;
    return spans[i]!.segment.kind === 'line' ? line(start.point, end.point) : cubic(start.point, start.handleOut!, end.handleIn!, end.point);
  };
  const errorOf = (i: number): number => search.measure(i, segmentOf(i));
  const errors = spans.map((_, i) => errorOf(i));
  // A span still over the tolerance: search both its ends again, now that all neighbours are final.
  const failing = errors.flatMap((e, i) => (e > tolerance ? [i] : []));
  for (const i of failing) {
    if (errors[i]! <= tolerance) continue;
    const ends = [i, (i + 1) % n].filter((j) => searched[j]);
    if (ends.length === 0) continue;
    for (const j of ends) joins[j] = search.choose(j);
    for (const j of ends) for (const s of [(j - 1 + n) % n, j]) errors[s] = errorOf(s);
  }
  const slidIndex = slideLineJoins(chain, contour, joins, errors, grid, tolerance, snap, search);
  unbulgeCornerHandles(contour, ideal, joins, errors, grid, tolerance, (s, segment) => search.measure(s, segment));
  const roundedSpans: FitSpan[] = spans.map((span, i) => ({ ...span, ...search.rangeOf(i), segment: segmentOf(i), maxError: errors[i]! }));
  const roundedNodes: FitNode[] = nodes.map((node, i) => ({ ...node, point: joins[i]!.point, index: slidIndex[i] ?? node.index }));
  return { nodes: roundedNodes, spans: roundedSpans };
}

/**
 * The axis direction nearest to the unit tangent t (same sense), when t is within
 * `axisSnap` radians of it; else undefined. A sloped join this close to horizontal or
 * vertical is tried on the axis first: the handles are then exactly collinear whatever
 * their lengths, and the join is an extremum with the axis-aligned handles a designer
 * expects, where the sloped handles' few lattice directions could bow a nearly straight
 * cubic past its ends (measured: a stem of Linux Libertine's k on the rough scan,
 * whose join leaned 1.9°, stuck out 0.69 unit).
 */
function nearAxis(t: Vec, axisSnap: number): Vec | undefined {
  if (!(axisSnap > 0)) return undefined;
  const offHorizontal = Math.atan2(Math.abs(t.y), Math.abs(t.x));
  if (offHorizontal <= axisSnap) return { x: Math.sign(t.x), y: 0 };
  if (Math.PI / 2 - offHorizontal <= axisSnap) return { x: 0, y: Math.sign(t.y) };
  return undefined;
}

/** A smooth join with a tangent and a cubic on at least one side, axis-aligned or between two cubics. */
function searchable(node: FitNode, join: RoundedJoin): boolean {
  const t = node.smooth ? node.tangentOut : null;
  if (!t || (join.handleIn === undefined && join.handleOut === undefined)) return false;
  if (t.x === 0 || t.y === 0) return true;
  return join.handleIn !== undefined && join.handleOut !== undefined;
}

/** End curvature of a cubic at its start, from its first three control points (Farin: κ(0) = (2/3)·(P1 − P0) × (P2 − P1) / |P1 − P0|³). */
function startCurvature(p0: Point, p1: Point, p2: Point): number {
  const ax = p1.x - p0.x;
  const ay = p1.y - p0.y;
  const l = Math.hypot(ax, ay);
  return (2 / 3) * (ax * (p2.y - p1.y) - ay * (p2.x - p1.x)) / (l * l * l);
}

/** End curvature of a cubic at its end: κ(1) = (2/3)·(P2 − P1) × (P3 − P2) / |P3 − P2|³. */
function endCurvature(p1: Point, p2: Point, p3: Point): number {
  const bx = p3.x - p2.x;
  const by = p3.y - p2.y;
  const l = Math.hypot(bx, by);
  return (2 / 3) * ((p2.x - p1.x) * by - (p2.y - p1.y) * bx) / (l * l * l);
}

/**
 * The search of the header for one smooth join at a time, against the current choice
 * at every other join (`joins`, updated by the caller).
 */
class JoinSearch {
  private readonly n: number;
  /** Per node: whether its curvature step counts (smooth, a cubic on a side). */
  private readonly counts: boolean[];
  /** Per node: |κ_in − κ_out| before rounding, and the scale it is measured in. */
  private readonly stepBefore: number[];
  private readonly scale: number[];
  /** Per span: whether its handles crossed before rounding (a crossing is then not held against a candidate). */
  private readonly crossedBefore: boolean[];
  /** Per span: whether an extremum inside it protruded past the limit before rounding (a protrusion is then not held against a candidate). */
  private readonly protrudedBefore: boolean[];
  /**
   * Per node: searched but not chosen yet. A span with such an end is not measured while
   * choosing its other end (it is measured when that end is chosen), which halves the
   * measuring; the repair pass in roundToGrid catches what this misses.
   */
  readonly pending: boolean[];
  /** Per span: errors already measured, by segment. */
  private readonly measured: Map<string, number>[];
  /** Per span: the chain range it is measured over, where a slid join moved it (slideLineJoins). */
  private readonly ranges: ({ readonly first: number; readonly last: number } | undefined)[];

  constructor(
    private readonly chain: BoundaryChain,
    private readonly contour: FittedContour,
    private readonly ideal: readonly RoundedJoin[],
    private readonly joins: readonly RoundedJoin[],
    private readonly grid: number,
    private readonly tolerance: number,
    private readonly axisSnap: number,
  ) {
    const { nodes, spans } = contour;
    const n = nodes.length;
    this.n = n;
    const peaks = spans.map((span) => {
      if (span.segment.kind !== 'cubic') return 0;
      let peak = 0;
      for (let k = 0; k < SPAN_CURVATURE_SAMPLES; k++) {
        const value = Math.abs(curvature(span.segment, k / (SPAN_CURVATURE_SAMPLES - 1)));
        if (value > peak) peak = value;
      }
      return peak;
    });
    this.crossedBefore = spans.map((span) => span.segment.kind === 'cubic' && handlesCross(span.segment));
    this.protrudedBefore = spans.map((span) => protrudes(span.segment));
    this.pending = nodes.map((node, i) => searchable(node, ideal[i]!));
    this.measured = spans.map(() => new Map());
    this.ranges = spans.map(() => undefined);
    this.counts = [];
    this.stepBefore = [];
    this.scale = [];
    nodes.forEach((node, i) => {
      const before = spans[(i - 1 + n) % n]!.segment;
      const after = spans[i]!.segment;
      const kIn = before.kind === 'cubic' ? endCurvature(before.p1, before.p2, before.p3) : 0;
      const kOut = after.kind === 'cubic' ? startCurvature(after.p0, after.p1, after.p2) : 0;
      const peak = Math.max(peaks[(i - 1 + n) % n]!, peaks[i]!);
      const scale = before.kind === 'cubic' && after.kind === 'cubic' ? Math.max(Math.abs(kIn), Math.abs(kOut), LOW_CURVATURE_SHARE * peak) : peak;
      this.counts.push(node.smooth && (before.kind === 'cubic' || after.kind === 'cubic') && scale > 0 && Number.isFinite(scale));
      this.stepBefore.push(Math.abs(kIn - kOut));
      this.scale.push(scale);
    });
  }

  /** The chosen triple at smooth join i. */
  choose(i: number): RoundedJoin {
    const node = this.contour.nodes[i]!;
    const t = node.tangentOut as Vec;
    const { grid } = this;
    const p = node.point;
    const rounded = { x: Math.round(p.x / grid) * grid, y: Math.round(p.y / grid) * grid };
    const axis = t.x === 0 || t.y === 0;
    const onAxis = axis ? undefined : nearAxis(t, this.axisSnap);
    const stages: (() => Candidate[])[] = axis
      ? [() => this.axisCandidates(i, rounded, t)]
      : [
          ...(onAxis ? [() => this.axisCandidates(i, rounded, onAxis)] : []),
          () => this.slopedCandidates(i, [rounded], t, 0),
          () => this.slopedCandidates(i, this.ring(rounded), t, 0),
          () => this.slopedCandidates(i, [rounded, ...this.ring(rounded)], t, 1),
        ];
    let fallback: { candidate: Candidate; error: number } | undefined;
    // Within the tolerance, but with an extremum its unrounded spans did not have: kept only if no stage offers better.
    let protruding: Candidate | undefined;
    for (const stage of stages) {
      const candidates = stage().sort(compareCandidates);
      for (const candidate of candidates.slice(0, CHECKED_CANDIDATES)) {
        const { error, newExtremum } = this.spanErrors(i, candidate);
        if (error <= this.tolerance && !newExtremum) return candidate;
        if (error <= this.tolerance) {
          protruding ??= candidate;
          continue;
        }
        if (!fallback || (candidate.bucket < fallback.candidate.bucket) || (candidate.bucket === fallback.candidate.bucket && error < fallback.error)) fallback = { candidate, error };
      }
    }
    if (protruding) return protruding;
    if (fallback) return fallback.candidate;
    // Nothing to choose from (degenerate handles): round each coordinate.
    const j = this.ideal[i]!;
    const roundPoint = (q: Point | undefined): Point | undefined => q && { x: Math.round(q.x / grid) * grid, y: Math.round(q.y / grid) * grid };
    return { point: rounded, handleIn: roundPoint(j.handleIn), handleOut: roundPoint(j.handleOut) };
  }

  /** The 8 grid points round q within POINT_SEARCH_RADIUS cells. */
  private ring(q: Point): Point[] {
    const out: Point[] = [];
    for (let a = -POINT_SEARCH_RADIUS; a <= POINT_SEARCH_RADIUS; a++) {
      for (let b = -POINT_SEARCH_RADIUS; b <= POINT_SEARCH_RADIUS; b++) if (a !== 0 || b !== 0) out.push({ x: q.x + a * this.grid, y: q.y + b * this.grid });
    }
    return out;
  }

  /** Axis-aligned join: the rounded point, handles on its axis with a few lengths each. */
  private axisCandidates(i: number, q: Point, t: Vec): Candidate[] {
    const { grid } = this;
    const j = this.ideal[i]!;
    const p = j.point;
    const lengths = (h: Point | undefined, sign: number): (Point | undefined)[] => {
      if (!h) return [undefined];
      const along = ((h.x - p.x) * t.x + (h.y - p.y) * t.y) * sign;
      const base = Math.round(along / grid);
      const out: Point[] = [];
      for (let k = -AXIS_LENGTH_STEPS; k <= AXIS_LENGTH_STEPS; k++) {
        const cells = base + k;
        if (cells < 1) continue;
        out.push({ x: q.x + sign * t.x * cells * grid, y: q.y + sign * t.y * cells * grid });
      }
      return out;
    };
    const candidates: Candidate[] = [];
    for (const hIn of lengths(j.handleIn, -1)) {
      for (const hOut of lengths(j.handleOut, 1)) candidates.push({ point: q, handleIn: hIn, handleOut: hOut, bucket: 0, turn: 0, cost: this.cost(i, q, hIn, hOut) });
    }
    return candidates;
  }

  /**
   * Sloped join between two cubics, for each on-curve point q in `points`: every
   * lattice point near the shorter handle's ideal position (sliding along the tangent
   * and turning by up to a cell at its tip), each paired with the lattice points along
   * the opposite ray within the longer handle's slide range. A direction the short
   * handle can take is coarse; the long one can follow it closely, since lattice
   * points lie within 1/(2|w|) cells of any line through q with primitive direction w.
   * Bucket 0: the pairs within COLLINEAR_DEGREES (exactly collinear ones included);
   * bucket 1: the nearest-direction pair for each short-handle position.
   */
  private slopedCandidates(i: number, points: readonly Point[], t: Vec, bucket: 0 | 1): Candidate[] {
    const { grid } = this;
    const j = this.ideal[i]!;
    const p = j.point;
    const inLength = Math.hypot(j.handleIn!.x - p.x, j.handleIn!.y - p.y);
    const outLength = Math.hypot(j.handleOut!.x - p.x, j.handleOut!.y - p.y);
    const shortIsIn = inLength <= outLength;
    const shortLength = shortIsIn ? inLength : outLength;
    const longLength = shortIsIn ? outLength : inLength;
    const toShort = shortIsIn ? { x: -t.x, y: -t.y } : t;
    const candidates: Candidate[] = [];
    for (const q of points) {
      for (const s of this.handleWindow(q, toShort, shortLength)) {
        // The long handle lies on the ray from q away from the short one.
        const sx = s.x - q.x;
        const sy = s.y - q.y;
        const sl = Math.hypot(sx, sy);
        const away = { x: -sx / sl, y: -sy / sl };
        let nearest: { h: Point; turn: number } | undefined;
        for (const h of this.pointsAlongRay(q, away, longLength)) {
          // Turn between the two handle directions, exactly 0 for an exactly collinear grid triple.
          const lx = Math.round((h.x - q.x) / grid);
          const ly = Math.round((h.y - q.y) / grid);
          const cx = Math.round(sx / grid);
          const cy = Math.round(sy / grid);
          const turn = (Math.atan2(Math.abs(cx * ly - cy * lx), -(cx * lx + cy * ly)) * 180) / Math.PI;
          if (bucket === 0) {
            if (turn > COLLINEAR_DEGREES) continue;
            candidates.push(this.sloped(i, q, shortIsIn ? s : h, shortIsIn ? h : s, 0, turn));
          } else if (turn > COLLINEAR_DEGREES && (!nearest || turn < nearest.turn)) nearest = { h, turn };
        }
        if (nearest) candidates.push(this.sloped(i, q, shortIsIn ? s : nearest.h, shortIsIn ? nearest.h : s, 1, nearest.turn));
      }
    }
    return candidates;
  }

  private sloped(i: number, q: Point, handleIn: Point, handleOut: Point, bucket: 0 | 1, turn: number): Candidate {
    const cost = this.cost(i, q, handleIn, handleOut) + (bucket === 0 ? (TURN_TIE_BREAK * turn) / COLLINEAR_DEGREES : 0);
    return { point: q, handleIn, handleOut, bucket, turn, cost };
  }

  /** The slide range of a handle of ideal length `length`: never shorter than a cell. */
  private slideRange(length: number): [number, number] {
    const slide = HANDLE_SLIDE_CELLS * this.grid;
    return [Math.max(this.grid, length - slide), length + slide];
  }

  /** Lattice points h with (h − q)·direction within the slide range of `length` and at most HANDLE_ACROSS_CELLS from the ray. */
  private handleWindow(q: Point, direction: Vec, length: number): Point[] {
    const { grid } = this;
    const [lo, hi] = this.slideRange(length);
    const across = HANDLE_ACROSS_CELLS * grid;
    const nx = -direction.y;
    const ny = direction.x;
    const xs = [direction.x * lo + nx * across, direction.x * lo - nx * across, direction.x * hi + nx * across, direction.x * hi - nx * across];
    const ys = [direction.y * lo + ny * across, direction.y * lo - ny * across, direction.y * hi + ny * across, direction.y * hi - ny * across];
    const out: Point[] = [];
    for (let gx = Math.ceil((q.x + Math.min(...xs)) / grid); gx * grid <= q.x + Math.max(...xs); gx++) {
      for (let gy = Math.ceil((q.y + Math.min(...ys)) / grid); gy * grid <= q.y + Math.max(...ys); gy++) {
        const vx = gx * grid - q.x;
        const vy = gy * grid - q.y;
        const along = vx * direction.x + vy * direction.y;
        if (along < lo || along > hi || Math.abs(direction.x * vy - direction.y * vx) > across) continue;
        out.push({ x: gx * grid, y: gy * grid });
      }
    }
    return out;
  }

  /** The two lattice points straddling the ray q + λ·direction at each lattice column (or row) crossed within the slide range of `length`. */
  private pointsAlongRay(q: Point, direction: Vec, length: number): Point[] {
    const { grid } = this;
    const [lo, hi] = this.slideRange(length);
    const major = Math.abs(direction.x) >= Math.abs(direction.y) ? 'x' : 'y';
    const minor = major === 'x' ? 'y' : 'x';
    const a = q[major] + direction[major] * lo;
    const b = q[major] + direction[major] * hi;
    const out: Point[] = [];
    for (let g = Math.ceil(Math.min(a, b) / grid); g * grid <= Math.max(a, b); g++) {
      const m = g * grid;
      const lambda = (m - q[major]) / direction[major];
      const c = (q[minor] + direction[minor] * lambda) / grid;
      for (const k of Math.floor(c) === Math.ceil(c) ? [c] : [Math.floor(c), Math.ceil(c)]) {
        out.push(major === 'x' ? { x: m, y: k * grid } : { x: k * grid, y: m });
      }
    }
    return out;
  }

  /**
   * Criteria (c) and (d): the curvature-step change at join i and its neighbours, and
   * the displacement from the ideal positions, for the triple (q, hIn, hOut) with every
   * other join as currently chosen.
   */
  private cost(i: number, q: Point, hIn: Point | undefined, hOut: Point | undefined): number {
    const { n, joins, grid } = this;
    const prev = (i - 1 + n) % n;
    const next = (i + 1) % n;
    // With a single node the neighbours are the join itself.
    const P: RoundedJoin = prev === i ? { point: q, handleIn: hIn, handleOut: hOut } : joins[prev]!;
    const N: RoundedJoin = next === i ? P : joins[next]!;
    let curvatureCost = 0;
    if (this.counts[i]) curvatureCost += this.stepChange(i, hIn ? endCurvature(P.handleOut!, hIn, q) : 0, hOut ? startCurvature(q, hOut, N.handleIn!) : 0);
    if (hIn && prev !== i && this.counts[prev]) {
      const PP = joins[(prev - 1 + n) % n]!;
      const prevIn = P.handleIn ? endCurvature(PP.handleOut!, P.handleIn, P.point) : 0;
      curvatureCost += this.stepChange(prev, prevIn, startCurvature(P.point, P.handleOut!, hIn));
    }
    if (hOut && next !== i && next !== prev && this.counts[next]) {
      const NN = joins[(next + 1) % n]!;
      const nextOut = N.handleOut ? startCurvature(N.point, N.handleOut, NN.handleIn!) : 0;
      curvatureCost += this.stepChange(next, endCurvature(hOut, N.handleIn!, N.point), nextOut);
    }
    if (!Number.isFinite(curvatureCost)) curvatureCost = 1e6;
    const j = this.ideal[i]!;
    const displacement = squaredDistance(q, j.point) + HANDLE_SHIFT_WEIGHT * (squaredDistance(hIn, j.handleIn) + squaredDistance(hOut, j.handleOut));
    return curvatureCost + displacement / (grid * grid);
  }

  /** Change of the curvature step at node k, relative to its scale, for the end curvatures given. */
  private stepChange(k: number, kIn: number, kOut: number): number {
    const before = this.stepBefore[k]!;
    const scale = this.scale[k]!;
    const weight = before <= G2_RELATIVE_TOLERANCE * scale ? G2_CURVATURE_WEIGHT : CURVATURE_WEIGHT;
    return (weight * Math.abs(Math.abs(kIn - kOut) - before)) / scale;
  }

  /** measureSpanError for span s with the given segment, remembered. */
  measure(s: number, segment: FitSpan['segment']): number {
    const key = segment.kind === 'line' ? `${segment.p0.x},${segment.p0.y},${segment.p1.x},${segment.p1.y}` : `${segment.p0.x},${segment.p0.y},${segment.p1.x},${segment.p1.y},${segment.p2.x},${segment.p2.y},${segment.p3.x},${segment.p3.y}`;
    const known = this.measured[s]!.get(key);
    if (known !== undefined) return known;
    const { first, last } = this.rangeOf(s);
    const error = measureSpanError(this.chain, segment, first, last, this.tolerance);
    this.measured[s]!.set(key, error);
    return error;
  }

  /** The chain range span s is measured over. */
  rangeOf(s: number): { readonly first: number; readonly last: number } {
    return this.ranges[s] ?? this.contour.spans[s]!;
  }

  /** Span s is measured over [first, last] from now on (a join at its end slid along a line). */
  setRange(s: number, first: number, last: number): void {
    this.ranges[s] = { first, last };
    this.measured[s]!.clear();
  }

  /**
   * The larger error of the two spans next to join i with the candidate in place
   * (Infinity when a candidate makes handles cross that did not before), and whether
   * it gives either span an extremum protruding past the limit that it did not have
   * before rounding: the outline check would report one there (an end not chosen yet
   * counts at its ideal position).
   */
  private spanErrors(i: number, candidate: RoundedJoin): { error: number; newExtremum: boolean } {
    const { n, joins, tolerance } = this;
    const prev = (i - 1 + n) % n;
    const next = (i + 1) % n;
    const at = (k: number): RoundedJoin => (k === i ? candidate : joins[k]!);
    let worst = 0;
    let newExtremum = false;
    const check = (s: number, segment: CubicSegment, otherEnd: number): void => {
      if (worst > tolerance) return;
      if (!this.crossedBefore[s] && handlesCross(segment)) {
        worst = Infinity;
        return;
      }
      if (!this.protrudedBefore[s] && protrudes(segment)) newExtremum = true;
      if (otherEnd !== i && this.pending[otherEnd]) return;
      worst = Math.max(worst, this.measure(s, segment));
    };
    if (candidate.handleIn) check(prev, cubic(at(prev).point, at(prev).handleOut!, candidate.handleIn, candidate.point), prev);
    if (candidate.handleOut) check(i, cubic(candidate.point, candidate.handleOut, at(next).handleIn!, at(next).point), next);
    return { error: worst, newExtremum };
  }
}

/** Whether a cubic has an extremum inside it protruding past EXTREMUM_PROTRUSION_LIMIT (extrema.ts), which the outline check reports. */
function protrudes(segment: FitSpan['segment']): boolean {
  return segment.kind === 'cubic' && segmentExtrema(segment).some((e) => e.protrusion > EXTREMUM_PROTRUSION_LIMIT);
}

function squaredDistance(a: Point | undefined, b: Point | undefined): number {
  return a && b ? (a.x - b.x) ** 2 + (a.y - b.y) ** 2 : 0;
}

function compareCandidates(a: Candidate, b: Candidate): number {
  if (a.bucket !== b.bucket) return a.bucket - b.bucket;
  if (a.bucket === 1 && a.turn !== b.turn) return a.turn - b.turn;
  return a.cost - b.cost;
}

/** Search radius (cells) round the rounded ideal position of a line end at a sloped line–cubic join, when the line's ends are chosen together (alignSlopedLines). */
const LINE_JOIN_RADIUS = 2;
/** Search radius (cells) of a line end at a corner there: a corner moved by a cell is still within the round trip's 4-unit corner match, and the spans it ends are measured again. */
const LINE_CORNER_RADIUS = 1;
/** Weight of moving a corner end of such a line against moving its join end (squared cells): the join end is preferred, since a corner is where a designer looks first. */
const CORNER_MOVE_WEIGHT = 2;
/** Candidates per line whose spans are measured against the chain (the best-ranked first). */
const CHECKED_LINE_CANDIDATES = 16;

/** Greatest common divisor of two non-negative integers. */
function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

/** A smooth join with a sloped tangent between a line and a cubic. */
function isLineCubicJoin(node: FitNode, before: FitSpan['segment'], after: FitSpan['segment']): boolean {
  const t = node.smooth ? node.tangentOut : null;
  if (!t || t.x === 0 || t.y === 0) return false;
  return (before.kind === 'line' && after.kind === 'cubic') || (before.kind === 'cubic' && after.kind === 'line');
}

/** Handles rounded on their own (a corner, or a smooth node with no tangent): nothing else depends on them. */
function independentHandles(node: FitNode): boolean {
  return !node.smooth || !node.tangentOut;
}

/** One candidate for a sloped line's rounded ends: the two joins it sets, and its cost. */
interface LineCandidate {
  readonly start: RoundedJoin;
  readonly end: RoundedJoin;
  readonly cost: number;
}

/**
 * Sloped lines with a smooth line–cubic join at one end or both: the line's rounded
 * ends and the join handles are chosen together, so that each join is exactly
 * collinear on the grid (integer cross product 0).
 *
 * A grid point H continues the line A′B′ exactly only if H − B′ is a multiple of the
 * reduced direction d = (B′ − A′)/gcd(B′ − A′): the lattice points on a line of
 * primitive direction d lie |d| apart. Rounding the ends on their own usually gives a
 * d longer than the handle (d is the whole line when the gcd is 1), and the nearest
 * lattice point to the handle then turns by up to a few degrees. So the ends are
 * searched (join ends within {@link LINE_JOIN_RADIUS} cells of their rounding, corner
 * ends within {@link LINE_CORNER_RADIUS} where the spans they also end can be measured
 * again, other ends fixed); every pair gives a direction d, and each join's handle is
 * put at E′ ± k·d, k ≥ 1, the multiple nearest its ideal position. The pairs are the
 * rational directions near the line's (the best approximations with small |d| among
 * them, in the sense of Farey sequences, are those with a short d): a window of
 * ±2 cells at a join end reaches directions with |d| up to about 4–5 cells at any
 * slope. Candidates are ranked by displacement from the ideal positions (join ends
 * weigh 1, corner ends {@link CORNER_MOVE_WEIGHT}, handles HANDLE_SHIFT_WEIGHT) and
 * the best {@link CHECKED_LINE_CANDIDATES} are measured: the line, each join's cubic,
 * and the other span of a moved corner must stay within the tolerance (span-error.ts)
 * with no new crossing handles. The first that does is used; otherwise the joins keep
 * roundJoin's nearest-collinear handle (recomputed against the line's final ends).
 *
 * Lines are taken in contour order and each end is settled by the first line that
 * reaches it, so a corner shared by two lines is chosen by the first and fixed for the
 * second. A corner whose other span is a line may move only where that line's far end
 * is a corner or a line–cubic join still to be settled (which then follows it);
 * otherwise moving it would turn an axis-aligned line or one already settled.
 *
 * `joins` is updated in place; searched joins (JoinSearch) not yet chosen sit at their
 * ideal positions, so a cubic from a line join to one of them is measured against the
 * ideal end and measured again when that end is chosen.
 */
function alignSlopedLines(contour: FittedContour, ideal: readonly RoundedJoin[], joins: RoundedJoin[], grid: number, tolerance: number, snap: (v: number) => number, measure: (s: number, segment: FitSpan['segment']) => number): void {
  const { nodes, spans } = contour;
  const n = nodes.length;
  if (n < 3) return;
  const prevOf = (i: number): number => (i - 1 + n) % n;
  const nextOf = (i: number): number => (i + 1) % n;
  const lineJoin = nodes.map((node, i) => isLineCubicJoin(node, spans[prevOf(i)]!.segment, spans[i]!.segment));
  const settled = nodes.map(() => false);
  const onGrid = (q: Point): boolean => Number.isInteger(q.x / grid) && Number.isInteger(q.y / grid);
  for (let s = 0; s < n; s++) {
    const fitted = spans[s]!.segment;
    if (fitted.kind !== 'line') continue;
    const a = s;
    const b = nextOf(s);
    if (!(lineJoin[a] && !settled[a]) && !(lineJoin[b] && !settled[b])) continue;
    if (fitted.p0.x === fitted.p1.x || fitted.p0.y === fitted.p1.y) continue;
    // The span on the other side of each end, and the node at its far end.
    const otherSpan = (e: number): number => (e === a ? prevOf(a) : b);
    const farEnd = (e: number): number => (e === a ? prevOf(a) : nextOf(b));
    const radiusOf = (e: number): number => {
      if (settled[e]) return 0;
      if (lineJoin[e]) return LINE_JOIN_RADIUS;
      if (!independentHandles(nodes[e]!)) return 0;
      const o = spans[otherSpan(e)]!.segment;
      if (o.kind === 'cubic') return LINE_CORNER_RADIUS;
      const far = farEnd(e);
      if (o.kind !== 'line' || o.p0.x === o.p1.x || o.p0.y === o.p1.y || far === a || far === b) return 0;
      return independentHandles(nodes[far]!) || (lineJoin[far] && !settled[far]) ? LINE_CORNER_RADIUS : 0;
    };
    const ra = radiusOf(a);
    const rb = radiusOf(b);
    const centre = (e: number, r: number): Point => (r > 0 ? { x: snap(nodes[e]!.point.x), y: snap(nodes[e]!.point.y) } : joins[e]!.point);
    const ca = centre(a, ra);
    const cb = centre(b, rb);
    if (!onGrid(ca) || !onGrid(cb)) continue;
    const moveWeight = (e: number, r: number): number => (r === 0 ? 0 : lineJoin[e] ? 1 : CORNER_MOVE_WEIGHT);
    const wa = moveWeight(a, ra);
    const wb = moveWeight(b, rb);
    const fx = fitted.p1.x - fitted.p0.x;
    const fy = fitted.p1.y - fitted.p0.y;
    // Handle positions on the ray E′ + k·dir nearest the ideal handle h (k ≥ 1, up to
    // two), with a length within the slide range of the ideal one: the span error is
    // measured from the chain to the curve only, so a handle far too long (a loop past
    // the chain) must be ruled out here.
    const slide = HANDLE_SLIDE_CELLS * grid;
    const handlesOnRay = (e: Point, dir: Vec, h: Point, p: Point): Point[] => {
      const step = Math.hypot(dir.x, dir.y);
      const length = Math.hypot(h.x - p.x, h.y - p.y);
      const k = ((h.x - e.x) * dir.x + (h.y - e.y) * dir.y) / (step * step);
      const ks = [...new Set([Math.max(1, Math.floor(k)), Math.max(1, Math.ceil(k))])];
      return ks.filter((m) => m * step >= Math.max(grid, length - slide) && m * step <= length + slide).map((m) => ({ x: e.x + m * dir.x, y: e.y + m * dir.y }));
    };
    const candidates: LineCandidate[] = [];
    for (let ax = -ra; ax <= ra; ax++) {
      for (let ay = -ra; ay <= ra; ay++) {
        const A = { x: ca.x + ax * grid, y: ca.y + ay * grid };
        const costA = (wa * squaredDistance(A, nodes[a]!.point)) / (grid * grid);
        for (let bx = -rb; bx <= rb; bx++) {
          for (let by = -rb; by <= rb; by++) {
            const B = { x: cb.x + bx * grid, y: cb.y + by * grid };
            const vx = Math.round((B.x - A.x) / grid);
            const vy = Math.round((B.y - A.y) / grid);
            if (vx * fx + vy * fy <= 0) continue;
            const g = gcd(Math.abs(vx), Math.abs(vy));
            const d = { x: (vx / g) * grid, y: (vy / g) * grid };
            const base = costA + (wb * squaredDistance(B, nodes[b]!.point)) / (grid * grid);
            const hAs = lineJoin[a] && ra > 0 ? handlesOnRay(A, { x: -d.x, y: -d.y }, ideal[a]!.handleIn!, nodes[a]!.point) : [joins[a]!.handleIn];
            const hBs = lineJoin[b] && rb > 0 ? handlesOnRay(B, d, ideal[b]!.handleOut!, nodes[b]!.point) : [joins[b]!.handleOut];
            // The line itself first: it is cheap to measure and decides most pairs.
            if (hAs.length === 0 || hBs.length === 0 || measure(s, line(A, B)) > tolerance) continue;
            for (const hA of hAs) {
              for (const hB of hBs) {
                const cost = base + (HANDLE_SHIFT_WEIGHT * (squaredDistance(hA, ideal[a]!.handleIn) + squaredDistance(hB, ideal[b]!.handleOut))) / (grid * grid);
                candidates.push({ start: { point: A, handleIn: hA, handleOut: joins[a]!.handleOut }, end: { point: B, handleIn: joins[b]!.handleIn, handleOut: hB }, cost });
              }
            }
          }
        }
      }
    }
    candidates.sort((x, y) => x.cost - y.cost);
    const accepted = candidates.slice(0, CHECKED_LINE_CANDIDATES).find((c) => lineCandidateFits(c));
    if (accepted) {
      joins[a] = accepted.start;
      joins[b] = accepted.end;
    } else {
      // No exact direction within reach: a handle farther along the rounded line that
      // continues it within the kink threshold, where its cubic still fits; else the
      // nearest-collinear handle, against the line's ends as they now stand.
      for (const e of [a, b]) {
        if (!lineJoin[e] || settled[e]) continue;
        const far = longHandleOnLine(e, e === a ? joins[b]!.point : joins[a]!.point);
        if (far) {
          joins[e] = far;
          continue;
        }
        const other = e === a ? b : a;
        const { handleIn, handleOut } = ideal[e]!;
        joins[e] = roundJoin(nodes[e]!, handleIn, handleOut, e === b ? joins[a]!.point : undefined, e === a ? joins[b]!.point : undefined, grid, snap, !nodes[other]!.smooth);
      }
    }
    settled[a] = true;
    settled[b] = true;

    /**
     * The join `e` of this line with its handle on the lattice point that continues the
     * line from `lineEnd` (its other end) within {@link NEAR_COLLINEAR_DEGREES}, at a
     * length within {@link LONG_HANDLE_MIN_SHARE}–{@link LONG_HANDLE_MAX_SHARE} of the
     * ideal (or out to {@link LONG_HANDLE_MIN_REACH_CELLS}), nearest the ideal length among those whose cubic stays within the
     * tolerance of the chain and of its unrounded self, crosses no handles and adds no
     * extremum; undefined when there is none.
     */
    function longHandleOnLine(e: number, lineEnd: Point): RoundedJoin | undefined {
      const point = joins[e]!.point;
      const incoming = e === a; // the cubic arrives at the line's start
      const cubicSpan = incoming ? prevOf(e) : e;
      const fittedCubic = spans[cubicSpan]!.segment;
      if (fittedCubic.kind !== 'cubic') return undefined;
      const idealHandle = (incoming ? ideal[e]!.handleIn : ideal[e]!.handleOut) as Point;
      const idealLength = Math.hypot(idealHandle.x - nodes[e]!.point.x, idealHandle.y - nodes[e]!.point.y);
      // The handle continues the line beyond the join: away from the line's other end.
      const lx = point.x - lineEnd.x;
      const ly = point.y - lineEnd.y;
      const ll = Math.hypot(lx, ly);
      if (ll === 0 || idealLength === 0) return undefined;
      const ux = lx / ll;
      const uy = ly / ll;
      const maxSine = Math.sin((NEAR_COLLINEAR_DEGREES * Math.PI) / 180);
      const found: { handle: Point; miss: number }[] = [];
      const first = Math.max(1, Math.floor((LONG_HANDLE_MIN_SHARE * idealLength) / grid));
      const last = Math.ceil(Math.max(LONG_HANDLE_MAX_SHARE * idealLength, LONG_HANDLE_MIN_REACH_CELLS * grid) / grid);
      const lengths = Array.from({ length: last - first + 1 }, (_, i) => (first + i) * grid);
      for (const c of latticeAlongRay(point, { x: ux, y: uy }, lengths, grid, snap)) {
        if (c.sine > maxSine) continue;
        if (found.some((f) => f.handle.x === c.handle.x && f.handle.y === c.handle.y)) continue;
        found.push({ handle: c.handle, miss: Math.abs(c.length - idealLength) });
      }
      found.sort((x, y) => x.miss - y.miss);
      const limit = Math.max(0, ...segmentExtrema(fittedCubic).map((x) => x.protrusion), EXTREMUM_PROTRUSION_LIMIT);
      // The cubic's far end: where it is a corner (its handle depends on nothing else),
      // that handle may move a few cells to take up the longer handle's change of shape.
      const farIndex = incoming ? cubicSpan : nextOf(e);
      const farJoin = joins[farIndex]!;
      const farHandle = (incoming ? farJoin.handleOut : farJoin.handleIn) as Point;
      const farFree = independentHandles(nodes[farIndex]!) && farIndex !== a && farIndex !== b;
      const offsets: Point[] = [{ x: 0, y: 0 }];
      if (farFree) {
        for (let dx = -FAR_HANDLE_CELLS; dx <= FAR_HANDLE_CELLS; dx++) for (let dy = -FAR_HANDLE_CELLS; dy <= FAR_HANDLE_CELLS; dy++) if (dx !== 0 || dy !== 0) offsets.push({ x: dx * grid, y: dy * grid });
      }
      for (const { handle } of found.slice(0, CHECKED_LINE_CANDIDATES)) {
        let best: { error: number; far: Point } | undefined;
        for (const o of offsets) {
          const far = { x: farHandle.x + o.x, y: farHandle.y + o.y };
          if (far.x === farJoin.point.x && far.y === farJoin.point.y) continue;
          const candidate = incoming ? cubic(farJoin.point, far, handle, point) : cubic(point, handle, far, farJoin.point);
          if (handlesCross(candidate) && !handlesCross(fittedCubic)) continue;
          if (segmentExtrema(candidate).some((x) => x.protrusion > limit)) continue;
          if (deviationFrom(candidate, fittedCubic) > tolerance) continue;
          const error = measure(cubicSpan, candidate);
          if (error <= tolerance && (!best || error < best.error)) best = { error, far };
          if (best && o.x === 0 && o.y === 0) break; // the far handle as it stands already fits
        }
        if (!best) continue;
        if (best.far !== farHandle) joins[farIndex] = incoming ? { ...farJoin, handleOut: best.far } : { ...farJoin, handleIn: best.far };
        return incoming ? { point, handleIn: handle, handleOut: joins[e]!.handleOut } : { point, handleIn: joins[e]!.handleIn, handleOut: handle };
      }
      return undefined;
    }

    function lineCandidateFits(c: LineCandidate): boolean {
      const at = (k: number): RoundedJoin => (k === a ? c.start : k === b ? c.end : joins[k]!);
      const segmentAt = (k: number): FitSpan['segment'] => {
        const p = at(k);
        const q = at(nextOf(k));
        return spans[k]!.segment.kind === 'line' ? line(p.point, q.point) : cubic(p.point, p.handleOut!, q.handleIn!, q.point);
      };
      const touched = [s];
      for (const e of [a, b]) {
        const moved = at(e).point.x !== joins[e]!.point.x || at(e).point.y !== joins[e]!.point.y;
        if (lineJoin[e] || moved) touched.push(otherSpan(e));
      }
      for (const k of touched) {
        const segment = segmentAt(k);
        if (segment.kind === 'cubic') {
          if ((segment.p1.x === segment.p0.x && segment.p1.y === segment.p0.y) || (segment.p2.x === segment.p3.x && segment.p2.y === segment.p3.y)) return false;
          if (handlesCross(segment) && !(spans[k]!.segment.kind === 'cubic' && handlesCross(spans[k]!.segment as CubicSegment))) return false;
        }
        if (measure(k, segment) > tolerance) return false;
      }
      return true;
    }
  }
}

/**
 * Farthest slide of a line–cubic join back along its line (cells), and at most this
 * share of the line: 16 cells, a quarter. The cubic takes over the straight stretch the
 * line gives up, which its handle along the line follows closely, and a handle longer by
 * the slide finds lattice points near the line's direction that the short one could
 * not (they lie, on average, 230/L units apart at length L, see
 * {@link NEAR_COLLINEAR_DEGREES}).
 */
const MAX_SLIDE_CELLS = 16;
const MAX_SLIDE_SHARE = 0.25;
/** Candidate positions measured against the chain per join (nearest the join first). */
const CHECKED_SLIDES = 24;
/** Samples of a slid cubic compared with the stretch of line and the cubic it replaces. */
const SLIDE_DEVIATION_SAMPLES = 32;

/**
 * Sloped line–cubic joins that rounding left turning by more than
 * {@link NEAR_COLLINEAR_DEGREES}, slid back along their line: the join point moves to a
 * lattice point within a cell of the line, up to {@link MAX_SLIDE_CELLS} cells back, and
 * the cubic's handle to a lattice point that continues the line from there within
 * {@link NEAR_COLLINEAR_DEGREES}. The traced points of the stretch given up move from
 * the line's span to the cubic's. A slide is taken, nearest the join first, where the
 * line and the cubic stay within the tolerance of their points, the cubic stays within
 * it of the line stretch and cubic it replaces, gains no crossing handles and no
 * protruding extremum, and the line's other end, if it is such a join too and was not
 * a near-miss kink, does not become one. Measured on the round trip of Linux
 * Libertine: where W's and z's diagonals meet their serif brackets and e's bar meets
 * its bowl, handles 6–25 units long had no lattice point within 0.25° of the line.
 *
 * `joins` and `errors` are updated in place; returns the new chain index of each slid
 * node (the spans' ranges are set in `search`).
 */
function slideLineJoins(chain: BoundaryChain, contour: FittedContour, joins: RoundedJoin[], errors: number[], grid: number, tolerance: number, snap: (v: number) => number, search: JoinSearch): (number | undefined)[] {
  const { nodes, spans } = contour;
  const n = nodes.length;
  const slid: (number | undefined)[] = nodes.map(() => undefined);
  if (n < 3) return slid;
  const prevOf = (i: number): number => (i - 1 + n) % n;
  const nextOf = (i: number): number => (i + 1) % n;
  const maxSine = Math.sin((NEAR_COLLINEAR_DEGREES * Math.PI) / 180);
  const kinkSine = Math.sin((KINK_MIN_DEGREES * Math.PI) / 180);
  /** Sine of the turn at line–cubic join e with the line's other end at `other` and the cubic's handle at `handle`. */
  const turnSine = (point: Point, other: Point, handle: Point): number => {
    const ux = point.x - other.x, uy = point.y - other.y;
    const hx = handle.x - point.x, hy = handle.y - point.y;
    const lu = Math.hypot(ux, uy), lh = Math.hypot(hx, hy);
    if (lu === 0 || lh === 0) return 1;
    if (ux * hx + uy * hy <= 0) return 1;
    return Math.abs(ux * hy - uy * hx) / (lu * lh);
  };
  // Node 0 is left where it is: the contour starts there, and the chain ranges of the
  // spans either side of it are counted a lap apart.
  for (let e = 1; e < n; e++) {
    const node = nodes[e]!;
    const before = spans[prevOf(e)]!.segment;
    const after = spans[e]!.segment;
    if (!slidableJoin(node, before, after)) continue;
    const lineBefore = before.kind === 'line';
    const lineSpan = lineBefore ? prevOf(e) : e;
    const cubicSpan = lineBefore ? e : prevOf(e);
    const otherEnd = lineBefore ? prevOf(e) : nextOf(e);
    const farEnd = lineBefore ? nextOf(e) : prevOf(e);
    if (otherEnd === farEnd) continue;
    const join = joins[e]!;
    const P = join.point;
    const O = joins[otherEnd]!.point;
    const handle = (lineBefore ? join.handleOut : join.handleIn) as Point;
    if (turnSine(P, O, handle) <= maxSine) continue;
    const far = joins[farEnd]!;
    const farHandle = (lineBefore ? far.handleIn : far.handleOut) as Point;
    const lineLength = Math.hypot(P.x - O.x, P.y - O.y);
    const ux = (P.x - O.x) / lineLength;
    const uy = (P.y - O.y) / lineLength;
    // The line's other end: a join whose handle continues the line must not start to kink.
    const otherNode = nodes[otherEnd]!;
    const otherJoin = joins[otherEnd]!;
    const otherHandle = otherNode.smooth && (lineBefore ? spans[prevOf(otherEnd)]!.segment.kind === 'cubic' : spans[otherEnd]!.segment.kind === 'cubic') ? ((lineBefore ? otherJoin.handleIn : otherJoin.handleOut) as Point) : undefined;
    const otherWasSmooth = otherHandle !== undefined && turnSine(O, P, otherHandle) < kinkSine;
    const fittedCubic = spans[cubicSpan]!.segment as CubicSegment;
    const current = lineBefore ? cubic(P, handle, farHandle, far.point) : cubic(far.point, farHandle, handle, P);
    const crossedBefore = handlesCross(current) || handlesCross(fittedCubic);
    const limit = Math.max(0, ...segmentExtrema(current).map((x) => x.protrusion), EXTREMUM_PROTRUSION_LIMIT);
    const handleLength = Math.hypot(handle.x - P.x, handle.y - P.y);
    const lineRange = search.rangeOf(lineSpan);
    const cubicRange = search.rangeOf(cubicSpan);
    const maxSlide = Math.min(MAX_SLIDE_CELLS * grid, MAX_SLIDE_SHARE * lineLength);
    // Join positions: lattice points within a cell of the line, back from the join.
    const positions: { point: Point; slide: number }[] = [];
    for (let cells = 1; cells * grid <= maxSlide; cells++) {
      const bx = snap(P.x - ux * cells * grid);
      const by = snap(P.y - uy * cells * grid);
      for (let dx = -1; dx <= 1; dx++) {
        for (let dy = -1; dy <= 1; dy++) {
          const q = { x: bx + dx * grid, y: by + dy * grid };
          const along = (q.x - O.x) * ux + (q.y - O.y) * uy;
          const across = Math.abs(-(q.x - O.x) * uy + (q.y - O.y) * ux);
          if (across > grid || along <= 0 || along >= lineLength || positions.some((p) => p.point.x === q.x && p.point.y === q.y)) continue;
          positions.push({ point: q, slide: lineLength - along });
        }
      }
    }
    positions.sort((a, b) => a.slide - b.slide);
    type Slide = { point: Point; handle: Point; segment: CubicSegment; split: number; cost: number };
    const options: Slide[] = [];
    for (const { point: Q, slide } of positions) {
      if (otherHandle && otherWasSmooth && turnSine(O, Q, otherHandle) >= kinkSine) continue;
      const vx = Q.x - O.x, vy = Q.y - O.y;
      const vl = Math.hypot(vx, vy);
      const want = handleLength + slide;
      const first = Math.max(1, Math.floor((LONG_HANDLE_MIN_SHARE * want) / grid));
      const last = Math.ceil((LONG_HANDLE_MAX_SHARE * want) / grid);
      const lengths = Array.from({ length: last - first + 1 }, (_, i) => (first + i) * grid);
      for (const c of latticeAlongRay(Q, { x: vx / vl, y: vy / vl }, lengths, grid, snap)) {
        if (c.sine > maxSine || options.some((o) => o.point === Q && o.handle.x === c.handle.x && o.handle.y === c.handle.y)) continue;
        const segment = lineBefore ? cubic(Q, c.handle, farHandle, far.point) : cubic(far.point, farHandle, c.handle, Q);
        options.push({ point: Q, handle: c.handle, segment, split: 0, cost: slide + HANDLE_SHIFT_WEIGHT * Math.abs(c.length - want) });
      }
    }
    options.sort((a, b) => a.cost - b.cost);
    let checked = 0;
    for (const option of options) {
      const { segment, point: Q } = option;
      if (!crossedBefore && handlesCross(segment)) continue;
      if (segmentExtrema(segment).some((x) => x.protrusion > limit)) continue;
      if (slidDeviation(segment, Q, P, current) > tolerance) continue;
      if (checked++ >= CHECKED_SLIDES) break;
      // The traced points past Q along the line go to the cubic.
      const reachQ = (Q.x - O.x) * ux + (Q.y - O.y) * uy;
      const split = splitAlongLine(chain, lineRange.first, lineRange.last, O, ux, uy, reachQ, lineBefore);
      const newLine = line(lineBefore ? O : Q, lineBefore ? Q : O);
      const lineError = lineBefore ? measureSpanError(chain, newLine, lineRange.first, split, tolerance) : measureSpanError(chain, newLine, split, lineRange.last, tolerance);
      if (lineError > tolerance) continue;
      const cubicError = lineBefore ? measureSpanError(chain, segment, split, cubicRange.last, tolerance) : measureSpanError(chain, segment, cubicRange.first, split, tolerance);
      if (cubicError > tolerance) continue;
      joins[e] = lineBefore ? { point: Q, handleIn: join.handleIn, handleOut: option.handle } : { point: Q, handleIn: option.handle, handleOut: join.handleOut };
      if (lineBefore) {
        search.setRange(lineSpan, lineRange.first, split);
        search.setRange(cubicSpan, split, cubicRange.last);
      } else {
        search.setRange(cubicSpan, cubicRange.first, split);
        search.setRange(lineSpan, split, lineRange.last);
      }
      errors[lineSpan] = lineError;
      errors[cubicSpan] = cubicError;
      slid[e] = split;
      break;
    }
  }
  return slid;
}

/**
 * A smooth join of a sloped line and a cubic that is no extremum: its handle must
 * continue the line (an axis-aligned tangent the fit gave it near an axis included,
 * which is exact only when the line is too).
 */
function slidableJoin(node: FitNode, before: FitSpan['segment'], after: FitSpan['segment']): boolean {
  if (!node.smooth || node.extremum) return false;
  const lineSegment = before.kind === 'line' && after.kind === 'cubic' ? before : before.kind === 'cubic' && after.kind === 'line' ? after : undefined;
  return lineSegment !== undefined && lineSegment.p0.x !== lineSegment.p1.x && lineSegment.p0.y !== lineSegment.p1.y;
}

/**
 * Where the traced points of a line's span [first, last] cross `reach` along the unit
 * direction u from the line's end O away from the join: for a line that arrives at the
 * join (`lineBefore`), the last index still within reach; for one that leaves it, the
 * last index beyond reach (the points from the join to there go to the cubic).
 */
function splitAlongLine(chain: BoundaryChain, first: number, last: number, O: Point, ux: number, uy: number, reach: number, lineBefore: boolean): number {
  const along = (k: number): number => {
    const i = ((k % chain.count) + chain.count) % chain.count;
    return (chain.xs[i]! + chain.origin.x - O.x) * ux + (chain.ys[i]! + chain.origin.y - O.y) * uy;
  };
  let k = first;
  while (k + 1 <= last && (lineBefore ? along(k + 1) <= reach : along(k + 1) > reach)) k++;
  return k;
}

/**
 * The largest distance from a slid cubic to what it replaces: the stretch of line from
 * its new end `Q` to the join's old position `P`, and the cubic that ran on from there.
 */
function slidDeviation(segment: CubicSegment, Q: Point, P: Point, replaced: CubicSegment): number {
  let worst = 0;
  const dx = P.x - Q.x, dy = P.y - Q.y;
  const l2 = dx * dx + dy * dy;
  for (let k = 1; k < SLIDE_DEVIATION_SAMPLES; k++) {
    const p = evaluate(segment, k / SLIDE_DEVIATION_SAMPLES);
    let t = l2 > 0 ? ((p.x - Q.x) * dx + (p.y - Q.y) * dy) / l2 : 0;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const toLine = Math.hypot(p.x - Q.x - t * dx, p.y - Q.y - t * dy);
    worst = Math.max(worst, Math.min(toLine, nearestPoint(replaced, p).distance));
  }
  return worst;
}

/**
 * A handle continuing a sloped line counts as smooth enough when it turns by at most
 * 0.25°, under the 0.3° near-miss kink threshold (quality-report.ts). Exact collinearity
 * needs a short lattice direction (alignSlopedLines); lattice points within this angle
 * of a line of arbitrary slope lie, on average, about 230/L units apart at length L
 * (a strip of half-width L·sin 0.25° holds that density of lattice points), so a
 * handle of 15 units finds one within about its own length.
 */
const NEAR_COLLINEAR_DEGREES = 0.25;
/**
 * Handle lengths searched for it, as shares of the ideal length: 0.5–2. The candidate's
 * cubic is measured against the chain and against its unrounded self
 * (deviationFrom), so a longer handle is kept only where the curve still fits.
 */
const LONG_HANDLE_MIN_SHARE = 0.5;
const LONG_HANDLE_MAX_SHARE = 2;
/**
 * …and at least out to 20 cells: a handle of a few units has no such lattice point
 * within twice its length (about 230/L apart), while a longer one on a short serif
 * bracket often still fits; the deviation test decides. Measured on the round trip of
 * Linux Libertine at 1 px per unit: near-miss kinks 40 → 20 with the share alone,
 * → 15 with this reach.
 */
const LONG_HANDLE_MIN_REACH_CELLS = 20;
/**
 * How far (cells, either way) the handle at a corner end of that cubic may move to
 * take up the longer handle's change of shape: 2, under a unit of curve movement
 * (4/9 of the move, see HANDLE_SLIDE_CELLS).
 */
const FAR_HANDLE_CELLS = 2;
/** Samples of a rounded cubic compared with its unrounded self. */
const DEVIATION_SAMPLES = 32;

/**
 * The largest distance from a rounded cubic to its unrounded self (samples of the first
 * to the nearest point of the second): it sees a curve that swings away from the
 * chain, which the chain-to-curve error of span-error.ts does not.
 */
function deviationFrom(rounded: CubicSegment, original: CubicSegment): number {
  let worst = 0;
  for (let k = 1; k < DEVIATION_SAMPLES; k++) {
    const p = evaluate(rounded, k / DEVIATION_SAMPLES);
    worst = Math.max(worst, nearestPoint(original, p).distance);
  }
  return worst;
}

/** Handle candidates tried round a corner's rounded handle (cells either way) when rounding made its cubic bulge past its ends. */
const UNBULGE_CELLS = 1;

/**
 * Corner handles whose rounding made an extremum stick out: a cubic next to a corner
 * whose unrounded extrema protrude at most EXTREMUM_PROTRUSION_LIMIT (extrema.ts) past
 * its end points can protrude more once its corner handles are rounded on their own
 * (a serif's end face drawn with handles a fraction of a unit inside the end points
 * gains a 0.6-unit bulge). Such a handle, which no other span depends on, is tried
 * within {@link UNBULGE_CELLS} of its rounding; the candidate nearest the ideal with
 * protrusion within the limit, no new crossing and an error within the tolerance (or
 * no worse than before) replaces it. `joins` and `errors` are updated in place.
 */
function unbulgeCornerHandles(contour: FittedContour, ideal: readonly RoundedJoin[], joins: RoundedJoin[], errors: number[], grid: number, tolerance: number, measure: (s: number, segment: FitSpan['segment']) => number): void {
  const { nodes, spans } = contour;
  const n = nodes.length;
  const protrusion = (segment: FitSpan['segment']): number => Math.max(0, ...segmentExtrema(segment).map((e) => e.protrusion));
  for (let i = 0; i < n; i++) {
    const fitted = spans[i]!.segment;
    if (fitted.kind !== 'cubic') continue;
    const j = (i + 1) % n;
    if (j === i) continue;
    const freeOut = independentHandles(nodes[i]!);
    const freeIn = independentHandles(nodes[j]!);
    const start = joins[i]!;
    const end = joins[j]!;
    const current = cubic(start.point, start.handleOut!, end.handleIn!, end.point);
    if (protrusion(current) <= EXTREMUM_PROTRUSION_LIMIT || protrusion(fitted) > EXTREMUM_PROTRUSION_LIMIT) continue;
    const around = (h: Point, free: boolean, p: Point): Point[] => {
      if (!free) return alongDirection(h, p, grid);
      const out: Point[] = [];
      for (let dx = -UNBULGE_CELLS; dx <= UNBULGE_CELLS; dx++) for (let dy = -UNBULGE_CELLS; dy <= UNBULGE_CELLS; dy++) out.push({ x: h.x + dx * grid, y: h.y + dy * grid });
      return out;
    };
    // The ideal handle carried with its on-curve point's rounding.
    const target = (h: Point, p: Point, q: Point): Point => ({ x: h.x - p.x + q.x, y: h.y - p.y + q.y });
    const wantOut = target(ideal[i]!.handleOut!, ideal[i]!.point, start.point);
    const wantIn = target(ideal[j]!.handleIn!, ideal[j]!.point, end.point);
    const crossedBefore = handlesCross(fitted);
    const options: { segment: CubicSegment; cost: number }[] = [];
    for (const hOut of around(start.handleOut!, freeOut, start.point)) {
      if (hOut.x === start.point.x && hOut.y === start.point.y) continue;
      for (const hIn of around(end.handleIn!, freeIn, end.point)) {
        if (hIn.x === end.point.x && hIn.y === end.point.y) continue;
        const segment = cubic(start.point, hOut, hIn, end.point);
        if (protrusion(segment) > EXTREMUM_PROTRUSION_LIMIT || (!crossedBefore && handlesCross(segment))) continue;
        options.push({ segment, cost: squaredDistance(hOut, wantOut) + squaredDistance(hIn, wantIn) });
      }
    }
    options.sort((x, y) => x.cost - y.cost);
    for (const { segment } of options) {
      const error = measure(i, segment);
      if (error > Math.max(tolerance, errors[i]!)) continue;
      joins[i] = { ...start, handleOut: segment.p1 };
      joins[j] = { ...end, handleIn: segment.p2 };
      errors[i] = error;
      break;
    }
  }
}

/**
 * A smooth join's handle `h` and the lattice points that keep its exact direction from
 * the on-curve point `p`: p + m·d for the reduced direction d of h − p, with m one less
 * or one more than now (never zero). The join stays exactly as smooth as it was; only
 * the handle's length changes.
 */
function alongDirection(h: Point, p: Point, grid: number): Point[] {
  const vx = Math.round((h.x - p.x) / grid);
  const vy = Math.round((h.y - p.y) / grid);
  const g = gcd(Math.abs(vx), Math.abs(vy));
  if (g === 0) return [h];
  const d = { x: (vx / g) * grid, y: (vy / g) * grid };
  const out = [h];
  for (const m of [g - 1, g + 1]) if (m >= 1) out.push({ x: p.x + m * d.x, y: p.y + m * d.y });
  return out;
}

/** Rounding of a join that is not searched: corners, sloped joins with a line, smooth joins between two lines. */
function roundJoin(node: FitNode, handleIn: Point | undefined, handleOut: Point | undefined, lineFrom: Point | undefined, lineTo: Point | undefined, grid: number, snap: (v: number) => number, mayMove: boolean): RoundedJoin {
  const p = node.point;
  const rounded = { x: snap(p.x), y: snap(p.y) };
  const roundPoint = (q: Point): Point => ({ x: snap(q.x), y: snap(q.y) });
  const tangent = node.smooth ? node.tangentOut : null;
  if (!tangent) {
    return { point: rounded, handleIn: handleIn && nonDegenerate(roundPoint(handleIn), rounded, handleIn, p, grid), handleOut: handleOut && nonDegenerate(roundPoint(handleOut), rounded, handleOut, p, grid) };
  }
  if (tangent.x === 0 || tangent.y === 0) {
    // Axis-aligned: handles keep the point's other coordinate exactly.
    const alongAxis = (h: Point, sign: number): Point => {
      if (tangent.y === 0) {
        let x = snap(h.x - p.x + rounded.x);
        if ((x - rounded.x) * tangent.x * sign <= 0) x = rounded.x + sign * tangent.x * grid;
        return { x, y: rounded.y };
      }
      let y = snap(h.y - p.y + rounded.y);
      if ((y - rounded.y) * tangent.y * sign <= 0) y = rounded.y + sign * tangent.y * grid;
      return { x: rounded.x, y };
    };
    return { point: rounded, handleIn: handleIn && alongAxis(handleIn, -1), handleOut: handleOut && alongAxis(handleOut, 1) };
  }
  // A sloped line on one side: continue the rounded line's direction as closely as the
  // grid allows, moving the on-curve point by up to one cell when that helps.
  const lineEnd = lineFrom ?? lineTo;
  const handle = (handleIn ?? handleOut) as Point;
  const sign = lineFrom ? 1 : -1;
  let best: { point: Point; handle: Point; score: number } | undefined;
  const radius = mayMove ? POINT_SEARCH_RADIUS : 0;
  for (let a = -radius; a <= radius; a++) {
    for (let b = -radius; b <= radius; b++) {
      const q = { x: rounded.x + a * grid, y: rounded.y + b * grid };
      const direction = lineEnd ? unit({ x: q.x - snap(lineEnd.x), y: q.y - snap(lineEnd.y) }, sign) : tangent;
      const found = bestHandleOnDirection(q, handle, p, direction, sign, grid, snap);
      const moved = Math.hypot(q.x - p.x, q.y - p.y) / grid;
      const score = found.score + moved * POINT_MOVE_WEIGHT;
      if (!best || score < best.score) best = { point: q, handle: found.handle, score };
    }
  }
  const chosen = best as { point: Point; handle: Point };
  return handleIn ? { point: chosen.point, handleIn: chosen.handle, handleOut: undefined } : { point: chosen.point, handleIn: undefined, handleOut: chosen.handle };
}

/** Weight of moving the on-curve point by one cell against the handle's length cost (score units). */
const POINT_MOVE_WEIGHT = 0.05;

function unit(v: Vec, sign: number): Vec {
  const l = Math.hypot(v.x, v.y) || 1;
  return { x: (sign * v.x) / l, y: (sign * v.y) / l };
}

/** A rounded handle that collapsed onto its rounded on-curve point is pushed one cell along its original direction. */
function nonDegenerate(h: Point, point: Point, original: Point, originalPoint: Point, grid: number): Point {
  if (h.x !== point.x || h.y !== point.y) return h;
  const dx = original.x - originalPoint.x;
  const dy = original.y - originalPoint.y;
  if (Math.abs(dx) >= Math.abs(dy)) return { x: point.x + Math.sign(dx || 1) * grid, y: point.y };
  return { x: point.x, y: point.y + Math.sign(dy || 1) * grid };
}

/**
 * Handle lengths searched, as shares of the ideal length, for a handle that must
 * continue a sloped line: lattice points lie close to a line of arbitrary slope only
 * here and there, so the search runs along the line (85–115 % of the length: a
 * handle that much longer or shorter moves the curve by at most about 7 % of the
 * handle, 0.44 × 15 %) and picks the point
 * whose direction is closest to the line's.
 */
const SLOPED_HANDLE_MIN_SHARE = 0.85;
const SLOPED_HANDLE_MAX_SHARE = 1.15;
/** Directions within this sine of the line's (≈ 0.06°) count as exactly continuing it. */
const COLLINEAR_SINE = 1e-3;

/**
 * Lattice points within a cell of the ray from `point` along the unit `direction`, at
 * each of `lengths` (the 3 × 3 cells round the rounded ray point), ahead of the point,
 * with their length and the sine of their angle to the ray.
 */
function* latticeAlongRay(point: Point, direction: Vec, lengths: readonly number[], grid: number, snap: (v: number) => number): Generator<{ handle: Point; length: number; sine: number }> {
  for (const along of lengths) {
    const cx = snap(point.x + direction.x * along);
    const cy = snap(point.y + direction.y * along);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const handle = { x: cx + dx * grid, y: cy + dy * grid };
        const vx = handle.x - point.x;
        const vy = handle.y - point.y;
        const length = Math.hypot(vx, vy);
        if (length === 0 || vx * direction.x + vy * direction.y <= 0) continue;
        yield { handle, length, sine: Math.abs(vx * direction.y - vy * direction.x) / length };
      }
    }
  }
}

/**
 * The grid point whose direction from the on-curve point best continues `direction`
 * (which points from the point into the line for an incoming handle, sign −1): among
 * lattice points within a cell of the line and 85–115 % of the ideal handle length,
 * those nearly collinear (sine below {@link COLLINEAR_SINE}) nearest the ideal length
 * win; otherwise the smallest turn.
 */
function bestHandleOnDirection(point: Point, handle: Point, originalPoint: Point, direction: Vec, sign: number, grid: number, snap: (v: number) => number): { handle: Point; score: number } {
  const ideal = { x: handle.x - originalPoint.x + point.x, y: handle.y - originalPoint.y + point.y };
  const want = sign > 0 ? direction : { x: -direction.x, y: -direction.y };
  const idealLength = Math.hypot(ideal.x - point.x, ideal.y - point.y);
  const steps = Math.max(1, Math.ceil(((SLOPED_HANDLE_MAX_SHARE - SLOPED_HANDLE_MIN_SHARE) * idealLength) / grid));
  let best = { x: snap(ideal.x), y: snap(ideal.y) };
  let bestScore = Infinity;
  const lengths = Array.from({ length: steps + 1 }, (_, k) => (SLOPED_HANDLE_MIN_SHARE + ((SLOPED_HANDLE_MAX_SHARE - SLOPED_HANDLE_MIN_SHARE) * k) / steps) * idealLength);
  for (const c of latticeAlongRay(point, want, lengths, grid, snap)) {
    const lengthCost = Math.abs(c.length - idealLength) / Math.max(idealLength, grid);
    const score = c.sine <= COLLINEAR_SINE ? lengthCost : 1 + c.sine * 1e3 + lengthCost;
    if (score < bestScore) {
      bestScore = score;
      best = c.handle;
    }
  }
  return { handle: best, score: bestScore };
}
