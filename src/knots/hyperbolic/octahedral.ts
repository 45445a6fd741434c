/**
 * An ideal triangulation of a link complement from a diagram.
 *
 * Step 1 — D. Thurston's octahedral decomposition ("Hyperbolic volume and the Jones polynomial",
 * Grenoble summer school notes, 1999; also Kim, Kim & Yoon, "Octahedral developing of knot
 * complement I", 2018): S³ minus the link and two points P₊ (above the projection plane) and P₋
 * (below) is a union of one ideal octahedron per crossing. The octahedron's axis is the crossing
 * arc, from its top vertex T on the over-strand to its bottom vertex B on the under-strand; its four
 * equatorial vertices sit in the directions of the four half-edges and are pulled up to P₊ (the two
 * under-strand directions, PD slots 0 and 2) or down to P₋ (the over-strand slots 1 and 3); the
 * equatorial edge between slots s and s+1 runs from P₊ to P₋ through the region at that corner.
 * Each octahedron is cut along its axis into four tetrahedra (T, B, eq(s), eq(s+1)), s = 0..3.
 * Faces (point of the link, P₊, P₋) in one region are glued along each edge of the diagram to the
 * face at the other end of that edge, matching P₊ to P₊ and P₋ to P₋.
 *
 * Step 2 — P₊ and P₋ are not cusps. Pulling one arc of the link seen from above up through P₊, and
 * one arc seen from below down through P₋, makes them points of the link: the edge from P₊ to that
 * arc (and from P₋ to the other) collapses, and the tetrahedra that contain a collapsing edge
 * flatten. A tetrahedron with one collapsing edge uv is removed and its faces opposite u and v are
 * glued to each other; one with two opposite collapsing edges disappears. (This is the "collapse"
 * of the octahedral decomposition; Kim–Kim–Yoon §2.) Pairs of arcs are tried until the result is
 * an ideal triangulation whose cusps are tori, one per component, with as many edges as tetrahedra.
 */
import type { PDInfo } from '../pd.ts';
import { combinatorics, checkGluings, isOriented, edgeIndex, EDGE_VERTS, type Triangulation } from './triangulation.ts';

/** Role of a tetrahedron vertex before the collapse. */
export const enum Role {
  Link = 0,
  Plus = 1,
  Minus = 2,
}

export interface Octahedral {
  tri: Triangulation;
  /** Role of vertex 4t + v. */
  role: Uint8Array;
}

/** The 4n tetrahedra of the octahedral decomposition; tetrahedron 4c + s = (T, B, eq(s), eq(s+1)). */
export function octahedralDecomposition(info: PDInfo): Octahedral {
  const n = info.nCrossings;
  const N = 4 * n;
  const nbr = new Int32Array(4 * N).fill(-1);
  const perm = new Uint8Array(16 * N);
  const role = new Uint8Array(4 * N);
  const set = (t: number, f: number, u: number, p: readonly number[]): void => {
    nbr[4 * t + f] = u;
    for (let i = 0; i < 4; i++) perm[16 * t + 4 * f + i] = p[i]!;
  };
  const eqRole = (s: number): Role => ((s & 1) === 0 ? Role.Plus : Role.Minus);
  for (let c = 0; c < n; c++)
    for (let s = 0; s < 4; s++) {
      const t = 4 * c + s;
      role[4 * t] = Role.Link;
      role[4 * t + 1] = Role.Link;
      role[4 * t + 2] = eqRole(s);
      role[4 * t + 3] = eqRole(s + 1);
      // internal faces around the axis: face 3 = (T, B, eq(s)) ↔ face 2 of the previous tetrahedron
      const prev = 4 * c + ((s + 3) & 3);
      set(t, 3, prev, [0, 1, 3, 2]);
      set(prev, 2, t, [0, 1, 3, 2]);
    }
  // external faces: corner (c, s) has the T-face (face 1) and the B-face (face 0); the one beside
  // an over-strand slot (odd) is the T-face. Corner (c, s) beside slot s+1 ↔ corner (c', s') beside s'.
  for (let c = 0; c < n; c++)
    for (let s = 0; s < 4; s++) {
      const t = 4 * c + s;
      const slot = (s + 1) & 3;
      const far = info.other[4 * c + slot]!;
      const c2 = far >> 2;
      const s2 = far & 3;
      const t2 = 4 * c2 + s2;
      const f = (slot & 1) === 1 ? 1 : 0; // face of t: T-face beside an over slot
      const knot = 1 - f; // its link vertex (0 = T, 1 = B)
      const f2 = (s2 & 1) === 1 ? 1 : 0;
      const knot2 = 1 - f2;
      const p = [0, 0, 0, 0];
      p[knot] = knot2;
      p[f] = f2;
      // P₊ ↔ P₊, P₋ ↔ P₋
      for (const a of [2, 3]) for (const b of [2, 3]) if (role[4 * t + a] === role[4 * t2 + b]) p[a] = b;
      set(t, f, t2, p);
      const q = [0, 0, 0, 0];
      for (let i = 0; i < 4; i++) q[p[i]!] = i;
      set(t2, f2, t, q);
    }
  return { tri: { n: N, nbr, perm }, role };
}

/**
 * Collapse the edges of the given classes: tetrahedra with one such edge are flattened (their two
 * faces off the edge glued together), with two opposite ones removed. Undefined when some
 * tetrahedron has another pattern or a gluing cannot be followed through.
 */
