/**
 * Thurston's gluing and completeness equations in logarithmic form (Thurston, "The geometry and
 * topology of 3-manifolds", 1979, §4.2–4.4; Neumann & Zagier, "Volumes of hyperbolic
 * three-manifolds", Topology 24, 1985). With one shape z per tetrahedron (on edges 01 and 23),
 * log z′ = −Log(1 − z) and log z″ = Log(1 − z) − Log z + iπ for Im z > 0, so every equation reads
 *   Σ_t A_t·Log z_t + B_t·Log(1 − z_t) = iπ·c
 * with integers A, B, c: around each edge the shapes' logarithms add up to 2πi; along each of two
 * curves generating a cusp's homology the signed logarithms of the cut-off corners add up to 0
 * (the cusp is Euclidean: completeness).
 */
import { cutCorner, type Passage } from './cusp.ts';
import { EDGE_SHAPE, type Combinatorics, type Triangulation } from './triangulation.ts';

export interface EquationSystem {
  rows: number;
  n: number;
  /** Row-major rows × n. */
  A: Float64Array;
  B: Float64Array;
  /** Right-hand side iπ·c. */
  c: Float64Array;
}

class RowBuilder {
  A: number[] = [];
  B: number[] = [];
  c: number[] = [];
  rows = 0;
  constructor(private n: number) {}
  add(terms: Array<{ t: number; shape: number; coef: number }>, target: number): void {
    const a = new Array<number>(this.n).fill(0);
    const b = new Array<number>(this.n).fill(0);
    let c = target;
    for (const { t, shape, coef } of terms) {
      if (shape === 0) a[t]! += coef;
      else if (shape === 1) b[t]! -= coef;
      else {
        b[t]! += coef;
        a[t]! -= coef;
        c -= coef;
      }
    }
    this.A.push(...a);
    this.B.push(...b);
    this.c.push(c);
    this.rows++;
  }
}

/** Shape-log terms of a normal curve's holonomy derivative. */
export function curveTerms(curve: readonly Passage[]): Array<{ t: number; shape: number; coef: number }> {
  return curve.map((p) => {
    const cc = cutCorner(p);
    return { t: p.t, shape: cc.shape, coef: cc.sign };
  });
}

/** Edge equations (all of them) and the completeness equations of the given curves. */
export function gluingEquations(tri: Triangulation, cb: Combinatorics, curves: readonly (readonly Passage[])[]): EquationSystem {
  const rb = new RowBuilder(tri.n);
  const terms: Array<Array<{ t: number; shape: number; coef: number }>> = Array.from({ length: cb.nEdges }, () => []);
  for (let t = 0; t < tri.n; t++) for (let k = 0; k < 6; k++) terms[cb.edgeOf[6 * t + k]!]!.push({ t, shape: EDGE_SHAPE[k]!, coef: 1 });
  for (const row of terms) rb.add(row, 2);
  for (const cv of curves) rb.add(curveTerms(cv), 0);
  return { rows: rb.rows, n: tri.n, A: Float64Array.from(rb.A), B: Float64Array.from(rb.B), c: Float64Array.from(rb.c) };
}
