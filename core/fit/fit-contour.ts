/**
 * One traced boundary in, one outline contour out: the fitting stages in order.
 *
 * 1. corners (corners.ts) — where the tangent jumps, with the sharp corner estimated
 *    from the two sides;
 * 2. lines (lines.ts) — straight runs between corners, snapped to the axes;
 * 3. extrema (extrema.ts) — horizontal and vertical extremes of the curved runs,
 *    which become on-curve points with axis tangents;
 * 4. curves (minimum-segments.ts, least-squares.ts) — the fewest least-squares cubics
 *    between those points, G1 exact at every smooth join;
 * 5. corner sharpening (corner-sharpening.ts) — corners moved to where the fitted
 *    sides meet;
 * 6. finishing (extrema.ts, finishing.ts, grid-rounding.ts) — remaining extrema split
 *    off, segments merged where one cubic suffices, crossing handles shortened,
 *    coordinates rounded to the grid with smooth joins kept smooth;
 * 7. the quality report (quality-report.ts).
 *
 * Options change two stages: `mode: 'smooth'` fits each run between corners with a
 * least-squares C² B-spline reduced to few points (smooth-fit.ts) in place of stages
 * 2–5, and `fairing` makes smooth joins curvature-continuous where the tolerance allows
 * (fairing.ts) before rounding.
 *
 * Fitting aims at the tolerance less a reserve for grid rounding; if rounding still
 * pushes a segment past the tolerance, the contour is fitted again with a larger
 * reserve (at most twice).
 *
 * The contour keeps the chain's direction; fit-glyph.ts sets directions by nesting.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { line, type LineSegment } from '../geometry/segment.ts';
import { contourFromSegments, type OutlineContour, type OutlineSegment } from '../outline/outline-contour.ts';
import { arcAt, chainPoint, prepareChain, wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import { CORNER_SUPPORT_PX, detectCorners, intersectLines, supportTurns, type DetectedCorner } from './corners.ts';
import { chainExtrema, enforceExtrema, MIN_POINT_SPACING_UNITS, topExtremum, type ExtremumAxis } from './extrema.ts';
import { resolveFitOptions, type FitOptions, type ResolvedFitOptions } from './fit-options.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { detectLines, projectOntoLine, runsBetweenCorners, type ChainRun, type DetectedLine } from './lines.ts';
import { fitCubic } from './least-squares.ts';
import { estimateNoise, rangeByArc } from './local-line.ts';
import { fitStretchWithin, type CurveEnd, type StretchFit, type StretchSettings } from './minimum-segments.ts';
import { sharpenCorners } from './corner-sharpening.ts';
import { fixCrossingHandles, mergeSegments, smoothShallowCorners } from './finishing.ts';
import { roundToGrid } from './grid-rounding.ts';
import { cornerTinyCurves } from './tiny-curves.ts';
import { fitSmoothContour } from './smooth-fit.ts';
import { fairSmoothJoins } from './fairing.ts';
import { contourReport, type ContourFitReport } from './quality-report.ts';
import { measureSpanError } from './span-error.ts';

/**
 * Share of the tolerance kept in reserve for grid rounding: the fit aims at the
 * tolerance less 0.35 grid units, since rounding an on-curve point and its handles to
 * the grid moves the curve by up to about half a grid unit and 0.35 of a unit on
 * average over the worst points (measured on the round-trip glyphs).
 */
export const ROUNDING_RESERVE_GRID = 0.35;
/** A line end within the corner's rounding zone plus this many pixels belongs to the corner. */
const LINE_AT_CORNER_SLACK_PX = 2;

export interface ContourFit {
  readonly contour: OutlineContour;
  readonly report: ContourFitReport;
  /** The fitted contour before rounding, with its links to the chain (for checks and tools). */
  readonly fitted: FittedContour;
}

/** Settings the stages share, derived once per chain. */
export interface StageSettings {
  readonly options: ResolvedFitOptions;
  /** Scan pixel in font units. */
  readonly pixel: number;
  /** Tolerance used while fitting (the tolerance less the rounding reserve). */
  readonly fitTolerance: number;
  /** Scan noise of the chain (standard deviation across the boundary), font units. */
  readonly noise: number;
}

