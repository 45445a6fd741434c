import { studentTQuantile } from '../util/special.ts';
/**
 * The difference of two estimates, each given with a symmetric-ish confidence interval, and the
 * interval of that difference: with half-widths h_A = (high_A − low_A)/2 and h_B likewise, the
 * difference B − A has half-width √(h_A² + h_B²) — the standard error of a difference of two
 * independent estimates, √(se_A² + se_B²), at the same level (Altman & Bland, "Interaction
 * revisited: the difference between two estimates", BMJ 326, 2003). Two runs on overlapping rows
 * are not independent (positively correlated), so the interval is then conservative (too wide).
 * The two are **consistent** when the interval of the difference contains 0.
 * @example differenceOf({ estimate: 3, low: 2.9, high: 3.1 }, { estimate: 3.003, low: 2.95, high: 3.05 })
 * // { difference: 0.003, low: ≈ −0.109, high: ≈ 0.115, consistent: true }
 */
export interface Estimate {
  estimate: number;
  low: number;
  high: number;
}

export interface Difference {
  /** B − A */
  difference: number;
  low: number;
  high: number;
  /** The interval of the difference contains 0 (or cannot be formed: then null). */
  consistent: boolean | null;
}

export function differenceOf(a: Estimate, b: Estimate): Difference {
  const d = b.estimate - a.estimate;
  const ha = (a.high - a.low) / 2;
  const hb = (b.high - b.low) / 2;
  const h = Math.hypot(ha, hb);
  if (!Number.isFinite(d) || !Number.isFinite(h)) return { difference: d, low: NaN, high: NaN, consistent: null };
  return { difference: d, low: d - h, high: d + h, consistent: d - h <= 0 && 0 <= d + h };
}

/**
 * A mean over repeats as an estimate with its Student-t interval: x̄ ± t_{(1+level)/2, R−1}·s/√R
 * (s the sample SD, n − 1 divisor). With one repeat the interval is undefined (NaN).
 * @example meanEstimate([1, 2, 3]).estimate // 2
 */
export function meanEstimate(values: readonly number[], level = 0.95): Estimate {
  const R = values.length;
  const m = values.reduce((a, b) => a + b, 0) / R;
  if (R < 2) return { estimate: m, low: NaN, high: NaN };
  const s = Math.sqrt(values.reduce((a, v) => a + (v - m) ** 2, 0) / (R - 1));
  const h = studentTQuantile((1 + level) / 2, R - 1) * (s / Math.sqrt(R));
  return { estimate: m, low: m - h, high: m + h };
}
