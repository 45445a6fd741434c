/**
 * The 2–3 move (Pachner; Matveev, "Algorithmic topology and classification of 3-manifolds", 2003,
 * §1.2): two distinct tetrahedra t0 = (a0; x, y, z) and t1 = (a1; x, y, z) sharing the face xyz are
 * replaced by three tetrahedra around the new edge a0a1. New tetrahedron j keeps t0's vertex
 * numbering with the vertex z_j replaced by a1 (same orientation), so its face opposite z_j is t0's
 * old face and its face opposite a0 is t1's old face opposite z_j.
 */
import { EDGE_VERTS, type Triangulation } from './triangulation.ts';

type P4 = [number, number, number, number];

const compose = (a: readonly number[], b: readonly number[]): P4 => [a[b[0]!]!, a[b[1]!]!, a[b[2]!]!, a[b[3]!]!]; // a ∘ b
const inverse = (a: readonly number[]): P4 => {
  const r: P4 = [0, 0, 0, 0];
  for (let i = 0; i < 4; i++) r[a[i]!] = i;
  return r;
};
const swap = (i: number, j: number): P4 => {
  const r: P4 = [0, 1, 2, 3];
  r[i] = j;
  r[j] = i;
  return r;
};

/** The triangulation after a 2–3 move on face f0 of tetrahedron t0; undefined when not possible. */
export function twoThree(tri: Triangulation, t0: number, f0: number): Triangulation | undefined {
  const { n, nbr, perm } = tri;
  const t1 = nbr[4 * t0 + f0]!;
  if (t1 === t0) return undefined;
  const getPerm = (t: number, f: number): P4 => [perm[16 * t + 4 * f]!, perm[16 * t + 4 * f + 1]!, perm[16 * t + 4 * f + 2]!, perm[16 * t + 4 * f + 3]!];
  const sigma = getPerm(t0, f0);
  const zs = [0, 1, 2, 3].filter((x) => x !== f0);
  const m = n - 2 + 3;
  const idx = new Int32Array(n).fill(-1);
  let k = 0;
  for (let u = 0; u < n; u++) if (u !== t0 && u !== t1) idx[u] = k++;
  const N = (j: number): number => n - 2 + j;
  // the three tetrahedra may not share a face with one of t0, t1 twice in a bad way: any face of t0
  // other than f0 glued to t1 makes the move degenerate here
  for (const z of zs) if (nbr[4 * t0 + z] === t1) return undefined;
  const trans = (u: number, g: number): [number, number, P4] => {
    if (u === t0) {
      const j = zs.indexOf(g);
      return [N(j), g, [0, 1, 2, 3]];
    }
    if (u === t1) {
      const j = zs.findIndex((z) => sigma[z] === g);
      return [N(j), f0, inverse(compose(sigma, swap(f0, zs[j]!)))];
    }
    return [idx[u]!, g, [0, 1, 2, 3]];
  };
  const nn = new Int32Array(4 * m);
  const pp = new Uint8Array(16 * m);
  const put = (t: number, f: number, u: number, p: P4): void => {
    nn[4 * t + f] = u;
    for (let i = 0; i < 4; i++) pp[16 * t + 4 * f + i] = p[i]!;
  };
  for (let u = 0; u < n; u++) {
    if (u === t0 || u === t1) continue;
    for (let g = 0; g < 4; g++) {
      const w = nbr[4 * u + g]!;
      const rho = getPerm(u, g);
      if (w === t0 || w === t1) {
        const [W, , M] = trans(w, rho[g]!);
        put(idx[u]!, g, W, compose(M, rho));
      } else put(idx[u]!, g, idx[w]!, rho);
    }
  }
  for (let j = 0; j < 3; j++) {
    const zj = zs[j]!;
    // face zj: t0's old face
    {
      const w = nbr[4 * t0 + zj]!;
      const rho = getPerm(t0, zj);
      const [W, , M] = trans(w, rho[zj]!);
      put(N(j), zj, W, compose(M, rho));
    }
    // face f0: t1's old face opposite sigma(zj)
    {
      const toT1 = compose(sigma, swap(f0, zj));
      const g = sigma[zj]!;
      const w = nbr[4 * t1 + g]!;
      const rho = getPerm(t1, g);
      const [W, , M] = trans(w, rho[g]!);
      put(N(j), f0, W, compose(M, compose(rho, toT1)));
    }
    // faces opposite the other two face vertices: the other new tetrahedra
    for (let kk = 0; kk < 3; kk++) {
      if (kk === j) continue;
      const x = zs[kk]!;
      put(N(j), x, N(kk), swap(x, zj));
    }
  }
  return { n: m, nbr: nn, perm: pp };
}

