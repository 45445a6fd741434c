/**
 * Roots of an integer polynomial on the unit circle, certified: ω = e^{2πix}, x ∈ (0, 1/2], each
 * root once with its multiplicity.
 *
 * 1. Square-free factorisation p = Π f_k^k over the integers (Yun; intpoly.ts): a root of f_k has
 *    multiplicity k in p.
 * 2. For a square-free f: the roots t = ±1 are read off exactly (f(±1) = 0); the unit-circle roots
 *    are among the roots of g = gcd(f, f*) (f* the reversed polynomial: a root z of f with 1/z also a
 *    root), and g is palindromic of even degree 2m once (t ∓ 1) are divided out, so
 *    g(t) = t^m·h(t + 1/t) with h of degree m (t^j + t^{−j} = P_j(x), P_{j+1} = x·P_j − P_{j−1}).
 *    Roots on the circle are exactly the real roots of h in (−2, 2) (x = 2cos θ); a root off the
 *    circle gives a non-real x or |x| > 2.
 * 3. Real roots of h in (−2, 2) isolated by Descartes' rule of signs with bisection (G. E. Collins &
 *    A. G. Akritas, "Polynomial real root isolation using Descartes' rule of signs", SYMSAC 1976;
 *    Vincent's theorem), all in exact integer arithmetic; then each isolating interval is halved by
 *    the sign of h at dyadic points until its image in x = θ/2π is narrower than 1e-13.
 *    θ = 2·atan2(√(2 − x), √(2 + x)) keeps full relative precision near x = ±2.
 * @example unitCircleRoots([1n, -1n, 1n]) // [{ x: 0.166666666667, lo: …, hi: … }]  (t² − t + 1: e^{±iπ/3})
 */
import { divide, gcdPoly, primitive, squareFree, trimTop, type IntPoly } from './intpoly.ts';
import type { LaurentPolynomial } from './poly.ts';
import { trimPoly } from './poly.ts';

/** Width in x below which an isolating interval counts as refined. */
export const ROOT_WIDTH = 1e-13;

export interface CircleRoot {
  /** x rounded to 12 decimals; ω = e^{2πix} */
  x: number;
  /** the root lies in [lo, hi] (floating-point images of exact dyadic bounds), hi − lo < 1e-13 */
  lo: number;
  hi: number;
}

export interface UnitRoot extends CircleRoot {
  multiplicity: number;
}

const valueAt = (p: readonly bigint[], t: bigint): bigint => p.reduceRight((acc, c) => acc * t + c, 0n);

/** p(y + a), by repeated synthetic division (O(n²) additions). */
function taylorShift(p: readonly bigint[], a: bigint): bigint[] {
  const q = p.slice();
  const n = q.length - 1;
  for (let i = 0; i < n; i++) for (let j = n - 1; j >= i; j--) q[j] = q[j]! + a * q[j + 1]!;
  return q;
}

/** Sign variations of (1 + y)^n·P(1/(1 + y)): bounds the roots of P in (0, 1), with their parity. */
function descartes(p: readonly bigint[]): number {
  const q = taylorShift(p.slice().reverse(), 1n);
  let v = 0;
  let last = 0n;
  for (const c of q) {
    if (c === 0n) continue;
    if (last !== 0n && (c < 0n) !== (last < 0n)) v++;
    last = c;
  }
  return v;
}

/** sign(P(N / 2^K)) exactly. */
function signAt(p: readonly bigint[], N: bigint, K: number): number {
  const n = p.length - 1;
  const D = 1n << BigInt(K);
  let acc = 0n;
  let Dpow = 1n;
  // Σ p_i N^i D^{n−i}, by Horner from the top with D powers accumulated
  for (let i = n; i >= 0; i--) {
    acc = acc * N + p[i]! * Dpow;
    Dpow *= D;
  }
  return acc > 0n ? 1 : acc < 0n ? -1 : 0;
}

/** x = θ/2π for 2cos θ = −2 + 4y, y = N/2^K ∈ [0, 1]. */
function xOf(N: bigint, K: number): number {
  const den = Number(1n << BigInt(K));
  const y = Number(N) / den;
  const oneMinus = Number((1n << BigInt(K)) - N) / den;
  return (2 * Math.atan2(Math.sqrt(oneMinus), Math.sqrt(y))) / (2 * Math.PI);
}

/** The polynomial h(x) with g(t) = t^m·h(t + 1/t) for a palindromic g of degree 2m. */
function halfDegree(g: readonly bigint[]): bigint[] {
  const m = (g.length - 1) / 2;
  let h: bigint[] = [g[m]!];
  let prev: bigint[] = [2n]; // P_0
  let cur: bigint[] = [0n, 1n]; // P_1
  for (let j = 1; j <= m; j++) {
    const c = g[m + j]!;
    h = Array.from({ length: Math.max(h.length, cur.length) }, (_, i) => (h[i] ?? 0n) + c * (cur[i] ?? 0n));
    const next = Array.from({ length: cur.length + 1 }, (_, i) => (i > 0 ? cur[i - 1]! : 0n) - (prev[i] ?? 0n));
    prev = cur;
    cur = next;
  }
  return trimTop(h);
}

