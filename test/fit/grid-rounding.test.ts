// Grid rounding: what a type designer would notice if it broke — a smooth join that
// shows a kink once on integer coordinates, an outline pushed off the drawing by
// rounding, or a curvature comb whose steps come back after fairing.

import { describe, expect, it } from 'vitest';
import { prepareChain, type BoundaryChain } from '../../core/fit/boundary-chain.ts';
import { fairSmoothJoins, G2_RELATIVE_TOLERANCE, joinCurvatures } from '../../core/fit/fairing.ts';
import { fitContour } from '../../core/fit/fit-contour.ts';
import type { FitNode, FitSpan, FittedContour } from '../../core/fit/fitted-contour.ts';
import { COLLINEAR_DEGREES, roundToGrid } from '../../core/fit/grid-rounding.ts';
import { KINK_MIN_DEGREES, turnAtJoin } from '../../core/fit/quality-report.ts';
import { fitSmoothContour } from '../../core/fit/smooth-fit.ts';
import { cubic, evaluate, line, type CubicSegment, type LineSegment, type Point } from '../../core/geometry/index.ts';
import { EXTREMUM_PROTRUSION_LIMIT, segmentExtrema } from '../../core/fit/extrema.ts';
import { ellipseChain, polarChain, sCurveBandChain, superellipseRadius } from './synthetic-chains.ts';

/** Handle length of the four-arc cubic circle, as a share of the radius: 4(√2 − 1)/3 (Riškus 2006, and the classic κ ≈ 0.5523). */
const ARC_HANDLE = (4 * (Math.SQRT2 - 1)) / 3;

/**
 * The four-arc cubic approximation of an ellipse with semi-axes a, b, rotated by
 * `rotation` about an off-grid centre, as a fitted contour, and a chain sampled along
 * its own cubics (so the unrounded contour has no error at all). Rotated by anything
 * but a multiple of 90°, every join is a sloped smooth join whose exact handles have
 * irrational directions and lengths.
 */
function rotatedEllipse(a: number, b: number, rotation: number): { chain: BoundaryChain; contour: FittedContour } {
  const c = { x: 400 + Math.SQRT2 / 7, y: 300 + Math.PI / 11 };
  const cos = Math.cos(rotation);
  const sin = Math.sin(rotation);
  const place = (x: number, y: number): Point => ({ x: c.x + x * cos - y * sin, y: c.y + x * sin + y * cos });
  const direction = (x: number, y: number): Point => ({ x: x * cos - y * sin, y: x * sin + y * cos });
  // Vertices counter-clockwise from (a, 0); the tangent there is the next vertex's axis direction.
  const vertices = [[a, 0, 0, 1, b], [0, b, -1, 0, a], [-a, 0, 0, -1, b], [0, -b, 1, 0, a]] as const;
  const points = vertices.map(([x, y]) => place(x, y));
  const tangents = vertices.map(([, , tx, ty]) => direction(tx, ty));
  const handles = vertices.map(([, , , , length]) => ARC_HANDLE * length);
  const segments = points.map((p, k) => {
    const q = points[(k + 1) % 4]!;
    const t0 = tangents[k]!;
    const t1 = tangents[(k + 1) % 4]!;
    return cubic(p, { x: p.x + t0.x * handles[k]!, y: p.y + t0.y * handles[k]! }, { x: q.x - t1.x * handles[(k + 1) % 4]!, y: q.y - t1.y * handles[(k + 1) % 4]! }, q);
  });
  const samples: Point[] = [];
  const starts: number[] = [];
  for (const s of segments) {
    starts.push(samples.length);
    const steps = Math.ceil(Math.hypot(s.p3.x - s.p0.x, s.p3.y - s.p0.y) * 1.2);
    for (let k = 0; k < steps; k++) samples.push(evaluate(s, k / steps));
  }
  const { chain } = prepareChain(samples);
  expect(chain.count).toBe(samples.length);
  const nodes: FitNode[] = points.map((point, k) => ({ point, smooth: true, tangentIn: tangents[k]!, tangentOut: tangents[k]!, extremum: null, corner: null, index: starts[k]!, pinned: false }));
  const spans: FitSpan[] = segments.map((segment, k) => ({ segment, first: starts[k]!, last: k < 3 ? starts[k + 1]! : samples.length, maxError: 0, carrier: null }));
  return { chain, contour: { nodes, spans } };
}

