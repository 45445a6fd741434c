import { describe, it, expect } from 'vitest';
import {
  braidSeifertMatrix,
  burauAlexander,
  centre,
  computeInvariants,
  diagramFrom,
  gordonLitherland,
  pencilDeterminant,
  randomBraid,
  valueAtMinusOne,
  valueAtOne,
} from '../../src/knots/index.ts';
import { burauAlexanderExact } from '../../src/knots/braid.ts';
import { addKink, analysePD, foxAlexander, randomKnotBraid, relabelPD, braidClosurePD } from '../../src/knots/index.ts';
import { sparseInertia, symmetricEntries } from '../../src/knots/sparse.ts';
import { Rng } from '../../src/util/rng.ts';

const trim = (c: bigint[]): bigint[] => centre(c).coefficients;

describe('burauAlexanderExact: the reduced Burau formula in packed big integers', () => {
  it('equals the exact pencil det(V − tVᵀ) of the braid-form Seifert matrix up to ±t^k on 300 random braids of 2–7 strands (Burau 1936; Birman Thm 3.11; a second, independent method)', () => {
    const rng = new Rng(51);
    for (let t = 0; t < 300; t++) {
      const b = randomBraid(rng, 2 + rng.int(6), 1 + rng.int(14));
      const V = braidSeifertMatrix(b);
      const pencil = trim(pencilDeterminant(V, V.map((r, i) => r.map((_, j) => -V[j]![i]!))));
      const exact = trim(burauAlexanderExact(b));
      expect(exact.length === 0 ? [] : exact[exact.length - 1]! * (pencil[pencil.length - 1] ?? 0n) < 0n ? exact.map((x) => -x) : exact).toEqual(pencil);
      const float = burauAlexander(b);
      if (float) expect(trim(float)).toEqual(exact);
    }
  });
});

const lucas = (k: number): bigint => {
  let a = 2n;
  let b = 1n;
  for (let i = 0; i < k; i++) [a, b] = [b, a + b];
  return a;
};

describe('a 1,000-crossing diagram: closure of (σ1σ2⁻¹)^500', () => {
  // the closure of (σ1σ2⁻¹)^n has determinant L_{2n} − 2 (Lucas numbers; from memory, also in large.test.ts);
  // it is amphichiral: the mirror (σ1⁻¹σ2)^n becomes the braid itself under the flip σ1 ↔ σ2 (turning the
  // closed braid over) and a cyclic shift, so σ = 0 (a knot's signature changes sign under mirroring)
  const b = { strands: 3, word: Array.from({ length: 1000 }, (_, k) => (k % 2 ? -2 : 1)) };
  const r = computeInvariants(diagramFrom({ kind: 'braid', braid: b }), { invariants: ['signature', 'determinant', 'alexander', 'components'] });

  it('is a knot (3 ∤ 500) with σ = 0, Δ(1) = 1, Δ(t) = Δ(1/t), det = |Δ(−1)| = L_1000 − 2 exactly', () => {
    expect(r.components).toBe(1);
    expect(r.signature).toBe(0);
    expect(valueAtOne(r.alexander!)).toBe(1n);
    const c = r.alexander!.coefficients;
    expect(c).toEqual(c.slice().reverse());
    expect(c.length).toBe(999); // span 2g = 998 = crossings − strands + 1 (the braid is alternating: the Seifert surface is minimal)
    expect(String(r.determinant)).toBe((lucas(1000) - 2n).toString());
    const [re] = valueAtMinusOne(r.alexander!);
    expect(re < 0n ? -re : re).toBe(lucas(1000) - 2n);
  });

  it('Gordon–Litherland on its PD code (Goeritz matrix, sparse elimination) gives the same σ and det', () => {
    const gl = gordonLitherland(diagramFrom({ kind: 'braid', braid: b }).info);
    expect(gl.signature).toBe(0);
    expect(gl.determinant).toBe(lucas(1000) - 2n);
  });

  it('the Seifert form needs few updates: under 20 per row (a count, not a timing)', () => {
    const V = braidSeifertMatrix(b);
    const s = sparseInertia(V.length, symmetricEntries(V.map((row, i) => row.map((x, j) => x + V[j]![i]!))));
    expect(s.updates).toBeLessThan(20 * V.length);
  });
});

describe('PD codes above 30 crossings: Δ through the Vogel braid', () => {
  it('equals Fox calculus on the same PD code (Fox 1954; an independent method) for kinked, relabelled knot and link diagrams of 33–45 crossings', () => {
    const rng = new Rng(52);
    for (let t = 0; t < 6; t++) {
      const b = t % 2 === 0 ? randomKnotBraid(rng, 3 + rng.int(2), 32 + rng.int(10)) : randomBraid(rng, 3, 32 + rng.int(10));
      let pd = braidClosurePD(b).pd;
      for (let k = 0; k < 3; k++) pd = addKink(pd, pd[rng.int(pd.length)]![rng.int(4)]!, rng.int(4));
      pd = relabelPD(pd, rng);
      const info = analysePD(pd);
      expect(info.nCrossings).toBeGreaterThan(30);
      const r = computeInvariants({ kind: 'pd', pd, info, freeLoops: 0 }, { invariants: ['alexander'] });
      const fox = trim(foxAlexander(info, 0));
      const got = r.alexander!.coefficients;
      // Fox gives Δ up to ±t^k
      expect(got[0]! * fox[0]! > 0n ? got : got.map((x) => -x)).toEqual(fox);
    }
  });
});
