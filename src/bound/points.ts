import { PLOT_POINTS, largestIndices, sampleIndices } from '../util/sample.ts';

/** The most extreme ratios always kept in the sample (largest; lower form: smallest). */
const KEEP_EXTREME = 100;

/** A bound's ratio against its stratifying quantity on the rows used (a seeded sample of at most PLOT_POINTS). */
export interface RatioPoints {
  /** 1-based data rows of the points. */
  rows: number[];
  by: number[];
  ratio: number[];
  /** Rows used in all (the sample was drawn from these). */
  sampledFrom: number;
}

/**
 * The points (by, ratio) of the rows `used`, all of them up to PLOT_POINTS, else a seeded sample
 * (sampleIndices: partial Fisher–Yates) that always keeps the 100 most extreme ratios, the rows
 * that set the constant.
 */
export function ratioPoints(ratio: Float64Array, by: Float64Array, used: Int32Array, upper: boolean, seed: number): RatioPoints {
  const m = used.length;
  let pick: ArrayLike<number>;
  if (m <= PLOT_POINTS) pick = used;
  else {
    const key = Float64Array.from(used, (i) => (upper ? ratio[i]! : -ratio[i]!));
    const s = sampleIndices(m, PLOT_POINTS, seed, largestIndices(key, KEEP_EXTREME));
    pick = Int32Array.from(s, (k) => used[k]!);
  }
  return {
    rows: Array.from(pick, (i) => i + 1),
    by: Array.from(pick, (i) => by[i]!),
    ratio: Array.from(pick, (i) => ratio[i]!),
    sampledFrom: m,
  };
}
