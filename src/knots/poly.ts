/**
 * Integer (Laurent) polynomials for the Alexander polynomial: exact arithmetic in BigInt, the
 * determinant of a linear matrix pencil det(A + t·B) by evaluation at t = 0..d and exact
 * interpolation, and the Conway normalisation Δ(t) = Δ(t⁻¹).
 */
import { bareissDet } from './exact.ts';

/**
 * A Laurent polynomial with integer coefficients (exact, BigInt), lowest power first. Exponents are
 * `lowestExponent + k`; `lowestExponent` is a multiple of 1/2 (half-integer powers occur for
 * links with an even number of components).
 */
export interface LaurentPolynomial {
  lowestExponent: number;
  coefficients: bigint[];
}

/** A Laurent polynomial from plain integer coefficients (lowest power first). */
export function laurent(lowestExponent: number, coefficients: readonly (number | bigint)[]): LaurentPolynomial {
  return { lowestExponent, coefficients: coefficients.map((x) => BigInt(x)) };
}

/** An exact integer for JSON and tables: a number when |x| ≤ 2^53 − 1, else its decimal string. */
export function exactOut(x: bigint): number | string {
  return x <= BigInt(Number.MAX_SAFE_INTEGER) && x >= -BigInt(Number.MAX_SAFE_INTEGER) ? Number(x) : x.toString();
}

/** Strip zero coefficients at both ends of an ordinary polynomial (t^0 first); returns [shift, coeffs]. */
export function trimPoly(c: readonly bigint[]): { shift: number; coeffs: bigint[] } {
  let lo = 0;
  while (lo < c.length && c[lo] === 0n) lo++;
  let hi = c.length - 1;
  while (hi >= lo && c[hi] === 0n) hi--;
  return { shift: lo, coeffs: c.slice(lo, hi + 1) };
}

/** Exact division of ordinary polynomials (t^0 first); throws when the remainder is not zero. */
export function polyDivExact(num: readonly bigint[], den: readonly bigint[]): bigint[] {
  const d = trimPoly(den);
  if (d.coeffs.length === 0) throw new Error('polyDivExact: division by zero');
  const rem = num.slice(d.shift).map((x) => x);
  for (let i = 0; i < d.shift; i++) if (num[i] !== 0n && num[i] !== undefined) throw new Error('polyDivExact: not divisible');
  const dc = d.coeffs;
  const lead = dc[dc.length - 1]!;
  const qLen = rem.length - dc.length + 1;
  if (qLen <= 0) {
    if (rem.some((x) => x !== 0n)) throw new Error('polyDivExact: not divisible');
    return [];
  }
  const q = new Array<bigint>(qLen).fill(0n);
  for (let k = qLen - 1; k >= 0; k--) {
    const top = rem[k + dc.length - 1]!;
    if (top % lead !== 0n) throw new Error('polyDivExact: not divisible');
    const f = top / lead;
    q[k] = f;
    if (f !== 0n) for (let j = 0; j < dc.length; j++) rem[k + j] = rem[k + j]! - f * dc[j]!;
  }
  if (rem.some((x) => x !== 0n)) throw new Error('polyDivExact: not divisible');
  return q;
}

/**
 * The polynomial of degree ≤ d through (t, f(t)) for t = 0..d, with integer coefficients:
 * Newton's forward-difference formula f(t) = Σ_k Δᵏf(0)·C(t, k) (Newton; see Knuth, TAOCP
 * vol. 1, §1.2.6), expanded in the monomial basis with every division exact.
 */
export function interpolateIntegerNodes(values: readonly bigint[]): bigint[] {
  const d = values.length - 1;
  const diff = values.slice();
  const deltas: bigint[] = [];
  for (let k = 0; k <= d; k++) {
    deltas.push(diff[0]!);
    for (let i = 0; i < diff.length - 1; i++) diff[i] = diff[i + 1]! - diff[i]!;
    diff.pop();
  }
  // Σ_k deltas[k] · t(t−1)…(t−k+1) / k!, accumulated times d! to stay in integers.
  let dFact = 1n;
  for (let k = 2; k <= d; k++) dFact *= BigInt(k);
  const acc = new Array<bigint>(d + 1).fill(0n);
  let falling: bigint[] = [1n];
  let kFact = 1n;
  for (let k = 0; k <= d; k++) {
    if (k > 0) {
      kFact *= BigInt(k);
      const next = new Array<bigint>(falling.length + 1).fill(0n);
      const r = BigInt(k - 1);
      for (let j = 0; j < falling.length; j++) {
        next[j + 1] = next[j + 1]! + falling[j]!;
        next[j] = next[j]! - r * falling[j]!;
      }
      falling = next;
    }
    const scale = deltas[k]! * (dFact / kFact);
    if (scale !== 0n) for (let j = 0; j < falling.length; j++) acc[j] = acc[j]! + scale * falling[j]!;
  }
  return acc.map((x) => {
    if (x % dFact !== 0n) throw new Error('interpolateIntegerNodes: values are not those of an integer polynomial');
    return x / dFact;
  });
}

