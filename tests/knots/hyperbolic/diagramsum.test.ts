import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { diagramSummands, recogniseDiagram } from '../../../src/knots/hyperbolic/diagramsum.ts';
import { hyperbolicInvariants } from '../../../src/knots/hyperbolic/invariants.ts';
import { parseDiagram } from '../../../src/knots/diagram.ts';
import { braidClosurePD } from '../../../src/knots/braid.ts';
import { foxAlexander } from '../../../src/knots/fox.ts';
import { addKink, mirrorPD, pdConnectedSum, randomKnotBraid, relabelPD } from '../../../src/knots/generate.ts';
import { analysePD, type Crossing } from '../../../src/knots/pd.ts';
import { trimPoly } from '../../../src/knots/poly.ts';
import { Rng } from '../../../src/util/rng.ts';

// Diagrams: tests/fixtures/knots-small.json (braid words and PD codes, verified by computation; see its provenance).
const fx = JSON.parse(readFileSync(new URL('../../fixtures/knots-small.json', import.meta.url), 'utf8')) as {
  knots: Record<string, { braid: number[]; pdMinimal?: Crossing[]; pdFromBraid: Crossing[] }>;
};
const pd = (k: string): Crossing[] => fx.knots[k]!.pdMinimal ?? fx.knots[k]!.pdFromBraid;
const hyp = (code: Crossing[]) => hyperbolicInvariants(parseDiagram(JSON.stringify(code)));
/** Δ up to ±t^k by Fox calculus (exact), as a string. */
const alexander = (code: Crossing[]): string => {
  const c = trimPoly(foxAlexander(analysePD(code))).coeffs;
  const s = c[0]! < 0n ? -1n : 1n;
  return c.map((x) => x * s).join(',');
};
const times = (a: string, b: string): string => {
  const x = a.split(',').map(BigInt);
  const y = b.split(',').map(BigInt);
  const out = new Array<bigint>(x.length + y.length - 1).fill(0n);
  x.forEach((u, i) => y.forEach((v, j) => (out[i + j]! += u * v)));
  return out.join(',');
};
const PRIME = ['3_1', '4_1', '5_1', '5_2', '6_1', '6_2', '6_3', '7_1', '7_2', '7_3', '7_4', '7_5', '7_6', '7_7'];

describe('connected sums seen in the diagram (a circle meeting it twice)', () => {
  it('minimal diagrams of prime knots up to 7 crossings have no splitting circle (Menasco 1984: reduced alternating diagrams of prime knots)', () => {
    for (const k of PRIME) expect(diagramSummands(pd(k)), k).toBeUndefined();
  });
  it('PD connected sums split into the two summands: Δ multiplies (Rolfsen; from memory), relabelled codes too', () => {
    const rng = new Rng(41);
    for (const [a, b] of [['3_1', '4_1'], ['5_2', '4_1'], ['6_1', '7_4'], ['3_1', '3_1'], ['7_7', '5_1']] as const) {
      const sum = relabelPD(pdConnectedSum(pd(a), pd(b)), rng);
      const parts = diagramSummands(sum);
      expect(parts, `${a} # ${b}`).toBeDefined();
      const [A, B] = parts!;
      expect(A.length + B.length).toBe(sum.length);
      expect(times(alexander(A), alexander(B))).toBe(alexander(sum));
      expect([alexander(A), alexander(B)].sort()).toEqual([alexander(pd(a)), alexander(pd(b))].sort());
    }
  });
  it('property: on random braid closures and their PD connected sums every split found has Δ(A)·Δ(B) = Δ(K) and as many crossings', () => {
    const rng = new Rng(43);
    let splits = 0;
    for (let t = 0; t < 120; t++) {
      const a = braidClosurePD(randomKnotBraid(rng, 3, 4 + rng.int(6))).pd;
      const b = braidClosurePD(randomKnotBraid(rng, 3, 4 + rng.int(6))).pd;
      const code = relabelPD(rng.next() < 0.5 ? pdConnectedSum(a, b) : a, rng);
      const parts = diagramSummands(code);
      if (!parts) continue;
      splits++;
      expect(parts[0].length + parts[1].length).toBe(code.length);
      expect(times(alexander(parts[0]), alexander(parts[1])), JSON.stringify(code)).toBe(alexander(code));
    }
    expect(splits).toBeGreaterThan(40);
  });
  it('composite PD codes are "not hyperbolic" (composite), also mirrored and kinked: 5_2 # 4_1, 3_1 # mirror 3_1, 6_2 # 7_6 # 3_1', () => {
    const cases: Array<[string, Crossing[]]> = [
      ['5_2 # 4_1', pdConnectedSum(pd('5_2'), pd('4_1'))],
      ['square knot', pdConnectedSum(pd('3_1'), mirrorPD(pd('3_1')))],
      ['6_2 # 7_6 # 3_1', pdConnectedSum(pdConnectedSum(pd('6_2'), pd('7_6')), pd('3_1'))],
    ];
    for (const [name, code] of cases) {
      for (const v of [code, mirrorPD(code), addKink(code, code[2]![1], 3)]) {
        const h = hyp(v);
        expect(h.geometry, name).toBe('not hyperbolic');
        expect(h.reason, name).toMatch(/^composite knot/);
        expect(h.volume).toBeUndefined();
      }
    }
  });
  it('an unknotted summand is dropped: 4_1 # (a 4-crossing unknot diagram) has the volume of 4_1 (2.029883212819307, from memory)', () => {
    // the closure of σ2σ1⁻¹σ2σ1 is the unknot (one braid relation and two destabilisations; by hand)
    const unknot = braidClosurePD({ strands: 3, word: [2, -1, 2, 1] }).pd;
    expect(recogniseDiagram(unknot).status).toBe('unknot');
    for (const code of [pdConnectedSum(pd('4_1'), unknot), pdConnectedSum(unknot, pd('5_2'))]) {
      const r = recogniseDiagram(code);
      expect(r.status).toBe('unknown');
      if (r.status === 'unknown') expect(r.dropped).toBe(1);
    }
    const h = hyp(pdConnectedSum(pd('4_1'), unknot));
    expect(h.geometry).toBe('hyperbolic');
    expect(h.volume!).toBeCloseTo(2.029883212819307, 10);
    // a sum of two unknot diagrams is the unknot
    expect(recogniseDiagram(pdConnectedSum(unknot, unknot)).status).toBe('unknot');
  });
  it('never refuses a prime hyperbolic knot: non-minimal PD codes (from braids), kinked and relabelled', () => {
    const rng = new Rng(42);
    for (const k of ['4_1', '5_2', '6_1', '6_2', '6_3', '7_2', '7_3', '7_4', '7_5', '7_6', '7_7']) {
      const code = fx.knots[k]!.pdFromBraid;
      for (const v of [code, relabelPD(addKink(code, code[0]![0], 1), rng)]) {
        const r = recogniseDiagram(v);
        expect(r.status, k).toBe('unknown');
      }
    }
  });
});
