import { tightestEnvelope } from './envelope.ts';
import { topK } from './topk.ts';

/** The tightest affine bound lhs ≤ c·rhs + d (lower form: ≥) on the rows used. */
export interface AffineEnvelope {
  form: 'upper' | 'lower';
  /** c */
  slope: number;
  /** d */
  offset: number;
  /** Mean |c·rhs + d − lhs| over the rows: the average gap the envelope minimises. */
  meanGap: number;
  /** 0-based rows where the bound is closest to equality, smallest gap first. */
  witnessRows: Int32Array;
  /** The slope hit the search box (the data ask for an ever steeper line: a vertical edge). */
  atLimit: boolean;
}

/**
 * lhs ≤ c·rhs + d on every row with the line lowest at the mean of rhs: the upper-hull edge of the
 * points (rhs, lhs) over their mean (lower form: the lower-hull edge), i.e. the smallest c for the
 * fitted d and the smallest d for that c at once. Exact, by the envelope linear program
 * (tightestEnvelope, revised simplex on the dual). The slope box is 10⁶ times lhs's spread over
 * rhs's spread, far beyond any hull edge of well-scaled data; `atLimit` says when it binds.
 * @example affineEnvelope(Float64Array.of(1, 2, 2.5), Float64Array.of(0, 1, 3), Int32Array.of(0, 1, 2), true, 1)
 * // slope 0.25, offset 1.75, witness row 1 or 2 (gap 0)
 */
export function affineEnvelope(lhs: Float64Array, rhs: Float64Array, rows: Int32Array, upper: boolean, top: number): AffineEnvelope {
  const spread = (a: Float64Array) => {
    let lo = Infinity;
    let hi = -Infinity;
    for (let t = 0; t < rows.length; t++) {
      lo = Math.min(lo, a[rows[t]!]!);
      hi = Math.max(hi, a[rows[t]!]!);
    }
    return hi - lo;
  };
  const sl = spread(lhs) || 1;
  const sr = spread(rhs) || 1;
  const env = tightestEnvelope(lhs, [rhs], rows, { upper, maxSlope: (1e6 * sl) / sr });
  const c = env.slopes[0]!;
  const d = env.intercept;
  const closeness = new Float64Array(lhs.length);
  for (let t = 0; t < rows.length; t++) {
    const r = rows[t]!;
    closeness[r] = -(upper ? c * rhs[r]! + d - lhs[r]! : lhs[r]! - c * rhs[r]! - d);
  }
  return { form: upper ? 'upper' : 'lower', slope: c, offset: d, meanGap: env.meanGap, witnessRows: topK(closeness, rows, top, true), atLimit: env.atLimit[0]! };
}
