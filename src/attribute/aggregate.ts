import type { RepeatScores } from './types.ts';
import { kendallTauB } from './kendall.ts';
import { Rng } from '../util/rng.ts';

export interface AggregateOptions {
  /** Bootstrap seed. */
  seed: number;
  /** Bootstrap resamples B. Default 1000. */
  resamples?: number;
  /** Two-sided interval level. Default 0.95. */
  level?: number;
  /**
   * Also resample held-out rows within each resampled repeat (a two-stage bootstrap; Davison &
   * Hinkley, Bootstrap Methods and their Application, 1997, §2.4). Default: when fewer than 10
   * repeats carry per-row scores, since a bootstrap over 3 repeats alone has at most 10 distinct means.
   */
  resampleRows?: boolean;
  /**
   * Normalise by the positive parts of the first `normaliseOver` groups only (default all). Noise
   * probes appended after the real groups are then expressed on the real groups' scale and do not
   * change the real shares.
   */
  normaliseOver?: number;
}

/** The evidence for one method: everything is per group, in the order of `groups`. */
export interface MethodRanking {
  method: string;
  groups: string[];
  /** Mean over repeats of the repeat's normalised score (each repeat sums to 1 over groups). */
  mean: number[];
  /** Bootstrap percentile interval of the mean (Efron & Tibshirani 1993, §13.3). */
  low: number[];
  high: number[];
  /** Normalised score per repeat, repeats × groups. */
  perRepeat: number[][];
  /** Raw (unnormalised) score per repeat, repeats × groups. */
  rawPerRepeat: number[][];
  /** Mean Kendall τ-b between every pair of repeats' scores; null with one repeat or all ties. */
  kendallTau: number | null;
  /** Group indices, best (largest mean) first. */
  order: number[];
  resamples: number;
  level: number;
  resampledRows: boolean;
}

/**
 * Normalise a score vector to sum 1: s_k / Σ max(s_l, 0), the sum over the first `over` entries
 * (default all). Negative scores (permutation importance of a feature whose shuffling helped, i.e.
 * noise) stay negative; an all-zero vector stays zero.
 * @example normaliseScores([3, 1, 0]) // [0.75, 0.25, 0]
 * @example normaliseScores([3, 1, 2], 2) // [0.75, 0.25, 0.5]
 */
export function normaliseScores(s: ArrayLike<number>, over = s.length): number[] {
  let tot = 0;
  for (let k = 0; k < over; k++) tot += Math.max(0, s[k]!);
  return Array.from(s, (v) => (tot > 0 ? v / tot : 0));
}

