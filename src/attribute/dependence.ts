/**
 * Partial dependence (J. H. Friedman, "Greedy function approximation: a gradient boosting
 * machine", Annals of Statistics 29 (2001), §8.2): for feature j and a grid value v,
 * PD_j(v) = (1/n) Σ_i f(x_i with x_ij := v), the network's mean prediction when feature j is set
 * to v on every row and the other features keep their values. Classification: f is the expected
 * class value Σ p_k·c_k, as everywhere in the ranking.
 * @example a linear f(x) = 2·x₀ + x₁ has PD₀(v) = 2v + mean(x₁)
 */
import type { RepeatData } from '../learn/repeats.ts';
import { subsampleRows } from '../util/subsample.ts';

/** The trained network's prediction, row-major n×p in, n values out. */
export type Predict = (x: Float64Array, n: number) => Float64Array;

export interface DependenceCurve {
  /** Grid values in the model's (standardized) units, increasing. */
  grid: number[];
  /** Mean prediction at each grid value. */
  mean: number[];
}

/**
 * Grid of `points` values of column j between its 5% and 95% sample quantiles (order statistics
 * ⌊q·(n−1)⌋ of the sorted column), equally spaced; the distinct values themselves when there are
 * at most `points` of them (an integer feature then gets its own values).
 */
export function dependenceGrid(x: Float64Array, n: number, p: number, j: number, points: number): number[] {
  const col = Float64Array.from({ length: n }, (_, i) => x[i * p + j]!).sort();
  const distinct: number[] = [];
  for (let i = 0; i < n; i++) if (i === 0 || col[i] !== col[i - 1]) distinct.push(col[i]!);
  if (distinct.length <= points) return distinct;
  const lo = col[Math.floor(0.05 * (n - 1))]!;
  const hi = col[Math.floor(0.95 * (n - 1))]!;
  return Array.from({ length: points }, (_, k) => lo + ((hi - lo) * k) / (points - 1));
}

/** PD_j on `grid` over the n rows of x (row-major n×p): one batched prediction of n·|grid| rows. */
export function partialDependence(predict: Predict, x: Float64Array, n: number, p: number, j: number, grid: readonly number[]): DependenceCurve {
  const g = grid.length;
  const big = new Float64Array(n * g * p);
  for (let k = 0; k < g; k++) {
    big.set(x.subarray(0, n * p), k * n * p);
    for (let i = 0; i < n; i++) big[(k * n + i) * p + j] = grid[k]!;
  }
  const out = predict(big, n * g);
  const mean = grid.map((_, k) => {
    let s = 0;
    for (let i = 0; i < n; i++) s += out[k * n + i]!;
    return s / n;
  });
  return { grid: [...grid], mean };
}

/**
 * Partial dependence of a repeat's model on every feature it saw: at most 500 held-out rows
 * (seeded subsample) and 25 grid values, mapped back to the feature's own units through the
 * repeat's standardizer (x = mean + sd·z).
 */
export function dependenceCurves(predict: Predict, d: RepeatData, names: readonly string[], seed: number): Array<{ feature: string; x: number[]; mean: number[] }> {
  const p = d.kept.length;
  const rows = subsampleRows(d.test.n, 500, seed);
  const x = new Float64Array(rows.length * p);
  rows.forEach((i, k) => x.set(d.test.x.subarray(i * p, (i + 1) * p), k * p));
  return d.kept.map((j, c) => {
    const name = names[j]!;
    const curve = partialDependence(predict, x, rows.length, p, c, dependenceGrid(x, rows.length, p, c, 25));
    const s = d.standardizer.names.indexOf(name);
    const unit = (z: number) => (s < 0 ? z : d.standardizer.mean[s]! + d.standardizer.std[s]! * z);
    return { feature: name, x: curve.grid.map(unit), mean: curve.mean };
  });
}
