import { describe, it, expect } from 'vitest';
import { SkillTally, secondFigure, skillOf } from '../../src/learn/skill.ts';
import { batchSizeFor } from '../../src/learn/batch-size.ts';
import { confusionCounts } from '../../src/learn/confusion.ts';
import { accuracy } from '../../src/learn/metrics.ts';

describe('skillOf / SkillTally', () => {
  it('averages each figure over the repeats (arithmetic mean) and keeps them per repeat', () => {
    const s = skillOf('r2', [0.5, 0.7, 0.9], [2, 1, 0], [0.25, 0.5, 0.75]);
    expect(s.score).toBeCloseTo(0.7, 15);
    expect(s.perRepeat).toEqual([0.5, 0.7, 0.9]);
    expect(s.secondary).toEqual({ metric: 'rmse', score: 1, perRepeat: [2, 1, 0] });
    expect(s.roundedExact).toEqual({ score: 0.5, perRepeat: [0.25, 0.5, 0.75] });
  });
  it('leaves out the rounded hit rate when a repeat has none (NaN), and names the classification figure', () => {
    const s = skillOf('accuracy', [1, 0.5], [0.75, 0.5], [Number.NaN, Number.NaN]);
    expect(s.secondary!.metric).toBe('balancedAccuracy');
    expect(s.roundedExact).toBeUndefined();
  });
  it('SkillTally collects figures and `skill(false)` drops the rounded hit rate', () => {
    const t = new SkillTally('r2');
    t.add({ score: 0.2, second: 3, exact: 1 });
    t.add({ score: 0.4, second: 5, exact: 0 });
    expect(t.skill()).toEqual(skillOf('r2', [0.2, 0.4], [3, 5], [1, 0]));
    expect(t.skill(false).roundedExact).toBeUndefined();
  });
  it('the second figure is RMSE for regression and balanced accuracy for classification', () => {
    expect(secondFigure({ metric: 'r2', score: 0.9, n: 3, rmse: 0.1 })).toBe(0.1);
    expect(secondFigure({ metric: 'accuracy', score: 0.9, n: 3, balancedAccuracy: 0.8 })).toBe(0.8);
  });
});

describe('batchSizeFor', () => {
  it('keeps about 8 steps per epoch on small tables and caps at 256 (our rule)', () => {
    expect(batchSizeFor(90)).toBe(8); // 90/8 = 11.25 → 2^3
    expect(batchSizeFor(1000)).toBe(64); // 125 → 2^6
    expect(batchSizeFor(14_000)).toBe(256); // 1750 → 1024, capped
    expect(batchSizeFor(1)).toBe(8);
  });
});

describe('confusionCounts', () => {
  it('its diagonal over n is the accuracy (definition), classes in increasing order', () => {
    const actual = [3, 1, 2, 2, 3, 1];
    const predicted = [3, 1, 1, 2, 2, 1];
    const c = confusionCounts(actual, predicted);
    expect(c.classes).toEqual([1, 2, 3]);
    expect(c.counts).toEqual([[2, 0, 0], [1, 1, 0], [0, 1, 1]]);
    const trace = c.counts.reduce((s, row, i) => s + row[i]!, 0);
    expect(trace / actual.length).toBe(accuracy(Float64Array.from(actual), Float64Array.from(predicted)));
  });
});
