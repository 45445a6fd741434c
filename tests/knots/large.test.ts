import { describe, it, expect } from 'vitest';
import { braidSeifertMatrix, computeInvariants, exactOut, formatLaurent, laurent, parseDiagram, valueAtOne } from '../../src/knots/index.ts';

/**
 * Exactness beyond 2^53 on the family β_n = (σ1σ2⁻¹)^n of 3-braids. Outside facts used (from memory):
 * the closure of β_n has determinant L_{2n} − 2 (Lucas numbers L_0 = 2, L_1 = 1); n = 1, 2, 4, 5 give
 * the unknot, 4₁ (det 5), 8₁₈ (det 45), 10₁₂₃ (det 121); it is a knot when 3 ∤ n (σ1σ2 permutes the
 * strands by a 3-cycle). The Alexander polynomial is checked against Burau's formula
 * det(I − ψ(β)) = Δ(t)·(1 + t + t²) up to a unit ±t^k (Burau 1936; Birman, Braids, links and mapping
 * class groups, Thm 3.11), computed here independently with plain BigInt polynomials and the reduced
 * Burau matrices σ1 ↦ [[−t, 1], [0, 1]], σ2 ↦ [[1, 0], [t, −t]] (from memory).
 */
const word = (n: number): string => Array(n).fill('1 -2').join(' ');

function lucas(k: number): bigint {
  let a = 2n;
  let b = 1n;
  for (let i = 0; i < k; i++) [a, b] = [b, a + b];
  return a;
}

/** Plain fraction-free Bareiss determinant in BigInt, written here independently of src/knots/exact.ts (Bareiss 1968). */
function bareiss(m0: bigint[][]): bigint {
  const m = m0.map((r) => r.slice());
  const n = m.length;
  let sign = 1n;
  let prev = 1n;
  for (let k = 0; k < n - 1; k++) {
    if (m[k]![k] === 0n) {
      const p = m.findIndex((r, i) => i > k && r[k] !== 0n);
      if (p < 0) return 0n;
      [m[k], m[p]] = [m[p]!, m[k]!];
      sign = -sign;
    }
    for (let i = k + 1; i < n; i++)
      for (let j = k + 1; j < n; j++) m[i]![j] = (m[i]![j]! * m[k]![k]! - m[i]![k]! * m[k]![j]!) / prev;
    prev = m[k]![k]!;
  }
  return sign * m[n - 1]![n - 1]!;
}

type P = bigint[]; // ordinary polynomial, t^0 first
const add = (a: P, b: P): P => Array.from({ length: Math.max(a.length, b.length) }, (_, i) => (a[i] ?? 0n) + (b[i] ?? 0n));
const neg = (a: P): P => a.map((x) => -x);
const mul = (a: P, b: P): P => {
  const c = new Array<bigint>(a.length + b.length - 1).fill(0n);
  a.forEach((x, i) => b.forEach((y, j) => (c[i + j]! += x * y)));
  return c;
};
const mmul = (a: P[][], b: P[][]): P[][] => [0, 1].map((i) => [0, 1].map((j) => add(mul(a[i]![0]!, b[0]![j]!), mul(a[i]![1]!, b[1]![j]!))));

