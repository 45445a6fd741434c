import { describe, it, expect } from 'vitest';
import { neighbours, normaliseClosedBraid, simplifyClosedBraid } from '../../../src/knots/hyperbolic/closedbraid.ts';
import { sameBraid } from '../../../src/knots/artin.ts';
import { burauAlexanderExact, braidSeifertMatrix, type Braid } from '../../../src/knots/braid.ts';
import { symmetricSignature } from '../../../src/knots/exact.ts';
import { trimPoly } from '../../../src/knots/poly.ts';
import { randomBraid, randomKnotBraid } from '../../../src/knots/generate.ts';
import { Rng } from '../../../src/util/rng.ts';

const rotate = (w: readonly number[], k: number): number[] => [...w.slice(k), ...w.slice(0, k)];
const signature = (b: Braid): number => {
  if (b.word.length === 0) return 0;
  const V = braidSeifertMatrix(b);
  return symmetricSignature(V.map((r, i) => r.map((x, j) => x + V[j]![i]!)));
};
/** Δ up to ±t^k and σ of the closure: isotopy invariants (Alexander 1928; Trotter 1962). */
const invariants = (b: Braid): string => {
  if (b.word.length === 0) return `${b.strands}:trivial`;
  const c = trimPoly(burauAlexanderExact(b)).coeffs;
  const s = c[0]! < 0n ? -1n : 1n;
  return `${c.map((x) => x * s).join(',')} σ=${signature(b)}`;
};

describe('moves on closed braids', () => {
  it('braid-relation and commutation rewrites give the same braid up to rotation (checked by Artin’s faithful action)', () => {
    const rng = new Rng(5);
    let checked = 0;
    for (let t = 0; t < 300; t++) {
      const b = randomBraid(rng, 3 + rng.int(3), 8 + rng.int(10));
      for (const r of neighbours(b.strands, b.word)) {
        if (r.at.length === 2 && Math.abs(Math.abs(b.word[r.at[0]!]!) - Math.abs(b.word[r.at[1]!]!)) < 2) continue; // an exchange move
        expect(sameBraid(b.strands, rotate(b.word, r.at[0]!), rotate(r.word, r.at[0]!)), `${b.word} → ${r.word}`).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(1000);
  });
  it('exchange moves (Birman–Menasco 1992) keep the closure: same Alexander polynomial and signature', () => {
    const rng = new Rng(6);
    let checked = 0;
    for (let t = 0; t < 400 && checked < 60; t++) {
      const n = 3 + rng.int(3);
      // A σ_{n−1} B σ_{n−1}⁻¹ with A, B on the first n − 1 strands
      const A = randomBraid(rng, n - 1, 3 + rng.int(5)).word;
      const B = randomBraid(rng, n - 1, 3 + rng.int(5)).word;
      const w = [...A, n - 1, ...B, -(n - 1)];
      const ex = neighbours(n, w).filter((r) => r.at.length === 2 && Math.abs(w[r.at[0]!]!) === n - 1 && Math.abs(w[r.at[1]!]!) === n - 1);
      expect(ex.length).toBe(1);
      expect(ex[0]!.word).toEqual([...A, -(n - 1), ...B, n - 1]);
      expect(invariants({ strands: n, word: ex[0]!.word })).toBe(invariants({ strands: n, word: w }));
      checked++;
    }
    expect(checked).toBe(60);
  });
  it('the search keeps the closure (Alexander polynomial and signature), and a connected sum multiplies Δ and adds σ (Rolfsen; from memory)', () => {
    const rng = new Rng(7);
    let sums = 0;
    for (let t = 0; t < 150; t++) {
      const b = randomKnotBraid(rng, 3 + rng.int(3), 10 + rng.int(12));
      // every other word with slack: cancelling pairs inserted (R2 moves) before the word shrinks
      const out = simplifyClosedBraid(b, t % 2 ? { maxStates: 2000, maxWork: 500_000, slack: 2 } : undefined);
      if (out.kind === 'braid' && out.braid.strands === 1) {
        expect(invariants(b), b.word.join(' ')).toMatch(/^1 σ=0$/);
        continue;
      }
      if (out.kind === 'braid') expect(invariants(out.braid), b.word.join(' ')).toBe(invariants(b));
      if (out.kind === 'sum') {
        sums++;
        const [A, B] = out.summands;
        const pa = A.word.length ? trimPoly(burauAlexanderExact(A)).coeffs : [1n];
        const pb = B.word.length ? trimPoly(burauAlexanderExact(B)).coeffs : [1n];
        const prod = new Array<bigint>(pa.length + pb.length - 1).fill(0n);
        pa.forEach((x, i) => pb.forEach((y, j) => (prod[i + j]! += x * y)));
        const s = prod[0]! < 0n ? -1n : 1n;
        expect(`${prod.map((x) => x * s).join(',')} σ=${signature(A) + signature(B)}`, b.word.join(' ')).toBe(invariants(b));
      }
    }
    expect(sums).toBeGreaterThan(3);
  });
  it('normalisation destabilises σ_{n−1} or σ_1 occurring once (Markov) and stops at a split or a connected sum', () => {
    expect(normaliseClosedBraid({ strands: 3, word: [1, 1, 1, 2] }).braid).toEqual({ strands: 2, word: [1, 1, 1] });
    expect(normaliseClosedBraid({ strands: 3, word: [1, 2, 2, 2] }).braid).toEqual({ strands: 2, word: [1, 1, 1] });
    expect(normaliseClosedBraid({ strands: 4, word: [1, 1, 3, 3] }).split).toBe(true);
    // the square knot σ1³σ2⁻³ (Birman 1974, §2: braid connected sum of two trefoils)
    expect(normaliseClosedBraid({ strands: 3, word: [1, 1, 1, -2, -2, -2] }).sum).toBe(2);
    // σ1σ2⁻¹ repeated (figure-eight): no sum
    expect(normaliseClosedBraid({ strands: 3, word: [1, -2, 1, -2] }).sum).toBe(0);
  });
});
