/**
 * fitRelation: least squares of a target expression on given term expressions over a table,
 * with intervals, simplest rationals inside them, held-out and cross-validated error.
 */
import { SurmiseError } from '../errors.ts';
import { checkOptions } from '../util/option-table.ts';
import { FIT_OPTIONS } from './options.ts';
import type { Table } from '../table/types.ts';
import { lstsq } from './lstsq.ts';
import { simpleFraction, SIMPLE_DENOMINATOR, type Rational, type SimpleFraction } from './rational.ts';
import { orthogonalLine } from './orthogonal.ts';
import { crossValidatedRmse, gather, predictRows, rmseOn } from './crossval.ts';
import { completeRows, describeRow, realExpression, withDerived, type DroppedRows } from './rows.ts';

export interface FitSpec {
  /** Expression for the target, e.g. `re(zb/za)`. */
  target: string;
  /** One expression per term, e.g. [`sig`, `ux/uy^3`]. */
  terms: string[];
  /** Include the constant term `1` (default true). */
  intercept?: boolean;
  /** Derived columns `{name, expression}` added before anything else is evaluated. */
  derive?: Array<{ name: string; expression: string }>;
  /** Row indices (0-based) of a training and a held-out part; the fit uses `train` only. */
  split?: { train: ArrayLike<number>; test: ArrayLike<number>; description?: string };
  /** Seed of the cross-validation folds (default 1, as every stage). */
  seed?: number;
  /** Number of cross-validation folds (default 5). */
  folds?: number;
  /** Confidence level of the intervals (default 0.95). */
  level?: number;
  /** Keep rows that repeat an earlier row in every column the target and terms use (default false: drop and count them). */
  keepDuplicates?: boolean;
  /** Terms whose values are themselves measured with error (errors-in-variables): their slopes are attenuated. */
  noisyTerms?: string[];
  /** Also return the residual of every fitted row (for a residual ranking). Default false. */
  keepResiduals?: boolean;
}

export interface FitTerm {
  term: string;
  coef: number;
  se: number;
  low: number;
  high: number;
  /** The one fraction with denominator ≤ 12 inside [low, high] (simpleFraction), or null. */
  rational: Rational | null;
  /** What the interval says about simple fractions: one, several (too wide), or none. */
  fraction: SimpleFraction;
  aliased: boolean;
}

export interface RowRef {
  row: number;
  line?: number;
  labels: Record<string, string>;
}

export interface FitResult {
  target: string;
  terms: FitTerm[];
  intercept: boolean;
  /** Rows the fit used. */
  n: number;
  /** Rows in the table. */
  nRows: number;
  dropped: DroppedRows;
  r2: number;
  centredR2: boolean;
  adjR2: number;
  rmse: number;
  mae: number;
  residualSD: number;
  maxAbsResidual: number;
  maxAbsResidualRow: RowRef & { residual: number };
  aic: number;
  bic: number;
  cvRmse: number;
  cvFolds: number;
  condition: number;
  rank: number;
  level: number;
  heldOut: { n: number; rmse: number; mae: number } | null;
  /** How the rows were split, or null when every usable row was fitted. */
  split: string | null;
  seed: number;
  warnings: string[];
  /** The fraction rule, in words. */
  fractionRule: string;
  /** One-term fits: the orthogonal (total least squares) line beside the ordinary one. */
  orthogonal?: { term: string; slope: number; intercept: number; text: string };
  /** Terms declared noisy, and what that does to their least-squares slopes. */
  errorsInVariables?: { terms: string[]; text: string };
  /** Integer target: fraction of rows the rounded fitted value gets exactly right (fitted rows; held-out rows when split). */
  roundedExact?: { fitted: number; heldOut: number | null };
  /** With keepResiduals: data rows fitted (0-based) and their residuals y − ŷ. */
  residuals?: { rows: Int32Array; values: Float64Array };
}

export const FRACTION_RULE = `a fraction is shown only when it is the one fraction with denominator ≤ ${SIMPLE_DENOMINATOR} inside the coefficient's interval`;

