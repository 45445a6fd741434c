/**
 * The maximal cusp of a one-cusped hyperbolic 3-manifold from a geometric ideal triangulation: the
 * horoball pattern seen from the cusp at ∞, its largest horoball, and the cusp torus it bounds.
 *
 * Picture (upper half-space, Thurston 1979 ch. 4): the developed cusp (`develop.ts`) gives the
 * ideal vertices of the tetrahedra at ∞ as points of ℂ, with the horosphere at height 1 carrying
 * the developed flat metric; its lifts form one Γ-orbit of horoballs, the one at p ∈ ℂ of Euclidean
 * diameter D_p. Lowering the horosphere at ∞ to height h turns D_p into D_p/h (a horoball at p is
 * γ({height > h}) with diameter 1/(|c|²h) for γ = (a b; c d), γ(∞) = p), so the cusp is embedded
 * while h² ≥ D_p for every p and is maximal at h = √D_max: it then touches the largest horoball
 * (Adams et al., "Densities of hyperbolic cusp invariants", 2017, §1: maximal = tangent to itself).
 *
 * Diameters from the triangulation: for an edge from ∞ to p, D_p = e^{−δ}, δ the signed distance
 * between its two horoballs; by Penner's formula (R. C. Penner, "The decorated Teichmüller space of
 * punctured surfaces", Comm. Math. Phys. 113, 1987: in an ideal triangle the horocyclic arc at a
 * vertex is λ_opp/(λ·λ′), λ = e^{δ/2}), the arcs h_v, h_a cut by the horoballs at the two ends v,
 * a of an edge in one face satisfy h_v·h_a = e^{−δ}. These arcs are sides of the developed cusp
 * triangles, so D_p is read off the development; past the first ring, D_x = |x − a|²·e^{−δ(xa)}/D_a
 * (δ of the edge xa; the horoball distance ln(|x − a|²/(D_x D_a)) in upper half-space).
 *
 * Stopping rule (why the search is complete): let s be the highest point of the floor of the
 * tetrahedra at ∞ (the union of their faces opposite ∞). Then the horoball {height ≥ s} lies in
 * the star of ∞, so every lift of it lies in the star of its own centre: with the cusp at height
 * s, the horoball at p (diameter D_p/s) meets only tetrahedra with vertex p, in particular the one
 * holding its top point (p, D_p/s). Hence every p with D_p ≥ D_edge is a vertex of a tetrahedron that
 * meets {height ≥ D_edge/s}; those tetrahedra form a face-connected set (the region is a horoball,
 * convex), reached by a breadth-first walk through faces from the tetrahedra at ∞, modulo the
 * cusp's translations. D_edge is the largest diameter on the edges (a lower bound for D_max), so the
 * largest horoball is among the vertices visited. When D_edge ≥ s the walk stops at once: the edge
 * bound is the maximal cusp.
 */
import { cuspBases } from './cusp.ts';
import { curveTranslation, developCusps, edgeShape, nextCorner, type Shapes } from './develop.ts';
import { edgeIndex, type Combinatorics, type Triangulation } from './triangulation.ts';
import { sub, mul, div, abs, abs2, type C } from './cpair.ts';

export interface MaximalCusp {
  /** Volume of the maximal cusp = half the area of its boundary torus. */
  volume: number;
  /** Area of the boundary torus of the maximal cusp. */
  area: number;
  /** Length of the meridian and of the longitude on that torus (the translations' lengths). */
  meridianLength: number;
  longitudeLength: number;
  /** Shortest translation on the torus ("waist size", Adams 2002); ≥ 1 always. */
  shortest: number;
  /** True when the largest horoball sits at the end of an edge of the triangulation. */
  onEdge: boolean;
  /** Lifted tetrahedra (modulo the cusp's translations) visited by the search. */
  visited: number;
}

export interface MaximalCuspOptions {
  /** Lifted tetrahedra the search may visit before it gives up (no number is reported then). */
  maxTetrahedra: number;
  /** Search down to height H/deeper instead of H (1 = the stopping rule; larger values only check it). */
  deeper: number;
}
export const MAXIMAL_CUSP_DEFAULTS: MaximalCuspOptions = { maxTetrahedra: 20000, deeper: 1 };


/**
 * Highest point of the ideal triangle with vertices a, b, c ∈ ℂ (on the hemisphere through them):
 * the circumradius when the circumcentre lies in the triangle (no obtuse angle), else half the
 * longest side (the top of that side's semicircle).
 */
export function triangleTop(a: C, b: C, c: C): number {
  const ab = sub(b, a);
  const bc = sub(c, b);
  const ca = sub(a, c);
  const dot = (u: C, v: C): number => u[0] * v[0] + u[1] * v[1];
  const la = abs2(bc);
  const lb = abs2(ca);
  const lc = abs2(ab);
  if (-dot(ab, ca) < 0 || -dot(ab, bc) < 0 || -dot(bc, ca) < 0) return Math.sqrt(Math.max(la, lb, lc)) / 2;
  // R = abc / (4·area) (Euclid)
  const area2 = Math.abs(ab[0] * ca[1] - ab[1] * ca[0]);
  return Math.sqrt(la * lb * lc) / (2 * area2);
}

