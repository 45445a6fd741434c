import { describe, it, expect } from 'vitest';
import { trainMany, trainNetwork, networkFromJSON, initBackend, type TrainData } from '../../src/learn/index.ts';
import { Rng, deriveSeed } from '../../src/util/rng.ts';
import { SurmiseError } from '../../src/errors.ts';

function data(n: number, seed: number): TrainData {
  const r = new Rng(seed);
  const p = 6;
  const x = new Float64Array(n * p);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) x[i * p + j] = r.normal();
    y[i] = Math.sin(x[i * p]!) + x[i * p + 1]! * x[i * p + 2]! + 0.1 * r.normal();
  }
  return { x, y, n, p };
}

describe('trainMany', () => {
  it('gives the same networks in worker threads as in this thread (and as trainNetwork)', async () => {
    const tr = data(800, 1);
    const va = data(200, 2);
    const jobs = [0, 1, 2].map((k) => ({ train: tr, validation: va, options: { hidden: [16, 16], maxEpochs: 4, seed: deriveSeed(7, 'repeat', k) } }));
    const inWorkers = await trainMany(jobs, { workers: 2 });
    expect(inWorkers.ranIn).toBe('workers');
    const here = await trainMany(jobs, { workers: 0 });
    expect(here.ranIn).toBe('in-process');
    // determinism (common practice for reproducible runs): bit-identical weights and histories
    expect(inWorkers.states).toEqual(here.states);
    await initBackend('wasm');
    const direct = await trainNetwork(tr, va, jobs[1]!.options);
    expect(direct.toJSON().params).toEqual(inWorkers.states[1]!.params);
    const net = networkFromJSON(inWorkers.states[2]!);
    expect(Array.from(net.predict(va.x, va.n))).toEqual(Array.from(networkFromJSON(here.states[2]!).predict(va.x, va.n)));
    // different seeds give different networks
    expect(inWorkers.states[0]!.params).not.toEqual(inWorkers.states[1]!.params);
    direct.dispose();
    net.dispose();
  });

  it('falls back to this thread when workers cannot start, with the same result', async () => {
    const tr = data(300, 3);
    const va = data(100, 4);
    const jobs = [1, 2].map((seed) => ({ train: tr, validation: va, options: { hidden: [8], maxEpochs: 3, seed } }));
    const missing = new URL('./no-such-worker-module.mjs', import.meta.url);
    const fell = await trainMany(jobs, { workers: 2, workerModule: missing });
    expect(fell.ranIn).toBe('in-process');
    expect(fell.fallbackReason).toMatch(/worker/);
    expect(fell.states).toEqual((await trainMany(jobs, { workers: 0 })).states);
  });

  it('reports a bad job before anything runs, naming the job and the option', async () => {
    const tr = data(50, 1);
    await expect(trainMany([{ train: tr, validation: tr, options: {} }, { train: tr, validation: tr, options: { patience: -1 } }])).rejects.toThrow(
      'expected patience to be an integer ≥ 0, got -1',
    );
    const err = await trainMany([{ train: tr, validation: tr, options: { learningRate: 0 } }]).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SurmiseError);
    expect((err as SurmiseError).code).toBe('option.badValue'); // one code for a bad option value, as in every table
  });
});