/** Fraction of rows where round(ŷ) = y exactly (y integer). */
function hitRate(pred: ArrayLike<number>, y: ArrayLike<number>): number {
  let h = 0;
  for (let i = 0; i < y.length; i++) if (Math.round(pred[i]!) === y[i]) h++;
  return y.length ? h / y.length : NaN;
}

/** Fit `spec.target ≈ Σ coef · term` by least squares (Householder QR) on the table's complete rows. */
export function fitRelation(table0: Table, spec: FitSpec): FitResult {
  const { intercept, seed, folds, level } = checkOptions<{ intercept: boolean; seed: number; folds: number; level: number }>(FIT_OPTIONS, spec as unknown as Record<string, unknown>);
  if (spec.terms.length === 0 && !intercept) throw new SurmiseError('relate.noTerms', 'no terms to fit: give at least one term, or keep the intercept');
  const seen = new Map<string, number>();
  spec.terms.forEach((t, i) => {
    const key = t.replace(/\s+/g, '');
    if (key === '') throw new SurmiseError('relate.emptyTerm', `term ${i + 1} of the term list is empty`);
    const j = seen.get(key);
    if (j !== undefined) throw new SurmiseError('relate.duplicateTerm', `term '${t}' is given twice (terms ${j + 1} and ${i + 1})`);
    seen.set(key, i);
  });
  const table = withDerived(table0, spec.derive ?? []);
  const target = realExpression(table, spec.target, 'the target');
  const terms = spec.terms.map((t) => realExpression(table, t, 'term'));
  const { rows, dropped } = completeRows(
    [{ expression: spec.target, ...target }, ...terms.map((t, i) => ({ expression: spec.terms[i]!, ...t }))],
    table.nRows,
    spec.keepDuplicates ? undefined : table0,
  );
  const warnings: string[] = [];
  if (dropped.total > 0) {
    const parts = dropped.byExpression.filter((d) => d.missing + d.nonFinite > 0).map((d) => `'${d.expression}': ${d.missing} missing, ${d.nonFinite} not finite`);
    if (dropped.duplicates > 0) parts.push(`${dropped.duplicates} repeat${dropped.duplicates === 1 ? '' : 's'} of an earlier row in every column used`);
    warnings.push(`${dropped.total} of ${table.nRows} rows dropped (${parts.join('; ')})`);
  }
  let trainRows: Int32Array = rows;
  let testRows: Int32Array | null = null;
  if (spec.split) {
    const keep = new Uint8Array(table.nRows);
    for (const i of rows) keep[i] = 1;
    const tr = Array.from(spec.split.train).filter((i) => keep[i]);
    const te = Array.from(spec.split.test).filter((i) => keep[i]);
    trainRows = Int32Array.from(tr);
    testRows = Int32Array.from(te);
  }
  const p = spec.terms.length + (intercept ? 1 : 0);
  if (trainRows.length <= p) {
    throw new SurmiseError(
      'relate.tooFewRows',
      `only ${trainRows.length} usable rows for ${p} coefficients (${dropped.total} of ${table.nRows} rows dropped for missing or non-finite values)`,
    );
  }
  // every row used, in order: no copies needed
  const all = trainRows.length === table.nRows && trainRows.every((r, i) => r === i);
  const cols = terms.map((t) => (all ? t.values : gather(t.values, trainRows)));
  const y = all ? target.values : gather(target.values, trainRows);
  const fit = lstsq(cols, y, { intercept, names: spec.terms, level });
  warnings.push(...fit.warnings);
  const fitTerms: FitTerm[] = fit.names.map((term, j) => {
    const fraction = fit.aliased[j] ? simpleFraction(NaN, NaN) : simpleFraction(fit.low[j]!, fit.high[j]!);
    return { term, coef: fit.coef[j]!, se: fit.se[j]!, low: fit.low[j]!, high: fit.high[j]!, rational: fraction.rational, fraction, aliased: fit.aliased[j]! };
  });
  const cv = trainRows.length >= 2 * folds && fit.rank === p ? crossValidatedRmse(cols, y, { k: folds, seed, intercept }) : null;
  if (!cv) warnings.push(`${folds}-fold cross-validation skipped (${fit.rank < p ? 'rank-deficient design' : 'too few rows'})`);
  let heldOut: FitResult['heldOut'] = null;
  if (testRows) {
    if (testRows.length === 0) warnings.push('the held-out part of the split has no usable rows');
    else {
      const pred = predictRows(terms.map((t) => t.values), fit.coef, intercept, testRows);
      let ae = 0;
      for (let i = 0; i < testRows.length; i++) ae += Math.abs(target.values[testRows[i]!]! - pred[i]!);
      heldOut = { n: testRows.length, rmse: rmseOn(pred, target.values, testRows), mae: ae / testRows.length };
    }
  }
  const worst = trainRows[fit.maxAbsResidualRow]!;
  const extra: Partial<FitResult> = {};
  if (spec.terms.length === 1 && !fitTerms.some((t) => t.aliased)) {
    const o = orthogonalLine(cols[0]!, y, intercept);
    const ols = fitTerms.find((t) => t.term !== '1')!.coef;
    extra.orthogonal = {
      term: spec.terms[0]!,
      slope: o.slope,
      intercept: o.intercept,
      text: `orthogonal (total least squares) slope ${o.slope.toPrecision(6)} beside the ordinary ${ols.toPrecision(6)}: it treats errors in '${spec.terms[0]}' and in the target as equal in size, in these units`,
    };
  }
  const noisy = (spec.noisyTerms ?? []).map((t) => {
    const k = spec.terms.findIndex((u) => u.replace(/\s+/g, '') === t.replace(/\s+/g, ''));
    if (k < 0) throw new SurmiseError('relate.unknownNoisyTerm', `noisy term '${t}' is not one of the fitted terms (${spec.terms.join('; ')})`);
    return spec.terms[k]!;
  });
  if (noisy.length) {
    extra.errorsInVariables = {
      terms: noisy,
      text:
        `${noisy.map((t) => `'${t}'`).join(', ')} ${noisy.length === 1 ? 'is' : 'are'} measured with error: least squares biases ${noisy.length === 1 ? 'its slope' : 'their slopes'} toward 0 ` +
        `by the factor var(true value)/var(observed value) (attenuation, errors-in-variables; Fuller, Measurement Error Models, 1987, §1.1)` +
        (extra.orthogonal ? '; the orthogonal slope corrects this when the two error variances are equal' : ''),
    };
  }
  if (y.every((v) => Number.isInteger(v))) {
    const fitted = Float64Array.from(y, (v, i) => v - fit.residuals[i]!);
    let heldOutRate: number | null = null;
    if (testRows && testRows.length) {
      const pred = predictRows(terms.map((t) => t.values), fit.coef, intercept, testRows);
      heldOutRate = hitRate(pred, Array.from(testRows, (i) => target.values[i]!));
    }
    extra.roundedExact = { fitted: hitRate(fitted, y), heldOut: heldOutRate };
  }
  if (spec.keepResiduals) extra.residuals = { rows: Int32Array.from(trainRows), values: Float64Array.from(fit.residuals) };
  return {
    ...extra,
    fractionRule: FRACTION_RULE,
    target: spec.target,
    terms: fitTerms,
    intercept,
    n: trainRows.length,
    nRows: table.nRows,
    dropped,
    r2: fit.r2,
    centredR2: fit.centredR2,
    adjR2: fit.adjR2,
    rmse: fit.rmse,
    mae: fit.mae,
    residualSD: fit.residualSD,
    maxAbsResidual: fit.maxAbsResidual,
    maxAbsResidualRow: { ...describeRow(table, worst), residual: fit.residuals[fit.maxAbsResidualRow]! },
    aic: fit.aic,
    bic: fit.bic,
    cvRmse: cv ? cv.rmse : NaN,
    cvFolds: folds,
    condition: fit.condition,
    rank: fit.rank,
    level,
    heldOut,
    split: spec.split ? spec.split.description ?? `${trainRows.length} rows fitted, ${testRows?.length ?? 0} held out` : null,
    seed,
    warnings,
  };
}
