import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { resolve } from 'node:path';
import { generateCensus } from '../demo/census.ts';
import { writeFileAtomic } from '../util/atomic-write.ts';
import { parsePositiveInt, parseIntOption, rangeHelp } from './options.ts';

/** Most rows `demo-data` writes (about 1.5 GB of CSV): the ceiling keeps a typo from filling the disk. */
export const MAX_DEMO_ROWS = 10_000_000;

/** `surmise demo-data`: regenerate the invented demo census from its documented random model. */
export function registerDemoData(program: Command, io: CliIO): void {
  program
    .command('demo-data')
    .description('write the invented demo census (see src/demo/census.ts for its random model) as CSV')
    .option('--rows <n>', `number of rows${rangeHelp({ min: 1, max: MAX_DEMO_ROWS })}`, '20000')
    .option('--seed <s>', 'random seed', '1')
    .option('--out <file>', 'write to this file instead of standard output')
    .option('--force', 'replace an existing --out file')
    .action((opts: { rows: string; seed: string; out?: string; force?: boolean }) => {
      const rows = parsePositiveInt('--rows', opts.rows, MAX_DEMO_ROWS);
      const seed = parseIntOption('--seed', opts.seed);
      const csv = generateCensus({ rows, seed });
      if (opts.out) {
        const path = resolve(io.cwd, opts.out);
        writeFileAtomic(path, csv, { force: opts.force });
        io.stderr(`wrote ${rows} rows to ${opts.out}\n`);
      } else {
        io.stdout(csv);
      }
    });
}
