/**
 * Finding a geometric solution: for each ideal triangulation from the diagram (one per choice of
 * collapsed arcs, `octahedral.ts`), solve the gluing and completeness equations from the regular
 * start; when the solution is not geometric (some shape has Im z ≤ `minIm`, i.e. flat or negatively
 * oriented tetrahedra), retriangulate by 2–3 moves on the faces of the worst tetrahedra and solve
 * again. A geometric solution of the gluing and completeness equations is the complete hyperbolic
 * structure (Thurston 1979, §4; the volume is then that of the complement, Mostow rigidity).
 */
import type { PDInfo } from '../pd.ts';
import { cuspBases, type Passage } from './cusp.ts';
import { gluingEquations } from './equations.ts';
import { solveShapes } from './newton.ts';
import { linkTriangulations, type LinkTriangulation } from './octahedral.ts';
import { twoThree, twoZero } from './moves.ts';
import { isCuspedTriangulation } from './octahedral.ts';
import { combinatorics, type Combinatorics, type Triangulation } from './triangulation.ts';

export interface SearchOptions {
  /** Base triangulations tried (different collapsed arcs). */
  maxTriangulations: number;
  /** Newton solves in all (each costs one run of Newton's method). */
  maxSolves: number;
  /** Smallest imaginary part accepted as positively oriented. */
  minIm: number;
}
export const SEARCH_DEFAULTS: SearchOptions = { maxTriangulations: 40, maxSolves: 160, minIm: 1e-7 };

export interface GeometricSolution {
  tri: Triangulation;
  cb: Combinatorics;
  re: Float64Array;
  im: Float64Array;
  residual: number;
  /** Original octahedral tetrahedron (4c + s) → index in `tri`, −1 when removed or moved. */
  fromOctahedral: Int32Array;
  base: number;
  moves: number;
  solves: number;
  /** The triangulation it came from, before 2–0 / 2–3 moves (same manifold). */
  unsimplified: LinkTriangulation;
}

export interface SearchFailure {
  solves: number;
  triangulations: number;
  /** Best (largest) min Im z reached, for the reason text. */
  best: number;
}

interface Candidate {
  /** The triangulation from the diagram before 2–0 / 2–3 moves. */
  unsimplified: LinkTriangulation;
  tri: Triangulation;
  map: Int32Array;
  moves: number;
  base: number;
}

function trySolve(c: Candidate, opts: SearchOptions): { sol?: GeometricSolution; im?: Float64Array; minIm: number } {
  const cb = combinatorics(c.tri);
  let curves: Passage[][];
  try {
    curves = cuspBases(c.tri, cb).flat();
  } catch {
    return { minIm: -Infinity };
  }
  const sys = gluingEquations(c.tri, cb, curves);
  const n = c.tri.n;
  const r = solveShapes(sys, new Float64Array(n).fill(0.5), new Float64Array(n).fill(Math.sqrt(3) / 2));
  let minIm = Infinity;
  for (let t = 0; t < n; t++) minIm = Math.min(minIm, r.im[t]!);
  if (r.converged && minIm > opts.minIm)
    return { sol: { tri: c.tri, cb, re: r.re, im: r.im, residual: r.residual, fromOctahedral: c.map, base: c.base, moves: c.moves, solves: 0, unsimplified: c.unsimplified }, minIm };
  return { im: r.im, minIm: r.converged ? minIm : -Infinity };
}

/** Map old tetrahedron indices through a 2–3 move on (t0, f0): the two replaced ones go to −1. */
function remap(map: Int32Array, tri: Triangulation, t0: number, f0: number): Int32Array {
  const t1 = tri.nbr[4 * t0 + f0]!;
  const idx = new Int32Array(tri.n).fill(-1);
  let k = 0;
  for (let u = 0; u < tri.n; u++) if (u !== t0 && u !== t1) idx[u] = k++;
  return map.map((x) => (x < 0 ? -1 : idx[x]!));
}

/** Search for a geometric solution; the failure says how far it got. */
export function findGeometricSolution(info: PDInfo, cusps: number, opts: SearchOptions = SEARCH_DEFAULTS): GeometricSolution | SearchFailure {
  let solves = 0;
  let bases = 0;
  let best = -Infinity;
  const pending: Array<{ c: Candidate; im: Float64Array }> = [];
  for (const lt of linkTriangulations(info, cusps)) {
    if (bases >= opts.maxTriangulations || solves >= opts.maxSolves) break;
    bases++;
    // edges of valence ≤ 2 (bigons of the diagram) force flat tetrahedra: 2–0 moves remove them
    const simple = removeLowValence(lt.tri, lt.keptIndex, cusps);
    const c: Candidate = { tri: simple.tri, map: simple.map, moves: simple.moves, base: lt.attempt, unsimplified: lt };
    const r = trySolve(c, opts);
    solves++;
    if (r.sol) return { ...r.sol, solves };
    best = Math.max(best, r.minIm);
    if (r.im && pending.length < 8) pending.push({ c, im: r.im });
  }
  if (pending.length) {
    const res = retriangulate(pending, opts, () => solves++, () => solves < opts.maxSolves);
    if (res) return { ...res, solves };
  }
  return { solves, triangulations: bases, best };
}

function retriangulate(list: Array<{ c: Candidate; im: Float64Array }>, opts: SearchOptions, count: () => void, more: () => boolean): GeometricSolution | undefined {
  // breadth first over one or two 2–3 moves, worst tetrahedra first
  let frontier = list;
  for (let depth = 0; depth < 2 && frontier.length && more(); depth++) {
    const next: Array<{ c: Candidate; im: Float64Array }> = [];
    for (const { c, im } of frontier) {
      const order = Array.from(im.keys()).sort((a, b) => im[a]! - im[b]!).slice(0, 2);
      for (const t0 of order)
        for (let f0 = 0; f0 < 4 && more(); f0++) {
          const nt = twoThree(c.tri, t0, f0);
          if (!nt) continue;
          const cand: Candidate = { tri: nt, map: remap(c.map, c.tri, t0, f0), moves: c.moves + 1, base: c.base, unsimplified: c.unsimplified };
          count();
          const r = trySolve(cand, opts);
          if (r.sol) return r.sol;
          if (r.im && depth === 0) next.push({ c: cand, im: r.im });
        }
      if (!more()) break;
    }
    frontier = next;
  }
  return undefined;
}

/** Repeated 2–0 moves on edges of valence ≤ 2, each kept only if the result is still a cusped triangulation. */
export function removeLowValence(tri: Triangulation, map: Int32Array, cusps: number): { tri: Triangulation; map: Int32Array; moves: number } {
  let cur = tri;
  let m = map;
  let moves = 0;
  for (let guard = 0; guard < tri.n; guard++) {
    const cb = combinatorics(cur);
    const val = new Array<number>(cb.nEdges).fill(0);
    for (const e of cb.edgeOf) val[e]!++;
    let progressed = false;
    for (let e = 0; e < cb.nEdges && !progressed; e++) {
      if (val[e]! > 2) continue;
      const r = twoZero(cur, cb.edgeOf, e);
      if (!r || !isCuspedTriangulation(r.tri, cusps)) continue;
      m = m.map((x) => (x < 0 ? -1 : r.map[x]!));
      cur = r.tri;
      moves++;
      progressed = true;
    }
    if (!progressed) break;
  }
  return { tri: cur, map: m, moves };
}
