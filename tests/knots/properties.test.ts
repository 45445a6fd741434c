import { describe, it, expect } from 'vitest';
import {
  addKink,
  analysePD,
  braidClosurePD,
  braidConnectedSum,
  computeInvariants,
  diagramFrom,
  gordonLitherland,
  mirrorBraid,
  mirrorPD,
  multiplyLaurent,
  pdConnectedSum,
  randomBraid,
  randomKnotBraid,
  relabelPD,
  braidSeifertMatrix,
  pencilDeterminant,
  centre,
  valueAtOne,
  valueAtMinusOne,
  pdToBraid,
  type Braid,
  type Crossing,
  type KnotInvariants,
} from '../../src/knots/index.ts';
import { Rng, deriveSeed } from '../../src/util/rng.ts';

const core = { invariants: ['signature', 'determinant', 'alexander', 'genus_bound'] as const };
const inv = (b: Braid): KnotInvariants => computeInvariants(diagramFrom({ kind: 'braid', braid: b }), core);
const invPD = (pd: Crossing[], freeLoops = 0): KnotInvariants =>
  computeInvariants({ kind: 'pd', pd, info: analysePD(pd), freeLoops }, core);
const same = (a: KnotInvariants, b: KnotInvariants): void => {
  expect(a.signature).toBe(b.signature);
  expect(a.determinant).toBe(b.determinant);
  expect(a.alexanderText).toBe(b.alexanderText);
};


describe("invariance under braid moves (Markov's theorem; Birman, 'Braids, Links and Mapping Class Groups', Thm 2.3)", () => {
  const rng = new Rng(deriveSeed(11, 'markov'));
  it('conjugation, stabilisation, far commutation, braid relation and free cancellation keep σ, det, Δ', () => {
    for (let trial = 0; trial < 150; trial++) {
      const n = 2 + rng.int(3);
      const b = randomBraid(rng, n, 2 + rng.int(10));
      const base = inv(b);
      const w = b.word;
      const k = rng.int(w.length);
      // conjugation by a generator: rotate the word
      same(inv({ strands: n, word: [...w.slice(k), ...w.slice(0, k)] }), base);
      // stabilisation σ_n^{±1} on a new strand
      same(inv({ strands: n + 1, word: [...w, rng.next() < 0.5 ? n : -n] }), base);
      // free cancellation g g⁻¹ inserted anywhere
      const g = (1 + rng.int(n - 1)) * (rng.next() < 0.5 ? 1 : -1);
      same(inv({ strands: n, word: [...w.slice(0, k), g, -g, ...w.slice(k)] }), base);
      if (n >= 3) {
        // braid relation σiσi+1σi = σi+1σiσi+1: insert σiσi+1σi·(σi+1σiσi+1)⁻¹
        const i = 1 + rng.int(n - 2);
        same(inv({ strands: n, word: [...w.slice(0, k), i, i + 1, i, -(i + 1), -i, -(i + 1), ...w.slice(k)] }), base);
      }
      // far commutation: swap adjacent letters |a| and |b| differing by ≥ 2
      for (let j = 0; j + 1 < w.length; j++)
        if (Math.abs(Math.abs(w[j]!) - Math.abs(w[j + 1]!)) >= 2) {
          const sw = w.slice();
          [sw[j], sw[j + 1]] = [sw[j + 1]!, sw[j]!];
          same(inv({ strands: n, word: sw }), base);
          break;
        }
    }
  });

  it('Reidemeister I kinks (all four kinds) and relabelling of the PD code keep σ, det, Δ (knots)', () => {
    for (let trial = 0; trial < 100; trial++) {
      const b = randomKnotBraid(rng, 2 + rng.int(3), 3 + rng.int(8));
      const base = inv(b);
      let { pd } = braidClosurePD(b);
      const kinks = 1 + rng.int(3);
      for (let r = 0; r < kinks; r++) pd = addKink(pd, pd[rng.int(pd.length)]![rng.int(4)]!, rng.int(4));
      pd = relabelPD(pd, rng);
      const after = invPD(pd);
      same(after, base);
    }
  });
});

