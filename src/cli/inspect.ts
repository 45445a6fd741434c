/**
 * `surmise inspect TABLE`: read a table and print its profile — rows, duplicate rows, per column
 * kind, missing and non-finite counts, min / max / mean / sample std, distinct counts, and the
 * strongest Spearman rank correlations. `--derive NAME=EXPR` adds computed columns first.
 */
import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { profileTable, type ColumnProfile, type TableProfile } from '../table/profile.ts';
import { withDerived } from '../table/expr/index.ts';
import { toJson } from '../util/json.ts';
import { INSPECT_OPTIONS } from '../table/options.ts';
import { addTableOptions, readTableOptions } from './options.ts';
import { addReadFlags, parseReadFlags, readWithFlags, type ReadFlags } from './read-flags.ts';

interface InspectOptions extends ReadFlags {
  json?: boolean;
  progress: boolean;
}

function fmtNum(x: number | null | undefined): string {
  if (x === null || x === undefined) return '';
  if (Number.isNaN(x)) return 'nan';
  if (!Number.isFinite(x)) return x > 0 ? 'inf' : '-inf';
  if (Number.isInteger(x) && Math.abs(x) < 1e15) return String(x);
  const a = Math.abs(x);
  if (a !== 0 && (a < 1e-4 || a >= 1e7)) return x.toExponential(4);
  return String(Number(x.toPrecision(6)));
}

function fmtStat(v: ColumnProfile['mean']): string {
  if (v === null) return '';
  if (typeof v === 'number') return fmtNum(v);
  if (v.im === null) return fmtNum(v.re);
  const im = fmtNum(v.im);
  return `${fmtNum(v.re)}${im.startsWith('-') ? im : `+${im}`}i`;
}

/** The aligned text view of a profile. */
export function formatProfile(p: TableProfile): string {
  const lines: string[] = [];
  lines.push(`${p.source}: ${p.rows.toLocaleString('en-US')} rows, ${p.columns.length} columns, ${p.duplicates} duplicate row${p.duplicates === 1 ? '' : 's'}`);
  const head = ['column', 'kind', 'missing', 'non-finite', 'min', 'max', 'mean', 'std', 'distinct'];
  const rows = p.columns.map((c) => [
    c.name,
    c.kind,
    String(c.missing),
    String(c.nonFinite),
    fmtStat(c.min),
    fmtStat(c.max),
    fmtStat(c.mean),
    fmtStat(c.std),
    c.distinct === undefined ? '' : String(c.distinct),
  ]);
  const width = head.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j]!.length)));
  const right = new Set([2, 3, 4, 5, 6, 7, 8]);
  const fmtRow = (r: string[]) => r.map((s, j) => (right.has(j) ? s.padStart(width[j]!) : s.padEnd(width[j]!))).join('  ').trimEnd();
  lines.push('', fmtRow(head), fmtRow(width.map((w) => '-'.repeat(w))), ...rows.map(fmtRow));
  lines.push('');
  if (p.correlations.length === 0) lines.push('Spearman rank correlations: fewer than two non-constant numeric columns');
  else {
    lines.push(
      `Strongest Spearman rank correlations (${p.correlationSampled ? `sample of ${p.correlationRows.toLocaleString('en-US')} rows` : 'all rows'}):`,
    );
    const w = Math.max(...p.correlations.map((c) => `${c.a} ~ ${c.b}`.length));
    for (const c of p.correlations) lines.push(`  ${`${c.a} ~ ${c.b}`.padEnd(w)}  ${c.rho >= 0 ? ' ' : ''}${c.rho.toFixed(4)}`);
  }
  if (p.notes.length) {
    lines.push('', 'Notes:');
    for (const n of p.notes) lines.push(`  - ${n}`);
  }
  return lines.join('\n') + '\n';
}

export function registerInspect(program: Command, io: CliIO): void {
  const cmd = program
    .command('inspect')
    .description('Read a table (CSV, TSV, JSON, JSON Lines) and summarise its columns, duplicates and rank correlations')
    .argument('<table>', 'the table file (.csv .tsv .tab .json .jsonl .ndjson)');
  addReadFlags(cmd)
    .option('--json', 'print one JSON object instead of the text view')
    .option('--no-progress', 'do not report reading progress on stderr');
  addTableOptions(cmd, INSPECT_OPTIONS);
  cmd.action(async (file: string, opts: InspectOptions) => {
    const read = parseReadFlags(opts);
    const table = withDerived(await readWithFlags(io, file, read, opts.progress), read.derive);
    const profile = profileTable(table, readTableOptions(INSPECT_OPTIONS, opts as unknown as Record<string, unknown>));
    if (opts.json) io.stdout(toJson(profile) + '\n');
    else io.stdout(formatProfile(profile));
  });
}
