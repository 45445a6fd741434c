import { selectByKey } from './select.ts';

/** One equal-count stratum of the rows by the value of `by`. */
export interface Stratum {
  /** Smallest and largest `by` in the stratum. With ties, neighbouring strata can share a value. */
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
 * Splits `rows` into `bins` strata of equal count by rank of `by` (sizes differ by at most one:
 * stratum i holds ranks ⌊i·m/bins⌋ … ⌊(i+1)·m/bins⌋ − 1 of the m rows) and reports the tightest
 * constant of each. Ties in `by` are split by rank, so equal values may fall in two neighbouring
 * strata. Uses selection at the bin boundaries, O(m log bins), not a full sort.
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
  const nb = Math.min(bins, m);
  if (nb <= 0) return [];
  const idx = Int32Array.from(rows);
  const bound = (i: number): number => Math.floor((i * m) / nb);
  // place every boundary by selection, splitting the range of boundaries in half each time
  const stack: number[] = [0, nb];
  while (stack.length > 0) {
    const bHi = stack.pop()!;
    const bLo = stack.pop()!;
    if (bHi - bLo < 2) continue;
    const bMid = (bLo + bHi) >>> 1;
    selectByKey(idx, by, bound(bLo), bound(bHi) - 1, bound(bMid));
    stack.push(bLo, bMid, bMid, bHi);
  }
  const out: Stratum[] = [];
  for (let s = 0; s < nb; s++) {
    const lo = bound(s);
    const hi = bound(s + 1) - 1;
    let low = Infinity;
    let high = -Infinity;
    let best = idx[lo]!;
    for (let t = lo; t <= hi; t++) {
      const r = idx[t]!;
      const b = by[r]!;
      if (b < low) low = b;
      if (b > high) high = b;
      const v = ratio[r]!;
      const w = ratio[best]!;
      if (upper ? v > w || (v === w && r < best) : v < w || (v === w && r < best)) best = r;
    }
    out.push({ low, high, n: hi - lo + 1, constant: ratio[best]!, centre: medianOfRange(idx, by, lo, hi), witness: best });
  }
  return out;
}

/** Type-7 median of key over idx[lo..hi] (reorders that range). */
function medianOfRange(idx: Int32Array, key: Float64Array, lo: number, hi: number): number {
  const n = hi - lo + 1;
  const h = (n - 1) / 2;
  const k = lo + Math.floor(h);
  selectByKey(idx, key, lo, hi, k);
  const xk = key[idx[k]!]!;
  if (h === Math.floor(h)) return xk;
  let next = Infinity;
  for (let t = k + 1; t <= hi; t++) if (key[idx[t]!]! < next) next = key[idx[t]!]!;
  return xk + 0.5 * (next - xk);
}
