import { studentTQuantile } from '../util/special.ts';

/** Straight-line least-squares fit y ≈ a + b·x with a two-sided interval for the slope b. */
export interface SlopeFit {
  slope: number;
  intercept: number;
  /** Two-sided interval for the slope at `level`, from Student's t with m − 2 degrees of freedom. */
  low: number;
  high: number;
  level: number;
  /** Standard error of the slope: sqrt(s² / Sxx) with s² = RSS / (m − 2). */
  stdError: number;
  points: number;
}

/**
 * Ordinary least squares of y on x with the slope's confidence interval b ± t₍₁₋α/₂, m−2₎·se(b),
 * se(b) = sqrt(RSS / ((m − 2)·Sxx)) (the textbook simple-regression interval, e.g. N. R. Draper &
 * H. Smith, Applied Regression Analysis, 3rd ed., §1.4). Centred sums avoid cancellation. Returns
 * null when m < 3 or all x are equal (no slope, or no interval, can be estimated).
 * @example slopeInterval([1, 2, 3], [2, 4, 6])?.slope // 2 (with low = high = 2: a perfect fit)
 */
export function slopeInterval(x: readonly number[], y: readonly number[], level = 0.95): SlopeFit | null {
  const m = x.length;
  if (m !== y.length) throw new RangeError('x and y differ in length');
  if (m < 3) return null;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < m; i++) {
    mx += x[i]!;
    my += y[i]!;
  }
  mx /= m;
  my /= m;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < m; i++) {
    const dx = x[i]! - mx;
    sxx += dx * dx;
    sxy += dx * (y[i]! - my);
  }
  if (!(sxx > 0)) return null;
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  let rss = 0;
  for (let i = 0; i < m; i++) {
    const r = y[i]! - intercept - slope * x[i]!;
    rss += r * r;
  }
  const stdError = Math.sqrt(rss / ((m - 2) * sxx));
  const t = studentTQuantile(1 - (1 - level) / 2, m - 2);
  return { slope, intercept, low: slope - t * stdError, high: slope + t * stdError, level, stdError, points: m };
}