/**
 * Fits one closed chain (font units, y up) with a contour of lines and cubics.
 *
 * Guarantees: on-curve points and handles are multiples of the grid; lines the axis
 * snap applied to are exactly horizontal or vertical; axis-aligned smooth joins are
 * exactly collinear, other smooth joins collinear as far as the grid allows (see
 * grid-rounding.ts); every listed shortfall (tolerance exceeded, extremum left inside a
 * segment, kink, crossing handles) is reported in `report.warnings`. The input is not
 * modified. Limits: see each stage; a chain needs at least 3 distinct points.
 */
export function fitContour(points: readonly Point[], options: FitOptions = {}): ContourFit {
  const resolved = resolveFitOptions(options);
  const { chain, keptIndices } = prepareChain(points);
  const pixel = resolved.pixelSize ?? chain.medianStep;
  const noise = estimateNoise(chain, pixel);
  const toChain = (inputIndex: number): number => nearestKept(keptIndices, inputIndex);
  const corners = detectCorners(chain, {
    cornerAngle: (resolved.cornerAngleDegrees * Math.PI) / 180,
    pixel,
    forcedCorners: resolved.forcedCorners.map(toChain),
    forcedSmooth: resolved.forcedSmooth.map(toChain),
    ...(resolved.scanBlurPx === undefined ? {} : { blurPx: resolved.scanBlurPx }),
    noisePx: resolved.scanNoisePx ?? noise / pixel,
  });
  // With no corner, the one run round the chain starts where it turns most, never inside a line.
  const seam = corners.length > 0 ? (corners[0] as DetectedCorner).index : mostTurningPoint(chain, pixel);
  const runs = runsBetweenCorners(chain, corners, seam);
  let reserve = ROUNDING_RESERVE_GRID * resolved.grid;
  let result: ContourFit | undefined;
  for (let attempt = 0; attempt <= ROUNDING_RETRIES; attempt++) {
    const settings: StageSettings = { options: resolved, pixel, fitTolerance: Math.max(resolved.tolerance / 2, resolved.tolerance - reserve), noise };
    let fitted =
      resolved.mode === 'smooth'
        ? fitSmoothContour(chain, { tolerance: settings.fitTolerance, pixel }, corners)
        : cornerTinyCurves(chain, economyFit(chain, corners, runs, settings), settings.fitTolerance, resolved.grid, pixel, resolved.forcedSmooth.map(toChain));
    if (resolved.fairing) fitted = fairSmoothJoins(chain, fitted, settings.fitTolerance);
    const rounded = roundToGrid(chain, fitted, resolved.grid, resolved.tolerance, (resolved.axisSnapDegrees * Math.PI) / 180);
    const segments: OutlineSegment[] = rounded.spans.map((span) => span.segment);
    const contour = contourFromSegments(segments, rounded.nodes.map((node) => node.smooth));
    result = { contour, report: contourReport(chain, rounded, resolved.tolerance), fitted };
    // Rounding pushed a segment past the tolerance: fit again with a larger reserve.
    if (!rounded.spans.some((span) => span.maxError > resolved.tolerance)) break;
    reserve += ROUNDING_RETRY_STEP_GRID * resolved.grid;
  }
  return result as ContourFit;
}

/**
 * The curved stretches already fitted while one contour is fitted, by their exact
 * inputs. The same stretch between the same two on-curve points is asked for again and
 * again: once per line-end retreat tried, again when the contour is assembled, and a
 * second time over when the contour is assembled again with fewer lines. The breakpoint
 * search is a pure function of its inputs, so a stored fit is the fit.
 */
type StretchMemo = Map<string, StretchFit>;

/** The stage settings of economy mode, with the contour's stretch memo. */
interface EconomySettings extends StageSettings {
  readonly stretches: StretchMemo;
}

/** A curve end's inputs in a memo key (numbers print exactly: the shortest decimal that reads back as the same double). */
function endKey(end: CurveEnd): string {
  return end.tangent ? `${end.index} ${end.point.x} ${end.point.y} ${end.tangent.x} ${end.tangent.y}` : `${end.index} ${end.point.x} ${end.point.y} free`;
}

/**
 * The fewest cubics for a curved stretch (minimum-segments.ts), taken from the memo when
 * this exact stretch was fitted before; undefined when they number more than `maxSegments`.
 */
