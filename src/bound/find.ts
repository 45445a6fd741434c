import { checkOptions } from '../util/option-table.ts';
import { BOUND_OPTIONS, type BoundForm } from './options.ts';
import { SurmiseError } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { boundArrays, fmt, type BoundNote, type Trend } from './core.ts';
import { affineEnvelope } from './affine.ts';
import { realColumn, withDerived, type DeriveSpec, type RealValues } from '../table/expr/index.ts';
import { idColumns, labelsOf, lineOf } from './inputs.ts';
import { ratioPoints, type RatioPoints } from './points.ts';
import { deriveSeed } from '../util/rng.ts';
import { ROW_KEPT, ROW_MISSING, ROW_NON_FINITE, validRows } from '../table/dataset-rows.ts';
import type { RowDrops } from '../table/dataset-types.ts';

/** What to bound: lhs ≤ c·rhs (or lhs ≥ c·rhs with `lower`), for each rhs candidate. */
export interface BoundSpec {
  /** Expression for the left-hand side (the table's expression language). */
  lhs: string;
  /** One or more candidate right-hand sides; each must be > 0 on the rows used. */
  rhs: string | readonly string[];
  /** Expression to stratify by; when omitted each candidate is stratified by its own rhs. */
  by?: string;
  /** Equal-count strata (integer ≥ 1, default 10). */
  bins?: number;
  /** Witness rows per candidate (integer ≥ 1, default 5). */
  top?: number;
  /** Columns shown beside witness rows; default every label column. */
  id?: readonly string[];
  /** Drop (and count) rows with a missing cell, a non-finite value or rhs ≤ 0 instead of refusing them. */
  skipInvalid?: boolean;
  /** The lower form lhs ≥ c·rhs: c* is the smallest ratio. */
  lower?: boolean;
  /** Derived columns, added in order before anything is evaluated (the table is not changed). */
  derive?: readonly DeriveSpec[];
  /** 'ratio' (default): lhs ≤ c·rhs; 'affine': also lhs ≤ c·rhs + d; 'two-sided': also c₁·rhs + d₁ ≤ lhs ≤ c₂·rhs + d₂. */
  form?: BoundForm;
}

export { BOUND_FORMS, BOUND_LIMITS, type BoundForm } from './options.ts';

/** An affine bound with its rows closest to equality. */
export interface AffineBound {
  form: 'upper' | 'lower';
  /** c in lhs ≤ c·rhs + d (lower: ≥) */
  slope: number;
  /** d */
  offset: number;
  meanGap: number;
  atLimit: boolean;
  witnesses: BoundWitness[];
}

/** Rows not used, by first reason: the row policy's (missing cell, then non-finite value), then rhs ≤ 0. */
export interface DropCounts extends RowDrops {
  rhsNonPositive: number;
}

/** The bound's own reason after the row policy's ROW_MISSING and ROW_NON_FINITE. */
const RHS_NON_POSITIVE = 3;

export interface BoundWitness {
  /** 1-based data row of the table (the header is not counted). */
  row: number;
  /** 1-based line of the source file where the row starts, when known. */
  line: number | null;
  /** The id/label columns of the row. */
  labels: Record<string, string | number | null>;
  lhs: number;
  rhs: number;
  ratio: number;
  /** The stratifying value of the row. */
  by: number;
}

export interface BoundStratum {
  low: number;
  high: number;
  n: number;
  constant: number;
  /** Median of `by` in the stratum. */
  centre: number;
  /** 1-based data row attaining the stratum's constant. */
  row: number;
}

export interface BoundCandidate {
  rhs: string;
  /** The expression the strata are taken along. */
  by: string;
  /** Upper form: max lhs/rhs; lower form: min lhs/rhs. */
  constant: number;
  /** Rows used. */
  n: number;
  dropped: DropCounts;
  witnesses: BoundWitness[];
  quantiles: Array<{ p: number; value: number }>;
  quantileDefinition: string;
  strata: BoundStratum[];
  trend: Trend;
  extremeStratum: 'lowest' | 'highest' | null;
  /** With form 'affine' (one side, by --lower) or 'two-sided' (both sides). */
  affine?: AffineBound[];
  notes: BoundNote[];
  /** The ratio against `by` on the rows used, for plotting (at most PLOT_POINTS, sampled with a fixed seed). */
  points: RatioPoints;
}

