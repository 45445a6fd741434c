import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { Rng } from '../../src/util/rng.ts';

let dir: string;
beforeAll(() => {
  // planted two-stage law (invented data for the machinery): y = 2a + 0.1·b³ + N(0, 0.01²); c inert
  dir = mkdtempSync(join(tmpdir(), 'surmise-residual-'));
  const rng = new Rng(31);
  const lines = ['a,b,c,y'];
  for (let i = 0; i < 900; i++) {
    const [a, b, c] = [rng.uniform(0, 2), rng.uniform(0, 2), rng.uniform(0, 2)];
    lines.push([a, b, c, 2 * a + 0.1 * b ** 3 + 0.01 * rng.normal()].map((v) => v.toFixed(6)).join(','));
  }
  writeFileSync(join(dir, 'two.csv'), lines.join('\n') + '\n');
});

const FAST = ['--workers', '0', '--hidden', '16,16', '--epochs', '30', '--seeds', '2', '--method', 'saliency,permutation', '--no-progress'];

describe('surmise residual', () => {
  it('text: the fit, the residual ranking with its noise line, |residual|, and the proposed next term with the fit to try', async () => {
    const io = memoryIO(dir);
    const code = await runCli(['residual', 'two.csv', '--target', 'y', '--terms', 'a', ...FAST], io);
    expect(code, io.err).toBe(0);
    expect(io.out).toMatch(/^surmise residual: y ≈ .*·a on 900 rows of two\.csv/);
    expect(io.out).toContain('ranked against 2 remaining columns: b, c');
    expect(io.out).toMatch(/ {4}1 {2}b +\d\.\d{3} {2}\[\d\.\d{3}, \d\.\d{3}\] +above/);
    expect(io.out).toMatch(/noise level \d\.\d{3} \(probes' upper reference\)/);
    expect(io.out).toContain('|residual| (the size of the error, for bounds)');
    expect(io.out).toMatch(/next term \(search over b; best by selection BIC\): residual ≈ .*b\^3/);
    expect(io.out).toContain('try: surmise fit two.csv --target "y" --terms "a; b^3"');
  }, 180_000);

  it('--json --no-absolute: one object, no absolute ranking; bad options exit 2 naming the option', async () => {
    const io = memoryIO(dir);
    expect(await runCli(['residual', 'two.csv', '--target', 'y', '--terms', 'a', '--json', '--no-absolute', ...FAST, '--seeds', '1', '--epochs', '5', '--method', 'saliency'], io), io.err).toBe(0);
    const j = JSON.parse(io.out);
    expect(j.absolute).toBeNull();
    expect(j.ranking.ranking.map((e: { feature: string }) => e.feature).sort()).toEqual(['b', 'c']);
    expect(j.fit.terms.map((t: { term: string }) => t.term)).toEqual(['1', 'a']);
    const cases: Array<[string[], RegExp]> = [
      [['--max-terms', '4'], /expected --max-terms to be at most 3 \(its ceiling\), got 4/],
      [['--probes', '99'], /expected --probes to be at most 50 \(its ceiling\), got 99/],
      [['--from', 'a,,b'], /--from a,,b: expected comma-separated entries with none empty/], // the options table's wording for every list flag
      [['--powers', '3..1'], /--powers 3\.\.1: the lower end 3 exceeds the upper end 1/],
    ];
    for (const [args, re] of cases) {
      const e = memoryIO(dir);
      expect(await runCli(['residual', 'two.csv', '--target', 'y', '--terms', 'a', ...args], e), args.join(' ')).toBe(2);
      expect(e.err, args.join(' ')).toMatch(re);
      expect(e.err.split('\n')).toHaveLength(2);
    }
  }, 180_000);
});
