/**
 * Held-out metrics. Each takes the true values and the predictions of the same rows; sums are
 * compensated (Neumaier) so long columns lose no digits.
 */
import { SurmiseError } from '../errors.ts';
import { kahanSum } from '../util/sum.ts';

function same(y: ArrayLike<number>, yhat: ArrayLike<number>, name: string): number {
  if (y.length !== yhat.length) throw new SurmiseError('learn.shapeMismatch', `${name}: ${y.length} true values but ${yhat.length} predictions`);
  if (y.length === 0) throw new SurmiseError('learn.noRows', `${name}: no held-out rows to score`);
  return y.length;
}

/**
 * Coefficient of determination on held-out rows, R² = 1 − Σ(y − ŷ)² / Σ(y − ȳ)², ȳ the mean of
 * the held-out y (the usual convention, e.g. Draper & Smith, Applied Regression Analysis). It is
 * negative when the predictions are worse than that mean; NaN when y is constant.
 * @example r2([1, 2, 3], [1, 2, 4]) // 0.5
 */
export function r2(y: ArrayLike<number>, yhat: ArrayLike<number>): number {
  const n = same(y, yhat, 'r2');
  const mean = kahanSum(y) / n;
  const res = new Float64Array(n);
  const tot = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    res[i] = (y[i]! - yhat[i]!) ** 2;
    tot[i] = (y[i]! - mean) ** 2;
  }
  const st = kahanSum(tot);
  return st > 0 ? 1 - kahanSum(res) / st : NaN;
}

/** Root mean squared error √(Σ(y − ŷ)²/n). @example rmse([0, 0], [3, 4]) // 3.5355… = √12.5 */
export function rmse(y: ArrayLike<number>, yhat: ArrayLike<number>): number {
  const n = same(y, yhat, 'rmse');
  const sq = new Float64Array(n);
  for (let i = 0; i < n; i++) sq[i] = (y[i]! - yhat[i]!) ** 2;
  return Math.sqrt(kahanSum(sq) / n);
}

/** Mean absolute error Σ|y − ŷ|/n. @example mae([0, 0], [3, -4]) // 3.5 */
export function mae(y: ArrayLike<number>, yhat: ArrayLike<number>): number {
  const n = same(y, yhat, 'mae');
  const a = new Float64Array(n);
  for (let i = 0; i < n; i++) a[i] = Math.abs(y[i]! - yhat[i]!);
  return kahanSum(a) / n;
}

/** Fraction of rows whose predicted class equals the true one. @example accuracy([1, 2, 2], [1, 2, 1]) // 2/3 */
export function accuracy(y: ArrayLike<number>, yhat: ArrayLike<number>): number {
  const n = same(y, yhat, 'accuracy');
  let k = 0;
  for (let i = 0; i < n; i++) if (y[i] === yhat[i]) k++;
  return k / n;
}

/**
 * Balanced accuracy: the mean over the classes present in y of the recall (correct / rows of
 * that class) (Brodersen et al., "The balanced accuracy and its posterior distribution", ICPR 2010).
 * Equals accuracy when classes are balanced; a majority-class guess scores 1/(number of classes).
 * @example balancedAccuracy([0, 0, 0, 1], [0, 0, 0, 0]) // (1 + 0)/2 = 0.5
 */
export function balancedAccuracy(y: ArrayLike<number>, yhat: ArrayLike<number>): number {
  const n = same(y, yhat, 'balancedAccuracy');
  const total = new Map<number, number>();
  const hit = new Map<number, number>();
  for (let i = 0; i < n; i++) {
    total.set(y[i]!, (total.get(y[i]!) ?? 0) + 1);
    if (y[i] === yhat[i]) hit.set(y[i]!, (hit.get(y[i]!) ?? 0) + 1);
  }
  let s = 0;
  for (const [c, t] of total) s += (hit.get(c) ?? 0) / t;
  return s / total.size;
}
