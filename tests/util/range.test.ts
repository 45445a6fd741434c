import { describe, it, expect } from 'vitest';
import { parseIntegerRange } from '../../src/util/range.ts';
import { SurmiseError } from '../../src/errors.ts';

const fail = (text: string, where?: string): SurmiseError => {
  try {
    parseIntegerRange(text, 'relate.badPowers', where);
  } catch (e) {
    return e as SurmiseError;
  }
  throw new Error(`accepted ${text}`);
};

describe('parseIntegerRange: lo..hi with integers', () => {
  it('reads both ends, negative ends and spaces around them', () => {
    expect(parseIntegerRange('-3..3', 'relate.badPowers')).toEqual([-3, 3]);
    expect(parseIntegerRange(' 2 .. 5 ', 'relate.badPowers')).toEqual([2, 5]);
    expect(parseIntegerRange('-4..-4', 'relate.badPowers')).toEqual([-4, -4]);
  });
  it('refuses other shapes, reversed ends and ends beyond exact integers, with the caller\'s code and place', () => {
    for (const t of ['1-3', '1..', '..2', '1.5..2', '1...2', 'a..b', '']) expect(fail(t).code, t).toBe('relate.badPowers');
    expect(fail('3..-3', '--powers 3..-3').message).toBe('--powers 3..-3: the lower end 3 exceeds the upper end -3');
    expect(fail('1-3').message).toBe("expected a range of integers lo..hi, e.g. -3..3, got '1-3'");
    expect(fail('1..99999999999999999').message).toMatch(/too large to be exact integers/); // 2^53 ≈ 9.007e15, IEEE 754 binary64
  });
});
