import { describe, it, expect } from 'vitest';
import { checkInteger, parseInteger } from '../../src/util/integer.ts';
import { caught } from '../helpers/errors.ts';

describe('the one integer reader and checker', () => {
  it('parseInteger reads text strictly (ECMA-262 Number, unlike parseInt which takes "12abc" as 12)', () => {
    expect(parseInt('12abc', 10)).toBe(12);
    expect(caught(() => parseInteger('--seed', '12abc'))).toMatchObject({ code: 'option.badInteger', message: "expected --seed to be an integer, got '12abc'" });
    for (const raw of ['', ' ', '1.5', 'NaN', 'Infinity']) expect(caught(() => parseInteger('--n', raw)).code, raw).toBe('option.badInteger');
    expect(parseInteger('--n', ' -7 ')).toBe(-7);
    expect(parseInteger('--n', '1e3')).toBe(1000);
  });
  it('checks the range: below it in words, above the ceiling option.tooLarge with the value grouped', () => {
    expect(caught(() => parseInteger('--seeds', '0', { min: 1, max: 100 })).message).toBe('expected --seeds to be a positive integer, got 0');
    expect(caught(() => parseInteger('--workers', '-1', { min: 0, max: 64 })).message).toBe('expected --workers to be a non-negative integer, got -1');
    expect(caught(() => parseInteger('--folds', '1', { min: 2, max: 20 })).message).toBe('expected --folds to be an integer ≥ 2, got 1');
    const big = caught(() => parseInteger('--top', '2000000', { min: 1, max: 1000 }));
    expect(big.code).toBe('option.tooLarge');
    expect(big.message).toBe('expected --top to be at most 1,000 (its ceiling), got 2000000');
    expect(parseInteger('--top', '1000', { min: 1, max: 1000 })).toBe(1000);
  });
  it('checkInteger checks a number the library was given, with the stage\'s code below the range', () => {
    expect(checkInteger('bins', 10, { min: 1, max: 1000 }, 'bound.badOption')).toBe(10);
    expect(caught(() => checkInteger('bins', 0, { min: 1, max: 1000 }, 'bound.badOption'))).toMatchObject({ code: 'bound.badOption', message: 'expected bins to be an integer ≥ 1, got 0' });
    expect(caught(() => checkInteger('bins', 1001, { min: 1, max: 1000 }, 'bound.badOption')).code).toBe('option.tooLarge');
  });
});