function curveStretch(chain: BoundaryChain, start: CurveEnd, end: CurveEnd, first: number, last: number, settings: EconomySettings, maxSegments = Infinity): StretchFit | undefined {
  const stretch: StretchSettings = { tolerance: settings.fitTolerance, pixel: settings.pixel };
  const key = `${endKey(start)}|${endKey(end)}|${first} ${last} ${stretch.tolerance} ${stretch.pixel}`;
  const known = settings.stretches.get(key);
  if (known) return known.segments.length <= maxSegments ? known : undefined;
  const fit = fitStretchWithin(chain, start, end, first, last, stretch, maxSegments);
  if (fit) settings.stretches.set(key, fit);
  return fit;
}

/**
 * Stages 2–6 of the header for the default 'economy' mode: the fewest on-curve points.
 * (Smooth mode fits C² splines between the corners instead, smooth-fit.ts.)
 */
function economyFit(chain: BoundaryChain, corners: readonly DetectedCorner[], runs: readonly ChainRun[], stageSettings: StageSettings): FittedContour {
  const settings: EconomySettings = { ...stageSettings, stretches: new Map() };
  const { options, pixel, fitTolerance } = settings;
  const lines = withoutLinesInSingleCurves(chain, runs, corners, detectLines(chain, runs, { tolerance: fitTolerance, pixel, axisSnap: (options.axisSnapDegrees * Math.PI) / 180 }), settings);
  let fitted = assemble(chain, corners, lines, settings);
  const economical = economicalLines(chain, runs, corners, lines, fitted, settings);
  if (economical) fitted = assemble(chain, corners, economical, settings);
  fitted = sharpenCorners(chain, fitted, fitTolerance);
  fitted = enforceExtrema(chain, fitted, fitTolerance);
  fitted = smoothShallowCorners(chain, fitted, fitTolerance);
  fitted = mergeSegments(chain, fitted, fitTolerance);
  return fixCrossingHandles(chain, fitted, fitTolerance);
}

/**
 * Lines dropped from runs between two corners that one cubic fits within the
 * tolerance. A gently curved stroke (the diagonal of Linux Libertine's 7 or Z) is
 * straight to within the noise over any 40–80 px of it, so the line search cuts it
 * into lines joined by short curves, with two on-curve points per piece; the designer
 * drew one curve. Only runs without an interior extremum are considered (a curve
 * through an extremum needs a point there anyway), and a run that is one line as a
 * whole keeps it.
 */
function withoutLinesInSingleCurves(chain: BoundaryChain, runs: readonly ChainRun[], corners: readonly DetectedCorner[], lines: readonly DetectedLine[], settings: StageSettings): DetectedLine[] {
  const dropped = new Set<DetectedLine>(polygonalLines(chain, corners, lines, settings));
  if (corners.length === 0) return lines.filter((l) => !dropped.has(l));
  runs.forEach((run, k) => {
    if (!run.betweenCorners) return;
    const inside = lines.filter((l) => {
      const first = l.first < run.first ? l.first + chain.count : l.first;
      return first >= run.first && first <= run.last;
    });
    if (inside.length === 0) return;
    if (inside.length === 1 && inside[0]!.first === wrapIndex(chain, run.first) && inside[0]!.last - inside[0]!.first === run.last - run.first) return;
    if (chainExtrema(chain, run.first, run.last, settings.pixel, settings.noise).length > 0) return;
    const start = corners[k]!;
    const end = corners[(k + 1) % corners.length]!;
    if (inside.every((l) => dropped.has(l))) return;
    const fit = fitCubic({ chain, first: run.first, last: run.last, start: start.estimate, end: end.estimate, startTangent: null, endTangent: null }, settings.fitTolerance, false, true);
    if (fit.maxError > settings.fitTolerance) return;
    for (const l of inside) dropped.add(l);
  });
  return lines.filter((l) => !dropped.has(l));
}

/**
 * A line at least this long, and the only line along its stroke in its run, is a stem
 * or a bar and is kept even where curves would cover its run with fewer points:
 * 120 px, three times the shortest line (lines.ts). The flat pieces that the line
 * search may lay along a cupped serif foot are shorter (Linux Libertine's: 35–90 px at
 * 0.5–1 px per unit), and those along a bowed diagonal come two or more to a stroke.
 */
const STEM_PROTECTION_PX = 120;

