import type { FeatureGroup, RepeatScores } from './types.ts';
import { columnMeans } from './column-mean.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { kahanSum } from '../util/sum.ts';

/** Per-row loss of the model on rows x (row-major n×p): squared error, cross-entropy, 0/1 error… */
export type RowLoss = (x: Float64Array, n: number) => Float64Array;

export interface PermutationOptions {
  /** Shuffles per group (R). Default 5. */
  repeats?: number;
  seed: number;
}

export interface PermutationResult extends RepeatScores {
  /** Mean loss on the unshuffled rows. */
  baseLoss: number;
  /** Loss increase per group for each shuffle, repeats × groups (row-major). */
  perShuffle: Float64Array;
}

/**
 * Permutation importance (L. Breiman, "Random Forests", Machine Learning 45, 2001, §10):
 * I_g = (1/R) Σ_r [L(X with the columns of group g permuted by π_{g,r}) − L(X)], the columns of a
 * group shuffled jointly by one permutation so the group's internal structure is kept. π_{g,r} is
 * seeded by deriveSeed(seed, 'perm', g, r). On standardized inputs of a noise-free linear model with
 * squared error, I_j → 2 w_j² (the shuffled column is an independent copy: E(x − x′)² = 2).
 * perRow holds each row's loss increase averaged over the R shuffles (n × groups).
 */
export function permutationImportance(
  rowLoss: RowLoss,
  x: Float64Array,
  n: number,
  p: number,
  groups: readonly FeatureGroup[],
  opts: PermutationOptions,
): PermutationResult {
  const R = opts.repeats ?? 5;
  const G = groups.length;
  const base = rowLoss(x, n);
  const baseLoss = n ? kahanSum(base) / n : NaN;
  const perRow = new Float64Array(n * G);
  const perShuffle = new Float64Array(R * G);
  const xs = new Float64Array(x);
  for (let g = 0; g < G; g++) {
    const members = groups[g]!.members;
    for (let r = 0; r < R; r++) {
      const perm = new Rng(deriveSeed(opts.seed, 'perm', groups[g]!.name, r)).permutation(n);
      for (const j of members) for (let i = 0; i < n; i++) xs[i * p + j] = x[perm[i]! * p + j]!;
      const loss = rowLoss(xs, n);
      const d = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        d[i] = loss[i]! - base[i]!;
        perRow[i * G + g] += d[i]! / R;
      }
      perShuffle[r * G + g] = n ? kahanSum(d) / n : NaN;
      for (const j of members) for (let i = 0; i < n; i++) xs[i * p + j] = x[i * p + j]!;
    }
  }
  return { scores: columnMeans(perRow, n, G), perRow, n, baseLoss, perShuffle };
}

/** Squared error per row against targets y: (f(x_i) − y_i)². */
export function squaredErrorLoss(predict: (x: Float64Array, n: number) => Float64Array, y: ArrayLike<number>): RowLoss {
  return (x, n) => {
    const f = predict(x, n);
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = (f[i]! - y[i]!) ** 2;
    return out;
  };
}
