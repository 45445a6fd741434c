/**
 * Shapes carried back through a recorded sequence of moves (from the triangulation after the
 * moves to the one before them), so that a solution found on a simplified triangulation can be
 * read where the meridian curves still are. Every shape is a cross ratio of ideal points placed by
 * the developing map of the same representation, so the carried shapes solve the earlier
 * triangulation's gluing and completeness equations in product form (Thurston 1979, §4;
 * Neumann & Zagier 1985); tetrahedra may come back negatively oriented, never degenerate (a move
 * whose shapes would be degenerate makes the carry fail).
 * - a 2–3 or 3–2 move (`pachner.ts`): the five labels of the ball are placed from two of the new
 *   tetrahedra, the old shapes are the cross ratios of their labels;
 * - a 2–0 move (`moves.ts`): the pillow's four vertices are placed by walking around the edge cd
 *   from the tetrahedron X beyond its face bcd to the tetrahedron Y beyond its face acd. That walk
 *   stays in the star of one edge and is homotopic to the way through the pillow only when the
 *   pillow's edge cd and the edge of X and Y are one edge after the move (checked combinatorially
 *   by `twoZeroRecord`); otherwise the pillow's shape is not determined by the neighbouring shapes
 *   and the move is recorded as not invertible (a carry stops there).
 */
import { crossRatio01, placeTetrahedron, placeVertex, type BallMove } from './pachner.ts';
import { pillow } from './moves.ts';
import type { Triangulation } from './triangulation.ts';
import type { C } from './cpair.ts';


export type MoveRecord =
  | { kind: 'ball'; ball: BallMove; map: Int32Array; after: Triangulation; track?: Int32Array }
  | {
      kind: 'twoZero';
      /** The pillow (indices before the move), X and Y (indices after it). */
      t0: number;
      t1: number;
      /** t0's vertex i ↔ X's vertex xp[i] (i ≠ a: across t0's face opposite a), ↔ Y's vertex yp[i] (i ≠ b). */
      xp: number[];
      yp: number[];
      X: number;
      Y: number;
      a: number;
      b: number;
      c: number;
      d: number;
      /** t1's vertex alpha[i] is t0's vertex i. */
      alpha: number[];
      map: Int32Array;
      after: Triangulation;
      /** False when the pillow cannot be put back from the shapes after the move (see the module comment). */
      invertible: boolean;
      /** Where the tetrahedra of the very first triangulation are after this move (−1 when gone). */
      track?: Int32Array;
    };

const good = (z: C): boolean => Number.isFinite(z[0]) && Number.isFinite(z[1]) && Math.hypot(z[0], z[1]) > 1e-12 && Math.hypot(1 - z[0], z[1]) > 1e-12;

/**
 * Walk around the edge (u, v) of tetrahedron T (after the move) until tetrahedron Y is reached with
 * the same edge as (yu, yv); with shapes, returns Y's four vertex positions in the frame where T's
 * are `posT`; without, whether Y is reached at all. Undefined when the walk closes first.
 */
function walkToEdge(tri: Triangulation, T: number, u: number, v: number, Y: number, yu: number, yv: number, shapes?: { re: Float64Array; im: Float64Array; posT: C[] }): C[] | true | undefined {
  let [w1, w2] = [0, 1, 2, 3].filter((x) => x !== u && x !== v) as [number, number];
  let P = shapes?.posT;
  const start = [T, u, v];
  for (let step = 0; step <= 6 * tri.n; step++) {
    const N = tri.nbr[4 * T + w1]!;
    const base = 16 * T + 4 * w1;
    const nu = tri.perm[base + u]!;
    const nv = tri.perm[base + v]!;
    const nw2 = tri.perm[base + w2]!;
    const fresh = tri.perm[base + w1]!;
    if (shapes && P) {
      const Q: Array<C | undefined> = [undefined, undefined, undefined, undefined];
      Q[nu] = P[u];
      Q[nv] = P[v];
      Q[nw2] = P[w2];
      Q[fresh] = placeVertex(Q, [shapes.re[N]!, shapes.im[N]!], fresh);
      P = Q as C[];
    }
    T = N;
    u = nu;
    v = nv;
    w1 = nw2;
    w2 = fresh;
    if (T === Y && u === yu && v === yv) return P ?? true;
    if (T === start[0] && u === start[1] && v === start[2]) return undefined;
  }
  return undefined;
}

