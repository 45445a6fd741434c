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
import { carryBackOne, twoZeroRecord, type MoveRecord } from './carryback.ts';

export interface SearchOptions {
  /** Base triangulations tried (different collapsed arcs). */
  maxTriangulations: number;
  /** Newton solves in all (each costs one run of Newton's method). */
  maxSolves: number;
  /** Smallest imaginary part accepted as positively oriented. */
  minIm: number;
  /**
   * Rounds per base triangulation: 1 = everything simplified (moves recorded), 2 = simplified
   * with the meridians' tetrahedra kept, 3 = the triangulation from the diagram itself.
   */
  rounds: number;
  /** Base triangulations on which the third round (no simplification) is tried. */
  unsimplifiedBases: number;
  /** Random 2–3 moves used to leave a local minimum of the tetrahedron count. */
  kicks: number;
  /** 2–3 / 3–2 moves allowed when carrying a solution with negative tetrahedra to a geometric one. */
  flipBudget: number;
  /**
   * Effort cap: solver work for the whole search, in complex multiply–adds of the factorizations
   * (n³/6 each, `newton.ts`). Deterministic, so a row's status does not depend on the machine.
   */
  maxWork: number;
}
export const SEARCH_DEFAULTS: SearchOptions = { maxTriangulations: 6, maxSolves: 30, minIm: 1e-7, rounds: 3, unsimplifiedBases: 1, kicks: 20, flipBudget: 120, maxWork: 6e7 };

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
  /** The meridians were simplified away and the solution could not be carried back to them. */
  cuspLost?: boolean;
}

export interface SearchFailure {
  solves: number;
  /** Solver work spent (see `SearchOptions.maxWork`); `capped` when the cap ended the search. */
  work: number;
  capped: boolean;
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
  /**
   * When `tri` was simplified with nothing frozen: the triangulation the meridians were placed on
   * and the recorded moves from it to `tri`, to carry a solution back for the cusp.
   */
  back?: { tri: Triangulation; map: Int32Array; moves: MoveRecord[]; info: PDInfo };
}

const regular = (n: number): [Float64Array, Float64Array] => [new Float64Array(n).fill(0.5), new Float64Array(n).fill(Math.sqrt(3) / 2)];

/**
 * Solve on one triangulation: Newton's method in the upper half-plane from the regular start; if
 * that finds no geometric solution, Levenberg–Marquardt without the half-plane constraint, then
 * 2–3 / 3–2 moves that carry the solution to a triangulation where it is geometric (`flip.ts`),
 * confirmed by Newton's method in the half-plane from the carried shapes.
 */
function trySolve(c: Candidate, opts: SearchOptions, cusps: number, rng: Rng, budget: Budget): { sol?: GeometricSolution; minIm: number; solves: number; negative: boolean } {
  const solveOn = (tri: Triangulation, re: Float64Array, im: Float64Array, free: boolean): ReturnType<typeof solveWithin> => solveWithin(tri, re, im, free, budget);
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
  // with the meridians simplified away, the cusp is read where they are: the solution on c.tri
  // (same representation as the geometric one) carried back through the recorded moves
  const withCusp = (sol: GeometricSolution, src: { re: Float64Array; im: Float64Array; cb: Combinatorics }): GeometricSolution => {
    if (!c.back) {
      sol.cuspSource = { tri: c.tri, cb: src.cb, re: src.re, im: src.im, map: c.map };
      return sol;
    }
    // back along the recorded moves only as far as the first triangulation where every meridian can be placed
    const { moves, info } = c.back;
    let shapes: { re: Float64Array; im: Float64Array } | undefined = src;
    for (let k = moves.length; k >= 0 && shapes; k--) {
      const tri = k === 0 ? c.back.tri : moves[k - 1]!.after;
      const map = k === 0 ? c.back.map : moves[k - 1]!.track!;
      if (typeof placeMeridians(info, tri, map) !== 'string') {
        sol.cuspSource = { tri, cb: combinatorics(tri), re: shapes.re, im: shapes.im, map };
        return sol;
      }
      if (k > 0) shapes = carryBackOne(moves[k - 1]!, shapes.re, shapes.im);
    }
    sol.cuspLost = true;
    return sol;
  };
  if (first.converged && minOf(first.im) > opts.minIm) {
    const sol = make(c.tri, first, c.map, 0);
    return { sol: c.back ? withCusp(sol, first) : sol, minIm: minOf(first.im), solves: 1, negative: false };
  }
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
    const sol = withCusp(make(flipped.tri, polished, flipped.map, flipped.moves), free);
    return { sol, minIm: minOf(polished.im), solves: 3, negative: true };
  }
  return { minIm: minOf(free.im), solves: 3, negative: true };
}

/** Solver work spent and allowed (`SearchOptions.maxWork`). */
interface Budget {
  work: number;
  max: number;
  /** A solver stopped for want of work left. */
  capped: boolean;
}

