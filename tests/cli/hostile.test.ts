/**
 * Hostile and extreme inputs, one row each: the command, its input files, the exit code and the
 * error code expected. Every row must end in one clear message (exit 2, a `[code]`, no stack
 * trace) or succeed as stated. Add a row for every new refusal; rows are run in the test process
 * (`runCli` with an in-memory IO), so ceilings are asserted by the refusal, never by timing.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { tempDir, put } from '../table/helpers.ts';

export interface HostileRow {
  /** What the row tries, in a few words. */
  name: string;
  /** Arguments after `surmise`. */
  args: string[];
  /** Files written in the row's folder first (name → content). */
  files?: Record<string, string>;
  exit: 0 | 2;
  /** The error code printed as `[code]` (rows with exit 0 leave it out). */
  code?: string;
  /** Text the message must contain (optional). */
  says?: string;
}

const XY = 'x,y\n1,2\n2,4\n3,6.5\n4,8\n5,10.1\n6,12\n';
/** An invented table of `cols` columns and `rows` rows. */
const wide = (cols: number, rows: number): string => {
  const lines = [Array.from({ length: cols }, (_, j) => `c${j}`).join(',')];
  for (let i = 0; i < rows; i++) lines.push(Array.from({ length: cols }, (_, j) => ((i * 7919 + j * 104729) % 1000) / 10).join(','));
  return lines.join('\n') + '\n';
};
const sum = (n: number, op: string) => Array.from({ length: n }, () => 'x').join(op);
const aliasBomb =
  'a: &a ["x","x","x","x","x","x","x","x","x"]\n' +
  'b: &b [*a,*a,*a,*a,*a,*a,*a,*a,*a]\nc: &c [*b,*b,*b,*b,*b,*b,*b,*b,*b]\nd: &d [*c,*c,*c,*c,*c,*c,*c,*c,*c]\n' +
  'e: &e [*d,*d,*d,*d,*d,*d,*d,*d,*d]\nf: &f [*e,*e,*e,*e,*e,*e,*e,*e,*e]\ng: [*f,*f,*f,*f,*f,*f,*f,*f,*f]\n' +
  'table: xy.csv\ntarget: y\n';

