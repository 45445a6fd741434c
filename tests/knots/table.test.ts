import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { braidSeifertMatrix, computeInvariants, parseDiagram, analysePD, symmetricSignature } from '../../src/knots/index.ts';

// Standard knot table up to 7 crossings: values from memory (Rolfsen, "Knots and Links",
// Appendix C), verified by computation; see tests/fixtures/knots-small.provenance.md.
const fixture = JSON.parse(readFileSync(new URL('../fixtures/knots-small.json', import.meta.url), 'utf8')) as {
  knots: Record<
    string,
    {
      braid: number[];
      pdFromBraid: number[][];
      pdMinimal?: number[][];
      alexander: number[];
      determinant: number;
      signatureOfBraidClosure: number;
      absSignature: number;
      seifertMatrix: number[][];
      signatureOfPdMinimal?: number;
    }
  >;
};
const knots = Object.entries(fixture.knots);
const all = { invariants: ['crossings', 'writhe', 'components', 'signature', 'determinant', 'alexander', 'genus_bound', 'seifert_circles'] as const };

// DT codes of the same knots, from memory (the Dowker–Thistlethwaite codes listed in the standard
// tables); a wrong recollection would show up as a mismatch with the fixture's invariants.
const DT: Record<string, string> = {
  '3_1': '4 6 2', '4_1': '4 6 8 2', '5_1': '6 8 10 2 4', '5_2': '4 8 10 2 6', '6_1': '4 8 12 10 2 6',
  '6_2': '4 8 10 12 2 6', '6_3': '4 8 10 2 12 6', '7_1': '8 10 12 14 2 4 6', '7_2': '4 10 14 12 2 8 6',
  '7_3': '6 10 12 14 2 4 8', '7_4': '6 10 12 14 4 2 8', '7_5': '4 10 12 14 2 8 6', '7_6': '4 8 12 2 14 6 10',
  '7_7': '4 8 10 12 2 14 6',
};

describe('knot table (fixture: from memory, verified by computation)', () => {
  it.each(knots)('%s from its braid word: σ, |σ|, det, Δ and the Seifert matrix', (_name, k) => {
    const inv = computeInvariants(parseDiagram(k.braid.join(' '), 'braid'), all);
    expect(inv.signature).toBe(k.signatureOfBraidClosure);
    expect(Math.abs(inv.signature!)).toBe(k.absSignature);
    expect(inv.determinant).toBe(k.determinant);
    expect(inv.alexander!.coefficients).toEqual(k.alexander.map(BigInt));
    expect(inv.alexander!.lowestExponent).toBe(-(k.alexander.length - 1) / 2);
    expect(inv.components).toBe(1);
    // the fixture's Seifert matrix was computed independently from the same braid
    expect(braidSeifertMatrix({ strands: Math.max(...k.braid.map(Math.abs)) + 1, word: k.braid })).toEqual(k.seifertMatrix);
    // |σ| ≤ 2g ≤ 2·(Seifert genus bound) (Murasugi's inequality, from memory)
    expect(Math.abs(inv.signature!)).toBeLessThanOrEqual(2 * inv.genusBound!);
  });

  it.each(knots)('%s from the PD code of its closure (Gordon–Litherland, Fox calculus)', (_name, k) => {
    const inv = computeInvariants(parseDiagram(JSON.stringify(k.pdFromBraid)), all);
    expect(inv.signature).toBe(k.signatureOfBraidClosure);
    expect(inv.determinant).toBe(k.determinant);
    expect(inv.alexander!.coefficients).toEqual(k.alexander.map(BigInt));
    expect(inv.crossings).toBe(k.braid.length);
  });

  it.each(knots.filter(([, k]) => k.pdMinimal))('%s from its minimal PD code (also in X[..] text form)', (_name, k) => {
    const text = k.pdMinimal!.map((x) => `X[${x.join(',')}]`).join(' ');
    const inv = computeInvariants(parseDiagram(text), all);
    expect(inv.signature).toBe(k.signatureOfPdMinimal);
    expect(inv.determinant).toBe(k.determinant);
    expect(inv.alexander!.coefficients).toEqual(k.alexander.map(BigInt));
    expect(inv.crossings).toBe(k.pdMinimal!.length);
    const inv2 = computeInvariants(parseDiagram(`PD[${text.replaceAll(' ', ', ')}]`), all);
    expect(inv2).toEqual(inv);
  });

  it.each(Object.entries(DT))('%s from its DT code %s (from memory): |σ|, det, Δ', (name, code) => {
    const k = fixture.knots[name]!;
    const inv = computeInvariants(parseDiagram(`DT[${code.replaceAll(' ', ',')}]`), all);
    expect(Math.abs(inv.signature!)).toBe(k.absSignature);
    expect(inv.determinant).toBe(k.determinant);
    expect(inv.alexander!.coefficients).toEqual(k.alexander.map(BigInt));
    expect(inv.crossings).toBe(code.split(' ').length);
  });

  it('Seifert matrices of the fixture have det(V − Vᵀ) = 1 and signature σ (Seifert 1935; from memory)', () => {
    for (const [, k] of knots) {
      const V = k.seifertMatrix;
      const S = V.map((r, i) => r.map((x, j) => x + V[j]![i]!));
      expect(symmetricSignature(S)).toBe(k.signatureOfBraidClosure);
    }
  });

  it('writhe follows the sign convention: right-handed trefoil +3, figure-eight 0 (from memory)', () => {
    expect(computeInvariants(parseDiagram('1 1 1')).writhe).toBe(3);
    expect(computeInvariants(parseDiagram('1 -2 1 -2')).writhe).toBe(0);
    expect(analysePD(fixture.knots['3_1']!.pdMinimal!).sign.every((s) => s === -1)).toBe(true); // the left-handed one
  });
});
