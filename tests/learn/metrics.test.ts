import { describe, it, expect } from 'vitest';
import * as ss from 'simple-statistics';
import { r2, rmse, mae, accuracy, balancedAccuracy, fitConstant, evaluate } from '../../src/learn/index.ts';
import { Rng } from '../../src/util/rng.ts';

describe('metrics', () => {
  const rng = new Rng(7);
  const y = Float64Array.from({ length: 200 }, () => rng.normal() * 3 + 1);
  const yhat = Float64Array.from(y, (v) => v + rng.normal());

  it('r2 agrees with simple-statistics rSquared on the same predictions', () => {
    const pts = Array.from(y, (v, i) => [i, v]);
    // simple-statistics rSquared(data, f) = 1 − SSres/SStot with f the predictor
    const ref = ss.rSquared(pts, (i: number) => yhat[i]!);
    expect(r2(y, yhat)).toBeCloseTo(ref, 12);
  });

  it('rmse and mae agree with simple-statistics', () => {
    const d = Array.from(y, (v, i) => v - yhat[i]!);
    expect(rmse(y, yhat)).toBeCloseTo(ss.rootMeanSquare(d), 12);
    expect(mae(y, yhat)).toBeCloseTo(ss.mean(d.map(Math.abs)), 12);
  });

  it('worked examples (hand-derived)', () => {
    expect(r2([1, 2, 3], [1, 2, 4])).toBeCloseTo(0.5, 15); // SSres 1, SStot 2
    expect(rmse([0, 0], [3, 4])).toBeCloseTo(Math.sqrt(12.5), 15);
    expect(accuracy([1, 2, 2], [1, 2, 1])).toBeCloseTo(2 / 3, 15);
    // 3 classes: recalls a 2/3, b 1/2, c 1/1 → mean 13/18 (accuracy would be 4/6)
    const t = [0, 0, 0, 1, 1, 2];
    const p = [0, 0, 1, 1, 0, 2];
    expect(balancedAccuracy(t, p)).toBeCloseTo((2 / 3 + 1 / 2 + 1) / 3, 15);
    expect(accuracy(t, p)).toBeCloseTo(4 / 6, 15);
    // majority-class guess: balanced accuracy 1/K (Brodersen et al. 2010)
    expect(balancedAccuracy([0, 0, 0, 1], [0, 0, 0, 0])).toBe(0.5);
  });

  it('constant baseline: mean for regression, majority (smallest on ties) for classes', () => {
    const c = fitConstant(y, 'regression');
    expect(c.value).toBeCloseTo(ss.mean(Array.from(y)), 12); // simple-statistics mean
    const k = fitConstant(new Float64Array([2, 2, 5, 5, 5, -1, -1, -1]), 'classification');
    expect(k.value).toBe(-1); // hand-derived: −1 and 5 tie at 3, the smaller wins
    const e = evaluate(k, { x: new Float64Array(4), y: new Float64Array([-1, -1, 5, 2]), n: 4, p: 1 });
    expect(e.metric).toBe('accuracy');
    expect(e.score).toBe(0.5);
    expect(e.balancedAccuracy).toBeCloseTo(1 / 3, 15); // recalls 1, 0, 0
  });
});