export const ROWS: HostileRow[] = [
  // ---- existing refusals (kept fixed)
  { name: 'unknown command', args: ['frobnicate'], exit: 2 },
  { name: 'ragged row', args: ['inspect', 'ragged.csv'], files: { 'ragged.csv': 'a,b\n1,2\n3\n' }, exit: 2, code: 'table.raggedRow', says: 'ragged.csv:3' },
  { name: 'missing table file', args: ['inspect', 'nope.csv'], exit: 2, code: 'table.unreadable', says: 'no such file' },
  { name: 'table path is a folder', args: ['inspect', 'dir.csv'], exit: 2, code: 'table.unreadable', says: 'it is a folder' },
  { name: 'unknown column in a term', args: ['fit', 'xy.csv', '--target', 'y', '--terms', 'z'], files: { 'xy.csv': XY }, exit: 2, code: 'expr.unknownColumn', says: "did you mean 'x'" },
  { name: 'unknown rank target', args: ['rank', 'xy.csv', '--target', 'q'], files: { 'xy.csv': XY }, exit: 2, code: 'dataset.unknownColumn' },
  { name: 'bad split spec', args: ['fit', 'xy.csv', '--target', 'y', '--terms', 'x', '--split', 'bogus'], files: { 'xy.csv': XY }, exit: 2, code: 'split.badSpec' },
  { name: 'rhs not positive', args: ['bound', 'xy.csv', '--lhs', 'y', '--rhs', 'x-3'], files: { 'xy.csv': XY }, exit: 2, code: 'bound.badRhs' },
  { name: 'integer option with trailing text', args: ['demo-data', '--seed', '12abc'], exit: 2, code: 'option.badInteger' },
  { name: 'too many search terms', args: ['search', 'xy.csv', '--target', 'y', '--from', 'x', '--max-terms', '9'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge', says: 'at most 6' },

  // ---- expressions: length and depth
  { name: '3,000-term flat sum', args: ['fit', 'xy.csv', '--target', 'y', '--terms', sum(3000, '+')], files: { 'xy.csv': XY }, exit: 2, code: 'expr.tooDeep', says: 'more than 500' },
  { name: '3,000-term flat product', args: ['bound', 'xy.csv', '--lhs', sum(3000, '*'), '--rhs', 'x'], files: { 'xy.csv': XY }, exit: 2, code: 'expr.tooDeep' },
  { name: '3,000-term sum as a derived column', args: ['inspect', 'xy.csv', '--derive', `s=${sum(3000, '+')}`], files: { 'xy.csv': XY }, exit: 2, code: 'expr.tooDeep' },
  { name: '100 KB expression', args: ['fit', 'xy.csv', '--target', 'y', '--terms', 'x+'.repeat(50_000) + 'x'], files: { 'xy.csv': XY }, exit: 2, code: 'expr.tooLong' },

  // ---- configuration files
  { name: 'YAML alias bomb', args: ['run', 'bomb.yaml'], files: { 'bomb.yaml': aliasBomb, 'xy.csv': XY }, exit: 2, code: 'config.yaml', says: 'bomb.yaml' },
  { name: 'misspelt required key', args: ['run', 'typo.yaml'], files: { 'typo.yaml': 'table: xy.csv\ntaget: y\n', 'xy.csv': XY }, exit: 2, code: 'config.missingKey', says: "did you mean 'target'" },
  { name: 'missing configuration', args: ['run', 'nope.yaml'], exit: 2, code: 'config.unreadable', says: 'no such file' },
  { name: 'configuration path is a folder', args: ['run', 'dir.csv'], exit: 2, code: 'config.unreadable', says: 'it is a folder' },
  { name: 'config count above its ceiling', args: ['run', 'seeds.yaml'], files: { 'seeds.yaml': 'table: xy.csv\ntarget: y\nattribution:\n  seeds: 1000000000\n', 'xy.csv': XY }, exit: 2, code: 'option.tooLarge', says: 'attribution.seeds' },
  { name: 'config search.from names an absent column', args: ['run', 'from.yaml'], files: { 'from.yaml': 'table: xy.csv\ntarget: y\nsearch:\n  target: y\n  from: [x, "my col"]\n', 'xy.csv': XY }, exit: 2, code: 'config.unknownColumn', says: 'search.from[1]' },

  // ---- count options: every one has a ceiling named in the refusal
  { name: 'rank --seeds 1e9', args: ['rank', 'xy.csv', '--target', 'y', '--seeds', '1e9'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge', says: 'at most 100' },
  { name: 'rank --hidden 100000000', args: ['rank', 'xy.csv', '--target', 'y', '--hidden', '100000000'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge', says: 'at most 4,096' },
  { name: 'rank --hidden with 40 layers', args: ['rank', 'xy.csv', '--target', 'y', '--hidden', Array(40).fill('2').join(',')], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge', says: 'at most 16' },
  { name: 'rank --epochs 1e12', args: ['rank', 'xy.csv', '--target', 'y', '--epochs', '1e12'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },
  { name: 'rank --folds 1e6', args: ['rank', 'xy.csv', '--target', 'y', '--folds', '1000000'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },
  { name: 'rank --drop-top 1e6', args: ['rank', 'xy.csv', '--target', 'y', '--drop-top', '1000000'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },
  { name: 'rank --workers 1e6', args: ['rank', 'xy.csv', '--target', 'y', '--workers', '1000000'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },
  { name: 'fit --folds 1e6', args: ['fit', 'xy.csv', '--target', 'y', '--terms', 'x', '--folds', '1000000'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge', says: 'at most 255' },
  { name: 'search --top 1e12', args: ['search', 'xy.csv', '--target', 'y', '--from', 'x', '--top', '1e12'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },
  { name: 'bound --bins 1e9', args: ['bound', 'xy.csv', '--lhs', 'y', '--rhs', 'x', '--bins', '1e9'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },
  { name: 'bound --top 1e9', args: ['bound', 'xy.csv', '--lhs', 'y', '--rhs', 'x', '--top', '1e9'], files: { 'xy.csv': XY }, exit: 2, code: 'option.tooLarge' },

  // ---- knots: diagram sizes (MAX_STRANDS 64, MAX_CROSSINGS 2,000) and every knots generate count option
  { name: 'braid generator 99999999999', args: ['knots', 'k.txt'], files: { 'k.txt': 'a\t99999999999\n' }, exit: 2, code: 'knots.tooLarge', says: 'k.txt:1:3: a: the braid needs 100000000000 strands' },
  { name: 'braid with 1e9 strands', args: ['knots', 'k.txt'], files: { 'k.txt': 'b\t{"strands": 1e9, "word": [1]}\n' }, exit: 2, code: 'knots.tooLarge', says: 'at most 64 strands' },
  { name: 'braid generator 3000', args: ['knots', 'k.txt'], files: { 'k.txt': 'c\t1 3000\n' }, exit: 2, code: 'knots.tooLarge', says: '(generator 3000)' },
  { name: 'braid of 2,001 letters', args: ['knots', 'k.txt'], files: { 'k.txt': `d\t${Array(2001).fill('1').join(' ')}\n` }, exit: 2, code: 'knots.tooLarge', says: 'at most 2000 crossings' },
  { name: 'knots generate braid --count 1e12', args: ['knots', 'generate', 'braid', '--strands', '3', '--length', '10', '--count', '1e12'], exit: 2, code: 'knots.tooLarge', says: 'the ceiling of --count' },
  { name: 'knots generate braid --strands 100', args: ['knots', 'generate', 'braid', '--strands', '100', '--length', '10'], exit: 2, code: 'knots.tooLarge', says: 'at most 64 strands' },
  { name: 'knots generate braid --length 5000', args: ['knots', 'generate', 'braid', '--strands', '3', '--length', '5000'], exit: 2, code: 'knots.tooLarge', says: 'at most 2000 letters' },
  { name: 'knots generate pd --count 2e6', args: ['knots', 'generate', 'pd', '--strands', '3', '--length', '10', '--count', '2000000'], exit: 2, code: 'knots.tooLarge', says: 'at most 1000000' },
  { name: 'knots generate pd --summands 1..500', args: ['knots', 'generate', 'pd', '--strands', '3', '--length', '10', '--summands', '1..500'], exit: 2, code: 'knots.tooLarge', says: 'at most 100 summands' },
  { name: 'knots generate pd --kinks 0..999999', args: ['knots', 'generate', 'pd', '--strands', '3', '--length', '10', '--kinks', '0..999999'], exit: 2, code: 'knots.tooLarge', says: 'at most 2000 kinks' },
  { name: 'knots generate pd past 2,000 crossings', args: ['knots', 'generate', 'pd', '--strands', '3', '--length', '1000', '--summands', '1..3'], exit: 2, code: 'knots.tooLarge', says: 'up to 3003 crossings' },
  { name: 'knots generate twist --twists 0..99999999', args: ['knots', 'generate', 'twist', '--braid', '1 2', '--on', '1..3', '--twists', '0..99999999'], exit: 2, code: 'knots.tooLarge', says: 'the ceiling of --twists' },
  { name: 'knots generate twist past 2,000 crossings', args: ['knots', 'generate', 'twist', '--braid', '1 2', '--on', '1..3', '--twists', '-400..0'], exit: 2, code: 'knots.tooLarge', says: 'up to 2402 crossings' },
  { name: 'knots generate torus --p 2..1000', args: ['knots', 'generate', 'torus', '--p', '2..1000', '--q', '3'], exit: 2, code: 'knots.tooLarge', says: 'the ceiling of --p' },
  { name: 'knots generate torus --q 1..99999', args: ['knots', 'generate', 'torus', '--p', '2..3', '--q', '1..99999'], exit: 2, code: 'knots.tooLarge', says: 'the ceiling of --q' },
  { name: 'knots generate torus past 2,000 crossings', args: ['knots', 'generate', 'torus', '--p', '60..64', '--q', '1..100'], exit: 2, code: 'knots.tooLarge', says: 'up to 6300 crossings' },

  // ---- output folders and files
  { name: 'run --force into a folder of the user\'s files', args: ['run', 'c.yaml', '--force'], files: { 'c.yaml': 'table: xy.csv\ntarget: y\noutput: out\n', 'xy.csv': XY, 'out/notes.txt': 'mine' }, exit: 2, code: 'output.notRunFolder', says: 'notes.txt' },
  { name: 'run --force into a folder with a forged format string', args: ['run', 'c.yaml', '--force'], files: { 'c.yaml': 'table: xy.csv\ntarget: y\noutput: out\n', 'xy.csv': XY, 'out/results.json': '{"format":"surmise-run"}' }, exit: 2, code: 'output.notRunFolder' },
  { name: 'run without --force into an existing folder', args: ['run', 'c.yaml'], files: { 'c.yaml': 'table: xy.csv\ntarget: y\noutput: out\n', 'xy.csv': XY, 'out/notes.txt': 'mine' }, exit: 2, code: 'output.exists' },
  { name: 'knots generate --out over an existing file', args: ['knots', 'generate', 'torus', '--p', '2..3', '--q', '3..5', '--out', 'xy.csv'], files: { 'xy.csv': XY }, exit: 2, code: 'knots.exists' },

  // ---- unclear input
  { name: 'TSV content in a .csv file', args: ['inspect', 'tabs.csv'], files: { 'tabs.csv': 'a\tb\n1\t2\n' }, exit: 2, code: 'table.wrongDelimiter', says: 'read it as TSV' },
  { name: 'a cell of 5 MB with control bytes (note cut and escaped)', args: ['inspect', 'huge.csv'], files: { 'huge.csv': 'a,b\n1,2\n2,' + '\u0007x'.repeat(2_500_000) + '\n3,4\n' }, exit: 0 },
  { name: 'empty column name (named with a note)', args: ['inspect', 'blank.csv'], files: { 'blank.csv': 'a,,c\n1,2,3\n4,5,6\n' }, exit: 0 },
  { name: 'constant target says what the value is', args: ['rank', 'const.csv', '--target', 'y', '--seeds', '1', '--epochs', '1', '--no-progress'], files: { 'const.csv': 'x,y\n' + Array.from({ length: 30 }, (_, i) => `${i},5`).join('\n') + '\n' }, exit: 2, code: 'learn.oneClass', says: 'target value 5' },
  { name: '10,000-column table (correlations capped with a note)', args: ['inspect', 'wide.csv', '--json'], files: { 'wide.csv': wide(10_000, 8) }, exit: 0 },

  // ---- names that are also constants
  { name: 'bare e that is also a column (fit)', args: ['fit', 'econ.csv', '--target', 'y', '--terms', 'e'], files: { 'econ.csv': 'x,e,y\n1,2,3\n2,3,5\n3,4,7\n4,5,9.5\n5,6,11\n' }, exit: 2, code: 'expr.ambiguousName', says: 'write `e`' },
  { name: 'bare pi that is also a column (bound)', args: ['bound', 'pi.csv', '--lhs', 'y', '--rhs', 'pi'], files: { 'pi.csv': 'pi,y\n1,2\n2,3\n' }, exit: 2, code: 'expr.ambiguousName', says: 'write `pi`' },
  { name: 'backquoted e reads the column', args: ['bound', 'econ.csv', '--lhs', 'y', '--rhs', '`e`'], files: { 'econ.csv': 'x,e,y\n1,2,3\n2,3,5\n3,4,7\n4,5,9.5\n5,6,11\n' }, exit: 0 },
];

describe('hostile inputs: one clear line, the right exit code and error code', () => {
  let dir: string;
  beforeAll(() => {
    dir = tempDir('hostile');
  });
  for (const row of ROWS) {
    it(`${row.name}: exit ${row.exit}${row.code ? ` [${row.code}]` : ''}`, async () => {
      const here = join(dir, row.name.replace(/[^A-Za-z0-9]+/g, '-'));
      mkdirSync(here, { recursive: true });
      mkdirSync(join(here, 'dir.csv'), { recursive: true });
      for (const [name, text] of Object.entries(row.files ?? {})) {
        mkdirSync(dirname(join(here, name)), { recursive: true });
        put(here, name, text);
      }
      const io = memoryIO(here);
      const exit = await runCli(row.args, io);
      expect(exit, io.err).toBe(row.exit);
      expect(io.err).not.toMatch(/\n\s+at /); // no stack trace
      expect(io.err).not.toContain('internal error');
      if (row.code) expect(io.err).toContain(`[${row.code}]`);
      if (row.says) expect(io.err).toContain(row.says);
      // a message never runs past a few lines, whatever the input's size, and output never echoes a huge cell
      expect(io.err.length).toBeLessThan(2000);
      expect(io.out.length).toBeLessThan(3_000_000);
      expect(io.out + io.err).not.toMatch(/[\u0000-\u0008\u000b-\u001f]/);
    });
  }
});
