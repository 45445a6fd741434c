import type { RepeatScores, ScalarModel } from './types.ts';
import { columnMeans } from './column-mean.ts';

/**
 * Gradient saliency: S_j = (1/n) Σ_i |∂f/∂x_j (x_i)| over the held-out rows (the mean absolute
 * input gradient; cf. Simonyan, Vedaldi & Zisserman 2014, averaged over rows). For a linear model
 * f = w·x + b it is |w_j| exactly.
 * @example gradientSaliency({p: 2, predict: …, inputGradients: () => [3, -1, 3, -1]}, x, 2) // scores [3, 1]
 */
export function gradientSaliency(model: ScalarModel, x: Float64Array, n: number): RepeatScores {
  const p = model.p;
  const g = model.inputGradients(x, n);
  const perRow = new Float64Array(n * p);
  for (let k = 0; k < n * p; k++) perRow[k] = Math.abs(g[k]!);
  return { scores: columnMeans(perRow, n, p), perRow, n };
}
