/**
 * Kendall's τ-b rank correlation (M. G. Kendall, "A new measure of rank correlation", Biometrika 30,
 * 1938; the tie correction τ-b from Kendall, Biometrika 33, 1945):
 * τ_b = (n_c − n_d) / √((n₀ − n₁)(n₀ − n₂)), n₀ = n(n−1)/2, n₁ = Σ t_i(t_i−1)/2 over tie groups
 * of a, n₂ likewise of b. O(n²), meant for rankings of tens of features. NaN when either vector is
 * constant or shorter than 2.
 * @example kendallTauB([1, 2, 3], [1, 3, 2]) // 1/3
 */
export function kendallTauB(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const n = a.length;
  if (n !== b.length) throw new RangeError(`kendallTauB: lengths differ (${n} vs ${b.length})`);
  let nc = 0;
  let nd = 0;
  let tiesA = 0;
  let tiesB = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const da = Math.sign(a[i]! - a[j]!);
      const db = Math.sign(b[i]! - b[j]!);
      if (da === 0) tiesA++;
      if (db === 0) tiesB++;
      if (da !== 0 && db !== 0) {
        if (da === db) nc++;
        else nd++;
      }
    }
  }
  const n0 = (n * (n - 1)) / 2;
  const den = Math.sqrt((n0 - tiesA) * (n0 - tiesB));
  return den > 0 ? (nc - nd) / den : NaN;
}
