/**
 * Householder QR with column pivoting (Businger & Golub, Numer. Math. 7, 1965; Golub & Van Loan,
 * "Matrix Computations", 4th ed., Algorithm 5.4.1), in float64 on a column-major design whose
 * columns are separate Float64Arrays. Never forms the normal equations.
 */

export interface PivotedQR {
  /** Rows and columns of the design. */
  n: number;
  p: number;
  /** R, upper triangular, p×p row-major (only the upper triangle is meaningful). */
  r: Float64Array;
  /** piv[k] = original index of the column in pivoted position k. */
  piv: Int32Array;
  /** Qᵀy for each right-hand side given (length n each). */
  qty: Float64Array[];
  /** Numerical rank: |R_kk| > tol · |R_00| for k < rank. */
  rank: number;
  /** The relative tolerance used to decide the rank. */
  rankTol: number;
}

/**
 * Factor A·P = Q·R, applying Qᵀ to each `rhs` too. `cols` are overwritten (they hold the
 * Householder vectors afterwards); pass copies. Rank tolerance default: max(n, p)·ε relative to
 * |R_00| (the usual choice for a rank-revealing factorization; Golub & Van Loan §5.4.2).
 */
export function pivotedHouseholderQR(cols: Float64Array[], rhs: Float64Array[], rankTol?: number): PivotedQR {
  const p = cols.length;
  const n = p > 0 ? cols[0]!.length : rhs[0]?.length ?? 0;
  const tol = rankTol ?? Math.max(n, p) * 2.220446049250313e-16;
  const piv = new Int32Array(p);
  for (let j = 0; j < p; j++) piv[j] = j;
  const a = cols.slice();
  const r = new Float64Array(p * p);
  // column norms of the trailing part, downdated after each step and recomputed when
  // cancellation threatens (LAPACK xLAQP2; Drmač & Bujanović, SIAM J. Matrix Anal. Appl. 29, 2008)
  const vn1 = new Float64Array(p);
  const vn2 = new Float64Array(p);
  for (let j = 0; j < p; j++) vn1[j] = vn2[j] = tailNorm(a[j]!, 0, n);
  const tol3z = Math.sqrt(2.220446049250313e-16);
  let r00 = 0;
  let rank = p;
  for (let k = 0; k < p; k++) {
    // pivot: the remaining column with the largest trailing norm
    let best = k;
    for (let j = k + 1; j < p; j++) if (vn1[j]! > vn1[best]!) best = j;
    if (best !== k) {
      [a[k], a[best]] = [a[best]!, a[k]!];
      [piv[k], piv[best]] = [piv[best]!, piv[k]!];
      [vn1[k], vn1[best]] = [vn1[best]!, vn1[k]!];
      [vn2[k], vn2[best]] = [vn2[best]!, vn2[k]!];
      for (let i = 0; i < k; i++) {
        const t = r[i * p + k]!;
        r[i * p + k] = r[i * p + best]!;
        r[i * p + best] = t;
      }
    }
    const v = a[k]!;
    const normK = tailNorm(v, k, n); // exact norm of the pivot column (the downdated one only chose it)
    if (k === 0) r00 = normK;
    if (normK <= tol * r00 || normK === 0) {
      if (rank === p) rank = k;
    }
    if (normK === 0) {
      r[k * p + k] = 0;
      continue;
    }
    // Householder vector v = x − βe_k with β = −sign(x_k)‖x‖ (Golub & Van Loan Algorithm 5.1.1)
    const x0 = v[k]!;
    const beta = x0 >= 0 ? -normK : normK;
    v[k] = x0 - beta;
    // vᵀv = 2‖x‖² − 2 x0 β  = 2 β (β − x0)
    const vtv = 2 * normK * normK - 2 * x0 * beta;
    r[k * p + k] = beta;
    const apply = (w: Float64Array): number => {
      let s = 0;
      for (let i = k; i < n; i++) s += v[i]! * w[i]!;
      const f = (2 * s) / vtv;
      for (let i = k; i < n; i++) w[i] = w[i]! - f * v[i]!;
      return w[k]!;
    };
    for (let j = k + 1; j < p; j++) {
      const rkj = apply(a[j]!);
      r[k * p + j] = rkj;
      if (vn1[j]! !== 0) {
        let t = 1 - (Math.abs(rkj) / vn1[j]!) ** 2;
        t = Math.max(t, 0);
        const t2 = t * (vn1[j]! / vn2[j]!) ** 2;
        if (t2 <= tol3z) {
          vn1[j] = vn2[j] = tailNorm(a[j]!, k + 1, n);
        } else vn1[j] = vn1[j]! * Math.sqrt(t);
      }
    }
    for (const y of rhs) apply(y);
  }
  return { n, p, r, piv, qty: rhs, rank, rankTol: tol };
}

