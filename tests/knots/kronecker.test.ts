import { describe, it, expect } from 'vitest';
import { pack, packBits, unpack } from '../../src/knots/kronecker.ts';
import { Rng } from '../../src/util/rng.ts';

/** Schoolbook product of integer polynomials (t^0 first), written here independently. */
function schoolbook(a: bigint[], b: bigint[]): bigint[] {
  const c = new Array<bigint>(a.length + b.length - 1).fill(0n);
  a.forEach((x, i) => b.forEach((y, j) => (c[i + j]! += x * y)));
  return c;
}

describe('Kronecker substitution (Schönhage 1982; von zur Gathen & Gerhard, Modern Computer Algebra §8.4)', () => {
  it('pack/unpack round trip, and the big-integer product of packed values is the packed polynomial product (schoolbook product, written in this test)', () => {
    const rng = new Rng(7);
    for (let t = 0; t < 200; t++) {
      const big = (): bigint => (BigInt(rng.int(2 ** 30)) << BigInt(rng.int(90))) * (rng.next() < 0.5 ? -1n : 1n);
      const a = Array.from({ length: 1 + rng.int(12) }, big);
      const b = Array.from({ length: 1 + rng.int(12) }, big);
      const B = packBits(2 * 120 + 8); // |a_i|, |b_j| < 2^120; a product's coefficient < 12·2^240
      expect(unpack(pack(a, B), B, a.length)).toEqual(a);
      const c = schoolbook(a, b);
      expect(unpack(pack(a, B) * pack(b, B), B, c.length)).toEqual(c);
      // an exact quotient of packed values is the packed quotient polynomial
      expect(unpack(pack(c, B) / pack(b, B), B, a.length)).toEqual(a);
    }
  });

  it('refuses to unpack when a coefficient does not fit the width (common practice: no silent wrap-around)', () => {
    expect(() => unpack(pack([1000n], 12), 8, 1)).toThrow(/out of range/);
  });
});