/** Gauss's reduction of a lattice basis: ω1 shortest, |Re(ω2/ω1)| ≤ 1/2 (Gauss 1801, art. 171). */
function gaussReduce(w1: C, w2: C): [C, C] {
  let a = w1;
  let b = w2;
  for (let guard = 0; guard < 200; guard++) {
    if (abs2(b) < abs2(a)) [a, b] = [b, a];
    const m = Math.round(div(b, a)[0]);
    if (m === 0) break;
    b = [b[0] - m * a[0], b[1] - m * a[1]];
  }
  return [a, b];
}

/** A point of the SL(2, ℤ) fundamental domain for τ (Im τ > 0) up to mirror: (|Re|, Im). */
function modularPoint(tau: C): C {
  let t: C = [tau[0], Math.abs(tau[1])];
  for (let guard = 0; guard < 200; guard++) {
    t = [t[0] - Math.round(t[0]), t[1]];
    if (abs2(t) >= 1 - 1e-14) break;
    t = div([-1, 0], t);
  }
  return [Math.abs(t[0]), t[1]];
}

interface Lifted {
  t: number;
  /** Positions of the four vertices (NaN for ∞) and the diameters of their horoballs. */
  p: C[];
  d: number[];
}

/**
 * The maximal cusp of a one-cusped manifold from a geometric solution (every Im z > 0) on `tri`;
 * `shape` is λ/μ (Im > 0) of the meridian μ and longitude λ, measured on any triangulation of the
 * same manifold. A string says why nothing was measured.
 */
