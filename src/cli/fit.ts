/**
 * `surmise fit TABLE --target EXPR --terms "EXPR; EXPR; ..."`: least squares of the target on the
 * given terms (Householder QR), with intervals, simplest rationals, held-out and cross-validated
 * error. A thin shell over fitRelation (src/relate/fit.ts).
 */
import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { addTableOptions, readTableOptions } from './options.ts';
import { FIT_OPTIONS } from '../relate/options.ts';
import { optionOf } from '../util/option-table.ts';
import { SurmiseError } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { withDerived } from '../table/expr/derive.ts';
import { fitRelation, type FitResult, type FitSpec } from '../relate/fit.ts';
import { addReadFlags, parseReadFlags, readWithFlags, type ReadFlags } from './read-flags.ts';
import { splitRows } from '../relate/split-option.ts';
import { alignTable, num } from '../relate/text.ts';
import { toJson } from '../util/json.ts';

export interface FitOptions extends ReadFlags {
  target: string;
  terms: string;
  json?: boolean;
  [table: string]: unknown;
}

/** Split the --terms list at ';' (commas belong to function calls such as atan2(y, x)). */
export function splitTerms(text: string): string[] {
  const parts = text.split(';').map((t) => t.trim());
  if (parts.length > 1 && parts[parts.length - 1] === '') parts.pop();
  parts.forEach((t, i) => {
    if (t === '') throw new SurmiseError('relate.emptyTerm', `--terms: term ${i + 1} is empty (terms are separated by ';')`);
  });
  return parts;
}

export function renderFit(r: FitResult): string {
  const lines: string[] = [];
  const d = r.dropped;
  const why = [d.missing ? `${d.missing} with missing cells` : '', d.nonFinite ? `${d.nonFinite} with non-finite values` : '', d.duplicates ? `${d.duplicates} repeating an earlier row in every column used` : '']
    .filter(Boolean)
    .join(', ');
  const drop = d.total > 0 ? `, ${d.total} of ${r.nRows} dropped (${why})` : '';
  const nT = r.terms.length - (r.intercept ? 1 : 0);
  lines.push(`least squares: ${r.target} on ${nT} term${nT === 1 ? '' : 's'}${r.intercept ? ' and an intercept' : ' (no intercept)'}, ${r.n} rows used${drop}`);
  lines.push('');
  const pct = `${Math.round(r.level * 100)}% interval`;
  const rows: string[][] = [['term', 'estimate', 'std. error', pct, 'simple fraction (denominator ≤ 12)']];
  for (const t of r.terms) {
    rows.push([
      t.term,
      t.aliased ? 'aliased' : num(t.coef, 8),
      num(t.se, 4),
      t.aliased ? '' : `[${num(t.low, 6)}, ${num(t.high, 6)}]`,
      t.aliased ? '—' : t.fraction.text,
    ]);
  }
  lines.push(alignTable(rows).trimEnd());
  lines.push('');
  const worst = r.maxAbsResidualRow;
  const lab = Object.entries(worst.labels).map(([k, v]) => `${k}=${v}`).join(', ');
  const where = `data row ${worst.row}${worst.line !== undefined ? ` (line ${worst.line})` : ''}${lab ? ` ${lab}` : ''}`;
  const stats: string[][] = [
    ['n', String(r.n)],
    [r.centredR2 ? 'R²' : 'R² (uncentred, no intercept)', num(r.r2, 6)],
    ['adjusted R²', num(r.adjR2, 6)],
    ['RMSE', num(r.rmse, 6)],
    ['residual SD', num(r.residualSD, 6)],
    ['MAE', num(r.mae, 6)],
    ['max |residual|', `${num(r.maxAbsResidual, 6)} at ${where}`],
    ['AIC / BIC', `${num(r.aic, 8)} / ${num(r.bic, 8)}`],
    [`${r.cvFolds}-fold CV RMSE`, `${num(r.cvRmse, 6)} (seed ${r.seed})`],
    ['condition number', `${num(r.condition, 3)} (centred, unit-length columns)`],
    ['rank', `${r.rank} of ${r.terms.length}`],
  ];
  if (r.heldOut) stats.push(['held-out RMSE', `${num(r.heldOut.rmse, 6)} on ${r.heldOut.n} rows (MAE ${num(r.heldOut.mae, 6)})`]);
  if (r.roundedExact) {
    stats.push(['rounded fit exactly right', `${num(r.roundedExact.fitted, 4)} of fitted rows${r.roundedExact.heldOut !== null ? `, ${num(r.roundedExact.heldOut, 4)} of held-out rows` : ''} (integer target)`]);
  }
  if (r.orthogonal) stats.push(['orthogonal slope', `${num(r.orthogonal.slope, 8)} (intercept ${num(r.orthogonal.intercept, 8)}; total least squares)`]);
  if (r.split) stats.push(['split', r.split]);
  lines.push(alignTable(stats).trimEnd());
  lines.push('');
  lines.push(`fractions: ${r.fractionRule}.`);
  if (r.orthogonal) lines.push(`${r.orthogonal.text}.`);
  if (r.errorsInVariables) lines.push(`${r.errorsInVariables.text}.`);
  if (r.warnings.length) {
    lines.push('');
    lines.push('warnings:');
    for (const w of r.warnings) lines.push(`  - ${w.text}`);
  }
  lines.push('');
  lines.push('Intervals assume independent errors of constant variance; this is evidence on this table, not a proof.');
  return lines.join('\n') + '\n';
}

export function registerFit(program: Command, io: CliIO): void {
  const cmd = program
    .command('fit')
    .description('least squares of a target expression on given terms, with intervals and simplest rational constants')
    .argument('<table>', 'CSV, TSV, JSON or JSON Lines file')
    .requiredOption('--target <expr>', 'expression to predict, e.g. "re(zb/za)"')
    .requiredOption('--terms <list>', 'terms separated by ";", e.g. "sig; ux/uy^3"');
  addReadFlags(cmd);
  addTableOptions(cmd, FIT_OPTIONS);
  cmd
    .option('--json', 'print one JSON object')
    .action(async (file: string, o: FitOptions) => {
      const given = readTableOptions(FIT_OPTIONS, o) as { split?: string } & Omit<FitSpec, 'target' | 'terms' | 'split'>;
      const terms = splitTerms(o.terms);
      const table = await readDerived(io, file, o);
      const { split: spec, ...options } = given;
      let split: FitSpec['split'];
      if (spec !== undefined) {
        const s = splitRows(table, spec, options.seed ?? FIT_DEFAULT_SEED);
        split = { train: s.first, test: s.second, description: s.description + (s.unused ? ` (${s.unused} rows in neither part)` : '') };
      }
      const r = fitRelation(table, { target: o.target, terms, ...options, ...(split ? { split } : {}) });
      if (o.json) io.stdout(toJson(r, 2) + '\n');
      else io.stdout(renderFit(r));
    });
}

const FIT_DEFAULT_SEED = optionOf(FIT_OPTIONS, 'seed').default as number;

/** Read a table as the reading flags say, with the `--derive` columns added (fit, search, residual). */
export async function readDerived(io: CliIO, file: string, flags: ReadFlags): Promise<Table> {
  const read = parseReadFlags(flags);
  return withDerived(await readWithFlags(io, file, read, flags.progress ?? false), read.derive);
}
