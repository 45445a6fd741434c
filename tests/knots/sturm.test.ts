import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix, QrDecomposition } from 'ml-matrix';
import { symmetricInertiaFloat } from '../../src/knots/sturm.ts';
import { Rng } from '../../src/util/rng.ts';

/** Reference: eigenvalues from ml-matrix's symmetric eigen-solver (npm `ml-matrix`, a port of JAMA). */
function referenceCounts(m: Matrix, tol: number): { positive: number; negative: number; zero: number } {
  const ev = new EigenvalueDecomposition(m, { assumeSymmetric: true }).realEigenvalues;
  return {
    positive: ev.filter((l) => l > tol).length,
    negative: ev.filter((l) => l < -tol).length,
    zero: ev.filter((l) => Math.abs(l) <= tol).length,
  };
}

const flat = (m: Matrix): Float64Array => Float64Array.from(m.to1DArray());

describe('symmetricInertiaFloat (Householder + Sturm counts)', () => {
  it('matches ml-matrix eigenvalue signs on 300 random symmetric matrices', () => {
    const rng = new Rng(11);
    for (let t = 0; t < 300; t++) {
      const n = 1 + rng.int(30);
      const b = Matrix.zeros(n, n);
      for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) b.set(i, j, rng.int(11) - 5), b.set(j, i, b.get(i, j));
      expect(symmetricInertiaFloat(flat(b), n, 1e-9), `n=${n}`).toEqual(referenceCounts(b, 1e-9));
    }
  });

  it('counts planted zero eigenvalues (A = Q·diag(d)·Qᵀ with exact zeros in d)', () => {
    const rng = new Rng(12);
    for (let t = 0; t < 100; t++) {
      const n = 2 + rng.int(24);
      const g = Matrix.zeros(n, n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) g.set(i, j, rng.next() - 0.5);
      const q = new QrDecomposition(g).orthogonalMatrix;
      const d = Array.from({ length: n }, () => [0, 1, -1][rng.int(3)]! * (0.5 + rng.next()));
      const a = q.mmul(Matrix.diag(d)).mmul(q.transpose());
      const sym = a.add(a.transpose()).div(2);
      const want = { positive: d.filter((x) => x > 0).length, negative: d.filter((x) => x < 0).length, zero: d.filter((x) => x === 0).length };
      expect(symmetricInertiaFloat(flat(sym), n, 1e-9)).toEqual(want);
    }
  });

  it('handles already-diagonal and 1×1 input (Sylvester: inertia of a diagonal matrix is its signs)', () => {
    expect(symmetricInertiaFloat(Float64Array.from([3, 0, 0, 0, 0, 0, 0, 0, -2]), 3, 1e-9)).toEqual({ positive: 1, negative: 1, zero: 1 });
    expect(symmetricInertiaFloat(Float64Array.from([-1e-12]), 1, 1e-9)).toEqual({ positive: 0, negative: 0, zero: 1 });
  });
});
