/**
 * Newton's method (Gauss–Newton for the overdetermined but consistent system) on the logarithmic
 * gluing and completeness equations, in complex float64, kept inside the upper half-plane: a step
 * that would take a shape to Im z ≤ 0 is halved, so only geometric solutions are found.
 * Start: every tetrahedron regular, z = e^{iπ/3} (the shape of the regular ideal tetrahedron);
 * other starts are given by the caller. Converges quadratically near a solution; stops when the
 * largest residual is below `tol` or after `maxIter` steps.
 * Precision: residuals reach ~1e-14; shapes of nearly flat tetrahedra (Im z ≈ 1e-8) lose digits, and
 * the normal equations square the Jacobian's condition number (reported as `conditionHint`).
 */
import type { EquationSystem } from './equations.ts';

export interface NewtonResult {
  re: Float64Array;
  im: Float64Array;
  residual: number;
  iterations: number;
  converged: boolean;
  /** Work done, in units of one complex multiply–add: n³/6 per factorization (the dominant cost). */
  work: number;
  /** True when the run stopped because `maxWork` was spent. */
  capped?: boolean;
}

/** Nearest value to `ref` among a + 2πk (an argument continued along the iteration). */
const nearBranch = (a: number, ref: number): number => a + 2 * Math.PI * Math.round((ref - a) / (2 * Math.PI));

/** Residuals with principal logarithms, or, given `args`, with arguments continued from them (updated). */
function residuals(sys: EquationSystem, re: Float64Array, im: Float64Array, Fr: Float64Array, Fi: Float64Array, args?: { z: Float64Array; w: Float64Array }): number {
  const { n, rows, A, B, c } = sys;
  const lzr = new Float64Array(n);
  const lzi = new Float64Array(n);
  const lwr = new Float64Array(n);
  const lwi = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    lzr[t] = 0.5 * Math.log(re[t]! * re[t]! + im[t]! * im[t]!);
    lzi[t] = Math.atan2(im[t]!, re[t]!);
    const wr = 1 - re[t]!;
    const wi = -im[t]!;
    lwr[t] = 0.5 * Math.log(wr * wr + wi * wi);
    lwi[t] = Math.atan2(wi, wr);
    if (args) {
      lzi[t] = args.z[t] = nearBranch(lzi[t]!, args.z[t]!);
      lwi[t] = args.w[t] = nearBranch(lwi[t]!, args.w[t]!);
    }
  }
  let worst = 0;
  for (let r = 0; r < rows; r++) {
    let sr = 0;
    let si = -Math.PI * c[r]!;
    const o = r * n;
    for (let t = 0; t < n; t++) {
      const a = A[o + t]!;
      const b = B[o + t]!;
      if (a !== 0) {
        sr += a * lzr[t]!;
        si += a * lzi[t]!;
      }
      if (b !== 0) {
        sr += b * lwr[t]!;
        si += b * lwi[t]!;
      }
    }
    Fr[r] = sr;
    Fi[r] = si;
    worst = Math.max(worst, Math.abs(sr), Math.abs(si));
  }
  return worst;
}