/** The control points next to each on-curve point of a contour: (handle in, point, handle out). */
function triples(contour: FittedContour): [Point, Point, Point][] {
  const n = contour.nodes.length;
  return contour.nodes.map((node, i) => {
    const before = contour.spans[(i - 1 + n) % n]!.segment;
    const after = contour.spans[i]!.segment;
    return [before.kind === 'cubic' ? before.p2 : before.p0, node.point, after.kind === 'cubic' ? after.p1 : after.p1];
  });
}

function turnAt(contour: FittedContour, i: number): number {
  const n = contour.nodes.length;
  return turnAtJoin(contour.spans[(i - 1 + n) % n]!.segment, contour.spans[i]!.segment);
}

const median = (values: readonly number[]): number => values.slice().sort((x, y) => x - y)[values.length >> 1]!;

describe('grid rounding of a broken fit', () => {
  it('refuses a control point far outside the traced ink with an error saying what to do, instead of searching the lattice along it', () => {
    // Reference: a cubic lies inside the convex hull of its control points (Farin,
    // "Curves and Surfaces for CAGD"), so the handles of a curve fitted to the ink stay
    // near it. A degenerate least-squares fit once put a handle 6·10⁸ units out, and the
    // searches along that handle ran out of memory.
    const { chain, contour } = rotatedEllipse(120, 80, 0.3);
    const first = contour.spans[0]!.segment as CubicSegment;
    const broken: FittedContour = { ...contour, spans: contour.spans.map((span, k) => (k === 0 ? { ...span, segment: cubic(first.p0, { x: -6e8, y: 3e6 }, first.p2, first.p3) } : span)) };
    expect(() => roundToGrid(chain, broken, 1, 1.5)).toThrow(/far outside the traced ink.*fit this letter again/);
    expect(roundToGrid(chain, contour, 1, 1.5).spans).toHaveLength(4);
  });
});

describe('rounding sloped smooth joins with irrational handles', () => {
  // 15°, 22.5° and 7.5° are 45°·1/3, 45°·1/2 and 45°·1/6; atan(1/√2) has no rational tangent at all.
  const rotations = [Math.PI / 12, Math.PI / 8, Math.PI / 24, Math.atan(Math.SQRT1_2), (5 * Math.PI) / 18];
  const shapes = rotations.flatMap((rotation) => [rotatedEllipse(250, 120, rotation), rotatedEllipse(90 * Math.SQRT2, 40 * Math.E, rotation), rotatedEllipse(300, 30, rotation)]);

  it(`keeps every sloped join collinear within ${COLLINEAR_DEGREES}°, far below a visible kink`, () => {
    for (const { chain, contour } of shapes) {
      const rounded = roundToGrid(chain, contour, 1, 1.5);
      rounded.nodes.forEach((_, i) => {
        // COLLINEAR_DEGREES (0.05°) is a sixth of the 0.3° near-miss kink threshold.
        expect(turnAt(rounded, i)).toBeLessThanOrEqual(COLLINEAR_DEGREES);
        expect(COLLINEAR_DEGREES).toBeLessThan(KINK_MIN_DEGREES);
      });
    }
  });

  it('moves no on-curve point by more than half a unit in either axis, and stays within the tolerance', () => {
    for (const { chain, contour } of shapes) {
      // The unrounded contour lies on its chain (margin = the whole tolerance of 1 unit ≥ half a unit).
      const rounded = roundToGrid(chain, contour, 1, 1);
      rounded.nodes.forEach((node, i) => {
        expect(Math.abs(node.point.x - contour.nodes[i]!.point.x)).toBeLessThanOrEqual(0.5);
        expect(Math.abs(node.point.y - contour.nodes[i]!.point.y)).toBeLessThanOrEqual(0.5);
      });
      for (const span of rounded.spans) expect(span.maxError).toBeLessThanOrEqual(1);
    }
  });

  it('puts every coordinate on the grid, keeps axis-aligned joins exactly collinear, and leaves its input alone', () => {
    for (const [rotation, grid] of [[0, 1], [Math.PI / 12, 1], [0, 2], [Math.PI / 8, 0.5]] as const) {
      const { chain, contour } = rotatedEllipse(250, 120, rotation);
      const snapshot = JSON.stringify(contour);
      const rounded = roundToGrid(chain, contour, grid, 1.5);
      expect(JSON.stringify(contour)).toBe(snapshot);
      for (const [hIn, p, hOut] of triples(rounded)) {
        for (const q of [hIn, p, hOut]) {
          expect(Number.isInteger(q.x / grid)).toBe(true);
          expect(Number.isInteger(q.y / grid)).toBe(true);
        }
        if (rotation === 0) {
          // Unrotated, every join is an extremum: both handles share the point's x or its y exactly.
          expect((hIn.x === p.x && hOut.x === p.x) || (hIn.y === p.y && hOut.y === p.y)).toBe(true);
        }
      }
    }
  });
});

