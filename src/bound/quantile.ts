import { selectValues } from './select.ts';

/** The quantile definition used everywhere in this stage, stated in outputs. */
export const QUANTILE_DEFINITION =
  'Hyndman & Fan (1996) type 7: linear interpolation between order statistics at h = (n-1)p';

/**
 * Sample quantiles of `values` at each probability in `ps`, Hyndman & Fan type 7 (R. J. Hyndman
 * and Y. Fan, "Sample quantiles in statistical packages", The American Statistician 50, 1996):
 * with the sorted sample x₀ ≤ … ≤ x₍ₙ₋₁₎ and h = (n−1)p, Q(p) = x⌊h⌋ + (h − ⌊h⌋)(x⌊h⌋₊₁ − x⌊h⌋).
 * Works by selection on one copy (expected O(n) per probability), never a full sort; `values` is
 * not modified. Throws RangeError on an empty sample or p outside [0, 1]; values must not be NaN.
 * @example quantilesType7(new Float64Array([1, 2, 3, 4]), [0.5]) // [2.5]
 */
export function quantilesType7(values: Float64Array, ps: readonly number[]): number[] {
  return quantilesType7InPlace(Float64Array.from(values), ps);
}

/** As quantilesType7, but reorders `a` itself instead of a copy (for callers that own a scratch array). */
export function quantilesType7InPlace(a: Float64Array, ps: readonly number[]): number[] {
  const n = a.length;
  if (n === 0) throw new RangeError('quantiles of an empty sample');
  // process probabilities in increasing order so each selection narrows the next range
  const order = ps.map((p, i) => ({ p, i })).sort((u, v) => u.p - v.p);
  const out = new Array<number>(ps.length);
  let lo = 0;
  for (const { p, i } of order) {
    if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile probability must lie in [0, 1], got ${p}`);
    const h = (n - 1) * p;
    const k = Math.floor(h);
    selectValues(a, lo, n - 1, k);
    const xk = a[k]!;
    let value = xk;
    const frac = h - k;
    if (frac > 0 && k + 1 < n) {
      // the next order statistic is the minimum of the part above k
      let next = Infinity;
      for (let j = k + 1; j < n; j++) if (a[j]! < next) next = a[j]!;
      value = xk + frac * (next - xk);
    }
    out[i] = value;
    lo = k;
  }
  return out;
}
