/**
 * Kahan–Babuška (Neumaier) compensated sum (A. Neumaier, ZAMM 54, 1974): the error does not grow
 * with the length of the column. NaN propagates.
 * @example kahanSum(new Float64Array([1e100, 1, -1e100])) // 1
 */
export function kahanSum(xs: ArrayLike<number>, rows?: ArrayLike<number>): number {
  let s = 0;
  let c = 0;
  const n = rows ? rows.length : xs.length;
  for (let k = 0; k < n; k++) {
    const x = rows ? xs[rows[k]!]! : xs[k]!;
    const t = s + x;
    if (Math.abs(s) >= Math.abs(x)) c += s - t + x;
    else c += x - t + s;
    s = t;
  }
  return s + c;
}
