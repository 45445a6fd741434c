/**
 * Inertia of a real symmetric matrix in floating point without its eigenvalues: Householder
 * reduction to a tridiagonal T = QᵀAQ (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 8.3.1),
 * then Sturm counts on T — the number of eigenvalues below x is the number of negative pivots of
 * the LDLᵀ factorisation of T − xI (ibid. §8.4.1; Wilkinson, "The Algebraic Eigenvalue Problem",
 * §5.37). About 4n³/3 flops instead of the 10–20n³ of cyclic Jacobi, with the same counts: an
 * eigenvalue in (−tol, tol) is counted as zero.
 */

/** Counts of eigenvalues > tol, < −tol and in [−tol, tol] of the symmetric n×n `a` (row-major; overwritten). */
export function symmetricInertiaFloat(a: Float64Array, n: number, tol: number): { positive: number; negative: number; zero: number } {
  const v = new Float64Array(n);
  const p = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    let xx = 0;
    for (let i = k + 1; i < n; i++) xx += a[i * n + k]! * a[i * n + k]!;
    if (xx === 0) continue;
    const x0 = a[(k + 1) * n + k]!;
    const alpha = x0 >= 0 ? -Math.sqrt(xx) : Math.sqrt(xx);
    for (let i = k + 1; i < n; i++) v[i] = a[i * n + k]!;
    v[k + 1] = x0 - alpha;
    const vv = xx - x0 * x0 + v[k + 1]! * v[k + 1]!;
    if (vv === 0) continue;
    const beta = 2 / vv;
    // p = β·A₂₂v, K = β·vᵀp/2, w = p − Kv, A₂₂ ← A₂₂ − vwᵀ − wvᵀ
    let vp = 0;
    for (let i = k + 1; i < n; i++) {
      let s = 0;
      for (let j = k + 1; j < n; j++) s += a[i * n + j]! * v[j]!;
      p[i] = beta * s;
      vp += v[i]! * p[i]!;
    }
    const K = (beta * vp) / 2;
    for (let i = k + 1; i < n; i++) p[i] = p[i]! - K * v[i]!;
    for (let i = k + 1; i < n; i++)
      for (let j = k + 1; j < n; j++) a[i * n + j] = a[i * n + j]! - v[i]! * p[j]! - p[i]! * v[j]!;
    a[(k + 1) * n + k] = alpha;
    a[k * n + k + 1] = alpha;
    for (let i = k + 2; i < n; i++) a[i * n + k] = a[k * n + i] = 0;
  }
  const below = (x: number): number => {
    let count = 0;
    let d = 1;
    for (let i = 0; i < n; i++) {
      const b = i > 0 ? a[i * n + i - 1]! : 0;
      d = a[i * n + i]! - x - (i > 0 ? (b * b) / d : 0);
      if (d === 0) d = -Number.EPSILON * (Math.abs(x) + Math.abs(b) + 1); // Sturm convention: a zero pivot counts as −ε
      if (d < 0) count++;
    }
    return count;
  };
  const negative = below(-tol);
  const notPositive = below(tol);
  return { positive: n - notPositive, negative, zero: notPositive - negative };
}
