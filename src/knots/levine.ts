/**
 * Levine–Tristram signatures σ_ω = sign((1 − ω)V + (1 − ω̄)Vᵀ) for a unit complex ω = e^{2πix}
 * (J. Levine, "Knot cobordism groups in codimension two", Comment. Math. Helv. 44 (1969);
 * A. G. Tristram, "Some cobordism invariants for links", Proc. Cambridge Philos. Soc. 66 (1969)),
 * and the points of the circle where σ_ω can jump: the roots of Δ on |z| = 1.
 *
 * At x = 1/2 (ω = −1) the matrix is 2(V + Vᵀ) and the signature is computed exactly. Elsewhere
 * the Hermitian matrix H = A + iB is embedded as the real symmetric [[A, −B], [B, A]] (each
 * eigenvalue of H appears twice) and diagonalised by cyclic Jacobi rotations (Golub & Van Loan,
 * "Matrix Computations", §8.5); eigenvalues with |λ| ≤ 1e-9·max(1, ‖H‖_F) count as zero. Near a
 * root of Δ the form degenerates; the result is reliable when x is farther than about 1e-6 from
 * every jump point.
 */
import { symmetricSignature } from './exact.ts';
import type { LaurentPolynomial } from './poly.ts';

export const LT_ZERO_TOLERANCE = 1e-9;
export const UNIT_CIRCLE_TOLERANCE = 1e-6;

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

/** σ_ω for ω = e^{2πix}, x ∈ [0, 1], from a Seifert matrix. */
export function levineTristram(V: readonly (readonly number[])[], x: number): number {
  if (!Number.isFinite(x)) throw new RangeError('levineTristram: x must be finite');
  const m = V.length;
  if (m === 0) return 0;
  const frac = x - Math.floor(x);
  if (frac === 0.5) return symmetricSignature(V.map((r, i) => r.map((v, j) => v + V[j]![i]!)));
  if (frac === 0) return 0;
  const th = 2 * Math.PI * frac;
  const c = 1 - Math.cos(th);
  const s = Math.sin(th);
  // H = (1 − ω)V + (1 − ω̄)Vᵀ: real part c(V + Vᵀ), imaginary part s(Vᵀ − V)
  const big: number[][] = Array.from({ length: 2 * m }, () => new Array<number>(2 * m).fill(0));
  let fro = 0;
  for (let i = 0; i < m; i++)
    for (let j = 0; j < m; j++) {
      const A = c * (V[i]![j]! + V[j]![i]!);
      const B = s * (V[j]![i]! - V[i]![j]!);
      fro += A * A + B * B;
      big[i]![j] = A;
      big[i + m]![j + m] = A;
      big[i]![j + m] = -B;
      big[i + m]![j] = B;
    }
  const tol = LT_ZERO_TOLERANCE * Math.max(1, Math.sqrt(fro));
  let sig = 0;
  for (const l of symmetricEigenvalues(big)) sig += l > tol ? 1 : l < -tol ? -1 : 0;
  return sig / 2;
}

/**
 * Roots of an ordinary polynomial (coefficients lowest first) by the Aberth–Ehrlich iteration
 * (O. Aberth, Math. Comp. 27 (1973)), returned as [re, im] pairs.
 */
export function polynomialRoots(coeffs: readonly number[]): Array<[number, number]> {
  let c = coeffs.slice();
  while (c.length > 0 && c[c.length - 1] === 0) c.pop();
  let zeroRoots = 0;
  while (c.length > 1 && c[0] === 0) {
    c = c.slice(1);
    zeroRoots++;
  }
  const deg = c.length - 1;
  const roots: Array<[number, number]> = [];
  for (let k = 0; k < zeroRoots; k++) roots.push([0, 0]);
  if (deg < 1) return roots;
  const lead = c[deg]!;
  const a = c.map((x) => x / lead);
  const radius = 1 + Math.max(...a.slice(0, deg).map(Math.abs));
  const zr = new Float64Array(deg);
  const zi = new Float64Array(deg);
  for (let k = 0; k < deg; k++) {
    const ang = (2 * Math.PI * k) / deg + 0.4;
    zr[k] = Math.min(radius, 1.3) * Math.cos(ang);
    zi[k] = Math.min(radius, 1.3) * Math.sin(ang);
  }
  for (let it = 0; it < 500; it++) {
    let maxStep = 0;
    for (let k = 0; k < deg; k++) {
      // p and p' by Horner
      let pr = 1, pi = 0, dr = 0, di = 0;
      for (let j = deg - 1; j >= 0; j--) {
        const ndr = dr * zr[k]! - di * zi[k]! + pr;
        const ndi = dr * zi[k]! + di * zr[k]! + pi;
        dr = ndr;
        di = ndi;
        const npr = pr * zr[k]! - pi * zi[k]! + a[j]!;
        const npi = pr * zi[k]! + pi * zr[k]!;
        pr = npr;
        pi = npi;
      }
      // ratio = p/p'
      const dd = dr * dr + di * di;
      if (dd === 0) continue;
      const rr = (pr * dr + pi * di) / dd;
      const ri = (pi * dr - pr * di) / dd;
      // sum 1/(z_k - z_j)
      let sr = 0, si = 0;
      for (let j = 0; j < deg; j++) {
        if (j === k) continue;
        const xr = zr[k]! - zr[j]!;
        const xi = zi[k]! - zi[j]!;
        const xx = xr * xr + xi * xi;
        if (xx === 0) continue;
        sr += xr / xx;
        si += -xi / xx;
      }
      // w = ratio / (1 - ratio * s)
      const denr = 1 - (rr * sr - ri * si);
      const deni = -(rr * si + ri * sr);
      const den = denr * denr + deni * deni;
      if (den === 0) continue;
      const wr = (rr * denr + ri * deni) / den;
      const wi = (ri * denr - rr * deni) / den;
      zr[k] = zr[k]! - wr;
      zi[k] = zi[k]! - wi;
      maxStep = Math.max(maxStep, Math.hypot(wr, wi));
    }
    if (maxStep < 1e-15) break;
  }
  for (let k = 0; k < deg; k++) roots.push([zr[k]!, zi[k]!]);
  return roots;
}

/**
 * Jump points of the Levine–Tristram signature on the upper half circle: the x ∈ (0, 1/2] with
 * Δ(e^{2πix}) = 0 (roots with ||z| − 1| < 1e-6), sorted, each listed once per root found
 * (a repeated root appears repeatedly). The jumps at 1 − x mirror them.
 */
export function alexanderUnitRoots(p: LaurentPolynomial): number[] {
  const c = p.coefficients.map(Number); // the roots are floating-point approximations anyway
  if (c.length <= 1) return [];
  const xs: number[] = [];
  for (const [re, im] of polynomialRoots(c)) {
    const r = Math.hypot(re, im);
    if (Math.abs(r - 1) > UNIT_CIRCLE_TOLERANCE * 10) continue;
    let x = Math.atan2(im, re) / (2 * Math.PI);
    if (x < 0) x += 1;
    if (x > 0.5 + 1e-9 || x < 1e-9) continue;
    xs.push(Math.round(x * 1e9) / 1e9);
  }
  return xs.sort((a, b) => a - b);
}
