/**
 * `surmise search TABLE --target EXPR --from a,b,c`: which few terms built from the chosen columns
 * predict the target? Chosen on a selection part of the rows, measured on a held-out part.
 * A thin shell over searchRelations (src/relate/search.ts).
 */
import type { Command } from 'commander';
import { makeProgress } from './progress.ts';
import type { CliIO } from './io.ts';
import { addTableOptions, readTableOptions } from './options.ts';
import { SurmiseError } from '../errors.ts';
import { searchRelations, type SearchCandidate, type SearchResult, type SearchSpec } from '../relate/search.ts';
import { splitRows } from '../relate/split-option.ts';
import { alignTable, num } from '../relate/text.ts';
import { toJson } from '../util/json.ts';
import { SEARCH_OPTIONS } from '../relate/options.ts';
import { optionOf } from '../util/option-table.ts';
import { readDerived } from './fit.ts';
import { addReadFlags, type ReadFlags } from './read-flags.ts';
import { parseIntegerRange } from '../util/range.ts';

interface SearchOptions extends ReadFlags {
  target: string;
  from: string;
  json?: boolean;
  progress: boolean;
  [table: string]: unknown;
}

/** `--time 60s` (also `90`, `2m`, `1.5m`): seconds, within (0, 86400]. */
export function parseDuration(text: string): number {
  const m = /^\s*(\d+(?:\.\d+)?)\s*(s|m|min)?\s*$/.exec(text);
  const v = m ? Number(m[1]) * (m[2] && m[2] !== 's' ? 60 : 1) : NaN;
  if (!(v > 0 && v <= 86_400)) throw new SurmiseError('option.badValue', `--time ${text}: expected a duration such as 60s or 2m, at most 24 hours`, { option: 'timeLimit' });
  return v;
}

/** `--lattice auto|off|STEP`. */
export function parseLattice(text: string): 'auto' | 'off' | number {
  if (text === 'auto' || text === 'off') return text;
  const v = Number(text);
  if (text.trim() === '' || !(Number.isFinite(v) && v > 0)) throw new SurmiseError('option.badValue', `--lattice ${text}: expected auto, off or a positive step such as 2`, { option: 'lattice' });
  return v;
}

/** `--powers lo..hi` with integers, e.g. `-3..3` (the shared range reader). */
export function parsePowers(text: string): [number, number] {
  return parseIntegerRange(text, 'relate.badPowers', `--powers ${text}`, 'powers');
}

function row(c: SearchCandidate, rank: number, lattice: boolean): string[] {
  const exact = lattice ? [c.roundedHeldOutExact === null ? '—' : `${(100 * c.roundedHeldOutExact).toFixed(1)}%`] : [];
  return [String(rank), String(c.complexity), num(c.selectionRmse, 4), num(c.heldOutRmse, 4), num(c.roundedHeldOutRmse, 4), ...exact, c.roundedFormula, c.formula];
}

