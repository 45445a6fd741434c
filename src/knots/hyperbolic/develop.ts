/**
 * The Euclidean structure of the cusps: cusp triangles laid out in ℂ from the shapes (corner w of
 * the cusp triangle at v has shape z, z′ or z″ of edge vw), so that closed curves give their
 * holonomy, a translation when the structure is complete.
 */
import { across, isEven, type Passage } from './cusp.ts';
import { EDGE_SHAPE, edgeIndex, type Combinatorics, type Triangulation } from './triangulation.ts';

export interface Shapes {
  re: Float64Array;
  im: Float64Array;
}

/** Shape of tetrahedron t at edge vw: z, z′ = 1/(1 − z) or z″ = 1 − 1/z. */
export function edgeShape(s: Shapes, t: number, v: number, w: number): [number, number] {
  const zr = s.re[t]!;
  const zi = s.im[t]!;
  const k = EDGE_SHAPE[edgeIndex(v, w)]!;
  if (k === 0) return [zr, zi];
  if (k === 1) {
    const dr = 1 - zr;
    const di = -zi;
    const d = dr * dr + di * di;
    return [dr / d, -di / d];
  }
  const d = zr * zr + zi * zi;
  return [1 - zr / d, zi / d];
}

/** Counter-clockwise successor of corner w in the cusp triangle at v. */
export function nextCorner(v: number, w: number): number {
  for (let u = 0; u < 4; u++) if (u !== v && u !== w && isEven(v, w, u, 6 - v - w - u)) return u;
  throw new Error('internal');
}

type Pos = Map<number, [number, number]>; // corner (tet vertex) → position

/** Positions of a triangle's third corner from two known ones. */
function complete(s: Shapes, t: number, v: number, pos: Pos): void {
  const known = [...pos.keys()];
  let a = known[0]!;
  let b = known[1]!;
  if (nextCorner(v, a) !== b) [a, b] = [b, a];
  const c = nextCorner(v, b);
  const [zr, zi] = edgeShape(s, t, v, a);
  const pa = pos.get(a)!;
  const pb = pos.get(b)!;
  const dr = pb[0] - pa[0];
  const di = pb[1] - pa[1];
  pos.set(c, [pa[0] + zr * dr - zi * di, pa[1] + zr * di + zi * dr]);
}

/** A placement of every cusp triangle of every cusp (breadth first from one triangle per cusp). */
export function developCusps(tri: Triangulation, cb: Combinatorics, s: Shapes): Map<number, Pos> {
  const placed = new Map<number, Pos>();
  for (let cusp = 0; cusp < cb.nVertices; cusp++) {
    let root = -1;
    for (let k = 0; k < 4 * tri.n && root < 0; k++) if (cb.vertexOf[k] === cusp) root = k;
    const v = root & 3;
    const ws = [0, 1, 2, 3].filter((x) => x !== v);
    const p0: Pos = new Map();
    p0.set(ws[0]!, [0, 0]);
    p0.set(nextCorner(v, ws[0]!), [1, 0]);
    complete(s, root >> 2, v, p0);
    placed.set(root, p0);
    const queue = [root];
    while (queue.length) {
      const k = queue.shift()!;
      const t = k >> 2;
      const vv = k & 3;
      const pos = placed.get(k)!;
      for (let f = 0; f < 4; f++) {
        if (f === vv) continue;
        const o = across(tri, t, vv, f);
        const k2 = 4 * o.t + o.v;
        if (placed.has(k2)) continue;
        const np: Pos = new Map();
        for (const w of [0, 1, 2, 3]) if (w !== vv && w !== f) np.set(tri.perm[16 * t + 4 * f + w]!, pos.get(w)!);
        complete(s, o.t, o.v, np);
        placed.set(k2, np);
        queue.push(k2);
      }
    }
  }
  return placed;
}

/**
 * Holonomy of a closed curve: develop it from its first triangle's placement and return the
 * translation that carries the start to the end (re, im) and the largest disagreement between the
 * three corners (0 for a translation, i.e. a complete cusp).
 */
export function curveTranslation(tri: Triangulation, s: Shapes, placed: Map<number, Pos>, curve: readonly Passage[]): { re: number; im: number; mismatch: number } {
  const first = curve[0]!;
  let pos: Pos = new Map(placed.get(4 * first.t + first.v)!);
  for (const p of curve) {
    const np: Pos = new Map();
    for (const w of [0, 1, 2, 3]) if (w !== p.v && w !== p.fout) np.set(tri.perm[16 * p.t + 4 * p.fout + w]!, pos.get(w)!);
    const o = across(tri, p.t, p.v, p.fout);
    complete(s, o.t, o.v, np);
    pos = np;
  }
  const start = placed.get(4 * first.t + first.v)!;
  let tr = 0;
  let ti = 0;
  let cnt = 0;
  const d: Array<[number, number]> = [];
  for (const [w, q] of pos) {
    const st = start.get(w)!;
    d.push([q[0] - st[0], q[1] - st[1]]);
    tr += q[0] - st[0];
    ti += q[1] - st[1];
    cnt++;
  }
  tr /= cnt;
  ti /= cnt;
  let mismatch = 0;
  for (const [a, b] of d) mismatch = Math.max(mismatch, Math.hypot(a - tr, b - ti));
  return { re: tr, im: ti, mismatch };
}
