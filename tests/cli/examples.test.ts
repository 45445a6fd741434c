/**
 * Every example printed at the end of a command's --help is a real command: run here, in order, in
 * a scratch folder holding copies of demo-data/knots.csv and configs/demo.yaml. The examples of
 * `demo-data` (tests/demo/knots.test.ts), `demo`, `run`, `rerun` and `compare` (tests/run/e2e.test.ts)
 * train or rewrite the whole demo and are run by those tests with the same options.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { copyFileSync, mkdirSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { EXAMPLES, exampleArgs } from '../../src/cli/examples.ts';

const RUN_ELSEWHERE = new Set(['demo-data', 'demo', 'run', 'rerun', 'compare']);
const dir = mkdtempSync(join(tmpdir(), 'surmise-examples-'));

beforeAll(() => {
  mkdirSync(join(dir, 'demo-data'));
  mkdirSync(join(dir, 'configs'));
  copyFileSync(fileURLToPath(new URL('../../demo-data/knots.csv', import.meta.url)), join(dir, 'demo-data', 'knots.csv'));
  copyFileSync(fileURLToPath(new URL('../../configs/demo.yaml', import.meta.url)), join(dir, 'configs', 'demo.yaml'));
});

describe('--help ends with real examples', () => {
  it('every command has two or three examples and its help ends with them; defaults are shown as values', async () => {
    for (const [command, list] of Object.entries(EXAMPLES)) {
      expect(list.length, command).toBeGreaterThanOrEqual(1);
      expect(list.length, command).toBeLessThanOrEqual(3);
      const io = memoryIO(dir);
      expect(await runCli([command, '--help'], io)).toBe(0);
      expect(io.out.trimEnd().endsWith(list[list.length - 1]!), command).toBe(true);
      expect(io.out, command).not.toMatch(/\(default: "/);
    }
  });

  for (const [command, list] of Object.entries(EXAMPLES)) {
    if (RUN_ELSEWHERE.has(command)) continue;
    it(`the examples of ${command} run and succeed`, async () => {
      for (const example of list) {
        const io = memoryIO(dir);
        const code = await runCli([...exampleArgs(example), ...(example.includes(' rank ') ? ['--no-progress'] : [])], io);
        expect(code, `${example}\n${io.err}`).toBe(0);
        expect(io.out.length + io.err.length, example).toBeGreaterThan(0);
        if (example.endsWith('--json')) expect(() => JSON.parse(io.out), example).not.toThrow();
      }
    }, 300_000);
  }
});

describe('exampleArgs', () => {
  it('splits at blanks outside double quotes', () => {
    expect(exampleArgs('surmise fit t.csv --terms "a; b" --json')).toEqual(['fit', 't.csv', '--terms', 'a; b', '--json']);
  });
});
