import type { Command } from 'commander';
import { resolve } from 'node:path';
import { readingProgress } from './progress.ts';
import type { CliIO } from './io.ts';
import { collect, parsePositiveInt, rangeHelp } from './options.ts';
import { BOUND_LIMITS } from '../bound/find.ts';
import { readTable, type TableFormat } from '../table/read.ts';
import { findBound } from '../bound/find.ts';
import { formatBound } from '../bound/format.ts';

interface BoundOptions {
  lhs: string;
  rhs: string[];
  by?: string;
  bins: string;
  top: string;
  id: string[];
  derive: string[];
  skipInvalid?: boolean;
  lower?: boolean;
  json?: boolean;
  format?: string;
  progress: boolean;
}

/** `surmise bound`: the tightest constant c of lhs ≤ c·rhs on a table, with witnesses, strata and trend. */
export function registerBound(program: Command, io: CliIO): void {
  program
    .command('bound')
    .description(
      'tightest constant c with lhs ≤ c·rhs on every row (max of lhs/rhs), the rows attaining it, quantiles of the ratio,\n' +
        'c per equal-count stratum of --by and its log-log trend; several --rhs are compared side by side',
    )
    .argument('<table>', 'CSV, TSV, JSON or JSON Lines file')
    .requiredOption('--lhs <expr>', 'left-hand side expression, e.g. "abs(2*sig - slope)"')
    .requiredOption('--rhs <expr>', 'right-hand side expression, > 0 on every row (repeat to compare candidates)', collect, [])
    .option('--by <expr>', 'stratify by this expression (default: each candidate by its own rhs)')
    .option('--bins <n>', `number of equal-count strata${rangeHelp(BOUND_LIMITS.bins)}`, '10')
    .option('--top <k>', `number of witness rows shown${rangeHelp(BOUND_LIMITS.top)}`, '5')
    .option('--id <col>', 'column shown beside witness rows (repeat or comma-separate; default: every label column)', collect, [])
    .option('--derive <name=expr>', 'add a derived column before evaluating, e.g. slope=re(lon/mer) (repeatable)', collect, [])
    .option('--skip-invalid', 'drop and count rows with a missing cell, a non-finite value or rhs ≤ 0 instead of refusing them')
    .option('--lower', 'the lower form: largest c with lhs ≥ c·rhs on every row (min of lhs/rhs)')
    .option('--format <fmt>', 'table format when the extension does not tell (csv, tsv, json, jsonl)')
    .option('--json', 'print one JSON object on standard output')
    .option('--no-progress', 'no progress output on standard error')
    .action(async (file: string, opts: BoundOptions) => {
      const bins = parsePositiveInt('--bins', opts.bins, BOUND_LIMITS.bins.max);
      const top = parsePositiveInt('--top', opts.top, BOUND_LIMITS.top.max);
      const id = opts.id.flatMap((s) => s.split(',')).map((s) => s.trim()).filter((s) => s.length > 0);
      const reading = readingProgress(io, file, opts.progress);
      const table = await readTable(resolve(io.cwd, file), {
        displayName: file,
        ...(opts.format !== undefined ? { format: opts.format as TableFormat } : {}),
        onProgress: reading.onProgress,
      }).finally(() => reading.stop());
      const result = findBound(table, {
        lhs: opts.lhs,
        rhs: opts.rhs,
        ...(opts.by !== undefined ? { by: opts.by } : {}),
        bins,
        top,
        ...(id.length > 0 ? { id } : {}),
        derive: opts.derive,
        skipInvalid: Boolean(opts.skipInvalid),
        lower: Boolean(opts.lower),
      });
      if (opts.json) io.stdout(JSON.stringify(result, null, 2) + '\n');
      else io.stdout(formatBound(result));
    });
}

