/**
 * Integer polynomials (BigInt coefficients, t^0 first, no zero at the top) for root finding: content,
 * derivative, greatest common divisor by the primitive remainder sequence, and the square-free
 * factorisation p = Π f_k^k (D. Y. Y. Yun, "On square-free decomposition algorithms", SYMSAC 1976;
 * von zur Gathen & Gerhard, "Modern Computer Algebra", §14.6). Every step is exact.
 * @example squareFree([1n, -2n, 1n]) // [{ factor: [-1n, 1n], multiplicity: 2 }]  (t² − 2t + 1 = (t − 1)²)
 */
import { polyDivExact } from './poly.ts';

export type IntPoly = bigint[];

/** Drop zero coefficients at the top. */
export function trimTop(p: readonly bigint[]): IntPoly {
  let hi = p.length - 1;
  while (hi >= 0 && p[hi] === 0n) hi--;
  return p.slice(0, hi + 1);
}

const abs = (x: bigint): bigint => (x < 0n ? -x : x);
function gcdInt(a: bigint, b: bigint): bigint {
  a = abs(a);
  b = abs(b);
  while (b) [a, b] = [b, a % b];
  return a;
}

/** The primitive part with a positive leading coefficient. */
export function primitive(p: readonly bigint[]): IntPoly {
  const q = trimTop(p);
  if (q.length === 0) return q;
  let g = 0n;
  for (const x of q) if (x !== 0n && g !== 1n) g = gcdInt(g, x);
  if (q[q.length - 1]! < 0n) g = -g;
  return q.map((x) => x / g);
}

export function derivative(p: readonly bigint[]): IntPoly {
  return trimTop(p.slice(1).map((x, k) => x * BigInt(k + 1)));
}

/** Pseudo-remainder lc(b)^(deg a − deg b + 1)·a mod b. */
function pseudoRemainder(a: readonly bigint[], b: readonly bigint[]): IntPoly {
  const r = a.slice();
  const db = b.length - 1;
  const lb = b[db]!;
  for (let k = r.length - 1; k >= db; k--) {
    const c = r[k]!;
    for (let i = 0; i < r.length; i++) r[i] = r[i]! * lb;
    if (c !== 0n) for (let j = 0; j <= db; j++) r[k - db + j] = r[k - db + j]! - c * b[j]!;
    r.length = k; // the top coefficient is now zero
  }
  return trimTop(r);
}

/** Primitive greatest common divisor (positive leading coefficient); gcd(0, 0) = 0. */
export function gcdPoly(a: readonly bigint[], b: readonly bigint[]): IntPoly {
  let x = primitive(a);
  let y = primitive(b);
  if (x.length < y.length) [x, y] = [y, x];
  while (y.length > 0) {
    const r = primitive(pseudoRemainder(x, y));
    x = y;
    y = r;
  }
  return x;
}

/** Exact quotient of integer polynomials (throws when not divisible over the integers). */
export function divide(a: readonly bigint[], b: readonly bigint[]): IntPoly {
  return trimTop(polyDivExact(a, b));
}

export interface SquareFreeFactor {
  /** primitive, square-free, positive leading coefficient, degree ≥ 1 */
  factor: IntPoly;
  multiplicity: number;
}

/**
 * Yun's square-free factorisation of a nonzero integer polynomial, up to its content and sign:
 * p = c·Π f_k^k with the f_k square-free and pairwise coprime; factors of degree 0 are left out.
 */
export function squareFree(p: readonly bigint[]): SquareFreeFactor[] {
  const f = primitive(p);
  if (f.length <= 1) return [];
  const out: SquareFreeFactor[] = [];
  const df = derivative(f);
  const a0 = gcdPoly(f, df);
  // b_i = Π_{j ≥ i} f_j and c_i − b_i' = d_i = b_i/… (Yun): a_i = gcd(b_i, d_i) = f_i; the same exact
  // quotients keep every scalar consistent
  let b = divide(f, a0);
  let c = divide(df, a0);
  for (let k = 1; b.length > 1; k++) {
    const db = derivative(b);
    const d = trimTop(Array.from({ length: Math.max(c.length, db.length) }, (_, i) => (c[i] ?? 0n) - (db[i] ?? 0n)));
    const a = gcdPoly(b, d);
    if (a.length > 1) out.push({ factor: a, multiplicity: k });
    b = divide(b, a);
    c = divide(d, a);
  }
  return out;
}
