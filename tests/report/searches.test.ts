/**
 * Several formula searches in one report: which best formula the summary picks, and what the input
 * check refuses. The figures are hand-made; the rule checked is that a held-out RMSE over the
 * target's held-out standard deviation is √(1 − R²) on those rows (R² = 1 − SSE/SST, Draper &
 * Smith, Applied Regression Analysis, 3rd ed., 1.4), so errors of different targets compare on it.
 */
import { describe, it, expect } from 'vitest';
import { renderReport, type ReportInput, type ReportSearch } from '../../src/report/index.ts';
import { bestAcrossSearches, searchesOf, relativeError } from '../../src/report/searches.ts';
import { SurmiseError } from '../../src/errors.ts';

const cand = (terms: string[], coefs: number[], heldOutRmse: number, complexity: number) => ({ terms, coefs, heldOutRmse, complexity, intercept: 1 });
const search = (name: string, target: string, rmse: number, sd: number | undefined, complexity = 1): ReportSearch => {
  const c = cand(['x'], [2], rmse, complexity);
  return { name, target, mode: 'exhaustive', candidates: [c], front: [c], ...(sd !== undefined ? { heldOutSd: sd } : {}) };
};
const base: ReportInput = { title: 't', createdAt: '2026-01-01', tool: { name: 'surmise', version: '0' }, input: { path: 'x.csv', sha256: '0', rows: 10 } };

describe('the best formula across searches', () => {
  it('compares held-out errors relative to each target\'s held-out spread, not the raw RMSE', () => {
    // u: RMSE 0.5 on SD 10 → 0.05 (R² = 1 − 0.05² = 0.9975); v: RMSE 0.1 on SD 0.2 → 0.5 (R² = 0.75)
    const u = search('big', 'u', 0.5, 10);
    const v = search('small', 'v', 0.1, 0.2);
    expect(relativeError(u, u.front[0]!)).toBeCloseTo(0.05, 12);
    expect(relativeError(v, v.front[0]!)).toBeCloseTo(0.5, 12);
    const pick = bestAcrossSearches([v, u])!;
    expect(pick.search.name).toBe('big');
    expect(pick.index).toBe(1);
    expect(pick.comparable).toBe(true);
  });

  it('a tie goes to the simpler formula, then to the search written first', () => {
    expect(bestAcrossSearches([search('a', 'y', 0, 1, 3), search('b', 'z', 0, 2, 2)])!.search.name).toBe('b');
    expect(bestAcrossSearches([search('a', 'y', 0, 1, 2), search('b', 'z', 0, 2, 2)])!.search.name).toBe('a');
  });

  it('without a spread, the same target compares by RMSE and different targets are not compared', () => {
    expect(bestAcrossSearches([search('a', 'y', 0.3, undefined), search('b', 'y', 0.2, undefined)])!.search.name).toBe('b');
    expect(bestAcrossSearches([search('a', 'y', 0.3, undefined), search('b', 'z', 0.2, undefined)])!.comparable).toBe(false);
  });

  it('reads one `search` (older inputs) as a list of one', () => {
    const s = search('only', 'y', 0.1, 1);
    expect(searchesOf({ search: s })).toEqual([s]);
    expect(searchesOf({})).toEqual([]);
  });
});

describe('the report of several searches', () => {
  it('one section per search under its name; the summary names the search its best formula came from', async () => {
    const out = await renderReport({ ...base, searches: [search('small', 'v', 0.1, 0.2), search('big', 'u', 0.5, 10)] }, { png: false });
    expect(out.markdown).toContain("### Formula search 'small' for v");
    expect(out.markdown).toContain("### Formula search 'big' for u");
    expect(out.markdown).toContain("Best formula found by the 2 searches: `u ≈ 1 + 2*x` (from search 'big'; held-out RMSE 0.5, or 0.05 times the target's standard deviation on those rows, complexity 1).");
  });

  it('searches that cannot be compared: each one\'s best on its own line', async () => {
    const out = await renderReport({ ...base, searches: [search('a', 'y', 0.3, undefined), search('b', 'z', 0.2, undefined)] }, { png: false });
    expect(out.markdown).toContain("Best formula found by search 'a': `y ≈ 1 + 2*x` (held-out RMSE 0.3, complexity 1).");
    expect(out.markdown).toContain("Best formula found by search 'b': `z ≈ 1 + 2*x` (held-out RMSE 0.2, complexity 1).");
  });

  it('refuses `search` and `searches` together, two searches of one name, and unpaired coefficients', async () => {
    const refusal = async (input: ReportInput) => {
      try {
        await renderReport(input, { png: false });
      } catch (e) {
        expect(e).toBeInstanceOf(SurmiseError);
        return `${(e as SurmiseError).code}: ${(e as SurmiseError).message}`;
      }
      throw new Error('expected a refusal');
    };
    const s = search('a', 'y', 0.1, 1);
    expect(await refusal({ ...base, search: s, searches: [s] })).toBe('report.badInput: report input search: give one search as `search` or a list as `searches`, not both');
    expect(await refusal({ ...base, searches: [s, s] })).toBe("report.badInput: report input searches[1].name: 'a' names an earlier search too");
    const bad = { ...s, name: 'b', front: [{ ...s.front[0]!, coefs: [1, 2] }] };
    expect(await refusal({ ...base, searches: [s, bad] })).toBe('report.badInput: report input searches[1].front[0].coefs: has 2 values but searches[1].front[0].terms has 1');
  });
});