export function maximalCusp(tri: Triangulation, cb: Combinatorics, s: Shapes, shape: C, opts: MaximalCuspOptions = MAXIMAL_CUSP_DEFAULTS): MaximalCusp | string {
  if (cb.nVertices !== 1) return 'the maximal cusp is measured for one cusp only';
  const n = tri.n;
  for (let t = 0; t < n; t++) if (!(s.im[t]! > 0)) return 'a tetrahedron is not positively oriented';
  const placed = developCusps(tri, cb, s);
  const basis = cuspBases(tri, cb)[0]!;
  if (basis.length !== 2) return 'the cusp does not have two basis curves';
  const ta = curveTranslation(tri, s, placed, basis[0]!);
  const tb = curveTranslation(tri, s, placed, basis[1]!);
  const [w1, w2] = gaussReduce([ta.re, ta.im], [tb.re, tb.im]);
  const latticeArea = Math.abs(w1[0] * w2[1] - w1[1] * w2[0]);
  const scale = Math.sqrt(latticeArea);
  if (!(latticeArea > 0) || Math.max(ta.mismatch, tb.mismatch) > 1e-8 * scale) return 'the cusp holonomy is not a lattice of translations';
  // same cusp as the one `shape` was measured on: equal lattice shapes up to SL(2, ℤ) and mirror
  const q1 = modularPoint(div(w2, w1));
  const q2 = modularPoint(shape);
  if (Math.hypot(q1[0] - q2[0], q1[1] - q2[1]) > 1e-7 * Math.max(1, q2[1])) return 'the cusp lattice of the geometric triangulation differs from the measured cusp shape';

  // the ring at ∞: cusp triangles (t, v); their areas tile the torus once (positively oriented)
  const pos = (t: number, v: number, w: number): C => placed.get(4 * t + v)!.get(w)!;
  let tiled = 0;
  let floorTop = 0;
  for (let t = 0; t < n; t++)
    for (let v = 0; v < 4; v++) {
      const [a, b, c] = [0, 1, 2, 3].filter((x) => x !== v).map((w) => pos(t, v, w)) as [C, C, C];
      const ab = sub(b, a);
      const ac = sub(c, a);
      tiled += Math.abs(ab[0] * ac[1] - ab[1] * ac[0]) / 2;
      floorTop = Math.max(floorTop, triangleTop(a, b, c));
    }
  if (Math.abs(tiled - latticeArea) > 1e-8 * latticeArea) return 'the cusp triangles do not tile the cusp torus once';
  // e^{−δ} of every edge class: h_v·h_a in the face (v, a, b) (Penner 1987)
  const edgeDiam = new Float64Array(cb.nEdges).fill(NaN);
  for (let t = 0; t < n; t++)
    for (let v = 0; v < 4; v++)
      for (let a = 0; a < 4; a++) {
        if (a === v) continue;
        const b = nextCorner(v, a);
        const D = abs(sub(pos(t, v, a), pos(t, v, b))) * abs(sub(pos(t, a, v), pos(t, a, b)));
        const e = cb.edgeOf[6 * t + edgeIndex(v, a)]!;
        const old = edgeDiam[e]!;
        if (Number.isNaN(old)) edgeDiam[e] = D;
        else if (Math.abs(old - D) > 1e-8 * old) return 'horoball diameters along an edge disagree (the cusp is not complete)';
      }
  let dStar = 0;
  for (const D of edgeDiam) dStar = Math.max(dStar, D);
  const H = ((dStar / floorTop) * (1 - 1e-9)) / opts.deeper;

  // breadth-first walk through faces over the lifted tetrahedra that reach the height H
  const inv = 1 / (w1[0] * w2[1] - w1[1] * w2[0]);
  const coords = (p: C): C => [(p[0] * w2[1] - p[1] * w2[0]) * inv, (w1[0] * p[1] - w1[1] * p[0]) * inv];
  const seen = new Set<string>();
  const queue: Lifted[] = [];
  let dMax = dStar;
  const RES = 1e6;
  const key = (t: number, p: C[]): string => {
    const [x, y] = coords(p[0]!);
    const fx = Math.round((x - Math.floor(x)) * RES) % RES;
    const fy = Math.round((y - Math.floor(y)) * RES) % RES;
    const d = sub(p[1]!, p[0]!);
    return `${t}:${fx}:${fy}:${Math.round((d[0] / scale) * RES)}:${Math.round((d[1] / scale) * RES)}`;
  };
  const INF: C = [NaN, NaN];
  for (let t = 0; t < n; t++)
    for (let v = 0; v < 4; v++) {
      const p: C[] = [];
      const d: number[] = [];
      for (let w = 0; w < 4; w++) {
        p.push(w === v ? INF : pos(t, v, w));
        d.push(w === v ? NaN : edgeDiam[cb.edgeOf[6 * t + edgeIndex(v, w)]!]!);
      }
      queue.push({ t, p, d });
    }
  let visited = 0;
  for (let head = 0; head < queue.length; head++) {
    const cur = queue[head]!;
    visited++;
    if (visited > opts.maxTetrahedra) return `the horoball search passed ${opts.maxTetrahedra} tetrahedra`;
    const infAt = cur.p.findIndex((q) => Number.isNaN(q[0]));
    for (let f = 0; f < 4; f++) {
      if (infAt >= 0 && f !== infAt) continue; // faces through ∞ lead to other tetrahedra at ∞
      const u = tri.nbr[4 * cur.t + f]!;
      const base = 16 * cur.t + 4 * f;
      const p: C[] = [INF, INF, INF, INF];
      const d = [NaN, NaN, NaN, NaN];
      for (let w = 0; w < 4; w++) {
        if (w === f) continue;
        p[tri.perm[base + w]!] = cur.p[w]!;
        d[tri.perm[base + w]!] = cur.d[w]!;
      }
      const x = tri.perm[base + f]!;
      // the fourth vertex from the shape: z_xa = [(p_c − p_a)(p_b − p_x)] / [(p_b − p_a)(p_c − p_x)]
      // for (x, a, b, c) even (cross ratio; Thurston 1979, §4.1), solved for p_x
      const a = (x + 1) & 3;
      const b = nextCorner(x, a);
      const c = nextCorner(x, b);
      const z = edgeShape(s, u, x, a);
      const A = mul(z, sub(p[b]!, p[a]!));
      const B = sub(p[c]!, p[a]!);
      const BA = sub(B, A);
      if (abs(BA) <= 1e-9 * (abs(A) + abs(B))) continue; // p_x = ∞: a tetrahedron at ∞, already there
      const px = div(sub(mul(B, p[b]!), mul(A, p[c]!)), BA);
      p[x] = px;
      // its horoball through the edge xa: D_x = |p_x − p_a|² e^{−δ(xa)} / D_a
      let dx = NaN;
      for (const y of [a, b, c]) {
        const D = (abs2(sub(px, p[y]!)) * edgeDiam[cb.edgeOf[6 * u + edgeIndex(x, y)]!]!) / d[y]!;
        if (Number.isNaN(dx)) dx = D;
        else if (Math.abs(D - dx) > 1e-6 * dx) return 'horoball diameters disagree in the developed pattern (precision lost)';
      }
      d[x] = dx;
      dMax = Math.max(dMax, dx);
      let top = 0;
      for (let g = 0; g < 4; g++) {
        const [i, j, k] = [0, 1, 2, 3].filter((y) => y !== g) as [number, number, number];
        top = Math.max(top, triangleTop(p[i]!, p[j]!, p[k]!));
      }
      if (top < H) continue;
      const kk = key(u, p);
      if (seen.has(kk)) continue;
      seen.add(kk);
      // keep the copy whose first vertex lies in the fundamental parallelogram
      const [cx, cy] = coords(p[0]!);
      const sx = Math.floor(cx);
      const sy = Math.floor(cy);
      const shift: C = [sx * w1[0] + sy * w2[0], sx * w1[1] + sy * w2[1]];
      queue.push({ t: u, p: p.map((q) => sub(q, shift)), d });
    }
  }
  // maximal cusp at height h = √D_max: lengths divide by h, the torus area by D_max
  const area = latticeArea / dMax;
  const meridianLength = Math.sqrt(area / shape[1]);
  return {
    volume: area / 2,
    area,
    meridianLength,
    longitudeLength: abs(shape) * meridianLength,
    shortest: abs(w1) / Math.sqrt(dMax),
    onEdge: dMax <= dStar * (1 + 1e-12),
    visited,
  };
}
