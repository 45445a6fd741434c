/**
 * k-fold cross-validated RMSE of a least-squares fit (Stone, J. R. Statist. Soc. B 36, 1974):
 * rows are shuffled with a seeded permutation and cut into k nearly equal folds; each fold is
 * predicted by the fit on the other k − 1; the reported figure is sqrt(Σ e² / n) over all rows.
 * The k training fits are assembled from one QR per fold (see foldBlocks), not k full refits.
 */
import { SurmiseError } from '../errors.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { kahanSum } from '../util/sum.ts';
import { lstsq } from './lstsq.ts';
import { pivotedHouseholderQR } from './qr.ts';

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
 * Per fold, an orthogonal reduction Q_fᵀ[A_f | y_f] = [[M_f, c_f], [0, d_f]] of the fold's rows of
 * the centred, scaled design; the fit on all folds but f is then the least-squares solution of the
 * stacked small blocks (M_g, c_g), g ≠ f: "tall-skinny QR" (Demmel, Grigori, Hoemmen & Langou,
 * SIAM J. Sci. Comput. 34, 2012). All k training fits cost about one QR of the whole design.
 */
function foldBlocks(
  raw: Float64Array[],
  mean: Float64Array,
  scale: Float64Array,
  y: Float64Array,
  perm: Int32Array,
  bounds: number[],
): Array<{ m: Float64Array[]; c: Float64Array }> {
  const p = raw.length;
  const out: Array<{ m: Float64Array[]; c: Float64Array }> = [];
  for (let f = 0; f + 1 < bounds.length; f++) {
    const idx = perm.subarray(bounds[f]!, bounds[f + 1]!);
    // the fold's rows of the centred, unit-length columns, built while gathering
    const cols = raw.map((c, j) => {
      const out = new Float64Array(idx.length);
      const m = mean[j]!;
      const inv = 1 / scale[j]!;
      for (let i = 0; i < idx.length; i++) out[i] = (c[idx[i]!]! - m) * inv;
      return out;
    });
    const qr = pivotedHouseholderQR(cols, [gather(y, idx)], 0);
    const m = Array.from({ length: p }, () => new Float64Array(p));
    for (let k = 0; k < p; k++) for (let i = 0; i <= k; i++) m[qr.piv[k]!]![i] = qr.r[i * p + k]!;
    out.push({ m, c: qr.qty[0]!.slice(0, p) });
  }
  return out;
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
  if (!Number.isInteger(k) || k < 2 || k > 255) throw new SurmiseError('relate.badFolds', `expected the number of folds to be an integer from 2 to 255, got ${k}`);
  if (n < k) return { k, rmse: NaN, foldRmse: [], seed };
  const shuffled = new Rng(deriveSeed(seed, 'cv')).permutation(n);
  const bounds = Array.from({ length: k + 1 }, (_, f) => Math.floor((f * n) / k));
  // fold f holds the rows at positions bounds[f]..bounds[f+1]−1 of the shuffled order; list each
  // fold's rows in ascending order (same membership) so that gathering them reads memory in order
  const foldOf = new Uint8Array(n);
  for (let f = 0; f < k; f++) for (let j = bounds[f]!; j < bounds[f + 1]!; j++) foldOf[shuffled[j]!] = f;
  const perm = new Int32Array(n);
  const next = bounds.slice(0, k);
  for (let i = 0; i < n; i++) perm[next[foldOf[i]!]!++] = i;
  const p = columns.length + (intercept ? 1 : 0);
  // centred (with an intercept) and unit-length columns, as in lstsq
  const mean = new Float64Array(p);
  const scale = new Float64Array(p);
  const raw = intercept ? [new Float64Array(n).fill(1), ...columns] : columns;
  raw.forEach((c, j) => {
    const m = intercept && j > 0 ? kahanSum(c) / n : 0;
    mean[j] = m;
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (c[i]! - m) ** 2;
    if (!(ss < 1e300)) {
      // overflow: the norm with the largest entry factored out
      let big = 0;
      for (let i = 0; i < n; i++) big = Math.max(big, Math.abs(c[i]! - m));
      ss = 0;
      for (let i = 0; i < n; i++) ss += ((c[i]! - m) / big) ** 2;
      scale[j] = big * Math.sqrt(ss);
    } else scale[j] = Math.sqrt(ss) || 1;
  });
  const smallest = Math.floor(n / k);
  const blocks = smallest > p ? foldBlocks(raw, mean, scale, y, perm, bounds) : null;
  const sq = new Float64Array(n);
  const foldRmse: number[] = [];
  for (let f = 0; f < k; f++) {
    const a = bounds[f]!;
    const b = bounds[f + 1]!;
    const test = perm.subarray(a, b);
    let coef: Float64Array;
    if (blocks) {
      // stack the other folds' blocks and solve the small problem
      const others = blocks.filter((_, g) => g !== f);
      const cols = Array.from({ length: p }, (_, j) => {
        const out = new Float64Array(others.length * p);
        others.forEach((o, g) => out.set(o.m[j]!, g * p));
        return out;
      });
      const rhs = new Float64Array(others.length * p);
      others.forEach((o, g) => rhs.set(o.c, g * p));
      const z = lstsq(cols, rhs, { intercept: false }).coef;
      coef = new Float64Array(p);
      for (let j = 0; j < p; j++) coef[j] = z[j]! / scale[j]!;
      if (intercept) for (let j = 1; j < p; j++) coef[0] = coef[0]! - coef[j]! * mean[j]!;
    } else {
      const train = new Int32Array(n - (b - a));
      train.set(perm.subarray(0, a), 0);
      train.set(perm.subarray(b), a);
      coef = lstsq(columns.map((c) => gather(c, train)), gather(y, train), { intercept }).coef;
    }
    const pred = predictRows(columns, coef, intercept, test);
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
