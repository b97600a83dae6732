// Fairing: smooth joins made curvature-continuous (G2), so a curvature comb runs on
// across them without a step, while the outline stays within the tolerance of the
// traced boundary and keeps its on-curve points and tangents.

import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import { prepareChain, type BoundaryChain } from '../../core/fit/boundary-chain.ts';
import { fairSmoothJoinsWithReport, G2_RELATIVE_TOLERANCE, joinCurvatures, type FairingResult } from '../../core/fit/fairing.ts';
import { fitContour } from '../../core/fit/fit-contour.ts';
import type { FittedContour } from '../../core/fit/fitted-contour.ts';
import { roundToGrid } from '../../core/fit/grid-rounding.ts';
import { measureSpanError } from '../../core/fit/span-error.ts';
import { derivative, evaluate, gaussLegendreRule, integrateWithRule, type CubicSegment, type Point } from '../../core/geometry/index.ts';
import { gaussianSource } from '../raster/degrade.ts';
import { seededRandom } from '../support/seeded-random.ts';
import { ellipseChain, sCurveBandChain, stadiumChain } from './synthetic-chains.ts';

const TOLERANCE = 1.5;
/** The tolerance fitContour fits to (DEFAULT tolerance less its rounding reserve, fit-contour.ts), and so the one fairing must keep. */
const FIT_TOLERANCE = TOLERANCE - 0.35;

/**
 * Superellipse |x/a|^p + |y/b|^p = 1 (Lamé curve; Piet Hein's "super-ellipse", p = 2.5),
 * counter-clockwise, about one point per unit of arc, with seeded Gaussian noise
 * along the normal.
 */
function superellipseChain(c: Point, a: number, b: number, p: number, noise: number, seed: number): Point[] {
  const at = (theta: number): Point => {
    const cos = Math.cos(theta);
    const sin = Math.sin(theta);
    return { x: c.x + a * Math.sign(cos) * Math.abs(cos) ** (2 / p), y: c.y + b * Math.sign(sin) * Math.abs(sin) ** (2 / p) };
  };
  const dense = 20000;
  const table = [0];
  for (let i = 1; i <= dense; i++) {
    const q0 = at((2 * Math.PI * (i - 1)) / dense + 0.2);
    const q1 = at((2 * Math.PI * i) / dense + 0.2);
    table.push(table[i - 1]! + Math.hypot(q1.x - q0.x, q1.y - q0.y));
  }
  const total = table[dense]!;
  const count = Math.round(total);
  const gauss = gaussianSource(seededRandom(seed));
  const thetaAt = (s: number): number => {
    const target = s * total;
    let lo = 0;
    let hi = dense;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (table[mid]! <= target) lo = mid;
      else hi = mid;
    }
    return (2 * Math.PI * (lo + (target - table[lo]!) / (table[lo + 1]! - table[lo]! || 1))) / dense + 0.2;
  };
  const points: Point[] = [];
  for (let i = 0; i < count; i++) {
    const q = at(thetaAt(i / count));
    const ahead = at(thetaAt(Math.min(1, (i + 0.5) / count)));
    const behind = at(thetaAt(Math.max(0, (i - 0.5) / count)));
    const tx = ahead.x - behind.x;
    const ty = ahead.y - behind.y;
    const l = Math.hypot(tx, ty) || 1;
    const e = noise * gauss();
    points.push({ x: q.x - (ty / l) * e, y: q.y + (tx / l) * e });
  }
  return points;
}

interface Case {
  chain: BoundaryChain;
  fitted: FittedContour;
  result: FairingResult;
}

function faired(points: readonly Point[]): Case {
  const { fitted } = fitContour(points, { tolerance: TOLERANCE });
  const { chain } = prepareChain(points);
  return { chain, fitted, result: fairSmoothJoinsWithReport(chain, fitted, FIT_TOLERANCE) };
}

const shapes = {
  'a clean ellipse': () => ellipseChain({ x: 400, y: 300 }, 250, 120, 0, 0.15, 2),
  'a clean ellipse rotated 30°': () => ellipseChain({ x: 400, y: 300 }, 250, 120, Math.PI / 6, 0.15, 2),
  'a noisy ellipse': () => ellipseChain({ x: 400, y: 300 }, 300, 180, 0.4, 0.3, 5),
  'a superellipse': () => superellipseChain({ x: 500, y: 400 }, 300, 220, 2.5, 0.2, 7),
  'a noisy superellipse': () => superellipseChain({ x: 500, y: 400 }, 260, 300, 2.5, 0.35, 9),
  'an S-shaped band': () => sCurveBandChain(400, 120, 80, 0.15, 3),
};
const cases = new Map<string, Case>(Object.entries(shapes).map(([name, make]) => [name, faired(make())]));

