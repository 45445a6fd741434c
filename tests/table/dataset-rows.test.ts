import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { dropDuplicates, validRows } from '../../src/table/dataset-rows.ts';

// The hashed duplicate finder must agree with the obvious quadratic definition (common practice:
// check a fast algorithm against a slow, evidently correct one).
function naive(keep: Uint8Array, cols: number[][]): Uint8Array {
  const out = keep.slice();
  const seen: number[] = [];
  for (let i = 0; i < out.length; i++) {
    if (!out[i]) continue;
    if (seen.some((j) => cols.every((c) => c[i] === c[j]))) out[i] = 0;
    else seen.push(i);
  }
  return out;
}

describe('dropDuplicates', () => {
  it('agrees with the quadratic definition on random tables with many repeats (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 4 }).chain((p) =>
          fc.array(fc.array(fc.constantFrom(0, -0, 1, 2, 0.5, 1e300, -7), { minLength: p, maxLength: p }), { minLength: 1, maxLength: 60 }),
        ),
        fc.array(fc.boolean(), { minLength: 60, maxLength: 60 }),
        (rowsData, keepBits) => {
          const n = rowsData.length;
          const p = rowsData[0]!.length;
          const cols = Array.from({ length: p }, (_, j) => rowsData.map((r) => r[j]!));
          const keep = Uint8Array.from({ length: n }, (_, i) => (keepBits[i] ? 1 : 0));
          const expected = naive(keep, cols);
          const got = keep.slice();
          const d = dropDuplicates(
            got,
            cols.map((c) => ({ numbers: Float64Array.from(c) })),
          );
          expect(Array.from(got)).toEqual(Array.from(expected));
          expect(d).toBe(keep.reduce((a, b) => a + b, 0) - expected.reduce((a, b) => a + b, 0));
        },
      ),
      { numRuns: 300 },
    );
  });
  it('compares strings for label keys and never merges rows with a missing key', () => {
    const keep = Uint8Array.of(1, 1, 1, 1, 1);
    const d = dropDuplicates(keep, [{ strings: ['3_1', '4_1', '3_1', '', ''], missing: Uint8Array.of(0, 0, 0, 1, 1) }]);
    expect(d).toBe(1);
    expect(Array.from(keep)).toEqual([1, 1, 0, 1, 1]);
  });
});

describe('validRows', () => {
  it('classifies missing, NaN and infinite cells (hand-counted)', () => {
    const r = validRows(5, [
      { name: 'a', parts: [Float64Array.of(1, NaN, Infinity, -Infinity, NaN)], missing: Uint8Array.of(0, 0, 0, 0, 1) },
      { name: 'z', parts: [Float64Array.of(1, 1, 1, 1, 1), Float64Array.of(0, 0, NaN, 0, 0)], missing: new Uint8Array(5) },
    ]);
    expect(r.dropped).toEqual([
      { column: 'a', reason: 'missing', rows: 1 },
      { column: 'a', reason: 'nan', rows: 1 },
      { column: 'a', reason: 'infinite', rows: 2 },
      { column: 'z', reason: 'nan', rows: 1 },
    ]);
    expect(Array.from(r.keep)).toEqual([1, 0, 0, 0, 0]);
    expect(r.invalidRows).toBe(4);
  });
});

describe('validRows: the one row policy (missing first, then not finite)', () => {
  it('agrees with the evident per-row definition on random columns (property; common practice)', () => {
    const cell = fc.constantFrom(1, -2.5, 0, NaN, Infinity, -Infinity, 'missing' as const);
    fc.assert(
      fc.property(fc.array(fc.array(cell, { minLength: 3, maxLength: 3 }), { minLength: 1, maxLength: 40 }), (rowsData) => {
        const n = rowsData.length;
        const used = [0, 1, 2].map((j) => ({
          name: `c${j}`,
          parts: [Float64Array.from(rowsData, (r) => (r[j] === 'missing' ? NaN : r[j]!))],
          missing: Uint8Array.from(rowsData, (r) => (r[j] === 'missing' ? 1 : 0)),
        }));
        const got = validRows(n, used);
        const expected = rowsData.map((r) => (r.some((v) => v === 'missing') ? 1 : r.some((v) => !Number.isFinite(v as number)) ? 2 : 0));
        expect(Array.from(got.reason)).toEqual(expected);
        expect(Array.from(got.keep)).toEqual(expected.map((e) => (e === 0 ? 1 : 0)));
        const count = (k: number) => expected.filter((e) => e === k).length;
        expect(got.rows).toEqual({ total: count(1) + count(2), missing: count(1), nonFinite: count(2) });
        expect(got.invalidRows).toBe(got.rows.total);
        // cells: each bad cell once under its column and reason
        const cells = (j: number, pred: (v: number | 'missing') => boolean) => rowsData.filter((r) => pred(r[j]!)).length;
        for (let j = 0; j < 3; j++) {
          const find = (reason: string) => got.dropped.find((d) => d.column === `c${j}` && d.reason === reason)?.rows ?? 0;
          expect(find('missing')).toBe(cells(j, (v) => v === 'missing'));
          expect(find('nan')).toBe(cells(j, (v) => v !== 'missing' && Number.isNaN(v)));
          expect(find('infinite')).toBe(cells(j, (v) => v === Infinity || v === -Infinity));
        }
      }),
    );
  });
});
