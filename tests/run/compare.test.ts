import { describe, it, expect } from 'vitest';
import { compareRuns, formatComparison } from '../../src/run/compare.ts';
import { differenceOf, meanEstimate } from '../../src/run/difference.ts';

describe('difference of two estimates (Altman & Bland, BMJ 326, 2003: se of a difference = √(se₁² + se₂²))', () => {
  it('hand-worked: 10 [8, 12] against 15 [12, 18] → +5 ± √(2² + 3²) = [1.394, 8.606], not consistent', () => {
    const d = differenceOf({ estimate: 10, low: 8, high: 12 }, { estimate: 15, low: 12, high: 18 });
    expect(d.difference).toBe(5);
    expect(d.low).toBeCloseTo(5 - Math.sqrt(13), 12);
    expect(d.high).toBeCloseTo(5 + Math.sqrt(13), 12);
    expect(d.consistent).toBe(false);
  });
  it('an undefined interval gives no verdict', () => {
    expect(differenceOf({ estimate: 1, low: NaN, high: NaN }, { estimate: 2, low: 1, high: 3 }).consistent).toBeNull();
  });
  it('mean of 1, 2, 3 with its t interval: 2 ± t(0.975, 2)·1/√3, t = 4.303 (Student t table, Abramowitz & Stegun Table 26.10)', () => {
    const e = meanEstimate([1, 2, 3]);
    expect(e.estimate).toBe(2);
    expect((e.high - e.low) / 2).toBeCloseTo(4.302653 / Math.sqrt(3), 5);
    expect(meanEstimate([0.8]).low).toBeNaN();
  });
});

const fit = (coef: number, low: number, high: number) => ({ target: 'y', terms: [{ term: 'x', coef, low, high }] });
const cand = (terms: string[], coefs: number[], half: number, formula: string) => ({
  terms,
  coefs,
  low: coefs.map((c) => c - half),
  high: coefs.map((c) => c + half),
  intercept: { coef: 1, low: 1 - half, high: 1 + half },
  heldOutRmse: 0.1,
  formula,
});

