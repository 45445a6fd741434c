import { gcd } from '../util/gcd.ts';

/** A small rational exponent p/q (q ≥ 1, in lowest terms). */
export interface SmallRational {
  num: number;
  den: number;
  value: number;
  /** `2`, `-1`, `1/2`, `-3/4` */
  text: string;
}

function rational(num: number, den: number): SmallRational {
  const g = gcd(num, den) || 1;
  const p = num / g;
  const q = den / g;
  return { num: p, den: q, value: p / q, text: q === 1 ? String(p) : `${p}/${q}` };
}

/**
 * The simplest fraction p/q with q ≤ maxDen and |p/q| ≤ maxAbs within `tol` of x: smallest q, then
 * the one nearest x (so 0 or an integer whenever one is close enough); when none is within `tol`,
 * the nearest such fraction. The Farey fractions of order maxDen (G. H. Hardy & E. M. Wright, An
 * Introduction to the Theory of Numbers, ch. III) are scanned by denominator, O(maxDen).
 * @example snapRational(1.97, 4, 4, 0.1).text // '2'
 * @example snapRational(0.34, 4, 4, 0.05).text // '1/3'
 */
export function snapRational(x: number, maxDen: number, maxAbs: number, tol: number): SmallRational {
  let nearest: SmallRational | null = null;
  for (let q = 1; q <= maxDen; q++) {
    const p = Math.max(-maxAbs * q, Math.min(maxAbs * q, Math.round(x * q)));
    const r = rational(p, q);
    const err = Math.abs(r.value - x);
    if (err <= tol) return r;
    if (nearest === null || err < Math.abs(nearest.value - x)) nearest = r;
  }
  return nearest!;
}
