/**
 * From a solution with negatively oriented tetrahedra to a geometric one: 2–3 moves on the faces and
 * 3–2 moves on the valence-3 edges of the negative tetrahedra, with the shapes carried through each
 * move (`pachner.ts`), so no equation is solved again until the end. Each step takes the move that
 * leaves the fewest negative tetrahedra (ties: the larger smallest Im z, then fewer tetrahedra,
 * then at random); a step that does not improve is still taken (a random walk on the plateau) until
 * the budget is spent. The representation never changes, so Σ D(z) is the same on every
 * triangulation visited; a triangulation where every Im z > 0 carries the complete hyperbolic
 * structure (Thurston 1979, §4), and the volume is that of the complement.
 */
import { isCuspedTriangulation } from './octahedral.ts';
import { threeTwoShapes, twoThreeShapes, type MovedShapes } from './pachner.ts';
import { EDGE_VERTS, type Triangulation } from './triangulation.ts';
import type { Rng } from '../../util/rng.ts';

export interface FlipResult {
  tri: Triangulation;
  re: Float64Array;
  im: Float64Array;
  /** Index in `tri` of each original tetrahedron (−1 when gone). */
  map: Int32Array;
  moves: number;
}

const negatives = (im: Float64Array, minIm: number): number => {
  let k = 0;
  for (const x of im) if (x < minIm) k++;
  return k;
};
const smallest = (im: Float64Array): number => {
  let m = Infinity;
  for (const x of im) m = Math.min(m, x);
  return m;
};

/** An order-free hash of the rounded shapes: equal for a triangulation and the same one reached again. */
function signature(m: { re: Float64Array; im: Float64Array }): number {
  let h = 0;
  for (let t = 0; t < m.re.length; t++) {
    const a = Math.round(m.re[t]! * 1e7);
    const b = Math.round(m.im[t]! * 1e7);
    // a multiplicative mix of the two integers, summed so that the order does not matter
    h += (Math.imul(a ^ 0x5bd1e995, 0x27d4eb2d) ^ Math.imul(b ^ 0x165667b1, 0x85ebca6b)) >>> 0;
  }
  return h;
}

/**
 * Moves around the negative tetrahedra, at most `budget` of them, never touching the tetrahedra
 * that the original ones listed in `frozen` have become; undefined when none reaches all Im z > minIm.
 */
export function flipToGeometric(
  start: { tri: Triangulation; re: Float64Array; im: Float64Array; map: Int32Array },
  frozen: readonly number[],
  cusps: number,
  rng: Rng,
  budget: number,
  minIm: number,
  maxTets: number,
): FlipResult | undefined {
  let cur: MovedShapes = start;
  let track = start.map;
  let score = negatives(start.im, minIm);
  // triangulations already visited, by their multiset of shapes (the walk must not undo itself)
  const seen = new Set<number>([signature(start)]);
  for (let step = 0; step < budget; step++) {
    if (score === 0) return { tri: cur.tri, re: cur.re, im: cur.im, map: track, moves: step };
    const cold = new Set(frozen.map((o) => track[o]!));
    const neg: number[] = [];
    for (let t = 0; t < cur.tri.n; t++) if (cur.im[t]! < minIm) neg.push(t);
    const touches = (ts: number[]): boolean => ts.some((t) => cold.has(t));
    // candidates ranked by their key; the (rarely failing) triangulation check is made on the chosen one
    const ranked: Array<{ m: MovedShapes; key: [number, number, number, number] }> = [];
    const consider = (m: MovedShapes | undefined): void => {
      if (!m || m.tri.n > maxTets || seen.has(signature(m))) return;
      ranked.push({ m, key: [negatives(m.im, minIm), -smallest(m.im), m.tri.n, rng.next()] });
    };
    // the negative tetrahedra and their neighbours
    const near = new Set<number>();
    for (const t of neg) for (let f = -1; f < 4; f++) near.add(f < 0 ? t : cur.tri.nbr[4 * t + f]!);
    for (const t of near) {
      if (cold.has(t)) continue;
      for (let f = 0; f < 4; f++) if (!cold.has(cur.tri.nbr[4 * t + f]!)) consider(twoThreeShapes(cur.tri, cur.re, cur.im, t, f));
      for (const [a, b] of EDGE_VERTS) {
        const others = [0, 1, 2, 3].filter((x) => x !== a && x !== b).map((f) => cur.tri.nbr[4 * t + f]!);
        if (!touches(others)) consider(threeTwoShapes(cur.tri, cur.re, cur.im, t, a, b));
      }
    }
    ranked.sort((x, y) => x.key[0] - y.key[0] || x.key[1] - y.key[1] || x.key[2] - y.key[2] || x.key[3] - y.key[3]);
    let best: MovedShapes | undefined;
    let bestKey: [number, number, number, number] = [Infinity, 0, 0, 0];
    for (const r of ranked)
      if (isCuspedTriangulation(r.m.tri, cusps)) {
        best = r.m;
        bestKey = r.key;
        break;
      }
    if (!best) {
      // stuck: a 2–3 move on a random face of a random negative tetrahedron, if any is possible
      const t = neg[rng.int(neg.length)]!;
      const f = rng.int(4);
      if (cold.has(t) || cold.has(cur.tri.nbr[4 * t + f]!)) continue;
      const m = twoThreeShapes(cur.tri, cur.re, cur.im, t, f);
      if (!m || m.tri.n > maxTets || !isCuspedTriangulation(m.tri, cusps)) continue;
      best = m;
      bestKey = [negatives(m.im, minIm), 0, 0, 0];
    }
    // take improving or level moves; a worse one only now and then, to leave a dead end
    if (bestKey[0] > score && rng.next() < 0.7) continue;
    cur = best;
    seen.add(signature(best));
    track = track.map((x) => (x < 0 ? -1 : best!.map[x]!));
    score = bestKey[0];
  }
  return score === 0 ? { tri: cur.tri, re: cur.re, im: cur.im, map: track, moves: budget } : undefined;
}
