import type { Command } from 'commander';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { CliIO } from './io.ts';

/** The bundled configuration; its table is the bundled demo table of knots (demo-data/knots.csv). */
export const DEMO_CONFIG = fileURLToPath(new URL('../../configs/demo.yaml', import.meta.url));

/** A fresh folder name: `base`, else `base-2`, `base-3`, … (the demo never replaces anything). */
function freshFolder(base: string): string {
  if (!existsSync(base)) return base;
  for (let k = 2; ; k++) if (!existsSync(`${base}-${k}`)) return `${base}-${k}`;
}

export function registerDemo(program: Command, io: CliIO): void {
  program
    .command('demo')
    .description('run configs/demo.yaml on the bundled demo table of knots and print the path of the report')
    .option('--out <dir>', 'run folder (default: a new surmise-demo folder in the current directory)')
    .option('--force', 'replace an existing --out folder')
    .option('--json', 'print the run folder and files as one JSON object')
    .option('--no-progress', 'no progress on stderr')
    .action(async (o: { out?: string; force?: boolean; json?: boolean; progress: boolean }) => {
      // the run stage (zod, yaml, plotting) loads when the command runs, not at every start
      const [{ loadConfig }, { runWithProgress }] = await Promise.all([import('../run/config.ts'), import('./run-shared.ts')]);
      const loaded = loadConfig(DEMO_CONFIG, 'configs/demo.yaml');
      const out = o.out ? resolve(io.cwd, o.out) : freshFolder(resolve(io.cwd, 'surmise-demo'));
      await runWithProgress(io, loaded, { ...o, out });
    });
}
