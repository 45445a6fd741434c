import type { Command } from 'commander';
import { resolve } from 'node:path';
import { readingProgress } from './progress.ts';
import type { CliIO } from './io.ts';
import { collect, parsePositiveInt, rangeHelp } from './options.ts';
import { SurmiseError } from '../errors.ts';
import { BOUND_LIMITS } from '../bound/find.ts';
import { readTable, type TableFormat } from '../table/read.ts';
import { writeTable } from '../table/write.ts';
import { findBound, BOUND_FORMS, type BoundForm } from '../bound/find.ts';
import { discoverBound, DISCOVER_OPTIONS, type DiscoverSpec } from '../bound/discover.ts';
import { formatBound, formatDiscovery } from '../bound/format.ts';
import { witnessTable } from '../bound/witness-table.ts';

interface BoundOptions {
  lhs: string;
  rhs: string[];
  from?: string;
  by?: string;
  bins?: string;
  top: string;
  id: string[];
  derive: string[];
  skipInvalid?: boolean;
  lower?: boolean;
  form: string;
  maxExponent?: string;
  maxDenominator?: string;
  proposals?: string;
  seed?: string;
  heldOut?: string;
  exceedances?: string;
  witnesses?: string;
  force?: boolean;
  json?: boolean;
  format?: string;
  progress: boolean;
}

/** CLI flag of each discovery option (the ranges come from DISCOVER_OPTIONS). */
const DISCOVER_FLAGS: Partial<Record<keyof DiscoverSpec, keyof BoundOptions>> = {
  maxExponent: 'maxExponent',
  maxDenominator: 'maxDenominator',
  proposals: 'proposals',
  seed: 'seed',
  heldOut: 'heldOut',
  exceedances: 'exceedances',
  bins: 'bins',
};
const flagName = (k: string) => '--' + k.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());

