/**
 * Integer polynomials packed into one big integer (Kronecker substitution t = 2^B; A. Schönhage,
 * "Asymptotically fast algorithms for the numerical multiplication and division of polynomials with
 * complex coefficients", EUROCAL 1982; von zur Gathen & Gerhard, "Modern Computer Algebra", §8.4).
 * With every coefficient below 2^(B−1) in absolute value the packed value P(2^B) determines the
 * polynomial, sums and shifts by t^k act on it directly, and products and exact quotients are the
 * engine's big-integer product and quotient. B is a multiple of 4 so packing goes through hex text
 * in linear time.
 * @example unpack(pack([3n, -1n, 2n], 8), 8, 3) // [3n, -1n, 2n]
 */

/** Bits per coefficient for coefficients of absolute value at most 2^log2Bound (rounded up to a multiple of 4). */
export function packBits(log2Bound: number): number {
  return 4 * Math.ceil((Math.ceil(log2Bound) + 2) / 4);
}

function hexOf(mags: readonly bigint[], B: number): string {
  const w = B / 4;
  const parts: string[] = [];
  for (let i = mags.length - 1; i >= 0; i--) parts.push(mags[i]!.toString(16).padStart(w, '0'));
  return parts.join('');
}

/** P(2^B) for coefficients c (t^0 first), |c_i| < 2^(B−1). */
export function pack(c: readonly bigint[], B: number): bigint {
  if (c.length === 0) return 0n;
  const pos = c.map((x) => (x > 0n ? x : 0n));
  const neg = c.map((x) => (x < 0n ? -x : 0n));
  return BigInt('0x' + hexOf(pos, B)) - BigInt('0x' + hexOf(neg, B));
}

/** The n coefficients (t^0 first) of a packed polynomial whose coefficients satisfy |c_i| < 2^(B−1). */
export function unpack(P: bigint, B: number, n: number): bigint[] {
  if (n === 0) return [];
  const w = B / 4;
  const half = 1n << BigInt(B - 1);
  // adding 2^(B−1) to every digit makes all digits nonnegative: no borrows, plain hex digits
  const offset = BigInt('0x' + ('8' + '0'.repeat(w - 1)).repeat(n));
  const R = P + offset;
  if (R < 0n || R >> BigInt(B * n) !== 0n) throw new Error('unpack: a coefficient is out of range for the packing width');
  const hex = R.toString(16).padStart(n * w, '0');
  const out = new Array<bigint>(n);
  for (let i = 0; i < n; i++) out[i] = BigInt('0x' + hex.slice((n - 1 - i) * w, (n - i) * w)) - half;
  return out;
}
