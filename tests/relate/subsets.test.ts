import { describe, it, expect } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import { countSubsets, subsetSearch } from '../../src/relate/subsets.ts';
import { Rng } from '../../src/util/rng.ts';

function unit(v: Float64Array): Float64Array {
  const m = v.reduce((s, x) => s + x, 0) / v.length;
  const c = v.map((x) => x - m);
  const nn = Math.sqrt(c.reduce((s, x) => s + x * x, 0));
  return c.map((x) => x / nn);
}

describe('subsetSearch', () => {
  it('counts Σ C(m, k): C(10,1) + C(10,2) + C(10,3) = 175', () => {
    expect(countSubsets(10, 3)).toBe(175);
    expect(countSubsets(3, 5)).toBe(7);
  });
  it('tries every subset of ≤ 3 of 8 terms, and each kept RSS equals a least-squares fit by ml-matrix (reference library)', () => {
    const rng = new Rng(9);
    const n = 200;
    const X = Array.from({ length: 8 }, () => Float64Array.from({ length: n }, () => rng.normal()));
    const y0 = Float64Array.from({ length: n }, (_, i) => 2 * X[1]![i]! - X[5]![i]! + 0.3 * rng.normal());
    const Z = X.map(unit);
    const y = y0.map((x) => x - y0.reduce((s, v) => s + v, 0) / n);
    const r = subsetSearch(Z, y, [1, 1, 1, 1, 1, 1, 1, 1], 3, 20);
    expect(r.tried).toBe(countSubsets(8, 3));
    expect(r.kept[0]!.s).toEqual([1, 5]);
    for (const k of r.kept.slice(0, 10)) {
      const A = new Matrix(n, k.s.length);
      k.s.forEach((j, c) => Z[j]!.forEach((v, i) => A.set(i, c, v)));
      const beta = solve(A, Matrix.columnVector(Array.from(y)), true);
      const res = Matrix.columnVector(Array.from(y)).sub(A.mmul(beta));
      const rss = res.to1DArray().reduce((s, x) => s + x * x, 0);
      expect(k.rss).toBeCloseTo(rss, 8);
    }
    expect(r.bestBySize.map((b) => b.s.length)).toEqual([1, 2, 3]);
  });
  it('passes over an exactly collinear subset and counts it', () => {
    const a = unit(Float64Array.of(1, 2, 3, 4, 5));
    const r = subsetSearch([a, a.slice()], a.slice(), [1, 1], 2, 5);
    expect(r.collinear).toBe(1);
    expect(r.tried).toBe(3);
  });
});
