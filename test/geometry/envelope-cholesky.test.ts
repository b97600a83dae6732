// The cyclic banded solver behind the smooth fit's normal equations.

import { describe, expect, it } from 'vitest';
import { addSymmetric, cyclicBandedMatrix, envelopeCholesky, solveWithCholesky } from '../../core/geometry/envelope-cholesky.ts';
import { seededRandom } from '../support/seeded-random.ts';

describe('envelope Cholesky', () => {
  for (const size of [3, 7, 8, 40]) {
    it(`solves a random symmetric positive definite cyclic band system of size ${size}`, () => {
      const random = seededRandom(size);
      const p = 3;
      const matrix = cyclicBandedMatrix(size, p);
      const dense = Array.from({ length: size }, () => new Array<number>(size).fill(0));
      // A = Bᵀ·B + I with B having random rows on 4 cyclically consecutive columns: SPD, cyclic half-bandwidth 3.
      for (let row = 0; row < size * 3; row++) {
        const start = Math.floor(random() * size);
        const w = [random(), random(), random(), random()];
        for (let r = 0; r < 4; r++) {
          for (let c = 0; c <= r; c++) {
            const i = (start + r) % size;
            const j = (start + c) % size;
            const v = r !== c && i === j ? 2 * w[r]! * w[c]! : w[r]! * w[c]!;
            addSymmetric(matrix, i, j, v);
            dense[i]![j]! += w[r]! * w[c]!;
            if (r !== c) dense[j]![i]! += w[r]! * w[c]!;
          }
        }
      }
      for (let i = 0; i < size; i++) {
        addSymmetric(matrix, i, i, 1);
        dense[i]![i]! += 1;
      }
      const rhs = Array.from({ length: size }, () => random() - 0.5);
      const x = solveWithCholesky(envelopeCholesky(matrix), rhs);
      // Reference: the definition A·x = b, with A assembled densely on the side.
      for (let i = 0; i < size; i++) {
        let sum = 0;
        for (let j = 0; j < size; j++) sum += dense[i]![j]! * x[j]!;
        expect(Math.abs(sum - rhs[i]!)).toBeLessThan(1e-12);
      }
    });
  }

  it('refuses a matrix that is not positive definite', () => {
    const matrix = cyclicBandedMatrix(5, 1);
    for (let i = 0; i < 5; i++) addSymmetric(matrix, i, i, i === 2 ? -1 : 1);
    expect(() => envelopeCholesky(matrix)).toThrow(/not positive definite/);
  });

  it('refuses an entry outside the envelope', () => {
    expect(() => addSymmetric(cyclicBandedMatrix(10, 1), 5, 2, 1)).toThrow(/envelope/);
  });
});
