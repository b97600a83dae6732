// Real roots of polynomials underlie extrema, inflections and nearest points; a lost
// or doubled root shows up as a missing extreme point or a wrong click target.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  evaluatePolynomial,
  multiplyPolynomials,
  realRoots,
  realRootsInInterval,
  refineBracketedRoot,
  rootsInUnitInterval,
  solveCubic,
  solveLinear,
  solveQuadratic,
} from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS } from './support.ts';

/** The monic polynomial with the given roots, ascending coefficients. */
const fromRoots = (roots: readonly number[]): number[] =>
  roots.reduce<number[]>((p, r) => multiplyPolynomials(p, [-r, 1]) as number[], [1]);

describe('quadratic equations', () => {
  it('solve textbook cases, ascending and distinct', () => {
    expect(solveQuadratic(1, -3, 2)).toEqual([1, 2]);
    expect(solveQuadratic(2, 0, -8)).toEqual([-2, 2]);
    expect(solveQuadratic(1, 0, 1)).toEqual([]);
    expect(solveQuadratic(0, 2, -1)).toEqual([0.5]);
    expect(solveQuadratic(0, 0, 1)).toEqual([]);
    expect(solveLinear(0, 0)).toEqual([]);
  });

  it('report a double root once, also when rounding makes the discriminant slightly non-zero', () => {
    expect(solveQuadratic(1, -6, 9)).toEqual([3]);
    const [r, ...rest] = solveQuadratic(1, -0.2, 0.01); // (x − 0.1)², coefficients rounded
    expect(rest).toEqual([]);
    expect(r).toBeCloseTo(0.1, 15);
    const [s, ...more] = solveQuadratic(1, -2 / 3, 1 / 9); // (x − ⅓)²
    expect(more).toEqual([]);
    expect(s).toBeCloseTo(1 / 3, 15);
  });

  it('keep full accuracy of the small root when the leading coefficient is tiny', () => {
    // Forsythe 1967's example of cancellation: the textbook formula returns 0 for the
    // small root of 1e-20·x² + x − 1 = 0; the true roots are ≈ 1 and ≈ −1e20.
    const [big, small] = solveQuadratic(1e-20, 1, -1);
    expect(small).toBeCloseTo(1, 15);
    expect(Math.abs((big ?? 0) / -1e20 - 1)).toBeLessThan(1e-12);
  });

  it('survive coefficients whose squares would overflow', () => {
    expect(solveQuadratic(1e200, -3e200, 2e200)).toEqual([1, 2]);
  });
});

