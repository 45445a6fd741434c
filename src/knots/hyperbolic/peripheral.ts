/**
 * Meridian and longitude of each component, and the cusp shape.
 *
 * Meridian: at a crossing where the component passes over, the cusp square of the top vertex T is
 * made of the T-corners of the crossing's four tetrahedra around the crossing arc; its corners
 * eq(0) and eq(2) are the same point of the cusp (the edge from P₊ down to the over-strand), and
 * the path eq(0) → crossing arc → eq(2) runs once around the over-strand: a meridian. As a normal
 * curve it crosses the corners of tetrahedra 0 and 1 and then turns around eq(2) = eq(0). It is
 * right-handed about the over-strand (linking number +1) when the over-strand runs from slot 3 to
 * slot 1, i.e. at a positive crossing; at a negative crossing it is reversed.
 * Longitude: the primitive class on the cusp torus with linking number 0 with its own component
 * (`linking.ts`), oriented along the component: with every tetrahedron positively oriented, a
 * right-handed pair (μ, λ) has Im(λ/μ) < 0 in the developed cusp, which fixes the sign of λ.
 * (Checked in the tests: the same knot from different diagrams, kinked, and placed at the over- or
 * under-strand gives the same λ/μ; a mirror image negates the real part.)
 * Cusp shape λ/μ: ratio of the complex translations of longitude and meridian in the Euclidean
 * structure of the cusp torus; reported with Im(λ/μ) > 0 (the orientation in which the torus is
 * viewed is chosen so); natural slope = Re(λ/μ). A mirror image conjugates the developed torus and
 * reverses the meridian, so it maps λ/μ to −conj(λ/μ): the slope changes sign.
 */
import type { PDInfo } from '../pd.ts';
import { across, cuspBases, type Passage } from './cusp.ts';
import { curveTranslation, developCusps, type Shapes } from './develop.ts';
import { linkingNumbers } from './linking.ts';
import type { Combinatorics, Triangulation } from './triangulation.ts';
import { gcd } from '../../util/gcd.ts';

export interface CuspGeometry {
  /** Component (0-based). */
  component: number;
  meridian: [number, number];
  longitude: [number, number];
  /** λ/μ with Im > 0. */
  shape: [number, number];
  /** Largest rotation left in the holonomies (0 for a complete cusp), relative to |μ|. */
  mismatch: number;
}

/**
 * A meridian placed in the cusp square of vertex V (0 = T on the over-strand, 1 = B on the
 * under-strand) of crossing c, through tetrahedra j and j+1: the path eq(j) → crossing arc → eq(j+2)
 * (j even at T, odd at B, so that both ends are the same cusp point), as a normal curve of the
 * final triangulation; undefined when one of the two tetrahedra is gone.
 */
function meridianAt(tri: Triangulation, map: Int32Array, c: number, V: number, j: number): Passage[] | undefined {
  const d0 = map[4 * c + j]!;
  const d1 = map[4 * c + ((j + 1) & 3)]!;
  if (d0 < 0 || d1 < 0) return undefined;
  const ext = 1 - V; // the face of the cusp square's side (opposite the other link vertex)
  const seq: Passage[] = [
    { t: d0, v: V, fin: ext, fout: 2 },
    { t: d1, v: V, fin: 3, fout: ext },
  ];
  // turn around the corner eq(j+2) of Δ(j+1) (its vertex 3) until Δj is entered through its side face
  let o = across(tri, d1, V, ext);
  let w = tri.perm[16 * d1 + 4 * ext + 3]!;
  for (let guard = 0; guard < 4 * tri.n + 4; guard++) {
    if (o.t === d0 && o.v === V && o.fin === ext) return seq;
    const fout = 6 - o.v - w - o.fin;
    if (fout === o.v || fout === w || fout === o.fin || fout < 0 || fout > 3) return undefined;
    seq.push({ t: o.t, v: o.v, fin: o.fin, fout });
    const nw = tri.perm[16 * o.t + 4 * fout + w]!;
    o = across(tri, o.t, o.v, fout);
    w = nw;
  }
  return undefined;
}

export interface MeridianPlace {
  c: number;
  V: number;
  j: number;
  curve: Passage[];
}

