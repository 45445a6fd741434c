import { describe, it, expect } from 'vitest';
import { findBound } from '../../src/bound/find.ts';
import { SurmiseError } from '../../src/errors.ts';
import type { Column, Table } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';
import { caught } from '../helpers/errors.ts';

const real = (name: string, xs: number[], missing?: number[]): Column => ({
  name,
  kind: 'real',
  values: Float64Array.from(xs),
  missing: Uint8Array.from(xs, (_, i) => (missing?.includes(i) ? 1 : 0)),
});
const label = (name: string, xs: string[]): Column => ({ name, kind: 'label', values: xs, missing: new Uint8Array(xs.length) });
const complex = (name: string, re: number[], im: number[]): Column => ({
  name,
  kind: 'complex',
  re: Float64Array.from(re),
  im: Float64Array.from(im),
  missing: new Uint8Array(re.length),
});
const table = (columns: Column[]): Table => {
  const n = columns[0]!.missing.length;
  return { source: 'test.csv', nRows: n, columns, lines: Int32Array.from({ length: n }, (_, i) => i + 2) };
};

const thrown = caught;

describe('findBound through the expression language', () => {
  // |eˣ − 1 − x| ≤ (e − 2)x² on [−1, 1], attained at x = 1 (from memory; ../shared/reference-checks.md).
  it('|exp(x) − 1 − x| ≤ c·x^2: c* = e − 2 at the row with x = 1, reported with its row, line and labels', () => {
    const rng = new Rng(21);
    const x = Array.from({ length: 2000 }, () => rng.uniform(-1, 1));
    x[1234] = 1;
    const t = table([label('name', x.map((_, i) => `p${i}`)), real('x', x)]);
    const res = findBound(t, { lhs: 'abs(exp(x) - 1 - x)', rhs: 'x^2', top: 3 });
    const r = res.results[0]!;
    expect(r.constant).toBeCloseTo(Math.E - 2, 12);
    expect(r.witnesses[0]).toMatchObject({ row: 1235, line: 1236, labels: { name: 'p1234' } });
    expect(r.witnesses[0]!.ratio).toBe(r.constant);
    expect(r.witnesses).toHaveLength(3);
    expect(r.n).toBe(2000);
    expect(res.form).toBe('upper');
    // no --by: stratified along the rhs itself
    expect(r.by).toBe('x^2');
    expect(r.strata).toHaveLength(10);
  });

  // |sin x − x| ≤ |x|³/6 (from memory): c* → 1/6 from below as x → 0; lower form min ratio at the largest x.
  it('|sin(x) − x| ≤ c·abs(x)^3 on (0, 0.5]: c* just below 1/6; --lower gives the ratio at x = 0.5', () => {
    const x = Array.from({ length: 500 }, (_, i) => 0.01 + (0.49 * i) / 499);
    const t = table([real('x', x)]);
    const up = findBound(t, { lhs: 'abs(sin(x) - x)', rhs: 'abs(x)^3', by: 'x' }).results[0]!;
    expect(up.constant).toBeLessThan(1 / 6);
    expect(up.constant).toBeGreaterThan(1 / 6 - 1e-3);
    expect(up.witnesses[0]!.row).toBe(1);
    const lo = findBound(t, { lhs: 'abs(sin(x) - x)', rhs: 'abs(x)^3', by: 'x', lower: true });
    expect(lo.form).toBe('lower');
    expect(lo.results[0]!.witnesses[0]!.row).toBe(500);
    expect(lo.results[0]!.constant).toBeCloseTo((0.5 - Math.sin(0.5)) / 0.125, 12);
  });

  // Integer target (even integers) with a derived real part of a complex quotient; invented data.
  it('works on an integer target with --derive r=re(q/p) and with re(q/p) written inline', () => {
    const rng = new Rng(8);
    const n = 3000;
    const k = Array.from({ length: n }, () => 2 * (rng.int(11) - 5));
    const b = Array.from({ length: n }, () => rng.uniform(2, 10));
    const pRe = Array.from({ length: n }, () => rng.uniform(0.5, 1.5));
    const pIm = Array.from({ length: n }, () => rng.uniform(-1, 1));
    // q real; choose q so that re(q/p) = 2·k + e with |e| ≤ 0.05·b
    const e = b.map((v) => 0.05 * v * (2 * rng.next() - 1));
    const q = k.map((s, i) => {
      const m2 = pRe[i]! ** 2 + pIm[i]! ** 2;
      return ((2 * s + e[i]!) * m2) / pRe[i]!; // re(q/p) = q·re(p)/|p|²
    });
    const t = table([
      { name: 'k', kind: 'integer', values: Float64Array.from(k), missing: new Uint8Array(n) },
      real('b', b),
      complex('p', pRe, pIm),
      real('q', q),
    ]);
    const viaDerive = findBound(t, { lhs: 'abs(2*k - r)', rhs: 'b', derive: [{ name: 'r', source: 're(q/p)' }] }).results[0]!;
    const inline = findBound(t, { lhs: 'abs(2*k - re(q/p))', rhs: 'b' }).results[0]!;
    // brute force over the planted errors
    const truth = Math.max(...e.map((x, i) => Math.abs(x) / b[i]!));
    expect(viaDerive.constant).toBeCloseTo(truth, 9);
    expect(inline.constant).toBeCloseTo(truth, 9);
    expect(viaDerive.constant).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(t.columns).toHaveLength(4); // the caller's table is not changed by --derive
  });

  it('allows negative lhs values and notes when the max ratio is ≤ 0', () => {
    const t = table([real('a', [-3, -1, -2, -5]), real('b', [1, 2, 3, 4])]);
    const r = findBound(t, { lhs: 'a', rhs: 'b', bins: 2 }).results[0]!;
    expect(r.constant).toBe(-0.5);
    expect(r.notes.map((n) => n.text).join(' ')).toMatch(/≤ 0/);
    expect(r.notes[0]!.kind).toBe('nonPositive');
  });

  it('compares several rhs candidates side by side, in the order given', () => {
    const t = table([real('x', [1, 2, 3, 4, 5, 6]), real('y', [1, 4, 9, 16, 25, 36])]);
    const res = findBound(t, { lhs: 'y', rhs: ['x', 'x^2', 'x^3'], bins: 3 });
    expect(res.results.map((r) => r.rhs)).toEqual(['x', 'x^2', 'x^3']);
    expect(res.results.map((r) => r.constant)).toEqual([6, 1, 1]);
  });
});

