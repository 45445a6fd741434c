import { describe, it, expect } from 'vitest';
import { rankPoints } from '../../src/attribute/points.ts';
import { buildDataset } from '../../src/table/dataset.ts';
import type { Column, Table } from '../../src/table/types.ts';

const real = (name: string, xs: number[]): Column => ({ name, kind: 'real', values: Float64Array.from(xs), missing: new Uint8Array(xs.length) });

describe('rankPoints: the target against the leading ranked groups', () => {
  it('a complex column is plotted through |z| (3-4-5 right triangle: |3 + 4i| = 5), a real one as itself; rows are 1-based and skip dropped rows', () => {
    const t: Table = {
      source: 't',
      nRows: 4,
      columns: [
        { name: 'z', kind: 'complex', re: Float64Array.of(3, 0, 6, 1), im: Float64Array.of(4, 1, 8, 0), missing: new Uint8Array(4) },
        real('w', [1, 2, NaN, 4]),
        real('y', [10, 20, 30, 40]),
      ],
    };
    const ds = buildDataset(t, { target: 'y' });
    const p = rankPoints(ds, ['z', 'w'], 1);
    expect(p.rows).toEqual([1, 2, 4]); // row 3 has w = NaN and is dropped by the row policy
    expect(p.target).toEqual([10, 20, 40]);
    expect(p.groups[0]).toEqual({ group: 'z', expression: 'abs(z)', values: [5, 1, 1] });
    expect(p.groups[1]).toEqual({ group: 'w', expression: 'w', values: [1, 2, 4] });
    expect(p.sampledFrom).toBe(3);
  });
  it('a group of several columns has no one value and is passed over for the next', () => {
    const t: Table = { source: 't', nRows: 3, columns: [real('a', [1, 2, 3]), real('b', [3, 1, 2]), real('c', [5, 6, 8]), real('y', [1, 0, 1])] };
    const ds = buildDataset(t, { target: 'y', groups: { pair: ['a', 'b'] } });
    expect(rankPoints(ds, ['pair', 'c'], 1).groups.map((g) => g.group)).toEqual(['c']);
  });
});
