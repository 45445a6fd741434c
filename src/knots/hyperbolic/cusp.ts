/**
 * Cusp triangulations: the link of every ideal vertex is a torus triangulated by the corners of the
 * tetrahedra (cusp triangle (t, v) = the corner of tetrahedron t at vertex v; its sides are the
 * faces f ≠ v). Curves on a cusp are closed sequences of cusp triangles, each entered and left
 * through different sides; such a normal curve cuts off one corner per triangle.
 *
 * Orientation: the corners of the cusp triangle at v are read counter-clockwise in the order
 * (w1, w2, w3) for which (v, w1, w2, w3) is an even permutation of (0, 1, 2, 3); the shapes at its
 * corners are then z, z′, z″ in that order, and a triangle with corners 0, 1, z is positively
 * oriented when Im z > 0.
 */
import { EDGE_SHAPE, edgeIndex, endIndex, type Combinatorics, type Triangulation } from './triangulation.ts';

/** One passage of a curve: tetrahedron t, vertex v, entered through face fin, left through fout. */
export interface Passage {
  t: number;
  v: number;
  fin: number;
  fout: number;
}

export function isEven(a: number, b: number, c: number, d: number): boolean {
  const p = [a, b, c, d];
  let inv = 0;
  for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) if (p[i]! > p[j]!) inv++;
  return inv % 2 === 0;
}

/**
 * The corner a passage cuts off, its shape type (0: z, 1: z′, 2: z″) and its sign in the
 * derivative of the holonomy: +1 when the corner lies on the curve's left.
 */
export function cutCorner(p: Passage): { w: number; shape: number; sign: number } {
  const w = 6 - p.v - p.fin - p.fout;
  // entering through side fin (corners fout, w), leaving through fout (corners fin, w): w is on the
  // left when (w, fout, fin) is counter-clockwise
  const sign = isEven(p.v, w, p.fout, p.fin) ? 1 : -1;
  return { w, shape: EDGE_SHAPE[edgeIndex(p.v, w)]!, sign };
}

/** Follow a cusp triangle through face f: the neighbouring triangle and the face it is entered by. */
export function across(tri: Triangulation, t: number, v: number, f: number): { t: number; v: number; fin: number } {
  const base = 16 * t + 4 * f;
  return { t: tri.nbr[4 * t + f]!, v: tri.perm[base + v]!, fin: tri.perm[base + f]! };
}

/**
 * Two closed curves generating the homology of each cusp torus, by the tree–cotree decomposition
 * (D. Eppstein, "Dynamic generators of topologically embedded graphs", SODA 2003): a spanning tree
 * of the triangles, a spanning tree of the remaining sides on the cusp's vertices, and one loop
 * through each of the two sides left over. Each loop visits a triangle at most once, so it is
 * simple.
 */
export function cuspBases(tri: Triangulation, cb: Combinatorics): Passage[][][] {
  const n = tri.n;
  const out: Passage[][][] = [];
  for (let cusp = 0; cusp < cb.nVertices; cusp++) {
    const tris: number[] = [];
    for (let k = 0; k < 4 * n; k++) if (cb.vertexOf[k] === cusp) tris.push(k);
    // BFS over triangles k = 4t + v
    const parent = new Map<number, { from: number; fout: number; fin: number }>();
    const root = tris[0]!;
    parent.set(root, { from: -1, fout: -1, fin: -1 });
    const queue = [root];
    const treeSide = new Set<string>();
    const sideKey = (k: number, f: number): string => {
      const t = k >> 2;
      const v = k & 3;
      const o = across(tri, t, v, f);
      const k2 = 4 * o.t + o.v;
      return k < k2 || (k === k2 && f < o.fin) ? `${k}:${f}` : `${k2}:${o.fin}`;
    };
    while (queue.length) {
      const k = queue.shift()!;
      const t = k >> 2;
      const v = k & 3;
      for (let f = 0; f < 4; f++) {
        if (f === v) continue;
        const o = across(tri, t, v, f);
        const k2 = 4 * o.t + o.v;
        if (parent.has(k2)) continue;
        parent.set(k2, { from: k, fout: f, fin: o.fin });
        treeSide.add(sideKey(k, f));
        queue.push(k2);
      }
    }
    // cotree: sides not in the triangle tree, joining vertex ends; spanning forest by union–find
    const up = new Map<number, number>();
    const find = (x: number): number => {
      let r = x;
      while (up.has(r) && up.get(r) !== r) r = up.get(r)!;
      return r;
    };
    const leftover: Array<[number, number]> = [];
    const seen = new Set<string>();
    for (const k of tris) {
      const t = k >> 2;
      const v = k & 3;
      for (let f = 0; f < 4; f++) {
        if (f === v) continue;
        const key = sideKey(k, f);
        if (treeSide.has(key) || seen.has(key)) continue;
        seen.add(key);
        const [a, b] = [0, 1, 2, 3].filter((x) => x !== v && x !== f);
        const ea = cb.endOf[endIndex(t, v, a!)]!;
        const eb = cb.endOf[endIndex(t, v, b!)]!;
        const ra = find(ea);
        const rb = find(eb);
        if (ra !== rb) up.set(ra, rb);
        else leftover.push([k, f]);
      }
    }
    // tree path root → k as triangle ids
    const pathFromRoot = (k: number): number[] => {
      const res: number[] = [];
      let cur = k;
      while (cur !== root) {
        res.push(cur);
        cur = parent.get(cur)!.from;
      }
      res.push(root);
      return res.reverse();
    };
    const loops: Passage[][] = [];
    for (const [k, f] of leftover) {
      const o = across(tri, k >> 2, k & 3, f);
      const k2 = 4 * o.t + o.v;
      const pa = pathFromRoot(k);
      const pb = pathFromRoot(k2);
      let c = 0;
      while (c + 1 < pa.length && c + 1 < pb.length && pa[c + 1] === pb[c + 1]) c++;
      // walk: branch = pb[c] → … → k2 → (side) → k → … → branch = pa[c]
      const steps: Array<{ k: number; fout: number }> = [];
      for (let q = c; q < pb.length - 1; q++) steps.push({ k: pb[q]!, fout: parent.get(pb[q + 1]!)!.fout });
      steps.push({ k: k2, fout: o.fin });
      for (let q = pa.length - 1; q > c; q--) steps.push({ k: pa[q]!, fout: parent.get(pa[q]!)!.fin });
      const L = steps.length;
      const seq: Passage[] = [];
      for (let q = 0; q < L; q++) {
        const prev = steps[(q - 1 + L) % L]!;
        const enter = across(tri, prev.k >> 2, prev.k & 3, prev.fout);
        const cur = steps[q]!;
        if (4 * enter.t + enter.v !== cur.k) throw new Error('internal: broken cusp loop');
        seq.push({ t: cur.k >> 2, v: cur.k & 3, fin: enter.fin, fout: cur.fout });
      }
      loops.push(seq);
    }
    out.push(loops);
  }
  return out;
}

