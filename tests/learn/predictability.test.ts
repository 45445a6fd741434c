import { describe, it, expect } from 'vitest';
import { tableFromRecords } from '../../src/table/columns.ts';
import { buildDataset } from '../../src/table/dataset.ts';
import { planRepeats, repeatData } from '../../src/learn/repeats.ts';
import { SkillTallies, skillWithout, trainRepeats, trainingUsed, type TrainingSettings } from '../../src/learn/predictability.ts';
import { evaluate } from '../../src/learn/evaluate.ts';
import { Rng } from '../../src/util/rng.ts';

// y = 2a − b + 0.1·ε with a, b, c ~ N(0,1): least squares recovers it, so the ridge baseline's held-out
// R² is ≈ 1 − 0.01/5.01 ≈ 0.998 (Var y = 4 + 1 + 0.01); the training mean predicts no better than
// the mean of the held-out rows, R² ≤ ~0 (definition of R²); without a and b nothing is left, R² ≈ 0
const rng = new Rng(3);
const rows = Array.from({ length: 400 }, () => {
  const a = rng.normal(), b = rng.normal(), c = rng.normal();
  return { a, b, c, y: 2 * a - b + 0.1 * rng.normal() };
});
const table = tableFromRecords(rows);
const ds = buildDataset(table, { target: 'y' });
const { plans } = planRepeats(table, ds, { seed: 1, seeds: 2, folds: 0 });
const S: TrainingSettings = { hidden: [8], activation: 'relu', loss: 'mse', epochs: 5, patience: 5, learningRate: 2e-3, batchSize: null, workers: 0, integerTarget: false };
const labels = plans.map((q) => q.label);

describe('the predictability test', () => {
  it('scores the network and both baselines on the held-out rows of every repeat', async () => {
    const datas = plans.map((q) => repeatData(ds, q, [0, 1, 2]));
    const tallies = new SkillTallies('regression');
    const units: number[] = [];
    let r = 0;
    for await (const fit of trainRepeats({ datas, seeds: plans.map((q) => q.seed), labels, task: 'regression', training: S }, (u) => units.push(u))) {
      expect(fit.model.score).toBe(evaluate(fit.net, datas[r]!.test).score); // the network's figure is its held-out R²
      tallies.add(fit);
      fit.net.dispose();
      r++;
    }
    expect(r).toBe(2);
    expect(Math.max(...units)).toBeLessThanOrEqual(2 * S.epochs);
    const s = tallies.skills();
    expect(s.ridge.score).toBeGreaterThan(0.99);
    expect(s.constant.score).toBeLessThan(0.02);
    expect(s.model.perRepeat).toHaveLength(2);
    expect(s.model.roundedExact).toBeUndefined(); // not an integer target
    expect(trainingUsed(S, datas).batchSize).toEqual(datas.map((d) => (d.train.n >= 2048 ? 256 : 2 ** Math.floor(Math.log2(d.train.n / 8)))));
  });

  it('ablation: without the two informative columns the ridge baseline has nothing left', async () => {
    const datas = plans.map((q) => repeatData(ds, q, [2]));
    const left = await skillWithout({ datas, seeds: plans.map((q) => q.seed), labels, task: 'regression', training: S }, () => {});
    expect(left.ridge.score).toBeLessThan(0.05);
    expect(left.model.roundedExact).toBeUndefined();
  });
});
