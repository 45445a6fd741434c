/**
 * Ideal triangulations as face gluings: tetrahedron t, face f (the face opposite vertex f) is
 * glued to tetrahedron `nbr[4t + f]` by the vertex map `perm[16t + 4f + i]` (vertex i of t goes to
 * that vertex of the neighbour; vertex f goes to the neighbour's face). Every gluing of an oriented
 * triangulation is an odd permutation. Edges of a tetrahedron are numbered 0..5 as the pairs
 * 01, 02, 03, 12, 13, 23; opposite edges share a shape parameter (z on 01/23, z′ on 02/13,
 * z″ on 03/12; Thurston, "The geometry and topology of 3-manifolds", 1979, ch. 4).
 */
export interface Triangulation {
  n: number;
  nbr: Int32Array;
  perm: Uint8Array;
}

export const EDGE_VERTS: ReadonlyArray<readonly [number, number]> = [
  [0, 1],
  [0, 2],
  [0, 3],
  [1, 2],
  [1, 3],
  [2, 3],
];
/** Edge index of the pair {a, b}. */
export function edgeIndex(a: number, b: number): number {
  const lo = a < b ? a : b;
  const hi = a < b ? b : a;
  return lo === 0 ? hi - 1 : lo === 1 ? hi + 1 : 5;
}
/** Shape type of an edge: 0 for z (01, 23), 1 for z′ (02, 13), 2 for z″ (03, 12). */
export const EDGE_SHAPE = [0, 1, 2, 2, 1, 0] as const;

class UnionFind {
  p: Int32Array;
  constructor(n: number) {
    this.p = new Int32Array(n);
    for (let i = 0; i < n; i++) this.p[i] = i;
  }
  find(x: number): number {
    while (this.p[x] !== x) {
      this.p[x] = this.p[this.p[x]!]!;
      x = this.p[x]!;
    }
    return x;
  }
  union(a: number, b: number): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) this.p[ra] = rb;
  }
}

/** Dense class numbers from a union–find. */
function classes(uf: UnionFind, m: number): { of: Int32Array; count: number } {
  const of = new Int32Array(m);
  const id = new Map<number, number>();
  for (let i = 0; i < m; i++) {
    const r = uf.find(i);
    let k = id.get(r);
    if (k === undefined) {
      k = id.size;
      id.set(r, k);
    }
    of[i] = k;
  }
  return { of, count: id.size };
}

export interface Combinatorics {
  /** Edge class of tetrahedron edge 6t + k. */
  edgeOf: Int32Array;
  nEdges: number;
  /** Vertex class (cusp) of tetrahedron vertex 4t + v. */
  vertexOf: Int32Array;
  nVertices: number;
  /** Euler characteristic of each vertex link (0 for a torus cusp). */
  linkEuler: number[];
  /** Class of the end at vertex a of edge ab of tetrahedron t: `endOf[endIndex(t, a, b)]` (the vertices of the cusp triangulations). */
  endOf: Int32Array;
}

/** Index of the end at vertex a of edge ab of tetrahedron t. */
export function endIndex(t: number, a: number, b: number): number {
  return 12 * t + 3 * a + (b < a ? b : b - 1);
}

/** Edge and vertex classes and the Euler characteristic of every vertex link. */
export function combinatorics(tri: Triangulation): Combinatorics {
  const { n, nbr, perm } = tri;
  const ue = new UnionFind(6 * n);
  const uv = new UnionFind(4 * n);
  // edge ends: (t, a, b) = end at vertex a of edge ab → 12 per tetrahedron, index 12t + 3a + slot(b)
  const endIdx = endIndex;
  const uEnd = new UnionFind(12 * n);
  for (let t = 0; t < n; t++)
    for (let f = 0; f < 4; f++) {
      const u = nbr[4 * t + f]!;
      const base = 16 * t + 4 * f;
      for (let a = 0; a < 4; a++) {
        if (a === f) continue;
        uv.union(4 * t + a, 4 * u + perm[base + a]!);
        for (let b = 0; b < 4; b++) {
          if (b === f || b === a) continue;
          uEnd.union(endIdx(t, a, b), endIdx(u, perm[base + a]!, perm[base + b]!));
          if (a < b) ue.union(6 * t + edgeIndex(a, b), 6 * u + edgeIndex(perm[base + a]!, perm[base + b]!));
        }
      }
    }
  const e = classes(ue, 6 * n);
  const v = classes(uv, 4 * n);
  const ends = classes(uEnd, 12 * n);
  const nLinkVerts = new Array<number>(v.count).fill(0);
  const seenEnd = new Uint8Array(ends.count);
  const nLinkTris = new Array<number>(v.count).fill(0);
  for (let t = 0; t < n; t++)
    for (let a = 0; a < 4; a++) {
      const vc = v.of[4 * t + a]!;
      nLinkTris[vc]!++;
      for (let b = 0; b < 4; b++) {
        if (b === a) continue;
        const k = ends.of[endIdx(t, a, b)]!;
        if (!seenEnd[k]) {
          seenEnd[k] = 1;
          nLinkVerts[vc]!++;
        }
      }
    }
  const linkEuler = nLinkTris.map((F, i) => nLinkVerts[i]! - (3 * F) / 2 + F);
  return { edgeOf: e.of, nEdges: e.count, vertexOf: v.of, nVertices: v.count, linkEuler, endOf: ends.of };
}

/** True when every gluing is an odd permutation (the tetrahedra are coherently oriented). */
export function isOriented(tri: Triangulation): boolean {
  for (let k = 0; k < 4 * tri.n; k++) {
    const p = tri.perm.subarray(4 * k, 4 * k + 4);
    let inv = 0;
    for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) if (p[i]! > p[j]!) inv++;
    if (inv % 2 === 0) return false;
  }
  return true;
}

/** Check that gluings are mutual (face f of t ↔ face p[f] of its neighbour, inverse maps). */
export function checkGluings(tri: Triangulation): string | undefined {
  for (let t = 0; t < tri.n; t++)
    for (let f = 0; f < 4; f++) {
      const u = tri.nbr[4 * t + f]!;
      if (u < 0 || u >= tri.n) return `tetrahedron ${t} face ${f} is not glued`;
      const p = tri.perm.subarray(16 * t + 4 * f, 16 * t + 4 * f + 4);
      const g = p[f]!;
      if (tri.nbr[4 * u + g] !== t) return `gluing of tetrahedron ${t} face ${f} is not mutual`;
      const q = tri.perm.subarray(16 * u + 4 * g, 16 * u + 4 * g + 4);
      for (let i = 0; i < 4; i++) if (q[p[i]!] !== i) return `gluing maps of tetrahedron ${t} face ${f} are not inverse`;
      if (u === t && g === f) return `face ${f} of tetrahedron ${t} is glued to itself`;
    }
  return undefined;
}
