/**
 * `surmise inspect` through runCli: the --json object, the text view, --kind, --format and
 * --derive (the expression language from src/table/expr). Expected statistics are cross-checked
 * with simple-statistics on the small invented table below.
 */
import { describe, it, expect } from 'vitest';
import { mean, sampleStandardDeviation, sampleRankCorrelation } from 'simple-statistics';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { put, tempDir } from './helpers.ts';

const dir = tempDir('inspect');
// invented rows; rows c and d are equal in every column
const amp = [1.5, 2.5, 4, 4, 7.25];
const cr = [3, 4, 5, 5, 6];
const tre = [0.5, -0.5, 0, 0, 1];
const tim = [2, 3, 2.5, 2.5, 4];
const names = ['a', 'b', 'c', 'c', 'e'];
put(
  dir,
  'census.csv',
  ['name,crossings,amp,tau_re,tau_im', ...names.map((n, i) => `${n},${cr[i]},${amp[i]},${tre[i]},${tim[i]}`), 'f,7,NA,1,4'].join('\n') + '\n',
);

async function run(args: string[]) {
  const io = memoryIO(dir);
  const code = await runCli(args, io);
  return { code, out: io.out, err: io.err };
}

describe('surmise inspect', () => {
  it('--json prints exactly one object with rows, duplicates, columns and correlations', async () => {
    const r = await run(['inspect', 'census.csv', '--json']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    expect(r.out.trim().split('\n')).toHaveLength(1);
    const j = JSON.parse(r.out);
    expect(j.rows).toBe(6);
    expect(j.duplicates).toBe(1);
    expect(j.columns.map((c: { name: string; kind: string }) => `${c.name}:${c.kind}`)).toEqual([
      'name:label',
      'crossings:integer',
      'amp:real',
      'tau:complex',
    ]);
    const v = j.columns[2];
    expect(v.missing).toBe(1);
    expect(v.mean).toBeCloseTo(mean(amp), 14);
    expect(v.std).toBeCloseTo(sampleStandardDeviation(amp), 14);
    expect([v.min, v.max]).toEqual([1.5, 7.25]);
    const tau = j.columns[3];
    expect(tau.mean.re).toBeCloseTo(mean([...tre, 1]), 14);
    expect(tau.std.im).toBeCloseTo(sampleStandardDeviation([...tim, 4]), 14);
    const top = j.correlations.find((c: { a: string; b: string }) => c.a === 'crossings' && c.b === 'tau.im');
    expect(top.rho).toBeCloseTo(sampleRankCorrelation([...cr, 7], [...tim, 4]), 12);
  });

  it('the text view lists every column aligned, the correlations and the notes', async () => {
    const r = await run(['inspect', 'census.csv']);
    expect(r.code).toBe(0);
    const lines = r.out.split('\n');
    expect(lines[0]).toBe('census.csv: 6 rows, 4 columns, 1 duplicate row');
    const header = lines.find((l) => l.startsWith('column'))!;
    const volLine = lines.find((l) => l.startsWith('amp '))!;
    // right-aligned numeric columns end at the same place as their headings
    expect(volLine.indexOf('7.25') + 4).toBe(header.indexOf('max') + 3);
    expect(r.out).toMatch(/Strongest Spearman rank correlations \(all rows\):/);
    expect(r.out).toMatch(/columns 'tau_re' and 'tau_im' joined into complex column 'tau'/);
  });

  it('--kind and --format are applied; a bad --kind is cli.badKind with exit code 2', async () => {
    put(dir, 'census.txt', 'k\tv\n1\t2\n3\t4\n');
    const r = await run(['inspect', 'census.txt', '--format', 'tsv', '--kind', 'k=real', '--kind', 'v=label', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).columns.map((c: { kind: string }) => c.kind)).toEqual(['real', 'label']);
    const bad = await run(['inspect', 'census.csv', '--kind', 'amp=integr']);
    expect(bad.code).toBe(2);
    expect(bad.err).toBe(
      "surmise: --kind amp=integr: 'integr' is not a column kind; expected one of real, integer, complex, label (did you mean 'integer'?) [cli.badKind]\n",
    );
  });

  it('--derive appends computed columns before profiling (expression language of src/table/expr)', async () => {
    const r = await run(['inspect', 'census.csv', '--derive', 'v2=2*amp', '--derive', 'w=v2+crossings', '--json']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    const v2 = j.columns.find((c: { name: string }) => c.name === 'v2');
    const w = j.columns.find((c: { name: string }) => c.name === 'w');
    expect(v2.mean).toBeCloseTo(2 * mean(amp), 13);
    expect(w.mean).toBeCloseTo(mean(amp.map((x, i) => 2 * x + cr[i]!)), 13);
    expect(v2.missing).toBe(1);
  });

  it('--derive naming an existing column is table.duplicateColumn; a missing column is reported by the expression layer', async () => {
    const dup = await run(['inspect', 'census.csv', '--derive', 'amp=2']);
    expect(dup.code).toBe(2);
    // the one derive service's wording (withDerived), as on rank, fit, search and bound
    expect(dup.err).toBe("surmise: census.csv: derived column 'amp' would replace the table's column of the same name; choose another name [table.duplicateColumn]\n");
    // a name given to two derived columns is not called the table's
    const twice = await run(['inspect', 'census.csv', '--derive', 'x=2', '--derive', 'x=3']);
    expect(twice.code).toBe(2);
    expect(twice.err).toBe("surmise: census.csv: derived column 'x' is given twice; choose another name for one of them [table.duplicateColumn]\n");
    const unk = await run(['inspect', 'census.csv', '--derive', 'x=volume*2']);
    expect(unk.code).toBe(2);
    // the expression layer adds a caret line under the expression (its own format); no stack trace
    expect(unk.err.startsWith("surmise: unknown column 'volume' at position 1 of the expression")).toBe(true);
    expect(unk.err).toMatch(/\[expr\.unknownColumn\]\n$/);
    expect(unk.err).not.toMatch(/\n\s+at /);
  });
});
