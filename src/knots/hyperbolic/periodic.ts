/**
 * Torus links from any braid word, exactly: β ∈ B_n is conjugate to δ^q, δ = σ1σ2…σ_{n−1}, if and
 * only if β^n = Δ^{2q} = δ^{nq} in B_n. One direction is δ^n = Δ² (central); the other is the
 * uniqueness of roots up to conjugacy (J. González-Meneses, "The nth root of a braid is unique up
 * to conjugacy", Algebr. Geom. Topol. 3, 2003: α^k = β^k ⇒ α, β conjugate). The closure of δ^q is
 * the torus link T(n, q) (Rolfsen, "Knots and Links", §3.C), an unknot when |q| = 1. The exponent
 * sum is a conjugacy invariant and δ^q has exponent sum q(n − 1), which fixes q; the equality of
 * braids is decided exactly by Artin's faithful action on the free group (`artin.ts`), given up
 * past a length cap (the images of a pseudo-Anosov braid grow exponentially), which only leaves the
 * braid unrecognised.
 */
import { powerEquals } from '../artin.ts';
import type { Braid } from '../braid.ts';
import { gcd } from '../../util/gcd.ts';

/** δ^m as a word (m < 0: the inverse letters in reverse order). */
function deltaPower(n: number, m: number): number[] {
  const out: number[] = [];
  for (let r = 0; r < Math.abs(m); r++) {
    if (m > 0) for (let i = 1; i < n; i++) out.push(i);
    else for (let i = n - 1; i >= 1; i--) out.push(-i);
  }
  return out;
}

/** { p: n, q } when the braid is conjugate to (σ1…σ_{n−1})^q (its closure is T(n, q)), else undefined. */
export function recognisePeriodicBraid(b: Braid, cap = 20000): { p: number; q: number } | undefined {
  const n = b.strands;
  if (n < 2) return undefined;
  // a letter outside σ1..σ_{n−1} is not a braid on n strands: claim nothing
  if (b.word.some((g) => g === 0 || Math.abs(g) >= n)) return undefined;
  const e = b.word.reduce((s, g) => s + Math.sign(g), 0);
  if (e % (n - 1) !== 0) return undefined;
  const q = e / (n - 1);
  if (q === 0) return undefined; // β^n = 1 means β = 1 (braid groups are torsion-free): left to the word reduction
  // cheap necessary condition first: the permutation of δ^q has every cycle of length n / gcd(n, q)
  const perm = Array.from({ length: n }, (_, i) => i);
  for (const g of b.word) {
    const i = Math.abs(g) - 1;
    [perm[i], perm[i + 1]] = [perm[i + 1]!, perm[i]!];
  }
  const len = n / gcd(n, Math.abs(q));
  const seen = new Uint8Array(n);
  for (let s = 0; s < n; s++) {
    if (seen[s]) continue;
    let c = 0;
    for (let t = s; !seen[t]; t = perm[t]!) {
      seen[t] = 1;
      c++;
    }
    if (c !== len) return undefined;
  }
  return powerEquals(b, n, deltaPower(n, n * q), cap) ? { p: n, q } : undefined;
}
