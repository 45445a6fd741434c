import { describe, it, expect } from 'vitest';
import { trainNetwork, loadEngine } from '../../src/learn/index.ts';
import { friedman } from '../helpers/friedman.ts';

/** Largest |a − b| / (1 + |b|). */
function worst(a: ArrayLike<number>, b: ArrayLike<number>): number {
  expect(a.length).toBe(b.length);
  let w = 0;
  for (let i = 0; i < a.length; i++) w = Math.max(w, Math.abs(a[i]! - b[i]!) / (1 + Math.abs(b[i]!)));
  return w;
}

const native = await loadEngine('native').then(() => true, () => false);

describe.skipIf(!native)('native and tfjs engines compute the same network from the same seed', () => {
  const cases = [
    { activation: 'relu', loss: 'mse', task: 'regression' },
    { activation: 'gelu', loss: 'huber', task: 'regression' },
    { activation: 'relu', loss: 'mse', task: 'classification' },
  ] as const;
  for (const c of cases) {
    it(`${c.activation}, ${c.loss}, ${c.task}: losses, weights, predictions and input gradients agree to float32 tolerance after a few steps`, async () => {
      const tr = friedman(400, 71);
      const va = friedman(150, 72);
      if (c.task === 'classification') {
        tr.y = Float64Array.from(tr.y, (v) => Math.min(3, Math.max(0, Math.floor(v / 6))));
        va.y = Float64Array.from(va.y, (v) => Math.min(3, Math.max(0, Math.floor(v / 6))));
      }
      // 400 rows in batches of 64: 7 Adam steps per epoch, 2 epochs, final partial batch included
      const o = { hidden: [32, 16], activation: c.activation, loss: c.loss, task: c.task, batchSize: 64, maxEpochs: 2, patience: 5, seed: 13 };
      const a = await trainNetwork(tr, va, { ...o, engine: 'native' });
      const b = await trainNetwork(tr, va, { ...o, engine: 'tfjs' });
      expect(a.engine).toBe('native');
      expect(b.engine).toBe('tfjs');
      const sa = a.toJSON();
      const sb = b.toJSON();
      expect(sa.engine).toBe('native');
      expect(sb.engine).toBe('tfjs');
      // common practice: two float32 implementations of the same arithmetic agree to ~1e-5 relative;
      // a few Adam steps (whose step is about lr in size whatever the gradient) keep it near that
      expect(worst(sa.history.flatMap((h) => [h.trainLoss, h.valLoss]), sb.history.flatMap((h) => [h.trainLoss, h.valLoss]))).toBeLessThan(2e-5);
      expect(worst(sa.params, sb.params)).toBeLessThan(2e-5);
      expect(worst(a.predict(va.x, va.n), b.predict(va.x, va.n))).toBeLessThan(2e-5);
      expect(worst(a.inputGradients(va.x, va.n), b.inputGradients(va.x, va.n))).toBeLessThan(1e-4);
      if (c.task === 'classification') {
        expect(worst(a.predictProba(va.x, va.n), b.predictProba(va.x, va.n))).toBeLessThan(1e-4);
        const ca = a.predictClass(va.x, va.n);
        const cb = b.predictClass(va.x, va.n);
        let same = 0;
        for (let i = 0; i < va.n; i++) if (ca[i] === cb[i]) same++;
        expect(same).toBeGreaterThanOrEqual(va.n - 1); // a near-tie may fall either way
      }
      a.dispose();
      b.dispose();
    });
  }

  it('a state saved by one engine rebuilds on the other with the same predictions', async () => {
    const tr = friedman(300, 81);
    const va = friedman(100, 82);
    const a = await trainNetwork(tr, va, { hidden: [16], maxEpochs: 2, seed: 2, engine: 'native' });
    const b = await trainNetwork(tr, va, { hidden: [16], maxEpochs: 2, seed: 2, engine: 'tfjs' });
    const { networkFromJSON } = await import('../../src/learn/index.ts');
    const onTfjs = networkFromJSON({ ...a.toJSON(), engine: 'tfjs' });
    expect(onTfjs.engine).toBe('tfjs');
    expect(worst(onTfjs.predict(va.x, va.n), a.predict(va.x, va.n))).toBeLessThan(1e-5);
    for (const m of [a, b, onTfjs]) m.dispose();
  });

  it("refuses an unknown engine with the option's name", async () => {
    await expect(trainNetwork(friedman(20, 1), friedman(10, 2), { engine: 'gpu' as never })).rejects.toThrow('expected engine to be one of auto, native, tfjs, got gpu');
  });
});
