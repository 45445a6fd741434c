import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { trainNetwork } from '../../src/learn/train.ts';
import type { TrainedNetwork } from '../../src/learn/trained.ts';
import { gradientSaliency } from '../../src/attribute/saliency.ts';
import { integratedGradients } from '../../src/attribute/integrated.ts';
import { attributeRepeat } from '../../src/attribute/repeat.ts';
import { defaultGroups } from '../../src/attribute/groups.ts';
import { friedman1, uniformRows } from './analytic.ts';
import { Rng } from '../../src/util/rng.ts';

// Friedman #1 (Friedman 1991, Ann. Statist. 19) with N(0,1) noise, inputs standardized with the
// exact U(0,1) moments (mean 1/2, SD 1/√12), a small network trained on it.
const SD = 1 / Math.sqrt(12);
function friedmanData(n: number, seed: number) {
  const raw = uniformRows(n, 10, 0, 1, seed);
  const y = friedman1.predict(raw, n);
  const rng = new Rng(seed + 1);
  for (let i = 0; i < n; i++) y[i] += rng.normal();
  const x = Float64Array.from(raw, (v) => (v - 0.5) / SD);
  return { x, y, n, p: 10 };
}

describe('attribution of a trained network on Friedman #1', () => {
  let net: TrainedNetwork;
  const test = friedmanData(1500, 303);
  beforeAll(async () => {
    net = await trainNetwork(friedmanData(3000, 101), friedmanData(600, 202), { hidden: [32, 32], maxEpochs: 60, patience: 8, seed: 4, batchSize: 64, learningRate: 3e-3, task: 'regression' });
  }, 120_000);
  afterAll(() => net?.dispose());

  it('the network learned the function (held-out MSE well below the variance 23.8 + 1)', () => {
    const f = net.predict(test.x, test.n);
    let mse = 0;
    for (let i = 0; i < test.n; i++) mse += (f[i]! - test.y[i]!) ** 2 / test.n;
    // noise-free variance 23.83 (attribution-benchmarks.json); noise variance 1
    expect(mse).toBeLessThan(5);
  });

  it('every method (saliency, SmoothGrad, integrated gradients, permutation) ranks x1..x5 above x6..x10 (Friedman 1991: x6..x10 inert)', () => {
    const r = attributeRepeat(net, test.x, test.y, test.n, defaultGroups(Array.from({ length: 10 }, (_, j) => `x${j + 1}`)), {
      methods: ['saliency', 'smoothgrad', 'integrated', 'permutation'],
      seed: 1,
      smoothGradSamples: 8,
      smoothGradNoise: 0.15,
      integratedSteps: 16,
      permutationRepeats: 3,
    });
    for (const m of ['saliency', 'smoothgrad', 'integrated', 'permutation'] as const) {
      const s = Array.from(r.scores[m]!.scores);
      expect(Math.min(...s.slice(0, 5)), m).toBeGreaterThan(Math.max(...s.slice(5)));
    }
  });

  it('integrated-gradients completeness holds on the network to integration error (Sundararajan et al. 2017)', () => {
    const r = integratedGradients(net, test.x.subarray(0, 3000), 300, { steps: 64 });
    // float32 network, 64 trapezoid steps on a piecewise-linear (ReLU) path: well under 2 % of |Δf|
    expect(r.meanAbsGap).toBeLessThan(0.02 * r.meanAbsDelta);
    expect(r.meanAbsDelta).toBeGreaterThan(1);
  });

  it('network saliency is bounded by the analytic scale: inert inputs far below x4 (∂f/∂x4 = 10 in raw units)', () => {
    const s = gradientSaliency(net, test.x, test.n).scores;
    // in standardized units ∂f/∂z4 = 10·SD ≈ 2.89 (chain rule); a fitted net should be within 30 %
    expect(Math.abs(s[3]! - 10 * SD) / (10 * SD)).toBeLessThan(0.3);
  });
});
