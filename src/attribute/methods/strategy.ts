/**
 * An attribution method as a registered strategy: a name (what `methods`, `--method` and the config
 * key `attribution.methods` take), a label and a one-line description, and `compute`, which scores
 * one repeat's held-out rows per feature group. Adding a method is one file in this folder and one
 * line in the list of index.ts; the library check, the CLI choices and help, the config schema and
 * the report all read that list.
 */
import type { AttributableModel, ClassificationLoss } from '../held-out-loss.ts';
import type { FeatureGroup, RepeatScores } from '../types.ts';

/** The settings of one repeat's attribution that the methods read (each takes the ones it needs). */
export interface MethodSettings {
  /** The repeat's attribution seed; each method derives its own from it. */
  seed: number;
  smoothGradSamples: number;
  smoothGradNoise: number;
  integratedSteps: number;
  permutationRepeats: number;
  /** Classification loss for permutation importance. Default 'error' (drop in accuracy). */
  classificationLoss?: ClassificationLoss;
}

/** One repeat's held-out rows (row-major n×p, standardized) and its feature groups. */
export interface MethodInput {
  model: AttributableModel;
  x: Float64Array;
  y: Float64Array;
  n: number;
  groups: readonly FeatureGroup[];
  settings: MethodSettings;
}

/** Group scores, and what a method measures besides them. */
export interface MethodOutput {
  scores: RepeatScores;
  /** Integrated gradients: mean and max |gap|, mean |f(x) − f(baseline)|. */
  completeness?: { meanAbsGap: number; maxAbsGap: number; meanAbsDelta: number };
  /** Permutation: held-out loss before shuffling (MSE, error rate or mean cross-entropy in nats). */
  baseLoss?: number;
}

export interface AttributionStrategy<N extends string = string> {
  /** Lower-case identifier, e.g. `smoothgrad`. */
  name: N;
  /** How prose names it, e.g. `integrated gradients`. */
  label: string;
  /** One line: what it measures and its published source. */
  description: string;
  compute(input: MethodInput): MethodOutput;
}
