import { quantilesType7InPlace, QUANTILE_DEFINITION } from './quantile.ts';
import { stratify, stratumStats, type Stratification, type Stratum } from './strata.ts';
import { topK } from './topk.ts';
import type { Note } from '../util/note.ts';
import { slopeInterval } from './trend.ts';

/** Probabilities at which the ratio's quantiles are reported (upper form; the lower form mirrors them). */
export const UPPER_PROBABILITIES = [0.5, 0.9, 0.99, 0.999] as const;
export const LOWER_PROBABILITIES = [0.5, 0.1, 0.01, 0.001] as const;

/** Fitted log-log slope of one stratum statistic along `by`, with its 95% interval. */
export interface TrendLine {
  /** Least-squares slope of log(stratum statistic) on log(stratum centre) (or log(stratum rank)); null when undetermined. */
  slope: number | null;
  /** 95% interval of the slope (Student's t, strata − 2 degrees of freedom). */
  low: number | null;
  high: number | null;
  /** 'none': the interval contains 0 (or no slope could be fitted); 'up': the statistic increases towards high `by`; 'down': towards low `by`. */
  kind: 'none' | 'up' | 'down';
}

export interface Trend extends TrendLine {
  level: number;
  /** 'median': x = log of the median of `by` in each stratum; 'rank': x = log(1, 2, …) because `by` takes values ≤ 0. */
  basis: 'median' | 'rank';
  /** false when no slope could be tested (fewer than 3 strata, a stratum constant ≤ 0, one centre): kind is then 'none'. */
  determined: boolean;
  /** The same trend for a high stratum quantile of the ratio (upper form 0.9, lower form 0.1). */
  quantile: (TrendLine & { p: number }) | null;
  /** When the stratum constant trends: the rows beyond every stratum constant of the other half of `by`. */
  drivers: { rows: number; share: number; side: 'low' | 'high'; limit: number } | null;
  /** The verdict in words: starts with "no trend detected", "increasing towards high …" or "increasing towards low …". */
  verdict: string;
  /** Kept with every verdict. */
  caveat: string;
}

export const TREND_CAVEAT =
  'a trend towards a finite limit is still a trend, and "no trend detected" on this table is evidence, not a proof that a constant holds';

/**
 * A note of the bound stage: `kind` for code to choose on, `text` for people. nonPositive: the
 * upper constant is ≤ 0; noLowerBound: the smallest ratio is ≤ 0 in the lower form; tiedStrata,
 * fewRows: fewer strata than asked; rankBasis: `by` takes values ≤ 0; extremeStratum: the constant's
 * row sits in an end stratum of `by`; noBy: strata taken along the rhs; lhsNonPositive: rows the
 * right-hand-side search left out.
 */
export type BoundNote = Note<'nonPositive' | 'noLowerBound' | 'tiedStrata' | 'fewRows' | 'rankBasis' | 'extremeStratum' | 'noBy' | 'lhsNonPositive'>;

export interface ArrayBound {
  /** Upper form: c* = max ratio; lower form: min ratio. */
  constant: number;
  /** 0-based rows closest to the constant, best first. */
  witnessRows: Int32Array;
  quantiles: Array<{ p: number; value: number }>;
  quantileDefinition: string;
  strata: Stratum[];
  trend: Trend;
  /** Which end of `by` holds the overall constant's row, when it is an extreme stratum. */
  extremeStratum: 'lowest' | 'highest' | null;
  notes: BoundNote[];
}

export interface ArrayBoundOptions {
  /** Number of equal-count strata (≥ 1). */
  bins: number;
  /** Number of witness rows (≥ 0). */
  top: number;
  /** true: lhs ≤ c·rhs (c* = max ratio); false: lhs ≥ c·rhs (c* = min ratio). */
  upper: boolean;
  /** How `by` is called in verdicts. */
  byName: string;
}

/**
 * The numerical core of `bound` on plain arrays: for ratio = lhs/rhs on the rows `rows` (already
 * checked finite), the tightest constant with its witnesses, type-7 quantiles, equal-count strata
 * of `by` and the trend of the per-stratum constant. O(n log k) for witnesses, O(n) per quantile,
 * O(n log bins) for strata.
 */
