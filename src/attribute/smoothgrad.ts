import type { RepeatScores, ScalarModel } from './types.ts';
import { columnMeans } from './column-mean.ts';
import { Rng } from '../util/rng.ts';

export interface SmoothGradOptions {
  /** Number of noisy copies per row (m). Default 16. */
  samples?: number;
  /** Noise scale as a fraction of each feature's range (max − min) over the rows given. Default 0.15. */
  noiseLevel?: number;
  /** Seed for the Gaussian noise. */
  seed: number;
}

/**
 * SmoothGrad (D. Smilkov, N. Thorat, B. Kim, F. Viégas, M. Wattenberg, "SmoothGrad: removing noise
 * by adding noise", 2017): ĝ(x_i) = (1/m) Σ_k ∇f(x_i + ε_k), ε_k ~ N(0, diag σ²) with
 * σ_j = noiseLevel · (max_j − min_j) over the rows given (their default, 15 % of the input range);
 * score S_j = (1/n) Σ_i |ĝ_j(x_i)|. Signed gradients are averaged first, then the absolute value taken.
 */
export function smoothGrad(model: ScalarModel, x: Float64Array, n: number, opts: SmoothGradOptions): RepeatScores {
  const p = model.p;
  const m = opts.samples ?? 16;
  const level = opts.noiseLevel ?? 0.15;
  const sigma = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < n; i++) {
      const v = x[i * p + j]!;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    sigma[j] = n > 0 ? level * (hi - lo) : 0;
  }
  const rng = new Rng(opts.seed);
  const acc = new Float64Array(n * p);
  const noisy = new Float64Array(n * p);
  for (let s = 0; s < m; s++) {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < p; j++) noisy[i * p + j] = x[i * p + j]! + sigma[j]! * rng.normal();
    }
    const g = model.inputGradients(noisy, n);
    for (let k = 0; k < n * p; k++) acc[k] += g[k]!;
  }
  const perRow = new Float64Array(n * p);
  for (let k = 0; k < n * p; k++) perRow[k] = Math.abs(acc[k]! / m);
  return { scores: columnMeans(perRow, n, p), perRow, n };
}
