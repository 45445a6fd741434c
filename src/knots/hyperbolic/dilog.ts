/**
 * Bloch–Wigner dilogarithm D(z) = Im Li₂(z) + arg(1 − z)·log|z| (D. Zagier, "The dilogarithm
 * function", in Frontiers in Number Theory, Physics and Geometry II, 2007, §I.3): the volume of
 * the ideal tetrahedron with shape z is D(z) when Im z > 0 (Milnor, "Hyperbolic geometry: the first
 * 150 years", Bull. AMS 6, 1982).
 *
 * Evaluation: the six-fold symmetry D(z) = D(1 − 1/z) = D(1/(1 − z)) = −D(1/z) = −D(1 − z) =
 * −D(z/(z − 1)) moves z into |z| ≤ 1, Re z ≤ 1/2, where Li₂(z) = Σ B_k u^{k+1}/(k+1)! with
 * u = −log(1 − z) (|u| < 1.1 there, far inside the radius 2π) converges to float64 in ~20 terms.
 * D is 0 on the real line; D(i) = Catalan's constant; D(e^{iπ/3}) = 1.0149416064096536…
 * @example blochWigner(0, 1) // 0.915965594177219… (Catalan's constant)
 */

// Bernoulli numbers B_1..B_36 (B_1 = −1/2, odd ones past B_1 vanish).
const BERNOULLI: number[] = [
  -1 / 2, 1 / 6, 0, -1 / 30, 0, 1 / 42, 0, -1 / 30, 0, 5 / 66, 0, -691 / 2730, 0, 7 / 6, 0, -3617 / 510, 0, 43867 / 798, 0, -174611 / 330, 0,
  854513 / 138, 0, -236364091 / 2730, 0, 8553103 / 6, 0, -23749461029 / 870, 0, 8615841276005 / 14322, 0, -7709321041217 / 510, 0,
  2577687858367 / 6,
];
// coefficient B_k / (k+1)! for u^{k+1}, k = 0.. with B_0 = 1
const COEF: number[] = (() => {
  const c = [1];
  let fact = 1;
  for (let k = 1; k <= BERNOULLI.length; k++) {
    fact *= k + 1;
    c.push(BERNOULLI[k - 1]! / fact);
  }
  return c;
})();

/** Im Li₂(z) for |z| ≤ 1, Re z ≤ 1/2 by the Bernoulli series in u = −log(1 − z). */
function imLi2Reduced(x: number, y: number): number {
  // u = −log(1 − z)
  const ax = 1 - x;
  const ay = -y;
  const ur = -0.5 * Math.log(ax * ax + ay * ay);
  const ui = -Math.atan2(ay, ax);
  // Σ COEF[k] u^{k+1}
  let pr = ur;
  let pi = ui;
  let sr = 0;
  let si = 0;
  for (let k = 0; k < COEF.length; k++) {
    const c = COEF[k]!;
    if (c !== 0) {
      sr += c * pr;
      si += c * pi;
    }
    const nr = pr * ur - pi * ui;
    pi = pr * ui + pi * ur;
    pr = nr;
    if (Math.abs(pr) + Math.abs(pi) < 1e-300) break;
  }
  void sr;
  return si;
}

function dReduced(x: number, y: number): number {
  const arg1mz = Math.atan2(-y, 1 - x);
  return imLi2Reduced(x, y) + arg1mz * 0.5 * Math.log(x * x + y * y);
}

/** Bloch–Wigner D(x + iy). */
export function blochWigner(x: number, y: number): number {
  if (y === 0) return 0;
  // candidates: z, 1 − 1/z, 1/(1 − z) (sign +) and 1/z, 1 − z, z/(z − 1) (sign −); pick the one in |w| ≤ 1, Re w ≤ 1/2
  const m2 = x * x + y * y;
  const cand: Array<[number, number, number]> = [];
  cand.push([x, y, 1]);
  cand.push([1 - x / m2, y / m2, 1]); // 1 − 1/z
  const d = (1 - x) * (1 - x) + y * y;
  cand.push([(1 - x) / d, y / d, 1]); // 1/(1 − z)
  cand.push([x / m2, -y / m2, -1]); // 1/z
  cand.push([1 - x, -y, -1]); // 1 − z
  // z/(z − 1)
  const e = (x - 1) * (x - 1) + y * y;
  cand.push([(x * (x - 1) + y * y) / e, (y * (x - 1) - x * y) / e, -1]);
  let best = cand[0]!;
  let bestScore = Infinity;
  for (const c of cand) {
    const mod = Math.hypot(c[0], c[1]);
    if (c[0] <= 0.5 + 1e-12 && mod <= 1 + 1e-12) {
      const score = Math.abs(-Math.log(Math.hypot(1 - c[0], c[1]))) + Math.abs(Math.atan2(-c[1], 1 - c[0]));
      if (score < bestScore) {
        bestScore = score;
        best = c;
      }
    }
  }
  return best[2] * dReduced(best[0], best[1]);
}
