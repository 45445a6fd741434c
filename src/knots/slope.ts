/**
 * Natural slope of a cusp: re(λ/μ) for the complex translations λ (longitude) and μ (meridian)
 * of the cusp torus, re(λ/μ) = (λ_re μ_re + λ_im μ_im) / |μ|².
 * @example naturalSlope(3, 0, 0, 1) // 0  (rectangular cusp)
 * @example naturalSlope(2, 1, 1, 0) // 2
 * A zero meridian gives NaN.
 */
export function naturalSlope(lonRe: number, lonIm: number, merRe: number, merIm: number): number {
  const d = merRe * merRe + merIm * merIm;
  if (d === 0) return Number.NaN;
  return (lonRe * merRe + lonIm * merIm) / d;
}
