import { describe, it, expect } from 'vitest';
import { platClosurePD, twistKnotPD } from '../../src/knots/plat.ts';
import { parseDiagram } from '../../src/knots/diagram.ts';
import { computeInvariants } from '../../src/knots/invariants.ts';

describe('plat closures', () => {
  it('twist knots: determinant 2n + 1, one component, n + 2 crossings (Rolfsen, Knots and Links, §4.D: C(n, 2))', () => {
    for (let n = 1; n <= 12; n++) {
      const pd = twistKnotPD(n);
      expect(pd.length).toBe(n + 2);
      const d = parseDiagram(JSON.stringify(pd));
      expect(d.info.nComponents).toBe(1);
      expect(computeInvariants(d, { invariants: ['determinant'] }).determinant).toBe(2 * n + 1);
    }
  });
  it('Alexander polynomials of 4_1 and 5_2 from their plats (from memory, reference checks)', () => {
    const a = computeInvariants(parseDiagram(JSON.stringify(twistKnotPD(2))), { invariants: ['alexander'] });
    const b = computeInvariants(parseDiagram(JSON.stringify(twistKnotPD(3))), { invariants: ['alexander'] });
    expect(String(a.alexander!.coefficients)).toMatch(/-1,3,-1/);
    expect(String(b.alexander!.coefficients)).toMatch(/(2,-3,2)|(-2,3,-2)/);
  });
  it('the plat of σ2^k on four strands is the torus link T(2, k): determinant k for odd k', () => {
    const d = parseDiagram(JSON.stringify(platClosurePD(4, [2, 2, 2, 2, 2])));
    expect(computeInvariants(d, { invariants: ['determinant'] }).determinant).toBe(5);
    expect(() => platClosurePD(3, [1])).toThrow(/even/);
  });
});
