import type { Command } from 'commander';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { CliIO } from './io.ts';

export function registerRerun(program: Command, io: CliIO): void {
  program
    .command('rerun')
    .description("repeat a run's resolved configuration (same seeds, same analysis) on a new table")
    .argument('<run-dir>', 'an earlier run folder')
    .requiredOption('--table <file>', 'the new table')
    .option('--out <dir>', 'run folder (default: <run-dir>-rerun, or -rerun-2, … if taken)')
    .option('--force', 'replace an existing --out folder')
    .option('--json', 'print the run folder and files as one JSON object')
    .option('--no-progress', 'no progress on stderr')
    .action(async (runDir: string, o: { table: string; out?: string; force?: boolean; json?: boolean; progress: boolean }) => {
      // the run stage (zod, yaml, plotting) loads when the command runs, not at every start
      const [{ rerunFromFolder }, { runWithProgress }] = await Promise.all([import('../run/rerun.ts'), import('./run-shared.ts')]);
      const dir = resolve(io.cwd, runDir);
      const loaded = rerunFromFolder(dir, o.table, io.cwd);
      let out = o.out ? resolve(io.cwd, o.out) : `${dir.replace(/[\\/]+$/, '')}-rerun`;
      if (!o.out) for (let k = 2; existsSync(out); k++) out = `${dir.replace(/[\\/]+$/, '')}-rerun-${k}`;
      await runWithProgress(io, loaded, { ...o, out });
    });
}
