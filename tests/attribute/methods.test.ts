import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { gradientSaliency } from '../../src/attribute/saliency.ts';
import { smoothGrad } from '../../src/attribute/smoothgrad.ts';
import { integratedGradients } from '../../src/attribute/integrated.ts';
import { permutationImportance, squaredErrorLoss } from '../../src/attribute/permutation.ts';
import { defaultGroups } from '../../src/attribute/groups.ts';
import { friedman1, ishigami, linearModel, normalRows, orderOf, uniformRows } from './analytic.ts';

const bench = JSON.parse(readFileSync(new URL('../fixtures/attribution-benchmarks.json', import.meta.url), 'utf8'));
const singles = (p: number) => defaultGroups(Array.from({ length: p }, (_, j) => `x${j + 1}`));

/** Mean and Monte-Carlo standard error of column j of |g|. */
function meanAndSe(perRow: Float64Array, n: number, p: number, j: number): [number, number] {
  let s = 0;
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    const v = perRow[i * p + j]!;
    s += v;
    s2 += v * v;
  }
  const m = s / n;
  return [m, Math.sqrt((s2 / n - m * m) / n)];
}

describe('Friedman #1, analytic model (Friedman 1991, Ann. Statist. 19)', () => {
  const n = 2000;
  const x = uniformRows(n, 10, 0, 1, 11);
  const y = friedman1.predict(x, n);
  const relevantAbove = (scores: ArrayLike<number>) => {
    const top = Math.min(...Array.from(scores).slice(0, 5));
    const rest = Math.max(...Array.from(scores).slice(5));
    expect(top).toBeGreaterThan(rest);
  };
  it('saliency ranks x1..x5 above x6..x10 and matches mean |∂f/∂x| = (10,10,10,10,5,0,…)', () => {
    const r = gradientSaliency(friedman1, x, n);
    relevantAbove(r.scores);
    // fixture attribution-benchmarks.json (Friedman 1991 function; exact mean |gradient|)
    for (let j = 0; j < 10; j++) {
      const [m, se] = meanAndSe(r.perRow!, n, 10, j);
      expect(Math.abs(m - bench.friedman1.meanAbsGradient[j])).toBeLessThanOrEqual(4 * se + 1e-12);
    }
  });
  it('SmoothGrad ranks x1..x5 above x6..x10', () => {
    relevantAbove(smoothGrad(friedman1, x, n, { seed: 3, samples: 8 }).scores);
  });
  it('integrated gradients rank x1..x5 above x6..x10', () => {
    relevantAbove(integratedGradients(friedman1, x, n, { baseline: new Float64Array(10).fill(0.5) }).scores);
  });
  it('permutation importance ranks x1..x5 above x6..x10; x4 first (largest total effect 0.350)', () => {
    const r = permutationImportance(squaredErrorLoss((a, m) => friedman1.predict(a, m), y), x, n, 10, singles(10), { seed: 5, repeats: 3 });
    relevantAbove(r.scores);
    // total effects from the fixture: x4 0.350 > x1 = x2 0.272 (Friedman #1 indices)
    expect(orderOf(r.scores)[0]).toBe(3);
    for (let j = 5; j < 10; j++) expect(r.scores[j]).toBe(0); // an inert input changes no prediction
  });
});