export interface BoundResult {
  source: string;
  lhs: string;
  /** The --by expression, or null when each candidate is stratified by its own rhs. */
  by: string | null;
  form: 'upper' | 'lower';
  /** Rows in the table. */
  n: number;
  /** Rows dropped for at least one candidate (only with skipInvalid; otherwise such rows are refused). */
  dropped: DropCounts;
  results: BoundCandidate[];
}

const SHOW_FIRST = 5;

/**
 * Tightest constants of lhs ≤ c·rhs (or ≥ with `lower`) on a table, for each rhs candidate: the
 * constant, the rows closest to it, quantiles of the ratio, per-stratum constants along `by` and
 * their log-log trend. Evidence on this table, not a proof.
 */
export function findBound(table: Table, spec: BoundSpec): BoundResult {
  const opts = checkSpec(spec);
  table = withDerived(table, spec.derive ?? []);
  const upper = !opts.lower;
  const lhs = realColumn(table, opts.lhs, 'lhs');
  const byVal = opts.by === null ? null : realColumn(table, opts.by, 'by');
  const idCols = idColumns(table, opts.id);
  const n = table.nRows;
  const reasonOf = new Uint8Array(n); // first reason across candidates: ROW_KEPT, ROW_MISSING, ROW_NON_FINITE, RHS_NON_POSITIVE
  const results: BoundCandidate[] = [];
  for (const rhsSrc of opts.rhs) {
    const rhs = realColumn(table, rhsSrc, 'rhs');
    const by = byVal ?? rhs;
    const byName = opts.by ?? rhsSrc;
    const ratio = new Float64Array(n);
    const rows = new Int32Array(n);
    let m = 0;
    const dropped: DropCounts = { missing: 0, nonFinite: 0, rhsNonPositive: 0, total: 0 };
    const bad: number[] = [];
    // the shared row policy (missing, then not finite), then the bound's own reason rhs ≤ 0
    const policy = validRows(n, [lhs, rhs, by].map((v, k) => ({ name: String(k), parts: [v.values], missing: v.missing })));
    for (let i = 0; i < n; i++) {
      const l = lhs.values[i]!;
      const r = rhs.values[i]!;
      let reason: number = policy.reason[i]!;
      if (reason === ROW_KEPT && !(r > 0)) reason = RHS_NON_POSITIVE;
      else if (reason === ROW_KEPT && !Number.isFinite(l / r)) reason = ROW_NON_FINITE; // rhs so small that the ratio overflows
      if (reason === ROW_KEPT) {
        ratio[i] = l / r;
        rows[m++] = i;
        continue;
      }
      if (reason === ROW_MISSING) dropped.missing++;
      else if (reason === ROW_NON_FINITE) dropped.nonFinite++;
      else dropped.rhsNonPositive++;
      dropped.total++;
      if (reasonOf[i] === ROW_KEPT || reason < reasonOf[i]!) reasonOf[i] = reason;
      if (bad.length < SHOW_FIRST) bad.push(i);
    }
    if (dropped.total > 0 && !opts.skipInvalid) refuse(table, opts.lhs, rhsSrc, opts.by, upper, dropped, bad, lhs, rhs, byVal);
    if (m === 0) {
      throw new SurmiseError('bound.noRows', `${table.source}: no row is left to bound ${opts.lhs} by ${rhsSrc} (${dropped.total} rows dropped)`);
    }
    const used = rows.subarray(0, m);
    const witnessOf = (i: number): BoundWitness => ({
      row: i + 1,
      line: table.lines ? table.lines[i]! : null,
      labels: labelsOf(idCols, i),
      lhs: lhs.values[i]!,
      rhs: rhs.values[i]!,
      ratio: ratio[i]!,
      by: by.values[i]!,
    });
    const sides = opts.form === 'ratio' ? [] : opts.form === 'two-sided' ? [true, false] : [upper];
    const affine = sides.map((up): AffineBound => {
      const a = affineEnvelope(lhs.values, rhs.values, used, up, opts.top);
      return { form: a.form, slope: a.slope, offset: a.offset, meanGap: a.meanGap, atLimit: a.atLimit, witnesses: Array.from(a.witnessRows, witnessOf) };
    });
    const core = boundArrays(ratio, by.values, used, { bins: opts.bins, top: opts.top, upper, byName });
    if (opts.by === null) core.notes.push({ kind: 'noBy', text: `no stratifying expression (by) given: strata are taken along the rhs ${rhsSrc}` });
    const rowNo = (i: number) => i + 1;
    results.push({
      rhs: rhsSrc,
      by: byName,
      constant: core.constant,
      n: m,
      dropped,
      witnesses: Array.from(core.witnessRows, witnessOf),
      quantiles: core.quantiles,
      quantileDefinition: core.quantileDefinition,
      strata: core.strata.map((s) => ({ low: s.low, high: s.high, n: s.n, constant: s.constant, centre: s.centre, row: rowNo(s.witness) })),
      trend: core.trend,
      extremeStratum: core.extremeStratum,
      ...(affine.length ? { affine } : {}),
      notes: core.notes,
      points: ratioPoints(ratio, by.values, used, upper, deriveSeed(0, 'bound', 'plot')),
    });
  }
  const dropped: DropCounts = { missing: 0, nonFinite: 0, rhsNonPositive: 0, total: 0 };
  for (let i = 0; i < n; i++) {
    const r = reasonOf[i]!;
    if (r === ROW_KEPT) continue;
    dropped.total++;
    if (r === ROW_MISSING) dropped.missing++;
    else if (r === ROW_NON_FINITE) dropped.nonFinite++;
    else dropped.rhsNonPositive++;
  }
  return { source: table.source, lhs: opts.lhs, by: opts.by, form: upper ? 'upper' : 'lower', n, dropped, results };
}

