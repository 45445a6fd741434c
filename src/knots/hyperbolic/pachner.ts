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
import { sub, mul, div, type C } from './cpair.ts';


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

/** The checked plan of a move: old tetrahedra with their labels, new label quadruples (oriented), boundary faces. */
interface BallPlan {
  olds: readonly number[];
  labels: readonly (readonly number[])[];
  news: number[][];
  /** Boundary face (bit mask of its three labels, < 32) → 4·j + f for old tetrahedron j and its face f, or −1. */
  ext: Int8Array;
}

/** Bit mask of the labels of the face opposite position F of a label quadruple (labels 0..4). */
const faceMask = (L: readonly number[], F: number): number => {
  let m = 0;
  for (let i = 0; i < 4; i++) if (i !== F) m |= 1 << L[i]!;
  return m;
};

/** Index of the new tetrahedron other than J that contains the face of mask `mask`, or −1. */
function sharedWith(news: readonly number[][], J: number, mask: number): number {
  for (let K = 0; K < news.length; K++) {
    if (K === J) continue;
    const S = news[K]!;
    const all = (1 << S[0]!) | (1 << S[1]!) | (1 << S[2]!) | (1 << S[3]!);
    if ((all & mask) === mask) return K;
  }
  return -1;
}

/**
 * Check that the tetrahedra `olds` (vertex i of olds[j] carries label labels[j][i], labels 0..4)
 * form a ball that the tetrahedra with the label quadruples `news` fill with the same boundary, and
 * orient each new tetrahedron like the old one it meets on the boundary (`news` is changed in
 * place). Undefined when they do not (a boundary face glued to the ball itself, inconsistent
 * labels). Costs O(1) in the size of the triangulation.
 */
function planBall(tri: Triangulation, olds: readonly number[], labels: readonly (readonly number[])[], news: number[][]): BallPlan | undefined {
  const { nbr, perm } = tri;
  const jOf = (u: number): number => olds.indexOf(u);
  for (let j = 0; j < olds.length; j++) if (jOf(olds[j]!) !== j) return undefined;
  const ext = new Int8Array(32).fill(-1);
  let nExt = 0;
  for (let j = 0; j < olds.length; j++) {
    const t = olds[j]!;
    const L = labels[j]!;
    if ((1 << L[0]!) + (1 << L[1]!) + (1 << L[2]!) + (1 << L[3]!) !== ((1 << L[0]!) | (1 << L[1]!) | (1 << L[2]!) | (1 << L[3]!))) return undefined;
    for (let f = 0; f < 4; f++) {
      const u = nbr[4 * t + f]!;
      const ju = jOf(u);
      if (ju >= 0) {
        const Lu = labels[ju]!;
        for (let i = 0; i < 4; i++) if (i !== f && Lu[perm[16 * t + 4 * f + i]!] !== L[i]) return undefined;
        continue;
      }
      const k = faceMask(L, f);
      if (ext[k] !== -1) return undefined;
      ext[k] = 4 * j + f;
      nExt++;
    }
  }
  // orient each new tetrahedron like the old one it meets on the boundary
  for (const T of news) {
    let faceF = -1;
    for (let F = 0; F < 4 && faceF < 0; F++) if (ext[faceMask(T, F)] !== -1) faceF = F;
    if (faceF < 0) return undefined;
    const e = ext[faceMask(T, faceF)]!;
    const L = labels[e >> 2]!;
    const p = T.map((l, i) => (i === faceF ? e & 3 : L.indexOf(l)));
    let inv = 0;
    for (let a = 0; a < 4; a++) for (let b = a + 1; b < 4; b++) if (p[a]! > p[b]!) inv++;
    if (inv % 2 === 1) [T[0], T[1]] = [T[1]!, T[0]!];
  }
  // every face of a new tetrahedron is shared with another new one or is a boundary face, used once
  let used = 0;
  let nUsed = 0;
  for (let J = 0; J < news.length; J++) {
    const T = news[J]!;
    for (let F = 0; F < 4; F++) {
      const k = faceMask(T, F);
      if (sharedWith(news, J, k) >= 0) continue;
      if (ext[k] === -1 || used & (1 << k)) return undefined;
      used |= 1 << k;
      nUsed++;
    }
  }
  if (nUsed !== nExt) return undefined;
  return { olds, labels, news, ext };
}