describe('Ishigami a=7, b=0.1 (Ishigami & Homma 1990; values in attribution-benchmarks.json)', () => {
  const n = 20000;
  const x = uniformRows(n, 3, -Math.PI, Math.PI, 21);
  const ish = bench.ishigami;
  it('gradient saliency orders x2 > x3 > x1 and matches (1.8769, 4.4563, 1.9739) within Monte-Carlo error', () => {
    const r = gradientSaliency(ishigami, x, n);
    expect(orderOf(r.scores)).toEqual([1, 2, 0]);
    for (let j = 0; j < 3; j++) {
      const [m, se] = meanAndSe(r.perRow!, n, 3, j);
      expect(Math.abs(m - ish.meanAbsGradient[j])).toBeLessThan(4 * se);
    }
  });
  it('permutation importance orders x1 > x2 > x3 (total effects) and ΔMSE/(2V) ≈ total index', () => {
    const y = ishigami.predict(x, n);
    const r = permutationImportance(squaredErrorLoss((a, m) => ishigami.predict(a, m), y), x, n, 3, singles(3), { seed: 7, repeats: 3 });
    expect(orderOf(r.scores)).toEqual([0, 1, 2]);
    // E[(f(x) − f(x with x_j independent))²] = 2 V S_Tj (Jansen's estimator of the total index;
    // Saltelli et al. 2010, Comput. Phys. Commun. 181); ST from the fixture (analytic).
    for (let j = 0; j < 3; j++) expect(r.scores[j]! / (2 * ish.variance)).toBeCloseTo(ish.ST[j], 1);
  });
  it('integrated gradients: completeness Σ a = f(x) − f(0) to trapezoid error, shrinking like 1/m²', () => {
    const coarse = integratedGradients(ishigami, x.subarray(0, 3000), 1000, { steps: 16 });
    const fine = integratedGradients(ishigami, x.subarray(0, 3000), 1000, { steps: 64 });
    // Sundararajan, Taly & Yan (ICML 2017), completeness axiom
    expect(fine.meanAbsGap).toBeLessThan(1e-2 * fine.meanAbsDelta);
    // trapezoid rule error O(h²) (any numerical-analysis text): 4× the steps → ~16× smaller
    expect(fine.meanAbsGap).toBeLessThan(coarse.meanAbsGap / 8);
  });
});

describe('integrated gradients completeness on Friedman #1 (Sundararajan et al. 2017)', () => {
  it('gap is below 1e-3 of |f(x) − f(baseline)| with 64 steps', () => {
    const n = 500;
    const x = uniformRows(n, 10, 0, 1, 31);
    const r = integratedGradients(friedman1, x, n, { steps: 64, baseline: new Float64Array(10).fill(0.5) });
    expect(r.maxAbsGap).toBeLessThan(1e-3 * r.meanAbsDelta);
  });
});

describe('linear model known answers (common practice; style guide)', () => {
  const w = [3, -2, 0.5, 0];
  const n = 20000;
  const x = normalRows(n, 4, 41);
  const model = linearModel(w, 1.5);
  it('saliency = |w| exactly', () => {
    const s = gradientSaliency(model, x, n).scores;
    w.forEach((wj, j) => expect(s[j]).toBeCloseTo(Math.abs(wj), 12));
  });
  it('SmoothGrad = |w| (the gradient does not depend on x)', () => {
    const s = smoothGrad(model, x, 200, { seed: 1, samples: 4 }).scores;
    w.forEach((wj, j) => expect(s[j]).toBeCloseTo(Math.abs(wj), 12));
  });
  it('integrated gradients a_ij = w_j x_ij with zero baseline, completeness exact', () => {
    const r = integratedGradients(model, x, 100, { steps: 4 });
    for (let i = 0; i < 100; i++) for (let j = 0; j < 4; j++) expect(r.attributions[i * 4 + j]).toBeCloseTo(w[j]! * x[i * 4 + j]!, 10);
    expect(r.maxAbsGap).toBeLessThan(1e-10);
  });
  it('permutation importance on standardized inputs ≈ 2 w²', () => {
    const y = model.predict(x, n);
    const r = permutationImportance(squaredErrorLoss((a, m) => model.predict(a, m), y), x, n, 4, singles(4), { seed: 9, repeats: 4 });
    // E(w(x − x'))² = 2w² for independent standard normals x, x'; Monte-Carlo relative error ~1-2 %
    w.forEach((wj, j) => expect(Math.abs(r.scores[j]! - 2 * wj * wj)).toBeLessThanOrEqual(0.05 * 2 * wj * wj + 1e-12));
  });
  it('a group shuffled jointly: importance ≈ 2(w₁² + w₂²) for independent members', () => {
    const y = model.predict(x, n);
    const r = permutationImportance(squaredErrorLoss((a, m) => model.predict(a, m), y), x, n, 4, [{ name: 'g', members: [0, 1] }], { seed: 9, repeats: 4 });
    expect(Math.abs(r.scores[0]! - 26) / 26).toBeLessThan(0.05);
  });
});