/** Solve the complex n×n system M x = y (row-major, partial pivoting); false when singular. */
export function complexSolve(n: number, Mr: Float64Array, Mi: Float64Array, yr: Float64Array, yi: Float64Array): boolean {
  for (let k = 0; k < n; k++) {
    let piv = k;
    let best = 0;
    for (let r = k; r < n; r++) {
      const m = Math.hypot(Mr[r * n + k]!, Mi[r * n + k]!);
      if (m > best) {
        best = m;
        piv = r;
      }
    }
    if (best < 1e-300) return false;
    if (piv !== k) {
      for (let j = 0; j < n; j++) {
        let tmp = Mr[k * n + j]!;
        Mr[k * n + j] = Mr[piv * n + j]!;
        Mr[piv * n + j] = tmp;
        tmp = Mi[k * n + j]!;
        Mi[k * n + j] = Mi[piv * n + j]!;
        Mi[piv * n + j] = tmp;
      }
      let tmp = yr[k]!;
      yr[k] = yr[piv]!;
      yr[piv] = tmp;
      tmp = yi[k]!;
      yi[k] = yi[piv]!;
      yi[piv] = tmp;
    }
    const pr = Mr[k * n + k]!;
    const pi = Mi[k * n + k]!;
    const d = pr * pr + pi * pi;
    for (let r = k + 1; r < n; r++) {
      const ar = Mr[r * n + k]!;
      const ai = Mi[r * n + k]!;
      if (ar === 0 && ai === 0) continue;
      const fr = (ar * pr + ai * pi) / d;
      const fi = (ai * pr - ar * pi) / d;
      for (let j = k; j < n; j++) {
        const br = Mr[k * n + j]!;
        const bi = Mi[k * n + j]!;
        Mr[r * n + j] = Mr[r * n + j]! - (fr * br - fi * bi);
        Mi[r * n + j] = Mi[r * n + j]! - (fr * bi + fi * br);
      }
      yr[r] = yr[r]! - (fr * yr[k]! - fi * yi[k]!);
      yi[r] = yi[r]! - (fr * yi[k]! + fi * yr[k]!);
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    let sr = yr[k]!;
    let si = yi[k]!;
    for (let j = k + 1; j < n; j++) {
      const br = Mr[k * n + j]!;
      const bi = Mi[k * n + j]!;
      sr -= br * yr[j]! - bi * yi[j]!;
      si -= br * yi[j]! + bi * yr[j]!;
    }
    const pr = Mr[k * n + k]!;
    const pi = Mi[k * n + k]!;
    const d = pr * pr + pi * pi;
    yr[k] = (sr * pr + si * pi) / d;
    yi[k] = (si * pr - sr * pi) / d;
  }
  return true;
}

/**
 * Solve M x = y for a Hermitian positive definite M (row-major, both triangles filled) by the
 * complex Cholesky factorization M = L Lᴴ (Golub & Van Loan, "Matrix Computations", §4.2): half
 * the work of LU and no pivot search. M and y are overwritten (L in the lower triangle, x in y).
 * False when a pivot is not positive (M not numerically positive definite).
 */
export function hermitianSolve(n: number, Mr: Float64Array, Mi: Float64Array, yr: Float64Array, yi: Float64Array): boolean {
  for (let j = 0; j < n; j++) {
    const oj = j * n;
    // d = M[j][j] − Σ_k |L[j][k]|²
    let d = Mr[oj + j]!;
    for (let k = 0; k < j; k++) d -= Mr[oj + k]! * Mr[oj + k]! + Mi[oj + k]! * Mi[oj + k]!;
    if (!(d > 1e-300)) return false;
    const ljj = Math.sqrt(d);
    Mr[oj + j] = ljj;
    Mi[oj + j] = 0;
    const inv = 1 / ljj;
    for (let i = j + 1; i < n; i++) {
      const oi = i * n;
      // L[i][j] = (M[i][j] − Σ_k L[i][k]·conj(L[j][k])) / L[j][j]
      let sr = Mr[oi + j]!;
      let si = Mi[oi + j]!;
      for (let k = 0; k < j; k++) {
        const ar = Mr[oi + k]!;
        const ai = Mi[oi + k]!;
        const br = Mr[oj + k]!;
        const bi = Mi[oj + k]!;
        sr -= ar * br + ai * bi;
        si -= ai * br - ar * bi;
      }
      Mr[oi + j] = sr * inv;
      Mi[oi + j] = si * inv;
    }
  }
  // L u = y
  for (let i = 0; i < n; i++) {
    const oi = i * n;
    let sr = yr[i]!;
    let si = yi[i]!;
    for (let k = 0; k < i; k++) {
      const lr = Mr[oi + k]!;
      const li = Mi[oi + k]!;
      sr -= lr * yr[k]! - li * yi[k]!;
      si -= lr * yi[k]! + li * yr[k]!;
    }
    yr[i] = sr / Mr[oi + i]!;
    yi[i] = si / Mr[oi + i]!;
  }
  // Lᴴ x = u
  for (let i = n - 1; i >= 0; i--) {
    let sr = yr[i]!;
    let si = yi[i]!;
    for (let k = i + 1; k < n; k++) {
      // conj(L[k][i]) · x[k]
      const lr = Mr[k * n + i]!;
      const li = -Mi[k * n + i]!;
      sr -= lr * yr[k]! - li * yi[k]!;
      si -= lr * yi[k]! + li * yr[k]!;
    }
    yr[i] = sr / Mr[i * n + i]!;
    yi[i] = si / Mr[i * n + i]!;
  }
  return true;
}

/** Column indices of the nonzero entries of each row (each edge equation touches few tetrahedra). */
function rowSupports(sys: EquationSystem): Int32Array[] {
  const { n, rows, A, B } = sys;
  const out: Int32Array[] = [];
  for (let r = 0; r < rows; r++) {
    const cols: number[] = [];
    for (let t = 0; t < n; t++) if (A[r * n + t] !== 0 || B[r * n + t] !== 0) cols.push(t);
    out.push(Int32Array.from(cols));
  }
  return out;
}

/**
 * Gauss–Newton normal equations at (re, im): M = Jᴴ J, y = −Jᴴ F with J = A/z − B/(1 − z),
 * accumulated over the nonzero entries of each row only (`support`), so the cost is Σ_r nnz_r²
 * instead of rows·n².
 */
function normalEquations(sys: EquationSystem, support: readonly Int32Array[], re: Float64Array, im: Float64Array, Fr: Float64Array, Fi: Float64Array, Jr: Float64Array, Ji: Float64Array, Mr: Float64Array, Mi: Float64Array, yr: Float64Array, yi: Float64Array): void {
  const { n, rows, A, B } = sys;
  // 1/z and 1/(1 − z) per tetrahedron
  const izr = new Float64Array(n);
  const izi = new Float64Array(n);
  const iwr = new Float64Array(n);
  const iwi = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    const zr = re[t]!;
    const zi = im[t]!;
    const dz = zr * zr + zi * zi;
    izr[t] = zr / dz;
    izi[t] = -zi / dz;
    const wr = 1 - zr;
    const wi = -zi;
    const dw = wr * wr + wi * wi;
    iwr[t] = wr / dw;
    iwi[t] = -wi / dw;
  }
  Mr.fill(0);
  Mi.fill(0);
  yr.fill(0);
  yi.fill(0);
  for (let r = 0; r < rows; r++) {
    const o = r * n;
    const cols = support[r]!;
    const m = cols.length;
    // J row entries on the support (stored in place in Jr/Ji at the same columns)
    for (let s = 0; s < m; s++) {
      const t = cols[s]!;
      const a = A[o + t]!;
      const b = B[o + t]!;
      Jr[o + t] = a * izr[t]! - b * iwr[t]!;
      Ji[o + t] = a * izi[t]! - b * iwi[t]!;
    }
    const fr = Fr[r]!;
    const fi = Fi[r]!;
    for (let s = 0; s < m; s++) {
      const p = cols[s]!;
      const ar = Jr[o + p]!;
      const ai = Ji[o + p]!;
      // conj(a) * F
      yr[p] = yr[p]! - (ar * fr + ai * fi);
      yi[p] = yi[p]! - (ar * fi - ai * fr);
      const op = p * n;
      for (let u = 0; u < m; u++) {
        const q = cols[u]!;
        const br = Jr[o + q]!;
        const bi = Ji[o + q]!;
        Mr[op + q] = Mr[op + q]! + (ar * br + ai * bi);
        Mi[op + q] = Mi[op + q]! + (ar * bi - ai * br);
      }
    }
  }
}

