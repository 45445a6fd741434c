import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseDiagram } from '../../../src/knots/diagram.ts';
import { hyperbolicInvariants } from '../../../src/knots/hyperbolic/invariants.ts';
import { addKink, mirrorPD, relabelPD } from '../../../src/knots/generate.ts';
import type { Crossing } from '../../../src/knots/pd.ts';
import { Rng } from '../../../src/util/rng.ts';

// Diagrams: tests/fixtures/knots-small.json (braid words and PD codes, verified by computation; see its provenance).
const fx = JSON.parse(readFileSync(new URL('../../fixtures/knots-small.json', import.meta.url), 'utf8')) as {
  knots: Record<string, { braid: number[]; pdMinimal?: Crossing[]; pdFromBraid: Crossing[]; signatureOfBraidClosure: number; signatureOfPdMinimal?: number }>;
};
const braid = (k: string): string => fx.knots[k]!.braid.join(' ');
const pd = (k: string): Crossing[] => fx.knots[k]!.pdMinimal ?? fx.knots[k]!.pdFromBraid;
const hyp = (code: string | Crossing[]) => hyperbolicInvariants(parseDiagram(typeof code === 'string' ? code : JSON.stringify(code)));

// Hyperbolic volumes, from memory (values listed in the project's vetted reference checks; the
// figure-eight is 2 × the regular ideal tetrahedron 1.0149416064096536, the Whitehead link
// 4 × Catalan, the Borromean rings 8 × Catalan).
const VOLUMES: Record<string, [number, number]> = {
  '4_1': [2.029883212819307, 1e-12],
  '5_2': [2.8281220883308, 1e-10],
  '6_1': [3.1639632288831, 1e-10],
  '6_2': [4.40083, 1e-5],
  '6_3': [5.69302, 1e-5],
  '7_2': [3.33174, 1e-5],
  '7_3': [4.59213, 1e-5],
  '7_4': [5.13794, 1e-5],
};

