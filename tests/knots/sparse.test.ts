import { describe, it, expect } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { sparseInertia, symmetricEntries } from '../../src/knots/sparse.ts';
import { bareissDet, braidSeifertMatrix, randomBraid } from '../../src/knots/index.ts';
import { Rng } from '../../src/util/rng.ts';

/** Inertia from ml-matrix's symmetric eigenvalues (general-purpose reference library). */
function referenceInertia(m: number[][]): { positive: number; negative: number; zero: number } {
  const ev = new EigenvalueDecomposition(new Matrix(m), { assumeSymmetric: true }).realEigenvalues;
  const tol = 1e-8 * Math.max(1, ...ev.map(Math.abs));
  return { positive: ev.filter((x) => x > tol).length, negative: ev.filter((x) => x < -tol).length, zero: ev.filter((x) => Math.abs(x) <= tol).length };
}

describe('sparseInertia: exact inertia and determinant of sparse symmetric integer matrices', () => {
  it('agrees with ml-matrix eigenvalue signs and with a dense Bareiss determinant on 2000 random sparse matrices, many with zero diagonals (general-purpose reference library)', () => {
    const rng = new Rng(41);
    let zeroDiagonalPivots = 0;
    for (let t = 0; t < 2000; t++) {
      const n = 1 + rng.int(9);
      const density = rng.next();
      const diagonal = rng.next() < 0.5; // half the matrices have an all-zero diagonal
      const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
      for (let i = 0; i < n; i++)
        for (let j = i; j < n; j++)
          if ((i !== j || diagonal) && rng.next() < density) m[i]![j] = m[j]![i] = rng.int(5) - 2;
      if (!diagonal && m.some((r) => r.some((x) => x !== 0))) zeroDiagonalPivots++;
      const r = sparseInertia(n, symmetricEntries(m));
      const { positive, negative, zero } = referenceInertia(m);
      expect({ positive: r.positive, negative: r.negative, zero: r.zero }).toEqual({ positive, negative, zero });
      expect(r.determinant).toBe(bareissDet(m));
    }
    expect(zeroDiagonalPivots).toBeGreaterThan(500);
  });

  it('hand example: [[2, −1, 0], [−1, 2, −1], [0, −1, 2]] (the A₃ Cartan matrix) is positive definite with det 4 (hand computation)', () => {
    const r = sparseInertia(3, [[0, 0, 2], [0, 1, -1], [1, 1, 2], [1, 2, -1], [2, 2, 2]]);
    expect(r).toMatchObject({ positive: 3, negative: 0, zero: 0, determinant: 4n });
  });

  it('work stays linear on the Seifert form of a long random 3-braid: at most 30 updates per row for 1,000 letters (a count, not a timing)', () => {
    const b = randomBraid(new Rng(42), 3, 1000);
    const V = braidSeifertMatrix(b);
    const S = V.map((row, i) => row.map((x, j) => x + V[j]![i]!));
    const r = sparseInertia(S.length, symmetricEntries(S));
    expect(r.positive + r.negative + r.zero).toBe(S.length);
    expect(r.updates).toBeLessThan(30 * S.length);
    // a dense elimination would touch about n³/3 ≈ 3·10⁸ entries
    expect(r.updates).toBeLessThan(S.length ** 3 / 3000);
  });
});
