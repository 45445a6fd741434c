import { describe, it, expect } from 'vitest';
import { residualRanking } from '../../src/run/residual.ts';
import { tableFromColumns } from '../../src/table/columns.ts';
import type { Column } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';
import { SurmiseError } from '../../src/errors.ts';

const real = (name: string, values: Float64Array): Column => ({ name, kind: 'real', values, missing: new Uint8Array(values.length) });
const SMALL = { workers: 0, hidden: [24, 24], epochs: 40, seeds: 2, attributionRows: 400, smoothGradSamples: 4, integratedSteps: 8, permutationRepeats: 2, resamples: 200 };

/** A planted two-stage law (invented data for the machinery): y = 3a² + 0.05·b² + N(0, 0.005²); c, d inert. */
function twoStage(n: number, seed: number) {
  const rng = new Rng(seed);
  const [a, b, c, d] = [0, 1, 2, 3].map(() => Float64Array.from({ length: n }, () => rng.uniform(1, 2)));
  const y = Float64Array.from({ length: n }, (_, i) => 3 * a![i]! ** 2 + 0.05 * b![i]! ** 2 + 0.005 * rng.normal());
  return tableFromColumns([real('a', a!), real('b', b!), real('c', c!), real('d', d!), real('y', y)], 'two-stage');
}

describe('residual ranking on a planted two-stage law (known answer by construction)', () => {
  it('after fitting 3a², b leads the ranking of the residual and of its size, above noise; the search proposes b² with coefficient ≈ 0.05', async () => {
    const r = await residualRanking(twoStage(1500, 21), { target: 'y', terms: ['a^2'], rank: SMALL });
    // the fit reads y and a: the remaining columns are b, c, d
    expect(r.features).toEqual(['b', 'c', 'd']);
    expect(r.residualName).toBe('residual');
    expect(r.ranking.ranking[0]!.feature).toBe('b');
    expect(Object.fromEntries(r.ranking.ranking.map((e) => [e.feature, e.aboveNoise]))).toEqual({ b: true, c: false, d: false });
    expect(r.absolute!.ranking[0]!.feature).toBe('b');
    // the residual is 0.05·b² + noise up to a constant: the network predicts most of it (R² of 0.05·b² over its noise ≈ 0.95, computed from the law)
    expect(r.ranking.model.score).toBeGreaterThan(0.8);
    expect(r.next!.from).toEqual(['b']);
    expect(r.next!.proposal!.terms).toEqual(['b^2']);
    const [lo, hi] = [r.next!.proposal!.low[0]!, r.next!.proposal!.high[0]!];
    expect(lo).toBeLessThan(0.05);
    expect(hi).toBeGreaterThan(0.05);
    expect(r.next!.nextTerms).toEqual(['a^2', 'b^2']);
    // the first fit's per-row residuals are not carried into the result
    expect('residuals' in r.fit).toBe(false);
  }, 180_000);

  it('refuses an unknown --from column and a fit that reads every column', async () => {
    const t = twoStage(100, 2);
    await expect(residualRanking(t, { target: 'y', terms: ['a'], from: ['bb'] })).rejects.toThrow(/columns to rank: 'bb' is not a column of the table \(did you mean 'b'\?\)/);
    await expect(residualRanking(t, { target: 'y', terms: ['a + b + c + d'] })).rejects.toThrow(SurmiseError);
  });
});
