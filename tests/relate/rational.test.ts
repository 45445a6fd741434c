import { describe, it, expect } from 'vitest';
import Fraction from 'fraction.js';
import fc from 'fast-check';
import { simplestRational, convergents } from '../../src/relate/rational.ts';

describe('convergents (Khinchin, "Continued Fractions", ch. I)', () => {
  it('π: 3, 22/7, 333/106, 355/113 (π = [3; 7, 15, 1, 292, …], from memory)', () => {
    expect(convergents(Math.PI, 4).map((c) => c.text)).toEqual(['3', '22/7', '333/106', '355/113']);
  });
  it('√2: 1, 3/2, 7/5, 17/12, 41/29 (√2 = [1; 2, 2, 2, …], from memory)', () => {
    expect(convergents(Math.SQRT2, 5).map((c) => c.text)).toEqual(['1', '3/2', '7/5', '17/12', '41/29']);
  });
  it('a rational input ends at itself: 0.75 = [0; 1, 3] (fact of arithmetic)', () => {
    expect(convergents(0.75, 10).map((c) => c.text)).toEqual(['0', '1', '3/4']);
  });
  it('agrees with fraction.js: new Fraction(Math.PI).simplify(1e-6) is 355/113 (general-purpose library)', () => {
    const f = new Fraction(Math.PI).simplify(1e-6);
    const ours = convergents(Math.PI, 10).find((c) => Math.abs(c.num / c.den - Math.PI) <= 1e-6)!;
    expect(`${f.n}/${f.d}`).toBe('355/113');
    expect(ours.text).toBe('355/113');
  });
});

describe('simplestRational (Stern–Brocot; Graham, Knuth & Patashnik, Concrete Mathematics §4.5)', () => {
  it('0.4987 ± 0.003 and [0.4957, 0.5017] → 1/2 (the task statement)', () => {
    expect(simplestRational(0.4987 - 0.003, 0.4987 + 0.003)!.text).toBe('1/2');
    expect(simplestRational(0.4957, 0.5017)).toEqual({ num: 1, den: 2, text: '1/2' });
  });
  it('integers are preferred, the one nearest 0; 0 when the interval holds 0 (definition of simplest)', () => {
    expect(simplestRational(2.7, 4.2)!.text).toBe('3');
    expect(simplestRational(-4.2, -2.7)!.text).toBe('-3');
    expect(simplestRational(-0.1, 0.3)!.text).toBe('0');
    expect(simplestRational(-2.1, -1.9)!.text).toBe('-2');
  });
  it('[3.14159, 3.14160] → 355/113 and [3.1, 3.2] → 16/5 (from memory: best approximations of π)', () => {
    expect(simplestRational(3.14159, 3.1416)!.text).toBe('355/113');
    expect(simplestRational(3.1, 3.2)!.text).toBe('16/5');
  });
  it('property: the answer lies in the interval and no smaller denominator has a fraction inside (brute force)', () => {
    fc.assert(
      fc.property(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: 1e-4, max: 0.5, noNaN: true }), (c, w) => {
        const lo = c - w;
        const hi = c + w;
        const r = simplestRational(lo, hi)!;
        expect(r.num / r.den).toBeGreaterThanOrEqual(lo - 1e-12);
        expect(r.num / r.den).toBeLessThanOrEqual(hi + 1e-12);
        for (let d = 1; d < r.den; d++) {
          // no integer m with lo ≤ m/d ≤ hi
          expect(Math.ceil(lo * d - 1e-12) <= Math.floor(hi * d + 1e-12) && Math.ceil(lo * d) <= Math.floor(hi * d)).toBe(false);
        }
      }),
      { numRuns: 300, seed: 42 },
    );
  });
  it('a point interval gives the fraction when it is one, else null past the denominator cap', () => {
    expect(simplestRational(0.5, 0.5)!.text).toBe('1/2');
    expect(simplestRational(-0.75, -0.75)!.text).toBe('-3/4');
    expect(simplestRational(Math.PI, Math.PI, 1e6)).toBeNull(); // π's float64 value needs a denominator far above 1e6
  });
  it('empty or infinite intervals give null', () => {
    expect(simplestRational(1, 0)).toBeNull();
    expect(simplestRational(NaN, 1)).toBeNull();
  });
});
