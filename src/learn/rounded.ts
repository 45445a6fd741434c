/**
 * Fraction of rows whose prediction, rounded to the nearest integer, equals the integer target:
 * (1/n) Σ [round(ŷ_i) = y_i] (the accuracy of a regression read as a classifier of integers;
 * common practice beside RMSE for integer targets). Halves round up (Math.round). NaN for n = 0.
 * @example roundedHitRate([0.9, 2.4, 2.6], [1, 2, 2]) // 2/3
 */
export function roundedHitRate(predicted: ArrayLike<number>, actual: ArrayLike<number>): number {
  const n = actual.length;
  if (n === 0) return Number.NaN;
  let hits = 0;
  for (let i = 0; i < n; i++) if (Math.round(predicted[i]!) === actual[i]) hits++;
  return hits / n;
}