describe('rounding the smooth-fit shapes', () => {
  // The noisy brush-like shapes of smooth-fit.test.ts, fitted as there (tolerance 1.15,
  // the default 1.5 less the rounding reserve) and rounded against the full 1.5.
  const shapes = [
    ['a five-lobed wobble', polarChain({ x: 400, y: 400 }, (theta) => 300 + 30 * Math.sin(5 * theta), 0.3, 7)],
    ['a superellipse (exponent 2.5)', polarChain({ x: 500, y: 400 }, superellipseRadius(300, 220, 2.5), 0.3, 5)],
  ] as const;
  for (const [name, points] of shapes) {
    const { chain } = prepareChain(points);
    const fitted = fitSmoothContour(chain, { tolerance: 1.15, pixel: chain.medianStep });
    const rounded = roundToGrid(chain, fitted, 1, 1.5);

    it(`keeps every span of ${name} within the tolerance where the fit left half a unit to spare`, () => {
      // Measured before this search: two spans at 1.75 and 2.07 units, pushed out by
      // on-curve points moved 1.5 units to reach an exactly collinear triple.
      let checked = 0;
      rounded.spans.forEach((span, i) => {
        if (fitted.spans[i]!.maxError > 1.5 - 0.5) return;
        checked++;
        expect(span.maxError, `span ${i}`).toBeLessThanOrEqual(1.5);
      });
      expect(checked).toBeGreaterThan(fitted.spans.length / 2);
    });

    it(`keeps the on-curve points of ${name} within half a unit and its sloped joins collinear`, () => {
      rounded.nodes.forEach((node, i) => {
        expect(Math.abs(node.point.x - fitted.nodes[i]!.point.x)).toBeLessThanOrEqual(0.5);
        expect(Math.abs(node.point.y - fitted.nodes[i]!.point.y)).toBeLessThanOrEqual(0.5);
        expect(turnAt(rounded, i), `join ${i}`).toBeLessThanOrEqual(COLLINEAR_DEGREES);
      });
    });
  }
});

describe('rounding faired outlines', () => {
  // The fairing tests' shapes (fairing.test.ts), fitted at the default tolerance and
  // faired to G2 at the fitting tolerance, plus the smooth-fit wobble.
  const cases = [
    ellipseChain({ x: 400, y: 300 }, 250, 120, 0, 0.15, 2),
    ellipseChain({ x: 400, y: 300 }, 250, 120, Math.PI / 6, 0.15, 2),
    ellipseChain({ x: 400, y: 300 }, 300, 180, 0.4, 0.3, 5),
    sCurveBandChain(400, 120, 80, 0.15, 3),
  ].map((points) => {
    const { chain } = prepareChain(points);
    return { chain, faired: fairSmoothJoins(chain, fitContour(points, { tolerance: 1.5 }).fitted, 1.15) };
  });
  const wobble = prepareChain(polarChain({ x: 400, y: 400 }, (theta) => 300 + 30 * Math.sin(5 * theta), 0.3, 7)).chain;
  cases.push({ chain: wobble, faired: fairSmoothJoins(wobble, fitSmoothContour(wobble, { tolerance: 1.15, pixel: wobble.medianStep }), 1.15) });

  it('keeps most of the curvature continuity fairing made (median step at G2 joins ≤ 5 %)', () => {
    const steps: number[] = [];
    for (const { chain, faired } of cases) {
      const before = joinCurvatures(faired);
      const after = joinCurvatures(roundToGrid(chain, faired, 1, 1.5));
      const n = faired.nodes.length;
      before.forEach((join, i) => {
        const cubics = faired.spans[(i - 1 + n) % n]!.segment.kind === 'cubic' && faired.spans[i]!.segment.kind === 'cubic';
        if (join.smooth && cubics && join.relativeJump <= G2_RELATIVE_TOLERANCE) steps.push(after[i]!.relativeJump);
      });
    }
    expect(steps.length).toBeGreaterThanOrEqual(20);
    // Measured: median 4.2 %, worst 56 % over 22 G2 joins; the rounding before this
    // search, which chose among exactly collinear triples by distance alone: 7.0 % and
    // 130 %. A 5 % step is a tooth or two of an editor's comb at the scale fairing.ts
    // judges G2 by (G2_RELATIVE_TOLERANCE, 2 %).
    expect(median(steps)).toBeLessThanOrEqual(0.05);
    expect(Math.max(...steps)).toBeLessThanOrEqual(0.75);
  });
});

