/**
 * Linking numbers of cusp curves with the components of the link, from the triangulation alone:
 * a 1-cocycle on the dual graph (one value per face, summing to 0 around every edge) is a class in
 * H¹(M; ℝ) ≅ ℝ^k for the complement M of a k-component link (Alexander duality; Rolfsen,
 * "Knots and Links", §5.D); the cocycle φ_i with φ_i(μ_j) = δ_ij is the linking number with the
 * i-th component. Cocycles come from the null space of the edge relations (Gaussian elimination in
 * float64; values on curves are rounded to integers and refused if they are not within 1e-6).
 */
import type { Passage } from './cusp.ts';
import type { Combinatorics, Triangulation } from './triangulation.ts';

function faceId(tri: Triangulation, t: number, f: number): { id: number; sign: number } {
  const u = tri.nbr[4 * t + f]!;
  const g = tri.perm[16 * t + 4 * f + f]!;
  const a = 4 * t + f;
  const b = 4 * u + g;
  return a <= b ? { id: a, sign: 1 } : { id: b, sign: -1 };
}

/** Basis of the cocycles (columns indexed by face id 4t + f, canonical sides only). */
function cocycleBasis(tri: Triangulation, cb: Combinatorics): Float64Array[] {
  const n = tri.n;
  const cols = 4 * n;
  const rows: Float64Array[] = [];
  const done = new Uint8Array(cb.nEdges);
  for (let t = 0; t < n; t++)
    for (let a = 0; a < 4; a++)
      for (let b = a + 1; b < 4; b++) {
        const k = a === 0 ? b - 1 : a === 1 ? b + 1 : 5;
        const e = cb.edgeOf[6 * t + k]!;
        if (done[e]) continue;
        done[e] = 1;
        const row = new Float64Array(cols);
        const [c] = [0, 1, 2, 3].filter((x) => x !== a && x !== b);
        let ct = t;
        let ca = a;
        let cbv = b;
        let exit = c!;
        for (let guard = 0; guard < 6 * n + 6; guard++) {
          const fi = faceId(tri, ct, exit);
          row[fi.id]! += fi.sign;
          const base = 16 * ct + 4 * exit;
          const u = tri.nbr[4 * ct + exit]!;
          const na = tri.perm[base + ca]!;
          const nb = tri.perm[base + cbv]!;
          const enter = tri.perm[base + exit]!;
          const nexit = 6 - na - nb - enter;
          ct = u;
          ca = na;
          cbv = nb;
          exit = nexit;
          if (ct === t && ((ca === a && cbv === b) || (ca === b && cbv === a)) && exit === c) break;
        }
        rows.push(row);
      }
  // reduced row echelon form
  const pivCol: number[] = [];
  let r = 0;
  for (let col = 0; col < cols && r < rows.length; col++) {
    let best = r;
    for (let i = r + 1; i < rows.length; i++) if (Math.abs(rows[i]![col]!) > Math.abs(rows[best]![col]!)) best = i;
    if (Math.abs(rows[best]![col]!) < 1e-9) continue;
    [rows[r], rows[best]] = [rows[best]!, rows[r]!];
    const pr = rows[r]!;
    const pv = pr[col]!;
    for (let j = col; j < cols; j++) pr[j] = pr[j]! / pv;
    for (let i = 0; i < rows.length; i++) {
      if (i === r) continue;
      const ri = rows[i]!;
      const fct = ri[col]!;
      if (fct === 0) continue;
      for (let j = col; j < cols; j++) ri[j] = ri[j]! - fct * pr[j]!;
    }
    pivCol.push(col);
    r++;
  }
  const isPiv = new Int32Array(cols).fill(-1);
  pivCol.forEach((c, i) => (isPiv[c] = i));
  // only canonical face ids are real columns
  const canonical = new Uint8Array(cols);
  for (let t = 0; t < n; t++) for (let f = 0; f < 4; f++) canonical[faceId(tri, t, f).id] = 1;
  const basis: Float64Array[] = [];
  for (let free = 0; free < cols; free++) {
    if (isPiv[free]! >= 0 || !canonical[free]) continue;
    const v = new Float64Array(cols);
    v[free] = 1;
    for (let i = 0; i < pivCol.length; i++) v[pivCol[i]!] = -rows[i]![free]!;
    basis.push(v);
  }
  return basis;
}

function evalCurve(tri: Triangulation, phi: Float64Array, curve: readonly Passage[]): number {
  let s = 0;
  for (const p of curve) {
    const fi = faceId(tri, p.t, p.fout);
    s += fi.sign * phi[fi.id]!;
  }
  return s;
}

/**
 * Linking numbers lk(curve, component i) for every curve, given one meridian per component (in
 * component order). Undefined when the values are not integers (numerical trouble).
 */
export function linkingNumbers(tri: Triangulation, cb: Combinatorics, meridians: readonly (readonly Passage[])[], curves: readonly (readonly Passage[])[]): number[][] | undefined {
  const basis = cocycleBasis(tri, cb);
  const k = meridians.length;
  const d = basis.length;
  // M[i][j] = basis j on meridian i
  const M = meridians.map((m) => basis.map((b) => evalCurve(tri, b, m)));
  // min-norm solutions of M c = e_i: c = Mᵀ (M Mᵀ)⁻¹ e_i
  const G = M.map((ri) => M.map((rj) => ri.reduce((s, x, q) => s + x * rj[q]!, 0)));
  // invert G (k×k) by Gauss–Jordan
  const inv = G.map((row, i) => [...row, ...G.map((_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let i = c + 1; i < k; i++) if (Math.abs(inv[i]![c]!) > Math.abs(inv[p]![c]!)) p = i;
    if (Math.abs(inv[p]![c]!) < 1e-12) return undefined;
    [inv[c], inv[p]] = [inv[p]!, inv[c]!];
    const pv = inv[c]![c]!;
    inv[c] = inv[c]!.map((x) => x / pv);
    for (let i = 0; i < k; i++) if (i !== c) {
      const f = inv[i]![c]!;
      inv[i] = inv[i]!.map((x, j) => x - f * inv[c]![j]!);
    }
  }
  const curveVals = curves.map((cv) => basis.map((b) => evalCurve(tri, b, cv)));
  const out: number[][] = [];
  for (const vals of curveVals) {
    const row: number[] = [];
    for (let i = 0; i < k; i++) {
      // φ_i = Σ_j c_j basis_j, c = Mᵀ inv e_i
      let s = 0;
      for (let j = 0; j < d; j++) {
        let cj = 0;
        for (let q = 0; q < k; q++) cj += M[q]![j]! * inv[q]![k + i]!;
        s += cj * vals[j]!;
      }
      const r = Math.round(s);
      if (Math.abs(s - r) > 1e-6) return undefined;
      row.push(r);
    }
    out.push(row);
  }
  return out;
}