describe('Gordon–Litherland signature equals the Seifert signature sign(V + Vᵀ) (Gordon & Litherland 1978, Cor. 6″)', () => {
  it('on 3000 random closed braids (knots and links, 2–5 strands), each read back as a kinked, relabelled PD code', () => {
    const rng = new Rng(deriveSeed(12, 'gl'));
    let links = 0;
    for (let trial = 0; trial < 3000; trial++) {
      const b = randomBraid(rng, 2 + rng.int(4), 1 + rng.int(12));
      const seifert = computeInvariants(diagramFrom({ kind: 'braid', braid: b }), { invariants: ['signature'] }).signature;
      let { pd } = braidClosurePD(b);
      if (rng.next() < 0.5) pd = addKink(pd, pd[0]![0]!, rng.int(4));
      pd = relabelPD(pd, rng);
      const gl = gordonLitherland(analysePD(pd)).signature;
      expect(gl, JSON.stringify(b)).toBe(seifert);
      if (analysePD(pd).nComponents > 1) links++;
    }
    expect(links).toBeGreaterThan(500); // links are exercised too
  });

  it('Fox-calculus Δ of the PD code equals the Burau Δ of the braid; Burau Δ equals det(t^{−1/2}V − t^{1/2}Vᵀ) exactly (300 braids)', () => {
    const rng = new Rng(deriveSeed(13, 'alex'));
    for (let trial = 0; trial < 300; trial++) {
      const b = randomBraid(rng, 2 + rng.int(3), 1 + rng.int(9));
      const d = diagramFrom({ kind: 'braid', braid: b });
      const viaBraid = computeInvariants(d, { invariants: ['alexander', 'determinant'] });
      const viaPD = computeInvariants({ ...d, braid: undefined, kind: 'pd' }, { invariants: ['alexander', 'determinant'] });
      // links too: the PD path fixes the sign through a Seifert matrix of the Vogel braid
      expect(viaPD.alexander).toEqual(viaBraid.alexander);
      expect(viaPD.determinant).toBe(viaBraid.determinant);
      const V = braidSeifertMatrix(b);
      const exact = centre(pencilDeterminant(V, V.map((r, i) => r.map((_, j) => -V[j]![i]!))));
      expect(viaBraid.alexander).toEqual(exact);
    }
  });
});

describe('facts of the trade on random knots', () => {
  const rng = new Rng(deriveSeed(14, 'facts'));
  const sample = Array.from({ length: 120 }, () => randomKnotBraid(rng, 2 + rng.int(4), 3 + rng.int(12)));

  it('σ even, det odd, Δ(1) = 1, Δ symmetric, |Δ(−1)| = det, |σ| ≤ 2·genus bound (from memory: Rolfsen, Lickorish)', () => {
    for (const b of sample) {
      const r = inv(b);
      expect(Math.abs(r.signature! % 2)).toBe(0);
      expect(Number(r.determinant) % 2).toBe(1);
      expect(valueAtOne(r.alexander!)).toBe(1n);
      const c = r.alexander!.coefficients;
      expect(c).toEqual(c.slice().reverse());
      const [re, im] = valueAtMinusOne(r.alexander!);
      expect(im).toBe(0n);
      expect(re < 0n ? -re : re).toBe(BigInt(r.determinant!));
      expect(Math.abs(r.signature!)).toBeLessThanOrEqual(2 * r.genusBound!);
    }
  });

  it('mirror image negates σ and keeps det and Δ (braid mirror and PD crossing change)', () => {
    for (const b of sample.slice(0, 60)) {
      const r = inv(b);
      const m = inv(mirrorBraid(b));
      expect(m.signature).toBe(-r.signature! + 0);
      expect(m.determinant).toBe(r.determinant);
      expect(m.alexanderText).toBe(r.alexanderText);
      const mp = invPD(mirrorPD(braidClosurePD(b).pd));
      expect(mp.signature).toBe(-r.signature! + 0);
      expect(mp.alexanderText).toBe(r.alexanderText);
    }
  });

  it('connected sum adds σ, multiplies det and Δ (braids and PD codes)', () => {
    for (let k = 0; k + 1 < 60; k += 2) {
      const a = sample[k]!;
      const b = sample[k + 1]!;
      const ra = inv(a);
      const rb = inv(b);
      const expectedAlex = multiplyLaurent(ra.alexander!, rb.alexander!);
      const s = inv(braidConnectedSum(a, b));
      expect(s.signature).toBe(ra.signature! + rb.signature!);
      expect(s.determinant).toBe(Number(ra.determinant) * Number(rb.determinant));
      expect(s.alexander).toEqual(expectedAlex);
      const pa = braidClosurePD(a).pd;
      const pb = braidClosurePD(b).pd;
      const e1 = pa[rng.int(pa.length)]![rng.int(4)]!;
      const e2 = pb[rng.int(pb.length)]![rng.int(4)]!;
      const sp = invPD(pdConnectedSum(pa, pb, e1, e2));
      expect(sp.signature).toBe(ra.signature! + rb.signature!);
      expect(sp.determinant).toBe(Number(ra.determinant) * Number(rb.determinant));
      expect(sp.alexander).toEqual(expectedAlex);
    }
  });
});