/** One meridian per component, at the first crossing that still has two neighbouring tetrahedra. */
export function placeMeridians(info: PDInfo, tri: Triangulation, map: Int32Array): MeridianPlace[] | string {
  const places: MeridianPlace[] = [];
  // prefer places whose two corner regions are not bigons (their edges are then never removed)
  const size = new Int32Array(info.nFaces);
  for (const f of info.face) size[f]!++;
  const score = (c: number, j: number): number => Math.min(size[info.face[4 * c + j]!]!, size[info.face[4 * c + ((j + 1) & 3)]!]!);
  const order: Array<[number, number, number]> = [];
  for (let c = 0; c < info.nCrossings; c++) for (const [V, j] of PLACES) order.push([c, V, j]);
  order.sort((x, y) => score(y[0], y[2]) - score(x[0], x[2]));
  for (let comp = 0; comp < info.nComponents; comp++) {
    let found: MeridianPlace | undefined;
    for (const [c, V, j] of order) {
      const slot = V === 0 ? 1 : 0;
      if (info.component[info.edge[4 * c + slot]!] !== comp) continue;
      const curve = meridianAt(tri, map, c, V, j);
      if (curve) {
        found = { c, V, j, curve };
        break;
      }
    }
    if (!found) return `no crossing of component ${comp + 1} keeps two neighbouring tetrahedra (meridian not placed)`;
    places.push(found);
  }
  return places;
}

/** (vertex, first tetrahedron) of the four meridian positions at a crossing. */
const PLACES: ReadonlyArray<readonly [number, number]> = [
  [0, 0],
  [0, 2],
  [1, 1],
  [1, 3],
];

const cdiv = (a: [number, number], b: [number, number]): [number, number] => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/**
 * Cusp geometry of every component from a geometric solution; undefined with a reason when a
 * meridian cannot be placed or the linking numbers are not integers.
 */
export function cuspGeometry(info: PDInfo, tri: Triangulation, cb: Combinatorics, shapes: Shapes, map: Int32Array): CuspGeometry[] | string {
  const k = info.nComponents;
  const places = placeMeridians(info, tri, map);
  if (typeof places === 'string') return places;
  const meridians = places.map((p) => p.curve);
  const bases = cuspBases(tri, cb);
  const placed = developCusps(tri, cb, shapes);
  const out: CuspGeometry[] = [];
  const allCurves: Passage[][] = [];
  const cuspOf = meridians.map((m) => cb.vertexOf[4 * m[0]!.t + m[0]!.v]!);
  for (let comp = 0; comp < k; comp++) {
    const b = bases[cuspOf[comp]!]!;
    if (b.length !== 2) return `cusp ${comp + 1} does not have two basis curves`;
    allCurves.push(b[0]!, b[1]!);
  }
  const lk = linkingNumbers(tri, cb, meridians, allCurves);
  if (!lk) return 'linking numbers of the cusp curves are not integers';
  for (let comp = 0; comp < k; comp++) {
    const { c, V, j } = places[comp]!;
    const mu = curveTranslation(tri, shapes, placed, meridians[comp]!);
    const al = curveTranslation(tri, shapes, placed, allCurves[2 * comp]!);
    const be = curveTranslation(tri, shapes, placed, allCurves[2 * comp + 1]!);
    const a = lk[2 * comp]![comp]!;
    const bb = lk[2 * comp + 1]![comp]!;
    const g = gcd(a, bb);
    if (g === 0) return `both basis curves of cusp ${comp + 1} have linking number 0`;
    const p = bb / g;
    const q = -a / g;
    let lam: [number, number] = [p * al.re + q * be.re, p * al.im + q * be.im];
    const m: [number, number] = [mu.re, mu.im];
    // right-handed about the strand: at T, path eq0→eq2 when the over-strand runs 3 → 1 (positive
    // crossing), reversed for eq2→eq0; at B (under-strand 0 → 2), path eq3→eq1 (j = 3)
    const rightHanded = V === 0 ? (j === 0) === (info.sign[c] === 1) : j === 3;
    const muR: [number, number] = rightHanded ? m : [-m[0], -m[1]];
    // with positively oriented tetrahedra the developed cusp sees a right-handed pair (μ, λ) with
    // Im(λ/μ) < 0: this fixes the direction of λ (along the component)
    if (cdiv(lam, muR)[1] > 0) lam = [-lam[0], -lam[1]];
    let shape = cdiv(lam, muR);
    if (shape[1] < 0) shape = [shape[0], -shape[1]];
    const scale = Math.hypot(m[0], m[1]);
    out.push({ component: comp, meridian: muR, longitude: lam, shape, mismatch: Math.max(mu.mismatch, al.mismatch, be.mismatch) / scale });
  }
  return out;
}
