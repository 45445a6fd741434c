import { describe, it, expect } from 'vitest';
import { parseDiagram } from '../../../src/knots/diagram.ts';
import { octahedralDecomposition, linkTriangulations } from '../../../src/knots/hyperbolic/octahedral.ts';
import { combinatorics, isOriented, checkGluings } from '../../../src/knots/hyperbolic/triangulation.ts';
import { twoThree } from '../../../src/knots/hyperbolic/moves.ts';

describe('octahedral decomposition (D. Thurston 1999)', () => {
  it('gives S³ minus the link and two points: torus link at the knot, spheres at P₊ and P₋, Euler characteristic 0', () => {
    for (const code of ['1 -2 1 -2', '1 1 1 2 -1 2', 'X[4,2,5,1] X[8,6,1,5] X[6,3,7,4] X[2,7,3,8]']) {
      const d = parseDiagram(code);
      const o = octahedralDecomposition(d.info);
      expect(checkGluings(o.tri)).toBeUndefined();
      expect(isOriented(o.tri)).toBe(true);
      const cb = combinatorics(o.tri);
      expect(cb.linkEuler.sort()).toEqual([0, 2, 2]);
      // χ(S³ \ K) = 0 = 2 finite vertices − E + F − T with F = 2T (counting cells)
      expect(2 - cb.nEdges + 2 * o.tri.n - o.tri.n).toBe(0);
    }
  });
  it('collapses to ideal triangulations of the complement: torus cusps, as many edges as tetrahedra', () => {
    const d = parseDiagram('1 -2 1 -2');
    let count = 0;
    for (const lt of linkTriangulations(d.info, 1)) {
      const cb = combinatorics(lt.tri);
      expect(cb.nVertices).toBe(1);
      expect(cb.linkEuler).toEqual([0]);
      expect(cb.nEdges).toBe(lt.tri.n);
      count++;
    }
    // the figure-eight complement has a 2-tetrahedron triangulation (Thurston 1979, ch. 4); it appears
    expect(count).toBeGreaterThan(0);
    expect(Math.min(...[...linkTriangulations(d.info, 1)].map((l) => l.tri.n))).toBe(2);
  });
  it('a 2–3 move keeps an oriented cusped triangulation and adds one tetrahedron and one edge', () => {
    const d = parseDiagram('1 1 1 2 -1 2');
    const lt = linkTriangulations(d.info, 1).next().value!;
    const before = combinatorics(lt.tri);
    let after = undefined;
    for (let t = 0; t < lt.tri.n && !after; t++) for (let f = 0; f < 4 && !after; f++) after = twoThree(lt.tri, t, f);
    if (!after) throw new Error('no 2–3 move possible');
    expect(checkGluings(after)).toBeUndefined();
    expect(isOriented(after)).toBe(true);
    const cb = combinatorics(after);
    expect(after.n).toBe(lt.tri.n + 1);
    expect(cb.nEdges).toBe(before.nEdges + 1);
    expect(cb.linkEuler).toEqual([0]);
  });
});
