import { describe, it, expect } from 'vitest';
import { SurmiseError } from '../../src/errors.ts';
import { Rng } from '../../src/util/rng.ts';
import type { Column, Table } from '../../src/table/types.ts';
import { compileExpression, deriveColumn, evaluateExpression, parseExpression } from '../../src/table/expr/index.ts';
import { caught } from '../helpers/errors.ts';
import { cplx } from '../helpers/columns.ts';

const real = (name: string, v: number[], kind: 'real' | 'integer' = 'real'): Column => ({
  name,
  kind,
  values: Float64Array.from(v),
  missing: Uint8Array.from(v.map((x) => (Number.isNaN(x) ? 1 : 0))),
});
const table = (columns: Column[], nRows: number): Table => ({ source: 'knots.csv', nRows, columns });

const err = caught;

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(1, Math.abs(b));

describe('evaluateExpression: worked examples', () => {
  const t = table(
    [
      real('a', [2.0298832128193, 2.8281220883308, NaN]),
      real('xings', [4, 5, 6], 'integer'),
      cplx('p', [0, 1, 2], [2 * Math.sqrt(3), 3, 1]),
      cplx('q', [1, 1, 1], [0, 1, 0]),
      { name: 'name', kind: 'label', values: ['4_1', '5_2', '6_1'], missing: new Uint8Array(3) },
    ],
    3,
  );

  it('real part of a complex quotient re(p/q), hand-derived', () => {
    // Row 0: 2√3·i / 1 is purely imaginary: 0. Row 1: (1+3i)/(1+i) = (1+3i)(1−i)/2 = 2+i by hand, so 2. Row 2: 2/1 = 2.
    const a = evaluateExpression(t, 're(p/q)');
    expect(a.im).toBeNull();
    expect(Array.from(a.re)).toEqual([0, 2, 2]);
  });
  it('natural_slope is no function of the language (write re(p/q))', () => {
    expect(() => evaluateExpression(t, 'natural_slope(p, q)')).toThrow(/unknown function 'natural_slope'/);
  });
  it('complex quotient keeps its imaginary part: p/q on row 1 is 2 + i (hand-derived)', () => {
    const q = evaluateExpression(t, 'p/q');
    expect(q.im).not.toBeNull();
    expect(q.re[1]).toBeCloseTo(2, 14);
    expect(q.im![1]).toBeCloseTo(1, 14);
  });
  it('marks a row missing when any input cell is missing, and its value is NaN', () => {
    const r = evaluateExpression(t, 'a^0 + xings');
    expect(Array.from(r.missing)).toEqual([0, 0, 1]);
    expect(r.re[0]).toBe(5);
    expect(Number.isNaN(r.re[2]!)).toBe(true);
  });
  it('reads X.re and X.im of a complex column X', () => {
    expect(Array.from(evaluateExpression(t, 'p.im - im(p)').re)).toEqual([0, 0, 0]);
    expect(Array.from(evaluateExpression(t, 'q.re').re)).toEqual([1, 1, 1]);
  });
  it('comparisons give 1 or 0 (and NaN on a missing row)', () => {
    expect(Array.from(evaluateExpression(t, 'xings <= 5').re)).toEqual([1, 1, 0]);
    expect(Array.from(evaluateExpression(t, 'xings != 5').re)).toEqual([1, 0, 1]);
    const r = evaluateExpression(t, 'a > 2.5');
    expect(Array.from(r.re.slice(0, 2))).toEqual([0, 1]);
    expect(Number.isNaN(r.re[2]!)).toBe(true);
  });
  it('never returns the table’s own arrays (the table cannot be changed through the result)', () => {
    const r = evaluateExpression(t, 'xings');
    r.re[0] = 99;
    expect((t.columns[1] as { values: Float64Array }).values[0]).toBe(4);
  });
  it('errors name the column, suggest the nearest and show a caret', () => {
    const e = err(() => evaluateExpression(t, 'aa * 2'));
    expect(e.code).toBe('expr.unknownColumn');
    expect(e.message).toBe(
      "unknown column 'aa' at position 1 of the expression (table knots.csv) (did you mean 'a'?)\n  aa * 2\n  ^^",
    );
    expect(err(() => evaluateExpression(t, 'name + 1')).code).toBe('expr.labelColumn');
    const nr = err(() => evaluateExpression(t, 'floor(p)'));
    expect(nr.code).toBe('expr.notReal');
    expect(nr.message.split('\n')[0]).toMatch(/^floor needs real values, but the argument at position 7 is complex \(first at data row 1: 0\+3\.46/);
    expect(err(() => evaluateExpression(t, 'p < 1')).code).toBe('expr.notReal');
    expect(err(() => evaluateExpression(t, 'max(a, q)')).code).toBe('expr.notReal');
  });
  it('accepts a complex column whose values are all real where a real argument is required', () => {
    const u = table([cplx('z', [1.5, -2.5], [0, 0])], 2);
    expect(Array.from(evaluateExpression(u, 'floor(z)').re)).toEqual([1, -3]);
  });
});

describe('evaluateExpression: real functions agree with Math (ECMAScript built-ins)', () => {
  const rng = new Rng(20261202);
  const n = 500;
  const x = Array.from({ length: n }, () => rng.uniform(-10, 10));
  const y = Array.from({ length: n }, () => rng.uniform(-10, 10));
  const p = Array.from({ length: n }, () => rng.uniform(0.01, 10));
  const t = table([real('x', x), real('y', y), real('p', p)], n);
  const cases: Array<[string, (i: number) => number]> = [
    ['sin(x)', (i) => Math.sin(x[i]!)],
    ['cos(x)', (i) => Math.cos(x[i]!)],
    ['tan(x)', (i) => Math.tan(x[i]!)],
    ['exp(x)', (i) => Math.exp(x[i]!)],
    ['log(p)', (i) => Math.log(p[i]!)],
    ['sqrt(p)', (i) => Math.sqrt(p[i]!)],
    ['abs(x)', (i) => Math.abs(x[i]!)],
    ['atan2(y, x)', (i) => Math.atan2(y[i]!, x[i]!)],
    ['min(x, y, 0)', (i) => Math.min(x[i]!, y[i]!, 0)],
    ['max(x, y)', (i) => Math.max(x[i]!, y[i]!)],
    ['floor(x)', (i) => Math.floor(x[i]!)],
    ['ceil(x)', (i) => Math.ceil(x[i]!)],
    ['sign(x)', (i) => Math.sign(x[i]!)],
    ['p^y', (i) => Math.pow(p[i]!, y[i]!)],
    ['x*y - x/p + 3', (i) => x[i]! * y[i]! - x[i]! / p[i]! + 3],
  ];
  for (const [src, f] of cases) {
    it(src, () => {
      const r = evaluateExpression(t, src);
      expect(r.im).toBeNull();
      for (let i = 0; i < n; i++) expect(r.re[i]).toBe(f(i));
    });
  }
});

describe('evaluateExpression: choices for negative bases and branches', () => {
  const t = table([real('x', [-8, -27, -4, 2])], 4);
  it('(-8)^(1/3) is the real cube root -2; integer powers of negatives stay real', () => {
    // our documented choice: x^(p/q) with q odd is real for x < 0 (cube root of -8 is -2, from memory)
    const r = evaluateExpression(t, 'x^(1/3)');
    expect(r.im).toBeNull();
    expect(r.re[0]).toBeCloseTo(-2, 14);
    expect(r.re[1]).toBeCloseTo(-3, 14);
    expect(r.re[2]).toBeCloseTo(-Math.cbrt(4), 14);
    expect(Array.from(evaluateExpression(t, 'x^3').re)).toEqual([-512, -19683, -64, 8]);
    expect(evaluateExpression(t, 'x^(2/3)').re[0]).toBeCloseTo(4, 13);
  });
  it('an even root of a negative number is the principal complex value: (-4)^(1/2) = 2i = sqrt(-4)', () => {
    const u = table([real('x', [-4])], 1);
    for (const src of ['x^(1/2)', 'x^0.5', 'sqrt(x)']) {
      const r = evaluateExpression(u, src);
      expect(r.re[0]).toBeCloseTo(0, 14);
      expect(r.im![0]).toBeCloseTo(2, 14);
    }
  });
  it('log(-1) = iπ (principal branch, from memory) and log(0) = -Infinity', () => {
    const u = table([real('x', [-1, 0])], 2);
    const r = evaluateExpression(u, 'log(x)');
    expect(r.re[0]).toBe(0);
    expect(r.im![0]).toBe(Math.PI);
    expect(r.re[1]).toBe(-Infinity);
  });
  it('round halves away from zero; -2^2 = -4; 2^3^2 = 512 (from memory)', () => {
    const u = table([real('x', [2.5, -2.5, 0.49999999999999994])], 3);
    expect(Array.from(evaluateExpression(u, 'round(x)').re)).toEqual([3, -3, 0]);
    expect(evaluateExpression(u, '-2^2').re[0]).toBe(-4);
    expect(evaluateExpression(u, '2^3^2').re[0]).toBe(512);
  });
});

describe('deriveColumn', () => {
  const t = table([real('xings', [3, 4, 5], 'integer'), real('amp', [0, 2.03, 2.83]), cplx('z', [1, 2, 3], [1, 0, -1])], 3);
  it('chooses integer, real or complex by construction and by value', () => {
    expect(deriveColumn(t, 'k', 'xings^2 - 2*xings').kind).toBe('integer');
    expect(deriveColumn(t, 'k', 'floor(amp)').kind).toBe('integer');
    expect(deriveColumn(t, 'k', '(xings <= 4) + sign(amp)').kind).toBe('integer');
    expect(deriveColumn(t, 'k', 'xings / 1').kind).toBe('real'); // division is never integer by construction
    expect(deriveColumn(t, 'k', 'amp * 2').kind).toBe('real');
    const c = deriveColumn(t, 'zz', 'z * conj(z) + i');
    expect(c.kind).toBe('complex');
    expect(c.name).toBe('zz');
    const a = deriveColumn(t, 'n2', 'z * conj(z)');
    expect(a.kind).toBe('real'); // |z|² has no imaginary part
    expect(a.kind !== 'label' && a.kind !== 'complex' && Array.from(a.values)).toEqual([2, 4, 10]);
  });
});

describe('compileExpression', () => {
  it('checks columns once and evaluates repeatedly with the same result', () => {
    const t = table([real('a', [1, 2, 3])], 3);
    const c = compileExpression(t, parseExpression('a^2 + 1'));
    expect(c.columns).toEqual(['a']);
    expect(Array.from(c.evaluate().re)).toEqual([2, 5, 10]);
    expect(Array.from(c.evaluate().re)).toEqual([2, 5, 10]);
  });
});