/** ‖col[from:to]‖₂, by a plain sum of squares, rescaled only when it over- or underflows. */
export function tailNorm(col: Float64Array, from: number, to: number): number {
  let s = 0;
  for (let i = from; i < to; i++) s += col[i]! * col[i]!;
  if (s > 1e-280 && s < 1e280) return Math.sqrt(s);
  let scale = 0;
  for (let i = from; i < to; i++) scale = Math.max(scale, Math.abs(col[i]!));
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  s = 0;
  for (let i = from; i < to; i++) { const w = col[i]! / scale; s += w * w; }
  return scale * Math.sqrt(s);
}

/** Solve R[0:m,0:m] z = b[0:m] by back substitution (R row-major p×p). */
export function backSubstitute(r: Float64Array, p: number, m: number, b: ArrayLike<number>): Float64Array {
  const z = new Float64Array(m);
  for (let i = m - 1; i >= 0; i--) {
    let s = b[i]!;
    for (let j = i + 1; j < m; j++) s -= r[i * p + j]! * z[j]!;
    z[i] = s / r[i * p + i]!;
  }
  return z;
}

/** R⁻¹ of the leading m×m block (upper triangular, row-major m×m). */
export function invertUpper(r: Float64Array, p: number, m: number): Float64Array {
  const inv = new Float64Array(m * m);
  for (let j = 0; j < m; j++) {
    const e = new Float64Array(m);
    e[j] = 1;
    const col = backSubstitute(r, p, m, e);
    for (let i = 0; i < m; i++) inv[i * m + j] = col[i]!;
  }
  return inv;
}

/**
 * Singular values of a small m×m matrix (row-major) by one-sided Jacobi rotations
 * (Hestenes 1958; Demmel & Veselić, SIAM J. Matrix Anal. Appl. 13, 1992): accurate to high
 * relative precision, which the condition number of a triangular factor needs.
 */
export function singularValues(m: number, a: Float64Array): Float64Array {
  // work on columns
  const u: Float64Array[] = [];
  for (let j = 0; j < m; j++) {
    const c = new Float64Array(m);
    for (let i = 0; i < m; i++) c[i] = a[i * m + j]!;
    u.push(c);
  }
  for (let sweep = 0; sweep < 60; sweep++) {
    let off = 0;
    for (let i = 0; i < m - 1; i++) {
      for (let j = i + 1; j < m; j++) {
        const ui = u[i]!;
        const uj = u[j]!;
        let alpha = 0;
        let beta = 0;
        let gamma = 0;
        for (let k = 0; k < m; k++) {
          alpha += ui[k]! * ui[k]!;
          beta += uj[k]! * uj[k]!;
          gamma += ui[k]! * uj[k]!;
        }
        if (gamma === 0 || Math.abs(gamma) <= 1e-15 * Math.sqrt(alpha * beta)) continue;
        off = Math.max(off, Math.abs(gamma) / Math.sqrt(alpha * beta));
        const zeta = (beta - alpha) / (2 * gamma);
        const t = Math.sign(zeta || 1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        for (let k = 0; k < m; k++) {
          const x = ui[k]!;
          const y = uj[k]!;
          ui[k] = c * x - s * y;
          uj[k] = s * x + c * y;
        }
      }
    }
    if (off <= 1e-15) break;
  }
  const sv = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    let s = 0;
    for (let k = 0; k < m; k++) s += u[j]![k]! * u[j]![k]!;
    sv[j] = Math.sqrt(s);
  }
  return sv.sort().reverse();
}
