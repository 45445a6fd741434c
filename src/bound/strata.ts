/** One stratum of the rows by the value of `by`. */
export interface Stratum {
  /** Smallest and largest `by` in the stratum; strata never share a value. */
  low: number;
  high: number;
  /** Rows in the stratum. */
  n: number;
  /** Tightest constant inside the stratum: max ratio (upper form) or min ratio (lower form). */
  constant: number;
  /** Median of `by` in the stratum (Hyndman & Fan type 7), the point the trend is fitted at. */
  centre: number;
  /** 0-based table row attaining `constant` (the earliest such row). */
  witness: number;
}

/**
 * Splits `rows` into at most `bins` strata of equal count by rank of `by`, never splitting equal
 * values. The m rows sorted by `by` are cut one stratum at a time: with r strata still to make
 * and the rows from rank a on still free, the next cut is at a + ⌊(m − a)/r⌋; a cut inside a run of
 * equal values moves to the nearer end of the run (the upper end on a draw). Without ties the sizes
 * differ by at most one; a long run of equal values becomes one stratum and the rows after it are
 * shared equally among the strata left, so there may be fewer, unequal strata. One sort of the `by` values (O(m log m)), then one pass with a binary search per row.
 * @example
 * equalCountStrata(new Float64Array([4, 1, 3, 2]), new Float64Array([1, 5, 2, 7]), Int32Array.from([0, 1, 2, 3]), 2, true)
 * // [{low: 1, high: 2, n: 2, constant: 7, centre: 1.5, witness: 3}, {low: 3, high: 4, n: 2, constant: 2, centre: 3.5, witness: 2}]
 */
export function equalCountStrata(
  by: Float64Array,
  ratio: Float64Array,
  rows: Int32Array,
  bins: number,
  upper: boolean,
): Stratum[] {
  const m = rows.length;
  if (m === 0 || bins < 1) return [];
  const sorted = new Float64Array(m);
  for (let t = 0; t < m; t++) sorted[t] = by[rows[t]!]!;
  sorted.sort();
  // cut ranks placed one after another, each stratum taking an equal share of the rows still left,
  // and moved off runs of equal values
  const cuts: number[] = [0];
  while (cuts[cuts.length - 1]! < m) {
    const last = cuts[cuts.length - 1]!;
    const rem = bins - (cuts.length - 1);
    let c = rem <= 1 ? m : last + Math.max(1, Math.floor((m - last) / rem));
    if (c < m && sorted[c - 1] === sorted[c]) {
      const v = sorted[c]!;
      let start = c;
      while (start > last && sorted[start - 1] === v) start--;
      let end = c;
      while (end < m && sorted[end] === v) end++;
      c = c - start < end - c && start > last ? start : end;
    }
    cuts.push(c);
  }
  const k = cuts.length - 1;
  // stratum s holds values in [sorted[cuts[s]], sorted[cuts[s+1]]): thresholds are the first values
  const thresholds = new Float64Array(k);
  for (let s = 0; s < k; s++) thresholds[s] = sorted[cuts[s]!]!;
  const best = new Int32Array(k).fill(-1);
  const count = new Int32Array(k);
  for (let t = 0; t < m; t++) {
    const r = rows[t]!;
    const b = by[r]!;
    // largest s with thresholds[s] ≤ b
    let lo = 0;
    let hi = k - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >>> 1;
      if (thresholds[mid]! <= b) lo = mid;
      else hi = mid - 1;
    }
    count[lo]!++;
    const w = best[lo]!;
    if (w < 0) {
      best[lo] = r;
      continue;
    }
    const v = ratio[r]!;
    const bv = ratio[w]!;
    if (upper ? v > bv || (v === bv && r < w) : v < bv || (v === bv && r < w)) best[lo] = r;
  }
  const out: Stratum[] = [];
  for (let s = 0; s < k; s++) {
    const a = cuts[s]!;
    const e = cuts[s + 1]!;
    const h = (e - a - 1) / 2;
    const j = a + Math.floor(h);
    const centre = h === Math.floor(h) ? sorted[j]! : sorted[j]! + 0.5 * (sorted[j + 1]! - sorted[j]!);
    out.push({ low: sorted[a]!, high: sorted[e - 1]!, n: count[s]!, constant: ratio[best[s]!]!, centre, witness: best[s]! });
  }
  return out;
}
