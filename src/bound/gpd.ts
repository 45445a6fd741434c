/**
 * Maximum-likelihood fit of the generalized Pareto law to exceedances y_1..y_k > 0 over a threshold,
 * G(y) = 1 − (1 + ξy/σ)^(−1/ξ) (J. Pickands, "Statistical inference using extreme order
 * statistics", Ann. Statist. 3, 1975), by Grimshaw's reduction to one variable θ = ξ/σ: for fixed θ
 * the likelihood is maximised at ξ(θ) = (1/k) Σ log(1 + θy_i), leaving the profile
 * ℓ*(θ) = −k log(ξ/θ) − (1/ξ + 1) Σ log(1 + θy_i) (S. D. Grimshaw, "Computing maximum likelihood
 * estimates for the generalized Pareto distribution", Technometrics 35, 1993). The shape is kept
 * ≥ −1, where the likelihood stops being bounded (R. L. Smith, Biometrika 72, 1985); θ → 0 is the
 * exponential law (σ = mean y). The maximum is found on a grid of θ·max(y) over (−1, 10⁶], refined
 * by golden sections.
 */

export interface GpdFit {
  /** ξ */
  shape: number;
  /** σ > 0 */
  scale: number;
  /** θ = ξ/σ (0 for the exponential law) */
  theta: number;
  logLik: number;
}

/** Profile log-likelihood ℓ*(θ) of exceedances `y` (all > 0), with ξ ≥ −1; −∞ outside 1 + θ·max(y) > 0. */
export function gpdProfileLogLik(y: Float64Array, theta: number): { logLik: number; shape: number; scale: number } {
  const k = y.length;
  let ymax = 0;
  let sum = 0;
  for (let i = 0; i < k; i++) {
    if (y[i]! > ymax) ymax = y[i]!;
    sum += y[i]!;
  }
  if (Math.abs(theta) * ymax < 1e-12) {
    const scale = sum / k; // exponential law: ξ = 0, σ = mean
    return { logLik: -k * Math.log(scale) - k, shape: 0, scale };
  }
  if (!(1 + theta * ymax > 0)) return { logLik: -Infinity, shape: NaN, scale: NaN };
  let S = 0;
  for (let i = 0; i < k; i++) S += Math.log1p(theta * y[i]!);
  const shape = Math.max(S / k, -1);
  const scale = shape / theta;
  return { logLik: -k * Math.log(scale) - (1 / shape + 1) * S, shape, scale };
}

/**
 * The ML fit of the generalized Pareto law to exceedances `y` (all > 0, at least 2).
 * @example fitGpd(Float64Array.of(1, 2, 3)).shape // < 0: three equally spaced points look bounded
 */
export function fitGpd(y: Float64Array): GpdFit {
  if (y.length < 2) throw new RangeError('fitGpd: at least 2 exceedances are needed');
  let ymax = 0;
  for (let i = 0; i < y.length; i++) ymax = Math.max(ymax, y[i]!);
  // φ = θ·ymax on a grid: −1/(1+s) for s log-spaced in [1e-6, 1e6], then 0, then log-spaced (1e-6, 1e6]
  const phis: number[] = [];
  for (let i = 0; i <= 240; i++) phis.push(-1 / (1 + 10 ** (-6 + (12 * i) / 240)));
  phis.push(0);
  for (let i = 0; i <= 120; i++) phis.push(10 ** (-6 + (12 * i) / 120));
  phis.sort((a, b) => a - b);
  const ll = (phi: number) => gpdProfileLogLik(y, phi / ymax).logLik;
  let bi = 0;
  let best = -Infinity;
  const vals = phis.map((p) => ll(p));
  vals.forEach((v, i) => {
    if (v > best) {
      best = v;
      bi = i;
    }
  });
  // golden-section refinement between the neighbours of the best grid point
  let a = phis[Math.max(0, bi - 1)]!;
  let b = phis[Math.min(phis.length - 1, bi + 1)]!;
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = ll(c);
  let fd = ll(d);
  for (let it = 0; it < 100 && b - a > 1e-13 * (1 + Math.abs(a)); it++) {
    if (fc >= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = ll(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = ll(d);
    }
  }
  let phi = fc >= fd ? c : d;
  if (Math.max(fc, fd) < best) phi = phis[bi]!;
  const theta = phi / ymax;
  const p = gpdProfileLogLik(y, theta);
  return { shape: p.shape, scale: p.scale, theta: Math.abs(theta) * ymax < 1e-12 ? 0 : theta, logLik: p.logLik };
}