/**
 * Curves that replace lines must stay within this share of the fitting tolerance, or
 * within the error the lines had there: 0.6. Trading a line for curves saves points
 * but must not cost visible fidelity; measured on the round trip, allowing the whole
 * tolerance let short stems at 0.5 px per unit bow into curves (Cantarell's P and B,
 * Hausdorff 2.0–2.3 units instead of 1.4), and 0.6 kept them while still
 * replacing the polygon pieces along serif feet and bowed diagonals.
 */
const CURVES_ERROR_SHARE = 0.6;

/**
 * The lines to keep when, for some run between two corners, curves alone cover it
 * with fewer on-curve points than the assembled contour with its lines used there;
 * undefined when every run is best as assembled.
 *
 * The rule is the trade's "as few points as the tolerance allows": a shallow curve
 * (a cupped serif foot, a gently bowed diagonal) is straight to within the noise over
 * stretches of 40–100 px, so the line search may lay two or three lines along it
 * joined by short curves, each adding on-curve points and near-miss kinks at the
 * joins, where the designer drew one or two curves. Both readings are within the
 * tolerance; the one with fewer points wins, lines on a tie. A stem or a bar (see
 * STEM_PROTECTION_PX) is never traded for curves, so straight stems stay straight.
 */
function economicalLines(chain: BoundaryChain, runs: readonly ChainRun[], corners: readonly DetectedCorner[], lines: readonly DetectedLine[], assembled: FittedContour, settings: EconomySettings): DetectedLine[] | undefined {
  if (corners.length === 0 || lines.length === 0) return undefined;
  const protectedLength = STEM_PROTECTION_PX * settings.pixel;
  const cornerAngle = (settings.options.cornerAngleDegrees * Math.PI) / 180;
  const dropped = new Set<DetectedLine>();
  runs.forEach((run, k) => {
    if (!run.betweenCorners) return;
    const start = corners[k]!;
    const end = corners[(k + 1) % corners.length]!;
    const runArc = arcForward(chain, start.index, end.index) || chain.perimeter;
    const inside = lines.filter((l) => {
      const offset = arcForward(chain, start.index, l.first);
      return offset > 0 && offset < runArc;
    });
    if (inside.length === 0) return;
    const alongOneStroke = (a: DetectedLine, b: DetectedLine): boolean => Math.abs(Math.atan2(a.direction.x * b.direction.y - a.direction.y * b.direction.x, a.direction.x * b.direction.x + a.direction.y * b.direction.y)) < cornerAngle;
    const isStem = (l: DetectedLine): boolean => arcAt(chain, l.last) - arcAt(chain, l.first) >= protectedLength && !inside.some((other) => other !== l && alongOneStroke(l, other));
    if (inside.some(isStem)) return;
    const withLines = assembled.nodes.filter((node) => {
      const offset = arcForward(chain, start.index, node.index);
      return offset > 0 && offset < runArc;
    }).length;
    let linesError = 0;
    assembled.spans.forEach((span, i) => {
      const offset = arcForward(chain, start.index, assembled.nodes[i]!.index);
      if (offset >= 0 && offset < runArc) linesError = Math.max(linesError, span.maxError);
    });
    const errorLimit = Math.max(linesError, CURVES_ERROR_SHARE * settings.fitTolerance);
    const curves = curveOnlyCost(chain, start, end, { ...settings, fitTolerance: Math.min(settings.fitTolerance, errorLimit) }, withLines);
    if (curves !== undefined && curves < withLines) for (const l of inside) dropped.add(l);
  });
  return dropped.size > 0 ? lines.filter((l) => !dropped.has(l)) : undefined;
}

/**
 * Interior on-curve points needed to cover the run from corner `start` to corner
 * `end` with curves only (its extrema, plus the breakpoints of the fewest cubics
 * between them), or undefined when that is not within the tolerance or would need
 * at least `bound` points.
 */
