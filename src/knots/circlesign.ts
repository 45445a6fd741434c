/**
 * The sign of a link's Conway-normalised Δ when det(V + Vᵀ) = 0, from one exact evaluation on the
 * unit circle instead of the whole pencil det(V − tVᵀ).
 *
 * With t^{1/2} = u = (a + bi)/c on the circle (a² + b² = c², a Pythagorean triple),
 * Δ(u²) = det(ūV − uVᵀ) = (−i)^m·det K, K = i(ūV − uVᵀ), and c·K = b(V + Vᵀ) + i·a(V − Vᵀ) is a
 * Hermitian matrix with integer real and imaginary parts. The real symmetric embedding
 * [[A, −B], [B, A]] has every eigenvalue of K twice, so sign det K = (−1)^(negatives/2), exactly
 * (sparse fraction-free elimination, sparse.ts). Evaluating the candidate Δ at u in Gaussian
 * integers then tells whether it must be negated. A point where K is singular (u² a root of Δ) is
 * skipped for the next triple.
 */
import type { LaurentPolynomial } from './poly.ts';
import { sparseInertia } from './sparse.ts';

const TRIPLES: ReadonlyArray<readonly [number, number, number]> = [[3, 4, 5], [5, 12, 13], [8, 15, 17], [7, 24, 25], [20, 21, 29], [12, 35, 37]];

type G = [bigint, bigint]; // a + bi
const gmul = (x: G, y: G): G => [x[0] * y[0] - x[1] * y[1], x[0] * y[1] + x[1] * y[0]];

/**
 * +1 when `alex` (Δ up to sign, centred) is Conway's Δ for the Seifert matrix V, −1 when its negative
 * is, undefined when every tried point is a root (Δ = 0 is left to the caller).
 */
export function conwaySign(alex: LaurentPolynomial, V: readonly (readonly number[])[]): 1 | -1 | undefined {
  const m = V.length;
  const coef = alex.coefficients;
  if (coef.length === 0) return undefined;
  for (const [a, b, c] of TRIPLES) {
    const entries: Array<[number, number, number]> = [];
    for (let i = 0; i < m; i++)
      for (let j = 0; j < m; j++) {
        const A = b * (V[i]![j]! + V[j]![i]!);
        const B = a * (V[i]![j]! - V[j]![i]!);
        if (A !== 0 && i <= j) {
          entries.push([i, j, A]);
          entries.push([i + m, j + m, A]);
        }
        if (B !== 0) entries.push([i + m, j, B]); // lower-left block B; upper-right −B = Bᵀ is its mirror
      }
    const inertia = sparseInertia(2 * m, entries);
    if (inertia.zero > 0) continue;
    const detSign = (inertia.negative / 2) % 2 === 0 ? 1n : -1n;
    // G = c^(2K + |2e₀|)·Δ_cand(u²) = (a − bi)^|2e₀| · Σ_k coef_k (a + bi)^{2k} (c²)^{K−k}   (e₀ ≤ 0 the lowest exponent)
    const K = coef.length - 1;
    const z = gmul([BigInt(a), BigInt(b)], [BigInt(a), BigInt(b)]);
    const w = BigInt(c) * BigInt(c);
    let acc: G = [coef[K]!, 0n];
    let wPow = 1n;
    for (let k = K - 1; k >= 0; k--) {
      wPow *= w;
      acc = gmul(acc, z);
      acc = [acc[0] + coef[k]! * wPow, acc[1]];
    }
    const low = Math.round(-2 * alex.lowestExponent);
    for (let k = 0; k < low; k++) acc = gmul(acc, [BigInt(a), -BigInt(b)]);
    // Δ_true(u²)·i^m = det K (real, sign detSign); Δ_cand = ±Δ_true
    for (let k = 0; k < ((m % 4) + 4) % 4; k++) acc = gmul(acc, [0n, 1n]);
    if (acc[1] !== 0n || acc[0] === 0n) throw new Error('internal: Δ at a point of the circle is not the real number the Seifert form gives');
    return (acc[0] > 0n) === (detSign > 0n) ? 1 : -1;
  }
  return undefined;
}
