/**
 * Linear least squares min ‖y − Xβ‖₂ by Householder QR with column pivoting (qr.ts), with the
 * statistics a reader of a regression table expects. With an intercept the other columns are
 * centred; all columns are scaled to unit 2-norm before the factorization. Neither changes the
 * fitted model; both are undone in the estimates and standard errors, and the condition number
 * reported is that of the centred, scaled design (the one whose conditioning limits the digits).
 */
import { kahanSum } from '../util/sum.ts';
import { pivotedHouseholderQR, backSubstitute, invertUpper, singularValues, tailNorm } from './qr.ts';
import { studentTQuantile } from '../util/special.ts';

export interface LstsqOptions {
  /** Prepend a column of ones named `1` (default true). */
  intercept?: boolean;
  /** Names of `columns` (default x1, x2, …), used in warnings and collinearity reports. */
  names?: string[];
  /** Condition number above which the design is flagged ill-conditioned (default 1e10). */
  conditionLimit?: number;
  /** Confidence level of the coefficient intervals (default 0.95). */
  level?: number;
  /** Relative rank tolerance on |R_kk|/|R_00| of the scaled design (default max(n,p)·ε). */
  rankTol?: number;
}

export interface Collinearity {
  /** The term left out of the basis. */
  term: string;
  /** Terms it is (numerically) a linear combination of, with the combination's coefficients. */
  of: Array<{ term: string; coef: number }>;
}

export interface LstsqResult {
  names: string[];
  /** Estimates in the order of `names` (intercept first when present); 0 for aliased terms. */
  coef: Float64Array;
  /** Standard errors sqrt(σ̂² [(XᵀX)⁻¹]_jj); NaN for aliased terms or when n ≤ rank. */
  se: Float64Array;
  /** Confidence interval coef ± t_{(1+level)/2, n−rank} · se. */
  low: Float64Array;
  high: Float64Array;
  level: number;
  tQuantile: number;
  /** True for terms left out because they are collinear with others. */
  aliased: boolean[];
  n: number;
  p: number;
  rank: number;
  df: number;
  residuals: Float64Array;
  fitted: Float64Array;
  /** Residual sum of squares (compensated sum). */
  rss: number;
  /** σ̂ = sqrt(RSS / (n − rank)). */
  residualSD: number;
  /** Centred R² = 1 − RSS/Σ(y−ȳ)² with an intercept; uncentred 1 − RSS/Σy² without (as NIST StRD does for NoInt1/2). */
  r2: number;
  centredR2: boolean;
  /** 1 − (1 − R²)(n − i)/(n − rank), i = 1 with intercept else 0. */
  adjR2: number;
  rmse: number;
  mae: number;
  maxAbsResidual: number;
  /** Row index (0-based, into y) of the largest |residual|. */
  maxAbsResidualRow: number;
  /** Gaussian log-likelihood at the ML variance: ℓ = −n/2 (ln 2π + ln(RSS/n) + 1). */
  logLik: number;
  /** AIC = 2k − 2ℓ, BIC = k ln n − 2ℓ with k = rank + 1 (coefficients and σ²) (Akaike 1974; Schwarz 1978). */
  aic: number;
  bic: number;
  /** 2-norm condition number σ_max/σ_min of the centred (with an intercept), column-scaled design (singular values of R by Jacobi). */
  condition: number;
  illConditioned: boolean;
  collinear: Collinearity[];
  warnings: string[];
}

/**
 * Fit y ≈ Σ β_j x_j (+ β_0). Rows must be finite (the caller drops and counts missing rows).
 * @example lstsq([new Float64Array([0, 1, 2])], new Float64Array([1, 3, 5])).coef // [1, 2]
 */