describe('cubic equations', () => {
  it('solve three simple roots to full precision', () => {
    const roots = solveCubic(1, -6, 11, -6); // (x − 1)(x − 2)(x − 3)
    expect(roots).toHaveLength(3);
    roots.forEach((r, i) => expect(r).toBeCloseTo(i + 1, 14));
    expect(solveCubic(1, 0, -1, 0)).toEqual([-1, 0, 1]);
  });

  it('find the single real root of x³ + x + 1', () => {
    // Cardano: x = ∛(−½ + √(31/108)) + ∛(−½ − √(31/108)) ≈ −0.6823278038280193.
    const cardano = Math.cbrt(-0.5 + Math.sqrt(31 / 108)) + Math.cbrt(-0.5 - Math.sqrt(31 / 108));
    const roots = solveCubic(1, 0, 1, 1);
    expect(roots).toHaveLength(1);
    expect(roots[0]).toBeCloseTo(cardano, 15);
  });

  it('report double and triple roots once, to the accuracy their conditioning allows', () => {
    const double = solveCubic(1, -5, 7, -3); // (x − 1)²(x − 3)
    expect(double).toHaveLength(2);
    expect(double[0]).toBeCloseTo(1, 7); // a double root is determined to about √ε
    expect(double[1]).toBeCloseTo(3, 14);
    const triple = solveCubic(1, -1.5, 0.75, -0.125); // (x − ½)³
    expect(triple).toHaveLength(1);
    expect(triple[0]).toBeCloseTo(0.5, 5); // a triple root to about ∛ε
    const shiftedDouble = realRoots(fromRoots([0.1, 0.1, 0.7]));
    expect(shiftedDouble).toHaveLength(2);
    expect(shiftedDouble[0]).toBeCloseTo(0.1, 7);
    expect(shiftedDouble[1]).toBeCloseTo(0.7, 12);
  });

  it('stay accurate when the leading coefficient is nearly zero', () => {
    // 1e-14·x³ + x² − 3x + 2: roots ≈ 1, 2 and one near −1e14.
    const roots = solveCubic(1e-14, 1, -3, 2);
    expect(roots).toHaveLength(3);
    expect(roots[1]).toBeCloseTo(1, 12);
    expect(roots[2]).toBeCloseTo(2, 12);
    expect(Math.abs((roots[0] ?? 0) / -1e14 - 1)).toBeLessThan(1e-6);
    // So small that the root bound overflows: treated as the quadratic.
    const degenerate = solveCubic(1e-320, 1, -3, 2);
    expect(degenerate.slice(-2).map((r) => Math.round(r * 1e12) / 1e12)).toEqual([1, 2]);
  });

  it('recover random well-separated roots', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -10, max: 0, noNaN: true }),
        fc.double({ min: 1e-2, max: 5, noNaN: true }),
        fc.double({ min: 1e-2, max: 5, noNaN: true }),
        (first, gap1, gap2) => {
          const roots = [first, first + gap1, first + gap1 + gap2];
          const p = fromRoots(roots);
          const found = solveCubic(p[3] ?? 0, p[2] ?? 0, p[1] ?? 0, p[0] ?? 0);
          expect(found).toHaveLength(3);
          found.forEach((r, i) => expect(Math.abs(r - (roots[i] ?? Number.NaN))).toBeLessThan(1e-8));
        },
      ),
      PROPERTY_SETTINGS,
    );
  });
});

describe('roots in an interval', () => {
  it('find all five roots of a quintic in [0, 1]', () => {
    const expected = [0.1, 0.3, 0.5, 0.7, 0.9];
    const found = rootsInUnitInterval(fromRoots(expected));
    expect(found).toHaveLength(5);
    found.forEach((r, i) => expect(r).toBeCloseTo(expected[i] ?? Number.NaN, 12));
  });

  it('separate two roots only 1e-6 apart', () => {
    const found = realRootsInInterval(fromRoots([0.2, 0.5, 0.5 + 1e-6]), 0, 1);
    expect(found).toHaveLength(3);
    expect(found[1]).toBeCloseTo(0.5, 8);
    expect(found[2]).toBeCloseTo(0.5 + 1e-6, 8);
    expect((found[2] ?? 0) - (found[1] ?? 0)).toBeGreaterThan(5e-7);
  });

  it('include end points when closed and exclude them when open', () => {
    const p = fromRoots([0, 0.5, 1]);
    expect(rootsInUnitInterval(p, 'closed')).toEqual([0, 0.5, 1]);
    expect(rootsInUnitInterval(p, 'open')).toEqual([0.5]);
  });

  it('are empty for constants and the zero polynomial, and every reported root is a root', () => {
    expect(realRootsInInterval([], 0, 1)).toEqual([]);
    expect(realRootsInInterval([3], 0, 1)).toEqual([]);
    fc.assert(
      fc.property(fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 2, maxLength: 7 }), (p) => {
        for (const r of realRootsInInterval(p, -2, 2)) {
          const magnitude = p.reduce((sum, c, i) => sum + Math.abs(c) * Math.abs(r) ** i, 0);
          expect(Math.abs(evaluatePolynomial(p, r))).toBeLessThanOrEqual(1e-12 * (1 + magnitude));
        }
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('refinement refuses an interval without a sign change', () => {
    expect(() => refineBracketedRoot((x) => x * x + 1, (x) => 2 * x, -1, 1)).toThrow(RangeError);
    expect(refineBracketedRoot((x) => x * x - 2, (x) => 2 * x, 0, 2)).toBeCloseTo(Math.SQRT2, 15);
  });
});
