/**
 * 2–3 and 3–2 moves with their shapes carried along (Pachner moves; Matveev, "Algorithmic topology
 * and classification of 3-manifolds", 2003, §1.2). A move replaces a ball made of a few tetrahedra
 * (two sharing a face, or three around an edge of valence 3) by another triangulation of the same
 * ball with the same boundary. The ball's five ideal vertices are placed on ∂ℍ³ = ℂ from the old
 * shapes (a tetrahedron with vertices p0..p3 has shape z = [p0, p1; p2, p3] at edge 01, see
 * `crossRatio01`), and each new tetrahedron's shape is the cross ratio of its four vertices. The
 * new shapes then satisfy the gluing and completeness equations of the new triangulation exactly
 * when the old ones did (they describe the same developing map and holonomy), and Σ D(z) is kept
 * (the five-term relation of the Bloch–Wigner dilogarithm; Neumann & Zagier 1985).
 */
import type { Triangulation } from './triangulation.ts';
import { EDGE_SHAPE, edgeIndex } from './triangulation.ts';

type C = [number, number];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/** Shape at edge 01 of the ideal tetrahedron (p0, p1, p2, p3): (p3 − p1)(p2 − p0) / ((p2 − p1)(p3 − p0)); (∞, 0, 1, z) ↦ z. */
export function crossRatio01(p: readonly C[]): C {
  return div(mul(sub(p[3]!, p[1]!), sub(p[2]!, p[0]!)), mul(sub(p[2]!, p[1]!), sub(p[3]!, p[0]!)));
}

/** z, z′ = 1/(1 − z) or z″ = 1 − 1/z: the shape at an edge of the given type. */
function shapeOfType(z: C, k: number): C {
  if (k === 0) return z;
  if (k === 1) return div([1, 0], [1 - z[0], -z[1]]);
  return sub([1, 0], div([1, 0], z));
}

/** Even permutations sending position 3 to k (so the unknown vertex takes the place of p3). */
const EVEN_TO: ReadonlyArray<readonly number[]> = [
  [2, 1, 3, 0],
  [0, 2, 3, 1],
  [0, 3, 1, 2],
  [0, 1, 2, 3],
];

/** The vertex k of a tetrahedron with shape z, given the positions of its other three vertices. */
export function placeVertex(pos: ReadonlyArray<C | undefined>, z: C, k: number): C {
  const pi = EVEN_TO[k]!;
  const q = pi.map((i) => pos[i]);
  const w = shapeOfType(z, EDGE_SHAPE[edgeIndex(pi[0]!, pi[1]!)]!);
  const [q0, q1, q2] = [q[0]!, q[1]!, q[2]!];
  // (q3 − q1)(q2 − q0) = w (q2 − q1)(q3 − q0), solved for q3
  const num = sub(mul(q1, sub(q2, q0)), mul(w, mul(q0, sub(q2, q1))));
  const den = sub(sub(q2, q0), mul(w, sub(q2, q1)));
  return div(num, den);
}

export interface MovedShapes {
  tri: Triangulation;
  re: Float64Array;
  im: Float64Array;
  /** Old index → new index (−1 for the replaced tetrahedra). */
  map: Int32Array;
}

/**
 * Replace the tetrahedra `olds` (vertex i of olds[j] carries label labels[j][i]) by tetrahedra with
 * the given label quadruples, gluing each new face to the old boundary face with the same labels or
 * to the other new tetrahedron with those labels. Undefined when the old tetrahedra do not form a
 * ball with these labels (a boundary face glued to the ball itself, inconsistent labels).
 */
