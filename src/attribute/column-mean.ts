import { kahanSum } from '../util/sum.ts';

/**
 * Column means of a row-major n×p matrix with compensated (Neumaier) sums, so a long held-out set
 * loses no digits (A. Neumaier, ZAMM 54, 1974).
 * @example columnMeans(new Float64Array([1, 2, 3, 4]), 2, 2) // Float64Array [2, 3]
 */
export function columnMeans(m: Float64Array, n: number, p: number): Float64Array {
  const out = new Float64Array(p);
  if (n === 0) return out.fill(NaN);
  const col = new Float64Array(n);
  for (let j = 0; j < p; j++) {
    for (let i = 0; i < n; i++) col[i] = m[i * p + j]!;
    out[j] = kahanSum(col) / n;
  }
  return out;
}
