import { fitGpd, gpdProfileLogLik } from './gpd.ts';
import { selectValues } from './select.ts';

/** An estimate of the supremum (upper form) or infimum (lower form) of the ratio from its tail. */
export interface SupremumEstimate {
  /** Endpoint of the fitted generalized Pareto law, u − σ/ξ (lower form: the mirrored infimum). */
  estimate: number;
  /** Profile-likelihood interval; `high` (lower form: `low`) is null when the interval is unbounded. */
  low: number | null;
  high: number | null;
  level: number;
  /** Fitted shape ξ (< 0 here) and scale σ of the exceedances over `threshold`. */
  shape: number;
  scale: number;
  threshold: number;
  exceedances: number;
}

export interface SupremumResult {
  estimate: SupremumEstimate | null;
  /** Why there is no estimate, or what to keep in mind about it. */
  note: string;
  method: string;
}

export const SUPREMUM_METHOD =
  'peaks over a threshold with a maximum-likelihood generalized Pareto fit (Pickands 1975; de Haan & Ferreira, Extreme Value Theory, 2006, ch. 3–4), endpoint u − σ/ξ when ξ < 0, 95% profile-likelihood interval';

/** χ²₁ 0.95 quantile / 2: the drop in log-likelihood that bounds a 95% profile interval (Wilks). */
const HALF_CHI2_95 = 3.841458820694124 / 2;
/** Fewest exceedances we fit to. */
export const MIN_EXCEEDANCES = 30;

/**
 * Default number of exceedances: a tenth of the rows, at most 1000 (our choice; common practice
 * takes the top few percent, trading bias from a low threshold against variance from few points).
 */
export function defaultExceedances(n: number): number {
  return Math.min(1000, Math.floor(n / 10));
}

/**
 * Estimate of the supremum of `values[rows]` (with `upper: false`, the infimum) by peaks over a
 * threshold: the k largest values above the (k+1)-th largest u are fitted by a generalized Pareto
 * law; a negative shape ξ gives a finite endpoint u − σ/ξ (de Haan & Ferreira 2006, §3.6 and §4.5).
 * The interval is the set of endpoints e whose profile log-likelihood — Grimshaw's profile at
 * θ = −1/(e − u), which maximises over ξ for that endpoint — lies within χ²₁,₀.₉₅/2 of the maximum; it
 * never starts below the largest observed value and is open above (null) when the exponential law
 * (ξ = 0, no endpoint) is within the same distance. With ξ ≥ 0 no finite supremum is suggested.
 */
export function estimateSupremum(values: Float64Array, rows: Int32Array, opts: { upper: boolean; exceedances?: number }): SupremumResult {
  const n = rows.length;
  const k = opts.exceedances ?? defaultExceedances(n);
  const method = SUPREMUM_METHOD;
  if (k < MIN_EXCEEDANCES || n < k + 1) {
    return { estimate: null, note: `too few rows for a tail fit (${n} rows; at least ${MIN_EXCEEDANCES} exceedances over a threshold are needed)`, method };
  }
  const s = opts.upper ? 1 : -1;
  const a = new Float64Array(n);
  for (let t = 0; t < n; t++) a[t] = s * values[rows[t]!]!;
  selectValues(a, 0, n - 1, n - k - 1);
  const u = a[n - k - 1]!;
  const y = new Float64Array(k);
  let m = 0;
  let ymax = 0;
  for (let t = n - k; t < n; t++) {
    const e = a[t]! - u;
    if (e > 0) {
      y[m++] = e;
      if (e > ymax) ymax = e;
    }
  }
  if (m < MIN_EXCEEDANCES) {
    return { estimate: null, note: `the top ${k} values are mostly tied at ${s * u}: no tail to fit (the constant is attained by many rows)`, method };
  }
  const ex = y.subarray(0, m);
  const fit = fitGpd(ex);
  const what = opts.upper ? 'supremum' : 'infimum';
  if (!(fit.shape < 0) || !(fit.theta < 0)) {
    return { estimate: null, note: `no finite ${what} suggested: the fitted tail shape ξ = ${fit.shape.toPrecision(3)} ≥ 0 (a tail without an endpoint)`, method };
  }
  const endpoint = u - 1 / fit.theta;
  const profile = (e: number): number => gpdProfileLogLik(ex, -1 / (e - u)).logLik;
  const cut = fit.logLik - HALF_CHI2_95;
  // lower end: between the largest observation and the estimate
  const top = u + ymax;
  let low: number;
  if (profile(top * (1 + 1e-15) + 1e-300) >= cut || endpoint <= top) low = top;
  else low = bisect(profile, top, endpoint, cut);
  // upper end: open when the exponential law is within reach
  let high: number | null;
  const expLogLik = gpdProfileLogLik(ex, 0).logLik;
  if (expLogLik >= cut) high = null;
  else {
    let far = endpoint + (endpoint - u);
    for (let i = 0; i < 200 && profile(far) >= cut; i++) far = u + 2 * (far - u);
    high = profile(far) >= cut ? null : bisect(profile, endpoint, far, cut);
  }
  const est: SupremumEstimate = opts.upper
    ? { estimate: endpoint, low, high, level: 0.95, shape: fit.shape, scale: fit.scale, threshold: u, exceedances: m }
    : { estimate: -endpoint, low: high === null ? null : -high, high: -low, level: 0.95, shape: fit.shape, scale: fit.scale, threshold: -u, exceedances: m };
  const open = high === null ? `; the interval is open ${opts.upper ? 'above' : 'below'} (a tail without endpoint fits almost as well)` : '';
  return { estimate: est, note: `fitted tail shape ξ = ${fit.shape.toPrecision(3)} < 0 over the ${m} largest${opts.upper ? '' : ' (lower form: smallest)'} values${open}`, method };
}

/** The crossing of f with `level` between x0 (f ≥ level side or below) and x1, by bisection. */
function bisect(f: (x: number) => number, x0: number, x1: number, level: number): number {
  const above0 = f(x0) >= level;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (x0 + x1);
    if (mid === x0 || mid === x1) break;
    if (f(mid) >= level === above0) x0 = mid;
    else x1 = mid;
  }
  return 0.5 * (x0 + x1);
}
