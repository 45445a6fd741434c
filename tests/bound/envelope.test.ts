import { describe, it, expect } from 'vitest';
import { tightestEnvelope } from '../../src/bound/envelope.ts';
import { Rng } from '../../src/util/rng.ts';

const all = (n: number) => Int32Array.from({ length: n }, (_, i) => i);

describe('tightest linear envelope (revised simplex on the dual)', () => {
  it('picks the upper-hull edge over the centroid (worked by hand)', () => {
    // hull of (0,1), (1,2), (3,2.5): the edge over z̄ = 4/3 joins (1,2) and (3,2.5): y = 1.75 + 0.25 z
    const e = tightestEnvelope(Float64Array.of(1, 2, 2.5), [Float64Array.of(0, 1, 3)], all(3), { upper: true, maxSlope: 4 });
    expect(e.intercept).toBeCloseTo(1.75, 12);
    expect(e.slopes[0]).toBeCloseTo(0.25, 12);
    expect(e.meanGap).toBeCloseTo((0.75 + 0 + 0) / 3, 12);
  });

  it('lower form: the lower-hull edge over the centroid (worked by hand)', () => {
    // lower hull of (0,1), (1,0), (2,2): edge over z̄ = 1 is ambiguous; use (0,3), (1,0), (3,1): z̄ = 4/3, edge (1,0)-(3,1)
    const e = tightestEnvelope(Float64Array.of(3, 0, 1), [Float64Array.of(0, 1, 3)], all(3), { upper: false, maxSlope: 10 });
    expect(e.slopes[0]).toBeCloseTo(0.5, 12);
    expect(e.intercept).toBeCloseTo(-0.5, 12);
  });

  it('agrees with a brute-force search over all planes through 3 points (common practice for small LPs)', () => {
    const rng = new Rng(7);
    for (let trial = 0; trial < 20; trial++) {
      const n = 25;
      const z1 = Float64Array.from({ length: n }, () => rng.normal());
      const z2 = Float64Array.from({ length: n }, () => rng.normal());
      const y = Float64Array.from({ length: n }, (_, i) => -(z1[i]! ** 2) - z2[i]! ** 2 + 0.3 * rng.normal());
      const e = tightestEnvelope(y, [z1, z2], all(n), { upper: true, maxSlope: 1e6 });
      const m1 = z1.reduce((s, v) => s + v, 0) / n;
      const m2 = z2.reduce((s, v) => s + v, 0) / n;
      let best = Infinity;
      for (let i = 0; i < n; i++)
        for (let j = i + 1; j < n; j++)
          for (let k = j + 1; k < n; k++) {
            // plane through three points
            const A = [[1, z1[i]!, z2[i]!], [1, z1[j]!, z2[j]!], [1, z1[k]!, z2[k]!]];
            const b = [y[i]!, y[j]!, y[k]!];
            const sol = solve3(A, b);
            if (!sol) continue;
            let ok = true;
            for (let t = 0; t < n && ok; t++) if (y[t]! > sol[0]! + sol[1]! * z1[t]! + sol[2]! * z2[t]! + 1e-9) ok = false;
            if (ok) best = Math.min(best, sol[0]! + sol[1]! * m1 + sol[2]! * m2);
          }
      expect(e.intercept + e.slopes[0]! * m1 + e.slopes[1]! * m2).toBeCloseTo(best, 8);
    }
  });

  it('holds on every row and respects the box, flagging a slope at its limit', () => {
    const z = Float64Array.from({ length: 50 }, (_, i) => i / 10);
    const y = Float64Array.from(z, (v) => 9 * v); // slope 9 wanted, box 4
    const e = tightestEnvelope(y, [z], all(50), { upper: true, maxSlope: 4 });
    expect(e.slopes[0]).toBeCloseTo(4, 10);
    expect(e.atLimit).toEqual([true]);
    for (let i = 0; i < 50; i++) expect(y[i]!).toBeLessThanOrEqual(e.intercept + e.slopes[0]! * z[i]!);
  });

  it('recovers AM–GM: xy ≤ (x+y)²/4 in logs, exponent 2 and constant 1/4 (equality x = y); a decoy gets 0', () => {
    const rng = new Rng(3);
    const n = 20000;
    const y = new Float64Array(n);
    const s = new Float64Array(n);
    const decoy = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const a = rng.uniform(0.1, 10);
      const b = i % 10 === 0 ? a : rng.uniform(0.1, 10); // every tenth row on the equality family
      y[i] = Math.log(a * b);
      s[i] = Math.log(a + b);
      decoy[i] = s[i]! + rng.uniform(-0.3, 0.3);
    }
    const e = tightestEnvelope(y, [s, decoy], all(n), { upper: true, maxSlope: 4 });
    expect(e.slopes[0]).toBeCloseTo(2, 6);
    expect(e.slopes[1]).toBeCloseTo(0, 6);
    expect(Math.exp(e.intercept)).toBeCloseTo(0.25, 6);
  });
});

function solve3(A: number[][], b: number[]): number[] | null {
  const M = A.map((r, i) => [...r, b[i]!]);
  for (let c = 0; c < 3; c++) {
    let p = c;
    for (let r = c + 1; r < 3; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[p]![c]!)) p = r;
    if (Math.abs(M[p]![c]!) < 1e-12) return null;
    [M[c], M[p]] = [M[p]!, M[c]!];
    for (let r = 0; r < 3; r++) {
      if (r === c) continue;
      const f = M[r]![c]! / M[c]![c]!;
      for (let k = c; k < 4; k++) M[r]![k]! -= f * M[c]![k]!;
    }
  }
  return [M[0]![3]! / M[0]![0]!, M[1]![3]! / M[1]![1]!, M[2]![3]! / M[2]![2]!];
}
