/**
 * Finding a geometric solution. For each ideal triangulation from the diagram (one per choice of
 * collapsed arcs, `octahedral.ts`): 2–0 moves on edges of valence ≤ 2; the tetrahedra carrying the
 * meridians are frozen; the rest is simplified by 3–2 / 2–0 moves with random 2–3 moves between
 * (`simplify.ts`). On the result, Newton's method in the upper half-plane from the regular start;
 * failing that, Levenberg–Marquardt without the half-plane constraint, and 2–3 / 3–2 moves that
 * carry that solution (same representation, same Σ D(z)) to a triangulation where every shape has
 * Im z > 0 (`flip.ts`), confirmed by Newton's method in the half-plane. Only a geometric solution is
 * returned: it is the complete hyperbolic structure (Thurston 1979, §4; the volume is then that of
 * the complement, Mostow rigidity).
 */
import type { PDInfo } from '../pd.ts';
import { cuspBases, type Passage } from './cusp.ts';
import { gluingEquations } from './equations.ts';
import { solveShapes, solveShapesFree, type NewtonResult } from './newton.ts';
import { linkTriangulations, type LinkTriangulation } from './octahedral.ts';
import { twoZero } from './moves.ts';
import { isCuspedTriangulation } from './octahedral.ts';
import { combinatorics, type Combinatorics, type Triangulation } from './triangulation.ts';
import { flipToGeometric } from './flip.ts';
import { simplifyTriangulation } from './simplify.ts';
import { placeMeridians } from './peripheral.ts';
import { Rng } from '../../util/rng.ts';

export interface SearchOptions {
  /** Base triangulations tried (different collapsed arcs). */
  maxTriangulations: number;
  /** Newton solves in all (each costs one run of Newton's method). */
  maxSolves: number;
  /** Smallest imaginary part accepted as positively oriented. */
  minIm: number;
  /** Simplifications (with different random 2–3 moves) tried per base triangulation. */
  rounds: number;
  /** Random 2–3 moves used to leave a local minimum of the tetrahedron count. */
  kicks: number;
  /** 2–3 / 3–2 moves allowed when carrying a solution with negative tetrahedra to a geometric one. */
  flipBudget: number;
}
export const SEARCH_DEFAULTS: SearchOptions = { maxTriangulations: 6, maxSolves: 30, minIm: 1e-7, rounds: 2, kicks: 20, flipBudget: 120 };

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
  /**
   * Where the cusp is to be measured when the geometric triangulation lost the meridians: the
   * triangulation before the 2–3 / 3–2 moves with its solution (negatively oriented tetrahedra
   * allowed) of which the geometric one is the carried image.
   */
  cuspSource?: { tri: Triangulation; cb: Combinatorics; re: Float64Array; im: Float64Array; map: Int32Array };
}

export interface SearchFailure {
  solves: number;
  triangulations: number;
  /** Best (largest) min Im z reached, for the reason text. */
  best: number;
  /** Solutions with negatively oriented tetrahedra that could not be carried to a geometric one. */
  negativeSolutions: number;
}

interface Candidate {
  /** The triangulation from the diagram before 2–0 / 2–3 moves. */
  unsimplified: LinkTriangulation;
  tri: Triangulation;
  map: Int32Array;
  moves: number;
  base: number;
}

const regular = (n: number): [Float64Array, Float64Array] => [new Float64Array(n).fill(0.5), new Float64Array(n).fill(Math.sqrt(3) / 2)];

/**
 * Solve on one triangulation: Newton's method in the upper half-plane from the regular start; if
 * that finds no geometric solution, Levenberg–Marquardt without the half-plane constraint, then
 * 2–3 / 3–2 moves that carry the solution to a triangulation where it is geometric (`flip.ts`),
 * confirmed by Newton's method in the half-plane from the carried shapes.
 */
