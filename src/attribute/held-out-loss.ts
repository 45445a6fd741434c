/**
 * What permutation importance measures on held-out rows: a model as attribution sees it (a
 * classifier also gives class probabilities and classes) and its loss per row.
 */
import type { ScalarModel } from './types.ts';
import { squaredErrorLoss, type RowLoss } from './permutation.ts';

/** A model as attribution sees it; a classifier also gives class probabilities (n×K) for its loss. */
export interface AttributableModel extends ScalarModel {
  /** Class values c_k (classification), else null/undefined. */
  classes?: readonly number[] | null;
  predictProba?(x: Float64Array, n: number): Float64Array;
  /** The most probable class value per row (classification). */
  predictClass?(x: Float64Array, n: number): Float64Array;
}

/** Held-out loss of a classifier for permutation importance. */
export type ClassificationLoss = 'error' | 'cross-entropy';

/**
 * Held-out loss per row for permutation importance. Regression: squared error (its mean is the MSE).
 * Classification, 'error' (default): 1 − [predicted class = y_i], so the importance is the drop in
 * accuracy; 'cross-entropy': −log p_{y_i}(x_i) (nats, floored at 1e-12), graded but measured ~8×
 * slower here because it reads every class probability (README). A class never seen in training
 * counts as an error / as the floor.
 */
export function heldOutLoss(model: AttributableModel, y: Float64Array, loss: ClassificationLoss = 'error'): RowLoss {
  const classes = model.classes;
  if (!classes) return squaredErrorLoss((x, n) => model.predict(x, n), y);
  if (loss === 'error') {
    if (!model.predictClass) throw new RangeError('heldOutLoss: a classifier needs predictClass');
    return (x, n) => {
      const c = model.predictClass!(x, n);
      return Float64Array.from({ length: n }, (_, i) => (c[i] === y[i] ? 0 : 1));
    };
  }
  if (!model.predictProba) throw new RangeError('heldOutLoss: cross-entropy needs predictProba');
  const K = classes.length;
  const index = new Map<number, number>(classes.map((c, k) => [c, k]));
  return (x, n) => {
    const pr = model.predictProba!(x, n);
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const k = index.get(y[i]!);
      out[i] = -Math.log(Math.max(1e-12, k === undefined ? 0 : pr[i * K + k]!));
    }
    return out;
  };
}
