/**
 * Round trip through danfo.js DataFrames (danfojs-node, the general-purpose dataframe library the
 * project uses for this bridge): a Table -> DataFrame -> Table keeps every value exactly, and the
 * DataFrame shows the expected shape and columns.
 */
import { describe, it, expect } from 'vitest';
import { toDataFrame, fromDataFrame } from '../../src/table/danfo.ts';
import { tableFromColumns } from '../../src/table/columns.ts';
import type { ComplexColumn, LabelColumn, RealColumn } from '../../src/table/types.ts';

describe('danfo bridge', () => {
  it('Table -> DataFrame -> Table keeps values bit for bit (0.1 is not a float32 value) and joins complex parts', async () => {
    const t = tableFromColumns(
      [
        { name: 'name', kind: 'label', values: ['3_1', '4_1', ''], missing: Uint8Array.from([0, 0, 1]) },
        { name: 'amp', kind: 'real', values: Float64Array.from([0.1, 2.0298832128193, NaN]), missing: Uint8Array.from([0, 0, 1]) },
        { name: 'c', kind: 'integer', values: Float64Array.from([3, 4, 5]), missing: new Uint8Array(3) },
        { name: 'tau', kind: 'complex', re: Float64Array.from([0.5, 0, 1 / 3]), im: Float64Array.from([1.2, 3.4641016151377544, -2]), missing: new Uint8Array(3) },
      ],
      'knots',
    );
    const df = await toDataFrame(t);
    expect(df.shape).toEqual([3, 5]);
    expect(df.columns).toEqual(['name', 'amp', 'c', 'tau.re', 'tau.im']);
    const back = await fromDataFrame(df);
    expect(back.columns.map((c) => `${c.name}:${c.kind}`)).toEqual(['name:label', 'amp:real', 'c:integer', 'tau:complex']);
    expect((back.columns[0] as LabelColumn).values.slice(0, 2)).toEqual(['3_1', '4_1']);
    expect(Array.from(back.columns[0]!.missing)).toEqual([0, 0, 1]);
    const amp = back.columns[1] as RealColumn;
    expect(amp.values[0]).toBe(0.1); // Math.fround(0.1) !== 0.1, so a float32 store would fail here
    expect(amp.values[1]).toBe(2.0298832128193);
    expect(Array.from(amp.missing)).toEqual([0, 0, 1]);
    const tau = back.columns[3] as ComplexColumn;
    expect(Array.from(tau.re)).toEqual([0.5, 0, 1 / 3]);
    expect(Array.from(tau.im)).toEqual([1.2, 3.4641016151377544, -2]);
  }, 60_000);
});
