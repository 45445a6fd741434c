import { describe, it, expect } from 'vitest';
import { rankFeatures } from '../../src/attribute/rank.ts';
import { noiseReference, planProbes, probeColumns } from '../../src/attribute/probes.ts';
import { roundedHitRate } from '../../src/learn/rounded.ts';
import { tableFromColumns } from '../../src/table/columns.ts';
import { buildDataset } from '../../src/table/dataset.ts';
import type { Column } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';

const real = (name: string, values: Float64Array): Column => ({ name, kind: 'real', values, missing: new Uint8Array(values.length) });

/** Friedman #1 (Friedman 1991, Ann. Statist. 19): y = 10 sin(π x1 x2) + 20 (x3 − ½)² + 10 x4 + 5 x5 + N(0,1); x6..x10 do not enter. */
function friedman(n: number, seed: number) {
  const rng = new Rng(seed);
  const x = Array.from({ length: 10 }, () => new Float64Array(n));
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < 10; j++) x[j]![i] = rng.next();
    const [a, b, c, d, e] = [0, 1, 2, 3, 4].map((j) => x[j]![i]!);
    y[i] = 10 * Math.sin(Math.PI * a! * b!) + 20 * (c! - 0.5) ** 2 + 10 * d! + 5 * e! + rng.normal();
  }
  return tableFromColumns([...x.map((v, j) => real(`x${j + 1}`, v)), real('y', y)], 'friedman');
}

const SMALL = { workers: 0, hidden: [24, 24], epochs: 40, seeds: 2, attributionRows: 400, smoothGradSamples: 4, integratedSteps: 8, permutationRepeats: 2, resamples: 200 };

describe('noise probes (Stoppiglia et al., JMLR 3, 2003: random probes)', () => {
  it('half permuted copies of features, half Gaussian; a permuted copy holds the same values in another order', () => {
    const t = friedman(200, 1);
    const ds = buildDataset(t, { target: 'y' });
    const probes = planProbes(ds.featureNames, 5, 3);
    expect(probes.map((p) => p.kind)).toEqual(['permuted', 'permuted', 'permuted', 'gaussian', 'gaussian']);
    expect(new Set(probes.slice(0, 3).map((p) => p.of)).size).toBe(3); // drawn without replacement
    const cols = probeColumns(ds, probes, 9);
    const src = ds.x[ds.featureNames.indexOf(probes[0]!.of!)]!;
    // a permutation: same multiset of values (sorted equal), not the same order
    expect(Array.from(cols[0]!).sort()).toEqual(Array.from(src).sort());
    expect(Array.from(cols[0]!)).not.toEqual(Array.from(src));
    // Gaussian N(0,1): the mean of 200 draws lies within 4 standard errors (4/√200) of 0 (normal sampling theory)
    const m = cols[3]!.reduce((a, b) => a + b, 0) / 200;
    expect(Math.abs(m)).toBeLessThan(4 / Math.sqrt(200));
    expect(noiseReference([0.01, 0.04, 0.02])).toBe(0.04);
    expect(noiseReference([])).toBeNaN();
  });

  it('rounded prediction hit rate: 2 of 3 rows exactly right (definition)', () => {
    expect(roundedHitRate([0.9, 2.4, 2.6], [1, 2, 2])).toBeCloseTo(2 / 3, 15);
  });

  it('Friedman #1: x1..x5 lie above the noise level and x6..x10 at it (Friedman 1991); probes are never ranked', async () => {
    const r = await rankFeatures(friedman(1500, 7), { target: 'y', ...SMALL, probes: 6 });
    const above = r.ranking.filter((e) => e.aboveNoise).map((e) => e.feature).sort();
    expect(above).toEqual(['x1', 'x2', 'x3', 'x4', 'x5']);
    expect(r.ranking).toHaveLength(10);
    expect(r.ranking.some((e) => e.feature.startsWith('probe'))).toBe(false);
    expect(r.noise!.probes).toHaveLength(6);
    expect(r.noise!.scores).toHaveLength(6);
    for (const e of r.ranking) {
      expect(e.noiseReference).toBe(r.noise!.reference);
      expect(e.aboveNoise).toBe(e.low > r.noise!.reference);
    }
    // every inert input's interval reaches down to the reference (at noise), every probe's stays under it
    for (const f of ['x6', 'x7', 'x8', 'x9', 'x10']) expect(r.ranking.find((e) => e.feature === f)!.low).toBeLessThanOrEqual(r.noise!.reference);
    for (const p of r.noise!.scores) expect(p.high).toBeLessThanOrEqual(r.noise!.reference);
    // each repeat's real saliency shares still sum to 1 (probes are measured on the real quantities' scale)
    for (const s of r.methods.saliency!.perRepeat) expect(s.reduce((a, v) => a + v, 0)).toBeCloseTo(1, 10);
    // the per-method rankings carry their own reference
    expect(r.methods.saliency!.ranking[0]!.noiseReference).toBe(r.noise!.perMethod.saliency);
  }, 120_000);

  it('a linear model with known zero weights: y = 2a − b + 0·c + 0·d + 0·e + noise → a, b above, c, d, e at noise (common practice)', async () => {
    const n = 1200;
    const rng = new Rng(11);
    const cols = ['a', 'b', 'c', 'd', 'e'].map(() => Float64Array.from({ length: n }, () => rng.normal()));
    const y = Float64Array.from({ length: n }, (_, i) => 2 * cols[0]![i]! - cols[1]![i]! + 0.5 * rng.normal());
    const t = tableFromColumns([...['a', 'b', 'c', 'd', 'e'].map((nm, j) => real(nm, cols[j]!)), real('y', y)], 'linear');
    const r = await rankFeatures(t, { target: 'y', ...SMALL, methods: ['saliency', 'permutation'] });
    const mark = Object.fromEntries(r.ranking.map((e) => [e.feature, e.aboveNoise]));
    expect(mark).toEqual({ a: true, b: true, c: false, d: false, e: false });
    // no probes: no noise level, entries carry no mark
    const r0 = await rankFeatures(t, { target: 'y', ...SMALL, methods: ['saliency'], seeds: 1, epochs: 2, probes: 0 });
    expect(r0.noise).toBeUndefined();
    expect(r0.ranking[0]!.aboveNoise).toBeUndefined();
  }, 120_000);

  it('an integer target fitted as a regression reports the rounded hit rate beside RMSE', async () => {
    const n = 800;
    const rng = new Rng(5);
    const a = Float64Array.from({ length: n }, () => rng.int(5));
    const b = Float64Array.from({ length: n }, () => rng.normal());
    const y = Float64Array.from(a, (v) => 2 * v); // y = 2a exactly: an integer target
    const t = tableFromColumns([real('a', a), real('b', b), real('y', y)], 'ints');
    const r = await rankFeatures(t, { target: 'y', ...SMALL, seeds: 1, methods: ['saliency'], task: 'regression' });
    expect(r.model.roundedExact).toBeDefined();
    // ridge fits y = 2a exactly, so its rounded predictions are all right (least squares reproduces an exact linear law)
    expect(r.model.baselines.ridge.roundedExact!.score).toBe(1);
    // the constant baseline predicts the training mean (≈ 4), right only on rows with y = round(mean): about 1 in 5 (a uniform on 0..4)
    expect(r.model.baselines.constant.roundedExact!.score).toBeLessThan(0.35);
    await expect(rankFeatures(t, { target: 'y', probes: 51 })).rejects.toThrow(/expected probes to be at most 50 \(its ceiling\), got 51/);
  }, 120_000);
});
