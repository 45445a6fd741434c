import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { SurmiseError } from '../errors.ts';

// Placeholder until the command is built; replaced by the stage that owns it.
export function registerRun(program: Command, _io: CliIO): void {
  program
    .command('run')
    .description('(not built yet)')
    .allowUnknownOption()
    .action(() => {
      throw new SurmiseError('cli.notBuilt', "the 'run' command is not built yet");
    });
}
