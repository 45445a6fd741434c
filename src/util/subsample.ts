import { Rng } from './rng.ts';

/**
 * Seeded subsample of at most `max` of the row indices 0..n−1 (all of them when n ≤ max), in row
 * order: the first `max` entries of a seeded Fisher–Yates permutation (Rng.permutation), sorted.
 * @example subsampleRows(3, 10, 1) // Int32Array [0, 1, 2]
 */
export function subsampleRows(n: number, max: number, seed: number): Int32Array {
  if (n <= max) return Int32Array.from({ length: n }, (_, i) => i);
  return new Rng(seed).permutation(n).subarray(0, max).sort();
}
