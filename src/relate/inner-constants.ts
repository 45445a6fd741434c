/**
 * Numeric constants inside functions (exp(α·u), log(u + β), …) fitted by Levenberg–Marquardt
 * (K. Levenberg, Q. Appl. Math. 2, 1944; D. W. Marquardt, J. SIAM 11, 1963) on the variable-
 * projection residual: for each value of the inner constants θ the linear coefficients are solved
 * by least squares, so only θ is iterated (G. H. Golub & V. Pereyra, SIAM J. Numer. Anal. 10, 1973).
 * Step: (JᵀJ + λ·diag JᵀJ) δ = −Jᵀr with J by forward differences; λ is divided by 3 after a step
 * that lowers the RSS and multiplied by 4 otherwise (Nocedal & Wright, "Numerical Optimization",
 * 2nd ed., §10.3). Standard errors from σ̂²(JᵀJ)⁻¹ at the optimum (the profiled Jacobian gives the
 * asymptotic covariance of θ; Golub & Pereyra 1973), then each constant becomes the simplest
 * rational inside its 95% interval (denominator ≤ 100), or keeps 6 significant digits. Each
 * constant stays within a factor 4 of its starting value: a step that leaves that range is refused.
 */
import { constantsOf, evaluateTree, withConstants, type Tree } from './tree.ts';
import { simplestRational } from './rational.ts';

export interface InnerFit {
  terms: Tree[];
  /** Constants before rounding, their standard errors, and the values used (rounded). */
  estimates: number[];
  se: number[];
  used: number[];
  iterations: number;
  rss: number;
}

/** y minus its least-squares fit on [1, cols], by modified Gram–Schmidt on the centred columns (Björck 1967); null when a value is not finite. */
export function residualVector(cols: Float64Array[], y: Float64Array): Float64Array | null {
  const n = y.length;
  let m = 0;
  for (let i = 0; i < n; i++) m += y[i]!;
  m /= n;
  const r = Float64Array.from(y, (x) => x - m);
  const Q: Float64Array[] = [];
  for (const c of cols) {
    let cm = 0;
    for (let i = 0; i < n; i++) { if (!Number.isFinite(c[i]!)) return null; cm += c[i]!; }
    cm /= n;
    const q = Float64Array.from(c, (x) => x - cm);
    for (const p of Q) {
      let d = 0;
      for (let i = 0; i < n; i++) d += p[i]! * q[i]!;
      for (let i = 0; i < n; i++) q[i] = q[i]! - d * p[i]!;
    }
    let nn = 0;
    for (let i = 0; i < n; i++) nn += q[i]! * q[i]!;
    if (!(nn > 1e-20)) continue;
    const f = 1 / Math.sqrt(nn);
    for (let i = 0; i < n; i++) q[i] = q[i]! * f;
    Q.push(q);
  }
  for (const p of Q) {
    let d = 0;
    for (let i = 0; i < n; i++) d += p[i]! * r[i]!;
    for (let i = 0; i < n; i++) r[i] = r[i]! - d * p[i]!;
  }
  return r;
}

/** Solve the small symmetric positive system A x = b (Gaussian elimination with partial pivoting). */
function solve(A: number[][], b: number[]): number[] | null {
  const p = b.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < p; c++) {
    let piv = c;
    for (let r = c + 1; r < p; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[piv]![c]!)) piv = r;
    if (!(Math.abs(M[piv]![c]!) > 1e-300)) return null;
    [M[c], M[piv]] = [M[piv]!, M[c]!];
    for (let r = c + 1; r < p; r++) {
      const f = M[r]![c]! / M[c]![c]!;
      for (let k = c; k <= p; k++) M[r]![k] = M[r]![k]! - f * M[c]![k]!;
    }
  }
  const x = new Array<number>(p).fill(0);
  for (let c = p - 1; c >= 0; c--) {
    let v = M[c]![p]!;
    for (let k = c + 1; k < p; k++) v -= M[c]![k]! * x[k]!;
    x[c] = v / M[c]![c]!;
  }
  return x;
}

/**
 * Fit the numeric constants of `terms` (all of them, in order) for y ≈ c₀ + Σ cⱼ·termⱼ on `rows`.
 * Returns null when no term has a constant or the fit fails.
 * @example fitInnerConstants([exp(scale(-1, a^2))], bases, rows, y) // α → −1/2 for y = exp(−a²/2)
 */
