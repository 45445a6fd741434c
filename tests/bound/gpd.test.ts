import { describe, it, expect } from 'vitest';
import ref from '../fixtures/gpd-scipy-reference.json' with { type: 'json' };
import { fitGpd, gpdProfileLogLik } from '../../src/bound/gpd.ts';

interface RefSet {
  y: number[];
  scipy_fit: { shape: number; scale: number; logLik: number };
  polished: { shape: number; scale: number; logLik: number };
}

describe('generalized Pareto maximum likelihood', () => {
  // Reference: SciPy 1.17.1 scipy.stats.genpareto.fit(y, floc=0), polished with scipy.optimize
  // (tests/fixtures/gpd-scipy-reference.json, provenance beside it).
  for (const [name, set] of Object.entries((ref as { sets: Record<string, RefSet> }).sets)) {
    it(`matches SciPy's genpareto fit on ${name}`, () => {
      const fit = fitGpd(Float64Array.from(set.y));
      expect(fit.shape).toBeCloseTo(set.polished.shape, 6);
      expect(fit.scale / set.polished.scale).toBeCloseTo(1, 6);
      expect(fit.logLik).toBeCloseTo(set.polished.logLik, 7);
      // never worse than SciPy's own fit on the same likelihood
      expect(fit.logLik).toBeGreaterThanOrEqual(set.scipy_fit.logLik - 1e-9);
      expect(Math.abs(fit.shape - set.scipy_fit.shape)).toBeLessThan(1e-3);
    });
  }

  it('the profile at θ → 0 is the exponential law (ξ = 0, σ = mean; Pickands 1975)', () => {
    const y = Float64Array.of(0.5, 1, 1.5, 3);
    const p = gpdProfileLogLik(y, 0);
    expect(p.shape).toBe(0);
    expect(p.scale).toBeCloseTo(1.5, 12);
    expect(p.logLik).toBeCloseTo(-4 * Math.log(1.5) - 4, 12);
    // continuity: a tiny θ gives nearly the same likelihood
    expect(gpdProfileLogLik(y, 1e-7).logLik).toBeCloseTo(p.logLik, 5);
  });

  it('keeps ξ ≥ −1, where the likelihood is bounded (Smith, Biometrika 1985)', () => {
    const y = Float64Array.of(0.1, 0.2, 0.3, 0.4, 0.5);
    const near = gpdProfileLogLik(y, -1 / 0.5000001);
    expect(near.shape).toBe(-1);
    expect(Number.isFinite(near.logLik)).toBe(true);
    expect(gpdProfileLogLik(y, -3).logLik).toBe(-Infinity); // 1 + θ·max(y) < 0
  });
});
