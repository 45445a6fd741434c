/**
 * Levine–Tristram signatures σ_ω = sign((1 − ω)V + (1 − ω̄)Vᵀ) for a unit complex ω = e^{2πix}
 * (J. Levine, "Knot cobordism groups in codimension two", Comment. Math. Helv. 44 (1969);
 * A. G. Tristram, "Some cobordism invariants for links", Proc. Cambridge Philos. Soc. 66 (1969)).
 * The points where σ_ω can jump (roots of Δ on |z| = 1) and σ_ω away from them: jumps.ts.
 *
 * At x = 1/2 (ω = −1) the matrix is 2(V + Vᵀ) and the signature is computed exactly. Elsewhere
 * the Hermitian matrix H = A + iB is embedded as the real symmetric [[A, −B], [B, A]] (each
 * eigenvalue of H appears twice); its inertia is counted by Householder tridiagonalisation and
 * Sturm sequences (sturm.ts; Golub & Van Loan, "Matrix Computations", §8.3–8.4); eigenvalues with |λ| ≤ 1e-9·max(1, ‖H‖_F) count as zero. Near a
 * root of Δ the form degenerates; the result is reliable when x is farther than about 1e-6 from
 * every jump point.
 */
import { symmetricSignature } from './exact.ts';
import { symmetricInertiaFloat } from './sturm.ts';

export const LT_ZERO_TOLERANCE = 1e-9;

/** Eigenvalues of a real symmetric matrix by cyclic Jacobi rotations. */
export function symmetricEigenvalues(m: readonly (readonly number[])[]): number[] {
  const n = m.length;
  const a = m.map((r) => Float64Array.from(r));
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) off += a[i]![j]! * a[i]![j]!;
    if (off < 1e-30) break;
    for (let p = 0; p < n; p++)
      for (let q = p + 1; q < n; q++) {
        const apq = a[p]![q]!;
        if (Math.abs(apq) < 1e-300) continue;
        const theta = (a[q]![q]! - a[p]![p]!) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k]![p]!;
          const akq = a[k]![q]!;
          a[k]![p] = c * akp - s * akq;
          a[k]![q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p]![k]!;
          const aqk = a[q]![k]!;
          a[p]![k] = c * apk - s * aqk;
          a[q]![k] = s * apk + c * aqk;
        }
      }
  }
  return a.map((r, i) => r[i]!);
}

/**
 * Inertia of the Hermitian form (1 − ω)V + (1 − ω̄)Vᵀ at ω = e^{2πix} (x not an integer), in
 * floating point: the real embedding's inertia (sturm.ts) is halved in count, |λ| ≤ 1e-9·max(1, ‖H‖_F)
 * counts as zero.
 */
export function hermitianInertia(V: readonly (readonly number[])[], x: number): { positive: number; negative: number; zero: number } {
  const m = V.length;
  if (m === 0) return { positive: 0, negative: 0, zero: 0 };
  const frac = x - Math.floor(x);
  const th = 2 * Math.PI * frac;
  const c = 1 - Math.cos(th);
  const s = Math.sin(th);
  // H = (1 − ω)V + (1 − ω̄)Vᵀ: real part c(V + Vᵀ), imaginary part s(Vᵀ − V)
  const n = 2 * m;
  const big = new Float64Array(n * n);
  let fro = 0;
  for (let i = 0; i < m; i++)
    for (let j = 0; j < m; j++) {
      const A = c * (V[i]![j]! + V[j]![i]!);
      const B = s * (V[j]![i]! - V[i]![j]!);
      fro += A * A + B * B;
      big[i * n + j] = A;
      big[(i + m) * n + j + m] = A;
      big[i * n + j + m] = -B;
      big[(i + m) * n + j] = B;
    }
  const tol = LT_ZERO_TOLERANCE * Math.max(1, Math.sqrt(fro));
  const { positive, negative, zero } = symmetricInertiaFloat(big, n, tol);
  return { positive: positive / 2, negative: negative / 2, zero: zero / 2 };
}

/** σ_ω for ω = e^{2πix}, x ∈ [0, 1], from a Seifert matrix (floating point away from ω = −1; see `levineTristramAt`). */
export function levineTristram(V: readonly (readonly number[])[], x: number): number {
  if (!Number.isFinite(x)) throw new RangeError('levineTristram: x must be finite');
  const m = V.length;
  if (m === 0) return 0;
  const frac = x - Math.floor(x);
  if (frac === 0.5) return symmetricSignature(V.map((r, i) => r.map((v, j) => v + V[j]![i]!)));
  if (frac === 0) return 0;
  const h = hermitianInertia(V, x);
  return h.positive - h.negative;
}
