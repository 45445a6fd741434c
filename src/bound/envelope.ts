import { SurmiseError } from '../errors.ts';
import { kahanSum } from '../util/sum.ts';

/** The tightest linear envelope y ≤ a + Σ k_j z_j (upper) or y ≥ a + Σ k_j z_j (lower) of a point cloud. */
export interface Envelope {
  /** a */
  intercept: number;
  /** k_j, one per column of z */
  slopes: Float64Array;
  /** Mean of y − (a + k·z) over the rows in absolute value: the average gap the LP minimises. */
  meanGap: number;
  /** Simplex pivots taken. */
  iterations: number;
  /** For each slope, whether it sits on its box limit |k_j| = maxSlope (the LP would go further). */
  atLimit: boolean[];
}

export interface EnvelopeOptions {
  /** true: y ≤ a + k·z on every row (the plane from above); false: y ≥ a + k·z. */
  upper: boolean;
  /** Box |k_j| ≤ maxSlope (one number for every column, or one per column); keeps the LP bounded. */
  maxSlope: number | readonly number[];
  /** Pivot ceiling (default 200 + 50·(columns + 1)). */
  maxIterations?: number;
}

/**
 * The plane that lies above every point (y_i, z_i) (below with `upper: false`) and is lowest at the
 * points' centroid z̄: minimise a + k·z̄ subject to a + k·z_i ≥ y_i and |k_j| ≤ K — equivalently the
 * plane of least average gap, the facet of the upper hull over the centroid. A linear program in
 * d + 1 variables with one constraint per row, solved exactly by the revised simplex method on its
 * dual (G. B. Dantzig, Linear Programming and Extensions, 1963; V. Chvátal, Linear Programming,
 * 1983, ch. 7): max Σ λ_i y_i − K Σ (μ⁺_j + μ⁻_j) subject to Σ λ_i = 1, Σ λ_i z_i + μ⁺ − μ⁻ = z̄,
 * λ, μ ≥ 0. The simplex multipliers are the plane (a, k); the entering row is the point farthest
 * above the current plane (Dantzig's rule), switching to Bland's smallest-index rule after a run of
 * degenerate pivots (R. G. Bland, Math. Oper. Res. 2, 1977), so it terminates. Data are centred
 * and scaled first, and the intercept is finally raised by the largest remaining violation so the
 * plane holds on every row in floating point. Each pivot costs one pass over the rows, O(n·d).
 * @example tightestEnvelope(Float64Array.of(1, 2, 2.5), [Float64Array.of(0, 1, 3)], Int32Array.of(0, 1, 2), { upper: true, maxSlope: 4 })
 * // intercept 1.75, slopes [0.25]: the hull edge through (1, 2) and (3, 2.5), the one over z̄ = 4/3
 */
