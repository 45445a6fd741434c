/**
 * Fewer tetrahedra before solving: 3–2 moves on edges of valence 3 and 2–0 moves on edges of
 * valence 2 (each removes tetrahedra; Matveev 2003, §1.2), with random 2–3 moves to leave a local
 * minimum, keeping the smallest triangulation seen. Tetrahedra listed in `frozen` (those that carry
 * the meridians, `peripheral.ts`) are never touched, so the meridian curves survive unchanged.
 * Every result is checked to be an ideal triangulation with `cusps` torus cusps. With `record`, the
 * moves are recorded (`carryback.ts`), so that a solution on the result can be carried back
 * towards the start.
 */
import { isCuspedTriangulation } from './octahedral.ts';
import { twoZero } from './moves.ts';
import { threeTwoMove, twoThreeMove } from './pachner.ts';
import { twoZeroRecord, type MoveRecord } from './carryback.ts';
import { combinatorics, EDGE_VERTS, type Triangulation } from './triangulation.ts';
import type { Rng } from '../../util/rng.ts';

export interface Tracked {
  tri: Triangulation;
  /** Index in `tri` of each tetrahedron of the original triangulation (−1 when gone). */
  map: Int32Array;
  /** The moves from the start (when recorded). */
  moves?: MoveRecord[];
}

const compose = (map: Int32Array, step: Int32Array): Int32Array => map.map((x) => (x < 0 ? -1 : step[x]!));

/** One move that lowers the number of tetrahedra without touching a frozen one, or undefined. */
function reducingMove(cur: Tracked, frozen: ReadonlySet<number>, cusps: number, record: boolean): (Tracked & { rec?: MoveRecord }) | undefined {
  const { tri } = cur;
  const cb = combinatorics(tri);
  const val = new Int32Array(cb.nEdges);
  const at = new Int32Array(cb.nEdges).fill(-1);
  for (let i = 0; i < 6 * tri.n; i++) {
    const e = cb.edgeOf[i]!;
    val[e]!++;
    at[e] = i;
  }
  const cold = (ts: Iterable<number>): boolean => {
    for (const t of ts) if (frozen.has(t)) return false;
    return true;
  };
  // when recording, a 2–0 move that a carry cannot go back through is taken only when no other
  // move lowers the count (it is remembered on the first pass and made after it)
  let lastResort: (Tracked & { rec?: MoveRecord }) | undefined;
  for (let e = 0; e < cb.nEdges; e++) {
    if (val[e] === 2) {
      const occ: number[] = [];
      for (let i = 0; i < 6 * tri.n; i++) if (cb.edgeOf[i] === e) occ.push(Math.floor(i / 6));
      if (!cold(occ)) continue;
      const r = twoZero(tri, cb.edgeOf, e);
      if (!r || !isCuspedTriangulation(r.tri, cusps)) continue;
      const rec = record ? twoZeroRecord(tri, cb.edgeOf, e, r.tri, r.map) : undefined;
      if (record && !rec) continue;
      if (rec && rec.kind === 'twoZero' && !rec.invertible) {
        lastResort ??= { tri: r.tri, map: compose(cur.map, r.map), rec };
        continue;
      }
      return { tri: r.tri, map: compose(cur.map, r.map), rec };
    } else if (val[e] === 3) {
      const t = Math.floor(at[e]! / 6);
      const [a, b] = EDGE_VERTS[at[e]! % 6]!;
      const ts = [t, tri.nbr[4 * t + [0, 1, 2, 3].find((x) => x !== a && x !== b)!]!, tri.nbr[4 * t + [0, 1, 2, 3].reverse().find((x) => x !== a && x !== b)!]!];
      if (!cold(ts)) continue;
      const r = threeTwoMove(tri, t, a, b);
      if (r && isCuspedTriangulation(r.tri, cusps)) return { tri: r.tri, map: compose(cur.map, r.map), rec: { kind: 'ball', ball: r.ball, map: r.map, after: r.tri } };
    }
  }
  return lastResort;
}

/** The smallest triangulation reached by reducing moves and up to `kicks` random 2–3 moves between them. */
export function simplifyTriangulation(start: Tracked, frozenOriginal: readonly number[], cusps: number, rng: Rng, kicks: number, record = false): Tracked {
  const frozenNow = (m: Int32Array): Set<number> => new Set(frozenOriginal.map((o) => m[o]!).filter((x) => x >= 0));
  const moves: MoveRecord[] = [];
  let cur: Tracked = { tri: start.tri, map: start.map };
  let best = cur;
  let bestMoves = 0;
  for (let k = 0; k <= kicks; k++) {
    for (;;) {
      const r = reducingMove(cur, frozenNow(cur.map), cusps, record);
      if (!r) break;
      if (r.rec) moves.push({ ...r.rec, track: r.map });
      cur = { tri: r.tri, map: r.map };
    }
    if (cur.tri.n < best.tri.n) {
      best = cur;
      bestMoves = moves.length;
    }
    if (k === kicks) break;
    // a random 2–3 move away from the frozen tetrahedra, then reduce again
    const frozen = frozenNow(cur.map);
    for (let tries = 0; tries < 20; tries++) {
      const t = rng.int(cur.tri.n);
      const f = rng.int(4);
      if (frozen.has(t) || frozen.has(cur.tri.nbr[4 * t + f]!)) continue;
      const r = twoThreeMove(cur.tri, t, f);
      if (r && isCuspedTriangulation(r.tri, cusps)) {
        const track = compose(cur.map, r.map);
        moves.push({ kind: 'ball', ball: r.ball, map: r.map, after: r.tri, track });
        cur = { tri: r.tri, map: track };
        break;
      }
    }
  }
  return record ? { ...best, moves: moves.slice(0, bestMoves) } : best;
}
