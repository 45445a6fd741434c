/**
 * k-fold cross-validated RMSE of a least-squares fit (Stone, J. R. Statist. Soc. B 36, 1974):
 * rows are shuffled with a seeded permutation and cut into k nearly equal folds; each fold is
 * predicted by the fit on the other k − 1; the reported figure is sqrt(Σ e² / n) over all rows.
 */
import { SurmiseError } from '../errors.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { kahanSum } from '../util/sum.ts';
import { lstsq } from './lstsq.ts';

export interface CrossValidation {
  k: number;
  rmse: number;
  foldRmse: number[];
  seed: number;
}

/** Gather rows `idx` of a column. */
export function gather(col: Float64Array, idx: ArrayLike<number>): Float64Array {
  const out = new Float64Array(idx.length);
  for (let i = 0; i < idx.length; i++) out[i] = col[idx[i]!]!;
  return out;
}

/** Predict Σ coef_j x_j (+ intercept) on rows `idx`. */
export function predictRows(columns: Float64Array[], coef: Float64Array, intercept: boolean, idx: ArrayLike<number>): Float64Array {
  const out = new Float64Array(idx.length);
  const off = intercept ? 1 : 0;
  if (intercept) out.fill(coef[0]!);
  for (let j = 0; j < columns.length; j++) {
    const b = coef[j + off]!;
    const c = columns[j]!;
    for (let i = 0; i < idx.length; i++) out[i] = out[i]! + b * c[idx[i]!]!;
  }
  return out;
}

/** RMSE of predictions against y on rows idx (compensated sum). */
export function rmseOn(pred: Float64Array, y: Float64Array, idx: ArrayLike<number>): number {
  const sq = new Float64Array(idx.length);
  for (let i = 0; i < idx.length; i++) sq[i] = (y[idx[i]!]! - pred[i]!) ** 2;
  return Math.sqrt(kahanSum(sq) / Math.max(1, idx.length));
}

/**
 * @example crossValidatedRmse([x], y, { k: 5, seed: 1 }).rmse
 */
export function crossValidatedRmse(
  columns: Float64Array[],
  y: Float64Array,
  opts: { k?: number; seed?: number; intercept?: boolean } = {},
): CrossValidation {
  const k = opts.k ?? 5;
  const seed = opts.seed ?? 0;
  const intercept = opts.intercept ?? true;
  const n = y.length;
  if (!Number.isInteger(k) || k < 2) throw new SurmiseError('relate.badFolds', `expected the number of folds to be an integer ≥ 2, got ${k}`);
  if (n < k) return { k, rmse: NaN, foldRmse: [], seed };
  const perm = new Rng(deriveSeed(seed, 'cv')).permutation(n);
  const sq = new Float64Array(n);
  const foldRmse: number[] = [];
  for (let f = 0; f < k; f++) {
    const a = Math.floor((f * n) / k);
    const b = Math.floor(((f + 1) * n) / k);
    const test = perm.subarray(a, b);
    const train = new Int32Array(n - (b - a));
    train.set(perm.subarray(0, a), 0);
    train.set(perm.subarray(b), a);
    const fit = lstsq(columns.map((c) => gather(c, train)), gather(y, train), { intercept });
    const pred = predictRows(columns, fit.coef, intercept, test);
    const fsq = new Float64Array(test.length);
    for (let i = 0; i < test.length; i++) {
      const e = (y[test[i]!]! - pred[i]!) ** 2;
      fsq[i] = e;
      sq[a + i] = e;
    }
    foldRmse.push(Math.sqrt(kahanSum(fsq) / test.length));
  }
  return { k, rmse: Math.sqrt(kahanSum(sq) / n), foldRmse, seed };
}
