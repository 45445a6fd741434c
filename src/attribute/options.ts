/**
 * The options of rankFeatures: one table (key, type, range, default, meaning) that the library
 * checks its options against, the `rank` command builds its flags from and the run configuration
 * its keys from (`configKey` is the key path there: `network.epochs`, `attribution.seeds`, `seed`).
 * Defaults: chosen to finish 20,000 rows in < 60 s on 2 cores (bench/attribute.ts, Friedman #1). The
 * network's rows are learn's NETWORK_OPTIONS as they are (one default per option).
 */
import { defaultsOf, optionOf, type OptionTable } from '../util/option-table.ts';
import type { IntegerRange } from '../util/integer.ts';
import { MAX_AUTO_BATCH } from '../learn/batch-size.ts';
import { NETWORK_OPTIONS, SEED_MAX } from '../learn/options.ts';
import { ATTRIBUTION_METHODS } from './methods/index.ts';

/** A row of the network's table (learn's NETWORK_OPTIONS) as the ranking takes it: same range and default, config key `network.KEY`. */
type NetworkRow = (typeof NETWORK_OPTIONS)[number];
type AsRankRow<K extends NetworkRow['key'], A extends string> = Omit<Extract<NetworkRow, { key: K }>, 'key'> & { key: A; configKey: `network.${A}` };
function net<K extends NetworkRow['key']>(key: K): AsRankRow<K, K>;
function net<K extends NetworkRow['key'], A extends string>(key: K, as: A): AsRankRow<K, A>;
function net(key: NetworkRow['key'], as: string = key): unknown {
  return { ...optionOf(NETWORK_OPTIONS, key), key: as, configKey: `network.${as}` };
}

export const RANK_OPTIONS = [
  { key: 'features', type: 'list', default: null, description: 'use only these features (default: every numeric column but the target)' },
  { key: 'exclude', type: 'list', default: [], description: 'leave these columns out of the features' },
  { key: 'methods', type: 'list', min: 1, choices: ATTRIBUTION_METHODS, noun: 'an attribution method', default: ATTRIBUTION_METHODS, flag: 'method', configKey: 'attribution.methods', description: `attribution methods: ${ATTRIBUTION_METHODS.join('|')}|all, or a comma list` },
  { key: 'seeds', type: 'integer', min: 1, max: 100, default: 3, configKey: 'attribution.seeds', description: 'networks per split' },
  { key: 'folds', type: 'integer', min: 0, max: 50, default: 0, configKey: 'attribution.folds', description: '0 = one random split per seed; k ≥ 2 = k-fold cross-validation (1 is refused)' },
  { key: 'split', type: 'text', default: null, description: 'random | random:TRAIN,VALIDATION,TEST | kfold:K | where:CONDITION (default random 70/15/15, or kfold:K with folds K)' },
  net('task'),
  net('hidden'),
  net('maxEpochs', 'epochs'),
  net('activation'),
  net('loss'),
  net('patience'),
  net('batchSize'),
  net('learningRate'),
  net('engine'),
  {
    key: 'workers', type: 'integer', min: 0, max: 64, default: 0, configKey: 'network.workers',
    description: 'worker threads for training (0 = train in this thread)',
    inert: 'decides only where the networks train; each network keeps its own derived seed',
  },
  { key: 'seed', type: 'integer', min: 0, max: SEED_MAX, default: 1, description: 'the seed every other seed is derived from' },
  { key: 'dropTop', type: 'integer', min: 0, max: 100, default: 0, configKey: 'attribution.dropTop', description: 'also retrain without the k best groups and report the skill left' },
  { key: 'probes', type: 'integer', min: 0, max: 50, default: 6, configKey: 'attribution.probes', description: 'noise probes per repeat: half permuted copies of features, half Gaussian columns; 0 = none' },
  { key: 'permutationLoss', type: 'choice', choices: ['error', 'cross-entropy'], default: 'error', configKey: 'attribution.permutationLoss', description: 'classification loss of permutation importance: error (drop in accuracy) or cross-entropy' },
  { key: 'attributionRows', type: 'integer', min: 2, max: 1_000_000, default: 2000, configKey: 'attribution.rows', description: 'held-out rows attributed per repeat (a seeded subsample)' },
  { key: 'smoothGradSamples', type: 'integer', min: 1, max: 1000, default: 16, configKey: 'attribution.smoothGradSamples', description: 'noisy copies per row for SmoothGrad' },
  { key: 'smoothGradNoise', type: 'number', min: 0, max: 10, default: 0.15, configKey: 'attribution.smoothGradNoise', description: 'SmoothGrad noise, in standard deviations of the standardized inputs' },
  { key: 'integratedSteps', type: 'integer', min: 1, max: 10_000, default: 32, configKey: 'attribution.integratedSteps', description: 'Riemann steps of integrated gradients' },
  { key: 'permutationRepeats', type: 'integer', min: 1, max: 1000, default: 5, configKey: 'attribution.permutationRepeats', description: 'shuffles per feature group for permutation importance' },
  { key: 'resamples', type: 'integer', min: 10, max: 100_000, default: 1000, configKey: 'attribution.resamples', description: 'bootstrap resamples of the intervals' },
] as const satisfies OptionTable;

/** The defaults of RANK_OPTIONS by key (`batchSize: null` = chosen from the training rows). */
export const RANK_DEFAULTS = Object.freeze({
  ...(defaultsOf(RANK_OPTIONS) as {
    seeds: number; folds: number; hidden: readonly number[]; activation: 'relu'; loss: 'mse'; epochs: number; patience: number;
    learningRate: number; seed: number; attributionRows: number; smoothGradSamples: number; smoothGradNoise: number;
    integratedSteps: number; permutationRepeats: number; resamples: number; workers: number; probes: number; dropTop: number;
  }),
  /** The largest batch batchSizeFor chooses (a smaller table gets smaller batches). */
  batchSize: MAX_AUTO_BATCH,
});

const range = (key: string): IntegerRange => {
  const o = optionOf(RANK_OPTIONS, key);
  if (o.type !== 'integer' && o.type !== 'integers') throw new Error(`${key} is not an integer option`);
  return { min: o.min, max: o.max };
};

/** Ranges of rankFeatures' count options, read from RANK_OPTIONS (the README's option tables quote them). */
export const RANK_LIMITS = Object.freeze({
  seeds: range('seeds'),
  folds: range('folds'),
  epochs: range('epochs'),
  patience: range('patience'),
  batchSize: range('batchSize'),
  /** Width of one hidden layer. */
  hiddenWidth: range('hidden'),
  /** Number of hidden layers. */
  hiddenLayers: { min: 0, max: (optionOf(RANK_OPTIONS, 'hidden') as { maxItems: number }).maxItems },
  dropTop: range('dropTop'),
  workers: range('workers'),
  seed: range('seed'),
  attributionRows: range('attributionRows'),
  smoothGradSamples: range('smoothGradSamples'),
  integratedSteps: range('integratedSteps'),
  permutationRepeats: range('permutationRepeats'),
  resamples: range('resamples'),
  probes: range('probes'),
} satisfies Record<string, IntegerRange>);
