/** Test helper: how far shapes are from solving Thurston's equations, read in product form. */
import { combinatorics, type Triangulation } from '../../../src/knots/hyperbolic/triangulation.ts';
import { cuspBases } from '../../../src/knots/hyperbolic/cusp.ts';
import { gluingEquations } from '../../../src/knots/hyperbolic/equations.ts';

/**
 * Largest residual of the gluing and completeness equations in product form (arguments mod 2π):
 * Π z^a (1 − z)^b = ±1 read as log-moduli summing to 0 and arguments to cπ (Thurston 1979, ch. 4),
 * independent of the branch of the logarithm the solver used.
 */
export function productResidual(tri: Triangulation, re: Float64Array, im: Float64Array): number {
  const cb = combinatorics(tri);
  const sys = gluingEquations(tri, cb, cuspBases(tri, cb).flat());
  let worst = 0;
  for (let r = 0; r < sys.rows; r++) {
    let sr = 0;
    let si = -Math.PI * sys.c[r]!;
    for (let t = 0; t < sys.n; t++) {
      const a = sys.A[r * sys.n + t]!;
      const b = sys.B[r * sys.n + t]!;
      sr += a * Math.log(Math.hypot(re[t]!, im[t]!)) + b * Math.log(Math.hypot(1 - re[t]!, im[t]!));
      si += a * Math.atan2(im[t]!, re[t]!) + b * Math.atan2(-im[t]!, 1 - re[t]!);
    }
    si -= 2 * Math.PI * Math.round(si / (2 * Math.PI));
    worst = Math.max(worst, Math.abs(sr), Math.abs(si));
  }
  return worst;
}
