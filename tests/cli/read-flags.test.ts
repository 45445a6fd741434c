/**
 * The reading flags every table command shares (src/cli/read-flags.ts): `--derive`, `--kind`,
 * `--complex-pairs`, `--format`, declared once with one wording, and their configuration keys
 * (`derive`, `kinds`, `complexPairs`, `format`). The planted relation is invented; least squares
 * recovers an exact linear relation whenever the design has full rank (a fact of the trade).
 */
import { describe, it, expect } from 'vitest';
import { buildProgram, runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { parseConfig } from '../../src/run/config.ts';
import { SurmiseError } from '../../src/errors.ts';
import { put, tempDir } from '../table/helpers.ts';

const dir = tempDir('readflags');
// invented rows: y = 1 + 2·re(cza) + 3·im(cza) exactly
const rows = [
  [0.5, 2],
  [1.25, -1],
  [-2, 1],
  [3, 0.5],
  [0.75, 4],
  [-1.5, -2.5],
];
put(dir, 'pair.csv', ['cza_re,cza_im,y', ...rows.map(([a, b]) => `${a},${b},${1 + 2 * a! + 3 * b!}`)].join('\n') + '\n');

const FLAGS = ['--derive', '--kind', '--complex-pairs', '--format'];
const TABLE_COMMANDS = ['inspect', 'rank', 'fit', 'search', 'residual', 'bound'];

async function cli(...args: string[]) {
  const io = memoryIO(dir);
  const code = await runCli(args, io);
  return { code, out: io.out, err: io.err };
}

describe('one set of reading flags on every table command', () => {
  it('inspect, rank, fit, search, residual and bound each have the four flags, worded alike', () => {
    const program = buildProgram(memoryIO());
    const help = new Map<string, string>();
    for (const name of TABLE_COMMANDS) {
      const cmd = program.commands.find((c) => c.name() === name)!;
      for (const flag of FLAGS) {
        const o = cmd.options.find((x) => x.long === flag);
        expect(o, `${name} ${flag}`).toBeDefined();
        if (!help.has(flag)) help.set(flag, o!.description);
        expect(o!.description, `${name} ${flag}`).toBe(help.get(flag));
      }
    }
  });

  it('fit joins cza_re/cza_im by default, keeps them apart with --complex-pairs none, and recovers the planted coefficients either way', async () => {
    const joined = await cli('fit', 'pair.csv', '--target', 'y', '--terms', 're(cza); im(cza)', '--json');
    expect(joined.code, joined.err).toBe(0);
    const j = JSON.parse(joined.out);
    const coef = (r: { terms: Array<{ coef: number }> }) => r.terms.map((t) => t.coef);
    expect(coef(j)[0]).toBeCloseTo(1, 10);
    expect(coef(j)[1]).toBeCloseTo(2, 10);
    expect(coef(j)[2]).toBeCloseTo(3, 10);

    const apart = await cli('fit', 'pair.csv', '--target', 'y', '--terms', 're(cza); im(cza)', '--complex-pairs', 'none');
    expect(apart.code).toBe(2);
    // the expression's position is shown under it (README "Errors")
    expect(apart.err).toMatch(/^surmise: unknown column 'cza' at position 4 of the expression/);
    expect(apart.err).toMatch(/\[expr\.unknownColumn\]\n$/);

    const parts = await cli('fit', 'pair.csv', '--target', 'y', '--terms', 'cza_re; cza_im', '--complex-pairs', 'none', '--json');
    expect(parts.code, parts.err).toBe(0);
    expect(coef(JSON.parse(parts.out))[2]).toBeCloseTo(3, 10);
  });

  it('--complex-pairs shows its real default, auto (the rule used when it is not given), not none', () => {
    const program = buildProgram(memoryIO());
    for (const name of TABLE_COMMANDS) {
      const o = program.commands.find((c) => c.name() === name)!.options.find((x) => x.long === '--complex-pairs')!;
      expect(o.defaultValueDescription, name).toBe('auto');
    }
  });

  it('a column given two kinds is refused, naming the flag, not silently overwritten', async () => {
    const r = await cli('inspect', 'pair.csv', '--kind', 'y=integer', '--kind', 'y=real', '--no-progress');
    expect(r.code).toBe(2);
    expect(r.err).toBe("surmise: --kind y=real: column 'y' already has a kind (integer); give each column one --kind [cli.badKind]\n");
  });

  it('a bad --complex-pairs or --format is refused on one line naming the flag, before any work', async () => {
    const pairs = await cli('bound', 'pair.csv', '--lhs', 'y', '--rhs', 'cza_re', '--complex-pairs', 'auto', '--complex-pairs', 'none');
    expect(pairs.code).toBe(2);
    expect(pairs.err).toMatch(/^surmise: --complex-pairs auto none: 'auto' cannot be combined.*\[cli\.badComplexPairs\]\n$/);
    const format = await cli('bound', 'pair.csv', '--lhs', 'y', '--rhs', 'cza_re', '--format', 'xlsx');
    expect(format.code).toBe(2);
    expect(format.err).toMatch(/^surmise: --format xlsx: expected one of csv, tsv, json, jsonl.*\[cli\.badFormat\]\n$/);
  });
});

describe('the configuration keys of the same choices', () => {
  it('complexPairs takes the same values as --complex-pairs (one value may be written without brackets)', () => {
    expect(parseConfig('table: t.csv\ntarget: y\n', 'c.yaml').config.complexPairs).toEqual([]);
    expect(parseConfig('table: t.csv\ntarget: y\ncomplexPairs: none\n', 'c.yaml').config.complexPairs).toEqual(['none']);
    expect(parseConfig('table: t.csv\ntarget: y\ncomplexPairs: ["z=a_re,a_im"]\n', 'c.yaml').config.complexPairs).toEqual(['z=a_re,a_im']);
  });

  it('a bad complexPairs names the key and its line', () => {
    let err: unknown;
    try {
      parseConfig('table: t.csv\ntarget: y\ncomplexPairs: [auto, none]\n', 'c.yaml');
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(SurmiseError);
    expect((err as Error).message).toBe("c.yaml:3:15: complexPairs: auto none: 'auto' cannot be combined with other complexPairs values; expected auto, none, or NAME=RE,IM (repeatable), e.g. complexPairs za=za_re,za_im");
  });
});
