import { describe, it, expect } from 'vitest';
import { kendallTauB } from '../../src/attribute/kendall.ts';
import { aggregateRepeats, consensusRanking, normaliseScores, quantileSorted } from '../../src/attribute/aggregate.ts';
import { defaultGroups, declareGroups, sumOverGroups } from '../../src/attribute/groups.ts';
import { Rng } from '../../src/util/rng.ts';
import type { RepeatScores } from '../../src/attribute/types.ts';

describe('Kendall τ-b (Kendall 1938, Biometrika 30; τ-b: Kendall 1945)', () => {
  it('hand-worked example without ties: 6 concordant, 4 discordant pairs → 0.2', () => {
    // pairs of b = (3,4,1,2,5) against a = (1..5): c = 6, d = 4, τ = (6 − 4)/10, worked by hand
    expect(kendallTauB([1, 2, 3, 4, 5], [3, 4, 1, 2, 5])).toBeCloseTo(0.2, 15);
  });
  it('hand-worked example with ties: n_c = 4, n_d = 0, n₁ = n₂ = 1 → 4/√(5·5) = 0.8', () => {
    expect(kendallTauB([1, 2, 2, 3], [1, 2, 3, 3])).toBeCloseTo(0.8, 15);
  });
  it('identical order → 1, reversed → −1, constant → NaN (definition)', () => {
    expect(kendallTauB([0.1, 0.5, 0.4], [1, 3, 2])).toBe(1);
    expect(kendallTauB([1, 2, 3, 4], [4, 3, 2, 1])).toBe(-1);
    expect(kendallTauB([1, 1, 1], [1, 2, 3])).toBeNaN();
  });
});

describe('aggregation over repeats', () => {
  it('normalises each repeat to sum 1 (definition) and keeps negative permutation scores negative', () => {
    expect(normaliseScores([3, 1, 0])).toEqual([0.75, 0.25, 0]);
    expect(normaliseScores([2, 2, -1])).toEqual([0.5, 0.5, -0.25]);
    // over the first two only (noise probes appended after the real groups): the third is on their scale
    expect(normaliseScores([3, 1, 2], 2)).toEqual([0.75, 0.25, 0.5]);
  });
  it('type-7 quantile matches the textbook interpolation (Hyndman & Fan 1996)', () => {
    expect(quantileSorted([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantileSorted([10, 20, 30, 40, 50], 0.25)).toBe(20);
  });
  it('bootstrap interval contains the mean, is seeded, and τ-b = 1 for repeats in the same order', () => {
    const rng = new Rng(5);
    const n = 400;
    const G = 3;
    const repeats: RepeatScores[] = [];
    for (let r = 0; r < 3; r++) {
      const perRow = new Float64Array(n * G);
      for (let i = 0; i < n; i++) {
        perRow[i * G] = 3 + rng.normal();
        perRow[i * G + 1] = 2 + rng.normal();
        perRow[i * G + 2] = 0.5 + 0.1 * rng.normal();
      }
      const scores = new Float64Array(G);
      for (let i = 0; i < n; i++) for (let k = 0; k < G; k++) scores[k] += perRow[i * G + k]! / n;
      repeats.push({ scores, perRow, n });
    }
    const a = aggregateRepeats('saliency', ['a', 'b', 'c'], repeats, { seed: 1 });
    const b = aggregateRepeats('saliency', ['a', 'b', 'c'], repeats, { seed: 1 });
    expect(a).toEqual(b);
    for (let k = 0; k < G; k++) {
      expect(a.low[k]).toBeLessThan(a.mean[k]!);
      expect(a.high[k]).toBeGreaterThan(a.mean[k]!);
    }
    expect(a.resampledRows).toBe(true);
    expect(a.kendallTau).toBe(1);
    expect(a.order).toEqual([0, 1, 2]);
    for (const s of a.perRepeat) expect(s.reduce((x, y) => x + y, 0)).toBeCloseTo(1, 12);
    // the sum-to-one constraint: means sum to 1 too
    expect(a.mean.reduce((x, y) => x + y, 0)).toBeCloseTo(1, 12);
  });
  it('the consensus of a method with itself is that method (same seed → same bootstrap draws)', () => {
    const rng = new Rng(8);
    const reps: RepeatScores[] = [0, 1].map(() => {
      const perRow = Float64Array.from({ length: 200 * 2 }, (_, k) => (k % 2 ? 1 : 2) + rng.normal());
      const scores = new Float64Array(2);
      for (let i = 0; i < 200; i++) for (let k = 0; k < 2; k++) scores[k] += perRow[i * 2 + k]! / 200;
      return { scores, perRow, n: 200 };
    });
    const one = aggregateRepeats('saliency', ['a', 'b'], reps, { seed: 4, resamples: 200 });
    const both = consensusRanking(['a', 'b'], [reps, reps], { seed: 4, resamples: 200 });
    for (let k = 0; k < 2; k++) {
      expect(both.mean[k]).toBeCloseTo(one.mean[k]!, 12);
      expect(both.low[k]).toBeCloseTo(one.low[k]!, 12);
      expect(both.high[k]).toBeCloseTo(one.high[k]!, 12);
    }
  });
  it('τ-b is the mean over pairs of repeats (hand-worked: pairs give 1, 1/3, 1/3 → 5/9)', () => {
    const rep = (s: number[]): RepeatScores => ({ scores: Float64Array.from(s), n: 1 });
    const a = aggregateRepeats('permutation', ['a', 'b', 'c'], [rep([3, 2, 1]), rep([3, 2, 1]), rep([3, 1, 2])], { seed: 2 });
    expect(a.kendallTau).toBeCloseTo(5 / 9, 12);
    expect(a.resampledRows).toBe(false);
  });
});

describe('groups', () => {
  it('a complex column’s two parts form one group named after it (project contract, DEVELOPERS.md)', () => {
    expect(defaultGroups(['amp', 'cza.re', 'cza.im', 'x.re'])).toEqual([
      { name: 'amp', members: [0] },
      { name: 'cza', members: [1, 2] },
      { name: 'x.re', members: [3] },
    ]);
  });
  it('declared groups take members by feature or column name; gradient group score = sum of members', () => {
    const g = declareGroups(['a', 'b', 'cza.re', 'cza.im'], { ab: ['a', 'b'] });
    expect(g).toEqual([
      { name: 'ab', members: [0, 1] },
      { name: 'cza', members: [2, 3] },
    ]);
    const s = sumOverGroups({ scores: Float64Array.from([1, 2, 3, 4]), n: 1, perRow: Float64Array.from([1, 2, 3, 4]) }, 4, g);
    expect(Array.from(s.scores)).toEqual([3, 7]);
    expect(Array.from(s.perRow!)).toEqual([3, 7]);
  });
  it('an unknown group member is refused with a suggestion', () => {
    expect(() => declareGroups(['amp', 'gap'], { g: ['amp', 'gab'] })).toThrow(/'gab', which is not a feature \(did you mean 'gap'\?\)/);
  });
});
