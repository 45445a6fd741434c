import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { resolve } from 'node:path';
import { generateCensus } from '../demo/census.ts';
import { writeFileAtomic } from '../util/atomic-write.ts';
import { parsePositiveInt, parseIntOption } from './options.ts';

/** `surmise demo-data`: regenerate the invented demo census from its documented random model. */
export function registerDemoData(program: Command, io: CliIO): void {
  program
    .command('demo-data')
    .description('write the invented demo census (see src/demo/census.ts for its random model) as CSV')
    .option('--rows <n>', 'number of rows', '20000')
    .option('--seed <s>', 'random seed', '1')
    .option('--out <file>', 'write to this file instead of standard output')
    .option('--force', 'replace an existing --out file')
    .action((opts: { rows: string; seed: string; out?: string; force?: boolean }) => {
      const rows = parsePositiveInt('--rows', opts.rows);
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