/**
 * A fitted contour for `segments` (closed: each ends where the next starts), with a
 * chain sampled along the segments themselves, so the unrounded contour has no error.
 * `smooth[k]` marks node k (the start of segment k) as a smooth join, with the
 * direction of the line on one side as its tangent.
 */
function contourOf(segments: readonly (LineSegment | CubicSegment)[], smooth: readonly boolean[]): { chain: BoundaryChain; contour: FittedContour } {
  const samples: Point[] = [];
  const starts: number[] = [];
  for (const s of segments) {
    starts.push(samples.length);
    const end = s.kind === 'line' ? s.p1 : s.p3;
    const steps = Math.ceil(Math.hypot(end.x - s.p0.x, end.y - s.p0.y) * 1.2);
    for (let k = 0; k < steps; k++) samples.push(evaluate(s, k / steps));
  }
  const { chain } = prepareChain(samples);
  expect(chain.count).toBe(samples.length);
  const m = segments.length;
  const nodes: FitNode[] = segments.map((s, k) => {
    const before = segments[(k - 1 + m) % m]!;
    const [from, to] = s.kind === 'line' ? [s.p0, s.p1] : before.kind === 'line' ? [before.p0, before.p1] : [before.p2, before.p3];
    const towards = { x: to.x - from.x, y: to.y - from.y };
    const l = Math.hypot(towards.x, towards.y);
    const tangent = smooth[k] ? { x: towards.x / l, y: towards.y / l } : null;
    return { point: s.p0, smooth: smooth[k]!, tangentIn: tangent, tangentOut: tangent, extremum: null, corner: null, index: starts[k]!, pinned: true };
  });
  const spans: FitSpan[] = segments.map((segment, k) => ({ segment, first: starts[k]!, last: k < m - 1 ? starts[k + 1]! : samples.length, maxError: 0, carrier: null }));
  return { chain, contour: { nodes, spans } };
}

