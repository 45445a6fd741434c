import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { formatNumber, formatCount, formatInterval } from '../../src/report/format.ts';

describe('formatNumber', () => {
  it('rounds handbook constants to four significant figures', () => {
    // π = 3.14159265…, e = 2.71828182…, √2 = 1.41421356… (from memory; any handbook of tables)
    expect(formatNumber(Math.PI)).toBe('3.142');
    expect(formatNumber(Math.E)).toBe('2.718');
    expect(formatNumber(Math.SQRT2)).toBe('1.414');
    // Avogadro constant 6.02214076e23 mol⁻¹, exact in the 2019 SI (CODATA 2018)
    expect(formatNumber(6.02214076e23)).toBe('6.022e23');
    // electron mass 9.1093837015e-31 kg (CODATA 2018)
    expect(formatNumber(9.1093837015e-31)).toBe('9.109e-31');
    // speed of light 299 792 458 m/s, exact (SI); above 10⁶ so scientific
    expect(formatNumber(299792458)).toBe('2.998e8');
    // figure-eight knot volume 2.0298832128193 (from memory, ../shared reference list)
    expect(formatNumber(2.0298832128193)).toBe('2.03');
  });

  it('keeps integers below a million whole and drops trailing zeros', () => {
    // common practice: counts and small integers are shown exactly
    expect(formatNumber(20000)).toBe('20000');
    expect(formatNumber(-6)).toBe('-6');
    expect(formatNumber(0.1)).toBe('0.1');
    expect(formatNumber(2.5)).toBe('2.5');
    expect(formatNumber(-0)).toBe('0');
    expect(formatNumber(12345.67)).toBe('12350'); // four significant figures, as 1.235e4
    expect(formatNumber(0.000123456)).toBe('1.235e-4');
  });

  it('names the non-finite values', () => {
    expect(formatNumber(NaN)).toBe('NaN');
    expect(formatNumber(Infinity)).toBe('∞');
    expect(formatNumber(-Infinity)).toBe('-∞');
  });

  it('agrees with ECMAScript toPrecision and stays within half a unit in the last digit', () => {
    // ECMA-262 Number.prototype.toPrecision is the reference rounding; relative error of rounding
    // to d significant figures is at most 5·10^-d (common practice).
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 9.99e3, noNaN: true }), fc.integer({ min: 2, max: 8 }), (x, d) => {
        if (Number.isInteger(x)) return;
        const s = formatNumber(x, d);
        const got = Number(s);
        const ref = Number(x.toPrecision(d));
        if (Math.abs(ref) < 10 ** d) expect(got).toBe(ref);
        expect(Math.abs(got - x) / Math.abs(x)).toBeLessThanOrEqual(5 * 10 ** -d * 1.0000001);
      }),
    );
    fc.assert(
      fc.property(fc.double({ min: 1e-300, max: 1e300, noNaN: true }), (x) => {
        const got = Number(formatNumber(x));
        expect(Math.abs(got - x) / x).toBeLessThanOrEqual(5e-4 * 1.0000001);
      }),
    );
  });

  it('rejects a bad digit count', () => {
    expect(() => formatNumber(1, 0)).toThrow(/digits/);
  });
});

describe('formatCount and formatInterval', () => {
  it('groups thousands with commas (common practice in English-language tables)', () => {
    expect(formatCount(20000)).toBe('20,000');
    expect(formatCount(1234567)).toBe('1,234,567');
    expect(formatCount(999)).toBe('999');
    expect(formatCount(-1000)).toBe('-1,000');
  });
  it('joins two ends', () => {
    expect(formatInterval(0.1, Math.PI)).toBe('0.1 to 3.142');
  });
});