/** Newton step: Cholesky on the Hermitian normal equations; LU with pivoting if that fails (semidefinite M). */
function solveNormal(n: number, Mr: Float64Array, Mi: Float64Array, yr: Float64Array, yi: Float64Array, Lr: Float64Array, Li: Float64Array, xr: Float64Array, xi: Float64Array): boolean {
  Lr.set(Mr);
  Li.set(Mi);
  xr.set(yr);
  xi.set(yi);
  if (hermitianSolve(n, Lr, Li, xr, xi)) return true;
  Lr.set(Mr);
  Li.set(Mi);
  xr.set(yr);
  xi.set(yi);
  return complexSolve(n, Lr, Li, xr, xi);
}

/** The arrays one Newton or Levenberg–Marquardt solve works in: residuals F, Jacobian J, normal matrix M, its Cholesky factor L, steps y, trial point t (real and imaginary parts). */
function workspace(n: number, rows: number) {
  const vec = () => new Float64Array(n);
  const eqs = () => new Float64Array(rows);
  const mat = () => new Float64Array(n * n);
  return {
    Fr: eqs(), Fi: eqs(), tFr: eqs(), tFi: eqs(),
    Jr: new Float64Array(rows * n), Ji: new Float64Array(rows * n),
    Mr: mat(), Mi: mat(), Lr: mat(), Li: mat(),
    yr: vec(), yi: vec(), y0r: vec(), y0i: vec(), tre: vec(), tim: vec(),
  };
}

/** Newton iteration from the given start (modified in place copies). */
export function solveShapes(sys: EquationSystem, startRe: Float64Array, startIm: Float64Array, tol = 1e-13, maxIter = 60, maxWork = Infinity): NewtonResult {
  const { n, rows } = sys;
  const re = Float64Array.from(startRe);
  const im = Float64Array.from(startIm);
  const { Fr, Fi, Jr, Ji, Mr, Mi, yr, yi, y0r, y0i, tre, tim, tFr, tFi, Lr, Li } = workspace(n, rows);
  let res = residuals(sys, re, im, Fr, Fi);
  const support = rowSupports(sys);
  const unit = (n * n * n) / 6;
  let work = 0;
  let capped = false;
  let it = 0;
  for (; it < maxIter && res > tol; it++) {
    if (work + unit > maxWork) {
      capped = true;
      break;
    }
    normalEquations(sys, support, re, im, Fr, Fi, Jr, Ji, Mr, Mi, y0r, y0i);
    work += unit;
    if (!solveNormal(n, Mr, Mi, y0r, y0i, Lr, Li, yr, yi)) break;
    // step, halved until it stays in the upper half-plane and the residual does not grow much
    let alpha = 1;
    let accepted = false;
    for (let h = 0; h < 30; h++) {
      let ok = true;
      for (let t = 0; t < n; t++) {
        tre[t] = re[t]! + alpha * yr[t]!;
        tim[t] = im[t]! + alpha * yi[t]!;
        if (!(tim[t]! > 0) || !Number.isFinite(tre[t]!)) ok = false;
      }
      if (ok) {
        const r2 = residuals(sys, tre, tim, tFr, tFi);
        if (r2 < res * 1.5 || r2 < tol) {
          re.set(tre);
          im.set(tim);
          Fr.set(tFr);
          Fi.set(tFi);
          res = r2;
          accepted = true;
          break;
        }
      }
      alpha /= 2;
    }
    if (!accepted) break;
  }
  return { re, im, residual: res, iterations: it, converged: res <= tol, work, capped: capped && res > tol };
}