function curveOnlyCost(chain: BoundaryChain, start: DetectedCorner, end: DetectedCorner, settings: EconomySettings, bound: number): number | undefined {
  const { pixel, fitTolerance, noise } = settings;
  const endIndex = end.index <= start.index ? end.index + chain.count : end.index;
  const from = arcAt(chain, start.index) + start.roundingZone;
  const to = arcAt(chain, endIndex) - end.roundingZone;
  if (to <= from) return undefined;
  const [dataFirst, dataLast] = rangeByArc(chain, from, to);
  const spacing = Math.max(MIN_POINT_SPACING_UNITS, pixel);
  const ends: { index: number; point: Point; tangent: Vec | null }[] = [{ index: start.index, point: start.estimate, tangent: null }];
  for (const e of chainExtrema(chain, dataFirst, dataLast, pixel, noise)) {
    const previous = ends[ends.length - 1]!;
    if (Math.hypot(e.point.x - previous.point.x, e.point.y - previous.point.y) < spacing) continue;
    if (Math.hypot(e.point.x - end.estimate.x, e.point.y - end.estimate.y) < spacing) continue;
    ends.push({ index: e.index, point: e.point, tangent: e.tangent });
  }
  ends.push({ index: endIndex, point: end.estimate, tangent: null });
  let cost = ends.length - 2;
  for (let i = 0; i + 1 < ends.length && cost < bound; i++) {
    const a = ends[i]!;
    const b = ends[i + 1]!;
    const first = i === 0 ? dataFirst : Math.max(dataFirst, a.index);
    const last = i + 2 === ends.length ? dataLast : Math.min(dataLast, b.index);
    if (last <= first) return undefined;
    const fit = curveStretch(chain, a, b, first, last, settings)!;
    if (fit.errors.some((e) => e > fitTolerance)) return undefined;
    cost += fit.segments.length - 1;
  }
  return cost < bound ? cost : undefined;
}

/** Two lines closer than this (px of chain, or this share of the shorter line) with no corner between them are suspect. */
const POLYGON_GAP_PX = 20;
const POLYGON_GAP_SHARE = 0.5;
/** Directions differing by less than this are the same line interrupted, not a polygon (0.5°, about the noise in a long line's direction). */
const SAME_DIRECTION_RADIANS = (0.5 * Math.PI) / 180;

/**
 * Lines that are really a polygon laid along a gently curved stroke: consecutive lines
 * with no corner between them, a short gap, and directions that differ (but by less
 * than a corner). Each is straight within the noise, yet together they turn; the
 * stroke is a curve and gets cubics instead.
 */
function polygonalLines(chain: BoundaryChain, corners: readonly DetectedCorner[], lines: readonly DetectedLine[], settings: StageSettings): DetectedLine[] {
  const suspects: DetectedLine[] = [];
  const cornerAngle = (settings.options.cornerAngleDegrees * Math.PI) / 180;
  for (let i = 0; i < lines.length && lines.length > 1; i++) {
    const a = lines[i]!;
    const b = lines[(i + 1) % lines.length]!;
    const bFirst = b.first <= a.last ? b.first + chain.count : b.first;
    const gap = arcAt(chain, bFirst) - arcAt(chain, a.last);
    const shorter = Math.min(arcAt(chain, a.last) - arcAt(chain, a.first), arcAt(chain, b.last) - arcAt(chain, b.first));
    if (gap < 0 || gap > Math.max(POLYGON_GAP_PX * settings.pixel, POLYGON_GAP_SHARE * shorter)) continue;
    const cornerBetween = corners.some((c) => {
      const index = c.index < a.last ? c.index + chain.count : c.index;
      return index >= a.last && index <= bFirst;
    });
    if (cornerBetween) continue;
    const turn = Math.abs(Math.atan2(a.direction.x * b.direction.y - a.direction.y * b.direction.x, a.direction.x * b.direction.x + a.direction.y * b.direction.y));
    if (turn <= SAME_DIRECTION_RADIANS || turn >= cornerAngle) continue;
    suspects.push(a, b);
  }
  return suspects;
}

/** Extra fits with a larger rounding reserve when rounding broke the tolerance, and the reserve added each time. */
const ROUNDING_RETRIES = 2;
const ROUNDING_RETRY_STEP_GRID = 0.2;

/** Chain index where the support turn (corners.ts) is largest. */
function mostTurningPoint(chain: BoundaryChain, pixel: number): number {
  const turns = supportTurns(chain, CORNER_SUPPORT_PX * pixel);
  let best = 0;
  for (let i = 1; i < turns.length; i++) if (Math.abs(turns[i]!) > Math.abs(turns[best]!)) best = i;
  return best;
}

