// Tridiagonal solvers: every interpolating spline goes through them; a wrong solve
// shows up as a spline that misses its points or wobbles.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveCyclicTridiagonal, solveTridiagonal } from '../../core/geometry/index.ts';
import { PROPERTY_SETTINGS } from './support.ts';

/** Independent reference: dense Gaussian elimination with partial pivoting (Golub & Van Loan 2013, §3.4). */
function denseSolve(matrix: number[][], rhs: number[]): number[] {
  const n = rhs.length;
  const a = matrix.map((row, i) => [...row, rhs[i] ?? 0]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r;
    [a[col], a[pivot]] = [a[pivot]!, a[col]!];
    for (let r = col + 1; r < n; r++) {
      const f = a[r]![col]! / a[col]![col]!;
      for (let c = col; c <= n; c++) a[r]![c]! -= f * a[col]![c]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = a[r]![n]!;
    for (let c = r + 1; c < n; c++) s -= a[r]![c]! * x[c]!;
    x[r] = s / a[r]![r]!;
  }
  return x;
}

function denseMatrix(lower: number[], diagonal: number[], upper: number[], cyclic: boolean): number[][] {
  const n = diagonal.length;
  const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    m[i]![i]! += diagonal[i]!;
    if (i > 0 || cyclic) m[i]![(i - 1 + n) % n]! += lower[i]!;
    if (i < n - 1 || cyclic) m[i]![(i + 1) % n]! += upper[i]!;
  }
  return m;
}

/** Random diagonally dominant systems, the class spline systems belong to. */
const systemArb = fc.integer({ min: 1, max: 12 }).chain((n) =>
  fc.record({
    lower: fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n, maxLength: n }),
    upper: fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n, maxLength: n }),
    extra: fc.array(fc.double({ min: 0.1, max: 5, noNaN: true }), { minLength: n, maxLength: n }),
    sign: fc.boolean(),
    rhs: fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: n, maxLength: n }),
  }),
);

describe('tridiagonal solvers', () => {
  it('Thomas algorithm agrees with dense elimination on diagonally dominant systems', () => {
    fc.assert(
      fc.property(systemArb, ({ lower, upper, extra, sign, rhs }) => {
        const diagonal = extra.map((e, i) => (sign ? -1 : 1) * (Math.abs(lower[i]!) + Math.abs(upper[i]!) + e));
        const ours = solveTridiagonal(lower, diagonal, upper, rhs);
        const reference = denseSolve(denseMatrix(lower, diagonal, upper, false), rhs);
        ours.forEach((x, i) => expect(Math.abs(x - reference[i]!)).toBeLessThan(1e-10 * (1 + Math.abs(reference[i]!))));
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('cyclic solver (Sherman–Morrison) agrees with dense elimination, corners included', () => {
    fc.assert(
      fc.property(systemArb, ({ lower, upper, extra, sign, rhs }) => {
        const diagonal = extra.map((e, i) => (sign ? -1 : 1) * (Math.abs(lower[i]!) + Math.abs(upper[i]!) + e));
        const ours = solveCyclicTridiagonal(lower, diagonal, upper, rhs);
        const reference = denseSolve(denseMatrix(lower, diagonal, upper, true), rhs);
        ours.forEach((x, i) => expect(Math.abs(x - reference[i]!)).toBeLessThan(1e-10 * (1 + Math.abs(reference[i]!))));
      }),
      PROPERTY_SETTINGS,
    );
  });

  it('solves a known periodic system: 4 on the diagonal, 1 beside it and in the corners', () => {
    // With all right-hand sides 6, symmetry gives xᵢ = 6/(4 + 1 + 1) = 1.
    const n = 7;
    const x = solveCyclicTridiagonal(new Array(n).fill(1), new Array(n).fill(4), new Array(n).fill(1), new Array(n).fill(6));
    x.forEach((v) => expect(v).toBeCloseTo(1, 14));
  });

  it('does not modify its inputs, and rejects mismatched or singular systems', () => {
    const lower = Object.freeze([0, 1, 1]);
    const diagonal = Object.freeze([4, 4, 4]);
    const upper = Object.freeze([1, 1, 0]);
    const rhs = Object.freeze([5, 6, 5]);
    expect(solveTridiagonal(lower, diagonal, upper, rhs).map((v) => Math.round(v * 1e12) / 1e12)).toEqual([1, 1, 1]);
    expect(solveCyclicTridiagonal(lower, diagonal, upper, rhs)).toHaveLength(3);
    expect(() => solveTridiagonal([0], [1, 2], [0], [1])).toThrow(RangeError);
    expect(() => solveTridiagonal([0, 0], [0, 1], [0, 0], [1, 1])).toThrow(RangeError);
  });
});
