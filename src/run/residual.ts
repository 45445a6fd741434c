/**
 * Residual ranking: after a first formula fits, which remaining column explains what it leaves
 * over? Fit the formula by least squares (relate), rank the remaining columns as predictors of the
 * residual — and of its absolute value, which is what a bound on the error needs — with the same
 * network, baselines, methods and noise probes as `rank` (attribute), then search for the next
 * term among the leading columns (relate's searchRelations). Composes stages, so it lives here on
 * top of them. Evidence on this table, not a proof.
 */
import { SurmiseError, didYouMean } from '../errors.ts';
import type { IntegerRange } from '../util/integer.ts';
import { checkOptions, optionOf, type OptionTable } from '../util/option-table.ts';
import { INTEGER_RANGE_PATTERN } from '../util/range.ts';
import type { Column, Table } from '../table/types.ts';
import { expressionColumns, parseExpression } from '../table/expr/index.ts';
import { rankFeatures, type RankOptions, type RankProgress, type RankResult } from '../attribute/rank.ts';
import { fitRelation, type FitResult } from '../relate/fit.ts';
import { searchRelations, type SearchCandidate, type SearchResult } from '../relate/search.ts';
import type { Note } from '../util/note.ts';

/**
 * The residual ranking's own options (the ranking's are RANK_OPTIONS): one table that
 * residualRanking checks against and the `residual` command and the configuration's `residual`
 * block are built from. In the library the next-term search's options sit under `search`
 * (`search.maxTerms`, `search.powers` as [lo, hi], `search.columns`).
 */
export const RESIDUAL_OPTIONS = [
  { key: 'intercept', type: 'boolean', default: true, description: 'fit the formula with the constant term' },
  { key: 'from', type: 'list', min: 1, default: null, description: 'rank only these columns (default: every numeric column the target and terms do not read)' },
  { key: 'absolute', type: 'boolean', default: true, description: 'also rank the absolute residual (the size of the error, for bounds)' },
  // each more term multiplies the subsets the next-term search tries
  { key: 'maxTerms', type: 'integer', min: 1, max: 3, default: 1, description: 'most terms the next-term search adds' },
  { key: 'powers', type: 'text', default: '-3..3', pattern: { re: INTEGER_RANGE_PATTERN, expected: 'a range such as -3..3' }, shell: 'read as the library\'s [lo, hi]', description: 'integer powers for the next-term search' },
  { key: 'columns', type: 'integer', min: 1, max: 20, default: 3, description: 'leading columns of the residual ranking the next-term search draws from' },
] as const satisfies OptionTable;

const range = (key: string): IntegerRange => {
  const o = optionOf(RESIDUAL_OPTIONS, key) as IntegerRange;
  return { min: o.min, max: o.max };
};

/** Ranges of the residual ranking's own count options, read from RESIDUAL_OPTIONS. */
export const RESIDUAL_LIMITS = Object.freeze({
  maxTerms: range('maxTerms'),
  columns: range('columns'),
} satisfies Record<string, IntegerRange>);

interface ResidualChecked {
  intercept: boolean;
  from: string[] | null;
  absolute: boolean;
  maxTerms: number;
  columns: number;
}

export interface ResidualSpec {
  target: string;
  /** The first formula's terms. */
  terms: string[];
  intercept?: boolean;
  /** Columns to rank on the residual; default every numeric column the target and terms do not read. */
  from?: string[];
  /** Also rank |residual| (default true). */
  absolute?: boolean;
  /** Ranking settings (network, methods, seeds, probes, split…), as for rank. */
  rank?: Omit<RankOptions, 'target' | 'features' | 'exclude' | 'derive' | 'onProgress'>;
  /** Next-term search: most terms (default 1), powers (default [−3, 3]), columns taken from the top of the ranking (default 3). */
  search?: { maxTerms?: number; powers?: [number, number]; top?: number; columns?: number };
  seed?: number;
  onProgress?: (e: RankProgress & { ranking: 'residual' | 'absolute residual' }) => void;
}

export interface NextTerm {
  /** The columns searched (leading the residual ranking; above the noise level when any are). */
  from: string[];
  search: SearchResult;
  /** The best candidate by selection BIC, or null when the search found none. */
  proposal: (Pick<SearchCandidate, 'terms' | 'coefs' | 'low' | 'high' | 'heldOutRmse' | 'formula'> & { terms: string[] }) | null;
  /** The next fit to try: the first formula's terms and the proposed ones. */
  nextTerms: string[] | null;
}

export interface ResidualResult {
  /** The first fit (without the per-row residuals). */
  fit: Omit<FitResult, 'residuals'>;
  /** Name of the residual column in the rankings (`residual`, or `residual_2`… when taken). */
  residualName: string;
  /** The columns ranked. */
  features: string[];
  ranking: RankResult;
  absolute: RankResult | null;
  next: NextTerm | null;
  /** Rows without a residual ('rows'), no column above the noise level ('noise'). */
  notes: Array<Note<'rows' | 'noise'>>;
}