/** The de-duplicated chain index whose input index is nearest `inputIndex`. */
function nearestKept(kept: Int32Array, inputIndex: number): number {
  let lo = 0;
  let hi = kept.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (kept[mid]! < inputIndex) lo = mid + 1;
    else hi = mid;
  }
  if (lo > 0 && Math.abs(kept[lo - 1]! - inputIndex) <= Math.abs(kept[lo]! - inputIndex)) return lo - 1;
  return lo;
}

/** A node while the contour is assembled, with the line (if any) that leaves it. */
interface Knot {
  index: number;
  point: Point;
  smooth: boolean;
  tangentIn: Vec | null;
  tangentOut: Vec | null;
  extremum: ExtremumAxis | null;
  corner: DetectedCorner | null;
  lineOut: DetectedLine | null;
}

/** Signed arc length from unwrapped index a forward to b, in [0, perimeter). */
function arcForward(chain: BoundaryChain, a: number, b: number): number {
  const d = arcAt(chain, b) - arcAt(chain, a);
  return ((d % chain.perimeter) + chain.perimeter) % chain.perimeter;
}

/** Stages 1–4: knots from corners, lines and extrema, then the curves between them. */
function assemble(chain: BoundaryChain, corners: readonly DetectedCorner[], lines: readonly DetectedLine[], settings: EconomySettings): FittedContour {
  const { pixel, fitTolerance } = settings;
  const knots: Knot[] = corners.map((corner) => ({
    index: corner.index,
    point: corner.estimate,
    smooth: false,
    tangentIn: null,
    tangentOut: null,
    extremum: null,
    corner,
    lineOut: null,
  }));
  const slack = LINE_AT_CORNER_SLACK_PX * pixel;
  const lineIn = new Map<Knot, DetectedLine>();
  for (const l of lines) {
    const startCorner = knots.find((k) => k.corner && arcForward(chain, k.index, l.first) <= k.corner.roundingZone + slack);
    if (startCorner) {
      startCorner.tangentOut = l.direction;
      startCorner.lineOut = l;
    } else {
      knots.push({ index: l.first, point: projectOntoLine(chain, l, l.first), smooth: true, tangentIn: l.direction, tangentOut: l.direction, extremum: null, corner: null, lineOut: l });
    }
    const endCorner = knots.find((k) => k.corner && arcForward(chain, l.last, k.index) <= k.corner.roundingZone + slack);
    if (endCorner) {
      endCorner.tangentIn = l.direction;
      lineIn.set(endCorner, l);
    } else {
      const end: Knot = { index: l.last, point: projectOntoLine(chain, l, l.last), smooth: true, tangentIn: l.direction, tangentOut: l.direction, extremum: null, corner: null, lineOut: null };
      knots.push(end);
      lineIn.set(end, l);
    }
  }
  // Corners on lines: put the corner point on the line(s).
  for (const k of knots) {
    if (!k.corner) continue;
    const incoming = lineIn.get(k);
    const outgoing = k.lineOut;
    const apex = chainPoint(chain, k.corner.index);
    const within = (p: Point | undefined, limit: number): p is Point => p !== undefined && Math.hypot(p.x - apex.x, p.y - apex.y) <= limit;
    if (incoming && outgoing) {
      const meet = intersectLines(incoming.through, incoming.direction, outgoing.through, outgoing.direction);
      k.point = within(meet, 2 * k.corner.reach) ? meet : projectPoint(k.point, outgoing);
    } else if (incoming || outgoing) {
      const l = (incoming ?? outgoing) as DetectedLine;
      const other = incoming ? k.corner.outgoing : k.corner.incoming;
      const meet = intersectLines(l.through, l.direction, k.corner.estimate, other);
      k.point = within(meet, k.corner.reach) ? meet : projectPoint(k.point, l);
    }
  }
  if (knots.length === 0) {
    const top = topExtremum(chain, pixel, settings.noise);
    knots.push({ index: top.index, point: top.point, smooth: true, tangentIn: top.tangent, tangentOut: top.tangent, extremum: 'y', corner: null, lineOut: null });
  }
  const base = Math.min(...knots.map((k) => wrapIndex(chain, k.index)));
  for (const k of knots) {
    k.index = wrapIndex(chain, k.index);
    if (k.index < base) k.index += chain.count;
  }
  knots.sort((a, b) => a.index - b.index);

  // Extrema inside the curved stretches.
  const withExtrema: Knot[] = [];
  knots.forEach((k, i) => {
    withExtrema.push(k);
    if (k.lineOut) return;
    const next = nextKnot(knots, i, chain.count);
    const [first, last] = dataRange(chain, k, next);
    const spacing = Math.max(MIN_POINT_SPACING_UNITS, pixel);
    let previousPoint = k.point;
    for (const e of chainExtrema(chain, first, last, pixel, settings.noise)) {
      const nearStart = Math.hypot(e.point.x - k.point.x, e.point.y - k.point.y) < spacing;
      const nearEnd = Math.hypot(e.point.x - next.point.x, e.point.y - next.point.y) < spacing;
      if (nearStart || nearEnd) {
        // Move the neighbouring corner's tangent to the axis instead of adding a point.
        const neighbour = nearStart ? k : next;
        if (neighbour.corner && !neighbour.corner.forced) {
          if (nearStart && neighbour.tangentOut === null) neighbour.tangentOut = e.tangent;
          if (!nearStart && neighbour.tangentIn === null) neighbour.tangentIn = e.tangent;
        }
        continue;
      }
      if (Math.hypot(e.point.x - previousPoint.x, e.point.y - previousPoint.y) < spacing) continue;
      withExtrema.push({ index: e.index, point: e.point, smooth: true, tangentIn: e.tangent, tangentOut: e.tangent, extremum: e.axis, corner: null, lineOut: null });
      previousPoint = e.point;
    }
  });

  settleLineEnds(chain, withExtrema, lineIn, settings);

  // Curves between consecutive knots; lines where a line leaves a knot.
  const nodes: FitNode[] = [];
  const spans: FitSpan[] = [];
  withExtrema.forEach((k, i) => {
    const next = nextKnot(withExtrema, i, chain.count);
    nodes.push(nodeOf(k, true));
    if (k.lineOut) {
      const l = k.lineOut;
      const segment: LineSegment = line(k.point, next.point);
      // A smooth end may have retreated along the line: the line then stands for the points up to it.
      const first = k.corner ? l.first : Math.max(l.first, k.index);
      const last = next.corner ? l.last : Math.min(l.last, next.index + (next.index < first ? chain.count : 0));
      spans.push({ segment, first, last, maxError: measureSpanError(chain, segment, first, last, fitTolerance), carrier: { through: l.through, direction: l.direction } });
      return;
    }
    const [first, last] = dataRange(chain, k, next);
    const fit = curveStretch(chain, { index: k.index, point: k.point, tangent: k.tangentOut }, { index: next.index, point: next.point, tangent: next.tangentIn }, first, last, settings)!;
    fit.segments.forEach((segment, s) => {
      if (s > 0) {
        const b = fit.breakpoints[s - 1]!;
        nodes.push({ point: b.point, smooth: true, tangentIn: b.tangent, tangentOut: b.tangent, extremum: null, corner: null, index: b.index, pinned: false });
      }
      const [a, z] = fit.ranges[s]!;
      spans.push({ segment, first: a, last: z, maxError: fit.errors[s]!, carrier: null });
    });
  });
  return { nodes, spans };
}

