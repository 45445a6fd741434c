/** Strict cell parsing: numbers, missing markers, non-finite words and one-cell complex numbers. */
import { describe, it, expect } from 'vitest';
import { formatComplex, formatNumber, isMissingText, parseComplexText, parseNumberText } from '../../src/table/cell.ts';

describe('parseNumberText', () => {
  it('reads decimal and scientific notation as ECMAScript Number() does (ECMA-262 StringNumericLiteral, from memory)', () => {
    expect(parseNumberText('1.5e3')).toBe(1500);
    expect(parseNumberText('-0.25')).toBe(-0.25);
    expect(parseNumberText('.5')).toBe(0.5);
    expect(parseNumberText('1.')).toBe(1);
    expect(parseNumberText('+7')).toBe(7);
    expect(Object.is(parseNumberText('-0'), -0)).toBe(true);
    expect(parseNumberText('2.2250738585072014e-308')).toBe(2.2250738585072014e-308);
  });

  it('rejects what parseFloat/Number would leniently accept (style guide: 12abc is text)', () => {
    for (const s of ['12abc', '0x10', '0b1', '0o7', '1_000', '1 2', '--1', '1e', 'e5', ''])
      expect(parseNumberText(s), s).toBeUndefined();
  });

  it('reads nan, inf, -inf, +inf, infinity case-insensitively (the task statement)', () => {
    expect(parseNumberText('NaN')).toBeNaN();
    expect(parseNumberText('INF')).toBe(Infinity);
    expect(parseNumberText('-inf')).toBe(-Infinity);
    expect(parseNumberText('+Inf')).toBe(Infinity);
    expect(parseNumberText('Infinity')).toBe(Infinity);
    expect(parseNumberText('-infinity')).toBe(-Infinity);
  });

  it('missing markers: empty, NA, null (the task statement)', () => {
    for (const s of ['', 'NA', 'na', 'null', 'NULL', ' NA ']) expect(isMissingText(s), s).toBe(true);
    for (const s of ['nan', 'N/A?', '0', 'none']) expect(isMissingText(s), s).toBe(false);
  });
});

describe('parseComplexText', () => {
  it('reads the written forms a+bj, a-bi, (a,b), bj, -i and plain reals (the task statement)', () => {
    expect(parseComplexText('1.5+2.25j')).toEqual({ re: 1.5, im: 2.25 });
    expect(parseComplexText('1.5-2.25i')).toEqual({ re: 1.5, im: -2.25 });
    expect(parseComplexText('(1.5,2.25)')).toEqual({ re: 1.5, im: 2.25 });
    expect(parseComplexText('2.25j')).toEqual({ re: 0, im: 2.25 });
    expect(parseComplexText('-i')).toEqual({ re: 0, im: -1 });
    expect(parseComplexText('3')).toEqual({ re: 3, im: 0 });
    // Python's repr of complex(1, 2) is '(1+2j)' (from memory)
    expect(parseComplexText('(1+2j)')).toEqual({ re: 1, im: 2 });
    expect(parseComplexText('1e-3-2E+2J')).toEqual({ re: 0.001, im: -200 });
  });

  it('rejects malformed complex numbers', () => {
    for (const s of ['1.5++2j', 'j2', '1+2', '(1,2', '1+2j)', 'abc', '1,2', '2jj']) expect(parseComplexText(s), s).toBeUndefined();
  });

  it('formatComplex output reads back exactly, including -0 and non-finite parts', () => {
    const cases: Array<[number, number]> = [
      [1.5, -2],
      [-0, -0],
      [NaN, Infinity],
      [-Infinity, NaN],
      [0.1, 1e-300],
    ];
    for (const [re, im] of cases) {
      const z = parseComplexText(formatComplex(re, im))!;
      expect(Object.is(z.re, re) && Object.is(z.im, im), formatComplex(re, im)).toBe(true);
    }
    expect(formatComplex(1.5, -2)).toBe('1.5-2j');
  });

  it('formatNumber is the shortest round-trip form (ECMA-262 Number::toString, from memory: 0.1+0.2 prints 0.30000000000000004)', () => {
    expect(formatNumber(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(formatNumber(-0)).toBe('-0');
    expect(formatNumber(NaN)).toBe('nan');
    expect(formatNumber(-Infinity)).toBe('-inf');
  });
});
