// The quadrature rule behind arc length: if a node or weight were wrong, every length
// in the application would be subtly off.
import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import { gaussLegendreRule, integrateWithRule } from '../../core/geometry/index.ts';

describe('Gauss–Legendre rules', () => {
  it('reproduce the 24-node table shipped by bezier-js to 1e-15', () => {
    // bezier-js 6.1.4 utils.Tvalues / Cvalues: the n = 24 Legendre–Gauss abscissae and
    // weights, tabulated there to 40 digits.
    const { Tvalues, Cvalues } = Bezier.getUtils();
    const rule = gaussLegendreRule(24);
    const table = Tvalues.map((x, i) => ({ x, w: Cvalues[i] ?? Number.NaN })).sort((a, b) => a.x - b.x);
    table.forEach(({ x, w }, i) => {
      expect(Math.abs((rule.nodes[i] ?? Number.NaN) - x)).toBeLessThan(1e-15);
      expect(Math.abs((rule.weights[i] ?? Number.NaN) - w)).toBeLessThan(1e-15);
    });
  });

  it('match the classical 3-node rule: nodes 0, ±√(3/5), weights 8/9, 5/9', () => {
    // Abramowitz & Stegun 1964, Table 25.4 (n = 3).
    const rule = gaussLegendreRule(3);
    expect(rule.nodes[0]).toBeCloseTo(-Math.sqrt(3 / 5), 15);
    expect(rule.nodes[1]).toBe(0);
    expect(rule.nodes[2]).toBeCloseTo(Math.sqrt(3 / 5), 15);
    expect(rule.weights[0]).toBeCloseTo(5 / 9, 15);
    expect(rule.weights[1]).toBeCloseTo(8 / 9, 15);
  });

  it('integrate polynomials up to degree 2n − 1 exactly and have weights summing to 2', () => {
    for (const n of [1, 2, 5, 16]) {
      const rule = gaussLegendreRule(n);
      expect(rule.weights.reduce((a, b) => a + b, 0)).toBeCloseTo(2, 13);
      for (let degree = 0; degree <= 2 * n - 1; degree++) {
        // ∫₀¹ tᵈ dt = 1/(d + 1).
        expect(integrateWithRule((t) => t ** degree, 0, 1, rule)).toBeCloseTo(1 / (degree + 1), 13);
      }
    }
  });

  it('reject nonsensical node counts', () => {
    expect(() => gaussLegendreRule(0)).toThrow(RangeError);
    expect(() => gaussLegendreRule(2.5)).toThrow(RangeError);
  });
});
