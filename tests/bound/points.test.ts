import { describe, it, expect } from 'vitest';
import { findBound } from '../../src/bound/find.ts';
import { ratioPoints } from '../../src/bound/points.ts';
import type { Column, Table } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';

const real = (name: string, xs: ArrayLike<number>): Column => ({ name, kind: 'real', values: Float64Array.from(xs), missing: new Uint8Array(xs.length) });
const table = (columns: Column[]): Table => ({ source: 'test.csv', nRows: columns[0]!.missing.length, columns });

describe('bound ratio points for plotting', () => {
  it('AM–GM, (a+b)/2 ≥ √(ab): every ratio point of findBound is lhs/rhs at its row; equality (ratio 1) at a = b (Hardy, Littlewood & Pólya §2.5)', () => {
    const rng = new Rng(3);
    const a = Array.from({ length: 300 }, () => rng.uniform(0.1, 5));
    const b = a.map((v, i) => (i % 50 === 0 ? v : rng.uniform(0.1, 5)));
    const r = findBound(table([real('a', a), real('b', b)]), { lhs: 'sqrt(a*b)', rhs: '(a + b)/2', by: 'a' }).results[0]!;
    expect(r.points.sampledFrom).toBe(300);
    expect(r.points.rows.length).toBe(300);
    r.points.rows.forEach((row, k) => {
      const i = row - 1;
      expect(r.points.ratio[k]).toBeCloseTo(Math.sqrt(a[i]! * b[i]!) / ((a[i]! + b[i]!) / 2), 14);
      expect(r.points.by[k]).toBe(a[i]);
    });
    expect(r.constant).toBeCloseTo(1, 14);
    expect(Math.max(...r.points.ratio)).toBe(r.constant);
  });
  it('above 5,000 rows: a seeded sample of 5,000 that keeps the 100 most extreme ratios (largest; lower form smallest)', () => {
    const n = 20000;
    const ratio = Float64Array.from({ length: n }, (_, i) => ((i * 7919) % n) / n);
    const by = Float64Array.from({ length: n }, (_, i) => i);
    const used = Int32Array.from({ length: n }, (_, i) => i);
    const up = ratioPoints(ratio, by, used, true, 1);
    expect(up.rows.length).toBe(5000);
    expect(up.sampledFrom).toBe(n);
    const sorted = Array.from(ratio).sort((x, y) => y - x);
    for (const v of sorted.slice(0, 100)) expect(up.ratio).toContain(v);
    const low = ratioPoints(ratio, by, used, false, 1);
    for (const v of sorted.slice(-100)) expect(low.ratio).toContain(v);
    expect(ratioPoints(ratio, by, used, true, 1).rows).toEqual(up.rows);
  });
});
