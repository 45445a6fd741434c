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
import { threeTwoPreview, twoThreePreview, twoThreeShapes, type MovedShapes, type MovePreview } from './pachner.ts';
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

/** One tetrahedron's term of `signature`. */
function shapeHash(re: number, im: number): number {
  const a = Math.round(re * 1e7);
  const b = Math.round(im * 1e7);
  // a multiplicative mix of the two integers, summed so that the order does not matter
  return (Math.imul(a ^ 0x5bd1e995, 0x27d4eb2d) ^ Math.imul(b ^ 0x165667b1, 0x85ebca6b)) >>> 0;
}

/** An order-free hash of the rounded shapes: equal for a triangulation and the same one reached again (an exact integer sum). */
function signature(m: { re: Float64Array; im: Float64Array }): number {
  let h = 0;
  for (let t = 0; t < m.re.length; t++) h += shapeHash(m.re[t]!, m.im[t]!);
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
    // the four smallest Im z of the current shapes (a move removes at most three tetrahedra)
    const low: number[] = [];
    for (let t = 0; t < cur.tri.n; t++) {
      low.push(t);
      low.sort((x, y) => cur.im[x]! - cur.im[y]!);
      if (low.length > 4) low.pop();
    }
    const sig = signature(cur);
    // candidates ranked by their key, computed from the move's preview (the tetrahedra it removes
    // and the shapes it adds); the move is made, and checked, only for the chosen one
    const ranked: Array<{ m: MovePreview; key: [number, number, number, number] }> = [];
    const consider = (m: MovePreview | undefined): void => {
      if (!m) return;
      const size = cur.tri.n - m.olds.length + m.re.length;
      if (size > maxTets) return;
      let s2 = sig;
      let neg2 = score;
      for (const t of m.olds) {
        s2 -= shapeHash(cur.re[t]!, cur.im[t]!);
        if (cur.im[t]! < minIm) neg2--;
      }
      let min2 = Infinity;
      for (const t of low)
        if (!m.olds.includes(t)) {
          min2 = cur.im[t]!;
          break;
        }
      for (let J = 0; J < m.re.length; J++) {
        s2 += shapeHash(m.re[J]!, m.im[J]!);
        if (m.im[J]! < minIm) neg2++;
        min2 = Math.min(min2, m.im[J]!);
      }
      if (seen.has(s2)) return;
      ranked.push({ m, key: [neg2, -min2, size, rng.next()] });
    };
    // the negative tetrahedra and their neighbours
    const near = new Set<number>();
    for (const t of neg) for (let f = -1; f < 4; f++) near.add(f < 0 ? t : cur.tri.nbr[4 * t + f]!);
    for (const t of near) {
      if (cold.has(t)) continue;
      for (let f = 0; f < 4; f++) if (!cold.has(cur.tri.nbr[4 * t + f]!)) consider(twoThreePreview(cur.tri, cur.re, cur.im, t, f));
      for (const [a, b] of EDGE_VERTS) {
        const others = [0, 1, 2, 3].filter((x) => x !== a && x !== b).map((f) => cur.tri.nbr[4 * t + f]!);
        if (!touches(others)) consider(threeTwoPreview(cur.tri, cur.re, cur.im, t, a, b));
      }
    }
    ranked.sort((x, y) => x.key[0] - y.key[0] || x.key[1] - y.key[1] || x.key[2] - y.key[2] || x.key[3] - y.key[3]);
    let best: MovedShapes | undefined;
    let bestKey: [number, number, number, number] = [Infinity, 0, 0, 0];
    for (const r of ranked) {
      const m = r.m.apply();
      if (isCuspedTriangulation(m.tri, cusps)) {
        best = m;
        bestKey = r.key;
        break;
      }
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