const sumSquares = (a: Float64Array, b: Float64Array): number => {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i]! * a[i]! + b[i]! * b[i]!;
  return s;
};

/**
 * Levenberg–Marquardt on the same equations with no half-plane constraint (Levenberg 1944; Marquardt,
 * SIAM J. Appl. Math. 11, 1963): shapes may cross the real axis away from 0 and 1 (negatively
 * oriented tetrahedra). Each argument is continued along the iteration (the branch nearest its
 * previous value), so a solution satisfies the equations in product form and in this continued log
 * form, not necessarily with principal arguments; `flip.ts` and the final check in the half-plane
 * decide what it is worth. Steps are accepted only when Σ|F|² decreases.
 */
export function solveShapesFree(sys: EquationSystem, startRe: Float64Array, startIm: Float64Array, tol = 1e-13, maxIter = 60, maxWork = Infinity): NewtonResult {
  const { n, rows } = sys;
  const re = Float64Array.from(startRe);
  const im = Float64Array.from(startIm);
  const args = { z: new Float64Array(n), w: new Float64Array(n) };
  for (let t = 0; t < n; t++) {
    args.z[t] = Math.atan2(im[t]!, re[t]!);
    args.w[t] = Math.atan2(-im[t]!, 1 - re[t]!);
  }
  const trial = { z: new Float64Array(n), w: new Float64Array(n) };
  const { Fr, Fi, Jr, Ji, Mr, Mi, yr, yi, y0r, y0i, tre, tim, tFr, tFi, Lr, Li } = workspace(n, rows);
  let res = residuals(sys, re, im, Fr, Fi, args);
  let ss = sumSquares(Fr, Fi);
  const M0 = new Float64Array(n * n);
  const M1 = new Float64Array(n * n);
  const support = rowSupports(sys);
  let lambda = 1e-3;
  const unit = (n * n * n) / 6;
  let work = 0;
  let capped = false;
  let it = 0;
  for (; it < maxIter && res > tol && !capped; it++) {
    normalEquations(sys, support, re, im, Fr, Fi, Jr, Ji, M0, M1, y0r, y0i);
    let accepted = false;
    for (let h = 0; h < 12 && !accepted; h++) {
      if (work + unit > maxWork) {
        capped = true;
        break;
      }
      work += unit;
      Mr.set(M0);
      Mi.set(M1);
      for (let p = 0; p < n; p++) Mr[p * n + p] = M0[p * n + p]! * (1 + lambda);
      if (!solveNormal(n, Mr, Mi, y0r, y0i, Lr, Li, yr, yi)) {
        lambda *= 10;
        continue;
      }
      let ok = true;
      for (let t = 0; t < n && ok; t++) {
        tre[t] = re[t]! + yr[t]!;
        tim[t] = im[t]! + yi[t]!;
        if (!Number.isFinite(tre[t]!) || !Number.isFinite(tim[t]!) || Math.hypot(tre[t]!, tim[t]!) < 1e-9 || Math.hypot(1 - tre[t]!, tim[t]!) < 1e-9) ok = false;
      }
      if (ok) {
        trial.z.set(args.z);
        trial.w.set(args.w);
        const r2 = residuals(sys, tre, tim, tFr, tFi, trial);
        const s2 = sumSquares(tFr, tFi);
        if (s2 < ss || r2 < tol) {
          re.set(tre);
          im.set(tim);
          Fr.set(tFr);
          Fi.set(tFi);
          args.z.set(trial.z);
          args.w.set(trial.w);
          res = r2;
          ss = s2;
          lambda = Math.max(lambda / 10, 1e-12);
          accepted = true;
          break;
        }
      }
      lambda *= 10;
    }
    if (!accepted) break;
  }
  return { re, im, residual: res, iterations: it, converged: res <= tol, work, capped: capped && res > tol };
}
