/**
 * A component that clasps one edge of another is a meridian of it: the link is a connected sum
 * with the Hopf link, never hyperbolic (a hyperbolic 3-manifold has no essential annulus;
 * Thurston 1982). Checked on clasped knots built here, against the Whitehead link and the
 * Borromean rings (hyperbolic, from memory: 4 and 8 × Catalan's constant), and against the solver:
 * a diagram with a clasp never has a geometric solution.
 */
import { describe, it, expect } from 'vitest';
import { parseDiagram } from '../../../src/knots/diagram.ts';
import { braidClosurePD } from '../../../src/knots/braid.ts';
import { analysePD } from '../../../src/knots/pd.ts';
import { randomBraid } from '../../../src/knots/generate.ts';
import { meridianClasp } from '../../../src/knots/hyperbolic/clasp.ts';
import { removeKinks } from '../../../src/knots/hyperbolic/kinks.ts';
import { hyperbolicInvariants } from '../../../src/knots/hyperbolic/invariants.ts';
import { findGeometricSolution } from '../../../src/knots/hyperbolic/search.ts';
import { Rng } from '../../../src/util/rng.ts';

const hyp = (code: string) => hyperbolicInvariants(parseDiagram(code));
const claspOf = (strands: number, word: number[]) => meridianClasp(analysePD(braidClosurePD({ strands, word }).pd));

describe('a component clasping one edge of another (a meridian)', () => {
  it('the trefoil and the figure-eight with a meridian: not hyperbolic, naming the two components', () => {
    // σ1³ on strands 1–2 is the trefoil; strand 3 is its own component, clasping strand 2 by σ2²
    expect(claspOf(3, [1, 1, 1, 2, 2])).toEqual({ clasp: 1, around: 0 });
    const t = hyp('3: 1 1 1 2 2');
    expect(t.geometry).toBe('not hyperbolic');
    expect(t.reason).toMatch(/^component 2 is a meridian of component 1 .*connected sum with the Hopf link$/);
    expect(t.volume).toBeUndefined();
    // 1 −2 1 −2 is the figure-eight on strands 1–3; strand 4 clasps strand 3 by σ3^−2
    const f = hyp('4: 1 -2 1 -2 -3 -3');
    expect(f.geometry).toBe('not hyperbolic');
    expect(f.reason).toMatch(/is a meridian of/);
  });

  it('no clasp where a component passes over (or under) both times, or crosses the other component four times', () => {
    // over both times: the component lifts off (a split link, refused elsewhere as split)
    expect(claspOf(3, [1, 1, 1, 2, -2])).toBeNull(); // cancelling pair: both crossings have strand 3 on the same side
    // Whitehead link and Borromean rings (hyperbolic, from memory): every component crosses the rest 4 times
    expect(claspOf(3, [1, -2, 1, -2, -2])).toBeNull();
    expect(claspOf(3, [1, -2, 1, -2, 1, -2])).toBeNull();
    expect(hyp('1 -2 1 -2 -2').geometry).toBe('hyperbolic');
  });

  it('a diagram with a clasp never has a geometric solution (random 3- and 4-strand links; the theorem above)', () => {
    const rng = new Rng(20261202);
    let clasped = 0;
    for (let k = 0; k < 300; k++) {
      const b = randomBraid(rng, 3 + (k % 2), 8 + (k % 9));
      const { pd, freeLoops } = removeKinks(braidClosurePD(b).pd);
      if (freeLoops > 0 || pd.length < 3) continue;
      const info = analysePD(pd);
      if (info.nPieces > 1 || !meridianClasp(info)) continue;
      clasped++;
      expect('tri' in findGeometricSolution(info, info.nComponents), `${b.strands}: ${b.word.join(' ')}`).toBe(false);
    }
    expect(clasped).toBeGreaterThan(10);
  });
});