/** The record of the 2–0 move on `edge` of `before` (giving `after` with index map `map`); undefined when it is no pillow. */
export function twoZeroRecord(before: Triangulation, edgeOf: Int32Array, edge: number, after: Triangulation, map: Int32Array): MoveRecord | undefined {
  const pl = pillow(before, edgeOf, edge);
  if (!pl) return undefined;
  const { t0, t1, a, b, c, d, alpha } = pl;
  const Xo = before.nbr[4 * t0 + a]!;
  const Yo = before.nbr[4 * t0 + b]!;
  const xp = Array.from(before.perm.subarray(16 * t0 + 4 * a, 16 * t0 + 4 * a + 4));
  const yp = Array.from(before.perm.subarray(16 * t0 + 4 * b, 16 * t0 + 4 * b + 4));
  const X = map[Xo]!;
  const Y = map[Yo]!;
  const simple = Xo !== t0 && Xo !== t1 && Yo !== t0 && Yo !== t1 && Xo !== Yo;
  const invertible = simple && walkToEdge(after, X, xp[c]!, xp[d]!, Y, yp[c]!, yp[d]!) !== undefined;
  return { kind: 'twoZero', t0, t1, xp, yp, X, Y, a, b, c, d, alpha, map, after, invertible };
}

/** Shapes before one recorded move from the shapes after it; undefined when one would be degenerate. */
export function carryBackOne(rec: MoveRecord, re: Float64Array, im: Float64Array): { re: Float64Array; im: Float64Array } | undefined {
  const n = rec.map.length;
  const ore = new Float64Array(n);
  const oim = new Float64Array(n);
  for (let u = 0; u < n; u++) {
    const k = rec.map[u]!;
    if (k < 0) continue;
    ore[u] = re[k]!;
    oim[u] = im[k]!;
  }
  if (rec.kind === 'ball') {
    const { olds, labels, news } = rec.ball;
    const base = rec.after.n - news.length;
    // the five labels placed from the first new tetrahedron and the one label it lacks from the second
    const pos: Array<C | undefined> = [];
    const p0 = placeTetrahedron([re[base]!, im[base]!]);
    for (let i = 0; i < 4; i++) pos[news[0]![i]!] = p0[i]!;
    const T1 = news[1]!;
    const k = T1.findIndex((l) => pos[l] === undefined);
    if (k < 0) return undefined;
    pos[T1[k]!] = placeVertex(
      T1.map((l, i) => (i === k ? undefined : pos[l])),
      [re[base + 1]!, im[base + 1]!],
      k,
    );
    for (let j = 0; j < olds.length; j++) {
      const z = crossRatio01(labels[j]!.map((l) => pos[l]!));
      if (!good(z)) return undefined;
      ore[olds[j]!] = z[0];
      oim[olds[j]!] = z[1];
    }
    return { re: ore, im: oim };
  }
  if (!rec.invertible) return undefined;
  const { t0, t1, xp, yp, X, Y, a, b, c, d, alpha, after } = rec;
  const posX = placeTetrahedron([re[X]!, im[X]!]);
  const posY = walkToEdge(after, X, xp[c]!, xp[d]!, Y, yp[c]!, yp[d]!, { re, im, posT: posX });
  if (!posY || posY === true) return undefined;
  // t0's vertices: b, c, d on X's side, a on Y's
  const at: C[] = [];
  for (const i of [b, c, d]) at[i] = posX[xp[i]!]!;
  at[a] = posY[yp[a]!]!;
  const z0 = crossRatio01([at[0]!, at[1]!, at[2]!, at[3]!]);
  // t1 has the same four ideal vertices (its vertex alpha[i] is t0's vertex i)
  const of1: C[] = [];
  for (let i = 0; i < 4; i++) of1[alpha[i]!] = at[i]!;
  const z1 = crossRatio01([of1[0]!, of1[1]!, of1[2]!, of1[3]!]);
  if (!good(z0) || !good(z1)) return undefined;
  ore[t0] = z0[0];
  oim[t0] = z0[1];
  ore[t1] = z1[0];
  oim[t1] = z1[1];
  return { re: ore, im: oim };
}

/** Shapes on the triangulation before `moves` (in the order made) from shapes on the one after them. */
export function carryBack(moves: readonly MoveRecord[], re: Float64Array, im: Float64Array): { re: Float64Array; im: Float64Array } | undefined {
  let cur: { re: Float64Array; im: Float64Array } | undefined = { re, im };
  for (let k = moves.length - 1; k >= 0 && cur; k--) cur = carryBackOne(moves[k]!, cur.re, cur.im);
  return cur;
}