/**
 * The pillow of an edge of valence 2: its two tetrahedra t0 = (a, b, c, d) with ab the edge, and t1
 * glued to t0 along the faces opposite c and d; alpha maps t0's vertices to t1's on the pillow's
 * outside (a, b, d by the gluing of the face opposite c, c by that of the face opposite d).
 */
export function pillow(tri: Triangulation, edgeOf: Int32Array, edge: number): { t0: number; t1: number; a: number; b: number; c: number; d: number; alpha: number[] } | undefined {
  const occ: Array<[number, number]> = [];
  for (let t = 0; t < tri.n; t++) for (let k = 0; k < 6; k++) if (edgeOf[6 * t + k] === edge) occ.push([t, k]);
  if (occ.length !== 2 || occ[0]![0] === occ[1]![0]) return undefined;
  const [t0, k0] = occ[0]!;
  const t1 = occ[1]![0];
  const [a, b] = EDGE_VERTS[k0]!;
  const [c, d] = [0, 1, 2, 3].filter((x) => x !== a && x !== b) as [number, number];
  if (tri.nbr[4 * t0 + c] !== t1 || tri.nbr[4 * t0 + d] !== t1) return undefined;
  const phi = tri.perm.subarray(16 * t0 + 4 * c, 16 * t0 + 4 * c + 4);
  const psi = tri.perm.subarray(16 * t0 + 4 * d, 16 * t0 + 4 * d + 4);
  const alpha = [0, 0, 0, 0];
  alpha[a] = phi[a]!;
  alpha[b] = phi[b]!;
  alpha[d] = phi[d]!;
  alpha[c] = psi[c]!;
  if (new Set(alpha).size !== 4) return undefined;
  return { t0, t1, a, b, c, d, alpha };
}

/**
 * The 2–0 move (Matveev 2003, §1.2; inverse of the 0–2 "pillow" insertion): an edge ab of valence 2
 * in two distinct tetrahedra t0 = (a, b, c, d) and t1 bounds a pillow; both are removed and the
 * pillow's two sides are folded shut: the face of t0 opposite a is glued to the face of t1
 * opposite a (and likewise for b) through what used to be there. Returns the new triangulation and
 * the old → new index map; undefined when the edge is not such an edge or the fold closes on itself.
 */
export function twoZero(tri: Triangulation, edgeOf: Int32Array, edge: number): { tri: Triangulation; map: Int32Array } | undefined {
  const pl = pillow(tri, edgeOf, edge);
  if (!pl) return undefined;
  const { t0, t1, alpha } = pl;
  const beta = [0, 0, 0, 0];
  for (let i = 0; i < 4; i++) beta[alpha[i]!] = i;
  const idx = new Int32Array(tri.n).fill(-1);
  let m = 0;
  for (let u = 0; u < tri.n; u++) if (u !== t0 && u !== t1) idx[u] = m++;
  if (m === 0) return undefined;
  const nbr = new Int32Array(4 * m);
  const perm = new Uint8Array(16 * m);
  const p = [0, 0, 0, 0];
  for (let u = 0; u < tri.n; u++) {
    if (idx[u]! < 0) continue;
    for (let f = 0; f < 4; f++) {
      let w = tri.nbr[4 * u + f]!;
      for (let i = 0; i < 4; i++) p[i] = tri.perm[16 * u + 4 * f + i]!;
      let steps = 0;
      while (w === t0 || w === t1) {
        if (++steps > 4) return undefined;
        const jump = w === t0 ? alpha : beta;
        const g = p[f]!;
        // only the outer faces (opposite a or b, and their images) can be entered from outside
        for (let i = 0; i < 4; i++) p[i] = jump[p[i]!]!;
        const other = w === t0 ? t1 : t0;
        const g2 = p[f]!;
        void g;
        const base = 16 * other + 4 * g2;
        for (let i = 0; i < 4; i++) p[i] = tri.perm[base + p[i]!]!;
        w = tri.nbr[4 * other + g2]!;
      }
      nbr[4 * idx[u]! + f] = idx[w]!;
      for (let i = 0; i < 4; i++) perm[16 * idx[u]! + 4 * f + i] = p[i]!;
    }
  }
  return { tri: { n: m, nbr, perm }, map: idx };
}
