import { describe, it, expect } from 'vitest';
import Fraction from 'fraction.js';
import fc from 'fast-check';
import { simplestRational, convergents, simpleFraction } from '../../src/relate/rational.ts';

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

describe('simpleFraction: shown only when one fraction with denominator ≤ 12 lies in the interval (our rule, checked by brute force)', () => {
  it('[0.4957, 0.5017] → 1/2; 25/51 and 110/221 are not shown: "no simple fraction" (the issue\'s examples)', () => {
    expect(simpleFraction(0.4957, 0.5017)).toEqual({ status: 'one', rational: { num: 1, den: 2, text: '1/2' }, text: '1/2' });
    expect(simpleFraction(25 / 51 - 1e-4, 25 / 51 + 1e-4).text).toBe('no simple fraction');
    expect(simpleFraction(110 / 221 - 1e-5, 110 / 221 + 1e-5).text).toBe('no simple fraction');
  });
  it('a wide interval holds several and picks none; an interval wider than 1 always does', () => {
    const s = simpleFraction(0.45, 0.7);
    expect(s.status).toBe('several');
    expect(s.rational).toBeNull();
    expect(simpleFraction(2, 3.5).status).toBe('several');
    expect(simpleFraction(-0.01, 0.02).text).toBe('0');
    expect(simpleFraction(-2.02, -1.99).text).toBe('-2');
  });
  it('agrees with brute force over every p/q, q ≤ 12, reduced by fraction.js (fast-check, general-purpose library)', () => {
    fc.assert(
      fc.property(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: 0, max: 0.3, noNaN: true }), (lo, w) => {
        const hi = lo + w;
        const inside = new Set<string>();
        for (let q = 1; q <= 12; q++) for (let p = Math.ceil(lo * q) - 1; p <= Math.floor(hi * q) + 1; p++) if (p / q >= lo && p / q <= hi) inside.add(new Fraction(p, q).toFraction());
        const r = simpleFraction(lo, hi);
        if (inside.size === 1) return r.status === 'one' && r.rational!.num / r.rational!.den === new Fraction([...inside][0]!).valueOf();
        return r.status === (inside.size === 0 ? 'none' : 'several');
      }),
      { numRuns: 2000, seed: 13 },
    );
  });
});
