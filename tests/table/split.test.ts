import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { SurmiseError } from '../../src/errors.ts';
import type { Column, Table } from '../../src/table/types.ts';
import { buildDataset } from '../../src/table/dataset.ts';
import { kFold, makeSplits, parseSplitSpec, randomSplit, thresholdSplit } from '../../src/table/split.ts';
import { caught } from '../helpers/errors.ts';

// Properties of data splits (common practice for hold-out and k-fold validation): parts are
// disjoint, cover every row, have the requested sizes, and depend only on the seed.

const err = caught;

function expectPartition(n: number, parts: Int32Array[]): void {
  const seen = new Uint8Array(n);
  for (const p of parts) {
    for (let k = 0; k < p.length; k++) {
      const i = p[k]!;
      expect(i >= 0 && i < n).toBe(true);
      expect(seen[i]).toBe(0);
      seen[i] = 1;
      if (k > 0) expect(p[k - 1]! < i).toBe(true); // ascending
    }
  }
  expect(seen.every((s) => s === 1)).toBe(true);
}

describe('randomSplit', () => {
  it('cuts 70/15/15 of 1000 rows into 700/150/150, disjoint and covering', () => {
    const s = randomSplit(1000, { train: 0.7, validation: 0.15, test: 0.15, seed: 1 });
    expect([s.train.length, s.validation.length, s.test.length]).toEqual([700, 150, 150]);
    expectPartition(1000, [s.train, s.validation, s.test]);
    expect(s.description).toBe('random 70/15/15 split of 1000 rows (seed 1): 700 train, 150 validation, 150 test');
  });
  it('is a partition of the rows for any n and fractions (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 400 }), fc.integer({ min: 1, max: 8 }), fc.integer({ min: 1, max: 8 }), fc.integer(), (n, a, b, seed) => {
        const tot = a + b + 2;
        const s = randomSplit(n, { train: (a + 1) / tot, validation: b / tot, test: 1 / tot, seed });
        expectPartition(n, [s.train, s.validation, s.test]);
        expect(s.test.length).toBe(Math.round(n / tot));
      }),
      { numRuns: 200 },
    );
  });
  it('depends only on the seed', () => {
    const a = randomSplit(500, { train: 0.8, validation: 0.1, test: 0.1, seed: 42 });
    const b = randomSplit(500, { train: 0.8, validation: 0.1, test: 0.1, seed: 42 });
    const c = randomSplit(500, { train: 0.8, validation: 0.1, test: 0.1, seed: 43 });
    expect(Array.from(a.test)).toEqual(Array.from(b.test));
    expect(Array.from(a.test)).not.toEqual(Array.from(c.test));
  });
  it('refuses a split that leaves a side empty', () => {
    expect(err(() => randomSplit(2, { train: 0.7, validation: 0.15, test: 0.15, seed: 1 })).code).toBe('split.empty');
  });
});

describe('kFold', () => {
  it('tests every row exactly once; fold sizes differ by at most one; train is the complement', () => {
    for (const [n, k] of [
      [10, 2],
      [103, 5],
      [7, 7],
    ] as const) {
      const folds = kFold(n, k, 9);
      expect(folds.length).toBe(k);
      expectPartition(
        n,
        folds.map((f) => f.test),
      );
      const sizes = folds.map((f) => f.test.length);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      for (const f of folds) expectPartition(n, [f.train, f.test]);
    }
    expect(Array.from(kFold(50, 5, 3)[2]!.test)).toEqual(Array.from(kFold(50, 5, 3)[2]!.test));
  });
  it('needs k >= 2 and at least k rows', () => {
    expect(err(() => kFold(10, 1, 0)).code).toBe('split.badSpec');
    expect(err(() => kFold(3, 5, 0)).code).toBe('split.empty');
  });
});

