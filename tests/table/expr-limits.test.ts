/**
 * Limits of the expression language: length and depth are refused with typed errors (never a
 * stack overflow), messages never echo a huge expression, and random strings up to 100 KB never
 * crash the parser or the evaluator. Sizes are asserted by counts, never by wall-clock time.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { SurmiseError } from '../../src/errors.ts';
import {
  compileExpression,
  formatExpression,
  parseExpression,
  sameExpression,
} from '../../src/table/expr/index.ts';
import { MAX_EXPRESSION_DEPTH, MAX_EXPRESSION_LENGTH } from '../../src/table/expr/parse.ts';
import { caught } from '../helpers/errors.ts';
import type { Table } from '../../src/table/types.ts';

const n = 4;
const table: Table = {
  source: 'limits.csv',
  nRows: n,
  columns: [
    { name: 'a', kind: 'real', values: Float64Array.of(1, 2, 3, 4), missing: new Uint8Array(n) },
    { name: 'b', kind: 'real', values: Float64Array.of(-1, 0, 0.5, 2), missing: new Uint8Array(n) },
  ],
};

const chain = (terms: number, op: string): string => Array.from({ length: terms }, () => 'a').join(op);

describe('expression limits', () => {
  it('refuses a 3,000-term flat sum or product with expr.tooDeep naming the limit', () => {
    for (const op of ['+', '*', '-', '/']) {
      const e = caught(() => parseExpression(chain(3000, op)));
      expect(e.code).toBe('expr.tooDeep');
      expect(e.exitCode).toBe(2);
      expect(e.message.split('\n')[0]).toContain(`more than ${MAX_EXPRESSION_DEPTH} operations`);
    }
  });

  it('evaluates and formats the deepest accepted tree without a stack overflow', () => {
    // a sum of MAX_EXPRESSION_DEPTH terms is a tree MAX_EXPRESSION_DEPTH deep
    const src = chain(MAX_EXPRESSION_DEPTH, '+');
    const v = compileExpression(table, src).evaluate();
    expect(Array.from(v.re)).toEqual([1, 2, 3, 4].map((x) => x * MAX_EXPRESSION_DEPTH));
    expect(sameExpression(parseExpression(formatExpression(parseExpression(src))), parseExpression(src))).toBe(true);
    expect(caught(() => parseExpression(chain(MAX_EXPRESSION_DEPTH + 1, '+'))).code).toBe('expr.tooDeep');
  });

  it('counts depth across nesting: chains inside parentheses add up', () => {
    const inner = `(${chain(300, '+')})`;
    expect(caught(() => parseExpression(`${inner} * ${chain(250, '*')}`)).code).toBe('expr.tooDeep');
    expect(caught(() => parseExpression(`abs(${chain(300, '+')}) + ${chain(250, '+')}`)).code).toBe('expr.tooDeep');
  });

  it('refuses text longer than the limit before reading it, and does not echo it', () => {
    const big = 'a+'.repeat(60_000) + 'a';
    const e = caught(() => parseExpression(big));
    expect(e.code).toBe('expr.tooLong');
    expect(e.message).toContain(MAX_EXPRESSION_LENGTH.toLocaleString('en-US'));
    expect(e.message.length).toBeLessThan(300);
  });

  it('shows a long expression cut to a window around the caret', () => {
    const src = 'a + '.repeat(400) + '* b';
    const e = caught(() => parseExpression(src));
    expect(e.code).toBe('expr.parse');
    const lines = e.message.split('\n');
    expect(lines).toHaveLength(3);
    expect(lines[1]!.length).toBeLessThanOrEqual(2 + 120 + 2);
    // the caret still points at the second operator
    const caretAt = lines[2]!.indexOf('^');
    expect(lines[1]![caretAt]).toBe('*');
  });

  it('shows control characters as spaces in the caret block', () => {
    const e = caught(() => parseExpression('a +\u0007 * b'));
    expect(e.message).not.toMatch(/[\u0000-\u0008\u000b-\u001f]/);
  });

  it('random strings up to 100 KB never crash the parser or the evaluator (property)', () => {
    // fast-check property (common practice for parsers): only typed expr.* errors escape.
    const pieces = fc.constantFrom('a', 'b', '(', ')', '+', '-', '*', '/', '^', ',', ' ', '1', '2.5e3', 'abs(', 'min(', 'sqrt(', 'pi', 'e', 'i', '`', '``', '<=', 'zz', '\u0000', '\u00e9');
    const check = (s: string): void => {
      try {
        compileExpression(table, s).evaluate();
      } catch (err) {
        expect(err).toBeInstanceOf(SurmiseError);
        const se = err as SurmiseError;
        expect(se.code.startsWith('expr.')).toBe(true);
        expect(se.exitCode).toBe(2);
        expect(se.message.length).toBeLessThan(1000);
      }
    };
    const long = fc.array(pieces, { minLength: 0, maxLength: 40_000 }).map((a) => a.join(''));
    fc.assert(fc.property(long, check), { numRuns: 20 });
    fc.assert(fc.property(fc.string({ unit: 'binary', minLength: 10_000, maxLength: 100_000 }), check), { numRuns: 8 });
    // nesting and chains just around the limits
    const nested = fc.tuple(fc.integer({ min: 1, max: 2000 }), fc.constantFrom('(', '-', 'abs(', '+', 'a^')).map(([k, p]) =>
      p === '(' || p === 'abs(' ? p.repeat(k) + 'a' + ')'.repeat(k) : p === 'a^' ? 'a^'.repeat(k) + 'a' : p.repeat(k) + 'a');
    fc.assert(fc.property(nested, check), { numRuns: 60 });
    const chains = fc.tuple(fc.integer({ min: 1, max: 10_000 }), fc.constantFrom('+', '*', '-', '/', '<')).map(([k, op]) => chain(k, op));
    fc.assert(fc.property(chains, check), { numRuns: 60 });
  });
});
