import { describe, it, expect } from 'vitest';
import { GENERATE_CEILINGS } from '../../src/cli/knots.ts';
import { MAX_CROSSINGS, MAX_STRANDS, parseCode } from '../../src/knots/index.ts';
import { caught } from '../helpers/errors.ts';

// Hostile sizes (issue reproducers): each is refused with one line, a stable code and exit 2 before any
// large allocation (common practice: ceilings on every count and size, stated in the message).
describe('diagram size caps', () => {
  const rows: Array<[string, string, RegExp]> = [
    ['99999999999', 'braid', /needs 100000000000 strands \(generator 99999999999\); at most 64 strands/],
    ['{"strands": 1e9, "word": [1]}', 'braid', /needs 1000000000 strands; at most 64 strands/],
    ['1 3000', 'braid', /needs 3001 strands \(generator 3000\); at most 64/],
    ['65: 1 2', 'braid', /needs 65 strands; at most 64/],
    [Array(MAX_CROSSINGS + 1).fill('1').join(' '), 'braid', /has 2001 letters; at most 2000 crossings/],
    [JSON.stringify(Array.from({ length: MAX_CROSSINGS + 1 }, () => [1, 2, 3, 4])), 'pd', /PD code has 2001 crossings; at most 2000/],
  ];
  for (const [code, kind, msg] of rows)
    it(`${code.slice(0, 30)}… (${kind}) is refused: knots.tooLarge`, () => {
      const e = caught(() => parseCode(code, kind as 'braid' | 'pd'));
      expect(e.code).toBe('knots.tooLarge');
      expect(e.message).toMatch(msg);
    });

  it('the caps are the documented ones', () => {
    expect([MAX_STRANDS, MAX_CROSSINGS]).toEqual([64, 2000]);
    // a braid at the caps is read
    expect(parseCode(`64: ${Array(MAX_CROSSINGS).fill('63').join(' ')}`, 'braid').kind).toBe('braid');
  });
});

describe('count options of knots generate', () => {
  // the refusals themselves (exit 2, [knots.tooLarge], the ceiling named) are rows of tests/cli/hostile.test.ts
  it('every count option of knots generate has a ceiling in the table, and the table holds the documented values', () => {
    expect(GENERATE_CEILINGS).toEqual({
      '--count': { max: 1_000_000, unit: 'diagrams' },
      '--strands': { max: 64, unit: 'strands' },
      '--length': { max: 2000, unit: 'letters' },
      '--summands': { max: 100, unit: 'summands' },
      '--kinks': { max: 2000, unit: 'kinks' },
      '--twists': { max: 2000, unit: 'full twists in absolute value' },
      '--p': { max: 64, unit: 'strands' },
      '--q': { max: 2000, unit: 'in absolute value' },
    });
  });
});