function trySolve(c: Candidate, opts: SearchOptions, frozen: readonly number[], cusps: number, rng: Rng): { sol?: GeometricSolution; minIm: number; solves: number; negative: boolean } {
  const first = solveOn(c.tri, ...regular(c.tri.n), false);
  if (!first) return { minIm: -Infinity, solves: 0, negative: false };
  const make = (tri: Triangulation, r: NewtonResult & { cb: Combinatorics }, map: Int32Array, moves: number): GeometricSolution => ({
    tri,
    cb: r.cb,
    re: r.re,
    im: r.im,
    residual: r.residual,
    fromOctahedral: map,
    base: c.base,
    moves: c.moves + moves,
    solves: 0,
    unsimplified: c.unsimplified,
  });
  const minOf = (im: Float64Array): number => im.reduce((a, b) => Math.min(a, b), Infinity);
  if (first.converged && minOf(first.im) > opts.minIm) return { sol: make(c.tri, first, c.map, 0), minIm: minOf(first.im), solves: 1, negative: false };
  // continue from where the half-plane iteration stopped (usually at the boundary, next to a
  // solution with a few negatively oriented tetrahedra); else from the regular start
  let free = solveOn(c.tri, first.re, first.im, true);
  if (!free || !free.converged) free = solveOn(c.tri, ...regular(c.tri.n), true);
  if (!free || !free.converged) return { minIm: first.converged ? minOf(first.im) : -Infinity, solves: 2, negative: false };
  const flipped = flipToGeometric({ tri: c.tri, re: free.re, im: free.im, map: c.map }, [], cusps, rng, opts.flipBudget, opts.minIm, 4 * c.tri.n + 8);
  if (!flipped) return { minIm: minOf(free.im), solves: 2, negative: true };
  const polished = solveOn(flipped.tri, flipped.re, flipped.im, false);
  if (polished && polished.converged && minOf(polished.im) > opts.minIm) {
    // the cusp is read where the meridians are (same representation, carried by the moves)
    const sol = make(flipped.tri, polished, flipped.map, flipped.moves);
    sol.cuspSource = { tri: c.tri, cb: free.cb, re: free.re, im: free.im, map: c.map };
    return { sol, minIm: minOf(polished.im), solves: 3, negative: true };
  }
  return { minIm: minOf(free.im), solves: 3, negative: true };
}

/** Gluing and completeness equations of a triangulation solved from the given start. */
function solveOn(tri: Triangulation, re: Float64Array, im: Float64Array, free: boolean): (NewtonResult & { cb: Combinatorics }) | undefined {
  const cb = combinatorics(tri);
  let curves: Passage[][];
  try {
    curves = cuspBases(tri, cb).flat();
  } catch {
    return undefined;
  }
  const sys = gluingEquations(tri, cb, curves);
  return { ...(free ? solveShapesFree(sys, re, im) : solveShapes(sys, re, im)), cb };
}

/** Search for a geometric solution; the failure says how far it got. */
export function findGeometricSolution(info: PDInfo, cusps: number, opts: SearchOptions = SEARCH_DEFAULTS): GeometricSolution | SearchFailure {
  let solves = 0;
  let bases = 0;
  let best = -Infinity;
  let negativeSolutions = 0;
  const rng = new Rng(0x5eed);
  for (const lt of linkTriangulations(info, cusps)) {
    if (bases >= opts.maxTriangulations || solves >= opts.maxSolves) break;
    bases++;
    // edges of valence ≤ 2 (bigons of the diagram) force flat tetrahedra: 2–0 moves remove them
    const low = removeLowValence(lt.tri, lt.keptIndex, cusps);
    // the tetrahedra that carry the meridians stay as they are; the rest is simplified
    const places = placeMeridians(info, low.tri, low.map);
    const frozen = typeof places === 'string' ? [] : places.flatMap((p) => [4 * p.c + p.j, 4 * p.c + ((p.j + 1) & 3)]);
    for (let round = 0; round < opts.rounds && solves < opts.maxSolves; round++) {
      // round 1 keeps the triangulation from the diagram (only the 2–0 moves): long twist regions
      // often have a geometric solution there and none after simplification
      const sm = round === 1 ? low : simplifyTriangulation({ tri: low.tri, map: low.map }, frozen, cusps, rng, round === 0 ? opts.kicks : 2 * opts.kicks);
      const c: Candidate = { tri: sm.tri, map: sm.map, moves: low.moves, base: lt.attempt, unsimplified: lt };
      const r = trySolve(c, opts, frozen, cusps, rng);
      solves += r.solves;
      if (r.sol) return { ...r.sol, solves };
      if (r.negative) negativeSolutions++;
      best = Math.max(best, r.minIm);
    }
  }
  return { solves, triangulations: bases, best, negativeSolutions };
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
