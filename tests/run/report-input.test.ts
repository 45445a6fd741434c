import { describe, it, expect } from 'vitest';
import { buildReportInput } from '../../src/run/report-input.ts';
import type { RunResults } from '../../src/run/run.ts';
import { fitRelation } from '../../src/relate/fit.ts';
import { findBound } from '../../src/bound/find.ts';
import type { Column, Table } from '../../src/table/types.ts';

const real = (name: string, xs: number[]): Column => ({ name, kind: 'real', values: Float64Array.from(xs), missing: new Uint8Array(xs.length) });
const label = (name: string, xs: string[]): Column => ({ name, kind: 'label', values: xs, missing: new Uint8Array(xs.length) });

describe('buildReportInput renders what the stages handed on', () => {
  it('needs no numeric column of the table: residuals and ratios come from the stages, labels from the table', () => {
    // y = 2x + 1 exactly (hand-worked: residuals 0); bound y ≤ c·x on x ≥ 1 has c = 3 at x = 1
    const x = [1, 2, 3, 4, 5, 6];
    const t: Table = { source: 't.csv', nRows: 6, columns: [real('x', x), real('y', x.map((v) => 2 * v + 1)), label('family', ['a', 'a', 'b', 'b', 'c', 'c'])] };
    const fit = fitRelation(t, { target: 'y', terms: ['x'] });
    const bound = findBound(t, { lhs: 'y', rhs: 'x', bins: 2 });
    const results = {
      config: { target: 'y' },
      createdAt: '2026-01-01T00:00:00Z',
      input: { path: 't.csv', sha256: '0', rows: 6 },
      rank: null, fits: [fit], search: null, residual: null, bounds: [bound], discoveries: [],
    } as unknown as RunResults;
    // only the label column is left: evaluating any expression here would fail with expr.unknownColumn
    const labelsOnly: Table = { ...t, columns: [t.columns[2]!] };
    const input = buildReportInput(results, labelsOnly, 'target: y\n');
    const res = input.fits![0]!.residuals!;
    expect(res.byTerm[0]!.x).toEqual(x);
    for (const r of res.residual) expect(Math.abs(r)).toBeLessThan(1e-12);
    const pts = input.bounds![0]!.results[0]!.points!;
    expect(pts.ratio).toEqual(x.map((v) => (2 * v + 1) / v));
    expect(Math.max(...pts.ratio)).toBe(3);
    expect(pts.labels).toEqual({ name: 'family', values: ['a', 'a', 'b', 'b', 'c', 'c'] });
    expect(input.fits![0]!.warnings).toEqual(fit.warnings);
  });
});