describe('rounding sloped lines that run smoothly into curves', () => {
  // A diagonal stem (the strokes of A, K, V, W, X, Y, k, v, w, x, y) ending in a curve
  // drawn tangent to it: before this search, the rounded handle was the lattice point
  // nearest the line's direction, 0.3°–6° off on the round trip of Linux Libertine.
  const at = (o: Point, u: Point, n: Point, along: number, across: number): Point => ({ x: o.x + along * u.x + across * n.x, y: o.y + along * u.y + across * n.y });
  /** A line of `length` from `origin` in direction `slope`, curving away at one end (or both) with handles of `handle` units. */
  function stroke(slope: Point, origin: Point, length: number, handle: number, bothEnds: boolean): { chain: BoundaryChain; contour: FittedContour } {
    const l = Math.hypot(slope.x, slope.y);
    const u = { x: slope.x / l, y: slope.y / l };
    const n = { x: -u.y, y: u.x };
    const j0 = origin;
    const j1 = at(origin, u, n, length, 0);
    const c1 = at(j1, u, n, 50, 70);
    const toC1 = cubic(j1, at(j1, u, n, handle, 0), at(c1, u, n, 0, -40), c1);
    if (!bothEnds) return contourOf([line(j0, j1), toC1, line(c1, j0)], [false, true, false]);
    const k = at(j0, u, n, -50, 70);
    const fromK = cubic(k, at(k, u, n, 0, -40), at(j0, u, n, -handle, 0), j0);
    return contourOf([fromK, line(j0, j1), toC1, line(c1, k)], [false, true, true, false]);
  }
  // 37:91 and 91:−37 reduce to themselves (a 98-unit step); 1:√2, √3:1 and π:−e have no rational slope at all.
  const slopes = [{ x: 37, y: 91 }, { x: 91, y: -37 }, { x: 1, y: Math.SQRT2 }, { x: Math.sqrt(3), y: 1 }, { x: Math.PI, y: -Math.E }, { x: -2.2, y: 5.1 }];
  const origins = [{ x: 100 + Math.SQRT2 / 3, y: 200 + Math.PI / 7 }, { x: 333.71, y: 48.29 }];
  const cases = slopes.flatMap((slope) => origins.flatMap((origin) => [false, true].flatMap((both) => [[9.6, 160], [5.3, 120], [13.1, 150]].map(([handle, length]) => ({ slope, origin, both, handle: handle!, length: length!, ...stroke(slope, origin, length!, handle!, both) })))));

  const tolerance = 1;
  /** Per case: the integer cross product (line direction × handle) at each join, whether every span held the tolerance, and the handles' lengths. */
  const results = cases.map((c) => {
    const rounded = roundToGrid(c.chain, c.contour, 1, tolerance);
    const lineIndex = c.both ? 1 : 0;
    const stem = rounded.spans[lineIndex]!.segment;
    const d = { x: stem.p1.x - stem.p0.x, y: stem.p1.y - stem.p0.y };
    const ends: [Point, Point][] = [[stem.p1, (rounded.spans[lineIndex + 1]!.segment as CubicSegment).p1]];
    if (c.both) ends.push([stem.p0, (rounded.spans[0]!.segment as CubicSegment).p2]);
    const joins = ends.map(([point, handle]) => {
      const h = { x: handle.x - point.x, y: handle.y - point.y };
      // Integer arithmetic: every coordinate is on the grid, so the cross product is exact.
      return { cross: d.x * h.y - d.y * h.x, turn: turnAt(rounded, rounded.nodes.findIndex((node) => node.point === point)), length: Math.hypot(h.x, h.y) };
    });
    const name = `slope ${c.slope.x.toFixed(2)}:${c.slope.y.toFixed(2)} from (${c.origin.x.toFixed(2)}, ${c.origin.y.toFixed(2)}), handle ${c.handle}, length ${c.length}${c.both ? ', curves at both ends' : ''}`;
    return { ...c, name, joins, held: rounded.spans.every((span) => span.maxError <= tolerance) };
  });

  it('makes the join exactly collinear on the grid (integer cross product 0) where the tolerance allows, and holds the tolerance there', () => {
    // Cases measured exact: 37:91 and 91:−37 with 13-unit handles on a 150-unit line reach
    // the 5:2 (resp. 5:−2) direction, 0.33° off, which the tolerance allows over that length.
    const anchors = results.filter((r) => (r.slope.x === 37 || r.slope.x === 91) && r.handle === 13.1);
    expect(anchors.length).toBe(8);
    for (const r of anchors) {
      for (const j of r.joins) expect(j.cross, r.name).toBe(0);
      expect(r.held, r.name).toBe(true);
    }
    for (const r of results) {
      for (const j of r.joins) {
        if (j.cross !== 0) continue;
        expect(j.turn, r.name).toBe(0);
        // The handle keeps its length within the slide range (3 cells), or within the
        // longer search that continues the line (half to twice the length, or 20 cells).
        expect(j.length, r.name).toBeGreaterThanOrEqual(Math.min(r.handle - 3, 0.5 * r.handle) - 1e-9);
        expect(j.length, r.name).toBeLessThanOrEqual(Math.max(r.handle + 3, 2 * r.handle, 20) + 1e-9);
      }
    }
    // Measured: 48 of the 108 joins exact; the rounding before this search (the lattice
    // point nearest the line's direction within 85–115 % of the handle length): 13. The
    // rest have no lattice direction short enough within the tolerance: a join end moved
    // along the line costs its whole displacement in error (the line and the cubic each
    // leave the chain points past their new ends), so the ends stay within about a unit
    // of the ideal, and a short direction must then be there by chance.
    const exact = results.flatMap((r) => r.joins).filter((j) => j.cross === 0).length;
    expect(exact).toBeGreaterThanOrEqual(40);
  });

  it('continues the line within the kink threshold where no exact direction fits, with a longer handle that still fits', () => {
    // The near-miss kink range is 0.3°–8° (quality-report.ts). Where no short lattice
    // direction lies within the tolerance, a lattice point farther along the rounded line
    // continues it within 0.25°; the cubic must still hold the tolerance.
    const joins = results.flatMap((r) => r.joins.map((j) => ({ ...j, name: r.name, held: r.held })));
    const kinks = joins.filter((j) => j.turn >= KINK_MIN_DEGREES && j.turn <= 8);
    // Where no lattice point on the line fits either, the join slides back along the
    // line and the cubic takes over the stretch, with a handle longer by as much.
    // Measured: 13 of the 108 joins still near-miss kinks, where a curve turning hard
    // within 50 units cannot take a longer handle within the tolerance of 1 unit (17
    // without the slide, 20 with the nearest-collinear handle alone).
    expect(joins).toHaveLength(108);
    expect(kinks.length).toBeLessThanOrEqual(13);
  });

  it('puts every coordinate on the grid and leaves its input alone', () => {
    for (const c of cases.slice(0, 8)) {
      const snapshot = JSON.stringify(c.contour);
      const rounded = roundToGrid(c.chain, c.contour, 1, 1);
      expect(JSON.stringify(c.contour)).toBe(snapshot);
      for (const span of rounded.spans) {
        const s = span.segment;
        for (const q of s.kind === 'line' ? [s.p0, s.p1] : [s.p0, s.p1, s.p2, s.p3]) expect(Number.isInteger(q.x) && Number.isInteger(q.y)).toBe(true);
      }
    }
  });
});