describe("Vogel's algorithm (Vogel, Comment. Math. Helv. 65, 1990): PD code → braid with the same closure", () => {
  it('on 300 random kinked, mirrored, relabelled PD codes: σ of the braid = Gordon–Litherland σ of the PD, Δ and σ_ω agree', () => {
    const rng = new Rng(deriveSeed(15, 'vogel'));
    let done = 0;
    while (done < 300) {
      const b0 = randomBraid(rng, 2 + rng.int(3), 2 + rng.int(8));
      const { pd: pd0, freeLoops } = braidClosurePD(b0);
      if (freeLoops > 0 || analysePD(pd0).nPieces > 1) continue;
      let pd = pd0;
      const kinks = rng.int(3);
      for (let r = 0; r < kinks; r++) pd = addKink(pd, pd[rng.int(pd.length)]![rng.int(4)]!, rng.int(4));
      const mirrored = rng.next() < 0.3;
      if (mirrored) pd = mirrorPD(pd);
      pd = relabelPD(pd, rng);
      const b = pdToBraid(pd);
      const viaBraid = computeInvariants(diagramFrom({ kind: 'braid', braid: b }), { invariants: ['signature', 'alexander', 'levine_tristram'], omega: 0.3 });
      const viaPD = computeInvariants({ kind: 'pd', pd, info: analysePD(pd), freeLoops: 0 }, { invariants: ['signature', 'alexander', 'levine_tristram'], omega: 0.3 });
      expect(viaBraid.signature).toBe(gordonLitherland(analysePD(pd)).signature);
      expect(viaPD.alexander).toEqual(viaBraid.alexander);
      // and against the original braid (mirror: σ_ω negates)
      const orig = computeInvariants(diagramFrom({ kind: 'braid', braid: mirrored ? mirrorBraid(b0) : b0 }), { invariants: ['levine_tristram'], omega: 0.3 });
      expect(viaPD.levineTristram).toBe(orig.levineTristram);
      done++;
    }
  });

  it('minimal PD codes of the knot table give σ_ω consistent with their signature (left-handed trefoil: +2 past x = 1/6; from memory)', () => {
    const lh = computeInvariants(diagramFrom({ kind: 'pd', pd: [[1, 4, 2, 5], [3, 6, 4, 1], [5, 2, 6, 3]] }), { invariants: ['levine_tristram'], omega: 0.3 });
    expect(lh.levineTristram).toBe(2);
    const lh0 = computeInvariants(diagramFrom({ kind: 'pd', pd: [[1, 4, 2, 5], [3, 6, 4, 1], [5, 2, 6, 3]] }), { invariants: ['levine_tristram'], omega: 0.1 });
    expect(lh0.levineTristram).toBe(0);
  });
});
