import { describe, it, expect } from 'vitest';
import { braidSeifertMatrix, symmetricSignature, torusBraid, computeInvariants, diagramFrom, bareissDet } from '../../src/knots/index.ts';

// Gordon, Litherland & Murasugi, "Signatures of covering links", Canad. J. Math. 33 (1981):
// recursion for σ(T(p, q)), p, q > 0 coprime (positive torus knots have negative signature).
function glmSignature(p: number, q: number): number {
  if (p < q) [p, q] = [q, p];
  if (q === 1) return 0;
  if (q === 2) return -(p - 1);
  if (2 * q < p) return glmSignature(p - 2 * q, q) - (q % 2 === 1 ? q * q - 1 : q * q);
  return -glmSignature(2 * q - p, q) - (q % 2 === 1 ? q * q - 1 : q * q - 2);
}
// Brieskorn's lattice count (same paper's reference list): σ = −(#{1/2 < s < 3/2} − #{s < 1/2 or s > 3/2}),
// s = i/p + j/q, 0 < i < p, 0 < j < q.
function latticeSignature(p: number, q: number): number {
  let inside = 0;
  let outside = 0;
  for (let i = 1; i < p; i++)
    for (let j = 1; j < q; j++) {
      const s = i / p + j / q;
      if (s > 0.5 && s < 1.5) inside++;
      else if (s < 0.5 || s > 1.5) outside++;
    }
  return -(inside - outside);
}
const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);

const pairs: Array<[number, number]> = [];
for (let p = 2; p <= 15; p++) for (let q = p + 1; q <= 15; q++) if (gcd(p, q) === 1) pairs.push([p, q]);

describe('torus knots T(p, q)', () => {
  it('the two published formulas agree with each other and with the listed values (reference check)', () => {
    for (const [p, q] of pairs) expect(glmSignature(p, q)).toBe(latticeSignature(p, q));
    // values listed in the reference checks: T(2,3) −2, T(2,5) −4, T(3,4) −6, T(3,5) −8, T(3,7) −8, T(4,5) −8, T(5,6) −16
    expect([glmSignature(2, 3), glmSignature(2, 5), glmSignature(3, 4), glmSignature(3, 5), glmSignature(3, 7), glmSignature(4, 5), glmSignature(5, 6)]).toEqual([-2, -4, -6, -8, -8, -8, -16]);
  });

  it(`signature of the closed braid (σ1…σ_{p−1})^q equals the GLM recursion on all ${pairs.length} coprime p < q ≤ 15`, () => {
    for (const [p, q] of pairs) {
      const V = braidSeifertMatrix(torusBraid(p, q));
      expect(V.length).toBe((p - 1) * (q - 1)); // rank of H1 of the fibre surface: 2g = (p−1)(q−1)
      const sig = symmetricSignature(V.map((r, i) => r.map((x, j) => x + V[j]![i]!)));
      expect(sig, `T(${p},${q})`).toBe(glmSignature(p, q));
    }
  });

  it('σ(T(2, 2k+1)) = −2k (closed form, from memory), also via Gordon–Litherland on the PD code', () => {
    for (let k = 1; k <= 20; k++) {
      const d = diagramFrom({ kind: 'braid', braid: torusBraid(2, 2 * k + 1) });
      expect(computeInvariants(d).signature).toBe(-2 * k);
      expect(computeInvariants({ ...d, braid: undefined, kind: 'pd' }).signature).toBe(-2 * k);
    }
  });

  it('determinant of T(p, q) is 1 if p, q are both odd, else the odd one (from memory); p·q ≤ 80', () => {
    for (const [p, q] of pairs.filter(([p, q]) => p * q <= 80)) {
      const expected = p % 2 === 1 && q % 2 === 1 ? 1 : p % 2 === 1 ? p : q;
      const inv = computeInvariants(diagramFrom({ kind: 'braid', braid: torusBraid(p, q) }), { invariants: ['determinant', 'alexander'] });
      expect(inv.determinant, `T(${p},${q})`).toBe(expected);
      // and |det(V + Vᵀ)| by Bareiss elimination, independently of the Alexander polynomial
      const V = braidSeifertMatrix(torusBraid(p, q));
      const d = bareissDet(V.map((r, i) => r.map((x, j) => x + V[j]![i]!)));
      expect(d < 0n ? -d : d).toBe(BigInt(expected));
    }
  });

  it('Alexander polynomial of T(p, q) is (t^{pq} − 1)(t − 1)/((t^p − 1)(t^q − 1)) (from memory), p·q ≤ 60', () => {
    for (const [p, q] of pairs.filter(([p, q]) => p * q <= 60)) {
      // expected coefficients by exact polynomial division in plain arithmetic
      const num = new Array<number>(p * q + 2).fill(0);
      num[0] = 1; num[1] = -1; num[p * q] = -1; num[p * q + 1] = 1; // (t^{pq} − 1)(t − 1)
      const divide = (a: number[], k: number): number[] => {
        // divide by (t^k − 1): a = (t^k − 1)·b  ⇒  b_j = b_{j−k} − a_j
        const b = new Array<number>(a.length - k).fill(0);
        for (let j = 0; j < b.length; j++) b[j] = (j >= k ? b[j - k]! : 0) - a[j]!;
        return b;
      };
      const expected = divide(divide(num, p), q);
      const inv = computeInvariants(diagramFrom({ kind: 'braid', braid: torusBraid(p, q) }), { invariants: ['alexander'] });
      expect(inv.alexander!.coefficients, `T(${p},${q})`).toEqual(expected.map(BigInt));
    }
  });
});