/** `surmise bound`: the tightest constant c of lhs ≤ c·rhs on a table, or a search for the rhs itself. */
export function registerBound(program: Command, io: CliIO): void {
  program
    .command('bound')
    .description(
      'tightest constant c with lhs ≤ c·rhs on every row (max of lhs/rhs), the rows attaining it, quantiles of the ratio,\n' +
        'c per equal-count stratum of --by and its log-log trend; several --rhs are compared side by side.\n' +
        'With --from a,b,c instead of --rhs: search rhs = a^i·b^j·c^k for the tightest bound without a trend',
    )
    .argument('<table>', 'CSV, TSV, JSON or JSON Lines file')
    .requiredOption('--lhs <expr>', 'left-hand side expression, e.g. "abs(3*k - z)"')
    .option('--rhs <expr>', 'right-hand side expression, > 0 on every row (repeat to compare candidates)', collect, [])
    .option('--from <exprs>', 'search the rhs among monomials of these positive quantities (comma-separated, 1 to 6)')
    .option('--by <expr>', 'with --rhs: stratify by this expression (default: each candidate by its own rhs)')
    .option('--bins <n>', `number of equal-count strata (default 10)${rangeHelp(BOUND_LIMITS.bins)}`)
    .option('--top <k>', `number of witness rows shown${rangeHelp(BOUND_LIMITS.top)}`, '5')
    .option('--id <col>', 'column shown beside witness rows (repeat or comma-separate; default: every label column)', collect, [])
    .option('--derive <name=expr>', 'add a derived column before evaluating, e.g. ratio=re(zb/za) (repeatable)', collect, [])
    .option('--skip-invalid', 'drop and count rows with a missing cell, a non-finite value or rhs ≤ 0 instead of refusing them')
    .option('--lower', 'the lower form: largest c with lhs ≥ c·rhs on every row (min of lhs/rhs)')
    .option('--form <form>', `with --rhs: ${BOUND_FORMS.join(', ')} (affine adds lhs ≤ c·rhs + d; two-sided adds both affine sides)`, 'ratio')
    .option('--max-exponent <k>', 'with --from: largest |exponent| (default 4)')
    .option('--max-denominator <q>', 'with --from: largest denominator of an exponent (default 4)')
    .option('--proposals <n>', 'with --from: proposals shown, best first (default 5)')
    .option('--seed <n>', 'with --from: seed of the selection / held-out split (default 1)')
    .option('--held-out <share>', 'with --from: share of rows held out (default 0.4)')
    .option('--exceedances <k>', 'with --from: exceedances for the tail estimate of the true constant (default: a tenth of the rows, at most 1000)')
    .option('--witnesses <file>', 'write the witness rows with every column to this CSV/TSV/JSON file (atomically)')
    .option('--force', 'replace an existing --witnesses file')
    .option('--format <fmt>', 'table format when the extension does not tell (csv, tsv, json, jsonl)')
    .option('--json', 'print one JSON object on standard output')
    .option('--no-progress', 'no progress output on standard error')
    .action(async (file: string, opts: BoundOptions) => {
      const discovering = opts.from !== undefined;
      if (discovering === opts.rhs.length > 0) {
        throw new SurmiseError('option.conflict', discovering ? 'give either --rhs or --from, not both' : 'give a right-hand side with --rhs, or search for one with --from');
      }
      if (discovering && (opts.by !== undefined || opts.form !== 'ratio')) {
        throw new SurmiseError('option.conflict', `${opts.by !== undefined ? '--by' : '--form'} applies to --rhs; with --from every quantity is its own stratifying axis`);
      }
      if (!discovering) {
        for (const k of Object.values(DISCOVER_FLAGS)) {
          if (k !== 'bins' && opts[k] !== undefined) throw new SurmiseError('option.conflict', `${flagName(k)} applies to --from`);
        }
      }
      const top = parsePositiveInt('--top', opts.top, BOUND_LIMITS.top.max);
      const id = opts.id.flatMap((s) => s.split(',')).map((s) => s.trim()).filter((s) => s.length > 0);
      const witnessPath = opts.witnesses !== undefined ? resolve(io.cwd, opts.witnesses) : null;
      const reading = readingProgress(io, file, opts.progress);
      const table = await readTable(resolve(io.cwd, file), {
        displayName: file,
        ...(opts.format !== undefined ? { format: opts.format as TableFormat } : {}),
        onProgress: reading.onProgress,
      }).finally(() => reading.stop());
      const common = { top, ...(id.length > 0 ? { id } : {}), derive: opts.derive, skipInvalid: Boolean(opts.skipInvalid), lower: Boolean(opts.lower) };
      let text: string;
      let json: unknown;
      let groups: Array<{ rhs: string; witnesses: Array<{ row: number; ratio: number; lhs: number; rhs: number }> }>;
      if (discovering) {
        const spec: DiscoverSpec = { lhs: opts.lhs, from: opts.from!.split(',').map((s) => s.trim()).filter((s) => s.length > 0), ...common };
        for (const opt of DISCOVER_OPTIONS) {
          const flag = DISCOVER_FLAGS[opt.key];
          const raw = flag ? (opts[flag] as string | undefined) : undefined;
          if (raw === undefined) continue;
          const v = Number(raw);
          if (raw.trim() === '' || !Number.isFinite(v) || (opt.integer && !Number.isInteger(v)) || v < opt.min || v > opt.max) {
            throw new SurmiseError('option.badValue', `expected ${flagName(flag!)} to be ${opt.integer ? 'an integer' : 'a number'} from ${opt.min} to ${opt.max}, got '${raw}'`);
          }
          (spec as unknown as Record<string, number>)[opt.key] = v;
        }
        const res = discoverBound(table, spec);
        text = formatDiscovery(res);
        json = res;
        groups = res.proposals.map((p) => ({ rhs: p.rhs, witnesses: p.witnesses }));
      } else {
        if (!(BOUND_FORMS as readonly string[]).includes(opts.form)) {
          throw new SurmiseError('option.badValue', `expected --form to be one of ${BOUND_FORMS.join(', ')}, got '${opts.form}'`);
        }
        const res = findBound(table, {
          lhs: opts.lhs,
          rhs: opts.rhs,
          ...(opts.by !== undefined ? { by: opts.by } : {}),
          ...(opts.bins !== undefined ? { bins: parsePositiveInt('--bins', opts.bins, BOUND_LIMITS.bins.max) } : {}),
          form: opts.form as BoundForm,
          ...common,
        });
        text = formatBound(res);
        json = res;
        groups = res.results.map((r) => ({ rhs: r.rhs, witnesses: r.witnesses }));
      }
      if (witnessPath) {
        await writeTable(witnessTable(table, groups), witnessPath, { force: Boolean(opts.force) });
        if (!opts.json) text += `witness rows written to ${opts.witnesses}\n`;
      }
      if (opts.json) io.stdout(JSON.stringify(json, null, 2) + '\n');
      else io.stdout(text);
    });
}