/** Carry out a checked plan: the new triangulation (O(n)) and the old → new index map. */
function buildBall(tri: Triangulation, plan: BallPlan): { tri: Triangulation; map: Int32Array } {
  const { n, nbr, perm } = tri;
  const { olds, labels, news, ext } = plan;
  const m = n - olds.length + news.length;
  const map = new Int32Array(n).fill(-1);
  const gone = new Uint8Array(n);
  for (const t of olds) gone[t] = 1;
  let c = 0;
  for (let u = 0; u < n; u++) if (!gone[u]) map[u] = c++;
  const base = c;
  const nn = new Int32Array(4 * m);
  const pp = new Uint8Array(16 * m);
  for (let u = 0; u < n; u++) {
    if (gone[u]) continue;
    const mu = map[u]!;
    for (let g = 0; g < 4; g++) {
      const w = nbr[4 * u + g]!;
      nn[4 * mu + g] = gone[w] ? -1 : map[w]!;
    }
    pp.set(perm.subarray(16 * u, 16 * u + 16), 16 * mu);
  }
  for (let J = 0; J < news.length; J++) {
    const T = news[J]!;
    const tJ = base + J;
    for (let F = 0; F < 4; F++) {
      const k = faceMask(T, F);
      const other = sharedWith(news, J, k);
      if (other >= 0) {
        const S = news[other]!;
        nn[4 * tJ + F] = base + other;
        for (let i = 0; i < 4; i++) pp[16 * tJ + 4 * F + i] = i === F ? S.findIndex((l) => !(k & (1 << l))) : S.indexOf(T[i]!);
        continue;
      }
      const e = ext[k]!;
      const j = e >> 2;
      const f = e & 3;
      const t = olds[j]!;
      const L = labels[j]!;
      const u = nbr[4 * t + f]!;
      const q = [0, 0, 0, 0];
      for (let i = 0; i < 4; i++) q[i] = perm[16 * t + 4 * f + (i === F ? f : L.indexOf(T[i]!))]!;
      nn[4 * tJ + F] = map[u]!;
      for (let i = 0; i < 4; i++) pp[16 * tJ + 4 * F + i] = q[i]!;
      const g = q[F]!;
      nn[4 * map[u]! + g] = tJ;
      for (let i = 0; i < 4; i++) pp[16 * map[u]! + 4 * g + q[i]!] = i;
    }
  }
  return { tri: { n: m, nbr: nn, perm: pp }, map };
}

/** Shapes of the new tetrahedra (label quadruples `news`) from the positions of the labels; undefined when one is degenerate. */
function newShapes(pos: readonly C[], news: readonly number[][]): { re: Float64Array; im: Float64Array } | undefined {
  const re = new Float64Array(news.length);
  const im = new Float64Array(news.length);
  for (let J = 0; J < news.length; J++) {
    const z = crossRatio01(news[J]!.map((l) => pos[l]!));
    if (!Number.isFinite(z[0]) || !Number.isFinite(z[1]) || Math.hypot(z[0], z[1]) < 1e-12 || Math.hypot(1 - z[0], z[1]) < 1e-12) return undefined;
    re[J] = z[0];
    im[J] = z[1];
  }
  return { re, im };
}

/** The old shapes moved to their new places and the new tetrahedra's shapes appended (they come last). */
function carry(tri: Triangulation, re: Float64Array, im: Float64Array, moved: { tri: Triangulation; map: Int32Array }, fresh: { re: Float64Array; im: Float64Array }): MovedShapes {
  const m = moved.tri.n;
  const nre = new Float64Array(m);
  const nim = new Float64Array(m);
  for (let u = 0; u < tri.n; u++)
    if (moved.map[u]! >= 0) {
      nre[moved.map[u]!] = re[u]!;
      nim[moved.map[u]!] = im[u]!;
    }
  nre.set(fresh.re, m - fresh.re.length);
  nim.set(fresh.im, m - fresh.im.length);
  return { tri: moved.tri, re: nre, im: nim, map: moved.map };
}

/** Positions of the four vertices (in order) of an ideal tetrahedron of shape z, in general position. */
export function placeTetrahedron(z: C): C[] {
  const p: Array<C | undefined> = [[0.3, -1.7], [0, 0], [1, 0], undefined];
  p[3] = placeVertex(p, z, 3);
  return p as C[];
}

/** Positions of the four vertices of tetrahedron t (labels L) from its shape, in general position. */
function seed(re: Float64Array, im: Float64Array, t: number, L: readonly number[]): C[] {
  const pos: C[] = [];
  const p = placeTetrahedron([re[t]!, im[t]!]);
  for (let i = 0; i < 4; i++) pos[L[i]!] = p[i]!;
  return pos;
}

/**
 * A move looked at before it is made: the tetrahedra it removes and the shapes of the ones it adds
 * (exactly those `apply` gives them), at O(1) cost; `apply` builds the new triangulation (O(n)).
 */
export interface MovePreview {
  olds: readonly number[];
  re: Float64Array;
  im: Float64Array;
  apply(): MovedShapes;
}