export function fitInnerConstants(terms: Tree[], bases: Float64Array[], rows: ArrayLike<number>, y: Float64Array, maxIter = 25): InnerFit | null {
  const counts = terms.map((t) => constantsOf(t).length);
  const theta0 = terms.flatMap((t) => constantsOf(t));
  const P = theta0.length;
  if (P === 0 || P > 3) return null;
  const split = (th: number[]): Tree[] => {
    let k = 0;
    return terms.map((t, j) => {
      const cs = th.slice(k, k + counts[j]!);
      k += counts[j]!;
      return counts[j] ? withConstants(t, cs) : t;
    });
  };
  const resid = (th: number[]): Float64Array | null => residualVector(split(th).map((t) => evaluateTree(t, bases, rows)), y);
  const ss = (r: Float64Array): number => r.reduce((s, x) => s + x * x, 0);
  // each constant stays within a factor 4 of the grammar's constant it started from (same sign):
  // outside, a function degenerates into its Taylor polynomial (cos(εx) with huge coefficients)
  const inRange = (th: number[]): boolean => th.every((v, k) => {
    const q = v / theta0[k]!;
    return theta0[k] === 0 || (q >= 0.25 && q <= 4);
  });
  let theta = theta0.slice();
  let r = resid(theta);
  if (!r) return null;
  let rss = ss(r);
  let lambda = 1e-3;
  let iterations = 0;
  let JtJ: number[][] = [];
  const jacobian = (th: number[], r0: Float64Array): Float64Array[] | null => {
    const J: Float64Array[] = [];
    for (let k = 0; k < P; k++) {
      const h = 1e-6 * Math.max(Math.abs(th[k]!), 1e-2);
      const t2 = th.slice();
      t2[k] = t2[k]! + h;
      const r2 = resid(t2);
      if (!r2) return null;
      J.push(Float64Array.from(r2, (x, i) => (x - r0[i]!) / h));
    }
    return J;
  };
  for (; iterations < maxIter; iterations++) {
    const J = jacobian(theta, r);
    if (!J) break;
    JtJ = J.map((a) => J.map((b) => a.reduce((s, x, i) => s + x * b[i]!, 0)));
    const g = J.map((a) => a.reduce((s, x, i) => s + x * r![i]!, 0));
    let improved = false;
    for (let tries = 0; tries < 8; tries++) {
      const A = JtJ.map((row, i) => row.map((v, j) => (i === j ? v * (1 + lambda) + 1e-300 : v)));
      const step = solve(A, g.map((v) => -v));
      if (!step) { lambda *= 4; continue; }
      const cand = theta.map((v, k) => v + step[k]!);
      const r2 = inRange(cand) ? resid(cand) : null;
      const rss2 = r2 ? ss(r2) : Infinity;
      if (rss2 < rss) {
        const rel = (rss - rss2) / Math.max(rss, 1e-300);
        theta = cand; r = r2!; rss = rss2; lambda = Math.max(lambda / 3, 1e-12);
        improved = true;
        if (rel < 1e-10) iterations = maxIter;
        break;
      }
      lambda *= 4;
    }
    if (!improved) break;
  }
  const n = y.length;
  const nLinear = terms.length + 1;
  const dof = Math.max(n - nLinear - P, 1);
  const sigma2 = rss / dof;
  const Jf = jacobian(theta, r);
  if (Jf) JtJ = Jf.map((a) => Jf.map((b) => a.reduce((s, x, i) => s + x * b[i]!, 0)));
  const se = theta.map((_, k) => {
    const e = new Array<number>(P).fill(0);
    e[k] = 1;
    const col = JtJ.length === P ? solve(JtJ, e) : null;
    return col ? Math.sqrt(Math.max(sigma2 * col[k]!, 0)) : NaN;
  });
  const used = theta.map((v, k) => {
    const half = 1.96 * se[k]!;
    const q = Number.isFinite(half) ? simplestRational(v - half, v + half, 100) : null;
    return q && q.num !== 0 ? q.num / q.den : Number(v.toPrecision(6));
  });
  const final = split(used);
  const rf = resid(used);
  return { terms: final, estimates: theta, se, used, iterations, rss: rf ? ss(rf) : NaN };
}
