import { describe, it, expect } from 'vitest';
import { EigenvalueDecomposition, Matrix, determinant } from 'ml-matrix';
import { bareissDet, symmetricInertia, symmetricSignature, interpolateIntegerNodes, pencilDeterminant, polyDivExact, formatLaurent, laurent, levineTristram, symmetricEigenvalues, alexanderUnitRoots, braidSeifertMatrix, torusBraid } from '../../src/knots/index.ts';
import { Rng } from '../../src/util/rng.ts';

function randomSymmetric(rng: Rng, n: number, range: number): number[][] {
  const a = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++)
    for (let j = i; j < n; j++) {
      const v = rng.int(2 * range + 1) - range;
      a[i]![j] = v;
      a[j]![i] = v;
    }
  return a;
}

describe('exact linear algebra', () => {
  it('signature of random symmetric integer matrices agrees with ml-matrix eigenvalues (general-purpose reference library)', () => {
    const rng = new Rng(3);
    for (let trial = 0; trial < 300; trial++) {
      const n = 1 + rng.int(9);
      const a = randomSymmetric(rng, n, rng.next() < 0.3 ? 1 : 6);
      if (rng.next() < 0.3) for (let i = 0; i < n; i++) { a[i]![i] = 0; } // force the zero-diagonal branch
      const ev = new EigenvalueDecomposition(new Matrix(a), { assumeSymmetric: true }).realEigenvalues;
      const pos = ev.filter((x) => x > 1e-8).length;
      const neg = ev.filter((x) => x < -1e-8).length;
      const inertia = symmetricInertia(a);
      expect(inertia).toEqual({ positive: pos, negative: neg, zero: n - pos - neg });
    }
  });

  it('Bareiss determinant agrees with ml-matrix LU on small matrices and is exact on a 40×40 case', () => {
    const rng = new Rng(4);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + rng.int(7);
      const a = Array.from({ length: n }, () => Array.from({ length: n }, () => rng.int(11) - 5));
      // ml-matrix's LU determinant (a general-purpose reference library)
      expect(Number(bareissDet(a))).toBeCloseTo(determinant(new Matrix(a)), 6);
    }
    // the n×n matrix with 2 on the diagonal and 1 elsewhere has determinant n + 1 (from memory: eigenvalues 1 (n−1 times) and n + 1)
    const n = 40;
    const b = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 2 : 1)));
    expect(bareissDet(b)).toBe(41n);
  });

  it('signature of the all-ones-plus-identity pattern: 2I + J has signature n; −(2I + J) has −n (from memory)', () => {
    const n = 30;
    const b = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 2 : 1)));
    expect(symmetricSignature(b)).toBe(n);
    expect(symmetricSignature(b.map((r) => r.map((x) => -x)))).toBe(-n);
  });

  it('falls back to BigInt when entries overflow float64 integers, with the same answer', () => {
    const big = 2 ** 40;
    const a = [[big, big - 1, 3], [big - 1, big, 5], [3, 5, -big]];
    const ev = new EigenvalueDecomposition(new Matrix(a), { assumeSymmetric: true }).realEigenvalues;
    expect(symmetricSignature(a)).toBe(ev.filter((x) => x > 0).length - ev.filter((x) => x < 0).length);
  });

  it('interpolation through integer nodes and exact division recover known polynomials (hand computation)', () => {
    const p = [3n, -7n, 0n, 11n, -2n]; // 3 − 7t + 11t³ − 2t⁴
    const values = [0, 1, 2, 3, 4].map((t) => p.reduce((s, c, k) => s + c * BigInt(t) ** BigInt(k), 0n));
    expect(interpolateIntegerNodes(values)).toEqual(p);
    expect(polyDivExact([-1n, 0n, 0n, 1n], [-1n, 1n])).toEqual([1n, 1n, 1n]); // (t³ − 1)/(t − 1)
    expect(() => polyDivExact([1n, 0n, 1n], [-1n, 1n])).toThrow();
    // det([[1, t], [t, 1]]) = 1 − t²
    expect(pencilDeterminant([[1, 0], [0, 1]], [[0, 1], [1, 0]])).toEqual([1n, 0n, -1n]);
  });

  it('text form (the documented output format, highest power first, as in the specification `t - 1 + t^-1`)', () => {
    expect(formatLaurent(laurent(-1, [1, -1, 1]))).toBe('t - 1 + t^-1');
    expect(formatLaurent(laurent(-1, [2, -3, 2]))).toBe('2t - 3 + 2t^-1');
    expect(formatLaurent(laurent(-0.5, [-1, 1]))).toBe('t^(1/2) - t^(-1/2)');
    expect(formatLaurent(laurent(0, []))).toBe('0');
  });
});



describe('Levine–Tristram signatures', () => {
  it('trefoil: σ_ω = 0 for x < 1/6 and −2 on (1/6, 1/2] (from memory: jump at the root e^{iπ/3} of t² − t + 1)', () => {
    const V = braidSeifertMatrix({ strands: 2, word: [1, 1, 1] });
    expect(levineTristram(V, 0.1)).toBe(0);
    expect(levineTristram(V, 0.2)).toBe(-2);
    expect(levineTristram(V, 0.5)).toBe(-2);
    expect(levineTristram(V, 0.8)).toBe(-2);
    expect(levineTristram(V, 0.9)).toBe(0);
    expect(alexanderUnitRoots(laurent(-1, [1, -1, 1])).map((r) => [r.x, r.multiplicity])).toEqual([[0.166666666667, 1]]);
  });

  it('T(2,5): jumps at x = 1/10 and 3/10, σ_ω = 0, −2, −4 between them (from memory: Δ = Φ₁₀)', () => {
    const V = braidSeifertMatrix(torusBraid(2, 5));
    expect([0.05, 0.2, 0.4, 0.5].map((x) => levineTristram(V, x))).toEqual([0, -2, -4, -4]);
    expect(alexanderUnitRoots(laurent(-2, [1, -1, 1, -1, 1])).map((r) => [r.x, r.multiplicity])).toEqual([[0.1, 1], [0.3, 1]]);
  });

  it('the Hermitian eigenvalue count agrees with ml-matrix on the real embedding (random Seifert matrices)', () => {
    const rng = new Rng(9);
    for (let trial = 0; trial < 40; trial++) {
      const m = 1 + rng.int(6);
      const V = Array.from({ length: m }, () => Array.from({ length: m }, () => rng.int(5) - 2));
      const ev = symmetricEigenvalues(V.map((r, i) => r.map((x, j) => x + V[j]![i]!)));
      const ref = new EigenvalueDecomposition(new Matrix(V.map((r, i) => r.map((x, j) => x + V[j]![i]!))), { assumeSymmetric: true }).realEigenvalues;
      expect(ev.slice().sort((a, b) => a - b)).toEqual(ref.slice().sort((a, b) => a - b).map((x) => expect.closeTo(x, 8)));
    }
  });

});
