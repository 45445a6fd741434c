import { describe, it, expect } from 'vitest';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { GENERATE_CEILINGS } from '../../src/cli/knots.ts';
import { MAX_CROSSINGS, MAX_STRANDS, parseCode } from '../../src/knots/index.ts';
import { caught } from '../helpers/errors.ts';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

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

describe('count options of knots generate: ceilings named in the refusal, exit 2', () => {
  const dir = mkdtempSync(join(tmpdir(), 'surmise-knots-limits-'));
  writeFileSync(join(dir, 'big.txt'), 'a\t99999999999\n');
  const run = async (args: string[]): Promise<{ code: number; err: string; out: string }> => {
    const io = memoryIO(dir);
    const code = await runCli(args, io);
    return { code, err: io.err, out: io.out };
  };
  const rows: Array<[string[], RegExp]> = [
    [['knots', 'generate', 'braid', '--strands', '3', '--length', '10', '--count', '1e12'], /--count 1000000000000: at most 1000000 diagrams \(the ceiling of --count\)/],
    [['knots', 'generate', 'braid', '--strands', '100', '--length', '10'], /--strands 100: at most 64 strands/],
    [['knots', 'generate', 'braid', '--strands', '3', '--length', '5000'], /--length 5000: at most 2000 letters/],
    [['knots', 'generate', 'pd', '--strands', '3', '--length', '10', '--count', '2000000'], /--count 2000000: at most 1000000/],
    [['knots', 'generate', 'pd', '--strands', '3', '--length', '10', '--summands', '1..500'], /--summands 500: at most 100 summands/],
    [['knots', 'generate', 'pd', '--strands', '3', '--length', '10', '--kinks', '0..999999'], /--kinks 999999: at most 2000 kinks/],
    [['knots', 'generate', 'pd', '--strands', '3', '--length', '1000', '--summands', '1..3'], /would have up to 3003 crossings; at most 2000/],
    [['knots', 'generate', 'twist', '--braid', '1 2', '--on', '1..3', '--twists', '0..99999999'], /--twists 99999999: at most 2000 full twists in absolute value/],
    [['knots', 'generate', 'twist', '--braid', '1 2', '--on', '1..3', '--twists', '-400..0'], /would have up to 2402 crossings/],
    [['knots', 'generate', 'torus', '--p', '2..1000', '--q', '3'], /--p 1000: at most 64 strands/],
    [['knots', 'generate', 'torus', '--p', '2..3', '--q', '1..99999'], /--q 99999: at most 2000 in absolute value/],
    [['knots', 'generate', 'torus', '--p', '60..64', '--q', '1..100'], /would have up to 6300 crossings/],
    [['knots', 'big.txt'], /big\.txt:1:3: a: the braid needs 100000000000 strands/],
  ];
  for (const [args, msg] of rows)
    it(args.slice(1).join(' '), async () => {
      const r = await run(args);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(msg);
      expect(r.err).toMatch(/\[knots\.tooLarge\]\n$/);
      expect(r.err.trim().split('\n')).toHaveLength(1);
      expect(r.out).toBe('');
    });

  it('every count option of knots generate has a ceiling in the table', () => {
    expect(Object.keys(GENERATE_CEILINGS).sort()).toEqual(['--count', '--kinks', '--length', '--p', '--q', '--strands', '--summands', '--twists']);
    rmSync(dir, { recursive: true, force: true });
  });
});
