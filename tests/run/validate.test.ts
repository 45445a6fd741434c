import { describe, it, expect } from 'vitest';
import { mkdtempSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';

// A configuration is checked against the table before any training: a typo costs seconds.
describe('configuration checked against the table before training', () => {
  const dir = mkdtempSync(join(tmpdir(), 'surmise-validate-'));
  writeFileSync(join(dir, 't.csv'), 'x,y,gap\n1,2,0.5\n2,4,0.25\n3,6,0.125\n4,8,0.3\n');

  async function refusal(yaml: string): Promise<string> {
    writeFileSync(join(dir, 'c.yaml'), yaml);
    const io = memoryIO(dir);
    expect(await runCli(['run', 'c.yaml', '--out', 'o', '--no-progress'], io)).toBe(2);
    expect(existsSync(join(dir, 'o'))).toBe(false); // nothing written
    expect(io.err).not.toContain('learning');
    return io.err;
  }

  it('names the key and its line for an unknown column in a bound', async () => {
    const err = await refusal('table: t.csv\ntarget: y\nbounds:\n  - lhs: y\n    rhs: [x/gapp]\n');
    expect(err.split('\n')[0]).toBe(
      "surmise: c.yaml:5:11: bounds[0].rhs[0]: unknown column 'gapp' at position 3 of the expression (table " +
        join(dir, 't.csv') +
        ") (did you mean 'gap'?)",
    );
    expect(err).toContain('[expr.unknownColumn]');
  });

  it('names the key and its line for a bad split', async () => {
    const err = await refusal('table: t.csv\ntarget: y\nsplit: randm\n');
    expect(err.startsWith("surmise: c.yaml:3:8: split: cannot read split 'randm'")).toBe(true);
  });

  it('names the key for a bad fit term', async () => {
    const err = await refusal('table: t.csv\ntarget: y\nfits:\n  - target: y\n    terms: [x, x^^2]\n');
    expect(err.startsWith('surmise: c.yaml:5:16: fits[0].terms[1]: ')).toBe(true);
    expect(err).toContain('[expr.parse]');
  });
});
