/**
 * Greatest common divisor of two integers by Euclid's algorithm (Elements VII.2); always ≥ 0,
 * gcd(a, 0) = |a|, gcd(0, 0) = 0.
 * @example gcd(-12, 18) // 6
 */
export function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) [a, b] = [b, a % b];
  return a;
}
