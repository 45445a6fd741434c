import { describe, it, expect } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import { braidClosurePD } from '../../../src/knots/braid.ts';
import { analysePD } from '../../../src/knots/pd.ts';
import { linkTriangulations } from '../../../src/knots/hyperbolic/octahedral.ts';
import { removeLowValence } from '../../../src/knots/hyperbolic/search.ts';
import { combinatorics } from '../../../src/knots/hyperbolic/triangulation.ts';
import { cuspBases } from '../../../src/knots/hyperbolic/cusp.ts';
import { gluingEquations } from '../../../src/knots/hyperbolic/equations.ts';
import { complexSolve, hermitianSolve, solveShapes, solveShapesFree } from '../../../src/knots/hyperbolic/newton.ts';
import { blochWigner } from '../../../src/knots/hyperbolic/dilog.ts';
import { Rng } from '../../../src/util/rng.ts';

/** A random Hermitian positive definite n×n matrix B·Bᴴ + I (row-major real and imaginary parts). */
function randomHpd(rng: Rng, n: number): [Float64Array, Float64Array] {
  const Br = Array.from({ length: n * n }, () => rng.next() - 0.5);
  const Bi = Array.from({ length: n * n }, () => rng.next() - 0.5);
  const Mr = new Float64Array(n * n);
  const Mi = new Float64Array(n * n);
  for (let p = 0; p < n; p++)
    for (let q = 0; q < n; q++) {
      let sr = p === q ? 1 : 0;
      let si = 0;
      for (let k = 0; k < n; k++) {
        // B[p][k] · conj(B[q][k])
        const ar = Br[p * n + k]!;
        const ai = Bi[p * n + k]!;
        const br = Br[q * n + k]!;
        const bi = -Bi[q * n + k]!;
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      Mr[p * n + q] = sr;
      Mi[p * n + q] = si;
    }
  return [Mr, Mi];
}

describe('linear solves of the Newton steps', () => {
  it('Cholesky on Hermitian positive definite systems agrees with LU (partial pivoting) and with ml-matrix on the real 2n×2n form', () => {
    const rng = new Rng(15);
    for (const n of [1, 2, 5, 12, 30]) {
      const [Mr, Mi] = randomHpd(rng, n);
      const yr = Float64Array.from({ length: n }, () => rng.next() - 0.5);
      const yi = Float64Array.from({ length: n }, () => rng.next() - 0.5);
      const a = [Float64Array.from(Mr), Float64Array.from(Mi), Float64Array.from(yr), Float64Array.from(yi)] as const;
      const b = [Float64Array.from(Mr), Float64Array.from(Mi), Float64Array.from(yr), Float64Array.from(yi)] as const;
      expect(hermitianSolve(n, ...a)).toBe(true);
      expect(complexSolve(n, ...b)).toBe(true);
      // reference: the real form [[Re M, −Im M], [Im M, Re M]] [x; y] = [Re y; Im y], solved by ml-matrix (general-purpose library)
      const R = Matrix.zeros(2 * n, 2 * n);
      for (let p = 0; p < n; p++)
        for (let q = 0; q < n; q++) {
          R.set(p, q, Mr[p * n + q]!);
          R.set(p, n + q, -Mi[p * n + q]!);
          R.set(n + p, q, Mi[p * n + q]!);
          R.set(n + p, n + q, Mr[p * n + q]!);
        }
      const x = solve(R, Matrix.columnVector([...yr, ...yi]));
      for (let p = 0; p < n; p++) {
        expect(Math.abs(a[2][p]! - b[2][p]!)).toBeLessThan(1e-10);
        expect(Math.abs(a[3][p]! - b[3][p]!)).toBeLessThan(1e-10);
        expect(Math.abs(a[2][p]! - x.get(p, 0))).toBeLessThan(1e-10);
        expect(Math.abs(a[3][p]! - x.get(n + p, 0))).toBeLessThan(1e-10);
      }
    }
  });
  it('Cholesky refuses a Hermitian matrix that is not positive definite (diag(1, −1): a negative pivot)', () => {
    const ok = hermitianSolve(2, Float64Array.from([1, 0, 0, -1]), new Float64Array(4), Float64Array.from([1, 1]), new Float64Array(2));
    expect(ok).toBe(false);
  });
  it('Gauss–Newton on the 5_2 closure reaches the volume 2.8281220883308 (from memory, reference checks); a work cap stops it early and says so', () => {
    const info = analysePD(braidClosurePD({ strands: 3, word: [1, 1, 1, 2, -1, 2] }).pd);
    const lt = linkTriangulations(info, 1).next().value!;
    const { tri } = removeLowValence(lt.tri, lt.keptIndex, 1);
    const cb = combinatorics(tri);
    const sys = gluingEquations(tri, cb, cuspBases(tri, cb).flat());
    const start = (): [Float64Array, Float64Array] => [new Float64Array(tri.n).fill(0.5), new Float64Array(tri.n).fill(Math.sqrt(3) / 2)];
    const r = solveShapes(sys, ...start());
    expect(r.converged).toBe(true);
    expect(r.re.reduce((s, _, t) => s + blochWigner(r.re[t]!, r.im[t]!), 0)).toBeCloseTo(2.8281220883308, 10);
    // work is n³/6 per factorization
    expect(r.work).toBeCloseTo((r.iterations * tri.n ** 3) / 6, 6);
    const capped = solveShapesFree(sys, ...start(), undefined, undefined, (tri.n ** 3 / 6) * 1.5);
    expect(capped.capped).toBe(true);
    expect(capped.converged).toBe(false);
    expect(capped.work).toBeLessThanOrEqual((tri.n ** 3 / 6) * 1.5);
  });
});