/**
 * Retreats, in px along the line, tried for a line end where a curve leaves it
 * tangentially. A line grown until the boundary leaves it by more than the noise runs
 * a few pixels into the curve (a tangent curve departs only quadratically), and the
 * curve then starts with the line's direction at a point where the drawn curve has
 * already turned. The end is moved back to where the curve beyond it fits best.
 */
const LINE_END_RETREATS_PX = [0, 1, 2, 3, 4, 6, 8, 11, 15, 20];
/** A line end retreats by at most this share of the line's length (both ends together keep half of it). */
const MAX_RETREAT_SHARE = 0.25;

/**
 * Moves each smooth line end (a line joined tangentially by a curve) back along the
 * line to where one cubic from it to the next on-curve point fits best.
 */
function settleLineEnds(chain: BoundaryChain, knots: Knot[], lineIn: Map<Knot, DetectedLine>, settings: EconomySettings): void {
  const { pixel } = settings;
  const count = knots.length;
  for (let i = 0; i < count; i++) {
    const knot = knots[i]!;
    if (!knot.smooth) continue;
    const incoming = lineIn.get(knot);
    const outgoing = knot.lineOut;
    if (incoming && !outgoing) {
      // Line arrives, curve leaves: retreat backwards along the incoming line.
      const next = nextKnot(knots, i, chain.count);
      const best = bestRetreat(chain, knot, incoming, -1, (trial, maxSegments) => {
        const [first, last] = dataRange(chain, trial, next);
        return curveStretch(chain, { index: trial.index, point: trial.point, tangent: trial.tangentOut }, { index: next.index, point: next.point, tangent: next.tangentIn }, first, last, settings, maxSegments);
      }, arcForward(chain, incoming.first, knot.index), pixel);
      if (best) {
        knot.index = best.index;
        knot.point = best.point;
      }
    } else if (outgoing && !incoming) {
      const previous = knots[(i - 1 + count) % count]!;
      const before: Knot = i === 0 ? { ...previous, index: previous.index - chain.count } : previous;
      const best = bestRetreat(chain, knot, outgoing, 1, (trial, maxSegments) => {
        const [first, last] = dataRange(chain, before, trial);
        return curveStretch(chain, { index: before.index, point: before.point, tangent: before.tangentOut }, { index: trial.index, point: trial.point, tangent: trial.tangentIn }, first, last, settings, maxSegments);
      }, arcForward(chain, knot.index, outgoing.last), pixel);
      if (best) {
        knot.index = best.index;
        knot.point = best.point;
      }
    }
  }
}