export function tightestEnvelope(y: Float64Array, z: readonly Float64Array[], rows: Int32Array, opts: EnvelopeOptions): Envelope {
  const n = rows.length;
  const d = z.length;
  const m = d + 1;
  if (n === 0) throw new RangeError('tightestEnvelope: no rows');
  const sign = opts.upper ? 1 : -1;
  // centre and scale: y' = sign·(y − ȳ)/sy, z'_j = (z_j − z̄_j)/s_j
  const yMean = kahanSum(y, rows) / n;
  let sy = 0;
  for (let t = 0; t < n; t++) sy = Math.max(sy, Math.abs(y[rows[t]!]! - yMean));
  if (!(sy > 0)) sy = 1;
  const zMean = new Float64Array(d);
  const zs = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    zMean[j] = kahanSum(z[j]!, rows) / n;
    let s = 0;
    for (let t = 0; t < n; t++) s = Math.max(s, Math.abs(z[j]![rows[t]!]! - zMean[j]!));
    zs[j] = s > 0 ? s : 1;
  }
  const yc = new Float64Array(n);
  const zc = new Float64Array(n * d);
  for (let t = 0; t < n; t++) {
    const r = rows[t]!;
    yc[t] = (sign * (y[r]! - yMean)) / sy;
    for (let j = 0; j < d; j++) zc[t * d + j] = (z[j]![r]! - zMean[j]!) / zs[j]!;
  }
  // box in scaled units: |k'_j| ≤ K·s_j/sy (the sign flip of the lower form keeps the box symmetric)
  const box = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    const K = typeof opts.maxSlope === 'number' ? opts.maxSlope : opts.maxSlope[j]!;
    if (!(K >= 0)) throw new RangeError(`tightestEnvelope: maxSlope must be ≥ 0, got ${K}`);
    box[j] = (K * zs[j]!) / sy;
  }

  // column q < n: (1, z'_q), cost y'_q; q = n + 2j: +e_{j+1}, q = n + 2j + 1: −e_{j+1}, cost −box_j
  const column = (q: number, out: Float64Array): void => {
    out.fill(0);
    if (q < n) {
      out[0] = 1;
      for (let j = 0; j < d; j++) out[j + 1] = zc[q * d + j]!;
    } else {
      const j = (q - n) >> 1;
      out[j + 1] = (q - n) & 1 ? -1 : 1;
    }
  };
  const cost = (q: number): number => (q < n ? yc[q]! : -box[(q - n) >> 1]!);
  const b = new Float64Array(m);
  b[0] = 1; // centred z: the other right-hand sides are 0

  // starting basis: the highest point, with the box slacks that make it feasible
  let top = 0;
  for (let t = 1; t < n; t++) if (yc[t]! > yc[top]!) top = t;
  const basis = new Int32Array(m);
  basis[0] = top;
  for (let j = 0; j < d; j++) basis[j + 1] = n + 2 * j + (zc[top * d + j]! > 0 ? 1 : 0);
  const Binv = new Float64Array(m * m);
  const xB = new Float64Array(m);
  const col = new Float64Array(m);
  const refactor = (): void => invertBasis(basis, column, m, Binv, b, xB);
  refactor();

  const pi = new Float64Array(m);
  const u = new Float64Array(m);
  const maxIter = opts.maxIterations ?? 200 + 50 * m;
  const tol = 1e-11;
  let iterations = 0;
  let degenerate = 0;
  for (;;) {
    for (let k = 0; k < m; k++) {
      let s = 0;
      for (let r = 0; r < m; r++) s += cost(basis[r]!) * Binv[r * m + k]!;
      pi[k] = s;
    }
    const bland = degenerate > 2 * m;
    let enter = -1;
    let best = tol;
    for (let q = 0; q < n; q++) {
      let v = yc[q]! - pi[0]!;
      const o = q * d;
      for (let j = 0; j < d; j++) v -= pi[j + 1]! * zc[o + j]!;
      if (v > best) {
        best = v;
        enter = q;
        if (bland) break;
      }
    }
    if (enter < 0 || !bland) {
      for (let j = 0; j < d; j++) {
        for (const s of [1, -1]) {
          const v = -box[j]! - s * pi[j + 1]!;
          if (v > best && (enter < 0 || !bland)) {
            best = v;
            enter = n + 2 * j + (s < 0 ? 1 : 0);
          }
        }
      }
    }
    if (enter < 0) break;
    if (++iterations > maxIter) {
      throw new SurmiseError('bound.lpNoConvergence', `the envelope linear program did not converge in ${maxIter} pivots (${n} rows, ${d} quantities)`);
    }
    column(enter, col);
    for (let r = 0; r < m; r++) {
      let s = 0;
      for (let k = 0; k < m; k++) s += Binv[r * m + k]! * col[k]!;
      u[r] = s;
    }
    let leave = -1;
    let ratio = Infinity;
    for (let r = 0; r < m; r++) {
      if (u[r]! > 1e-12) {
        const t = Math.max(0, xB[r]!) / u[r]!;
        if (t < ratio - 1e-15 || (Math.abs(t - ratio) <= 1e-15 && basis[r]! < basis[leave]!)) {
          ratio = t;
          leave = r;
        }
      }
    }
    if (leave < 0) throw new SurmiseError('bound.lpUnbounded', 'the envelope linear program is unbounded (no plane lies above every point)', undefined, 1);
    degenerate = ratio <= 1e-14 ? degenerate + 1 : 0;
    basis[leave] = enter;
    if (iterations % 32 === 0) refactor();
    else {
      const p = u[leave]!;
      for (let k = 0; k < m; k++) Binv[leave * m + k]! /= p;
      for (let r = 0; r < m; r++) {
        if (r === leave || u[r] === 0) continue;
        const f = u[r]!;
        for (let k = 0; k < m; k++) Binv[r * m + k]! -= f * Binv[leave * m + k]!;
      }
      for (let r = 0; r < m; r++) if (r !== leave) xB[r]! -= ratio * u[r]!;
      xB[leave] = ratio;
    }
  }
  // back to original units: k_j = sign·sy·k'_j/s_j, a = ȳ + sign·sy·a' − k·z̄
  const slopes = new Float64Array(d);
  let a = yMean + sign * sy * pi[0]!;
  const atLimit: boolean[] = [];
  for (let j = 0; j < d; j++) {
    slopes[j] = (sign * sy * pi[j + 1]!) / zs[j]!;
    a -= slopes[j]! * zMean[j]!;
    atLimit.push(box[j]! > 0 && Math.abs(pi[j + 1]!) >= box[j]! * (1 - 1e-9));
  }
  // raise (lower) the intercept by the largest remaining violation, then the mean gap
  let worst = 0;
  for (let t = 0; t < n; t++) {
    const r = rows[t]!;
    let v = y[r]! - a;
    for (let j = 0; j < d; j++) v -= slopes[j]! * z[j]![r]!;
    if (sign * v > worst) worst = sign * v;
  }
  a += sign * worst;
  let gap = 0;
  for (let t = 0; t < n; t++) {
    const r = rows[t]!;
    let v = a - y[r]!;
    for (let j = 0; j < d; j++) v += slopes[j]! * z[j]![r]!;
    gap += sign * v;
  }
  return { intercept: a, slopes, meanGap: gap / n, iterations, atLimit };
}

