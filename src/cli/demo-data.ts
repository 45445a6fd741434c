import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { resolve } from 'node:path';
import { generateDemoKnots } from '../demo/knots.ts';
import { writeFileAtomic } from '../util/atomic-write.ts';
import { addTableOptions, readTableOptions } from './options.ts';
import { DEMO_DATA_OPTIONS } from '../demo/options.ts';
import { defaultsOf } from '../util/option-table.ts';
import { makeProgress } from './progress.ts';

/** `surmise demo-data`: recompute the bundled demo table of knots from its diagrams. */
export function registerDemoData(program: Command, io: CliIO): void {
  const cmd = program
    .command('demo-data')
    .description('recompute the demo table: torus knots, twisted families and random closed braids with their invariants (CSV)');
  addTableOptions(cmd, DEMO_DATA_OPTIONS);
  cmd
    .option('--out <file>', 'write to this file instead of standard output')
    .option('--force', 'replace an existing --out file')
    .option('--no-progress', 'no progress on stderr')
    .addHelpText('after', '\nThe bundled demo-data/knots.csv is exactly what the first example writes (a test checks it byte for byte).\n')
    .action((opts: { seed?: string; out?: string; force?: boolean; progress: boolean }) => {
      const { seed } = { ...defaultsOf(DEMO_DATA_OPTIONS), ...readTableOptions(DEMO_DATA_OPTIONS, opts) } as { seed: number };
      const progress = makeProgress(io, 'demo-data', opts.progress);
      const csv = generateDemoKnots(seed, (done, total) => {
        if (done % 100 === 0 || done === total) progress.update(done, total);
      });
      progress.stop();
      if (opts.out) {
        writeFileAtomic(resolve(io.cwd, opts.out), csv, { force: opts.force, display: opts.out });
        io.stderr(`surmise demo-data: wrote ${csv.split('\n').length - 2} knots to ${opts.out}\n`);
      } else {
        io.stdout(csv);
      }
    });
}
