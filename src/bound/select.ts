/**
 * Selection (Hoare's FIND / quickselect: C. A. R. Hoare, "Algorithm 65: Find", CACM 4, 1961) on
 * an index array keyed by a Float64Array: after `selectByKey(idx, key, lo, hi, k)`, `idx[k]` holds
 * the index whose key has rank k within idx[lo..hi], every idx[lo..k-1] has a key ≤ it and every
 * idx[k+1..hi] a key ≥ it. Expected O(hi − lo) work; median-of-three pivots. Keys must not be NaN.
 * @example
 * const idx = Int32Array.from([0, 1, 2]); selectByKey(idx, new Float64Array([3, 1, 2]), 0, 2, 0); idx[0] // 1
 */
export function selectByKey(idx: Int32Array, key: Float64Array, lo: number, hi: number, k: number): void {
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // median of three, moved to idx[lo]
    const a = key[idx[lo]!]!;
    const b = key[idx[mid]!]!;
    const c = key[idx[hi]!]!;
    let m = mid;
    if (a < b) m = b < c ? mid : a < c ? hi : lo;
    else m = a < c ? lo : b < c ? hi : mid;
    swap(idx, lo, m);
    const pivot = key[idx[lo]!]!;
    let i = lo;
    let j = hi + 1;
    // Hoare partition: both scans stop on keys equal to the pivot, so runs of ties split evenly.
    for (;;) {
      do i++; while (i <= hi && key[idx[i]!]! < pivot);
      do j--; while (key[idx[j]!]! > pivot);
      if (i >= j) break;
      swap(idx, i, j);
    }
    swap(idx, lo, j);
    if (j === k) return;
    if (j < k) lo = j + 1;
    else hi = j - 1;
  }
}

/** Quickselect on the values themselves (same contract as selectByKey, on a Float64Array in place). */
export function selectValues(a: Float64Array, lo: number, hi: number, k: number): void {
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    const x = a[lo]!;
    const y = a[mid]!;
    const z = a[hi]!;
    let m = mid;
    if (x < y) m = y < z ? mid : x < z ? hi : lo;
    else m = x < z ? lo : y < z ? hi : mid;
    swapF(a, lo, m);
    const pivot = a[lo]!;
    let i = lo;
    let j = hi + 1;
    for (;;) {
      do i++; while (i <= hi && a[i]! < pivot);
      do j--; while (a[j]! > pivot);
      if (i >= j) break;
      swapF(a, i, j);
    }
    swapF(a, lo, j);
    if (j === k) return;
    if (j < k) lo = j + 1;
    else hi = j - 1;
  }
}

function swap(a: Int32Array, i: number, j: number): void {
  const t = a[i]!;
  a[i] = a[j]!;
  a[j] = t;
}

function swapF(a: Float64Array, i: number, j: number): void {
  const t = a[i]!;
  a[i] = a[j]!;
  a[j] = t;
}