/**
 * det(A + t·B) for square integer matrices as an ordinary polynomial (t^0 first): exact
 * determinants (Bareiss) at t = 0..n and exact interpolation; the degree is at most n.
 */
export function pencilDeterminant(a: readonly (readonly number[])[], b: readonly (readonly number[])[]): bigint[] {
  const n = a.length;
  const values: bigint[] = [];
  for (let t = 0; t <= n; t++) {
    const m = a.map((row, i) => row.map((x, j) => BigInt(x) + BigInt(t) * BigInt(b[i]![j]!)));
    values.push(bareissDet(m));
  }
  return interpolateIntegerNodes(values);
}

/**
 * Centre an ordinary polynomial p(t) (t^0 first) so that it is symmetric about t^0, i.e. return
 * t^(−s/2)·p(t) as a Laurent polynomial with the zero ends trimmed; `negate` flips the sign.
 */
export function centre(p: readonly bigint[], negate = false): LaurentPolynomial {
  const { coeffs } = trimPoly(p);
  if (coeffs.length === 0) return { lowestExponent: 0, coefficients: [] };
  const span = coeffs.length - 1;
  return {
    lowestExponent: -span / 2,
    coefficients: negate ? coeffs.map((x) => -x) : coeffs.slice(),
  };
}

/** True when the coefficients read the same from both ends. */
export function isSymmetric(p: LaurentPolynomial): boolean {
  const c = p.coefficients;
  for (let i = 0; i < c.length; i++) if (c[i] !== c[c.length - 1 - i]) return false;
  return p.coefficients.length === 0 || p.lowestExponent === -(c.length - 1) / 2;
}

/** Value at t = 1 (exact). */
export function valueAtOne(p: LaurentPolynomial): bigint {
  return p.coefficients.reduce((s, x) => s + x, 0n);
}

/**
 * Value at t = −1, taking t^(1/2) = i for half-integer exponents: returned as [re, im] with
 * exactly one part nonzero (or both zero).
 */
export function valueAtMinusOne(p: LaurentPolynomial): [bigint, bigint] {
  let re = 0n;
  let im = 0n;
  p.coefficients.forEach((c, k) => {
    const e2 = Math.round(2 * (p.lowestExponent + k)); // i^(e2)
    const r = ((e2 % 4) + 4) % 4;
    if (r === 0) re += c;
    else if (r === 1) im += c;
    else if (r === 2) re -= c;
    else im -= c;
  });
  return [re, im];
}

/** Product of two Laurent polynomials (exact). */
export function multiplyLaurent(a: LaurentPolynomial, b: LaurentPolynomial): LaurentPolynomial {
  if (a.coefficients.length === 0 || b.coefficients.length === 0) return { lowestExponent: 0, coefficients: [] };
  const c = new Array<bigint>(a.coefficients.length + b.coefficients.length - 1).fill(0n);
  a.coefficients.forEach((x, i) => b.coefficients.forEach((y, j) => (c[i + j]! += x * y)));
  return { lowestExponent: a.lowestExponent + b.lowestExponent, coefficients: c };
}

function expText(e: number): string {
  if (Number.isInteger(e)) return e < 0 ? `^${e}` : `^${e}`;
  const n = Math.round(2 * e);
  return `^(${n}/2)`;
}

/**
 * Text form, highest power first: `t - 1 + t^-1`, `2t^2 - 3t + 1`, `t^(1/2) - t^(-1/2)`;
 * the zero polynomial is `0`.
 */
export function formatLaurent(p: LaurentPolynomial, variable = 't'): string {
  const parts: string[] = [];
  for (let k = p.coefficients.length - 1; k >= 0; k--) {
    const c = p.coefficients[k]!;
    if (c === 0n) continue;
    const e = p.lowestExponent + k;
    const abs = c < 0n ? -c : c;
    let term: string;
    if (e === 0) term = abs.toString();
    else {
      const mono = e === 1 ? variable : `${variable}${expText(e)}`;
      term = abs === 1n ? mono : `${abs}${mono}`;
    }
    if (parts.length === 0) parts.push(c < 0n ? `-${term}` : term);
    else parts.push(c < 0n ? `- ${term}` : `+ ${term}`);
  }
  return parts.length === 0 ? '0' : parts.join(' ');
}