describe('compareRuns: both runs\' uncertainty (definition: consistent when the difference interval contains 0)', () => {
  it('3.000 → 3.003 is consistent when B\'s own interval is wider, though it leaves A\'s narrow interval', () => {
    const c = compareRuns({ fits: [fit(3, 2.999, 3.001)] }, { fits: [fit(3.003, 2.996, 3.01)] });
    expect(c.coefficients[0]!.flagged).toBe(false);
    expect(c.coefficients[0]!.diff!.consistent).toBe(true);
    expect(c.flags).toEqual([]);
    expect(formatComparison(c)).toContain('consistent');
    // a real move: 3 ± 0.01 against 3.1 ± 0.01 → +0.1 ± 0.0141
    const moved = compareRuns({ fits: [fit(3, 2.99, 3.01)] }, { fits: [fit(3.1, 3.09, 3.11)] });
    expect(moved.coefficients[0]!.flagged).toBe(true);
    expect(moved.flags[0]).toMatch(/coefficient of 'x' moved from 3 to 3\.1; difference \+0\.1 \[0\.08586, 0\.1141\] excludes 0/);
  });

  it('ranking: overlapping shares are consistent; a noise-level change is reported', () => {
    const a = { rank: { ranking: [{ feature: 'p', score: 0.5, low: 0.45, high: 0.55, aboveNoise: true }, { feature: 'q', score: 0.06, low: 0.05, high: 0.07, aboveNoise: true }] } };
    const b = { rank: { ranking: [{ feature: 'p', score: 0.52, low: 0.47, high: 0.57, aboveNoise: true }, { feature: 'q', score: 0.058, low: 0.04, high: 0.076, aboveNoise: false }] } };
    const c = compareRuns(a, b);
    expect(c.ranking.every((r) => !r.flagged)).toBe(true);
    expect(c.flags).toEqual(["feature 'q' is above the noise level in A but at it in B"]);
    expect(formatComparison(c)).toContain('above/at');
  });

  it('search: the same terms compare coefficient by coefficient; other terms are flagged with where A\'s formula went', () => {
    const a = { search: { target: 'y', candidates: [cand(['x', 'z'], [2, 3], 0.1, 'y ≈ 1 + 2·x + 3·z')] } };
    const same = compareRuns(a, { search: { target: 'y', candidates: [cand(['z', 'x'], [3.05, 2.02], 0.1, 'y ≈ 1 + 3.05·z + 2.02·x')] } });
    expect(same.searches[0]!.sameTerms).toBe(true);
    expect(same.searches[0]!.coefficients.map((m) => [m.term, m.flagged])).toEqual([['1', false], ['x', false], ['z', false]]);
    expect(same.flags).toEqual([]);
    const other = compareRuns(a, { search: { target: 'y', candidates: [cand(['w'], [1], 0.1, 'y ≈ 1 + w'), cand(['x', 'z'], [2, 3], 0.1, 'y ≈ 1 + 2·x + 3·z')] } });
    expect(other.searches[0]!.rankOfAInB).toBe(2);
    expect(other.flags[0]).toBe("search for y: the best formula changed from y ≈ 1 + 2·x + 3·z to y ≈ 1 + w (A's formula is candidate 2 in B)");
  });

  it('searches are compared by name: an older run\'s one `search` is `search 1`; with several, flags name the search', () => {
    const xz = cand(['x', 'z'], [2, 3], 0.1, 'y ≈ 1 + 2·x + 3·z');
    const w = cand(['w'], [1], 0.1, 'u ≈ 1 + w');
    const old = compareRuns({ search: { target: 'y', candidates: [xz] } }, { searches: [{ name: 'search 1', target: 'y', candidates: [xz] }] });
    expect(old.searches.map((s) => [s.name, s.in, s.sameTerms])).toEqual([['search 1', 'both', true]]);
    expect(old.flags).toEqual([]);
    // B lists the searches in another order: matched by name, not by place
    const a = { searches: [{ name: 'g', target: 'y', candidates: [xz] }, { name: 'h', target: 'u', candidates: [w] }] };
    const b = { searches: [{ name: 'h', target: 'u', candidates: [cand(['v'], [1], 0.1, 'u ≈ 1 + v')] }, { name: 'g', target: 'y', candidates: [xz] }] };
    const c = compareRuns(a, b);
    expect(c.searches.map((s) => [s.name, s.sameTerms, s.flagged])).toEqual([['g', true, false], ['h', false, true]]);
    expect(c.flags).toEqual(["search 'h' for u: the best formula changed from u ≈ 1 + w to u ≈ 1 + v (A's formula is not among B's candidates)"]);
    const text = formatComparison(c);
    expect(text).toContain("formula search 'g' for y");
    expect(text).toContain("formula search 'h' for u");
  });

  it('bounds: an upper constant that grew and a lower constant that shrank mean A fails on B (a maximum is exact, not an estimate)', () => {
    const up = compareRuns({ bounds: [{ lhs: 'u', results: [{ rhs: 'v', constant: 2 }] }] }, { bounds: [{ lhs: 'u', results: [{ rhs: 'v', constant: 2.5 }] }] });
    expect(up.constants[0]!.flagged).toBe(true);
    expect(up.flags[0]).toContain('grew from 2 to 2.5');
    const low = compareRuns({ bounds: [{ lhs: 'u', form: 'lower', results: [{ rhs: 'v', constant: 2 }] }] }, { bounds: [{ lhs: 'u', form: 'lower', results: [{ rhs: 'v', constant: 2.5 }] }] });
    expect(low.constants[0]!.flagged).toBe(false);
  });

  it('discovered bounds: proposals compared like bounds (a maximum over rows), and a change of the best right-hand side is flagged', () => {
    const d = (rhs: string, c: number) => ({ lhs: 'u', form: 'upper' as const, proposals: [{ rhs, constant: c }, { rhs: 'w', constant: 5 }] });
    const same = compareRuns({ discoveries: [d('v^2', 1)] }, { discoveries: [d('v^2', 1)] });
    expect(same.flags).toEqual([]);
    expect(same.constants.map((c) => c.source)).toEqual(['discovered', 'discovered']);
    const grew = compareRuns({ discoveries: [d('v^2', 1)] }, { discoveries: [d('v^2', 1.2)] });
    expect(grew.constants[0]!.flagged).toBe(true);
    expect(grew.flags[0]).toContain('discovered bound u ≤ c·(v^2): the constant grew from 1 to 1.2');
    const moved = compareRuns({ discoveries: [d('v^2', 1)] }, { discoveries: [d('v^3', 1)] });
    expect(moved.flags[0]).toBe('discovered bound for u: the best right-hand side changed from v^2 to v^3');
    expect(formatComparison(moved)).toContain('v^3 (discovered)');
  });

  it('skill: per-repeat values compared through their t intervals', () => {
    const c = compareRuns({ rank: { model: { metric: 'r2', score: 0.8, perRepeat: [0.79, 0.8, 0.81] } } }, { rank: { model: { metric: 'r2', score: 0.81, perRepeat: [0.8, 0.81, 0.82] } } });
    expect(c.skill!.diff!.consistent).toBe(true);
    const d = compareRuns({ rank: { model: { metric: 'r2', score: 0.8, perRepeat: [0.79, 0.8, 0.81] } } }, { rank: { model: { metric: 'r2', score: 0.5, perRepeat: [0.49, 0.5, 0.51] } } });
    expect(d.skill!.diff!.consistent).toBe(false);
    expect(d.flags[0]).toMatch(/^held-out r2: 0\.8 → 0\.5/);
  });
});
