/**
 * The command line: a thin shell over the library. Each command lives in its own module under
 * src/cli/ and registers itself on the program; this file only wires them and turns typed errors
 * into one line on stderr and an exit code (2 for the user's input, 1 for our bugs).
 */
import { Command, CommanderError } from 'commander';
import { SurmiseError, wordOptionError } from '../errors.ts';
import { flagFor } from './options.ts';
import { type CliIO, processIO } from './io.ts';
import { commandRegistrations } from './commands.ts';
import { VERSION } from '../version.ts';
import { examplesHelp } from './examples.ts';

export function buildProgram(io: CliIO): Command {
  const program = new Command();
  program
    .name('surmise')
    .description(
      'Find which invariants in a table predict a target, fit closed-form relations and inequalities, ' +
        'and report the tightest constants with the rows that attain them. Results are statistical ' +
        'evidence on the given table, never a proof. Knot signatures: the right-handed trefoil has signature -2.',
    )
    .version(VERSION, '-V, --version')
    .exitOverride()
    .configureOutput({ writeOut: (s) => io.stdout(s), writeErr: (s) => io.stderr(s) })
    .showHelpAfterError('(run with --help for usage)');
  for (const register of commandRegistrations) register(program, io);
  program.hook('preAction', (_program, action) => {
    running.set(program, action);
  });
  for (const c of program.commands) {
    c.addHelpText('after', examplesHelp(c.name()));
    showDefaultsAsValues(c);
    c.exitOverride();
    c.configureOutput({ writeOut: (s) => io.stdout(s), writeErr: (s) => io.stderr(s) });
    for (const sub of c.commands) {
      sub.exitOverride();
      sub.configureOutput({ writeOut: (s) => io.stdout(s), writeErr: (s) => io.stderr(s) });
    }
  }
  return program;
}

/** The command being run, to word a library error's option key as that command's flag. */
const running = new WeakMap<Command, Command>();

/** `(default: 3)` rather than `(default: "3")`: a default given as text is shown as the value it stands for. */
function showDefaultsAsValues(c: Command): void {
  for (const o of c.options) {
    if (typeof o.defaultValue === 'string' && o.defaultValueDescription === undefined) o.defaultValueDescription = o.defaultValue === '' ? 'none' : o.defaultValue;
    if (Array.isArray(o.defaultValue) && o.defaultValue.length === 0 && o.defaultValueDescription === undefined) o.defaultValueDescription = 'none';
  }
  for (const sub of c.commands) showDefaultsAsValues(sub);
}

/** Run the CLI on `args` (without node and script), returning the exit code. Never throws. */
export async function runCli(args: string[], io: CliIO): Promise<number> {
  const program = buildProgram(io);
  try {
    await program.parseAsync(args, { from: 'user' });
    return 0;
  } catch (e) {
    if (e instanceof CommanderError) {
      if (e.code === 'commander.helpDisplayed' || e.code === 'commander.version' || e.code === 'commander.help') return 0;
      // commander has already printed its message; usage errors are the user's input
      return 2;
    }
    if (e instanceof SurmiseError) {
      const action = running.get(program);
      const worded = action ? wordOptionError(e, (key) => flagFor(action, key)) : e;
      io.stderr(`surmise: ${worded.message} [${worded.code}]\n`);
      return worded.exitCode;
    }
    const err = e as Error;
    io.stderr(`surmise: internal error: ${err?.message ?? String(e)}\n${err?.stack ?? ''}\n`);
    return 1;
  }
}

export async function main(argv: string[]): Promise<number> {
  return runCli(argv.slice(2), processIO());
}
