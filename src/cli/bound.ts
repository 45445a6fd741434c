import type { Command } from 'commander';
import { resolve } from 'node:path';
import type { CliIO } from './io.ts';
import { addTableOptions, collect, flagFor, readTableOptions } from './options.ts';
import { SurmiseError } from '../errors.ts';
import { writeTable } from '../table/write.ts';
import { findBound } from '../bound/find.ts';
import { discoverBound, type DiscoverSpec } from '../bound/discover.ts';
import { BOUND_OPTIONS, DISCOVER_OPTIONS } from '../bound/options.ts';
import type { OptionSpec, OptionTable } from '../util/option-table.ts';
import { addReadFlags, parseReadFlags, readWithFlags, type ReadFlags } from './read-flags.ts';
import { formatBound, formatDiscovery } from '../bound/format.ts';
import { witnessTable } from '../bound/witness-table.ts';
import { toJson } from '../util/json.ts';

interface BoundOptions extends ReadFlags {
  lhs: string;
  rhs: string[];
  from?: string;
  witnesses?: string;
  force?: boolean;
  json?: boolean;
  progress: boolean;
  [table: string]: unknown;
}

/** Keys of one mode's table that the other mode does not have (given in the wrong mode: a conflict). */
const only = (a: OptionTable, b: OptionTable): OptionSpec[] => a.filter((o) => !b.some((p) => p.key === o.key));

/** `surmise bound`: the tightest constant c of lhs ≤ c·rhs on a table, or a search for the rhs itself. */
export function registerBound(program: Command, io: CliIO): void {
  const cmd = program
    .command('bound')
    .description(
      'tightest constant c with lhs ≤ c·rhs on every row (max of lhs/rhs), the rows attaining it, quantiles of the ratio,\n' +
        'c per equal-count stratum of --by and its log-log trend; several --rhs are compared side by side.\n' +
        'With --from a,b,c instead of --rhs: search rhs = a^i·b^j·c^k for the tightest bound without a trend',
    )
    .argument('<table>', 'CSV, TSV, JSON or JSON Lines file')
    .requiredOption('--lhs <expr>', 'left-hand side expression, e.g. "abs(3*k - z)"')
    .option('--rhs <expr>', 'right-hand side expression, > 0 on every row (repeat to compare candidates)', collect, [])
    .option('--from <exprs>', 'search the rhs among monomials of these positive quantities (comma-separated, 1 to 6)');
  addReadFlags(cmd);
  addTableOptions(cmd, BOUND_OPTIONS);
  addTableOptions(cmd, DISCOVER_OPTIONS);
  cmd
    .option('--witnesses <file>', 'write the witness rows with every column to this CSV/TSV/JSON file (atomically)')
    .option('--force', 'replace an existing --witnesses file')
    .option('--json', 'print one JSON object on standard output')
    .option('--no-progress', 'no progress output on standard error')
    .action(async (file: string, opts: BoundOptions) => {
      const discovering = opts.from !== undefined;
      if (discovering === opts.rhs.length > 0) {
        throw new SurmiseError('option.conflict', discovering ? 'give either --rhs or --from, not both' : 'give a right-hand side with --rhs, or search for one with --from');
      }
      // an option of the other mode's table given: say which mode it belongs to
      const [own, other, otherMode] = discovering ? [DISCOVER_OPTIONS, BOUND_OPTIONS, '--rhs'] : [BOUND_OPTIONS, DISCOVER_OPTIONS, '--from'];
      for (const o of only(other, own)) {
        const flag = flagFor(cmd, o.key) ?? o.key;
        if (opts[flag.replace(/^--/, '').replace(/-([a-z])/g, (_, c: string) => c.toUpperCase())] !== undefined) {
          throw new SurmiseError('option.conflict', `${flag} applies to ${otherMode}${discovering ? '; with --from every quantity is its own stratifying axis' : ''}`, { option: o.key });
        }
      }
      const given = readTableOptions(own, opts);
      const read = parseReadFlags(opts);
      const witnessPath = opts.witnesses !== undefined ? resolve(io.cwd, opts.witnesses) : null;
      const table = await readWithFlags(io, file, read, opts.progress);
      const common = { ...given, derive: read.derive };
      let text: string;
      let json: unknown;
      let groups: Array<{ rhs: string; witnesses: Array<{ row: number; ratio: number; lhs: number; rhs: number }> }>;
      if (discovering) {
        const spec: DiscoverSpec = { lhs: opts.lhs, from: opts.from!.split(',').map((s) => s.trim()).filter((s) => s.length > 0), ...common };
        const res = discoverBound(table, spec);
        text = formatDiscovery(res);
        json = res;
        groups = res.proposals.map((p) => ({ rhs: p.rhs, witnesses: p.witnesses }));
      } else {
        const res = findBound(table, { lhs: opts.lhs, rhs: opts.rhs, ...common });
        text = formatBound(res);
        json = res;
        groups = res.results.map((r) => ({ rhs: r.rhs, witnesses: r.witnesses }));
      }
      if (witnessPath) {
        await writeTable(witnessTable(table, groups), witnessPath, { force: Boolean(opts.force) });
        if (!opts.json) text += `witness rows written to ${opts.witnesses}\n`;
      }
      if (opts.json) io.stdout(toJson(json, 2) + '\n');
      else io.stdout(text);
    });
}
