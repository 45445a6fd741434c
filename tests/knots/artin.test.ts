import { describe, it, expect } from 'vitest';
import { artinImages, powerEquals, sameBraid } from '../../src/knots/artin.ts';
import { randomBraid } from '../../src/knots/generate.ts';
import { Rng } from '../../src/util/rng.ts';

// Artin's action of B_n on the free group F_n (Artin 1925; Birman, "Braids, Links and Mapping
// Class Groups", 1974, ch. 1: faithful; from memory).
describe("Artin's action on the free group", () => {
  it('satisfies the braid relations (Artin 1925): σ1σ2σ1 = σ2σ1σ2, σ1σ3 = σ3σ1, σ_iσ_i⁻¹ = 1', () => {
    expect(sameBraid(3, [1, 2, 1], [2, 1, 2])).toBe(true);
    expect(sameBraid(4, [1, 3], [3, 1])).toBe(true);
    expect(sameBraid(4, [2, -2, 3, -3], [])).toBe(true);
    expect(sameBraid(5, [2, 3, 2, 4], [3, 2, 3, 4])).toBe(true);
  });
  it('tells apart braids that differ (faithfulness): σ1σ2 ≠ σ2σ1, σ1σ2σ1 ≠ σ1σ1σ2, σ1² ≠ 1', () => {
    expect(sameBraid(3, [1, 2], [2, 1])).toBe(false);
    expect(sameBraid(3, [1, 2, 1], [1, 1, 2])).toBe(false);
    expect(sameBraid(2, [1, 1], [])).toBe(false);
  });
  it('the full twist Δ² = (σ1…σ_{n−1})^n acts as conjugation by x1…xn, central (its centre, Chow 1948; an inner automorphism of F_n; from memory)', () => {
    for (const n of [2, 3, 4, 5, 6]) {
      const delta: number[] = [];
      for (let i = 1; i < n; i++) delta.push(i);
      const full = Array.from({ length: n }, () => delta).flat();
      const w = artinImages(n, full)!;
      const P = Array.from({ length: n }, (_, j) => j + 1);
      const Pinv = P.map((x) => -x).reverse();
      // each image is P x_j P⁻¹ freely reduced (x_j cancels into P on the side it lies)
      const expected = (j: number): number[] => {
        const word = [...P, j, ...Pinv];
        const out: number[] = [];
        for (const g of word) {
          if (out.length && out[out.length - 1] === -g) out.pop();
          else out.push(g);
        }
        return out;
      };
      for (let j = 1; j <= n; j++) expect(w[j - 1], `n=${n} x${j}`).toEqual(expected(j));
      // central: commutes with every generator
      for (let i = 1; i < n; i++) expect(sameBraid(n, [...full, i], [i, ...full])).toBe(true);
    }
  });
  it('random words equal themselves after random braid relations, and differ from themselves with σ_i² inserted', () => {
    const rng = new Rng(21);
    for (let t = 0; t < 200; t++) {
      const n = 3 + rng.int(3);
      const b = randomBraid(rng, n, 12);
      const i = 1 + rng.int(n - 2);
      // insert σ_iσ_{i+1}σ_i σ_{i+1}⁻¹σ_i⁻¹σ_{i+1}⁻¹ (trivial by the braid relation) at a random place
      const k = rng.int(b.word.length + 1);
      const same = [...b.word.slice(0, k), i, i + 1, i, -(i + 1), -i, -(i + 1), ...b.word.slice(k)];
      expect(sameBraid(n, b.word, same)).toBe(true);
      const other = [...b.word.slice(0, k), i, i, ...b.word.slice(k)];
      expect(sameBraid(n, b.word, other)).toBe(false);
    }
  });
  it('powers: (σ1σ2)³ = (σ1σ2σ1)² = Δ² on 3 strands (Garside 1969; from memory); a pseudo-Anosov braid hits the cap', () => {
    expect(powerEquals({ strands: 3, word: [1, 2] }, 3, [1, 2, 1, 1, 2, 1])).toBe(true);
    expect(powerEquals({ strands: 3, word: [1, 2, 1] }, 2, [1, 2, 1, 2, 1, 2])).toBe(true);
    expect(powerEquals({ strands: 3, word: [1, 2] }, 2, [1, 2, 1, 1, 2, 1])).toBe(false);
    // σ1σ2⁻¹ (the figure-eight's braid) is pseudo-Anosov: its images grow exponentially
    expect(powerEquals({ strands: 3, word: [1, -2] }, 40, [], 2000)).toBeUndefined();
  });
});