/** Curvature from bezier-js (npm `bezier-js` 6.1.4, Pomax), the outside reference for κ. */
function referenceCurvature(segment: CubicSegment, t: number): number {
  const { p0, p1, p2, p3 } = segment;
  return new Bezier(p0.x, p0.y, p1.x, p1.y, p2.x, p2.y, p3.x, p3.y).curvature(t).k;
}

/** Largest |κ| sampled along a cubic with bezier-js. */
function referencePeak(segment: CubicSegment): number {
  let peak = 0;
  for (let k = 0; k <= 64; k++) peak = Math.max(peak, Math.abs(referenceCurvature(segment, k / 64)));
  return peak;
}

/** Strain energy ∫κ² ds of the cubics, by 24-point Gauss–Legendre on 8 pieces per cubic. */
function strainEnergy(contour: FittedContour): number {
  const rule = gaussLegendreRule(24);
  let total = 0;
  for (const span of contour.spans) {
    const s = span.segment;
    if (s.kind !== 'cubic') continue;
    const integrand = (t: number): number => {
      const k = referenceCurvature(s, t);
      const d = derivative(s, t);
      return k * k * Math.hypot(d.x, d.y);
    };
    for (let piece = 0; piece < 8; piece++) total += integrateWithRule(integrand, piece / 8, (piece + 1) / 8, rule);
  }
  return total;
}

/** Largest distance from the span's chain points to its segment, by dense sampling (an upper bound, independent of span-error.ts). */
function sampledError(chain: BoundaryChain, contour: FittedContour, i: number): number {
  const span = contour.spans[i]!;
  const samples = Array.from({ length: 2001 }, (_, k) => evaluate(span.segment, k / 2000));
  let worst = 0;
  for (let k = span.first; k <= span.last; k++) {
    const j = ((k % chain.count) + chain.count) % chain.count;
    const x = chain.xs[j]! + chain.origin.x;
    const y = chain.ys[j]! + chain.origin.y;
    let best = Infinity;
    for (const q of samples) best = Math.min(best, Math.hypot(q.x - x, q.y - y));
    worst = Math.max(worst, best);
  }
  return worst;
}

/** |κ_in − κ_out| over the scale joinCurvatures documents, from bezier-js curvatures. */
function referenceJump(contour: FittedContour, i: number): number {
  const n = contour.nodes.length;
  const before = contour.spans[(i - 1 + n) % n]!.segment;
  const after = contour.spans[i]!.segment;
  const kIn = before.kind === 'cubic' ? referenceCurvature(before, 1) : 0;
  const kOut = after.kind === 'cubic' ? referenceCurvature(after, 0) : 0;
  const peak = Math.max(before.kind === 'cubic' ? referencePeak(before) : 0, after.kind === 'cubic' ? referencePeak(after) : 0);
  const scale = before.kind === 'cubic' && after.kind === 'cubic' ? Math.max(Math.abs(kIn), Math.abs(kOut), 0.1 * peak) : peak;
  return Math.abs(kIn - kOut) / scale;
}