function replaceBall(tri: Triangulation, olds: readonly number[], labels: readonly (readonly number[])[], news: number[][]): { tri: Triangulation; map: Int32Array } | undefined {
  const { n, nbr, perm } = tri;
  const which = new Map<number, number>();
  olds.forEach((t, j) => which.set(t, j));
  if (which.size !== olds.length) return undefined;
  const key = (ls: number[]): string => ls.sort((a, b) => a - b).join(',');
  const ext = new Map<string, { j: number; f: number }>();
  for (let j = 0; j < olds.length; j++) {
    const t = olds[j]!;
    const L = labels[j]!;
    if (new Set(L).size !== 4) return undefined;
    for (let f = 0; f < 4; f++) {
      const u = nbr[4 * t + f]!;
      const face = [0, 1, 2, 3].filter((i) => i !== f);
      const ju = which.get(u);
      if (ju !== undefined) {
        const Lu = labels[ju]!;
        for (const i of face) if (Lu[perm[16 * t + 4 * f + i]!] !== L[i]) return undefined;
        continue;
      }
      const k = key(face.map((i) => L[i]!));
      if (ext.has(k)) return undefined;
      ext.set(k, { j, f });
    }
  }
  const m = n - olds.length + news.length;
  const map = new Int32Array(n).fill(-1);
  let c = 0;
  for (let u = 0; u < n; u++) if (!which.has(u)) map[u] = c++;
  const base = c;
  const nn = new Int32Array(4 * m);
  const pp = new Uint8Array(16 * m);
  for (let u = 0; u < n; u++) {
    if (which.has(u)) continue;
    for (let g = 0; g < 4; g++) {
      const w = nbr[4 * u + g]!;
      nn[4 * map[u]! + g] = which.has(w) ? -1 : map[w]!;
      for (let i = 0; i < 4; i++) pp[16 * map[u]! + 4 * g + i] = perm[16 * u + 4 * g + i]!;
    }
  }
  // orient each new tetrahedron like the old one it meets on the boundary
  for (const T of news) {
    const faceF = [0, 1, 2, 3].find((F) => ext.has(key(T.filter((_, i) => i !== F))));
    if (faceF === undefined) return undefined;
    const { j, f } = ext.get(key(T.filter((_, i) => i !== faceF)))!;
    const L = labels[j]!;
    const p = T.map((l, i) => (i === faceF ? f : L.indexOf(l)));
    let inv = 0;
    for (let a = 0; a < 4; a++) for (let b = a + 1; b < 4; b++) if (p[a]! > p[b]!) inv++;
    if (inv % 2 === 1) [T[0], T[1]] = [T[1]!, T[0]!];
  }
  const used = new Set<string>();
  for (let J = 0; J < news.length; J++) {
    const T = news[J]!;
    const tJ = base + J;
    for (let F = 0; F < 4; F++) {
      const fl = T.filter((_, i) => i !== F);
      const k = key([...fl]);
      const other = news.findIndex((S, K) => K !== J && fl.every((l) => S.includes(l)));
      if (other >= 0) {
        const S = news[other]!;
        nn[4 * tJ + F] = base + other;
        for (let i = 0; i < 4; i++) pp[16 * tJ + 4 * F + i] = i === F ? S.findIndex((l) => !fl.includes(l)) : S.indexOf(T[i]!);
        continue;
      }
      const e = ext.get(k);
      if (!e || used.has(k)) return undefined;
      used.add(k);
      const t = olds[e.j]!;
      const L = labels[e.j]!;
      const u = nbr[4 * t + e.f]!;
      const q = [0, 0, 0, 0];
      for (let i = 0; i < 4; i++) q[i] = perm[16 * t + 4 * e.f + (i === F ? e.f : L.indexOf(T[i]!))]!;
      nn[4 * tJ + F] = map[u]!;
      for (let i = 0; i < 4; i++) pp[16 * tJ + 4 * F + i] = q[i]!;
      const g = q[F]!;
      nn[4 * map[u]! + g] = tJ;
      for (let i = 0; i < 4; i++) pp[16 * map[u]! + 4 * g + q[i]!] = i;
    }
  }
  if (used.size !== ext.size) return undefined;
  return { tri: { n: m, nbr: nn, perm: pp }, map };
}

/** Shapes of the new tetrahedra from the positions of the labels; undefined when one is degenerate. */
function carry(tri: Triangulation, re: Float64Array, im: Float64Array, moved: { tri: Triangulation; map: Int32Array }, pos: readonly C[], news: readonly number[][]): MovedShapes | undefined {
  const m = moved.tri.n;
  const nre = new Float64Array(m);
  const nim = new Float64Array(m);
  for (let u = 0; u < tri.n; u++)
    if (moved.map[u]! >= 0) {
      nre[moved.map[u]!] = re[u]!;
      nim[moved.map[u]!] = im[u]!;
    }
  const base = m - news.length;
  for (let J = 0; J < news.length; J++) {
    const z = crossRatio01(news[J]!.map((l) => pos[l]!));
    if (!Number.isFinite(z[0]) || !Number.isFinite(z[1]) || Math.hypot(z[0], z[1]) < 1e-12 || Math.hypot(1 - z[0], z[1]) < 1e-12) return undefined;
    nre[base + J] = z[0];
    nim[base + J] = z[1];
  }
  return { tri: moved.tri, re: nre, im: nim, map: moved.map };
}

