/**
 * Complex pairs joined by a declared rule: `--complex-pairs auto|none|NAME=RE,IM` and declared
 * kinds winning over the 'auto' join (rule from the project issue: "complex pairs joined by a
 * declared rule"; declared kinds skip inference, README "Kinds"). Means are cross-checked with
 * simple-statistics.
 */
import { describe, it, expect } from 'vitest';
import { mean } from 'simple-statistics';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { parseComplexPairsOption } from '../../src/table/complex-pairs.ts';
import { tableFromRecords } from '../../src/table/columns.ts';
import { readTable } from '../../src/table/read.ts';
import { put, tempDir } from './helpers.ts';

const dir = tempDir('pairs');
// invented rows
const re = [0.5, 1.25, -2, 3];
const im = [2, 2.5, 1, -1];
const x = [1, 2, 3, 4];
put(dir, 'pair.csv', ['cza_re,cza_im,x', ...re.map((r, i) => `${r},${im[i]},${x[i]}`)].join('\n') + '\n');
put(dir, 'pair.jsonl', re.map((r, i) => JSON.stringify({ 'cza.re': r, 'cza.im': im[i], x: x[i] })).join('\n') + '\n');

async function inspect(...args: string[]) {
  const io = memoryIO(dir);
  const code = await runCli(['inspect', ...args, '--json'], io);
  const j = code === 0 ? JSON.parse(io.out) : null;
  const kinds: string[] = j ? j.columns.map((c: { name: string; kind: string }) => `${c.name}:${c.kind}`) : [];
  return { code, err: io.err, j, kinds };
}

describe('complex pairs and declared kinds', () => {
  it("'auto' joins cza_re/cza_im into complex cza when nothing is declared (mean per part = simple-statistics mean)", async () => {
    const r = await inspect('pair.csv');
    expect(r.code).toBe(0);
    expect(r.kinds).toEqual(['cza:complex', 'x:integer']);
    const cza = r.j.columns[0];
    expect(cza.mean.re).toBeCloseTo(mean(re), 12); // simple-statistics mean
    expect(cza.mean.im).toBeCloseTo(mean(im), 12);
  });

  it('a kind declared for a part keeps the parts apart, and says so in the notes', async () => {
    const r = await inspect('pair.csv', '--kind', 'cza_re=real', '--kind', 'cza_im=real');
    expect(r.code).toBe(0);
    expect(r.kinds).toEqual(['cza_re:real', 'cza_im:real', 'x:integer']);
    expect(r.j.notes.join('\n')).toMatch(/'cza_re' and 'cza_im' were kept apart: a kind is declared for 'cza_re' \(real\) and 'cza_im' \(real\)/);
    // one part alone is enough
    expect((await inspect('pair.csv', '--kind', 'cza_im=real')).kinds).toEqual(['cza_re:real', 'cza_im:real', 'x:integer']);
  });

  it('a kind other than complex declared for the pair name keeps the parts apart and applies to both', async () => {
    expect((await inspect('pair.csv', '--kind', 'cza=real')).kinds).toEqual(['cza_re:real', 'cza_im:real', 'x:integer']);
    expect((await inspect('pair.csv', '--kind', 'cza=label')).kinds).toEqual(['cza_re:label', 'cza_im:label', 'x:integer']);
    // declared integer applies to the parts: 0.5 is not an integer (README "Kinds": table.notInteger)
    const bad = await inspect('pair.csv', '--kind', 'cza=integer');
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/\[table\.notInteger\]\n$/);
    // the same in JSON Lines with the X.re/X.im spelling
    expect((await inspect('pair.jsonl', '--kind', 'cza=label')).kinds).toEqual(['cza.re:label', 'cza.im:label', 'x:integer']);
    expect((await inspect('pair.jsonl')).kinds).toEqual(['cza:complex', 'x:integer']);
  });

  it('--kind cza=complex joins even when a part is declared; with --complex-pairs none it is an error naming the fix', async () => {
    expect((await inspect('pair.csv', '--kind', 'cza=complex', '--kind', 'cza_re=real')).kinds).toEqual(['cza:complex', 'x:integer']);
    const none = await inspect('pair.csv', '--complex-pairs', 'none', '--kind', 'cza=complex');
    expect(none.code).toBe(2);
    expect(none.err).toMatch(/--complex-pairs cza=cza_re,cza_im to join them \[table\.unknownColumn\]\n$/);
  });

  it('--complex-pairs none keeps every pair apart; NAME=RE,IM joins exactly the named columns', async () => {
    expect((await inspect('pair.csv', '--complex-pairs', 'none')).kinds).toEqual(['cza_re:real', 'cza_im:real', 'x:integer']);
    const one = await inspect('pair.csv', '--complex-pairs', 'z=x,cza_im');
    expect(one.code).toBe(0);
    expect(one.kinds).toEqual(['cza_re:real', 'z:complex']);
    expect(one.j.columns[1].mean.re).toBeCloseTo(mean(x), 12); // simple-statistics mean
    expect(one.j.columns[1].mean.im).toBeCloseTo(mean(im), 12);
    const two = await inspect('pair.csv', '--complex-pairs', 'a=cza_re,cza_im', '--complex-pairs', 'b=x,x2');
    expect(two.code).toBe(2);
    expect(two.err).toMatch(/no column 'x2'.*\[table\.unknownColumn\]\n$/);
  });

  it('an explicit pair whose name is declared another kind is refused (table.kindConflict)', async () => {
    const r = await inspect('pair.csv', '--complex-pairs', 'cza=cza_re,cza_im', '--kind', 'cza=real');
    expect(r.code).toBe(2);
    expect(r.err).toBe(
      "surmise: complex pair cza=cza_re,cza_im makes 'cza' complex, but its kind is declared 'real' (--kind cza=real); drop one of the two [table.kindConflict]\n",
    );
  });

  it('the library readers follow the same rule (readTable, tableFromRecords)', async () => {
    const t = await readTable(`${dir}/pair.csv`, { kinds: { cza: 'real' } });
    expect(t.columns.map((c) => `${c.name}:${c.kind}`)).toEqual(['cza_re:real', 'cza_im:real', 'x:integer']);
    const recs = re.map((r, i) => ({ cza_re: r, cza_im: im[i], x: x[i] }));
    expect(tableFromRecords(recs, 'recs', { kinds: { cza_re: 'real' } }).columns.map((c) => c.kind)).toEqual(['real', 'real', 'integer']);
    expect(tableFromRecords(recs, 'recs').columns.map((c) => c.kind)).toEqual(['complex', 'integer']);
    expect(tableFromRecords(recs, 'recs', { complexPairs: [{ name: 'q', re: 'cza_re', im: 'x' }] }).columns.map((c) => `${c.name}:${c.kind}`)).toEqual([
      'q:complex',
      'cza_im:real',
    ]);
  });
});

