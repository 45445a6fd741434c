import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { SurmiseError } from '../../src/errors.ts';
import {
  type Expr,
  FUNCTION_NAMES,
  FUNCTIONS,
  expressionColumns,
  formatExpression,
  parseDerive,
  parseExpression,
  sameExpression,
} from '../../src/table/expr/index.ts';
import { codeOf } from '../helpers/errors.ts';

function messageOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    return (e as Error).message;
  }
  return 'no error';
}

describe('parseExpression: precedence and associativity', () => {
  // Conventions of mathematical notation (from memory): ^ binds tighter than unary minus and is
  // right-associative; * and / bind tighter than + and -; both pairs are left-associative.
  it('reads -x^2 as -(x^2) and 2^3^2 as 2^(3^2)', () => {
    expect(sameExpression(parseExpression('-x^2'), parseExpression('-(x^2)'))).toBe(true);
    expect(sameExpression(parseExpression('-x^2'), parseExpression('(-x)^2'))).toBe(false);
    expect(sameExpression(parseExpression('2^3^2'), parseExpression('2^(3^2)'))).toBe(true);
    expect(sameExpression(parseExpression('2^3^2'), parseExpression('(2^3)^2'))).toBe(false);
  });
  it('reads a - b - c as (a - b) - c and a / b / c as (a / b) / c', () => {
    expect(sameExpression(parseExpression('a - b - c'), parseExpression('(a - b) - c'))).toBe(true);
    expect(sameExpression(parseExpression('a / b / c'), parseExpression('(a / b) / c'))).toBe(true);
    expect(sameExpression(parseExpression('a / b / c'), parseExpression('a / (b / c)'))).toBe(false);
  });
  it('gives comparisons the lowest precedence', () => {
    const e = parseExpression('xings + 1 <= 2 * k');
    expect(e.type).toBe('binary');
    expect(e.type === 'binary' && e.op).toBe('<=');
  });
  it('allows a signed exponent: 2^-1', () => {
    const e = parseExpression('2^-1');
    expect(e.type === 'binary' && e.op === '^' && e.right.type === 'unary').toBe(true);
  });
  it('reads numbers in decimal and scientific notation', () => {
    for (const [s, v] of [
      ['12', 12],
      ['1.5', 1.5],
      ['.25', 0.25],
      ['3.', 3],
      ['1e-3', 0.001],
      ['6.02E+23', 6.02e23],
    ] as const) {
      const e = parseExpression(s);
      expect(e.type === 'number' && e.value).toBe(v);
    }
  });
  it('reads names with dots, backquoted names and the constants pi, e, i', () => {
    expect(expressionColumns(parseExpression('czb.re + `my col` * `a``b` + pi + e + i'))).toEqual(['czb.re', 'my col', 'a`b']);
    expect(parseExpression('`pi`')).toMatchObject({ type: 'column', name: 'pi' });
    expect(parseExpression('pi')).toMatchObject({ type: 'constant', name: 'pi' });
  });
  it('lists the columns used, once each, in order of appearance', () => {
    expect(expressionColumns(parseExpression('re(p / q) + a * p'))).toEqual(['p', 'q', 'a']);
  });
});

describe('parseExpression: errors', () => {
  it('shows the expression with a caret under the offending place (the documented example)', () => {
    expect(messageOf(() => parseExpression('amp * * gap'))).toBe(
      "cannot read expression at position 7: expected a value after '*'\n  amp * * gap\n        ^",
    );
    expect(codeOf(() => parseExpression('amp * * gap'))).toBe('expr.parse');
  });
  it('names the problem for each kind of malformed input', () => {
    const cases: Array<[string, string, RegExp]> = [
      ['', 'expr.parse', /expression is empty/],
      ['amp +', 'expr.parse', /position 6: expected a value after '\+' \(the expression ends there\)/],
      ['(amp', 'expr.parse', /expected '\)' to close the '\(' at position 1/],
      ['amp)', 'expr.parse', /position 4: unmatched '\)'/],
      ['2x', 'expr.parse', /write 2 \* x for a product/],
      ['x = 3', 'expr.parse', /write '==' to compare/],
      ['a < b < c', 'expr.parse', /cannot be chained/],
      ['`abc', 'expr.parse', /backquoted name is not closed/],
      ['1e+', 'expr.parse', /no exponent digits/],
      ['1e999', 'expr.parse', /too large/],
      ['sine(x)', 'expr.unknownFunction', /unknown function 'sine' at position 1 \(did you mean 'sin'\?\)/],
      ['abs(x, y)', 'expr.arity', /abs takes 1 argument, got 2/],
      ['atan2(y)', 'expr.arity', /atan2 takes 2 arguments, got 1/],
      ['min(x)', 'expr.arity', /min takes at least 2 arguments, got 1/],
      ['f(x', 'expr.unknownFunction', /unknown function 'f'/],
      ['abs(x', 'expr.parse', /expected ',' or '\)' in the call to abs\(/],
    ];
    for (const [src, code, re] of cases) {
      expect(codeOf(() => parseExpression(src)), src).toBe(code);
      expect(messageOf(() => parseExpression(src)), src).toMatch(re);
    }
  });
  it('keeps the first line of every message readable on its own', () => {
    const first = messageOf(() => parseExpression('amp * (gap')).split('\n')[0]!;
    expect(first).toMatch(/^cannot read expression at position \d+: /);
  });
  it('rejects absurd nesting with a parse error, not a stack overflow', () => {
    expect(codeOf(() => parseExpression('('.repeat(5000) + 'x' + ')'.repeat(5000)))).toBe('expr.parse');
    expect(codeOf(() => parseExpression('-'.repeat(5000) + 'x'))).toBe('expr.parse');
  });
  it('on any string returns an Expr or throws a SurmiseError whose code starts with expr. (property)', () => {
    // fast-check property (common practice for parsers): no other exception escapes.
    const alphabet = fc.constantFrom(...'x y1 _ . ( ) , + - * / ^ < > = ! ` e i pi 0 1 9 . E abs sqrt min re \t'.split(' '), ' ', '<=', '==', '!=');
    const check = (s: string): void => {
      try {
        const e = parseExpression(s);
        expect(typeof e.type).toBe('string');
      } catch (err) {
        expect(err).toBeInstanceOf(SurmiseError);
        expect((err as SurmiseError).code.startsWith('expr.')).toBe(true);
      }
    };
    fc.assert(fc.property(fc.array(alphabet, { maxLength: 30 }).map((a) => a.join('')), check), { numRuns: 1500 });
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 40 }), check), { numRuns: 2000 });
  });
});

