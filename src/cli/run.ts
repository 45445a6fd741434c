import type { Command } from 'commander';
import { resolve } from 'node:path';
import type { CliIO } from './io.ts';
import { parseEngine } from './options.ts';

export function registerRun(program: Command, io: CliIO): void {
  program
    .command('run')
    .description('run the whole analysis described by a configuration file and write a run folder')
    .argument('<config>', 'YAML configuration (see the README for every key)')
    .option('--out <dir>', 'run folder (default: the configuration\'s output)')
    .option('--force', 'replace an existing run folder')
    .option('--json', 'print the run folder and files as one JSON object')
    .option('--engine <engine>', 'network engine: auto (native when it loads) | native | tfjs (default: the configuration\'s network.engine)')
    .option('--no-progress', 'no progress on stderr')
    .action(async (config: string, o: { out?: string; force?: boolean; json?: boolean; progress: boolean; engine?: string }) => {
      const engine = o.engine === undefined ? undefined : parseEngine(o.engine);
      // the run stage (zod, yaml, plotting) loads when the command runs, not at every start
      const [{ loadConfig }, { runWithProgress }] = await Promise.all([import('../run/config.ts'), import('./run-shared.ts')]);
      const loaded = loadConfig(resolve(io.cwd, config), config);
      await runWithProgress(io, loaded, { ...o, engine, ...(o.out ? { out: resolve(io.cwd, o.out) } : {}) });
    });
}