/** B⁻¹ of the basis columns by Gauss–Jordan elimination with partial pivoting, and x_B = B⁻¹ b. */
function invertBasis(basis: Int32Array, column: (q: number, out: Float64Array) => void, m: number, Binv: Float64Array, b: Float64Array, xB: Float64Array): void {
  const w = 2 * m;
  const M = new Float64Array(m * w);
  const col = new Float64Array(m);
  for (let r = 0; r < m; r++) {
    column(basis[r]!, col);
    for (let k = 0; k < m; k++) M[k * w + r] = col[k]!;
    M[r * w + m + r] = 1;
  }
  for (let c = 0; c < m; c++) {
    let p = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(M[r * w + c]!) > Math.abs(M[p * w + c]!)) p = r;
    if (Math.abs(M[p * w + c]!) < 1e-14) throw new SurmiseError('bound.lpSingular', 'the envelope linear program reached a singular basis', undefined, 1);
    if (p !== c) for (let k = 0; k < w; k++) [M[c * w + k], M[p * w + k]] = [M[p * w + k]!, M[c * w + k]!];
    const piv = M[c * w + c]!;
    for (let k = 0; k < w; k++) M[c * w + k]! /= piv;
    for (let r = 0; r < m; r++) {
      if (r === c) continue;
      const f = M[r * w + c]!;
      if (f === 0) continue;
      for (let k = 0; k < w; k++) M[r * w + k]! -= f * M[c * w + k]!;
    }
  }
  for (let r = 0; r < m; r++) for (let k = 0; k < m; k++) Binv[r * m + k] = M[r * w + m + k]!;
  for (let r = 0; r < m; r++) {
    let s = 0;
    for (let k = 0; k < m; k++) s += Binv[r * m + k]! * b[k]!;
    xB[r] = s;
  }
}