describe('thresholdSplit', () => {
  it('trains where the condition holds, tests on the rest, leaves undecided rows out', () => {
    const cond = Float64Array.of(1, 1, 0, 1, NaN, 0, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1);
    const s = thresholdSplit(cond, { seed: 5, label: 'xings <= 12' });
    expect(Array.from(s.test)).toEqual([2, 5]);
    expect(Array.from(s.unassigned!)).toEqual([4]);
    expect(s.train.length + s.validation.length).toBe(18);
    expect(s.validation.length).toBe(Math.round(18 * 0.15));
    expectPartition(21, [s.train, s.validation, s.test, s.unassigned!]);
    expect(s.description).toMatch(/^train where xings <= 12 \(18 rows: 15 train, 3 validation\), test on the other 2 rows; 1 rows left out/);
  });
  it('names the condition and the counts when a side is empty', () => {
    const e = err(() => thresholdSplit(Float64Array.of(1, 1, 1), { seed: 1, label: 'xings <= 12' }));
    expect(e.code).toBe('split.empty');
    expect(e.message).toBe("the split 'where:xings <= 12' leaves the test side empty: 3 rows satisfy the condition, 0 do not");
  });
});

describe('parseSplitSpec', () => {
  it('reads the documented forms', () => {
    expect(parseSplitSpec('random')).toEqual({ kind: 'random', train: 0.7, validation: 0.15, test: 0.15 });
    expect(parseSplitSpec('random:0.8,0.1,0.1')).toEqual({ kind: 'random', train: 0.8, validation: 0.1, test: 0.1 });
    expect(parseSplitSpec('kfold:5')).toEqual({ kind: 'kfold', k: 5 });
    expect(parseSplitSpec('where:xings <= 12')).toEqual({ kind: 'where', condition: 'xings <= 12' });
  });
  it('names the option in every error', () => {
    for (const s of ['random:0.8,0.1', 'random:0.8,0.1,0.2', 'random:1,0,0', 'random:a,b,c', 'kfold:1', 'kfold:2.5', 'kfold:', 'where:', 'where:xings <=', 'shuffle']) {
      const e = err(() => parseSplitSpec(s));
      expect(e.code, s).toBe('split.badSpec');
      expect(e.message, s).toMatch(/`split`/);
      expect(e.details?.option, s).toBe('split');
    }
    expect(err(() => parseSplitSpec('random:0.8,0.1,0.2')).message).toMatch(/add up to 1/);
  });
});

describe('makeSplits on a dataset', () => {
  const n = 60;
  const xings = Array.from({ length: n }, (_, i) => 3 + (i % 14));
  const col = (name: string, v: number[], kind: 'real' | 'integer' = 'real'): Column => ({
    name,
    kind,
    values: Float64Array.from(v),
    missing: new Uint8Array(v.length),
  });
  const table: Table = {
    source: 'knots.csv',
    nRows: n,
    columns: [col('xings', xings, 'integer'), col('amp', xings.map((x, i) => x * 0.9 + i / 100)), col('sig', xings.map((x, i) => (x + i) % 5))],
  };
  const ds = buildDataset(table, { target: 'sig', derive: [{ name: 'half', source: 'xings / 2' }] });
  it('splits on a condition over a table column: train where xings <= 12', () => {
    const [s] = makeSplits(ds, table, parseSplitSpec('where:xings <= 12'), 1);
    const trainSide = [...s!.train, ...s!.validation];
    expect(trainSide.every((k) => xings[ds.rows[k]!]! <= 12)).toBe(true);
    expect(Array.from(s!.test).every((k) => xings[ds.rows[k]!]! > 12)).toBe(true);
    expect(s!.test.length).toBe(xings.filter((x) => x > 12).length);
  });
  it('resolves derived columns through the dataset features', () => {
    const [a] = makeSplits(ds, table, parseSplitSpec('where:half <= 6'), 1);
    const [b] = makeSplits(ds, table, parseSplitSpec('where:xings <= 12'), 1);
    expect(Array.from(a!.test)).toEqual(Array.from(b!.test));
  });
  it('reports an unknown column in the condition with a suggestion', () => {
    const e = err(() => makeSplits(ds, table, parseSplitSpec('where:xing <= 12'), 1));
    expect(e.code).toBe('expr.unknownColumn');
    expect(e.message).toMatch(/did you mean 'xings'/);
  });
  it('k-fold gives one split per fold, validation carved from training, every row tested once', () => {
    const splits = makeSplits(ds, table, parseSplitSpec('kfold:4'), 7);
    expect(splits.length).toBe(4);
    expectPartition(
      n,
      splits.map((s) => s.test),
    );
    for (const s of splits) {
      expectPartition(n, [s.train, s.validation, s.test]);
      expect(s.validation.length).toBe(Math.round((s.train.length + s.validation.length) * 0.15));
    }
  });
});