/** Gluing and completeness equations of a triangulation solved from the given start, within the budget. */
function solveWithin(tri: Triangulation, re: Float64Array, im: Float64Array, free: boolean, budget: Budget): (NewtonResult & { cb: Combinatorics }) | undefined {
  const cb = combinatorics(tri);
  let curves: Passage[][];
  try {
    curves = cuspBases(tri, cb).flat();
  } catch {
    return undefined;
  }
  const sys = gluingEquations(tri, cb, curves);
  const left = budget.max - budget.work;
  const r = free ? solveShapesFree(sys, re, im, undefined, undefined, left) : solveShapes(sys, re, im, undefined, undefined, left);
  budget.work += r.work;
  if (r.capped) budget.capped = true;
  return { ...r, cb };
}

/** Search for a geometric solution; the failure says how far it got. */
export function findGeometricSolution(info: PDInfo, cusps: number, opts: SearchOptions = SEARCH_DEFAULTS): GeometricSolution | SearchFailure {
  let solves = 0;
  let bases = 0;
  let best = -Infinity;
  let negativeSolutions = 0;
  const budget: Budget = { work: 0, max: opts.maxWork, capped: false };
  const rng = new Rng(0x5eed);
  // a geometric solution whose cusp cannot be measured, kept in case no other is found
  let lost: GeometricSolution | undefined;
  for (const lt of linkTriangulations(info, cusps)) {
    if (bases >= opts.maxTriangulations || solves >= opts.maxSolves || budget.capped) break;
    bases++;
    // edges of valence ≤ 2 (bigons of the diagram) force flat tetrahedra: 2–0 moves remove them
    const low = removeLowValence(lt.tri, lt.keptIndex, cusps);
    // the tetrahedra that carry the meridians stay as they are; the rest is simplified
    const places = placeMeridians(info, low.tri, low.map);
    const frozen = typeof places === 'string' ? [] : places.flatMap((p) => [4 * p.c + p.j, 4 * p.c + ((p.j + 1) & 3)]);
    // round 0 simplifies everything (recording the moves, to carry the solution back to the
    // meridians); round 1 keeps the meridians' tetrahedra; round 2 keeps the triangulation from
    // the diagram (only the 2–0 moves): long twist regions are often geometric only there. The
    // unsimplified triangulation (large) is tried on the first base only: on the bench diagrams
    // it never gave a solution on another base.
    const rounds = bases <= opts.unsimplifiedBases ? opts.rounds : Math.min(opts.rounds, 2);
    for (let round = 0; round < rounds && solves < opts.maxSolves && !budget.capped; round++) {
      // every round records its moves from the triangulation of the diagram (before the 2–0 moves
      // on bigons), so that the cusp can be read wherever the meridians still are
      const sm = round === 2 ? { tri: low.tri, map: low.map, moves: [] } : simplifyTriangulation({ tri: low.tri, map: low.map }, round === 0 ? [] : frozen, cusps, rng, opts.kicks, true);
      const c: Candidate = { tri: sm.tri, map: sm.map, moves: low.moves, base: lt.attempt, unsimplified: lt, back: { tri: lt.tri, map: lt.keptIndex, moves: [...low.records, ...sm.moves!], info } };
      const r = trySolve(c, opts, cusps, rng, budget);
      solves += r.solves;
      if (r.sol && r.sol.cuspLost) lost ??= { ...r.sol, solves };
      else if (r.sol) return { ...r.sol, solves };
      if (r.negative) negativeSolutions++;
      best = Math.max(best, r.minIm);
    }
  }
  if (lost) return { ...lost, solves };
  return { solves, triangulations: bases, best, negativeSolutions, work: budget.work, capped: budget.capped };
}

/** Repeated 2–0 moves on edges of valence ≤ 2, each kept only if the result is still a cusped triangulation. */
export function removeLowValence(tri: Triangulation, map: Int32Array, cusps: number): { tri: Triangulation; map: Int32Array; moves: number; records: MoveRecord[] } {
  let cur = tri;
  let m = map;
  let moves = 0;
  const records: MoveRecord[] = [];
  for (let guard = 0; guard < tri.n; guard++) {
    const cb = combinatorics(cur);
    const val = new Array<number>(cb.nEdges).fill(0);
    for (const e of cb.edgeOf) val[e]!++;
    let progressed = false;
    for (let e = 0; e < cb.nEdges && !progressed; e++) {
      if (val[e]! > 2) continue;
      const r = twoZero(cur, cb.edgeOf, e);
      if (!r || !isCuspedTriangulation(r.tri, cusps)) continue;
      const rec = twoZeroRecord(cur, cb.edgeOf, e, r.tri, r.map);
      if (!rec) continue;
      m = m.map((x) => (x < 0 ? -1 : r.map[x]!));
      records.push({ ...rec, track: m });
      cur = r.tri;
      moves++;
      progressed = true;
    }
    if (!progressed) break;
  }
  return { tri: cur, map: m, moves, records };
}
