import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { SurmiseError } from '../errors.ts';

// Placeholder until the command is built; replaced by the stage that owns it.
export function registerInspect(program: Command, _io: CliIO): void {
  program
    .command('inspect')
    .description('(not built yet)')
    .allowUnknownOption()
    .action(() => {
      throw new SurmiseError('cli.notBuilt', "the 'inspect' command is not built yet");
    });
}
