import type { IntegerRange } from '../util/integer.ts';

/**
 * Ranges of rankFeatures' count options. Each ceiling keeps a run finite on a shared machine
 * (e.g. `seeds: 1e9` would train for ever); the README's option tables quote them.
 */
export const RANK_LIMITS = Object.freeze({
  seeds: { min: 1, max: 100 },
  folds: { min: 0, max: 50 },
  epochs: { min: 1, max: 10_000 },
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
