import { selectValues } from './select.ts';
import { quantilesType7InPlace } from './quantile.ts';

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
 * values. The m rows, ranked by `by`, are cut one stratum at a time: with r strata still to make
 * and the rows from rank a on still free, the next cut is at a + ⌊(m − a)/r⌋; a cut inside a run of
 * equal values moves to the nearer end of the run (the upper end on a draw). Without ties the sizes
 * differ by at most one; a long run of equal values becomes one stratum and the rows after it are
 * shared equally among the strata left, so there may be fewer, unequal strata. Selection, not a
 * full sort: O(m) expected work per cut, then one pass with a binary search per row.
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
  const a = new Float64Array(m);
  for (let t = 0; t < m; t++) a[t] = by[rows[t]!]!;
  const cuts = evenCuts(a, bins) ?? tieAwareCuts(a, bins);
  const k = cuts.length - 1;
  // stratum s holds the values from its smallest (its threshold) up to the next stratum's threshold
  const thresholds = new Float64Array(k);
  for (let s = 0; s < k; s++) {
    let low = Infinity;
    for (let j = cuts[s]!; j < cuts[s + 1]!; j++) if (a[j]! < low) low = a[j]!;
    thresholds[s] = low;
  }
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
    const lo = cuts[s]!;
    const hi = cuts[s + 1]! - 1;
    let low = Infinity;
    let high = -Infinity;
    for (let j = lo; j <= hi; j++) {
      if (a[j]! < low) low = a[j]!;
      if (a[j]! > high) high = a[j]!;
    }
    out.push({ low, high, n: count[s]!, constant: ratio[best[s]!]!, centre: medianOfRange(a, lo, hi), witness: best[s]! });
  }
  return out;
}

/**
 * The plain equal-count cuts ⌊i·m/bins⌋, placed by recursive selection (O(m log bins)), or null when
 * some cut falls inside a run of equal values (then the tie-aware cuts are needed).
 */
function evenCuts(a: Float64Array, bins: number): number[] | null {
  const m = a.length;
  const nb = Math.min(bins, m);
  const cut = (i: number): number => Math.floor((i * m) / nb);
  const stack: number[] = [0, nb];
  while (stack.length > 0) {
    const bHi = stack.pop()!;
    const bLo = stack.pop()!;
    if (bHi - bLo < 2) continue;
    const bMid = (bLo + bHi) >>> 1;
    selectValues(a, cut(bLo), cut(bHi) - 1, cut(bMid));
    stack.push(bLo, bMid, bMid, bHi);
  }
  const cuts = [0];
  for (let i = 1; i <= nb; i++) cuts.push(cut(i));
  // the segments are now in order; a tie straddles cut i when the max left of it equals the min right of it
  let prevMax = -Infinity;
  for (let i = 0; i < nb; i++) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let j = cuts[i]!; j < cuts[i + 1]!; j++) {
      if (a[j]! < lo) lo = a[j]!;
      if (a[j]! > hi) hi = a[j]!;
    }
    if (lo === prevMax) return null;
    prevMax = hi;
  }
  return cuts;
}

/**
 * Cuts placed one after another by selection: with r strata still to make and the rows from rank
 * `last` on still free, the next cut is at last + ⌊(m − last)/r⌋, moved to the nearer end of a run of
 * equal values it falls in. After each step a[last..c) holds exactly the values of ranks last..c−1.
 */
function tieAwareCuts(a: Float64Array, bins: number): number[] {
  const m = a.length;
  const cuts: number[] = [0];
  while (cuts[cuts.length - 1]! < m) {
    const last = cuts[cuts.length - 1]!;
    const rem = bins - (cuts.length - 1);
    let c = rem <= 1 ? m : last + Math.max(1, Math.floor((m - last) / rem));
    if (c < m) {
      selectValues(a, last, m - 1, c);
      const v = a[c]!;
      // gather values equal to v next to position c: those left of c at its end, those right of c at its start
      let start = c;
      for (let j = c - 1; j >= last; j--) if (a[j] === v) swapF(a, j, --start);
      let end = c + 1;
      for (let j = c + 1; j < m; j++) if (a[j] === v) swapF(a, j, end++);
      // equal values on both sides of the cut: move it to the nearer end of their run (never to `last`)
      if (start < c) c = c - start < end - c && start > last ? start : end;
    }
    cuts.push(c);
  }
  return cuts;
}

/** Type-7 median of a[lo..hi] (reorders that range). */
function medianOfRange(a: Float64Array, lo: number, hi: number): number {
  const h = (hi - lo) / 2;
  const k = lo + Math.floor(h);
  selectValues(a, lo, hi, k);
  if (h === Math.floor(h)) return a[k]!;
  let next = Infinity;
  for (let j = k + 1; j <= hi; j++) if (a[j]! < next) next = a[j]!;
  return a[k]! + 0.5 * (next - a[k]!);
}

function swapF(a: Float64Array, i: number, j: number): void {
  const t = a[i]!;
  a[i] = a[j]!;
  a[j] = t;
}

/**
 * The type-7 quantile at `p` of the ratio within each stratum (strata as returned by
 * equalCountStrata: a row belongs to the last stratum whose `low` is ≤ its `by`). O(n log k + n).
 * @example stratumQuantiles(by, ratio, rows, strata, 0.9) // [q₀.₉ of stratum 1, …]
 */
export function stratumQuantiles(by: Float64Array, ratio: Float64Array, rows: Int32Array, strata: Stratum[], p: number): { p: number; values: number[] } {
  const k = strata.length;
  const buckets = strata.map((s) => new Float64Array(s.n));
  const fill = new Int32Array(k);
  for (let t = 0; t < rows.length; t++) {
    const r = rows[t]!;
    const b = by[r]!;
    let lo = 0;
    let hi = k - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >>> 1;
      if (strata[mid]!.low <= b) lo = mid;
      else hi = mid - 1;
    }
    buckets[lo]![fill[lo]!++] = ratio[r]!;
  }
  return { p, values: buckets.map((a, s) => quantilesType7InPlace(a.subarray(0, fill[s]!), [p])[0]!) };
}