/** Positions of the four vertices of tetrahedron t (labels L) from its shape, in general position. */
function seed(re: Float64Array, im: Float64Array, t: number, L: readonly number[]): C[] {
  const pos: C[] = [];
  const p: Array<C | undefined> = [[0.3, -1.7], [0, 0], [1, 0], undefined];
  p[3] = placeVertex(p, [re[t]!, im[t]!], 3);
  for (let i = 0; i < 4; i++) pos[L[i]!] = p[i]!;
  return pos;
}

/** 2–3 move on face f0 of t0 (shapes carried when given) (t0 and its neighbour there are replaced by three tetrahedra around a new edge). */
export function twoThreeShapes(tri: Triangulation, re: Float64Array | undefined, im: Float64Array | undefined, t0: number, f0: number): MovedShapes | undefined {
  const t1 = tri.nbr[4 * t0 + f0]!;
  if (t1 === t0) return undefined;
  const L0 = [0, 1, 2, 3];
  const L1 = [-1, -1, -1, -1];
  for (let i = 0; i < 4; i++) L1[tri.perm[16 * t0 + 4 * f0 + i]!] = i === f0 ? 4 : i;
  const news = [0, 1, 2, 3].filter((z) => z !== f0).map((z) => L0.map((l) => (l === z ? 4 : l)));
  const moved = replaceBall(tri, [t0, t1], [L0, L1], news);
  if (!moved) return undefined;
  if (!re || !im) return { ...moved, re: new Float64Array(0), im: new Float64Array(0) };
  const pos = seed(re, im, t0, L0);
  const k = L1.indexOf(4);
  pos[4] = placeVertex(L1.map((l) => (l === 4 ? undefined : pos[l])), [re[t1]!, im[t1]!], k);
  return carry(tri, re, im, moved, pos, news);
}

/** 3–2 move on the edge (a, b) of t0 when that edge has valence 3 in three distinct tetrahedra. */
export function threeTwoShapes(tri: Triangulation, re: Float64Array | undefined, im: Float64Array | undefined, t0: number, a: number, b: number): MovedShapes | undefined {
  const [c, d] = [0, 1, 2, 3].filter((x) => x !== a && x !== b) as [number, number];
  const L0 = [0, 0, 0, 0];
  L0[a] = 0;
  L0[b] = 1;
  L0[c] = 2;
  L0[d] = 3;
  // across the face opposite d (labels 0, 1, 2) and the face opposite c (labels 0, 1, 3)
  const t1 = tri.nbr[4 * t0 + d]!;
  const t2 = tri.nbr[4 * t0 + c]!;
  if (t1 === t0 || t2 === t0 || t1 === t2) return undefined;
  const L1 = [4, 4, 4, 4];
  for (const i of [a, b, c]) L1[tri.perm[16 * t0 + 4 * d + i]!] = L0[i]!;
  const L2 = [4, 4, 4, 4];
  for (const i of [a, b, d]) L2[tri.perm[16 * t0 + 4 * c + i]!] = L0[i]!;
  if (new Set(L1).size !== 4 || new Set(L2).size !== 4) return undefined;
  // the edge has valence 3 exactly when t1 and t2 meet along the face (0, 1, 4)
  const f1 = L1.indexOf(2);
  if (tri.nbr[4 * t1 + f1] !== t2) return undefined;
  const news = [
    [2, 3, 4, 0],
    [2, 3, 4, 1],
  ];
  const moved = replaceBall(tri, [t0, t1, t2], [L0, L1, L2], news);
  if (!moved) return undefined;
  if (!re || !im) return { ...moved, re: new Float64Array(0), im: new Float64Array(0) };
  const pos = seed(re, im, t0, L0);
  pos[4] = placeVertex(L1.map((l) => (l === 4 ? undefined : pos[l])), [re[t1]!, im[t1]!], L1.indexOf(4));
  return carry(tri, re, im, moved, pos, news);
}