export function boundArrays(
  ratio: Float64Array,
  by: Float64Array | null,
  rows: Int32Array,
  opts: ArrayBoundOptions,
): ArrayBound {
  const { upper, byName } = opts;
  const n = rows.length;
  if (n === 0) throw new RangeError('no rows to bound');
  const witnessRows = topK(ratio, rows, Math.max(1, opts.top), upper);
  const constant = ratio[witnessRows[0]!]!;
  const used = new Float64Array(n);
  for (let t = 0; t < n; t++) used[t] = ratio[rows[t]!]!;
  const ps = upper ? UPPER_PROBABILITIES : LOWER_PROBABILITIES;
  const qv = quantilesType7InPlace(used, ps); // `used` is our scratch copy
  const quantiles = ps.map((p, i) => ({ p, value: qv[i]! }));
  const notes: BoundNote[] = [];
  if (upper && constant <= 0) notes.push({ kind: 'nonPositive', text: `c* = ${constant} ≤ 0: lhs ≤ 0 on every row used, so lhs ≤ c·rhs holds for every c ≥ ${constant}` });
  if (!upper && constant <= 0) notes.push({ kind: 'noLowerBound', text: `the smallest ratio is ${constant} ≤ 0: lhs ≥ c·rhs gives no positive lower bound` });

  let strata: Stratum[] = [];
  let trend: Trend = undetermined('no stratifying expression', 'median');
  let extremeStratum: ArrayBound['extremeStratum'] = null;
  if (by) {
    const along = trendAlong(ratio, stratify(by, rows, opts.bins), { upper, byName, bins: opts.bins }, witnessRows[0]!);
    ({ strata, trend, extremeStratum } = along);
    notes.push(...along.notes);
  }
  return { constant, witnessRows, quantiles, quantileDefinition: QUANTILE_DEFINITION, strata, trend, extremeStratum, notes };
}

/**
 * Per-stratum constants of `ratio` along a fixed stratification, their trend (maximum and high
 * quantile), and notes: ties that merged strata, a `by` with values ≤ 0 (rank basis), and whether
 * the overall witness `topRow` sits in an extreme stratum.
 */
export function trendAlong(
  ratio: Float64Array,
  st: Stratification,
  opts: { upper: boolean; byName: string; bins: number },
  topRow: number,
): { strata: Stratum[]; trend: Trend; extremeStratum: 'lowest' | 'highest' | null; notes: BoundNote[] } {
  const { upper, byName, bins } = opts;
  const { by, rows } = st;
  const n = rows.length;
  const notes: BoundNote[] = [];
  const { strata, q } = stratumStats(st, ratio, upper, upper ? 0.9 : 0.1);
  const k = strata.length;
  const kWord = `${k} ${k === 1 ? 'stratum' : 'strata'}`;
  if (k < Math.min(bins, n)) {
    notes.push({ kind: 'tiedStrata', text: `${byName} has tied values, which are never split between strata: ${kWord} instead of ${Math.min(bins, n)}${k > 1 ? ', of unequal size' : ''}` });
  } else if (n < bins) {
    notes.push({ kind: 'fewRows', text: `only ${n} rows: ${kWord} instead of ${bins}` });
  }
  let byMin = Infinity;
  for (let t = 0; t < n; t++) byMin = Math.min(byMin, by[rows[t]!]!);
  const basis: Trend['basis'] = byMin > 0 ? 'median' : 'rank';
  if (basis === 'rank') notes.push({ kind: 'rankBasis', text: `${byName} takes values ≤ 0 (min ${byMin}), so the trend uses log of the stratum rank instead of log of its median` });
  const trend = fitTrend(strata, basis, upper, byName, q, { ratio, by, rows });
  let extremeStratum: 'lowest' | 'highest' | null = null;
  const s = strata.findIndex((x) => x.witness === topRow);
  if (k >= 2 && s === 0) extremeStratum = 'lowest';
  if (k >= 2 && s === k - 1) extremeStratum = 'highest';
  if (extremeStratum) {
    const x = strata[s]!;
    notes.push({ kind: 'extremeStratum', text: `the overall ${upper ? 'maximum' : 'minimum'} ratio sits in the ${extremeStratum} stratum of ${byName} (${fmt(x.low)} ≤ ${byName} ≤ ${fmt(x.high)})` });
  }
  return { strata, trend, extremeStratum, notes };
}

/** One log-log trend line of per-stratum values (all > 0). */
function trendLine(xs: number[], values: number[]): TrendLine | null {
  if (values.some((v) => !(v > 0))) return null;
  const fit = slopeInterval(xs, values.map(Math.log), 0.95);
  if (!fit) return null;
  const kind = fit.low > 0 ? 'up' : fit.high < 0 ? 'down' : 'none';
  return { slope: fit.slope, low: fit.low, high: fit.high, kind };
}

