/**
 * ℓ0 subset search: every subset of at most K screened terms, each scored by its residual sum of
 * squares on the screening rows, as SISSO's sparsifying operator does (Ouyang et al. 2018). With
 * the centred, unit-length columns Z and centred target y, RSS(S) = yᵀy − bₛᵀGₛ⁻¹bₛ with
 * G = ZᵀZ, b = Zᵀy (e.g. A. Miller, "Subset Selection in Regression", 2nd ed., ch. 3); the depth-
 * first enumeration extends a Cholesky factor of Gₛ by one row per added term, so a subset costs
 * O(k²). A pivot ≤ 1e-9 (collinear within 1e-9 of a unit diagonal) ends that branch and is counted.
 * An RSS below 1e-12·yᵀy is floored there (the Gram arithmetic cannot rank such fits); ties in BIC
 * go to the simpler subset.
 */

export interface ScoredSubset {
  s: number[];
  rss: number;
  bic: number;
  complexity: number;
}

export interface SubsetSearchResult {
  /** Best `keep` subsets by BIC, then the best by RSS at each complexity not among them. */
  kept: ScoredSubset[];
  /** The subset with the lowest RSS of each size 1..K. */
  bestBySize: ScoredSubset[];
  tried: number;
  collinear: number;
}

/** Number of subsets of 1..k of m terms. */
export function countSubsets(m: number, k: number): number {
  let total = 0;
  let c = 1;
  for (let j = 1; j <= Math.min(k, m); j++) {
    c = (c * (m - j + 1)) / j;
    total += c;
  }
  return Math.round(total);
}

/**
 * Exhaustive search over subsets of the columns `Z` (centred, unit length) for the centred `y`.
 * BIC = n ln(RSS/n) + (k + 2) ln n (Schwarz 1978; k terms, the intercept and σ²).
 * @example subsetSearch([x1, x2], y, [1, 2], 2, 10).kept[0].s // the pair or single best by BIC
 */
export function subsetSearch(
  Z: Float64Array[],
  y: Float64Array,
  complexities: number[],
  maxTerms: number,
  keep: number,
  onProgress?: (done: number) => void,
): SubsetSearchResult {
  const m = Z.length;
  const n = y.length;
  const dot = (a: Float64Array, b: Float64Array): number => {
    let s0 = 0, s1 = 0;
    let i = 0;
    for (; i + 1 < n; i += 2) { s0 += a[i]! * b[i]!; s1 += a[i + 1]! * b[i + 1]!; }
    if (i < n) s0 += a[i]! * b[i]!;
    return s0 + s1;
  };
  const G = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    G[i * m + i] = 1;
    for (let j = 0; j < i; j++) G[i * m + j] = G[j * m + i] = dot(Z[i]!, Z[j]!);
  }
  const b = Float64Array.from(Z, (z) => dot(z, y));
  const yy = dot(y, y);
  const K = Math.min(maxTerms, m);
  const L = new Float64Array(K * K); // rows of the Cholesky factor of G_s
  const z = new Float64Array(K); // L⁻¹ b_s
  const s: number[] = [];
  let tried = 0;
  let collinear = 0;
  let pool: ScoredSubset[] = [];
  let worst = Infinity;
  const bestAt = new Map<number, ScoredSubset>();
  const bySize: ScoredSubset[] = [];
  const rec = (start: number, explained: number, cx: number): void => {
    const k = s.length;
    for (let j = start; j < m; j++) {
      tried++;
      if (onProgress && (tried & 0xffff) === 0) onProgress(tried);
      // new row l of L: solve L l = G[s, j]; pivot d = 1 − ‖l‖²
      let d = G[j * m + j]!;
      let zj = b[j]!;
      for (let r = 0; r < k; r++) {
        let v = G[s[r]! * m + j]!;
        for (let q = 0; q < r; q++) v -= L[r * K + q]! * L[k * K + q]!;
        const l = v / L[r * K + r]!;
        L[k * K + r] = l;
        d -= l * l;
        zj -= l * z[r]!;
      }
      if (d <= 1e-9) { collinear++; continue; }
      const piv = Math.sqrt(d);
      L[k * K + k] = piv;
      z[k] = zj / piv;
      const e = explained + z[k]! * z[k]!;
      const rss = Math.max(yy - e, 1e-12 * yy); // below ~1e-12·yᵀy the Gram arithmetic cannot tell fits apart: ties
      const c = cx + complexities[j]!;
      s.push(j);
      const bic = n * Math.log(rss / n) + (s.length + 2) * Math.log(n);
      if (pool.length < keep || bic <= worst) {
        pool.push({ s: s.slice(), rss, bic, complexity: c });
        if (pool.length >= 2 * keep) {
          pool.sort((x, w) => x.bic - w.bic || x.complexity - w.complexity);
          pool = pool.slice(0, keep);
          worst = pool[keep - 1]!.bic;
        }
      }
      const ps = bySize[s.length - 1];
      if (!ps || rss < ps.rss) bySize[s.length - 1] = { s: s.slice(), rss, bic, complexity: c };
      const prior = bestAt.get(c);
      if (!prior || rss < prior.rss) bestAt.set(c, { s: s.slice(), rss, bic, complexity: c });
      if (s.length < K) rec(j + 1, e, c);
      s.pop();
    }
  };
  rec(0, 0, 0);
  pool.sort((x, w) => x.bic - w.bic || x.complexity - w.complexity);
  pool = pool.slice(0, keep);
  const inPool = new Set(pool.map((p) => p.s.join(',')));
  const extra = [...bestAt.values()].filter((p) => !inPool.has(p.s.join(','))).sort((x, w) => x.complexity - w.complexity);
  return { kept: [...pool, ...extra], bestBySize: bySize, tried, collinear };
}