interface CheckedSpec {
  lhs: string;
  rhs: string[];
  by: string | null;
  bins: number;
  top: number;
  id: string[] | null;
  skipInvalid: boolean;
  lower: boolean;
  form: BoundForm;
}

/** Options checked once, against one table of constraints. */
function checkSpec(spec: BoundSpec): CheckedSpec {
  const rhs = typeof spec.rhs === 'string' ? [spec.rhs] : [...(spec.rhs ?? [])];
  if (typeof spec.lhs !== 'string' || spec.lhs.trim() === '') throw new SurmiseError('bound.badOption', 'expected lhs to be an expression, got nothing');
  if (rhs.length === 0) throw new SurmiseError('bound.badOption', 'expected at least one rhs expression, got none');
  for (const r of rhs) if (typeof r !== 'string' || r.trim() === '') throw new SurmiseError('bound.badOption', 'expected every rhs to be an expression, got an empty one');
  const o = checkOptions<Omit<CheckedSpec, 'lhs' | 'rhs'>>(BOUND_OPTIONS, spec as unknown as Record<string, unknown>);
  return { lhs: spec.lhs, rhs, ...o };
}

function refuse(
  table: Table,
  lhsSrc: string,
  rhsSrc: string,
  bySrc: string | null,
  upper: boolean,
  d: DropCounts,
  bad: number[],
  lhs: RealValues,
  rhs: RealValues,
  by: RealValues | null,
): never {
  const parts: string[] = [];
  if (d.rhsNonPositive) parts.push(`${d.rhsNonPositive} with rhs ≤ 0`);
  if (d.nonFinite) parts.push(`${d.nonFinite} with a value that is not finite`);
  if (d.missing) parts.push(`${d.missing} with a missing cell`);
  const show = (v: RealValues, i: number) => (v.missing[i] ? 'missing' : fmt(v.values[i]!));
  const first = bad
    .map((i) => `row ${i + 1}${lineOf(table, i)}: lhs = ${show(lhs, i)}, rhs = ${show(rhs, i)}${by ? `, by = ${show(by, i)}` : ''}`)
    .join('; ');
  const code = d.rhsNonPositive > 0 ? 'bound.badRhs' : 'bound.invalidRows';
  throw new SurmiseError(
    code,
    `${table.source}: ${d.total} of ${table.nRows} rows cannot be used for ${lhsSrc} ${upper ? '≤' : '≥'} c·(${rhsSrc})${bySrc ? ` along ${bySrc}` : ''} ` +
      `(${parts.join(', ')}); first: ${first}. With \`skipInvalid\` they are dropped and counted instead`,
    { counts: d, rows: bad.map((i) => i + 1), option: 'skipInvalid' },
  );
}
