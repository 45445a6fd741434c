import { describe, it, expect } from 'vitest';
import { affineEnvelope } from '../../src/bound/affine.ts';
import { findBound } from '../../src/bound/find.ts';
import type { Table } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';
import { caught } from '../helpers/errors.ts';

const all = (n: number) => Int32Array.from({ length: n }, (_, i) => i);

describe('affine bounds lhs ≤ c·rhs + d', () => {
  // A convex function lies below its chord and above its tangents (Hardy, Littlewood & Pólya, Inequalities, §3.5):
  // on [−1, 1], eˣ ≤ sinh(1)·x + cosh(1) (the chord, equality at x = ±1) and eˣ ≥ 1 + x (the tangent at 0).
  const rng = new Rng(31);
  const x = Float64Array.from([-1, 1, ...Array.from({ length: 4000 }, () => rng.uniform(-1, 1)), 0]);
  const ex = Float64Array.from(x, Math.exp);

  it('upper: the chord of eˣ over [−1, 1], touching at x = ±1', () => {
    const a = affineEnvelope(ex, x, all(x.length), true, 2);
    expect(a.slope).toBeCloseTo(Math.sinh(1), 10);
    expect(a.offset).toBeCloseTo(Math.cosh(1), 10);
    expect([...a.witnessRows].sort()).toEqual([0, 1]);
    expect(a.atLimit).toBe(false);
  });

  const m = x.reduce((s, v) => s + v, 0) / x.length;

  it('lower: the tangent at the mean m of x, e^m·(1 + x − m), touching near x = m', () => {
    const a = affineEnvelope(ex, x, all(x.length), false, 1);
    // the hull edge over the sample mean joins two sampled points next to m: within 1e-3 of the tangent
    expect(Math.abs(a.slope - Math.exp(m))).toBeLessThan(1e-3);
    expect(Math.abs(a.offset - Math.exp(m) * (1 - m))).toBeLessThan(1e-5);
    for (let i = 0; i < x.length; i++) expect(ex[i]!).toBeGreaterThanOrEqual(a.slope * x[i]! + a.offset - 1e-12);
    expect(Math.abs(x[a.witnessRows[0]!]! - m)).toBeLessThan(0.01);
  });

  it('findBound form two-sided reports both lines; form is checked against its table', () => {
    const t: Table = {
      source: 't.csv',
      nRows: x.length,
      columns: [{ name: 'x', kind: 'real', values: x, missing: new Uint8Array(x.length) }],
    };
    const res = findBound(t, { lhs: 'exp(x)', rhs: 'x + 2', form: 'two-sided', top: 2 });
    const [up, lo] = res.results[0]!.affine!;
    // in terms of r = x + 2: eˣ ≤ sinh(1)·r + cosh(1) − 2 sinh(1)
    expect(up!.form).toBe('upper');
    expect(up!.slope).toBeCloseTo(Math.sinh(1), 10);
    expect(up!.offset).toBeCloseTo(Math.cosh(1) - 2 * Math.sinh(1), 9);
    expect(lo!.form).toBe('lower');
    expect(Math.abs(lo!.slope - Math.exp(m))).toBeLessThan(1e-3);
    expect(caught(() => findBound(t, { lhs: 'x', rhs: 'x + 2', form: 'cubic' as never })).message).toBe(
      'expected form to be one of ratio, affine, two-sided, got cubic',
    );
    expect(findBound(t, { lhs: 'exp(x)', rhs: 'x + 2', form: 'affine', lower: true }).results[0]!.affine!.map((a) => a.form)).toEqual(['lower']);
  });
});
