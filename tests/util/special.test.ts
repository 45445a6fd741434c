import { describe, it, expect } from 'vitest';
import { studentTQuantile, logGamma, regularizedBeta } from '../../src/util/special.ts';

describe('Student-t quantile', () => {
  it('t_{0.975, ν} for ν = 10, 30, ∞ is 2.228, 2.042, 1.960 (Abramowitz & Stegun table 26.10; from memory)', () => {
    expect(studentTQuantile(0.975, 10).toFixed(3)).toBe('2.228');
    expect(studentTQuantile(0.975, 30).toFixed(3)).toBe('2.042');
    expect(studentTQuantile(0.975, Infinity).toFixed(3)).toBe('1.960');
  });
  it('standard normal 97.5% point 1.959963984540054 (from memory) and t_{0.995, 5} = 4.032 (A&S 26.10, from memory)', () => {
    expect(studentTQuantile(0.975, Infinity)).toBeCloseTo(1.959963984540054, 12);
    expect(studentTQuantile(0.995, 5).toFixed(3)).toBe('4.032');
  });
  it('closed forms: ν = 1 is Cauchy, t = tan(π(p − ½)); ν = 2, t = (2p − 1)/√(2p(1 − p)) (fact of the trade)', () => {
    for (const p of [0.6, 0.9, 0.975, 0.999, 0.01]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 9);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 10);
    }
  });
  it('ln Γ(n) = ln (n−1)! and I_x(a, 1) = x^a (definitions)', () => {
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 13);
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 13);
    expect(regularizedBeta(0.3, 2.5, 1)).toBeCloseTo(0.3 ** 2.5, 13);
  });
});
