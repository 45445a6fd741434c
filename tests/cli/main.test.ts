import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';

const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };

describe('the command line shell', () => {
  it('--version prints the package version', async () => {
    const io = memoryIO();
    expect(await runCli(['--version'], io)).toBe(0);
    expect(io.out).toBe(`${pkg.version}\n`);
  });

  it('--help lists every command and states the knot sign convention', async () => {
    const io = memoryIO();
    expect(await runCli(['--help'], io)).toBe(0);
    for (const c of ['inspect', 'rank', 'fit', 'search', 'bound', 'knots', 'run', 'demo', 'rerun', 'compare', 'demo-data']) {
      expect(io.out).toMatch(new RegExp(`\\n  ${c}\\b`));
    }
    expect(io.out).toContain('right-handed trefoil has signature -2');
  });

  it('an unknown command or option exits 2 with commander\'s message and no stack trace', async () => {
    const a = memoryIO();
    expect(await runCli(['frobnicate'], a)).toBe(2);
    expect(a.err).toContain("unknown command 'frobnicate'");
    const b = memoryIO();
    expect(await runCli(['fit', 'x.csv', '--target', 'y', '--terms', 'x', '--bogus'], b)).toBe(2);
    expect(b.err).toContain("unknown option '--bogus'");
    expect(a.err + b.err).not.toContain('    at ');
  });

  it('a bad integer option names the option (Number(), not parseInt: "12abc" is refused)', async () => {
    const io = memoryIO();
    expect(await runCli(['demo-data', '--seed', '12abc'], io)).toBe(2);
    expect(io.err).toBe("surmise: expected --seed to be an integer, got '12abc' [option.badInteger]\n");
  });
});