describe('fairing smooth joins', () => {
  it('makes at least half the smooth joins of clean ellipses curvature-continuous', () => {
    // Measured: 4 of 8 joins on the axis-aligned ellipse (the others would leave the
    // tolerance or worsen a neighbour), 6 of 6 on the rotated one.
    const count = (name: string): [number, number] => {
      const { result } = cases.get(name)!;
      return [result.joins.filter((j) => j.outcome === 'g2').length, result.joins.length];
    };
    const [straight, straightTotal] = count('a clean ellipse');
    expect(straight).toBeGreaterThanOrEqual(straightTotal / 2);
    const [rotated, rotatedTotal] = count('a clean ellipse rotated 30°');
    expect(rotated).toBe(rotatedTotal);
  });

  it('leaves no curvature step above 2 % at the joins it reports as G2 (checked with bezier-js)', () => {
    for (const [name, { result }] of cases) {
      for (const j of result.joins) {
        if (j.outcome !== 'g2') continue;
        // Reference: bezier-js's curvature (x′y″ − y′x″)/|B′|³ at the span ends.
        expect(referenceJump(result.contour, j.node), `${name}, node ${j.node}`).toBeLessThanOrEqual(G2_RELATIVE_TOLERANCE);
      }
    }
  });

  it('reports the same end curvatures as bezier-js', () => {
    for (const { result } of cases.values()) {
      const { nodes, spans } = result.contour;
      const n = nodes.length;
      for (const c of joinCurvatures(result.contour)) {
        const before = spans[(c.node - 1 + n) % n]!.segment;
        const after = spans[c.node]!.segment;
        // Reference: bezier-js Bezier.curvature(t).k.
        if (before.kind === 'cubic') expect(c.kappaIn).toBeCloseTo(referenceCurvature(before, 1), 12);
        if (after.kind === 'cubic') expect(c.kappaOut).toBeCloseTo(referenceCurvature(after, 0), 12);
      }
    }
  });

  it('keeps every span within the tolerance of the traced boundary', () => {
    for (const [name, { chain, result }] of cases) {
      result.contour.spans.forEach((span, i) => {
        expect(span.maxError, `${name}, span ${i}`).toBeLessThanOrEqual(FIT_TOLERANCE);
        expect(measureSpanError(chain, span.segment, span.first, span.last, FIT_TOLERANCE)).toBeLessThanOrEqual(FIT_TOLERANCE);
        // Dense sampling of the curve bounds the true distance from above (sampling step ≤ 0.5 unit here).
        expect(sampledError(chain, result.contour, i), `${name}, span ${i}`).toBeLessThanOrEqual(FIT_TOLERANCE + 0.25);
      });
    }
  });

  it('keeps on-curve points, tangent directions and positive, uncrossed handles', () => {
    for (const [name, { fitted, result }] of cases) {
      expect(result.contour.nodes).toEqual(fitted.nodes);
      result.contour.spans.forEach((span, i) => {
        const original = fitted.spans[i]!;
        expect(span.first).toBe(original.first);
        expect(span.last).toBe(original.last);
        if (span.segment.kind !== 'cubic' || original.segment.kind !== 'cubic') return;
        const s = span.segment;
        const o = original.segment;
        expect([s.p0, s.p3]).toEqual([o.p0, o.p3]);
        for (const [h, q, end] of [
          [s.p1, o.p1, s.p0],
          [s.p2, o.p2, s.p3],
        ] as const) {
          const a = { x: h.x - end.x, y: h.y - end.y };
          const b = { x: q.x - end.x, y: q.y - end.y };
          const la = Math.hypot(a.x, a.y);
          const lb = Math.hypot(b.x, b.y);
          expect(la, `${name}, span ${i}`).toBeGreaterThan(0);
          // Same direction: unit vectors agree to rounding.
          expect(Math.abs(a.x * b.y - a.y * b.x) / (la * lb)).toBeLessThanOrEqual(1e-12);
          expect(a.x * b.x + a.y * b.y).toBeGreaterThan(0);
        }
      });
    }
  });

  it('lowers the curvature steps without raising the strain energy ∫κ² ds by more than 5 %', () => {
    for (const [name, { fitted, result }] of cases) {
      const chosen = new Set(result.joins.map((j) => j.node));
      const jumps = (c: FittedContour): number => joinCurvatures(c).filter((j) => chosen.has(j.node)).reduce((sum, j) => sum + j.relativeJump, 0);
      if (result.joins.some((j) => j.outcome === 'g2' && j.relativeJumpBefore > G2_RELATIVE_TOLERANCE)) expect(jumps(result.contour), name).toBeLessThan(jumps(fitted));
      // Reference: Holladay's theorem — the natural spline, G2 at its knots, minimises ∫ f″².
      // Fairing here keeps the G2 curve nearest the chain, not the one of least strain, so
      // the energy is not guaranteed to fall; measured: −0.4 % (clean ellipse, superellipse),
      // +0.15 % (rotated ellipse), +3.3 % on the noisy superellipse, whose fitted outline
      // has one near-cusp span holding almost all of its energy. 5 % more would mean wiggles.
      expect(strainEnergy(result.contour), name).toBeLessThanOrEqual(strainEnergy(fitted) * 1.05);
    }
  });

  it('does not modify its inputs', () => {
    const points = shapes['a clean ellipse rotated 30°']();
    const { fitted } = fitContour(points, { tolerance: TOLERANCE });
    const { chain } = prepareChain(points);
    const snapshot = JSON.stringify(fitted);
    fairSmoothJoinsWithReport(chain, fitted, FIT_TOLERANCE);
    expect(JSON.stringify(fitted)).toBe(snapshot);
  });

  it('fairs only the chosen joins when nodes are given, and rejects a node outside the contour', () => {
    const { chain, fitted } = cases.get('a clean ellipse rotated 30°')!;
    const n = fitted.nodes.length;
    expect(n).toBeGreaterThan(3);
    for (const node of [0, 2]) {
      const result = fairSmoothJoinsWithReport(chain, fitted, FIT_TOLERANCE, { nodes: [node] });
      expect(result.joins.map((j) => j.node)).toEqual([node]);
      if (result.joins[0]!.outcome === 'g2') expect(joinCurvatures(result.contour)[node]!.relativeJump).toBeLessThanOrEqual(G2_RELATIVE_TOLERANCE);
      // Only the two cubics next to the node may change.
      result.contour.spans.forEach((span, i) => {
        if (i === node || i === (node - 1 + n) % n) return;
        expect(span, `node ${node}, span ${i}`).toBe(fitted.spans[i]);
      });
    }
    expect(() => fairSmoothJoinsWithReport(chain, fitted, FIT_TOLERANCE, { nodes: [n] })).toThrow(RangeError);
  });

  it('keeps the original handles where a line meets an arc of a stadium, which is G1 only', () => {
    // Reference: a stadium's curvature is 0 on its straight sides and 1/r on its arcs, a
    // step of 1/r where they meet, so no outline within the tolerance is G2 there.
    const points = stadiumChain({ x: 400, y: 300 }, 300, 100, 0.15, 8);
    const { fitted } = fitContour(points, { tolerance: TOLERANCE });
    const { chain } = prepareChain(points);
    const result = fairSmoothJoinsWithReport(chain, fitted, FIT_TOLERANCE);
    const n = fitted.nodes.length;
    const lineJoins = result.joins.filter((j) => fitted.spans[(j.node - 1 + n) % n]!.segment.kind === 'line' || fitted.spans[j.node]!.segment.kind === 'line');
    expect(lineJoins.length).toBeGreaterThanOrEqual(4);
    for (const j of lineJoins) {
      expect(j.outcome).toBe('outside-tolerance');
      // The handles at the join are the original ones.
      const before = result.contour.spans[(j.node - 1 + n) % n]!.segment;
      const after = result.contour.spans[j.node]!.segment;
      if (before.kind === 'cubic') expect(before.p2).toEqual((fitted.spans[(j.node - 1 + n) % n]!.segment as CubicSegment).p2);
      if (after.kind === 'cubic') expect(after.p1).toEqual((fitted.spans[j.node]!.segment as CubicSegment).p1);
    }
    // The joins in the middle of each arc are between two cubics and do become G2.
    expect(result.joins.filter((j) => j.outcome === 'g2').length).toBeGreaterThanOrEqual(2);
  });

  it('still has smaller curvature steps than the unfaired outline after grid rounding (the documented residual)', () => {
    const faired: number[] = [];
    const unfaired: number[] = [];
    for (const { chain, fitted, result } of cases.values()) {
      const afterFairing = joinCurvatures(roundToGrid(chain, result.contour, 1, TOLERANCE));
      const withoutFairing = joinCurvatures(roundToGrid(chain, fitted, 1, TOLERANCE));
      for (const j of result.joins) {
        if (j.outcome !== 'g2') continue;
        faired.push(afterFairing[j.node]!.relativeJump);
        unfaired.push(withoutFairing[j.node]!.relativeJump);
      }
    }
    const median = (values: number[]): number => values.slice().sort((a, b) => a - b)[values.length >> 1]!;
    // Rounding reopens steps a little (fairing.ts header: median 4.2 %, worst 56 % at
    // G2 joins on these shapes), so the faired joins must still beat the unfaired ones.
    expect(median(faired)).toBeLessThan(median(unfaired));
  });
});