/**
 * The retreat (direction −1: backwards from a line's end; +1: forwards from its
 * start) whose curve fit has the fewest segments, then the smallest error. `fitCurve`
 * may give up (undefined) on a trial needing more segments than the limit it is given,
 * since such a trial cannot win.
 */
function bestRetreat(
  chain: BoundaryChain,
  knot: Knot,
  l: DetectedLine,
  direction: number,
  fitCurve: (trial: Knot, maxSegments: number) => { segments: readonly unknown[]; errors: readonly number[] } | undefined,
  lineLength: number,
  pixel: number,
): { index: number; point: Point } | undefined {
  let best: { index: number; point: Point; segments: number; error: number } | undefined;
  const s0 = arcAt(chain, knot.index);
  for (const retreat of LINE_END_RETREATS_PX) {
    const distance = retreat * pixel;
    if (distance > MAX_RETREAT_SHARE * lineLength) break;
    const [index] = direction < 0 ? rangeByArc(chain, s0 - distance, s0 - distance) : rangeByArc(chain, s0 + distance, s0 + distance);
    const trialIndex = retreat === 0 ? knot.index : Math.max(Math.min(index, Math.max(knot.index, index)), Math.min(knot.index, index));
    const trial: Knot = { ...knot, index: trialIndex, point: projectOntoLine(chain, l, trialIndex) };
    const fit = fitCurve(trial, best ? best.segments : Infinity);
    if (!fit) continue;
    const error = Math.max(...fit.errors);
    if (!best || fit.segments.length < best.segments || (fit.segments.length === best.segments && error < best.error - 1e-9)) {
      best = { index: trial.index, point: trial.point, segments: fit.segments.length, error };
    }
  }
  return best;
}

function projectPoint(p: Point, l: DetectedLine): Point {
  const along = (p.x - l.through.x) * l.direction.x + (p.y - l.through.y) * l.direction.y;
  return { x: l.through.x + along * l.direction.x, y: l.through.y + along * l.direction.y };
}

function nodeOf(k: Knot, pinned: boolean): FitNode {
  return { point: k.point, smooth: k.smooth, tangentIn: k.tangentIn, tangentOut: k.tangentOut, extremum: k.extremum, corner: k.corner, index: k.index, pinned };
}

/** The knot after knot i, with its index unwrapped past knot i (one lap for a single knot). */
function nextKnot(knots: readonly Knot[], i: number, count: number): Knot {
  if (i + 1 < knots.length) return knots[i + 1] as Knot;
  const first = knots[0] as Knot;
  return { ...first, index: first.index + count };
}

/** The chain points a curve from knot a to knot b is fitted to: corner tips left out. */
function dataRange(chain: BoundaryChain, a: Knot, b: Knot): [number, number] {
  const from = arcAt(chain, a.index) + (a.corner ? a.corner.roundingZone : 0);
  const to = arcAt(chain, b.index) - (b.corner ? b.corner.roundingZone : 0);
  if (to <= from) return [a.index + 1, a.index];
  const [first, last] = rangeByArc(chain, from, to);
  return [Math.max(first, a.index), Math.min(last, b.index)];
}
