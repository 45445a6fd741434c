import { describe, it, expect } from 'vitest';
import { discoverBound, monomialText } from '../../src/bound/discover.ts';
import { snapRational } from '../../src/bound/snap.ts';
import type { Column, Table } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';
import { caught } from '../helpers/errors.ts';

const real = (name: string, xs: ArrayLike<number>): Column => ({ name, kind: 'real', values: Float64Array.from(xs), missing: new Uint8Array(xs.length) });
const table = (columns: Column[]): Table => {
  const n = columns[0]!.missing.length;
  return { source: 'test.csv', nRows: n, columns, lines: Int32Array.from({ length: n }, (_, i) => i + 2) };
};

describe('snapping exponents to simple fractions', () => {
  it('takes the simplest fraction in the window, else the nearest (Farey order 4)', () => {
    expect(snapRational(1.97, 4, 4, 0.1).text).toBe('2');
    expect(snapRational(0.34, 4, 4, 0.05).text).toBe('1/3');
    expect(snapRational(-0.74, 4, 4, 0.05).text).toBe('-3/4');
    expect(snapRational(0.6, 4, 4, 0.01).text).toBe('2/3'); // nearest of order 4 (|0.6 − 2/3| < |0.6 − 1/2|)
    expect(snapRational(9.3, 4, 4, 0.3).text).toBe('4'); // clipped to the exponent limit
    expect(snapRational(0.02, 4, 4, 0.05).value).toBe(0);
  });

  it('writes monomials in the expression language', () => {
    const r = (t: string) => snapRational(eval(t) as number, 4, 4, 0); // test-only arithmetic on literals
    expect(monomialText(['s'], [r('2')])).toBe('s^2');
    expect(monomialText(['A', 'B'], [r('1'), r('1')])).toBe('A*B');
    expect(monomialText(['x', 'y'], [r('1/2'), r('-1')])).toBe('x^(1/2)/y');
    expect(monomialText(['p/q', 'z'], [r('0'), r('-3')])).toBe('1/z^3');
    expect(monomialText(['p/q'], [r('1')])).toBe('(p/q)');
    expect(monomialText(['a'], [r('0')])).toBe('1');
  });
});

