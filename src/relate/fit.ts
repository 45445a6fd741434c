/**
 * fitRelation: least squares of a target expression on given term expressions over a table,
 * with intervals, simplest rationals inside them, held-out and cross-validated error.
 */
import { SurmiseError } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { lstsq } from './lstsq.ts';
import { simplestRational, type Rational } from './rational.ts';
import { crossValidatedRmse, gather, predictRows, rmseOn } from './crossval.ts';
import { completeRows, describeRow, realExpression, withDerived, type DroppedRows } from './rows.ts';

export interface FitSpec {
  /** Expression for the target, e.g. `re(lon/mer)`. */
  target: string;
  /** One expression per term, e.g. [`sig`, `vol/inj^3`]. */
  terms: string[];
  /** Include the constant term `1` (default true). */
  intercept?: boolean;
  /** Derived columns `{name, expression}` added before anything else is evaluated. */
  derive?: Array<{ name: string; expression: string }>;
  /** Row indices (0-based) of a training and a held-out part; the fit uses `train` only. */
  split?: { train: ArrayLike<number>; test: ArrayLike<number>; description?: string };
  /** Seed of the cross-validation folds (default 0). */
  seed?: number;
  /** Number of cross-validation folds (default 5). */
  folds?: number;
  /** Confidence level of the intervals (default 0.95). */
  level?: number;
  /** Keep rows that repeat an earlier row in every column the target and terms use (default false: drop and count them). */
  keepDuplicates?: boolean;
}

export interface FitTerm {
  term: string;
  coef: number;
  se: number;
  low: number;
  high: number;
  /** Simplest fraction inside [low, high], or null (interval undefined or too narrow for a small fraction). */
  rational: Rational | null;
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
}

/** Fit `spec.target ≈ Σ coef · term` by least squares (Householder QR) on the table's complete rows. */
export function fitRelation(table0: Table, spec: FitSpec): FitResult {
  const intercept = spec.intercept ?? true;
  const seed = spec.seed ?? 0;
  const folds = spec.folds ?? 5;
  const level = spec.level ?? 0.95;
  if (spec.terms.length === 0 && !intercept) throw new SurmiseError('relate.noTerms', 'no terms to fit: give at least one term, or keep the intercept');
  if (!(level > 0 && level < 1)) throw new SurmiseError('relate.badLevel', `expected the confidence level to lie in (0, 1), got ${level}`);
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
  const fitTerms: FitTerm[] = fit.names.map((term, j) => ({
    term,
    coef: fit.coef[j]!,
    se: fit.se[j]!,
    low: fit.low[j]!,
    high: fit.high[j]!,
    rational: fit.aliased[j] ? null : simplestRational(fit.low[j]!, fit.high[j]!, 1000),
    aliased: fit.aliased[j]!,
  }));
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
  return {
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
