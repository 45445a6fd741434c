import { describe, it, expect } from 'vitest';
import { braidClosurePD } from '../../../src/knots/braid.ts';
import { analysePD } from '../../../src/knots/pd.ts';
import { linkTriangulations } from '../../../src/knots/hyperbolic/octahedral.ts';
import { removeLowValence } from '../../../src/knots/hyperbolic/search.ts';
import { simplifyTriangulation } from '../../../src/knots/hyperbolic/simplify.ts';
import { combinatorics, type Triangulation } from '../../../src/knots/hyperbolic/triangulation.ts';
import { cuspBases } from '../../../src/knots/hyperbolic/cusp.ts';
import { gluingEquations } from '../../../src/knots/hyperbolic/equations.ts';
import { solveShapes, solveShapesFree } from '../../../src/knots/hyperbolic/newton.ts';
import { carryBack, carryBackOne } from '../../../src/knots/hyperbolic/carryback.ts';
import { blochWigner } from '../../../src/knots/hyperbolic/dilog.ts';
import { Rng } from '../../../src/util/rng.ts';
import { productResidual } from './product-residual.ts';

const volume = (s: { re: Float64Array; im: Float64Array }): number => s.re.reduce((v, _, t) => v + blochWigner(s.re[t]!, s.im[t]!), 0);

const regular = (n: number): [Float64Array, Float64Array] => [new Float64Array(n).fill(0.5), new Float64Array(n).fill(Math.sqrt(3) / 2)];
function solve(tri: Triangulation): { re: Float64Array; im: Float64Array } {
  const cb = combinatorics(tri);
  const sys = gluingEquations(tri, cb, cuspBases(tri, cb).flat());
  let r = solveShapes(sys, ...regular(tri.n));
  if (!r.converged) r = solveShapesFree(sys, ...regular(tri.n));
  expect(r.converged).toBe(true);
  return r;
}
function low(word: number[]): Triangulation {
  const info = analysePD(braidClosurePD({ strands: Math.max(...word.map(Math.abs)) + 1, word }).pd);
  const lt = linkTriangulations(info, 1).next().value!;
  return removeLowValence(lt.tri, lt.keptIndex, 1).tri;
}

describe('shapes carried back through recorded moves', () => {
  it.each([
    ['5_2', [1, 1, 1, 2, -1, 2]],
    ['7_4', [1, 1, 2, -1, 2, 2, 3, -2, 3]],
    ['7_7', [1, -2, 1, -2, 3, -2, 3]],
  ])('%s: a solution on the simplified triangulation, carried back, solves the larger one with the same Σ D(z) (Thurston 1979 §4; Neumann–Zagier 1985), and is the geometric one when that exists (Mostow rigidity)', (_, word) => {
    const start = low(word as number[]);
    const direct = solve(start);
    const geometric = Math.min(...direct.im) > 0;
    let full = 0;
    let partial = 0;
    for (let seed = 1; seed <= 8; seed++) {
      const sm = simplifyTriangulation({ tri: start, map: new Int32Array(start.n).map((_, i) => i) }, [], 1, new Rng(seed), 10, true);
      expect(sm.moves!.length).toBeGreaterThan(0);
      expect(sm.moves![sm.moves!.length - 1]!.after).toBe(sm.tri);
      const s = solve(sm.tri);
      const back = carryBack(sm.moves!, s.re, s.im);
      if (!back) {
        // only a 2–0 move whose pillow is not determined by its neighbours stops a carry
        let k = sm.moves!.length - 1;
        let cur: { re: Float64Array; im: Float64Array } | undefined = s;
        while (cur) cur = carryBackOne(sm.moves![k--]!, cur.re, cur.im);
        const stop = sm.moves![k + 1]!;
        expect(stop.kind === 'twoZero' && !stop.invertible).toBe(true);
        partial++;
        continue;
      }
      full++;
      expect(productResidual(start, back.re, back.im)).toBeLessThan(1e-9);
      expect(Math.abs(volume(back) - volume(s))).toBeLessThan(1e-9);
      if (geometric && Math.min(...s.im) > 0)
        for (let t = 0; t < start.n; t++) {
          expect(Math.abs(back.re[t]! - direct.re[t]!)).toBeLessThan(1e-9);
          expect(Math.abs(back.im[t]! - direct.im[t]!)).toBeLessThan(1e-9);
        }
    }
    expect(full).toBeGreaterThan(0);
    expect(full + partial).toBe(8);
  });
});
