// The quality report: the figures and warnings a designer reads to decide whether an
// outline can be kept as it is.

import { describe, expect, it } from 'vitest';
import { prepareChain } from '../../core/fit/boundary-chain.ts';
import { contourReport } from '../../core/fit/quality-report.ts';
import type { FitNode, FittedContour } from '../../core/fit/fitted-contour.ts';
import { fitContour, turnAtJoin } from '../../core/fit/index.ts';
import { cubic, line, type Point } from '../../core/geometry/index.ts';
import { squareChain } from './synthetic-chains.ts';

const node = (point: Point, index: number, smooth = false): FitNode => ({ point, smooth, tangentIn: null, tangentOut: null, extremum: null, corner: null, index, pinned: true });

describe('quality report', () => {
  it('reports a clean square as exact: 4 corners, 4 lines, no warnings', () => {
    const fit = fitContour(squareChain(0, 0, 300, 0.1, 5));
    expect(fit.report.segmentCount).toBe(4);
    expect(fit.report.lineCount).toBe(4);
    expect(fit.report.cornerCount).toBe(4);
    expect(fit.report.onCurveCount).toBe(4);
    expect(fit.report.warnings).toEqual([]);
    expect(fit.report.maxDeviationOutsideCorners).toBeLessThan(0.6);
    expect(fit.report.maxOutlineDeviation).toBeLessThan(0.6);
  });

  it('warns about a near-miss kink, an extremum left inside a segment, crossing handles and a stray segment', () => {
    // A square chain, "fitted" by hand with defects.
    const chainPoints = squareChain(0, 0, 100, 0, 1);
    const { chain } = prepareChain(chainPoints);
    const quarter = chain.count / 4;
    const a = { x: 100, y: 0 };
    const b = { x: 100, y: 100 };
    const c = { x: 0, y: 100 };
    const d = { x: 0, y: 0 };
    const contour: FittedContour = {
      nodes: [node(a, quarter / 2), node(b, quarter * 1.5, true), node(c, quarter * 2.5), node(d, quarter * 3.5)],
      spans: [
        // Right side bulging out: an x-extremum inside, far from the boundary; arrives at b vertically.
        { segment: cubic(a, { x: 160, y: 30 }, { x: 100, y: 70 }, b), first: quarter / 2, last: quarter * 1.5, maxError: 22.5, carrier: null },
        // Top side leaving b 3° off the incoming direction: a near-miss kink at b.
        { segment: cubic(b, { x: 100 - 30 * Math.sin((3 * Math.PI) / 180), y: 100 + 30 * Math.cos((3 * Math.PI) / 180) }, { x: 0, y: 130 }, c), first: quarter * 1.5, last: quarter * 2.5, maxError: 22.5, carrier: null },
        { segment: line(c, d), first: quarter * 2.5, last: quarter * 3.5, maxError: 0, carrier: null },
        // Bottom side with crossing handles.
        { segment: cubic(d, { x: 80, y: 5 }, { x: 20, y: 5 }, a), first: quarter * 3.5, last: quarter * 4.5, maxError: 2, carrier: null },
      ],
    };
    const report = contourReport(chain, contour, 1.5);
    const kinds = new Set(report.warnings.map((w) => w.kind));
    expect(kinds).toEqual(new Set(['tolerance-exceeded', 'extremum-inside-segment', 'near-miss-kink', 'crossing-handles']));
    const kink = report.warnings.find((w) => w.kind === 'near-miss-kink')!;
    expect(kink.value).toBeCloseTo(3, 6);
    expect(report.maxDeviation).toBeGreaterThan(20);
  });

  it('measures the turn at a join from the nearest distinct control points', () => {
    const before = cubic({ x: 0, y: 0 }, { x: 50, y: 0 }, { x: 100, y: 0 }, { x: 100, y: 0 });
    const after = line({ x: 100, y: 0 }, { x: 100, y: 100 });
    expect(turnAtJoin(before, after)).toBeCloseTo(90, 9);
  });
});