describe('formatExpression', () => {
  it('writes canonical text with only the needed parentheses', () => {
    expect(formatExpression(parseExpression('(a+b)*-(c^2)'))).toBe('(a + b) * -c^2');
    expect(formatExpression(parseExpression('(-x)^2'))).toBe('(-x)^2');
    expect(formatExpression(parseExpression('a-(b-c)'))).toBe('a - (b - c)');
    expect(formatExpression(parseExpression('(2^3)^2'))).toBe('(2^3)^2');
    expect(formatExpression(parseExpression('`my col`+`pi`'))).toBe('`my col` + `pi`');
    expect(formatExpression(parseExpression('re( czb/cza )<=0.5'))).toBe('re(czb / cza) <= 0.5');
  });

  // Random trees: parse(format(e)) must be structurally e (a round-trip property, common practice).
  const leaf: fc.Arbitrary<Expr> = fc.oneof(
    fc.double({ min: 0, max: 1e6, noNaN: true }).map((value) => ({ type: 'number', value, pos: 0, end: 0 }) as Expr),
    fc.constantFrom('x', 'czb.re', 'my col', 'pi', 'a`b', '_k2').map((name) => ({ type: 'column', name, pos: 0, end: 0 }) as Expr),
    fc.constantFrom('pi', 'e', 'i').map((name) => ({ type: 'constant', name, pos: 0, end: 0 }) as Expr),
  );
  const tree = fc.letrec<{ e: Expr }>((tie) => ({
    e: fc.oneof(
      { depthSize: 'small', withCrossShrink: true },
      leaf,
      fc.record({ op: fc.constantFrom('-', '+'), arg: tie('e') }).map((r) => ({ type: 'unary', ...r, pos: 0, end: 0 }) as Expr),
      fc
        .record({
          op: fc.constantFrom('+', '-', '*', '/', '^', '<', '<=', '>', '>=', '==', '!='),
          left: tie('e'),
          right: tie('e'),
        })
        .map((r) => ({ type: 'binary', ...r, pos: 0, end: 0 }) as Expr),
      fc
        .record({ name: fc.constantFrom(...FUNCTION_NAMES), args: fc.array(tie('e'), { minLength: 1, maxLength: 3 }) })
        .filter((r) => r.args.length >= FUNCTIONS.get(r.name)!.minArgs && r.args.length <= FUNCTIONS.get(r.name)!.maxArgs)
        .map((r) => ({ type: 'call', ...r, pos: 0, end: 0 }) as Expr),
    ),
  })).e;
  it('round-trips: parseExpression(formatExpression(e)) ≡ e on random trees (property)', () => {
    fc.assert(
      fc.property(tree, (e) => {
        const text = formatExpression(e);
        expect(sameExpression(parseExpression(text), e), text).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
  it('is idempotent on text: format(parse(format(parse(s)))) = format(parse(s))', () => {
    for (const s of ['-x^-y^2', '((a))', 'a*(b/c)', 'min(a,b,-c)<=max(d,e)', '- - x', '+x']) {
      const once = formatExpression(parseExpression(s));
      expect(formatExpression(parseExpression(once))).toBe(once);
    }
  });
});

describe('parseDerive', () => {
  it('splits NAME=EXPRESSION at the first =', () => {
    expect(parseDerive('ratio=re(p/q)')).toEqual({ name: 'ratio', source: 're(p/q)' });
    expect(parseDerive(' small = xings <= 12 ')).toEqual({ name: 'small', source: 'xings <= 12' });
    expect(parseDerive('`half det`=determinant / 2')).toEqual({ name: 'half det', source: 'determinant / 2' });
  });
  it('rejects malformed specifications with expr.badDerive', () => {
    for (const s of ['slope', '=amp', 'slope=', 'x<=3', 'a==b', '2x=amp', '`open=amp']) {
      expect(codeOf(() => parseDerive(s)), s).toBe('expr.badDerive');
    }
    expect(messageOf(() => parseDerive('slope'))).toMatch(/expected NAME=EXPRESSION, e\.g\. twice_g=2\*genus_bound/);
    expect(codeOf(() => parseDerive('slope=amp*'))).toBe('expr.parse');
  });
});
