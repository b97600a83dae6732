/**
 * Cholesky factorisation of a symmetric positive definite matrix stored by its
 * envelope (profile), sized for the cyclic banded normal equations of periodic
 * spline fits.
 *
 * A least-squares fit of a closed uniform B-spline of degree d has a normal matrix
 * whose non-zeros lie within d of the diagonal, cyclically: a band plus two corner
 * triangles. Stored by rows from each row's first non-zero column (the envelope), the
 * band rows hold d + 1 entries and only the last d rows are full; Cholesky fill-in
 * stays inside the envelope (George & Liu 1981, "Computer Solution of Large Sparse
 * Positive Definite Systems", ch. 4, the envelope method; the row-by-row "bordering"
 * form of the factorisation). For a cyclic band of half-width p that is O(n·p)
 * storage and O(n·p²) work, against O(n³) for a dense solve.
 *
 * Matrices here are built by the caller through `addSymmetric` (the one mutating
 * helper, on a matrix the caller owns) and never modified by the factorisation.
 */

/** A symmetric matrix by the lower triangle of its envelope. */
export interface EnvelopeMatrix {
  readonly size: number;
  /** firstColumn[i]: the first column stored in row i (≤ i). */
  readonly firstColumn: Int32Array;
  /** rows[i][j − firstColumn[i]] is entry (i, j) for firstColumn[i] ≤ j ≤ i. */
  readonly rows: readonly Float64Array[];
}

/**
 * A zero matrix whose envelope holds every entry (i, j) with cyclic distance
 * min(|i − j|, n − |i − j|) ≤ halfBandwidth: rows before n − halfBandwidth keep the
 * band, the last halfBandwidth rows are stored in full (they carry the corner entries
 * and the factor's fill-in). For n ≤ 2·halfBandwidth + 1 every entry is stored.
 */
export function cyclicBandedMatrix(size: number, halfBandwidth: number): EnvelopeMatrix {
  if (!(size >= 1) || !Number.isInteger(size)) throw new RangeError(`cyclicBandedMatrix: size must be a positive integer, got ${size}`);
  if (!(halfBandwidth >= 0) || !Number.isInteger(halfBandwidth)) throw new RangeError(`cyclicBandedMatrix: halfBandwidth must be a non-negative integer, got ${halfBandwidth}`);
  const firstColumn = new Int32Array(size);
  const rows: Float64Array[] = [];
  for (let i = 0; i < size; i++) {
    const first = i < size - halfBandwidth ? Math.max(0, i - halfBandwidth) : 0;
    firstColumn[i] = first;
    rows.push(new Float64Array(i - first + 1));
  }
  return { size, firstColumn, rows };
}

/**
 * Adds `value` to entries (i, j) and (j, i) of the symmetric matrix — once, to the
 * stored lower entry; on the diagonal it is added once. Throws a RangeError when the
 * entry lies outside the envelope.
 */
export function addSymmetric(matrix: EnvelopeMatrix, i: number, j: number, value: number): void {
  const row = Math.max(i, j);
  const column = Math.min(i, j);
  const first = matrix.firstColumn[row];
  const stored = matrix.rows[row];
  if (first === undefined || stored === undefined || column < first || column < 0) {
    throw new RangeError(`addSymmetric: entry (${i}, ${j}) lies outside the matrix envelope`);
  }
  stored[column - first]! += value;
}

/**
 * The lower-triangular Cholesky factor L (A = L·Lᵀ), in the same envelope.
 *
 * Guarantees: backward stable for symmetric positive definite A without pivoting
 * (Higham 2002, "Accuracy and Stability of Numerical Algorithms", 2nd ed., ch. 10).
 * Throws a RangeError naming the row when a pivot is not positive (A is not positive
 * definite to working precision).
 */
export function envelopeCholesky(matrix: EnvelopeMatrix): EnvelopeMatrix {
  const { size, firstColumn } = matrix;
  const rows = matrix.rows.map((row) => Float64Array.from(row));
  for (let i = 0; i < size; i++) {
    const fi = firstColumn[i]!;
    const li = rows[i]!;
    for (let j = fi; j < i; j++) {
      const fj = firstColumn[j]!;
      const lj = rows[j]!;
      let sum = li[j - fi]!;
      for (let k = Math.max(fi, fj); k < j; k++) sum -= li[k - fi]! * lj[k - fj]!;
      li[j - fi] = sum / lj[j - fj]!;
    }
    let pivot = li[i - fi]!;
    for (let k = fi; k < i; k++) pivot -= li[k - fi]! * li[k - fi]!;
    if (!(pivot > 0)) throw new RangeError(`envelopeCholesky: the matrix is not positive definite (pivot ${pivot} in row ${i})`);
    li[i - fi] = Math.sqrt(pivot);
  }
  return { size, firstColumn, rows };
}

/** Solves A·x = rhs given A's factor from `envelopeCholesky` (forward, then backward substitution). */
export function solveWithCholesky(factor: EnvelopeMatrix, rhs: ArrayLike<number>): Float64Array {
  const { size, firstColumn, rows } = factor;
  if (rhs.length !== size) throw new RangeError(`solveWithCholesky: rhs has ${rhs.length} entries, the matrix ${size} rows`);
  const x = Float64Array.from(rhs);
  // L·y = b, row by row.
  for (let i = 0; i < size; i++) {
    const fi = firstColumn[i]!;
    const li = rows[i]!;
    let sum = x[i]!;
    for (let k = fi; k < i; k++) sum -= li[k - fi]! * x[k]!;
    x[i] = sum / li[i - fi]!;
  }
  // Lᵀ·x = y, column by column from the last.
  for (let i = size - 1; i >= 0; i--) {
    const fi = firstColumn[i]!;
    const li = rows[i]!;
    const xi = x[i]! / li[i - fi]!;
    x[i] = xi;
    for (let k = fi; k < i; k++) x[k]! -= li[k - fi]! * xi;
  }
  return x;
}
