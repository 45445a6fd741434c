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
  if (rows.length === 0 || bins < 1) return [];
  return stratumStats(stratify(by, rows, bins), ratio, upper, 0.5).strata;
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

/** Strata of `by` fixed once (they do not depend on the ratio), for many ratios along the same quantity. */
export interface Stratification {
  /** The strata with `constant` and `witness` not yet meaningful. */
  shells: Stratum[];
  /** Stratum of rows[t], for each position t. */
  of: Uint16Array;
  rows: Int32Array;
  by: Float64Array;
  /** Reused by stratumStats across ratios (allocated on first use). */
  scratch?: Float64Array;
}

/**
 * The equal-count strata of `by` over `rows` (the cutting rule of equalCountStrata) and the stratum
 * of every row: selection for the cuts, then one pass with a binary search per row.
 */
export function stratify(by: Float64Array, rows: Int32Array, bins: number): Stratification {
  const m = rows.length;
  const of = new Uint16Array(m);
  if (m === 0 || bins < 1) return { shells: [], of, rows, by };
  const a = new Float64Array(m);
  for (let t = 0; t < m; t++) a[t] = by[rows[t]!]!;
  const cuts = evenCuts(a, Math.min(bins, 65535)) ?? tieAwareCuts(a, Math.min(bins, 65535));
  const k = cuts.length - 1;
  // stratum s holds the values from its smallest (its threshold) up to the next stratum's threshold
  const shells: Stratum[] = [];
  for (let s = 0; s < k; s++) {
    const lo = cuts[s]!;
    const hi = cuts[s + 1]! - 1;
    let low = Infinity;
    let high = -Infinity;
    for (let j = lo; j <= hi; j++) {
      if (a[j]! < low) low = a[j]!;
      if (a[j]! > high) high = a[j]!;
    }
    shells.push({ low, high, n: 0, constant: NaN, centre: medianOfRange(a, lo, hi), witness: -1 });
  }
  for (let t = 0; t < m; t++) {
    const b = by[rows[t]!]!;
    // largest s with shells[s].low ≤ b
    let lo = 0;
    let hi = k - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >>> 1;
      if (shells[mid]!.low <= b) lo = mid;
      else hi = mid - 1;
    }
    of[t] = lo;
    shells[lo]!.n++;
  }
  return { shells, of, rows, by };
}

/**
 * Per stratum: the tightest constant (max ratio, lower form min; ties to the earlier row) with its
 * row, and the type-7 quantile at `p` of the ratio (Hyndman & Fan 1996). One pass plus one
 * selection per stratum, O(n).
 */
export function stratumStats(st: Stratification, ratio: Float64Array, upper: boolean, p: number): { strata: Stratum[]; q: { p: number; values: number[] } } {
  const { shells, of, rows } = st;
  const k = shells.length;
  // one scratch array, stratum s filling [start[s], start[s] + n_s)
  const scratch = (st.scratch ??= new Float64Array(rows.length));
  const start = new Int32Array(k + 1);
  for (let s = 0; s < k; s++) start[s + 1] = start[s]! + shells[s]!.n;
  const fill = Int32Array.from(start.subarray(0, k));
  const best = new Int32Array(k).fill(-1);
  for (let t = 0; t < rows.length; t++) {
    const r = rows[t]!;
    const s = of[t]!;
    const v = ratio[r]!;
    scratch[fill[s]!++] = v;
    const w = best[s]!;
    if (w < 0 || (upper ? v > ratio[w]! || (v === ratio[w]! && r < w) : v < ratio[w]! || (v === ratio[w]! && r < w))) best[s] = r;
  }
  const strata = shells.map((sh, s) => ({ ...sh, constant: ratio[best[s]!]!, witness: best[s]! }));
  return { strata, q: { p, values: shells.map((_, s) => quantilesType7InPlace(scratch.subarray(start[s]!, fill[s]!), [p])[0]!) } };
}
