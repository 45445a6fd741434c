import { describe, it, expect } from 'vitest';
import Fraction from 'fraction.js';
import { gcd } from '../../src/util/gcd.ts';

describe('gcd (Euclid, Elements VII.2)', () => {
  it('hand-worked values and the edge cases gcd(a, 0) = |a|, gcd(0, 0) = 0', () => {
    expect(gcd(-12, 18)).toBe(6);
    expect(gcd(17, 5)).toBe(1);
    expect(gcd(-7, 0)).toBe(7);
    expect(gcd(0, 0)).toBe(0);
  });
  it('a/g and b/g are the reduced fraction fraction.js gives (general-purpose reference library)', () => {
    for (let a = -30; a <= 30; a++) for (let b = 1; b <= 30; b++) {
      const g = gcd(a, b);
      const f = new Fraction(a, b);
      expect(Math.abs(a / g)).toBe(Number(f.n));
      expect(b / g).toBe(Number(f.d));
    }
  });
});