/** Conway-normalised Δ of the closure of (σ1σ2⁻¹)^n (3 ∤ n) from the reduced Burau matrices, lowest power first. */
function burauDelta(n: number): bigint[] {
  // t·ψ(σ1σ2⁻¹) = t·[[−t, 1], [0, 1]]·[[1, 0], [1, −1/t]] = [[t − t², −1], [t, −1]]
  const tM: P[][] = [[[0n, 1n, -1n], [-1n]], [[0n, 1n], [-1n]]];
  let N: P[][] = [[[1n], [0n]], [[0n], [1n]]];
  for (let k = 0; k < n; k++) N = mmul(N, tM); // N = t^n·ψ(β)
  // t^{2n}·det(I − ψ(β)) = t^{2n} − t^n·tr N + det N
  const t2n: P = [...new Array<bigint>(2 * n).fill(0n), 1n];
  const tn: P = [...new Array<bigint>(n).fill(0n), 1n];
  const det = add(mul(N[0]![0]!, N[1]![1]!), neg(mul(N[0]![1]!, N[1]![0]!)));
  const num = add(add(t2n, neg(mul(tn, add(N[0]![0]!, N[1]![1]!)))), det);
  // exact division by 1 + t + t² (long division from the top)
  const rem = num.slice();
  const q = new Array<bigint>(rem.length - 2).fill(0n);
  for (let k = q.length - 1; k >= 0; k--) {
    q[k] = rem[k + 2]!;
    rem[k] = rem[k]! - q[k]!;
    rem[k + 1] = rem[k + 1]! - q[k]!;
    rem[k + 2] = 0n;
  }
  expect(rem.every((x) => x === 0n)).toBe(true);
  let lo = 0;
  while (q[lo] === 0n) lo++;
  let hi = q.length - 1;
  while (q[hi] === 0n) hi--;
  const c = q.slice(lo, hi + 1);
  return c.reduce((s, x) => s + x, 0n) === 1n ? c : c.map((x) => -x);
}

describe('exact determinants and Alexander coefficients beyond 2^53: closures of (σ1σ2⁻¹)^n', () => {
  it('small members: unknot, 4₁, 8₁₈, 10₁₂₃ have det 1, 5, 45, 121 = L_{2n} − 2 (from memory)', () => {
    const expected: Record<number, number> = { 1: 1, 2: 5, 4: 45, 5: 121 };
    for (const [n, det] of Object.entries(expected)) {
      const r = computeInvariants(parseDiagram(word(Number(n)), 'braid'));
      expect(r.determinant, `n = ${n}`).toBe(det);
      expect(BigInt(det)).toBe(lucas(2 * Number(n)) - 2n);
    }
  });

  it('n = 40 (80 crossings): det = L_80 − 2 = 52361396397820125 exactly (a decimal string, past 2^53), = |det(V + Vᵀ)| by an independent Bareiss', () => {
    const r = computeInvariants(parseDiagram(word(40), 'braid'), { invariants: ['determinant'] });
    expect(lucas(80) - 2n).toBe(52361396397820125n); // from memory: L_80 = 52361396397820127
    expect(r.determinant).toBe('52361396397820125');
    const V = braidSeifertMatrix(parseDiagram(word(40), 'braid').braid!);
    const d = bareiss(V.map((row, i) => row.map((x, j) => BigInt(x + V[j]![i]!))));
    expect(d < 0n ? -d : d).toBe(lucas(80) - 2n);
  });

  it('n = 41 (82 crossings): Alexander coefficients past 2^53 are exact (no error), equal Burau’s formula, Δ(1) = 1, |Δ(−1)| = L_82 − 2', () => {
    const r = computeInvariants(parseDiagram(word(41), 'braid'));
    const c = r.alexander!.coefficients;
    expect(c.some((x) => x > BigInt(Number.MAX_SAFE_INTEGER) || x < -BigInt(Number.MAX_SAFE_INTEGER))).toBe(true);
    expect(c).toEqual(burauDelta(41));
    expect(r.alexander!.lowestExponent).toBe(-(c.length - 1) / 2);
    expect(valueAtOne(r.alexander!)).toBe(1n); // Δ(1) = 1 for knots (from memory)
    expect(r.determinant).toBe((lucas(82) - 2n).toString());
    // text form carries every digit
    const mid = c[(c.length - 1) / 2]!;
    expect(r.alexanderText).toContain(` ${mid < 0n ? -mid : mid} `);
  });

  it('exactOut: numbers up to 2^53 − 1, decimal strings beyond; formatLaurent prints big coefficients in full (common practice)', () => {
    expect(exactOut(9007199254740991n)).toBe(9007199254740991);
    expect(exactOut(-9007199254740991n)).toBe(-9007199254740991);
    expect(exactOut(9007199254740993n)).toBe('9007199254740993');
    expect(exactOut(-9007199254740993n)).toBe('-9007199254740993');
    expect(formatLaurent(laurent(-1, [-9007199254740993n, 3n, -9007199254740993n]))).toBe('-9007199254740993t + 3 - 9007199254740993t^-1');
  });
});