describe('discovering the right-hand side of classical inequalities', () => {
  // AM–GM for two numbers: xy ≤ ((x + y)/2)² = s²/4, equality iff x = y (Hardy, Littlewood & Pólya,
  // Inequalities, §2.5; ../shared/reference-checks.md). Every fifth row lies on the equality family.
  it('AM–GM: xy ≤ c·s^k over s = x + y gives k = 2, c = 1/4, witnesses with x = y', () => {
    const rng = new Rng(1);
    const n = 5000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = Math.exp(rng.uniform(-2, 2));
      y[i] = i % 5 === 0 ? x[i]! : Math.exp(rng.uniform(-2, 2));
    }
    const t = table([real('x', x), real('y', y)]);
    const res = discoverBound(t, { lhs: 'x*y', from: ['x + y'], top: 5 });
    const best = res.proposals[0]!;
    expect(best.exponents).toEqual({ 'x + y': 2 });
    expect(best.rhs).toBe('(x + y)^2');
    expect(best.constant).toBeCloseTo(0.25, 12);
    expect(best.trend.along['x + y']!.kind).toBe('none');
    for (const w of best.witnesses) expect(x[w.row - 1]).toBeCloseTo(y[w.row - 1]!, 12);
    // the constant bound (exponent 0) trends and ranks below
    const flat = res.proposals.find((p) => p.rhs === '1');
    if (flat) expect(flat.trend.kind).toBe('up');
    expect(best.heldOutExceed).toBe(0);
  });

  // AM–GM for three numbers with the product as lhs and both the sum and a decoy in `from`:
  // xyz ≤ (s/3)³, equality iff x = y = z (same source). The decoy s·e^u, u ~ U(−0.2, 0.2), is correlated with s.
  it('AM–GM (3 terms) with a correlated decoy: exponents (3, 0), c = 1/27', () => {
    const rng = new Rng(2);
    const n = 6000;
    const cols = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n), decoy: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      const a = Math.exp(rng.uniform(-1, 1));
      const eq = i % 4 === 0;
      cols.x[i] = a;
      cols.y[i] = eq ? a : Math.exp(rng.uniform(-1, 1));
      cols.z[i] = eq ? a : Math.exp(rng.uniform(-1, 1));
      cols.decoy[i] = (cols.x[i]! + cols.y[i]! + cols.z[i]!) * Math.exp(rng.uniform(-0.2, 0.2));
    }
    const t = table(Object.entries(cols).map(([k, v]) => real(k, v)));
    const res = discoverBound(t, { lhs: 'x*y*z', from: ['x+y+z', 'decoy'] });
    const best = res.proposals[0]!;
    expect(best.exponents).toEqual({ 'x+y+z': 3, decoy: 0 });
    expect(best.constant).toBeCloseTo(1 / 27, 12);
    expect(best.trend.kind).toBe('none');
    const w = best.witnesses[0]!.row - 1;
    expect(cols.x[w]).toBe(cols.y[w]);
  });

  // Cauchy–Schwarz: (a·b)² ≤ |a|²|b|², equality iff a ∥ b (Hardy, Littlewood & Pólya §2.4; reference-checks).
  it('Cauchy–Schwarz in R³: (a·b)² ≤ c·A^p·B^q gives p = q = 1, c = 1, witnesses proportional', () => {
    const rng = new Rng(3);
    const n = 4000;
    const dot = new Float64Array(n);
    const A = new Float64Array(n);
    const B = new Float64Array(n);
    const par = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      const a = [rng.normal(), rng.normal(), rng.normal()];
      const lam = Math.exp(rng.uniform(-1, 1));
      par[i] = i % 5 === 0 ? 1 : 0;
      const b = par[i] ? a.map((v) => lam * v) : [rng.normal(), rng.normal(), rng.normal()];
      dot[i] = (a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]!) ** 2;
      A[i] = a[0]! ** 2 + a[1]! ** 2 + a[2]! ** 2;
      B[i] = b[0]! ** 2 + b[1]! ** 2 + b[2]! ** 2;
    }
    const res = discoverBound(table([real('d2', dot), real('A', A), real('B', B)]), { lhs: 'd2', from: ['A', 'B'], skipInvalid: true });
    const best = res.proposals[0]!;
    expect(best.exponents).toEqual({ A: 1, B: 1 });
    expect(best.rhs).toBe('A*B');
    expect(best.constant).toBeLessThanOrEqual(1 + 1e-12);
    expect(best.constant).toBeGreaterThan(1 - 1e-12);
    for (const w of best.witnesses) expect(par[w.row - 1]).toBe(1);
  });

  // Jensen for the convex t ↦ t²: ((a + b)/2)² ≤ (a² + b²)/2, equality iff a = b (reference-checks).
  it('Jensen (t²): ((a+b)/2)² ≤ c·q^k over q = (a²+b²)/2 gives k = 1, c = 1', () => {
    const rng = new Rng(4);
    const n = 4000;
    const a = Float64Array.from({ length: n }, () => Math.exp(rng.uniform(-2, 2)));
    const b = Float64Array.from(a, (v, i) => (i % 5 === 0 ? v : Math.exp(rng.uniform(-2, 2))));
    const res = discoverBound(table([real('a', a), real('b', b)]), { lhs: '((a+b)/2)^2', from: ['(a^2+b^2)/2'] });
    const best = res.proposals[0]!;
    expect(best.exponentText).toEqual({ '(a^2+b^2)/2': '1' });
    expect(best.constant).toBeCloseTo(1, 12);
    const w = best.witnesses[0]!.row - 1;
    expect(a[w]).toBe(b[w]);
  });

  // |sin x| ≤ |x| (equality only in the limit x → 0; reference-checks). On log-uniform x in [1e-3, 1] the
  // ratio sin x / x rises towards 1 as x falls: a trend towards a finite limit, reported as a trend.
  it('|sin x| ≤ c·|x|^k gives k = 1 and c* just below 1 at the smallest x; the trend towards the limit is reported', () => {
    const rng = new Rng(5);
    const x = Float64Array.from({ length: 4000 }, () => Math.exp(rng.uniform(Math.log(1e-3), 0)));
    const res = discoverBound(table([real('x', x)]), { lhs: 'abs(sin(x))', from: ['abs(x)'] });
    const best = res.proposals[0]!;
    expect(best.exponents).toEqual({ 'abs(x)': 1 });
    expect(best.constant).toBeLessThan(1);
    expect(best.constant).toBeGreaterThan(1 - 1e-6);
    expect(x[best.witnesses[0]!.row - 1]).toBe(Math.min(...x));
    expect(best.trend.along['abs(x)']!.kind).toBe('down');
    expect(best.trend.verdict).toMatch(/^increasing towards low abs\(x\)/);
  });

  // Bernoulli: (1 + x)ⁿ ≥ 1 + nx for x > −1, n ≥ 1 (reference-checks), here as the lower form
  // (1 + x)ⁿ − 1 ≥ c·n^p·x^q on small x: p = q = 1, c = 1, attained at n = 1.
  it('Bernoulli (lower form): (1+x)^n − 1 ≥ c·n^p·x^q gives p = q = 1, c = 1 at n = 1', () => {
    const rng = new Rng(6);
    const N = 4000;
    const x = Float64Array.from({ length: N }, () => Math.exp(rng.uniform(Math.log(1e-4), Math.log(1e-2))));
    const nn = Float64Array.from({ length: N }, () => 1 + rng.int(8));
    const lhs = Float64Array.from(x, (v, i) => Math.expm1(nn[i]! * Math.log1p(v)));
    const res = discoverBound(table([real('x', x), real('n', nn), real('lhs', lhs)]), { lhs: 'lhs', from: ['n', 'x'], lower: true });
    const best = res.proposals[0]!;
    expect(best.exponents).toEqual({ n: 1, x: 1 });
    expect(best.constant).toBeGreaterThanOrEqual(1 - 1e-12);
    expect(best.constant).toBeLessThan(1 + 1e-4);
    expect(nn[best.witnesses[0]!.row - 1]).toBe(1);
  });
});