describe('rows that cannot be used', () => {
  const t = table([
    label('k', ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h']),
    real('l', [1, 2, 3, 4, 5, 6, Infinity, 8], [5]),
    real('r', [1, 0, -2, 1, -1, 1, 1, 2]),
  ]);

  it('refuses rhs ≤ 0 with the count and the first rows (row, line, values)', () => {
    const e = thrown(() => findBound(t, { lhs: 'l', rhs: 'r' }));
    expect(e.code).toBe('bound.badRhs');
    expect(e.message).toBe(
      'test.csv: 5 of 8 rows cannot be used for l ≤ c·(r) (3 with rhs ≤ 0, 1 with a value that is not finite, 1 with a missing cell); ' +
        'first: row 2, line 3: lhs = 2, rhs = 0; row 3, line 4: lhs = 3, rhs = -2; row 5, line 6: lhs = 5, rhs = -1; ' +
        'row 6, line 7: lhs = missing, rhs = 1; row 7, line 8: lhs = Infinity, rhs = 1. With `skipInvalid` they are dropped and counted instead',
    );
  });

  it('with skipInvalid drops and counts them', () => {
    const res = findBound(t, { lhs: 'l', rhs: 'r', skipInvalid: true, bins: 2 });
    expect(res.dropped).toEqual({ missing: 1, nonFinite: 1, rhsNonPositive: 3, total: 5 });
    expect(res.results[0]!.n).toBe(3);
    expect(res.results[0]!.constant).toBe(4); // rows a (1/1), d (4/1), h (8/2)
    expect(res.results[0]!.witnesses[0]!.labels).toEqual({ k: 'd' });
  });

  it('names an unknown column through the expression error', () => {
    expect(thrown(() => findBound(t, { lhs: 'lhs_typo', rhs: 'r' })).code).toBe('expr.unknownColumn');
  });

  it('refuses a complex lhs, an unknown --id column and bad options', () => {
    const c = table([complex('z', [1, 2], [0, 1]), real('r', [1, 1])]);
    const e = thrown(() => findBound(c, { lhs: 'z', rhs: 'r' }));
    expect(e.code).toBe('expr.notReal');
    expect(e.message).toMatch(/row 2, line 3/);
    const u = thrown(() => findBound(t, { lhs: 'l', rhs: 'r', id: ['kk'], skipInvalid: true }));
    expect(u.message).toMatch(/no column 'kk'.*did you mean 'k'/);
    expect(thrown(() => findBound(t, { lhs: 'l', rhs: 'r', bins: 0 })).message).toBe('expected bins to be an integer ≥ 1, got 0');
    expect(thrown(() => findBound(t, { lhs: 'l', rhs: [] })).code).toBe('bound.badOption');
  });
});