describe('rounding the handles of a cubic between two corners', () => {
  it('keeps a serif end face from bulging past its end points after rounding', () => {
    // The end face of a Linux Libertine serif as fitted on the round trip (the letters i,
    // j, m, n, p, r): handles a fraction of a unit inside the end points; rounded on their
    // own they gave {(35,413), (34,404), (34,394), (37,385)}, whose x-minimum sticks out
    // 0.6 units past its ends, an extremum-inside-segment warning.
    const face = cubic({ x: 35.3, y: 413.2 }, { x: 34.49, y: 404.2 }, { x: 34.49, y: 394.1 }, { x: 37.3, y: 385.2 });
    const protrusion = (s: CubicSegment): number => Math.max(0, ...segmentExtrema(s).map((e) => e.protrusion));
    expect(protrusion(face)).toBeLessThanOrEqual(EXTREMUM_PROTRUSION_LIMIT);
    expect(protrusion(cubic({ x: 35, y: 413 }, { x: 34, y: 404 }, { x: 34, y: 394 }, { x: 37, y: 385 }))).toBeGreaterThan(EXTREMUM_PROTRUSION_LIMIT);
    const { chain, contour } = contourOf([face, line(face.p3, { x: 137.4, y: 385.2 }), line({ x: 137.4, y: 385.2 }, { x: 137.4, y: 413.2 }), line({ x: 137.4, y: 413.2 }, face.p0)], [false, false, false, false]);
    const rounded = roundToGrid(chain, contour, 1, 1);
    const s = rounded.spans[0]!.segment as CubicSegment;
    expect(protrusion(s), JSON.stringify(s)).toBeLessThanOrEqual(EXTREMUM_PROTRUSION_LIMIT);
    expect(rounded.spans[0]!.maxError).toBeLessThanOrEqual(1);
    for (const q of [s.p0, s.p1, s.p2, s.p3]) expect(Number.isInteger(q.x) && Number.isInteger(q.y)).toBe(true);
  });
});

describe('rounding smooth joins that lean less than the axis-snap angle', () => {
  // Reference: common practice in outline drawing — a join whose tangent is within a
  // degree or two of horizontal or vertical is drawn with axis-aligned handles, which are
  // then exactly collinear and make the join an extremum point.
  const { chain, contour } = rotatedEllipse(90, 60, (1.5 * Math.PI) / 180);
  const axisSnap = (2 * Math.PI) / 180;

  it('puts both handles on the axis, exactly, within the tolerance', () => {
    const rounded = roundToGrid(chain, contour, 1, 1.5, axisSnap);
    for (const [handleIn, point, handleOut] of triples(rounded)) {
      const vertical = handleIn.x === point.x && handleOut.x === point.x;
      const horizontal = handleIn.y === point.y && handleOut.y === point.y;
      expect(vertical || horizontal, JSON.stringify(point)).toBe(true);
    }
    for (const span of rounded.spans) expect(span.maxError).toBeLessThanOrEqual(1.5);
  });

  it('leaves them sloped when no axis snap is asked for', () => {
    const rounded = roundToGrid(chain, contour, 1, 1.5);
    const onAxis = triples(rounded).filter(([handleIn, point, handleOut]) => (handleIn.x === point.x && handleOut.x === point.x) || (handleIn.y === point.y && handleOut.y === point.y));
    expect(onAxis).toHaveLength(0);
  });
});
