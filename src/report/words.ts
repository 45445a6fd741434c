import type { ReportFitTerm, ReportWitness } from './types.ts';
import { formatNumber } from './format.ts';

/**
 * Small pieces of wording shared by the summary and the sections: metric direction, equations,
 * witness labels.
 */

const HIGHER_IS_BETTER = new Set(['r2', 'rsquared', 'accuracy', 'balancedaccuracy', 'auc', 'rocauc', 'f1', 'explainedvariance']);
const LOWER_IS_BETTER = new Set(['rmse', 'mse', 'mae', 'logloss', 'crossentropy', 'error', 'errorrate', 'brier']);

/** +1 when a larger score is better, −1 when smaller is, 0 when the metric is not known. */
export function metricDirection(metric: string): 1 | -1 | 0 {
  const k = metric.toLowerCase().replace(/²/g, '2').replace(/[^a-z0-9]/g, '');
  if (HIGHER_IS_BETTER.has(k)) return 1;
  if (LOWER_IS_BETTER.has(k)) return -1;
  return 0;
}

/** A readable metric name. */
export function metricLabel(metric: string): string {
  const k = metric.toLowerCase().replace(/[^a-z0-9]/g, '');
  if (k === 'r2' || k === 'rsquared') return 'R²';
  if (k === 'rmse' || k === 'mse' || k === 'mae' || k === 'auc') return k.toUpperCase();
  return metric;
}

/**
 * How a score compares with a baseline: 'better', 'same' or 'worse'. Margins (common practice,
 * our choice): 0.02 absolute for higher-is-better metrics (they live in [0, 1]), 5 % relative
 * for error metrics.
 */
export function compareScore(score: number, baseline: number, direction: 1 | -1): 'better' | 'same' | 'worse' {
  if (!Number.isFinite(score) || !Number.isFinite(baseline)) return 'same';
  if (direction === 1) {
    if (score > baseline + 0.02) return 'better';
    if (score < baseline - 0.02) return 'worse';
    return 'same';
  }
  const tol = 0.05 * Math.max(Math.abs(baseline), 1e-300);
  if (score < baseline - tol) return 'better';
  if (score > baseline + tol) return 'worse';
  return 'same';
}

const INTERCEPT = new Set(['1', 'intercept', '(intercept)', 'const', 'constant']);

export function isIntercept(term: string): boolean {
  return INTERCEPT.has(term.trim().toLowerCase());
}

/**
 * "target ≈ c₁*t₁ + c₂*t₂ + c₀" (one multiplication sign, the expression language's `*`) from fitted terms; with `rational`, coefficients are the
 * fractions found by the fit (terms whose fraction is 0 are left out), else 4 significant figures.
 * Returns null in rational mode when some term has no fraction.
 */
export function equation(target: string, terms: readonly ReportFitTerm[], rational: boolean): string | null {
  const parts: Array<{ sign: 1 | -1; body: string }> = [];
  for (const t of terms) {
    let mag: string;
    let sign: 1 | -1;
    if (rational) {
      if (t.rational === null) return null;
      const txt = t.rational.text.trim();
      if (/^[-−]?0$/.test(txt)) continue;
      sign = /^[-−]/.test(txt) ? -1 : 1;
      mag = txt.replace(/^[-−]\s*/, '');
    } else {
      sign = t.coef < 0 ? -1 : 1;
      mag = formatNumber(Math.abs(t.coef));
    }
    const factor = /[/\s]/.test(mag) ? `(${mag})` : mag;
    const body = isIntercept(t.term) ? mag : mag === '1' ? t.term : `${factor}*${wrap(t.term)}`;
    parts.push({ sign, body });
  }
  if (parts.length === 0) return `${target} ≈ 0`;
  const rhs = parts
    .map((p, k) => (k === 0 ? (p.sign < 0 ? `-${p.body}` : p.body) : `${p.sign < 0 ? ' - ' : ' + '}${p.body}`))
    .join('');
  return `${target} ≈ ${rhs}`;
}

/** A search candidate's fitted right-hand side with 4-figure coefficients, e.g. `2*k + 4e-4*b`. */
export function candidateExpression(terms: readonly string[], coefs: readonly number[]): string {
  const eq = equation(
    '',
    terms.map((term, k) => ({ term, coef: coefs[k] ?? NaN, se: NaN, low: NaN, high: NaN, rational: null })),
    false,
  )!;
  return eq.replace(/^ ≈ /, '');
}

function wrap(term: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(term) || /^\(.*\)$/.test(term) ? term : `(${term})`;
}

/** "name=T(2,3), family=torus" from a witness's first two labels (long values shortened), or "". */
export function witnessLabels(w: ReportWitness): string {
  if (!w.labels) return '';
  return Object.entries(w.labels)
    .slice(0, 2)
    .map(([k, v]) => `${k}=${v.length > 40 ? `${v.slice(0, 38)}…` : v}`)
    .join(', ');
}

/**
 * True when a bound's per-stratum constant changes systematically along the `by` quantity: the
 * bound stage's `kind` ('up' or 'down') when given, else the trend's interval excludes zero (either
 * sign: growth as `by` shrinks counts too). The verdict's words are shown, never read.
 */
export function trendGrows(t: { slope: number | null; low: number | null; high: number | null; kind?: 'none' | 'up' | 'down'; verdict: string } | null): boolean {
  if (t === null) return false;
  if (t.kind !== undefined) return t.kind !== 'none';
  const excludesZero = (t.low !== null && Number.isFinite(t.low) && t.low > 0) || (t.high !== null && Number.isFinite(t.high) && t.high < 0);
  return excludesZero;
}

/** Integrated gradients: true when on some repeat the largest row gap exceeds 10% of mean |f(x) − f(baseline)| (our threshold). */
export function completenessTroubled(c: ReadonlyArray<{ maxAbsGap: number; meanAbsDelta: number }> | undefined): boolean {
  return (c ?? []).some((x) => x.meanAbsDelta > 0 && x.maxAbsGap > 0.1 * x.meanAbsDelta);
}

/** "RMSE" or "balanced accuracy" for the second held-out figure of a ranking. */
export function secondaryLabel(metric: string): string {
  return metric === 'balancedAccuracy' ? 'balanced accuracy' : metricLabel(metric);
}

/**
 * A search candidate as `target ≈ c₀ + c₁·t₁ + …` with 4-figure coefficients; without a known
 * target or intercept (older inputs) the right-hand side alone, as before.
 */
export function searchFormula(target: string | undefined, c: { terms: readonly string[]; coefs: readonly number[]; intercept?: number }): string {
  if (c.intercept === undefined) return candidateExpression(c.terms, c.coefs);
  const terms = [
    { term: '1', coef: c.intercept, se: NaN, low: NaN, high: NaN, rational: null },
    ...c.terms.map((term, k) => ({ term, coef: c.coefs[k] ?? NaN, se: NaN, low: NaN, high: NaN, rational: null })),
  ];
  return equation(target ?? 'target', terms, false)!;
}
