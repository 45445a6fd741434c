import { describe, it, expect } from 'vitest';
import { gcdPoly, squareFree } from '../../src/knots/intpoly.ts';
import { Rng } from '../../src/util/rng.ts';

const mul = (a: bigint[], b: bigint[]): bigint[] => {
  const c = new Array<bigint>(a.length + b.length - 1).fill(0n);
  a.forEach((x, i) => b.forEach((y, j) => (c[i + j]! += x * y)));
  return c;
};
const power = (a: bigint[], k: number): bigint[] => Array.from({ length: k }).reduce<bigint[]>((acc) => mul(acc, a), [1n]);

// Pairwise coprime irreducible integer polynomials (t^0 first): Φ6, Φ4, Φ10, 4₁'s Δ·t, 5₂'s Δ·t, t − 2, 3t + 1 (hand-checked: distinct irreducibles)
const IRREDUCIBLE: bigint[][] = [[1n, -1n, 1n], [1n, 0n, 1n], [1n, -1n, 1n, -1n, 1n], [-1n, 3n, -1n], [2n, -3n, 2n], [-2n, 1n], [1n, 3n]];

describe('square-free factorisation over the integers (Yun 1976; von zur Gathen & Gerhard §14.6)', () => {
  it('recovers the factors and multiplicities of random products of coprime irreducibles (products built in this test)', () => {
    const rng = new Rng(61);
    for (let t = 0; t < 200; t++) {
      const mult = IRREDUCIBLE.map(() => rng.int(4)); // 0..3
      const scale = BigInt(1 + rng.int(5)) * (rng.next() < 0.5 ? -1n : 1n);
      let p: bigint[] = [scale];
      IRREDUCIBLE.forEach((f, i) => (p = mul(p, power(f, mult[i]!))));
      const got = squareFree(p);
      // expected: for each k, the product of the irreducibles of multiplicity k (primitive, positive top)
      const expected: Array<{ factor: bigint[]; multiplicity: number }> = [];
      for (let k = 1; k <= 3; k++) {
        let f: bigint[] = [1n];
        IRREDUCIBLE.forEach((g, i) => {
          if (mult[i] === k) f = mul(f, g);
        });
        if (f.length > 1) expected.push({ factor: f[f.length - 1]! < 0n ? f.map((x) => -x) : f, multiplicity: k });
      }
      expect(got).toEqual(expected);
    }
  });

  it('gcd of (t² − t + 1)(t − 2) and (t² − t + 1)(3t + 1) is t² − t + 1; of coprime polynomials 1 (hand computation)', () => {
    expect(gcdPoly(mul([1n, -1n, 1n], [-2n, 1n]), mul([1n, -1n, 1n], [1n, 3n]))).toEqual([1n, -1n, 1n]);
    expect(gcdPoly([-2n, 1n], [1n, 3n])).toEqual([1n]);
  });
});