/** The q-quantile of sorted values by linear interpolation (Hyndman & Fan 1996, type 7). */
export function quantileSorted(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/**
 * Aggregate one method's repeats (seeds × folds): normalise each repeat, average, bootstrap a
 * percentile interval of the mean (seeded; B resamples of the repeats, and of rows within them when
 * `resampleRows`), and measure rank stability as the mean Kendall τ-b over pairs of repeats.
 */
export function aggregateRepeats(
  method: string,
  groups: readonly string[],
  repeats: readonly RepeatScores[],
  opts: AggregateOptions,
): MethodRanking {
  const G = groups.length;
  const R = repeats.length;
  const B = opts.resamples ?? 1000;
  const level = opts.level ?? 0.95;
  for (const r of repeats) {
    if (r.scores.length !== G) throw new RangeError(`aggregateRepeats: a repeat has ${r.scores.length} scores for ${G} groups`);
  }
  const rawPerRepeat = repeats.map((r) => Array.from(r.scores));
  const perRepeat = rawPerRepeat.map((s) => normaliseScores(s, opts.normaliseOver));
  const mean = new Array<number>(G).fill(0);
  for (const s of perRepeat) for (let k = 0; k < G; k++) mean[k]! += s[k]! / R;

  const { boot, resampledRows } = bootstrapReplicates(repeats, perRepeat, G, opts);
  const { low, high } = percentile(boot, level, R);
  const order = Array.from({ length: G }, (_, k) => k).sort((i, j) => mean[j]! - mean[i]! || i - j);
  return {
    method,
    groups: [...groups],
    mean,
    low,
    high,
    perRepeat,
    rawPerRepeat,
    kendallTau: meanPairwiseTau(perRepeat),
    order,
    resamples: B,
    level,
    resampledRows,
  };
}

/**
 * B bootstrap replicates of the mean normalised score per group (groups × B). The draws depend only
 * on the seed, R and n, so methods aggregated with one seed on the same repeats see the same
 * resampled repeats and rows: the b-th replicates of several methods can be averaged into a
 * replicate of their consensus.
 */
export function bootstrapReplicates(
  repeats: readonly RepeatScores[],
  perRepeat: readonly number[][],
  G: number,
  opts: AggregateOptions,
): { boot: Float64Array[]; resampledRows: boolean } {
  const R = repeats.length;
  const B = opts.resamples ?? 1000;
  const withRows = R > 0 && repeats.every((r) => r.perRow !== undefined && r.n > 0);
  const resampledRows = withRows && (opts.resampleRows ?? R < 10);
  const rng = new Rng(opts.seed);
  const boot: Float64Array[] = Array.from({ length: G }, () => new Float64Array(B));
  const sums = new Float64Array(G);
  const acc = new Float64Array(G);
  for (let b = 0; b < B && R > 0; b++) {
    acc.fill(0);
    for (let t = 0; t < R; t++) {
      const r = rng.int(R);
      let s: ArrayLike<number>;
      if (resampledRows) {
        const rep = repeats[r]!;
        const n = rep.n;
        const pr = rep.perRow!;
        sums.fill(0);
        for (let i = 0; i < n; i++) {
          const row = rng.int(n) * G;
          for (let k = 0; k < G; k++) sums[k] += pr[row + k]!;
        }
        for (let k = 0; k < G; k++) sums[k] /= n;
        s = normaliseScores(sums, opts.normaliseOver);
      } else s = perRepeat[r]!;
      for (let k = 0; k < G; k++) acc[k] += s[k]! / R;
    }
    for (let k = 0; k < G; k++) boot[k]![b] = acc[k]!;
  }
  return { boot, resampledRows };
}

/** Mean Kendall τ-b over all pairs of rows of `perRepeat`; null when no pair is defined. */
export function meanPairwiseTau(perRepeat: readonly number[][]): number | null {
  let tauSum = 0;
  let pairs = 0;
  for (let i = 0; i < perRepeat.length; i++) {
    for (let j = i + 1; j < perRepeat.length; j++) {
      const t = kendallTauB(perRepeat[i]!, perRepeat[j]!);
      if (Number.isFinite(t)) {
        tauSum += t;
        pairs++;
      }
    }
  }
  return pairs > 0 ? tauSum / pairs : null;
}

function percentile(boot: Float64Array[], level: number, R: number): { low: number[]; high: number[] } {
  const a = (1 - level) / 2;
  const low: number[] = [];
  const high: number[] = [];
  for (const col of boot) {
    const sorted = Float64Array.from(col).sort();
    low.push(R > 0 ? quantileSorted(sorted, a) : NaN);
    high.push(R > 0 ? quantileSorted(sorted, 1 - a) : NaN);
  }
  return { low, high };
}

/**
 * The consensus of several methods on the same repeats: each repeat's normalised group scores
 * averaged over the methods (equal weight per method), then aggregated like one method. Its interval
 * comes from averaging the methods' b-th bootstrap replicates, all drawn with the same seed (so the
 * same resampled repeats and rows; see bootstrapReplicates).
 */
export function consensusRanking(
  groups: readonly string[],
  repeatsByMethod: ReadonlyArray<readonly RepeatScores[]>,
  opts: AggregateOptions,
): MethodRanking {
  const G = groups.length;
  const M = repeatsByMethod.length;
  const R = M > 0 ? repeatsByMethod[0]!.length : 0;
  const B = opts.resamples ?? 1000;
  const level = opts.level ?? 0.95;
  const perRepeatByMethod = repeatsByMethod.map((reps) => reps.map((r) => normaliseScores(r.scores, opts.normaliseOver)));
  const perRepeat: number[][] = Array.from({ length: R }, (_, r) => {
    const s = new Array<number>(G).fill(0);
    for (const pm of perRepeatByMethod) for (let k = 0; k < G; k++) s[k]! += pm[r]![k]! / M;
    return s;
  });
  const mean = new Array<number>(G).fill(0);
  for (const s of perRepeat) for (let k = 0; k < G; k++) mean[k]! += s[k]! / R;
  const boot: Float64Array[] = Array.from({ length: G }, () => new Float64Array(B));
  let anyRows = false;
  repeatsByMethod.forEach((reps, m) => {
    const rb = bootstrapReplicates(reps, perRepeatByMethod[m]!, G, opts);
    anyRows ||= rb.resampledRows;
    for (let k = 0; k < G; k++) for (let b = 0; b < B; b++) boot[k]![b] += rb.boot[k]![b]! / M;
  });
  const { low, high } = percentile(boot, level, R);
  const order = Array.from({ length: G }, (_, k) => k).sort((i, j) => mean[j]! - mean[i]! || i - j);
  return {
    method: 'consensus',
    groups: [...groups],
    mean,
    low,
    high,
    perRepeat,
    rawPerRepeat: perRepeat,
    kendallTau: meanPairwiseTau(perRepeat),
    order,
    resamples: B,
    level,
    resampledRows: anyRows,
  };
}
