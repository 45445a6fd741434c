import { describe, it, expect } from 'vitest';
import { SurmiseError } from '../../src/errors.ts';
import type { Column, Table } from '../../src/table/types.ts';
import { buildDataset, formatDropReport } from '../../src/table/dataset.ts';
import { caught } from '../helpers/errors.ts';
import { cplx, label } from '../helpers/columns.ts';

// Row-policy checks are counted by hand on small invented tables (common practice: each count
// below is derived by reading the table literal).
const M = NaN; // marks a missing cell in the literals below
const real = (name: string, v: number[], kind: 'real' | 'integer' = 'real', missingAt: number[] = []): Column => ({
  name,
  kind,
  values: Float64Array.from(v),
  missing: Uint8Array.from(v.map((_, i) => (missingAt.includes(i) ? 1 : 0))),
});

function knots(): Table {
  return {
    source: 'knots.csv',
    nRows: 8,
    columns: [
      label('name', ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h']),
      real('xings', [3, 4, 5, 5, 6, 6, 7, 7], 'integer'),
      real('amp', [1, 2, M, 3, NaN, 4, 4, Infinity], 'real', [2]),
      real('gap', [0.5, 0.6, 0.7, M, 0.9, 1.0, 1.0, 1.2], 'real', [3]),
      cplx('cza', [1, 1, 1, 1, 1, 1, 1, 1], [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.6, 0.8]),
      cplx('czb', [2, 4, 6, 8, 10, 12, 12, 16], [3, 1, 0, 2, 1, 1, 1, 3]),
      real('sig', [-2, 0, -4, 2, 0, -2, -2, 4], 'integer'),
    ],
  };
}

const err = caught;

describe('buildDataset', () => {
  it('defaults: every numeric column but the target is a feature; complex columns split in one group', () => {
    const d = buildDataset(knots(), { target: 'sig' });
    expect(d.featureNames).toEqual(['xings', 'amp', 'gap', 'cza.re', 'cza.im', 'czb.re', 'czb.im']);
    expect(d.groups).toEqual([
      { name: 'xings', members: [0] },
      { name: 'amp', members: [1] },
      { name: 'gap', members: [2] },
      { name: 'cza', members: [3, 4] },
      { name: 'czb', members: [5, 6] },
    ]);
    expect(d.targetKind).toBe('integer');
  });
  it('drops rows with missing, NaN or infinite used values and counts each per column and reason', () => {
    const d = buildDataset(knots(), { target: 'sig' });
    // by hand: row 2 amp missing, row 3 gap missing, row 4 amp nan, row 7 amp infinite;
    // row 6 repeats row 5 in every used column except... (amp 4 = 4, gap 1 = 1, cza, czb equal, sig -2 = -2, xings 6 vs 7) → not a duplicate
    expect(d.drops.dropped).toEqual([
      { column: 'amp', reason: 'missing', rows: 1 },
      { column: 'amp', reason: 'nan', rows: 1 },
      { column: 'amp', reason: 'infinite', rows: 1 },
      { column: 'gap', reason: 'missing', rows: 1 },
    ]);
    expect(d.drops.invalidRows).toBe(4);
    expect(d.drops.duplicates).toBe(0);
    expect(Array.from(d.rows)).toEqual([0, 1, 5, 6]);
    expect(Array.from(d.y)).toEqual([-2, 0, -2, -2]);
    expect(Array.from(d.x[1]!)).toEqual([1, 2, 4, 4]);
    expect(d.labels.name).toEqual(['a', 'b', 'f', 'g']);
    expect(d.drops.keptRows + d.drops.invalidRows + d.drops.duplicates).toBe(d.drops.inputRows);
  });
  it('counts a row once under each offending column', () => {
    const t: Table = { source: 't', nRows: 3, columns: [real('a', [NaN, 1, 2]), real('b', [Infinity, 1, 3]), real('y', [1, 2, 3])] };
    const d = buildDataset(t, { target: 'y' });
    expect(d.drops.dropped).toEqual([
      { column: 'a', reason: 'nan', rows: 1 },
      { column: 'b', reason: 'infinite', rows: 1 },
    ]);
    expect(d.drops.invalidRows).toBe(1);
    expect(formatDropReport(d.drops)).toBe('kept 2 of 3 rows; dropped 1 row with missing or non-finite values (a: 1 nan; b: 1 infinite)');
  });
  it('drops exact duplicates of the used columns after the first, and by key when asked', () => {
    const d = buildDataset(knots(), { target: 'sig', features: ['amp', 'gap', 'cza', 'czb'] });
    // without xings, rows 5 and 6 agree in every used column → one duplicate
    expect(d.drops.duplicates).toBe(1);
    expect(Array.from(d.rows)).toEqual([0, 1, 5]);
    expect(d.drops.duplicateRule).toMatch(/target and every feature/);
    const k = buildDataset(knots(), { target: 'sig', key: ['xings'] });
    // valid rows 0,1,5,6 have xings 3,4,6,7 → no repeats; with the invalid rows gone first
    expect(k.drops.duplicates).toBe(0);
    const k2 = buildDataset(knots(), { target: 'sig', dedupe: 'key', key: ['sig'] });
    // valid rows' sig: -2, 0, -2, -2 → rows 5 and 6 repeat row 0
    expect(k2.drops.duplicates).toBe(2);
    expect(Array.from(k2.rows)).toEqual([0, 1]);
    const none = buildDataset(knots(), { target: 'sig', features: ['amp', 'gap', 'cza', 'czb'], dedupe: 'none' });
    expect(none.drops.duplicates).toBe(0);
    expect(none.drops.keptRows).toBe(4);
  });
  it('derives columns first; a derived target leaves its inputs out of the default features', () => {
    const d = buildDataset(knots(), { target: 'q', derive: [{ name: 'q', source: 're(czb/cza)' }] });
    expect(d.targetInputs.sort()).toEqual(['cza', 'czb', 'q']);
    expect(d.featureNames).toEqual(['xings', 'amp', 'gap', 'sig']);
    // row 0: (2+3i)/(1+0.1i) = (2+3i)(1−0.1i)/1.01 = (2.3+2.8i)/1.01 → re = 2.3/1.01 (by hand)
    expect(d.y[0]).toBeCloseTo(2.3 / 1.01, 14);
    expect(d.targetKind).toBe('real');
  });
  it('accepts an expression as target, and derived features', () => {
    const d = buildDataset(knots(), {
      target: 'abs(sig) / 2',
      features: ['xings', 'v2'],
      derive: [{ name: 'v2', source: 'amp^2' }],
    });
    expect(d.featureNames).toEqual(['xings', 'v2']);
    expect(d.targetName).toBe('abs(sig) / 2');
    // by hand: gap is not used, so only amp's bad rows 2, 4, 7 go; kept rows 0, 1, 3, 5, 6
    expect(Array.from(d.rows)).toEqual([0, 1, 3, 5, 6]);
    expect(Array.from(d.y)).toEqual([1, 0, 1, 1, 1]);
    expect(Array.from(d.x[1]!)).toEqual([1, 4, 9, 16, 16]);
  });
  it('merges user groups with complex groups', () => {
    const d = buildDataset(knots(), { target: 'sig', features: ['amp', 'cza', 'czb', 'gap'], groups: { cusp: ['cza', 'czb'] } });
    expect(d.groups).toEqual([
      { name: 'amp', members: [0] },
      { name: 'cusp', members: [1, 2, 3, 4] },
      { name: 'gap', members: [5] },
    ]);
  });
  it('errors name the column and suggest the nearest', () => {
    const e = err(() => buildDataset(knots(), { target: 'sigg' }));
    expect(e.code).toBe('dataset.unknownColumn');
    expect(e.message).toMatch(/^target 'sigg' is not a column of the table \(did you mean 'sig'\?\)/);
    expect(err(() => buildDataset(knots(), { target: 'sig', features: ['volume'] })).code).toBe('dataset.unknownColumn');
    expect(err(() => buildDataset(knots(), { target: 'sig', exclude: ['gap2'] })).message).toMatch(/did you mean 'gap'/);
    expect(err(() => buildDataset(knots(), { target: 'name' })).code).toBe('dataset.labelTarget');
    expect(err(() => buildDataset(knots(), { target: 'czb' })).code).toBe('dataset.complexTarget');
    expect(err(() => buildDataset(knots(), { target: 'sig', features: ['sig', 'amp'] })).code).toBe('dataset.targetAsFeature');
    expect(err(() => buildDataset(knots(), { target: 'sig', features: ['name'] })).code).toBe('dataset.labelFeature');
    expect(err(() => buildDataset(knots(), { target: 'sig', derive: [{ name: 'amp', source: 'gap' }] })).code).toBe('table.duplicateColumn');
    expect(err(() => buildDataset(knots(), { target: 'sig', dedupe: 'key' })).code).toBe('dataset.badSpec');
    expect(err(() => buildDataset(knots(), { target: 'sig', groups: { g: ['amp'], h: ['amp'] } })).code).toBe('dataset.badGroup');
    expect(err(() => buildDataset(knots(), { target: 'amp + nope' })).code).toBe('expr.unknownColumn');
    const clash: Table = { source: 't', nRows: 2, columns: [cplx('z', [1, 2], [3, 4]), real('z.re', [5, 6]), real('y', [1, 2])] };
    expect(err(() => buildDataset(clash, { target: 'y' })).code).toBe('dataset.nameClash');
  });
  it('refuses to return an empty dataset, with the drop report in the message', () => {
    const t: Table = { source: 't', nRows: 2, columns: [real('a', [NaN, NaN]), real('y', [1, 2])] };
    const e = err(() => buildDataset(t, { target: 'y' }));
    expect(e.code).toBe('dataset.empty');
    expect(e.message).toMatch(/kept 0 of 2 rows; dropped 2 rows with missing or non-finite values \(a: 2 nan\)/);
  });
  it('keeps numeric columns as labels on request, and the target part of a complex column', () => {
    const d = buildDataset(knots(), { target: 'czb.re', features: ['amp', 'czb.im'], keepLabels: ['xings'] });
    expect(Object.keys(d.labels)).toEqual(['name', 'xings']);
    // by hand: amp's bad rows 2, 4, 7 go; row 6 repeats row 5 in czb.re, amp and czb.im
    expect(d.labels.xings).toEqual(['3', '4', '5', '6']);
    expect(d.featureNames).toEqual(['amp', 'czb.im']);
    expect(Array.from(d.y)).toEqual([2, 4, 8, 12]);
    expect(d.drops.duplicates).toBe(1);
  });
});