export function renderSearch(r: SearchResult): string {
  const out: string[] = [];
  const d = r.dropped;
  const why = [d.missing ? `${d.missing} with missing cells` : '', d.nonFinite ? `${d.nonFinite} with non-finite values` : '', d.duplicates ? `${d.duplicates} exact duplicates` : '']
    .filter(Boolean)
    .join(', ');
  const drop = d.total > 0 ? ` (${d.total} rows dropped: ${why})` : '';
  out.push(`formula search for ${r.target}: ${r.nCandidateTerms} distinct terms built, ${r.nCandidatesTried} subsets tried (${r.mode}); method: ${r.method}`);
  out.push(`selection rows ${r.selectionRows}, held-out rows ${r.heldOutRows}${drop}: ${r.split}`);
  out.push('');
  const lat = r.lattice !== null;
  const head = ['#', 'complexity', 'selection RMSE', 'held-out RMSE', 'rounded held-out', ...(lat ? [`exact on ${r.lattice!.step}ℤ${r.lattice!.offset ? ` + ${r.lattice!.offset}` : ''}`] : []), 'rounded formula', 'fitted formula'];
  out.push('best first (the simplest formulas whose held-out RMSE is within two standard errors of the lowest, then by held-out RMSE):');
  out.push(alignTable([head, ...r.candidates.map((c, i) => row(c, i + 1, lat))]).trimEnd());
  out.push('');
  out.push('Pareto front (complexity against held-out RMSE):');
  out.push(alignTable([head, ...r.front.map((c, i) => row(c, i + 1, lat))]).trimEnd());
  const best = r.candidates[0];
  if (best) {
    out.push('');
    out.push(`best candidate, coefficients with 95% intervals and the simplest rational inside each:`);
    const rows: string[][] = [['term', 'estimate', 'std. error', '95% interval', 'rational']];
    const ic = best.intercept;
    rows.push(['1', num(ic.coef, 8), num(ic.se, 4), `[${num(ic.low)}, ${num(ic.high)}]`, ic.rational?.text ?? '—']);
    best.terms.forEach((t, j) => rows.push([t, num(best.coefs[j]!, 8), num(best.se[j]!, 4), `[${num(best.low[j]!)}, ${num(best.high[j]!)}]`, best.rationals[j]?.text ?? '—']));
    out.push(alignTable(rows).trimEnd());
  }
  if (r.skippedTerms.length) {
    out.push('');
    out.push(`skipped terms (${r.skippedTerms.length}):`);
    for (const s of r.skippedTerms.slice(0, 12)) out.push(`  - ${s.name}: ${s.reason}`);
    if (r.skippedTerms.length > 12) out.push(`  … and ${r.skippedTerms.length - 12} more (see --json)`);
  }
  out.push('');
  for (const n of r.notes) out.push(n.text);
  out.push('Complexity: 1 per column, 2 per part of a complex column, 4 per part of a quotient; + |power| − 1, + 1 per root, + 1 per division, sum or difference, + 1 per function, + 1 per numeric constant; products and the intercept are free.');
  return out.join('\n') + '\n';
}

export function registerSearch(program: Command, io: CliIO): void {
  const cmd = program
    .command('search')
    .description('search formulas target ≈ c0 + Σ c·term over terms built from chosen columns; chosen on one part of the rows, measured on another')
    .argument('<table>', 'CSV, TSV, JSON or JSON Lines file')
    .requiredOption('--target <expr>', 'expression to predict')
    .requiredOption('--from <columns>', 'columns to build terms from, comma-separated');
  addReadFlags(cmd);
  addTableOptions(cmd, SEARCH_OPTIONS);
  cmd
    .option('--json', 'print one JSON object')
    .option('--no-progress', 'no progress output on stderr')
    .action(async (file: string, o: SearchOptions) => {
      const given = readTableOptions(SEARCH_OPTIONS, o, { timeLimit: parseDuration, powers: parsePowers, lattice: parseLattice }) as { split?: string } & Omit<SearchSpec, 'target' | 'from' | 'split'>;
      const from = o.from.split(',').map((s) => s.trim());
      from.forEach((c, i) => {
        if (c === '') throw new SurmiseError('option.badList', `--from: column ${i + 1} of the list is empty (columns are separated by ',')`);
      });
      const table = await readDerived(io, file, o);
      const { split: spec, ...options } = given;
      let split: SearchSpec['split'];
      if (spec !== undefined) {
        const s = splitRows(table, spec, options.seed ?? (optionOf(SEARCH_OPTIONS, 'seed').default as number));
        split = { selection: s.first, heldOut: s.second, description: s.description + (s.unused ? ` (${s.unused} rows in neither part)` : '') };
      }
      const bar = makeProgress(io, 'searching formulas', o.progress);
      const progress = (done: number, total: number): void => bar.update(done, total);
      let r: SearchResult;
      try {
        r = searchRelations(table, { target: o.target, from, progress, ...options, ...(split ? { split } : {}) });
      } finally {
        bar.stop();
      }
      if (o.json) io.stdout(toJson(r, 2) + '\n');
      else io.stdout(renderSearch(r));
    });
}
