/** The constant baseline: the training mean (regression) or the majority class (classification). */
import { SurmiseError } from '../errors.ts';
import { kahanSum } from '../util/sum.ts';
import { chooseTask, type Task } from './options.ts';

export interface ConstantModel {
  kind: 'constant';
  task: Task;
  /** regression: the training mean; classification: the most frequent training value (ties: the smallest) */
  value: number;
  predict(x: Float64Array | Float32Array | null, n: number): Float64Array;
  predictClass(x: Float64Array | Float32Array | null, n: number): Float64Array;
  toJSON(): { kind: 'constant'; task: Task; value: number };
}

/** Fit the constant baseline on the training targets. */
export function fitConstant(y: Float64Array, task: Task = chooseTask(y)): ConstantModel {
  if (y.length === 0) throw new SurmiseError('learn.noRows', 'no training rows for the constant baseline');
  let value: number;
  if (task === 'regression') value = kahanSum(y) / y.length;
  else {
    const count = new Map<number, number>();
    for (const v of y) count.set(v, (count.get(v) ?? 0) + 1);
    value = NaN;
    let bestC = -1;
    for (const [v, c] of count) if (c > bestC || (c === bestC && v < value)) [value, bestC] = [v, c];
  }
  const fill = (_x: unknown, n: number) => new Float64Array(n).fill(value);
  return { kind: 'constant', task, value, predict: fill, predictClass: fill, toJSON: () => ({ kind: 'constant', task, value }) };
}
