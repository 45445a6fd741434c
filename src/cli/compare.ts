import type { Command } from 'commander';
import { resolve } from 'node:path';
import type { CliIO } from './io.ts';
import { toJson } from '../util/json.ts';

export function registerCompare(program: Command, io: CliIO): void {
  program
    .command('compare')
    .description('compare two runs with both runs\' uncertainty: rankings, fitted coefficients, the best searched formula and bound constants (difference and its interval; "consistent" when it contains 0)')
    .argument('<run-a>', 'the earlier run folder')
    .argument('<run-b>', 'the later run folder')
    .option('--json', 'print the comparison as one JSON object')
    .action(async (a: string, b: string, o: { json?: boolean }) => {
      // the run stage (zod, yaml, plotting) loads when the command runs, not at every start
      const [{ readRunResults }, { compareRuns, formatComparison }] = await Promise.all([import('../run/rerun.ts'), import('../run/compare.ts')]);
      const c = compareRuns(readRunResults(resolve(io.cwd, a)), readRunResults(resolve(io.cwd, b)));
      io.stdout(o.json ? toJson(c) + '\n' : formatComparison(c));
    });
}
