/**
 * Linear solvers for tridiagonal and cyclic (periodic) tridiagonal systems.
 *
 * Interpolating cubic splines reduce to one such system per coordinate: tridiagonal
 * for open curves, cyclic tridiagonal for closed ones. Both are solved in O(n):
 * the tridiagonal case by the Thomas algorithm (Thomas 1949, "Elliptic problems in
 * linear difference equations over a network", Watson Sci. Comput. Lab. report;
 * Gaussian elimination without pivoting, stable for diagonally dominant or
 * symmetric positive definite matrices, Higham 2002, "Accuracy and Stability of
 * Numerical Algorithms", 2nd ed., ch. 9), the cyclic case by treating the two corner
 * entries as a rank-one correction with the Sherman–Morrison formula (Sherman &
 * Morrison 1950, "Adjustment of an inverse matrix corresponding to a change in one
 * element of a given matrix", Ann. Math. Statist. 21(1); arrangement as in Press et
 * al. 2007, "Numerical Recipes", 3rd ed., §2.7).
 *
 * Matrix layout: row i reads lower[i]·x[i−1] + diagonal[i]·x[i] + upper[i]·x[i+1] =
 * rhs[i]. In the plain system lower[0] and upper[n−1] are ignored; in the cyclic system
 * they are the corner entries, lower[0] multiplying x[n−1] and upper[n−1] multiplying
 * x[0]. Inputs are never modified.
 */

/**
 * Solves the tridiagonal system by the Thomas algorithm.
 *
 * Guarantees: O(n) time; backward stable when the matrix is diagonally dominant or
 * symmetric positive definite, which holds for every spline system in this package.
 * Throws a RangeError when the arrays differ in length or a pivot is exactly zero
 * (the matrix is singular or needs pivoting, which this solver does not do).
 */
export function solveTridiagonal(
  lower: readonly number[],
  diagonal: readonly number[],
  upper: readonly number[],
  rhs: readonly number[],
): number[] {
  const n = diagonal.length;
  if (lower.length !== n || upper.length !== n || rhs.length !== n) {
    throw new RangeError('solveTridiagonal: lower, diagonal, upper and rhs must have the same length');
  }
  if (n === 0) return [];
  const modifiedUpper = new Array<number>(n).fill(0);
  const modifiedRhs = new Array<number>(n).fill(0);
  let pivot = diagonal[0] ?? 0;
  if (pivot === 0) throw new RangeError('solveTridiagonal: zero pivot in row 0');
  modifiedUpper[0] = (upper[0] ?? 0) / pivot;
  modifiedRhs[0] = (rhs[0] ?? 0) / pivot;
  for (let i = 1; i < n; i++) {
    const l = lower[i] ?? 0;
    pivot = (diagonal[i] ?? 0) - l * (modifiedUpper[i - 1] ?? 0);
    if (pivot === 0) throw new RangeError(`solveTridiagonal: zero pivot in row ${i}`);
    modifiedUpper[i] = (upper[i] ?? 0) / pivot;
    modifiedRhs[i] = ((rhs[i] ?? 0) - l * (modifiedRhs[i - 1] ?? 0)) / pivot;
  }
  const x = new Array<number>(n).fill(0);
  x[n - 1] = modifiedRhs[n - 1] ?? 0;
  for (let i = n - 2; i >= 0; i--) x[i] = (modifiedRhs[i] ?? 0) - (modifiedUpper[i] ?? 0) * (x[i + 1] ?? 0);
  return x;
}

/**
 * Solves the cyclic tridiagonal system (corner entries lower[0] and upper[n−1]) by
 * one Thomas solve of a modified tridiagonal matrix plus a Sherman–Morrison rank-one
 * correction (two tridiagonal solves in all, O(n)).
 *
 * Guarantees: exact up to rounding for non-singular systems with a non-zero first
 * diagonal entry; stable for diagonally dominant matrices such as periodic spline
 * systems. Systems of size 1 and 2, where corners and off-diagonals coincide, are
 * solved directly with the entries summed. Throws a RangeError on mismatched lengths
 * or when the system is singular.
 */
export function solveCyclicTridiagonal(
  lower: readonly number[],
  diagonal: readonly number[],
  upper: readonly number[],
  rhs: readonly number[],
): number[] {
  const n = diagonal.length;
  if (lower.length !== n || upper.length !== n || rhs.length !== n) {
    throw new RangeError('solveCyclicTridiagonal: lower, diagonal, upper and rhs must have the same length');
  }
  if (n === 0) return [];
  if (n === 1) {
    const a = (diagonal[0] ?? 0) + (lower[0] ?? 0) + (upper[0] ?? 0);
    if (a === 0) throw new RangeError('solveCyclicTridiagonal: singular 1×1 system');
    return [(rhs[0] ?? 0) / a];
  }
  if (n === 2) {
    const a = diagonal[0] ?? 0;
    const b = (upper[0] ?? 0) + (lower[0] ?? 0);
    const c = (lower[1] ?? 0) + (upper[1] ?? 0);
    const d = diagonal[1] ?? 0;
    const determinant = a * d - b * c;
    if (determinant === 0) throw new RangeError('solveCyclicTridiagonal: singular 2×2 system');
    return [((rhs[0] ?? 0) * d - b * (rhs[1] ?? 0)) / determinant, (a * (rhs[1] ?? 0) - c * (rhs[0] ?? 0)) / determinant];
  }
  const topRight = lower[0] ?? 0; // A[0][n−1]
  const bottomLeft = upper[n - 1] ?? 0; // A[n−1][0]
  // A = T + u·vᵀ with u = (γ, 0, …, 0, bottomLeft), v = (1, 0, …, 0, topRight/γ);
  // γ = −diagonal[0] keeps T's first pivot away from cancellation (Press et al. 2007).
  const gamma = -(diagonal[0] ?? 0);
  if (gamma === 0) throw new RangeError('solveCyclicTridiagonal: zero first diagonal entry');
  const modifiedDiagonal = diagonal.slice();
  modifiedDiagonal[0] = (diagonal[0] ?? 0) - gamma;
  modifiedDiagonal[n - 1] = (diagonal[n - 1] ?? 0) - (bottomLeft * topRight) / gamma;
  const plainLower = lower.map((v, i) => (i === 0 ? 0 : v));
  const plainUpper = upper.map((v, i) => (i === n - 1 ? 0 : v));
  const x = solveTridiagonal(plainLower, modifiedDiagonal, plainUpper, rhs);
  const u = new Array<number>(n).fill(0);
  u[0] = gamma;
  u[n - 1] = bottomLeft;
  const z = solveTridiagonal(plainLower, modifiedDiagonal, plainUpper, u);
  const denominator = 1 + (z[0] ?? 0) + (topRight * (z[n - 1] ?? 0)) / gamma;
  if (denominator === 0) throw new RangeError('solveCyclicTridiagonal: singular system');
  const factor = ((x[0] ?? 0) + (topRight * (x[n - 1] ?? 0)) / gamma) / denominator;
  return x.map((xi, i) => xi - factor * (z[i] ?? 0));
}
