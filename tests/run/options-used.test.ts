/**
 * Settings of the run configuration reach training, and the run records the ones used.
 * (Before: network.activation, loss, patience, batchSize and learningRate were accepted and
 * ignored, and config.yaml recorded a learning rate that was not used.) Invented data only:
 * y = 2u − v on a grid, so a linear relation the network can learn.
 */
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { parseConfig } from '../../src/run/config.ts';
import { executeRun } from '../../src/run/run.ts';
import { rankFeatures, RANK_DEFAULTS } from '../../src/attribute/rank.ts';
import { tableFromColumns } from '../../src/table/columns.ts';
import { tempDir, put } from '../table/helpers.ts';

function grid(n: number): { u: number[]; v: number[]; y: number[] } {
  const u: number[] = [];
  const v: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < n; i++) {
    u.push(1 + (i % 17) / 4);
    v.push(((i * 7) % 23) / 5);
    y.push(2 * u[i]! - v[i]!);
  }
  return { u, v, y };
}

describe('network settings reach training', () => {
  it('run: activation, loss, patience, batchSize and learningRate of the configuration are the ones trained with and recorded', async () => {
    const dir = tempDir('options-used');
    const g = grid(160);
    put(dir, 't.csv', 'u,v,y\n' + g.u.map((u, i) => `${u},${g.v[i]},${g.y[i]}`).join('\n') + '\n');
    const text = [
      'table: t.csv',
      'target: y',
      'network:',
      '  hidden: [6]',
      '  activation: gelu',
      '  loss: huber',
      '  epochs: 3',
      '  patience: 2',
      '  batchSize: 16',
      '  learningRate: 0.0123',
      '  engine: tfjs',
      'attribution:',
      '  seeds: 2',
      '  methods: [saliency]',
      'output: out',
      '',
    ].join('\n');
    put(dir, 'c.yaml', text);
    const loaded = parseConfig(text, join(dir, 'c.yaml'));
    const { results } = await executeRun(loaded);
    expect(results.rank!.model.training).toEqual({
      hidden: [6],
      activation: 'gelu',
      loss: 'huber',
      epochs: 3,
      patience: 2,
      learningRate: 0.0123,
      batchSize: [16, 16],
    });
    const recorded = parse(readFileSync(join(dir, 'out', 'config.yaml'), 'utf8')) as { network: Record<string, unknown> };
    expect(recorded.network.learningRate).toBe(0.0123);
    expect(recorded.network.batchSize).toBe(16);
  });

  it('run: the configuration defaults are the library defaults (one home), recorded as used', () => {
    const loaded = parseConfig('table: t.csv\ntarget: y\n', 'c.yaml', '.');
    expect(loaded.config.network.learningRate).toBe(RANK_DEFAULTS.learningRate);
    expect(loaded.config.network.patience).toBe(RANK_DEFAULTS.patience);
    expect(loaded.config.network.epochs).toBe(RANK_DEFAULTS.epochs);
    expect(loaded.config.network.hidden).toEqual([...RANK_DEFAULTS.hidden]);
    expect(loaded.config.network.batchSize).toBeUndefined(); // chosen from the training rows
    expect(loaded.config.attribution.seeds).toBe(RANK_DEFAULTS.seeds);
  });

  it('rankFeatures: the learning rate changes the trained network (same seed, same split)', async () => {
    const g = grid(200);
    const n = g.y.length;
    const t = tableFromColumns([
      { name: 'u', kind: 'real', values: Float64Array.from(g.u), missing: new Uint8Array(n) },
      { name: 'v', kind: 'real', values: Float64Array.from(g.v), missing: new Uint8Array(n) },
      { name: 'y', kind: 'real', values: Float64Array.from(g.y), missing: new Uint8Array(n) },
    ]);
    const base = { target: 'y', seeds: 1, epochs: 2, hidden: [4], methods: ['saliency' as const], engine: 'tfjs' as const, resamples: 10 };
    const slow = await rankFeatures(t, { ...base, learningRate: 1e-5 });
    const fast = await rankFeatures(t, { ...base, learningRate: 0.05 });
    expect(slow.model.training.learningRate).toBe(1e-5);
    expect(fast.model.training.learningRate).toBe(0.05);
    expect(slow.model.perRepeat[0]).not.toBe(fast.model.perRepeat[0]);
  });
});
