// The continuity readout beside each on-curve point. If these broke, a designer would
// be told a corner is smooth, or a tangent-only join is curvature-continuous.
import { describe, expect, it } from 'vitest';
import { cubic, line } from '../../core/geometry/segment.ts';
import { splitAt } from '../../core/geometry/split.ts';
import { offCurve, onCurve } from '../../core/outline/index.ts';
import { classifyJoin, contourContinuity } from '../../renderer/src/editor/continuity.ts';

describe('join continuity', () => {
  it('calls the join inside one cubic split in two G2', () => {
    // A cubic split at any t is C² at the split (de Casteljau), hence G2.
    const [a, b] = splitAt(cubic({ x: 0, y: 0 }, { x: 100, y: 300 }, { x: 400, y: 300 }, { x: 500, y: 0 }), 0.37);
    const join = classifyJoin(a, b);
    expect(join.continuity).toBe('G2');
    expect(join.curvatureIn).toBeCloseTo(join.curvatureOut, 9);
  });

  it('calls a tangent join whose curvature jumps G1', () => {
    // A straight line into a curve leaving along the same direction: tangent, but κ jumps from 0.
    const incoming = line({ x: -200, y: 0 }, { x: 0, y: 0 });
    const outgoing = cubic({ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 200, y: 100 }, { x: 200, y: 200 });
    const join = classifyJoin(incoming, outgoing);
    expect(join.continuity).toBe('G1');
    expect(join.turnDegrees).toBe(0);
    expect(Math.abs(join.curvatureOut)).toBeGreaterThan(0);
  });

  it('calls a collinear handle pair with unequal end curvatures G1, and equalised ones G2', () => {
    // Both cubics leave the join horizontally; end curvature is (2/3)·h/d² for a far handle
    // at height h and a near handle at distance d (the standard end-curvature formula).
    const a = cubic({ x: -300, y: 120 }, { x: -200, y: 60 }, { x: -100, y: 0 }, { x: 0, y: 0 });
    const jump = classifyJoin(a, cubic({ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 200, y: 120 }, { x: 300, y: 240 }));
    expect(jump.continuity).toBe('G1');
    // Mirror image of `a` about x = 0 continues it with the same curvature on the other side.
    const mirrored = cubic({ x: 0, y: 0 }, { x: 100, y: 0 }, { x: 200, y: 60 }, { x: 300, y: 120 });
    expect(classifyJoin(a, mirrored).continuity).toBe('G2');
  });

  it('calls a turn of a few degrees a corner', () => {
    const incoming = line({ x: -100, y: 0 }, { x: 0, y: 0 });
    const outgoing = line({ x: 0, y: 0 }, { x: 100, y: 100 * Math.tan((2 * Math.PI) / 180) });
    const join = classifyJoin(incoming, outgoing);
    expect(join.continuity).toBe('corner');
    expect(join.turnDegrees).toBeCloseTo(2, 9);
  });

  it('reports every on-curve point of a contour by its index', () => {
    const contour = { points: [onCurve(0, 0), onCurve(100, 0, true), offCurve(155, 0), offCurve(200, 45), onCurve(200, 100), onCurve(0, 100)] };
    const joins = contourContinuity(contour);
    expect([...joins.keys()]).toEqual([0, 1, 4, 5]);
    expect(joins.get(0)?.continuity).toBe('corner');
    expect(joins.get(1)?.continuity).toBe('G1');
  });
});
