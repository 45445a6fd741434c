import { Rng } from './rng.ts';

/** Seeded choices of rows to draw: used by the stages that hand plot points on and by the report. */

/** Rows a stage hands on per plot at most (a seeded sample above it); the report draws or thins them further. */
export const PLOT_POINTS = 5000;

/**
 * Up to `k` distinct row indices of `0..n−1`, in increasing order: every index in `keep` (in
 * range) first, the rest drawn uniformly without replacement by a partial Fisher–Yates shuffle
 * (Knuth, TAOCP vol. 2, Algorithm P) seeded with `seed`. n ≤ k returns every index.
 */
export function sampleIndices(n: number, k: number, seed: number, keep: readonly number[] = []): Int32Array {
  if (n <= k) {
    const all = new Int32Array(n);
    for (let i = 0; i < n; i++) all[i] = i;
    return all;
  }
  const chosen = new Set<number>();
  for (const i of keep) if (Number.isInteger(i) && i >= 0 && i < n && chosen.size < k) chosen.add(i);
  const pool = new Int32Array(n);
  for (let i = 0; i < n; i++) pool[i] = i;
  const rng = new Rng(seed);
  let end = n;
  while (chosen.size < k && end > 0) {
    const j = rng.int(end);
    const pick = pool[j]!;
    pool[j] = pool[end - 1]!;
    pool[end - 1] = pick;
    end--;
    chosen.add(pick);
  }
  return Int32Array.from([...chosen].sort((a, b) => a - b));
}

/** Indices of the `k` largest finite values, largest first (ties: lower index first). */
export function largestIndices(values: ArrayLike<number>, k: number): number[] {
  const idx: number[] = [];
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i]!)) idx.push(i);
  idx.sort((a, b) => values[b]! - values[a]! || a - b);
  return idx.slice(0, k);
}
