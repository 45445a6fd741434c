/** Score any fitted model (network, ridge, constant) on held-out rows. */
import { SurmiseError } from '../errors.ts';
import type { TrainData } from './data.ts';
import { accuracy, balancedAccuracy, mae, r2, rmse } from './metrics.ts';
import type { Task } from './options.ts';

/** What evaluate needs of a model. */
export interface Predictor {
  task: Task;
  predict(x: Float64Array | Float32Array, n: number): Float64Array;
  predictClass(x: Float64Array | Float32Array, n: number): Float64Array;
}

export interface Evaluation {
  metric: 'r2' | 'accuracy';
  score: number;
  /** held-out rows scored */
  n: number;
  /** regression */
  rmse?: number;
  mae?: number;
  /** classification */
  balancedAccuracy?: number;
}

/**
 * Regression: R² of `predict` (with RMSE and MAE). Classification: accuracy of `predictClass`
 * (with balanced accuracy). Pass held-out rows only.
 */
export function evaluate(model: Predictor, data: TrainData): Evaluation {
  if (data.n < 1) throw new SurmiseError('learn.noRows', 'evaluate: no held-out rows');
  if (model.task === 'regression') {
    const yhat = model.predict(data.x, data.n);
    return { metric: 'r2', score: r2(data.y, yhat), n: data.n, rmse: rmse(data.y, yhat), mae: mae(data.y, yhat) };
  }
  const c = model.predictClass(data.x, data.n);
  return { metric: 'accuracy', score: accuracy(data.y, c), n: data.n, balancedAccuracy: balancedAccuracy(data.y, c) };
}
