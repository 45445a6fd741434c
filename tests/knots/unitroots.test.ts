import { describe, it, expect } from 'vitest';
import { alexanderUnitRoots, unitCircleRoots } from '../../src/knots/unitroots.ts';
import { computeInvariants, diagramFrom, laurent, torusBraid } from '../../src/knots/index.ts';
import { polyDivExact } from '../../src/knots/poly.ts';

const mul = (a: bigint[], b: bigint[]): bigint[] => {
  const c = new Array<bigint>(a.length + b.length - 1).fill(0n);
  a.forEach((x, i) => b.forEach((y, j) => (c[i + j]! += x * y)));
  return c;
};
const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);

/** Cyclotomic polynomials from t^n − 1 = Π_{d | n} Φ_d (facts of the trade), built here. */
const cyclo: bigint[][] = [[], [-1n, 1n]];
for (let n = 2; n <= 40; n++) {
  let p: bigint[] = [-1n, ...new Array<bigint>(n - 1).fill(0n), 1n];
  for (let d = 1; d < n; d++) if (n % d === 0) p = polyDivExact(p, cyclo[d]!);
  cyclo.push(p);
}
/** The primitive n-th roots of unity e^{2πik/n} with k/n ∈ (0, 1/2]. */
const primitiveRoots = (n: number): number[] => Array.from({ length: n }, (_, k) => k).filter((k) => k > 0 && 2 * k <= n && gcd(k, n) === 1).map((k) => k / n);

describe('unit-circle roots, certified (Descartes bisection on h(t + 1/t); Collins & Akritas 1976)', () => {
  it('Φ_n for n = 2..40 has exactly the primitive n-th roots of unity, each within 1e-12 (facts of the trade)', () => {
    for (let n = 2; n <= 40; n++) {
      const r = unitCircleRoots(cyclo[n]!);
      const want = primitiveRoots(n);
      expect(r.length, `Φ${n}`).toBe(want.length);
      r.forEach((x, i) => {
        expect(Math.abs(x.x - want[i]!), `Φ${n} root ${i}`).toBeLessThan(1e-12);
        expect(x.lo).toBeLessThanOrEqual(want[i]! + 1e-15);
        expect(x.hi).toBeGreaterThanOrEqual(want[i]! - 1e-15);
      });
    }
  });

  it('products whose roots sit on dyadic bisection points (x = 1/4, 1/3, 1/6: 2cos θ = 0, −1, 1) next to irrational ones (Φ4Φ3Φ6Φ12Φ24)', () => {
    const p = [4, 3, 6, 12, 24].reduce<bigint[]>((acc, n) => mul(acc, cyclo[n]!), [1n]);
    const want = [4, 3, 6, 12, 24].flatMap(primitiveRoots).sort((a, b) => a - b);
    const got = unitCircleRoots(p).map((r) => r.x);
    expect(got.length).toBe(want.length);
    got.forEach((x, i) => expect(Math.abs(x - want[i]!)).toBeLessThan(1e-12));
  });

  it('5₂: Δ = 2t − 3 + 2t⁻¹ has its roots on the circle at cos 2πx = 3/4 (hand computation; from memory for Δ)', () => {
    const r = alexanderUnitRoots(laurent(-1, [2, -3, 2]));
    expect(r).toHaveLength(1);
    expect(Math.abs(r[0]!.x - Math.acos(3 / 4) / (2 * Math.PI))).toBeLessThan(1e-12);
  });

  it('roots off the circle are not reported: (2t − 1)(t − 2), 4₁ (−t + 3 − t⁻¹: real roots (3 ± √5)/2), and t⁴ − 3t² + 1 (hand computation)', () => {
    expect(unitCircleRoots([2n, -5n, 2n])).toEqual([]);
    expect(alexanderUnitRoots(laurent(-1, [-1, 3, -1]))).toEqual([]);
    expect(unitCircleRoots([1n, 0n, -3n, 0n, 1n])).toEqual([]);
    // mixed: off-circle factor times Φ5
    expect(unitCircleRoots(mul([2n, -5n, 2n], cyclo[5]!)).map((r) => r.x)).toEqual([0.2, 0.4]);
  });

  it('t = −1 (x = 1/2) is exact; t = 1 is never reported (x = 0 is excluded)', () => {
    expect(unitCircleRoots(mul([1n, 1n], [-1n, 1n]))).toEqual([{ x: 0.5, lo: 0.5, hi: 0.5 }]);
  });

  it('multiplicities: (t − 1 + t⁻¹)^k has the single root 1/6 with multiplicity k, k = 1..6 (listed once)', () => {
    for (let k = 1; k <= 6; k++) {
      let c: bigint[] = [1n];
      for (let j = 0; j < k; j++) c = mul(c, [1n, -1n, 1n]);
      const r = alexanderUnitRoots({ lowestExponent: -k, coefficients: c });
      expect(r.map((u) => [u.x, u.multiplicity])).toEqual([[0.166666666667, k]]);
    }
  });

  it('torus knots: the roots of Δ(T(p, q)) = (t^{pq} − 1)(t − 1)/((t^p − 1)(t^q − 1)) are the pq-th roots of unity that are neither p-th nor q-th roots, all simple (reference checks)', () => {
    for (const [p, q] of [[2, 3], [2, 9], [3, 4], [3, 5], [4, 7], [5, 6], [5, 9]] as const) {
      const d = computeInvariants(diagramFrom({ kind: 'braid', braid: torusBraid(p, q) }), { invariants: ['alexander'] });
      const r = alexanderUnitRoots(d.alexander!);
      const want: number[] = [];
      // e^{2πik/pq} is a p-th root when q | k and a q-th root when p | k
      for (let k = 1; 2 * k <= p * q; k++) if (k % q !== 0 && k % p !== 0) want.push(k / (p * q));
      expect(r.map((u) => u.multiplicity).every((m) => m === 1)).toBe(true);
      expect(r.length, `T(${p},${q})`).toBe(want.length);
      r.forEach((u, i) => expect(Math.abs(u.x - want[i]!)).toBeLessThan(1e-12));
    }
  });
});