/** H(y) = h(4y − 2): the interval (−2, 2) mapped to (0, 1). */
function toUnitInterval(h: readonly bigint[]): bigint[] {
  const s = taylorShift(h, -2n);
  let f = 1n;
  return s.map((c) => {
    const v = c * f;
    f *= 4n;
    return v;
  });
}

/** Refine an isolating interval (a/2^K, b/2^K) of a simple root of H with H(a), H(b) ≠ 0 of opposite signs. */
function refine(H: readonly bigint[], a: bigint, b: bigint, K: number): CircleRoot {
  let sa = signAt(H, a, K);
  for (let step = 0; step < 400; step++) {
    const xa = xOf(a, K);
    const xb = xOf(b, K);
    if (Math.abs(xa - xb) < ROOT_WIDTH) return { x: Math.round(((xa + xb) / 2) * 1e12) / 1e12, lo: Math.min(xa, xb), hi: Math.max(xa, xb) };
    a *= 2n;
    b *= 2n;
    K++;
    const mid = (a + b) / 2n;
    const sm = signAt(H, mid, K);
    if (sm === 0) {
      const x = xOf(mid, K);
      return { x: Math.round(x * 1e12) / 1e12, lo: x, hi: x };
    }
    if (sm === sa) {
      a = mid;
      sa = sm;
    } else b = mid;
  }
  throw new Error('internal: root refinement did not converge');
}

/**
 * Isolate the roots of H in (0, 1) (H square-free): Collins–Akritas bisection on
 * P(y) = 2^{kn}·H((c + y)/2^k), then refinement by signs.
 */
function isolate(H: readonly bigint[]): CircleRoot[] {
  const out: CircleRoot[] = [];
  // lr: H vanishes at the left end (a root found there earlier, divided out of p but not of H)
  const stack: Array<{ p: bigint[]; c: bigint; k: number; lr: boolean }> = [{ p: H.slice(), c: 0n, k: 0, lr: false }];
  while (stack.length > 0) {
    const { p: p0, c, k, lr } = stack.pop()!;
    let p = p0;
    let leftRoot = lr;
    if (p[0] === 0n) {
      leftRoot = true;
      // a root exactly at the left end y = c/2^k (a midpoint of the parent)
      const x = xOf(c, k);
      out.push({ x: Math.round(x * 1e12) / 1e12, lo: x, hi: x });
      p = p.slice(1);
    }
    if (p.length <= 1) continue;
    const v = descartes(p);
    if (v === 0) continue;
    // refine by signs once neither end is a root of H (else keep halving)
    if (v === 1 && !leftRoot && valueAt(p, 1n) !== 0n) {
      out.push(refine(H, c, c + 1n, k));
      continue;
    }
    const n = p.length - 1;
    const left = p.map((x, i) => x << BigInt(n - i)); // 2^n·P(y/2)
    stack.push({ p: taylorShift(left, 1n), c: 2n * c + 1n, k: k + 1, lr: false });
    stack.push({ p: left, c: 2n * c, k: k + 1, lr: leftRoot });
  }
  return out;
}

/** Unit-circle roots e^{2πix}, x ∈ (0, 1/2], of a square-free integer polynomial (t^0 first), sorted. */
export function unitCircleRoots(f0: readonly bigint[]): CircleRoot[] {
  let f = primitive(trimPoly(f0).coeffs);
  const out: CircleRoot[] = [];
  if (f.length <= 1) return out;
  if (valueAt(f, -1n) === 0n) {
    out.push({ x: 0.5, lo: 0.5, hi: 0.5 });
    f = divide(f, [1n, 1n]);
  }
  if (valueAt(f, 1n) === 0n) f = divide(f, [-1n, 1n]);
  if (f.length <= 1) return out;
  const rev = f.slice().reverse();
  const self = rev.every((c, i) => c === f[i]) || rev.every((c, i) => c === -f[i]!);
  const g = self ? f : gcdPoly(f, rev);
  if (g.length > 1) {
    const pal = g.every((c, i) => c === g[g.length - 1 - i]) && (g.length - 1) % 2 === 0;
    if (!pal) throw new Error('internal: the self-reciprocal part is not palindromic of even degree');
    out.push(...isolate(toUnitInterval(halfDegree(g))));
  }
  return out.sort((a, b) => a.x - b.x);
}

/**
 * Roots of a Laurent polynomial on the unit circle, x ∈ (0, 1/2], each once with its multiplicity
 * (the roots at 1 − x are the conjugates). The zero polynomial has no isolated roots: [].
 */
export function alexanderUnitRoots(p: LaurentPolynomial): UnitRoot[] {
  const c = trimPoly(p.coefficients).coeffs;
  if (c.length <= 1) return [];
  const out: UnitRoot[] = [];
  for (const { factor, multiplicity } of squareFree(c)) for (const r of unitCircleRoots(factor)) out.push({ ...r, multiplicity });
  return out.sort((a, b) => a.x - b.x);
}

export type { IntPoly };
