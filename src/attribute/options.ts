import type { IntegerRange } from '../util/integer.ts';

/** Defaults: chosen to finish 20,000 rows in < 60 s on 2 cores (bench/attribute.ts, Friedman #1). */
export const RANK_DEFAULTS = Object.freeze({
  seeds: 3,
  folds: 0,
  hidden: [64, 64, 64] as readonly number[],
  activation: 'relu' as const,
  loss: 'mse' as const,
  epochs: 60,
  patience: 8,
  batchSize: 256,
  learningRate: 2e-3,
  seed: 1,
  attributionRows: 2000,
  smoothGradSamples: 16,
  smoothGradNoise: 0.15,
  integratedSteps: 32,
  permutationRepeats: 5,
  resamples: 1000,
  workers: 0,
  probes: 6,
});

/**
 * Ranges of rankFeatures' count options. Each ceiling keeps a run finite on a shared machine
 * (e.g. `seeds: 1e9` would train for ever); the README's option tables quote them.
 */
export const RANK_LIMITS = Object.freeze({
  seeds: { min: 1, max: 100 },
  folds: { min: 0, max: 50 },
  epochs: { min: 1, max: 10_000 },
  /** Epochs without improvement on the validation rows before training stops. */
  patience: { min: 0, max: 10_000 },
  /** Mini-batch size (default: chosen from the training rows, see batchSizeFor). */
  batchSize: { min: 1, max: 1 << 20 },
  /** Width of one hidden layer. */
  hiddenWidth: { min: 1, max: 4096 },
  /** Number of hidden layers. */
  hiddenLayers: { min: 0, max: 16 },
  dropTop: { min: 0, max: 100 },
  workers: { min: 0, max: 64 },
  seed: { min: 0, max: 0xffffffff },
  attributionRows: { min: 2, max: 1_000_000 },
  smoothGradSamples: { min: 1, max: 1000 },
  integratedSteps: { min: 1, max: 10_000 },
  permutationRepeats: { min: 1, max: 1000 },
  resamples: { min: 10, max: 100_000 },
  /** Noise probes per repeat (probes.ts): each is one more network input and attribution group. */
  probes: { min: 0, max: 50 },
} satisfies Record<string, IntegerRange>);