function fitTrend(
  strata: Stratum[],
  basis: Trend['basis'],
  upper: boolean,
  byName: string,
  q: { p: number; values: number[] },
  data: { ratio: Float64Array; by: Float64Array; rows: Int32Array },
): Trend {
  if (strata.length < 3) return undetermined(`only ${strata.length} ${strata.length === 1 ? 'stratum' : 'strata'}: at least 3 are needed for a slope interval`, basis);
  const bad = strata.filter((s) => !(s.constant > 0)).length;
  if (bad > 0) return undetermined(`${bad} strata have a constant ≤ 0, so log(constant) is undefined`, basis);
  const x = strata.map((s, i) => Math.log(basis === 'median' ? s.centre : i + 1));
  const line = trendLine(x, strata.map((s) => s.constant));
  if (!line) return undetermined(`every stratum has the same centre of ${byName}`, basis);
  const ql = trendLine(x, q.values);
  const stat = upper ? 'stratum maximum' : 'stratum minimum';
  const what = basis === 'median' ? `log-log slope of the ${stat} on the median of ${byName}` : `slope of log(${stat}) on log(stratum rank)`;
  const cs = strata.map((s) => s.constant);
  const ci = `${fmt(line.slope!)}, 95% interval [${fmt(line.low!)}, ${fmt(line.high!)}]`;
  const parts = [`${what} ${ci}; ${stat} from ${fmt(Math.min(...cs))} to ${fmt(Math.max(...cs))}`];
  let drivers: Trend['drivers'] = null;
  if (line.kind !== 'none') {
    drivers = findDrivers(strata, line.kind, upper, data);
    const cmp = drivers.side === 'low' ? '≤' : '≥';
    parts.push(`set by ${drivers.rows} ${drivers.rows === 1 ? 'row' : 'rows'} (${fmtShare(drivers.share)}) with ${byName} ${cmp} ${fmt(drivers.limit)} beyond every ${stat} of the other half`);
  }
  if (ql) parts.push(`${q.p} quantile: ${words(ql.kind, byName)} (slope ${fmt(ql.slope!)}, [${fmt(ql.low!)}, ${fmt(ql.high!)}])`);
  return {
    ...line,
    level: 0.95,
    basis,
    determined: true,
    quantile: ql ? { ...ql, p: q.p } : null,
    drivers,
    verdict: `${words(line.kind, byName)} (${parts.join('; ')})`,
    caveat: TREND_CAVEAT,
  };
}

function words(kind: TrendLine['kind'], byName: string): string {
  return kind === 'none' ? `no trend detected along ${byName}` : `increasing towards ${kind === 'up' ? 'high' : 'low'} ${byName}`;
}

function fmtShare(s: number): string {
  return `${Number((100 * s).toPrecision(2))}% of rows`;
}

/**
 * The rows that make the stratum constant trend: at the worse end of `by` (upper form: where the
 * maximum is larger; lower form: where the minimum is smaller), the rows whose ratio lies beyond
 * every stratum constant of the other half, with the `by` value that bounds them.
 */
function findDrivers(
  strata: Stratum[],
  kind: 'up' | 'down',
  upper: boolean,
  { ratio, by, rows }: { ratio: Float64Array; by: Float64Array; rows: Int32Array },
): NonNullable<Trend['drivers']> {
  const side: 'low' | 'high' = (kind === 'up') === upper ? 'high' : 'low';
  const half = Math.floor(strata.length / 2);
  const other = side === 'high' ? strata.slice(0, half) : strata.slice(strata.length - half);
  const ref = upper ? Math.max(...other.map((s) => s.constant)) : Math.min(...other.map((s) => s.constant));
  let count = 0;
  let limit = side === 'low' ? -Infinity : Infinity;
  for (let t = 0; t < rows.length; t++) {
    const r = rows[t]!;
    const v = ratio[r]!;
    if (upper ? v > ref : v < ref) {
      count++;
      const b = by[r]!;
      if (side === 'low' ? b > limit : b < limit) limit = b;
    }
  }
  return { rows: count, share: count / rows.length, side, limit };
}

function undetermined(reason: string, basis: Trend['basis']): Trend {
  return {
    slope: null,
    low: null,
    high: null,
    kind: 'none',
    level: 0.95,
    basis,
    determined: false,
    quantile: null,
    drivers: null,
    verdict: `no trend detected: not testable, ${reason}`,
    caveat: TREND_CAVEAT,
  };
}

/** Short numeric display: `digits` significant figures (default 4). */
export function fmt(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1);
}