describe('parseComplexPairsOption', () => {
  it('reads auto, none and NAME=RE,IM lists', () => {
    expect(parseComplexPairsOption([])).toBe('auto');
    expect(parseComplexPairsOption(['auto'])).toBe('auto');
    expect(parseComplexPairsOption([' none '])).toBe('none');
    expect(parseComplexPairsOption(['cza=cza_re, cza_im', 'czb=a,b'])).toEqual([
      { name: 'cza', re: 'cza_re', im: 'cza_im' },
      { name: 'czb', re: 'a', im: 'b' },
    ]);
  });
  it('refuses malformed values with cli.badComplexPairs naming the option and value', () => {
    const cases: Array<[string[], RegExp]> = [
      [['auto', 'none'], /'auto' cannot be combined/],
      [['auto', 'm=a,b'], /'auto' cannot be combined/],
      [['sometimes'], /`complexPairs` sometimes: 'sometimes' is neither auto, none nor NAME=RE,IM/],
      [['m=a'], /expected two column names/],
      [['m=a,b,c'], /expected two column names/],
      [['=a,b'], /the name before = is empty/],
      [['m=a,a'], /the same column 'a'/],
      [['m=a,b', 'm=c,d'], /the pair 'm' is given twice/],
      [['m=a,b', 'n=b,c'], /column 'b' is already a part of pair 'm'/],
    ];
    for (const [v, msg] of cases) {
      let err: { code?: string; message?: string } = {};
      try {
        parseComplexPairsOption(v);
      } catch (e) {
        err = e as typeof err;
      }
      expect(err.code, v.join(' ')).toBe('cli.badComplexPairs');
      expect(err.message).toMatch(msg);
    }
  });
});