describe('a planted envelope with a correlated decoy', () => {
  // Planted by construction: lhs = u·t^(3/2) with u ∈ (0, 1], a share of rows at u = 1; w = t·e^v (v ~ N(0, 0.3²)).
  it('the decoy gets exponent 0 and the planted exponent 3/2 is recovered with c = 1', () => {
    const rng = new Rng(7);
    const n = 8000;
    const t = new Float64Array(n);
    const w = new Float64Array(n);
    const lhs = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      t[i] = Math.exp(rng.uniform(-2, 3));
      w[i] = t[i]! * Math.exp(0.3 * rng.normal());
      const u = i % 10 === 0 ? 1 : rng.next() ** 2;
      lhs[i] = u * t[i]! ** 1.5;
    }
    const res = discoverBound(table([real('t', t), real('w', w), real('lhs', lhs)]), { lhs: 'lhs', from: ['t', 'w'] });
    const best = res.proposals[0]!;
    expect(best.exponentText).toEqual({ t: '3/2', w: '0' });
    expect(best.constant).toBeCloseTo(1, 12);
    expect(best.trend.kind).toBe('none');
    // the decoy alone carries a looser bound: lhs/w^(3/2) = u·e^(−1.5v) does not trend (v is independent of t)
    // but runs farther from the data on the held-out rows and ranks below
    const decoyOnly = res.proposals.findIndex((p) => p.exponents.t === 0 && p.exponents.w !== 0);
    expect(decoyOnly).toBeGreaterThan(0);
    expect(res.proposals[decoyOnly]!.heldOutMeanLogGap).toBeGreaterThan(best.heldOutMeanLogGap * 1.2);
  });

  it('reports held-out behaviour and a tail estimate beside c*', () => {
    const rng = new Rng(8);
    const n = 5000;
    const t = Float64Array.from({ length: n }, () => Math.exp(rng.uniform(0, 2)));
    const lhs = Float64Array.from(t, (v) => v * rng.next()); // sup of lhs/t is 1, uniform tail: ξ = −1
    const res = discoverBound(table([real('t', t), real('lhs', lhs)]), { lhs: 'lhs', from: ['t'] });
    const best = res.proposals[0]!;
    expect(best.exponents).toEqual({ t: 1 });
    expect(res.selectionRows + res.heldOutRows).toBe(n);
    expect(res.heldOutRows).toBe(2000);
    expect(best.heldOutConstant).toBeLessThanOrEqual(best.constant);
    expect(best.selectionConstant).toBeLessThanOrEqual(best.constant);
    expect(best.supremum).not.toBeNull();
    expect(best.supremum!.low!).toBeLessThanOrEqual(1);
    expect(best.supremum!.high === null || best.supremum!.high >= 1).toBe(true);
  });
});

describe('refusals', () => {
  const t = table([real('x', [1, 2, 0, 4, ...Array.from({ length: 30 }, (_, i) => i + 1)]), real('y', Array.from({ length: 34 }, (_, i) => i + 1))]);
  it('a quantity ≤ 0 is refused with its row and line, unless skipped and counted', () => {
    const e = caught(() => discoverBound(t, { lhs: 'y', from: ['x'] }));
    expect(e.code).toBe('bound.invalidRows');
    expect(e.message).toMatch(/row 3, line 4 \(x ≤ 0\)/);
    const res = discoverBound(t, { lhs: 'y', from: ['x'], skipInvalid: true });
    expect(res.dropped.total).toBe(1);
    expect(res.used).toBe(33);
  });
  it('options are checked against their table, naming the key', () => {
    expect(caught(() => discoverBound(t, { lhs: 'y', from: ['x'], maxExponent: 13 })).message).toBe('expected maxExponent to be at most 12 (its ceiling), got 13');
    expect(caught(() => discoverBound(t, { lhs: 'y', from: [] })).message).toBe('expected from to list 1 to 6 quantities, got 0');
    expect(caught(() => discoverBound(t, { lhs: 'y', from: ['x', 'x'] })).message).toBe("from lists 'x' twice");
  });
});