describe('hyperbolic invariants of small knots', () => {
  it('volumes of the knots up to 7 crossings (from memory) from braid words and from PD codes', () => {
    for (const [k, [v, tol]] of Object.entries(VOLUMES)) {
      const a = hyp(pd(k));
      expect(a.geometry, k).toBe('hyperbolic');
      expect(Math.abs(a.volume! - v), k).toBeLessThan(tol);
    }
    for (const k of ['4_1', '5_2', '6_1', '6_3', '7_3', '7_4']) {
      const b = hyp(braid(k));
      expect(b.geometry, k).toBe('hyperbolic');
      expect(Math.abs(b.volume! - VOLUMES[k]![0]), k).toBeLessThan(VOLUMES[k]![1]);
    }
  });
  it('Whitehead link = 4 × Catalan, Borromean rings = 8 × Catalan (from memory)', () => {
    const catalan = 0.915965594177219;
    const wh = hyp('1 -2 1 -2 -2');
    expect(wh.geometry).toBe('hyperbolic');
    expect(wh.volume!).toBeCloseTo(4 * catalan, 11);
    const br = hyp('1 -2 1 -2 1 -2');
    expect(br.volume!).toBeCloseTo(8 * catalan, 11);
  });
  it('figure-eight cusp shape 2√3·i, natural slope 0 (amphichiral; from memory, Thurston 1979 ch. 4)', () => {
    for (const code of [braid('4_1'), pd('4_1')]) {
      const h = hyp(code);
      expect(h.cuspShape![0]).toBeCloseTo(0, 9);
      expect(h.cuspShape![1]).toBeCloseTo(2 * Math.sqrt(3), 9);
    }
  });
  it('amphichiral knots 4_1 and 6_3 have natural slope 0 (fact of the trade)', () => {
    for (const k of ['4_1', '6_3']) for (const code of [braid(k), pd(k)]) expect(Math.abs(hyp(code).naturalSlope!)).toBeLessThan(1e-9);
  });
  it('a mirror image keeps the volume and negates the natural slope (orientation reversal)', () => {
    for (const k of ['5_2', '6_1', '6_2', '7_3', '7_4', '7_6', '7_7']) {
      const a = hyp(pd(k));
      const b = hyp(mirrorPD(pd(k)));
      expect(Math.abs(a.volume! - b.volume!)).toBeLessThan(1e-9);
      expect(Math.abs(a.naturalSlope! + b.naturalSlope!)).toBeLessThan(1e-9);
      expect(Math.abs(a.cuspShape![1] - b.cuspShape![1])).toBeLessThan(1e-9);
      expect(Math.abs(a.naturalSlope!)).toBeGreaterThan(0.1);
    }
  });
  it('the same knot as braid, PD code, kinked and relabelled agrees to 1e-9 (same chirality: equal signatures in the fixture)', () => {
    for (const k of ['5_2', '6_2', '7_3', '7_4', '7_6']) {
      const e = fx.knots[k]!;
      const p = pd(k);
      const variants = [hyp(p), hyp(addKink(p, p[0]![0], 1)), hyp(addKink(p, p[1]![2], 2)), hyp(relabelPD(p, new Rng(7)))];
      // a braid of opposite signature is the mirror image
      const sameChirality = e.signatureOfPdMinimal === undefined || e.signatureOfPdMinimal === e.signatureOfBraidClosure;
      const b = hyp(braid(k));
      for (const v of variants) {
        expect(Math.abs(v.volume! - variants[0]!.volume!), k).toBeLessThan(1e-9);
        expect(Math.abs(v.naturalSlope! - variants[0]!.naturalSlope!), k).toBeLessThan(1e-9);
      }
      expect(Math.abs(b.naturalSlope! - (sameChirality ? 1 : -1) * variants[0]!.naturalSlope!), k).toBeLessThan(1e-9);
    }
  });
  it('Markov stabilisation of a braid (a kink on a new strand) keeps the invariants', () => {
    const a = hyp('1 1 1 2 -1 2');
    const b = hyp('1 1 1 2 -1 2 3');
    const c = hyp('1 1 1 2 -1 2 -3');
    for (const x of [b, c]) {
      expect(Math.abs(x.volume! - a.volume!)).toBeLessThan(1e-9);
      expect(Math.abs(x.naturalSlope! - a.naturalSlope!)).toBeLessThan(1e-9);
    }
  });
  it('torus knots are refused: never a number; braids of the form (σ1…σ_{p−1})^q are "not hyperbolic" (Thurston 1982)', () => {
    for (const code of ['1 1 1', '1 1 1 1 1', '-1 -1 -1 -1 -1 -1 -1', '1 2 1 2 1 2 1 2', '2 3 1 2 3 1 2 3 1 2 3 1 2 3 1']) {
      const h = hyp(code);
      expect(h.geometry, code).toBe('not hyperbolic');
      expect(h.reason).toMatch(/torus (knot|link) T\(/);
      expect(h.volume).toBeUndefined();
    }
    for (const k of ['3_1', '5_1', '7_1']) {
      const h = hyp(pd(k));
      expect(h.geometry).not.toBe('hyperbolic');
      expect(h.volume).toBeUndefined();
      expect(h.naturalSlope).toBeUndefined();
    }
  });
  it('split and trivial diagrams are not hyperbolic, with the reason', () => {
    expect(hyp('3: 1 1 1').reason).toMatch(/torus|split/);
    expect(hyp('1 -2 1 -2 4 4 4').geometry).toBe('not hyperbolic'); // strand 4,5 apart
    expect(hyp('[[1,1,2,2]]').geometry).toBe('not hyperbolic');
  });
  it("Thurston's hyperbolic Dehn surgery: adding full twists on two strands increases the volume, by ever smaller steps", () => {
    // σ1^(2k+1) σ2 σ1⁻¹ σ2, k = 1..22: the twist region of the closure gets k full twists
    const vols: number[] = [];
    for (let k = 1; k <= 22; k++) {
      const h = hyp(`${Array(2 * k + 1).fill(1).join(' ')} 2 -1 2`);
      expect(h.geometry, `k=${k}`).toBe('hyperbolic');
      vols.push(h.volume!);
    }
    for (let i = 1; i < vols.length; i++) expect(vols[i]!).toBeGreaterThan(vols[i - 1]!);
    for (let i = 2; i < vols.length; i++) expect(vols[i]! - vols[i - 1]!).toBeLessThan(vols[i - 1]! - vols[i - 2]!);
    // the gap to the limit shrinks like 1/k² (Neumann–Zagier): the last step is tiny
    expect(vols[21]! - vols[20]!).toBeLessThan(1e-3);
  });
});