export function lstsq(columns: Float64Array[], y: Float64Array, opts: LstsqOptions = {}): LstsqResult {
  const intercept = opts.intercept ?? true;
  const level = opts.level ?? 0.95;
  const conditionLimit = opts.conditionLimit ?? 1e10;
  const n = y.length;
  const given = opts.names ?? columns.map((_, j) => `x${j + 1}`);
  if (given.length !== columns.length) throw new RangeError('lstsq: names and columns differ in length');
  const names = intercept ? ['1', ...given] : given.slice();
  const raw: Float64Array[] = intercept ? [new Float64Array(n).fill(1), ...columns] : columns.slice();
  const p = raw.length;
  for (const c of raw) if (c.length !== n) throw new RangeError('lstsq: every column must have the length of y');
  if (p === 0) throw new RangeError('lstsq: no columns');
  // With an intercept, centre the other columns first: [1, X] and [1, X − 1x̄ᵀ] span the same
  // space, so the fit is unchanged, but a polynomial or offset column loses its collinearity with
  // the constant (e.g. Seber & Lee, "Linear Regression Analysis", 2nd ed., §3.11). Then scale
  // every column to unit 2-norm (column equilibration, Golub & Van Loan §3.5.2).
  const mean = new Float64Array(p);
  const scale = new Float64Array(p);
  const work: Float64Array[] = raw.map((c, j) => {
    const isOne = intercept && j === 0;
    const m = intercept && !isOne ? kahanSum(c) / n : 0;
    mean[j] = m;
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = c[i]! - m;
    const norm = tailNorm(out, 0, n);
    scale[j] = norm > 0 ? norm : 1;
    const f = 1 / scale[j]!;
    for (let i = 0; i < n; i++) out[i] = out[i]! * f;
    return out;
  });
  const qr = pivotedHouseholderQR(work, [Float64Array.from(y)], opts.rankTol);
  const { r, piv, rank } = qr;
  const qty = qr.qty[0]!;
  const warnings: string[] = [];
  // basic solution on the first `rank` pivoted columns
  const z = backSubstitute(r, p, rank, qty);
  const coef = new Float64Array(p);
  const aliased = new Array<boolean>(p).fill(false);
  for (let k = 0; k < rank; k++) coef[piv[k]!] = z[k]! / scale[piv[k]!]!;
  // undo the centring: β₀ = β₀ᶜ − Σ_j β_j x̄_j
  if (intercept) for (let j = 1; j < p; j++) coef[0] = coef[0]! - coef[j]! * mean[j]!;
  const collinear: Collinearity[] = [];
  for (let k = rank; k < p; k++) {
    aliased[piv[k]!] = true;
    // column k ≈ Σ_{i<rank} w_i column_i  with  R11 w = R12
    const rhs = new Float64Array(rank);
    for (let i = 0; i < rank; i++) rhs[i] = r[i * p + k]!;
    const w = backSubstitute(r, p, rank, rhs);
    const of: Array<{ term: string; coef: number }> = [];
    // x_k − x̄_k = Σ_i w'_i (x_i − x̄_i) with w'_i = w_i s_k / s_i; the constant collects the means
    const jk = piv[k]!;
    let constant = mean[jk]!;
    for (let i = 0; i < rank; i++) {
      const ji = piv[i]!;
      const c = (w[i]! * scale[jk]!) / scale[ji]!;
      if (intercept && ji === 0) constant += c;
      else {
        constant -= c * mean[ji]!;
        if (Math.abs(w[i]!) > 1e-8) of.push({ term: names[ji]!, coef: c });
      }
    }
    if (intercept && Math.abs(constant) > 1e-8 * Math.max(1, Math.abs(mean[jk]!))) of.unshift({ term: '1', coef: constant });
    collinear.push({ term: names[piv[k]!]!, of });
  }
  if (collinear.length > 0) {
    warnings.push(
      `rank-deficient design (rank ${rank} of ${p}): ` +
        collinear
          .map((c) => `'${c.term}' is a linear combination of ${c.of.map((o) => `'${o.term}'`).join(', ') || 'nothing (all zero)'}`)
          .join('; ') +
        '; those coefficients are set to 0 and have no standard error',
    );
  }
  // fitted values and residuals in the original columns
  const fitted = new Float64Array(n);
  for (let j = 0; j < p; j++) {
    const b = coef[j]!;
    if (b === 0) continue;
    const c = raw[j]!;
    for (let i = 0; i < n; i++) fitted[i] = fitted[i]! + b * c[i]!;
  }
  const residuals = new Float64Array(n);
  const tmp = new Float64Array(n); // scratch for compensated sums
  let maxAbs = 0;
  let maxRow = -1;
  for (let i = 0; i < n; i++) {
    const e = y[i]! - fitted[i]!;
    residuals[i] = e;
    tmp[i] = e * e;
    const a = Math.abs(e);
    if (a > maxAbs || maxRow < 0) { maxAbs = a; maxRow = i; }
  }
  // RSS as the compensated Σe² of the residuals recomputed from the original columns
  const rss = kahanSum(tmp);
  for (let i = 0; i < n; i++) tmp[i] = Math.abs(residuals[i]!);
  const sumAbs = kahanSum(tmp);
  const df = n - rank;
  const sigma2 = df > 0 ? rss / df : NaN;
  // standard errors: β = A z with z the coefficients of the scaled, centred, pivoted columns, and
  // Cov(z) = σ̂² R⁻¹R⁻ᵀ, so Var(β_j) = σ̂² ‖R⁻ᵀ a_j‖² (a_j the row of A for β_j)
  const se = new Float64Array(p).fill(NaN);
  if (rank > 0) {
    const g = invertUpper(r, p, rank);
    const posOf = new Int32Array(p).fill(-1);
    for (let k = 0; k < rank; k++) posOf[piv[k]!] = k;
    for (let j = 0; j < p; j++) {
      if (posOf[j]! < 0) continue;
      const a = new Float64Array(rank);
      a[posOf[j]!] = 1 / scale[j]!;
      if (intercept && j === 0) for (let i = 1; i < p; i++) if (posOf[i]! >= 0) a[posOf[i]!] = a[posOf[i]!]! - mean[i]! / scale[i]!;
      let s2 = 0;
      for (let l = 0; l < rank; l++) {
        let t = 0;
        for (let k = 0; k <= l; k++) t += g[k * rank + l]! * a[k]!;
        s2 += t * t;
      }
      se[j] = Math.sqrt(sigma2 * s2);
    }
  }
  const tq = df > 0 ? studentTQuantile((1 + level) / 2, df) : NaN;
  const low = new Float64Array(p);
  const high = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    low[j] = coef[j]! - tq * se[j]!;
    high[j] = coef[j]! + tq * se[j]!;
  }
  // R²
  let tss: number;
  if (intercept) {
    const ybar = kahanSum(y) / n;
    for (let i = 0; i < n; i++) tmp[i] = (y[i]! - ybar) ** 2;
    tss = kahanSum(tmp);
  } else {
    for (let i = 0; i < n; i++) tmp[i] = y[i]! ** 2;
    tss = kahanSum(tmp);
  }
  const r2 = tss > 0 ? 1 - rss / tss : NaN;
  const i0 = intercept ? 1 : 0;
  const adjR2 = df > 0 ? 1 - ((1 - r2) * (n - i0)) / df : NaN;
  const rmse = Math.sqrt(rss / n);
  const mae = sumAbs / n;
  // Gaussian log-likelihood at σ² = RSS/n (e.g. Burnham & Anderson, "Model Selection and
  // Multimodel Inference", 2nd ed., §2.2): ℓ = −n/2 (ln 2π + ln(RSS/n) + 1)
  const logLik = -0.5 * n * (Math.log(2 * Math.PI) + Math.log(rss / n) + 1);
  const kParams = rank + 1;
  const aic = 2 * kParams - 2 * logLik;
  const bic = kParams * Math.log(n) - 2 * logLik;
  // condition number of the scaled design: σ_max/σ_min of R (all p columns, so aliasing shows as ∞)
  const rFull = new Float64Array(p * p);
  for (let i = 0; i < p; i++) for (let j = i; j < p; j++) rFull[i * p + j] = r[i * p + j]!;
  const sv = singularValues(p, rFull);
  const condition = sv[p - 1]! > 0 ? sv[0]! / sv[p - 1]! : Infinity;
  const illConditioned = !(condition <= conditionLimit);
  if (illConditioned && collinear.length === 0) {
    warnings.push(
      `ill-conditioned design: condition number ${condition.toPrecision(3)} (after scaling columns to unit length) ` +
        `exceeds ${conditionLimit.toPrecision(2)}; about ${Math.min(16, Math.max(0, Math.log10(condition))).toFixed(0)} of the ~16 ` +
        'digits of float64 may be lost in the coefficients: treat their trailing digits as noise',
    );
  }
  else if (condition > 1e7 && collinear.length === 0) {
    warnings.push(
      `poorly conditioned design: condition number ${condition.toPrecision(3)} (after scaling columns to unit length); ` +
        `expect only about ${Math.max(0, 16 - Math.log10(condition)).toFixed(0)} correct significant digits in the coefficients`,
    );
  }
  if (df <= 0) warnings.push(`no residual degrees of freedom (n = ${n}, rank = ${rank}): standard errors are undefined`);
  return {
    names, coef, se, low, high, level, tQuantile: tq, aliased, n, p, rank, df, residuals, fitted, rss,
    residualSD: Math.sqrt(sigma2), r2, centredR2: intercept, adjR2, rmse, mae, maxAbsResidual: maxAbs,
    maxAbsResidualRow: maxRow, logLik, aic, bic, condition, illConditioned, collinear, warnings,
  };
}
