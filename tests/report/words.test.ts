import { describe, it, expect } from 'vitest';
import { compareScore, equation, isIntercept, metricDirection, trendGrows, candidateExpression } from '../../src/report/words.ts';

const term = (t: string, coef: number, rational: string | null) => ({ term: t, coef, se: 0, low: 0, high: 0, rational: rational === null ? null : { text: rational } });

describe('metric direction', () => {
  it('knows which way the usual metrics point (common practice: R², accuracy up; RMSE, MAE, log-loss down)', () => {
    expect(metricDirection('r2')).toBe(1);
    expect(metricDirection('R²')).toBe(1);
    expect(metricDirection('accuracy')).toBe(1);
    expect(metricDirection('rmse')).toBe(-1);
    expect(metricDirection('logLoss')).toBe(-1);
    expect(metricDirection('kappa-ish')).toBe(0);
  });
  it('compares with a margin', () => {
    expect(compareScore(0.93, 0.41, 1)).toBe('better');
    expect(compareScore(0.42, 0.41, 1)).toBe('same');
    expect(compareScore(0.3, 0.41, 1)).toBe('worse');
    expect(compareScore(0.5, 1.0, -1)).toBe('better');
    expect(compareScore(1.02, 1.0, -1)).toBe('same');
  });
});

describe('equations', () => {
  it('writes the least-squares line of Anscombe set 1 (Anscombe 1973: y ≈ 3.00 + 0.500 x)', () => {
    // intercept 3.000091, slope 0.500091 (../shared reference list, cross-checked there)
    const t = [term('x', 0.500091, '1/2'), term('1', 3.000091, '3')];
    expect(equation('y', t, false)).toBe('y ≈ 0.5001*x + 3');
    expect(equation('y', t, true)).toBe('y ≈ (1/2)*x + 3');
  });
  it('handles signs, unit coefficients, zero fractions and compound terms', () => {
    const t = [term('k', 3.0003, '3'), term('b/w', -0.25, '-1/4'), term('intercept', -0.0012, '0')];
    expect(equation('z', t, false)).toBe('z ≈ 3*k - 0.25*(b/w) - 0.0012');
    expect(equation('z', t, true)).toBe('z ≈ 3*k - (1/4)*(b/w)');
    expect(equation('y', [term('x', 1, '1')], true)).toBe('y ≈ x');
    expect(equation('y', [term('x', 1, null)], true)).toBeNull();
    expect(candidateExpression(['k', 'b'], [3.0001, 0.0004])).toBe('3*k + 4e-4*b');
    expect(isIntercept('(Intercept)')).toBe(true);
  });
});

describe('trend flags', () => {
  it('flags an interval that excludes zero on either side, or a verdict of growth', () => {
    expect(trendGrows({ slope: 1, low: 0.5, high: 1.5, verdict: 'x' })).toBe(true);
    expect(trendGrows({ slope: -1, low: -1.5, high: -0.5, verdict: 'x' })).toBe(true);
    expect(trendGrows({ slope: 0.1, low: -0.2, high: 0.4, verdict: 'flat' })).toBe(false);
    expect(trendGrows({ slope: 0.1, low: -0.2, high: 0.4, verdict: 'grows' })).toBe(true);
    expect(trendGrows(null)).toBe(false);
    expect(trendGrows({ slope: null, low: null, high: null, verdict: 'undetermined: too few strata' })).toBe(false);
    expect(trendGrows({ slope: 0.01, low: -0.1, high: 0.12, verdict: 'bounded: no trend along gap (interval contains 0)' })).toBe(false);
    expect(trendGrows({ slope: -0.9, low: null, high: null, verdict: 'unbounded: grows as gap decreases' })).toBe(true);
  });
});
