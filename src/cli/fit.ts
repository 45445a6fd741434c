/**
 * `surmise fit TABLE --target EXPR --terms "EXPR; EXPR; ..."`: least squares of the target on the
 * given terms (Householder QR), with intervals, simplest rationals, held-out and cross-validated
 * error. A thin shell over fitRelation (src/relate/fit.ts).
 */
import { resolve } from 'node:path';
import type { Command } from 'commander';
import type { CliIO } from './io.ts';
import { collect, rangeHelp } from './options.ts';
import { tooLarge } from '../util/integer.ts';
import { RELATE_LIMITS } from '../relate/limits.ts';
import { SurmiseError } from '../errors.ts';
import { readTable } from '../table/read.ts';
import { parseDerive, withDerived } from '../table/expr/derive.ts';
import { fitRelation, type FitResult } from '../relate/fit.ts';
import { splitRows } from '../relate/split-option.ts';
import { alignTable, num } from '../relate/text.ts';
import { toJson } from '../util/json.ts';

export interface FitOptions {
  target: string;
  terms: string;
  intercept: boolean;
  split?: string;
  derive: string[];
  seed: string;
  folds: string;
  level: string;
  format?: string;
  json?: boolean;
  keepDuplicates?: boolean;
  noisy?: string;
}

/** An integer option ≥ `min` (else `relate.badOption` naming it) and at most its ceiling `max` (else `option.tooLarge`). */
export function intOption(name: string, text: string, min: number, max = Infinity): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isInteger(v) || v < min)
    throw new SurmiseError('relate.badOption', `expected ${name} to be an integer ≥ ${min}, got '${text}'`);
  if (v > max) throw tooLarge(name, text, { min, max });
  return v;
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
  program
    .command('fit')
    .description('least squares of a target expression on given terms, with intervals and simplest rational constants')
    .argument('<table>', 'CSV, TSV, JSON or JSON Lines file')
    .requiredOption('--target <expr>', 'expression to predict, e.g. "re(zb/za)"')
    .requiredOption('--terms <list>', 'terms separated by ";", e.g. "sig; ux/uy^3"')
    .option('--no-intercept', 'fit without the constant term (R² is then uncentred)')
    .option('--split <spec>', 'fit on one part and report the error on another: random:TRAIN,VALIDATION,TEST (fit on train, measure on test) or where:CONDITION')
    .option('--derive <name=expr>', 'add a derived column first (repeatable)', collect, [] as string[])
    .option('--seed <n>', 'seed for the split and the cross-validation folds', '0')
    .option('--folds <k>', `cross-validation folds${rangeHelp(RELATE_LIMITS.folds)}`, '5')
    .option('--level <p>', 'confidence level of the intervals', '0.95')
    .option('--format <fmt>', 'table format when the extension does not tell (csv, tsv, json, jsonl)')
    .option('--noisy <terms>', 'terms measured with error, separated by ";" (their slopes are attenuated; errors-in-variables)')
    .option('--keep-duplicates', 'keep rows that repeat an earlier row in every column used (default: drop and count them)')
    .option('--json', 'print one JSON object')
    .action(async (file: string, o: FitOptions) => {
      const seed = intOption('--seed', o.seed, 0);
      const folds = intOption('--folds', o.folds, RELATE_LIMITS.folds.min, RELATE_LIMITS.folds.max);
      const level = Number(o.level);
      if (!(level > 0 && level < 1)) throw new SurmiseError('relate.badOption', `expected --level to lie strictly between 0 and 1, got '${o.level}'`);
      const terms = splitTerms(o.terms);
      const derive = o.derive.map((d) => parseDerive(d));
      const table0 = await readTable(resolve(io.cwd, file), { displayName: file, ...(o.format ? { format: o.format as 'csv' } : {}) });
      const table = withDerived(table0, derive);
      let split: { train: Int32Array; test: Int32Array; description: string } | undefined;
      if (o.split !== undefined) {
        const s = splitRows(table, o.split, seed);
        split = { train: s.first, test: s.second, description: s.description + (s.unused ? ` (${s.unused} rows in neither part)` : '') };
      }
      const r = fitRelation(table, { target: o.target, terms, intercept: o.intercept, seed, folds, level, keepDuplicates: Boolean(o.keepDuplicates), ...(split ? { split } : {}), ...(o.noisy !== undefined ? { noisyTerms: splitTerms(o.noisy) } : {}) });
      if (o.json) io.stdout(toJson(r, 2) + '\n');
      else io.stdout(renderFit(r));
    });
}
