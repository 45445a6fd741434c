import { quantilesType7InPlace, QUANTILE_DEFINITION } from './quantile.ts';
import { equalCountStrata, type Stratum } from './strata.ts';
import { topK } from './topk.ts';
import { slopeInterval } from './trend.ts';

/** Probabilities at which the ratio's quantiles are reported (upper form; the lower form mirrors them). */
export const UPPER_PROBABILITIES = [0.5, 0.9, 0.99, 0.999] as const;
export const LOWER_PROBABILITIES = [0.5, 0.1, 0.01, 0.001] as const;

export interface Trend {
  /** Least-squares slope of log(stratum constant) on log(stratum centre) (or log(stratum rank)). */
  slope: number | null;
  /** 95% interval of the slope (Student's t, strata − 2 degrees of freedom). */
  low: number | null;
  high: number | null;
  level: number;
  /** 'median': x = log of the median of `by` in each stratum; 'rank': x = log(1, 2, …) because `by` takes values ≤ 0. */
  basis: 'median' | 'rank';
  /** 'bounded': the slope interval contains 0; 'unbounded': the constant worsens (grows, or shrinks in the lower form) along one direction of `by`. */
  kind: 'bounded' | 'unbounded' | 'undetermined';
  /** Direction of `by` in which the constant worsens (upper form: grows; lower form: shrinks). */
  direction: 'increasing' | 'decreasing' | null;
  /** The verdict in words. */
  verdict: string;
}

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
  notes: string[];
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
  const notes: string[] = [];
  if (upper && constant <= 0) notes.push(`c* = ${constant} ≤ 0: lhs ≤ 0 on every row used, so lhs ≤ c·rhs holds for every c ≥ ${constant}`);
  if (!upper && constant <= 0) notes.push(`the smallest ratio is ${constant} ≤ 0: lhs ≥ c·rhs gives no positive lower bound`);

  let strata: Stratum[] = [];
  let trend: Trend = undetermined('no stratifying expression', 'median');
  let extremeStratum: ArrayBound['extremeStratum'] = null;
  if (by) {
    strata = equalCountStrata(by, ratio, rows, opts.bins, upper);
    const k = strata.length;
    const kWord = `${k} ${k === 1 ? 'stratum' : 'strata'}`;
    if (k < Math.min(opts.bins, n)) {
      notes.push(`${byName} has tied values, which are never split between strata: ${kWord} instead of ${Math.min(opts.bins, n)}${k > 1 ? ', of unequal size' : ''}`);
    } else if (n < opts.bins) {
      notes.push(`only ${n} rows: ${kWord} instead of ${opts.bins}`);
    }
    let byMin = Infinity;
    for (let t = 0; t < n; t++) byMin = Math.min(byMin, by[rows[t]!]!);
    const basis: Trend['basis'] = byMin > 0 ? 'median' : 'rank';
    if (basis === 'rank') notes.push(`${byName} takes values ≤ 0 (min ${byMin}), so the trend uses log of the stratum rank instead of log of its median`);
    trend = fitTrend(strata, basis, upper, byName);
    const s = strata.findIndex((st) => st.witness === witnessRows[0]);
    if (strata.length >= 2 && s === 0) extremeStratum = 'lowest';
    if (strata.length >= 2 && s === strata.length - 1) extremeStratum = 'highest';
    if (extremeStratum) {
      const st = strata[s]!;
      notes.push(
        `the overall ${upper ? 'maximum' : 'minimum'} ratio sits in the ${extremeStratum} stratum of ${byName} (${fmt(st.low)} ≤ ${byName} ≤ ${fmt(st.high)})`,
      );
    }
  }
  return { constant, witnessRows, quantiles, quantileDefinition: QUANTILE_DEFINITION, strata, trend, extremeStratum, notes };
}

function fitTrend(strata: Stratum[], basis: Trend['basis'], upper: boolean, byName: string): Trend {
  if (strata.length < 3) return undetermined(`only ${strata.length} ${strata.length === 1 ? 'stratum' : 'strata'}: at least 3 are needed for a slope interval`, basis);
  const bad = strata.filter((s) => !(s.constant > 0)).length;
  if (bad > 0) return undetermined(`${bad} strata have a constant ≤ 0, so log(constant) is undefined`, basis);
  const x = strata.map((s, i) => Math.log(basis === 'median' ? s.centre : i + 1));
  const y = strata.map((s) => Math.log(s.constant));
  const fit = slopeInterval(x, y, 0.95);
  if (!fit) return undetermined(`every stratum has the same centre of ${byName}`, basis);
  const what = basis === 'median' ? `log-log slope of the stratum constant on the median of ${byName}` : `slope of log(stratum constant) on log(stratum rank)`;
  const cs = strata.map((s) => s.constant);
  const spread = `; stratum c* from ${fmt(Math.min(...cs))} to ${fmt(Math.max(...cs))}`;
  const ci = `${fmt(fit.slope)}, 95% interval [${fmt(fit.low)}, ${fmt(fit.high)}]`;
  const base = { slope: fit.slope, low: fit.low, high: fit.high, level: 0.95, basis };
  if (fit.low <= 0 && fit.high >= 0) {
    return { ...base, kind: 'bounded', direction: null, verdict: `bounded: no trend along ${byName} (${what} ${ci} contains 0${spread})` };
  }
  // upper form worsens where the constant grows; lower form where it shrinks
  const rising = fit.low > 0;
  const direction = rising === upper ? 'increasing' : 'decreasing';
  const verb = upper ? 'grows' : 'shrinks';
  const words = direction === 'increasing' ? `${verb} along ${byName}` : `${verb} as ${byName} decreases`;
  return { ...base, kind: 'unbounded', direction, verdict: `${words} (${what} ${ci} excludes 0${spread})` };
}

function undetermined(reason: string, basis: Trend['basis']): Trend {
  return { slope: null, low: null, high: null, level: 0.95, basis, kind: 'undetermined', direction: null, verdict: `undetermined: ${reason}` };
}

/** Short numeric display: `digits` significant figures (default 4). */
export function fmt(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1);
}