/** The plan of a 2–3 move on face f0 of t0: t0 (labels 0..3) and its neighbour (the far vertex labelled 4). */
function planTwoThree(tri: Triangulation, t0: number, f0: number): { plan: BallPlan; L1: number[] } | undefined {
  const t1 = tri.nbr[4 * t0 + f0]!;
  if (t1 === t0) return undefined;
  const L0 = [0, 1, 2, 3];
  const L1 = [-1, -1, -1, -1];
  for (let i = 0; i < 4; i++) L1[tri.perm[16 * t0 + 4 * f0 + i]!] = i === f0 ? 4 : i;
  const news = [0, 1, 2, 3].filter((z) => z !== f0).map((z) => L0.map((l) => (l === z ? 4 : l)));
  const plan = planBall(tri, [t0, t1], [L0, L1], news);
  return plan && { plan, L1 };
}

/** The plan of a 3–2 move on the edge (a, b) of t0 (labels 0, 1 on the edge, 2, 3 on t0's other vertices, 4 beyond). */
function planThreeTwo(tri: Triangulation, t0: number, a: number, b: number): { plan: BallPlan; L1: number[] } | undefined {
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
  const plan = planBall(tri, [t0, t1, t2], [L0, L1, L2], news);
  return plan && { plan, L1 };
}

/** Preview of a planned move with shapes: label positions from the first two old tetrahedra, new shapes as cross ratios. */
function preview(tri: Triangulation, re: Float64Array, im: Float64Array, planned: { plan: BallPlan; L1: number[] } | undefined): MovePreview | undefined {
  if (!planned) return undefined;
  const { plan, L1 } = planned;
  const [t0, t1] = plan.olds as [number, number];
  const pos = seed(re, im, t0, plan.labels[0]!);
  pos[4] = placeVertex(L1.map((l) => (l === 4 ? undefined : pos[l])), [re[t1]!, im[t1]!], L1.indexOf(4));
  const fresh = newShapes(pos, plan.news);
  if (!fresh) return undefined;
  return { olds: plan.olds, re: fresh.re, im: fresh.im, apply: () => carry(tri, re, im, buildBall(tri, plan), fresh) };
}

/**
 * A move as labels: old tetrahedron olds[j] has label labels[j][i] at vertex i; the new tetrahedra
 * (indices n − olds.length + J of the new triangulation) have labels news[J] — enough to carry
 * shapes either way (`carryback.ts`).
 */
export interface BallMove {
  olds: readonly number[];
  labels: readonly (readonly number[])[];
  news: readonly (readonly number[])[];
}

/** 2–3 move on face f0 of t0 (t0 and its neighbour there are replaced by three tetrahedra around a new edge), without shapes. */
export function twoThreeMove(tri: Triangulation, t0: number, f0: number): { tri: Triangulation; map: Int32Array; ball: BallMove } | undefined {
  const p = planTwoThree(tri, t0, f0);
  return p && { ...buildBall(tri, p.plan), ball: p.plan };
}

/** 3–2 move on the edge (a, b) of t0 when that edge has valence 3 in three distinct tetrahedra, without shapes. */
export function threeTwoMove(tri: Triangulation, t0: number, a: number, b: number): { tri: Triangulation; map: Int32Array; ball: BallMove } | undefined {
  const p = planThreeTwo(tri, t0, a, b);
  return p && { ...buildBall(tri, p.plan), ball: p.plan };
}

/** Preview of the 2–3 move on face f0 of t0 with its shapes carried. */
export function twoThreePreview(tri: Triangulation, re: Float64Array, im: Float64Array, t0: number, f0: number): MovePreview | undefined {
  return preview(tri, re, im, planTwoThree(tri, t0, f0));
}

/** Preview of the 3–2 move on the edge (a, b) of t0 with its shapes carried. */
export function threeTwoPreview(tri: Triangulation, re: Float64Array, im: Float64Array, t0: number, a: number, b: number): MovePreview | undefined {
  return preview(tri, re, im, planThreeTwo(tri, t0, a, b));
}

/** 2–3 move on face f0 of t0 (shapes carried when given) (t0 and its neighbour there are replaced by three tetrahedra around a new edge). */
export function twoThreeShapes(tri: Triangulation, re: Float64Array | undefined, im: Float64Array | undefined, t0: number, f0: number): MovedShapes | undefined {
  if (!re || !im) {
    const moved = twoThreeMove(tri, t0, f0);
    return moved && { ...moved, re: new Float64Array(0), im: new Float64Array(0) };
  }
  return twoThreePreview(tri, re, im, t0, f0)?.apply();
}

/** 3–2 move on the edge (a, b) of t0 when that edge has valence 3 in three distinct tetrahedra. */
export function threeTwoShapes(tri: Triangulation, re: Float64Array | undefined, im: Float64Array | undefined, t0: number, a: number, b: number): MovedShapes | undefined {
  if (!re || !im) {
    const moved = threeTwoMove(tri, t0, a, b);
    return moved && { ...moved, re: new Float64Array(0), im: new Float64Array(0) };
  }
  return threeTwoPreview(tri, re, im, t0, a, b)?.apply();
}