export function collapseEdges(tri: Triangulation, edgeOf: Int32Array, collapse: ReadonlySet<number>): { tri: Triangulation; kept: Int32Array } | undefined {
  const n = tri.n;
  const kind = new Int8Array(n); // 0 keep, 1 flatten, 2 vanish
  const pairA = new Int8Array(n);
  const pairB = new Int8Array(n);
  for (let t = 0; t < n; t++) {
    const ks: number[] = [];
    for (let k = 0; k < 6; k++) if (collapse.has(edgeOf[6 * t + k]!)) ks.push(k);
    if (ks.length === 0) continue;
    if (ks.length === 1) {
      kind[t] = 1;
      pairA[t] = EDGE_VERTS[ks[0]!]![0];
      pairB[t] = EDGE_VERTS[ks[0]!]![1];
    } else if (ks.length === 2 && ks[0]! + ks[1]! === 5) kind[t] = 2;
    else return undefined;
  }
  const newIndex = new Int32Array(n).fill(-1);
  let m = 0;
  for (let t = 0; t < n; t++) if (kind[t] === 0) newIndex[t] = m++;
  if (m === 0) return undefined;
  const nbr = new Int32Array(4 * m);
  const perm = new Uint8Array(16 * m);
  const p = [0, 0, 0, 0];
  for (let t = 0; t < n; t++) {
    if (kind[t] !== 0) continue;
    for (let f = 0; f < 4; f++) {
      let u = tri.nbr[4 * t + f]!;
      for (let i = 0; i < 4; i++) p[i] = tri.perm[16 * t + 4 * f + i]!;
      let steps = 0;
      while (kind[u] !== 0) {
        if (kind[u] === 2 || ++steps > n) return undefined;
        const g = p[f]!;
        const a = pairA[u]!;
        const b = pairB[u]!;
        if (g !== a && g !== b) return undefined;
        // across the flattened tetrahedron: swap a and b, then leave by the other face
        for (let i = 0; i < 4; i++) p[i] = p[i] === a ? b : p[i] === b ? a : p[i]!;
        const g2 = p[f]!;
        const base = 16 * u + 4 * g2;
        for (let i = 0; i < 4; i++) p[i] = tri.perm[base + p[i]!]!;
        u = tri.nbr[4 * u + g2]!;
      }
      nbr[4 * newIndex[t]! + f] = newIndex[u]!;
      for (let i = 0; i < 4; i++) perm[16 * newIndex[t]! + 4 * f + i] = p[i]!;
    }
  }
  const kept = new Int32Array(m);
  for (let t = 0; t < n; t++) if (newIndex[t]! >= 0) kept[newIndex[t]!] = t;
  return { tri: { n: m, nbr, perm }, kept };
}

export interface LinkTriangulation {
  tri: Triangulation;
  /** Original tetrahedron 4c + s of each kept tetrahedron (vertex numbering unchanged). */
  kept: Int32Array;
  /** Kept index of original tetrahedron, or −1. */
  keptIndex: Int32Array;
  /** The collapsed edge classes (of the octahedral decomposition) that were used. */
  attempt: number;
}

/** Is this an ideal triangulation of a complement with `cusps` torus cusps? */
export function isCuspedTriangulation(tri: Triangulation, cusps: number): boolean {
  if (checkGluings(tri) !== undefined || !isOriented(tri)) return false;
  const cb = combinatorics(tri);
  return cb.nVertices === cusps && cb.nEdges === tri.n && cb.linkEuler.every((x) => x === 0);
}

/**
 * Ideal triangulations of the complement of the link of `info`, one per pair of arcs (seen from
 * above / below) that collapses cleanly; `skip` of them are passed over (another start).
 */
export function* linkTriangulations(info: PDInfo, cusps: number): Generator<LinkTriangulation> {
  const oct = octahedralDecomposition(info);
  const cb = combinatorics(oct.tri);
  const ends = (cls: number): [Role, Role] | undefined => {
    for (let t = 0; t < oct.tri.n; t++)
      for (let k = 0; k < 6; k++)
        if (cb.edgeOf[6 * t + k] === cls) {
          const [a, b] = EDGE_VERTS[k]!;
          return [oct.role[4 * t + a]! as Role, oct.role[4 * t + b]! as Role];
        }
    return undefined;
  };
  const plus: number[] = [];
  const minus: number[] = [];
  for (let e = 0; e < cb.nEdges; e++) {
    const r = ends(e);
    if (!r) continue;
    const hasLink = r[0] === Role.Link || r[1] === Role.Link;
    if (hasLink && (r[0] === Role.Plus || r[1] === Role.Plus)) plus.push(e);
    if (hasLink && (r[0] === Role.Minus || r[1] === Role.Minus)) minus.push(e);
  }
  let attempt = 0;
  for (const ep of plus)
    for (const em of minus) {
      const res = collapseEdges(oct.tri, cb.edgeOf, new Set([ep, em]));
      if (!res || !isCuspedTriangulation(res.tri, cusps)) continue;
      const keptIndex = new Int32Array(oct.tri.n).fill(-1);
      res.kept.forEach((t, i) => (keptIndex[t] = i));
      yield { tri: res.tri, kept: res.kept, keptIndex, attempt: attempt++ };
    }
}

export { edgeIndex };