function freeName(table: Table, base: string): string {
  const taken = new Set(table.columns.map((c) => c.name));
  if (!taken.has(base)) return base;
  for (let k = 2; ; k++) if (!taken.has(`${base}_${k}`)) return `${base}_${k}`;
}

function realColumn(name: string, n: number, rows: Int32Array, values: ArrayLike<number>, f: (v: number) => number = (v) => v): Column {
  const v = new Float64Array(n).fill(NaN);
  const missing = new Uint8Array(n).fill(1);
  rows.forEach((r, k) => {
    v[r] = f(values[k]!);
    missing[r] = 0;
  });
  return { name, kind: 'real', values: v, missing };
}

/** Fit, rank the remaining columns on the residual (and |residual|), and search the next term. */
export async function residualRanking(table: Table, spec: ResidualSpec): Promise<ResidualResult> {
  const seed = spec.seed ?? spec.rank?.seed ?? 1;
  const o = checkOptions<ResidualChecked & Record<string, unknown>>(RESIDUAL_OPTIONS, {
    intercept: spec.intercept,
    from: spec.from,
    absolute: spec.absolute,
    maxTerms: spec.search?.maxTerms,
    columns: spec.search?.columns,
  });
  const fitFull = fitRelation(table, { target: spec.target, terms: spec.terms, intercept: o.intercept, seed, keepResiduals: true });
  const { residuals, ...fit } = fitFull;
  const res = residuals!;
  const notes: ResidualResult['notes'] = [];
  const used = new Set([spec.target, ...spec.terms].flatMap((e) => expressionColumns(parseExpression(e))));
  const features =
    o.from ??
    table.columns.filter((c) => c.kind !== 'label' && !used.has(c.name)).map((c) => c.name);
  for (const f of features) {
    if (!table.columns.some((c) => c.name === f)) {
      throw new SurmiseError('residual.unknownColumn', `columns to rank: '${f}' is not a column of the table${didYouMean(f, table.columns.map((c) => c.name))}`, { option: 'from' });
    }
  }
  if (features.length === 0) {
    throw new SurmiseError('residual.noColumns', `no column is left to rank on the residual: the target and terms read every numeric column (${[...used].join(', ')})`, { option: 'from' });
  }
  const residualName = freeName(table, 'residual');
  const absName = freeName({ ...table, columns: [...table.columns, { name: residualName, kind: 'real', values: new Float64Array(0), missing: new Uint8Array(0) }] }, 'abs_residual');
  const withRes: Table = {
    ...table,
    columns: [...table.columns, realColumn(residualName, table.nRows, res.rows, res.values), realColumn(absName, table.nRows, res.rows, res.values, Math.abs)],
  };
  if (fit.n < table.nRows) notes.push({ kind: 'rows', text: `${table.nRows - fit.n} of ${table.nRows} rows have no residual (dropped by the fit) and are left out of the rankings` });
  const rankWith = (target: string, which: 'residual' | 'absolute residual') =>
    rankFeatures(withRes, {
      ...spec.rank,
      seed,
      target,
      features,
      task: 'regression',
      ...(spec.onProgress ? { onProgress: (e: RankProgress) => spec.onProgress!({ ...e, ranking: which }) } : {}),
    });
  const ranking = await rankWith(residualName, 'residual');
  const absolute = !o.absolute ? null : await rankWith(absName, 'absolute residual');

  // next term: the leading columns, those above the noise level when any are
  const k = o.columns;
  const above = ranking.ranking.filter((e) => e.aboveNoise);
  const lead = (above.length ? above : ranking.ranking).slice(0, k).map((e) => e.feature);
  if (ranking.noise && above.length === 0) notes.push({ kind: 'noise', text: 'no column lies above the noise level on the residual: the next-term search below ranges over the top columns anyway and is weak evidence' });
  let next: NextTerm | null = null;
  if (lead.length) {
    const search = searchRelations(withRes, {
      target: residualName,
      from: lead,
      maxTerms: o.maxTerms,
      powers: spec.search?.powers ?? [-3, 3],
      top: spec.search?.top ?? 5,
      seed,
    });
    const best = search.candidates[0];
    next = {
      from: lead,
      search,
      proposal: best ? { terms: best.terms, coefs: best.coefs, low: best.low, high: best.high, heldOutRmse: best.heldOutRmse, formula: best.formula } : null,
      nextTerms: best ? [...spec.terms, ...best.terms] : null,
    };
  }
  return { fit, residualName, features, ranking, absolute, next, notes };
}
