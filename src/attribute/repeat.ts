import type { AttributionMethod, FeatureGroup, RepeatScores, ScalarModel } from './types.ts';
import { gradientSaliency } from './saliency.ts';
import { smoothGrad } from './smoothgrad.ts';
import { integratedGradients } from './integrated.ts';
import { permutationImportance, squaredErrorLoss, type RowLoss } from './permutation.ts';
import { sumOverGroups } from './groups.ts';
import { deriveSeed } from '../util/rng.ts';

/** A model as attribution sees it; a classifier also gives class probabilities (n×K) for its loss. */
export interface AttributableModel extends ScalarModel {
  /** Class values c_k (classification), else null/undefined. */
  classes?: readonly number[] | null;
  predictProba?(x: Float64Array, n: number): Float64Array;
  /** The most probable class value per row (classification). */
  predictClass?(x: Float64Array, n: number): Float64Array;
}

export interface RepeatSettings {
  methods: readonly AttributionMethod[];
  seed: number;
  smoothGradSamples: number;
  smoothGradNoise: number;
  integratedSteps: number;
  permutationRepeats: number;
  /** Classification loss for permutation importance. Default 'error' (drop in accuracy). */
  classificationLoss?: ClassificationLoss;
}

export interface RepeatAttribution {
  /** Group-level scores per method (groups in the order given). */
  scores: Partial<Record<AttributionMethod, RepeatScores>>;
  /** Integrated-gradients completeness: mean and max |gap|, mean |f(x) − f(baseline)|. */
  completeness?: { meanAbsGap: number; maxAbsGap: number; meanAbsDelta: number };
  /** Held-out loss before shuffling (permutation): MSE, error rate or mean cross-entropy (nats). */
  baseLoss?: number;
}

/** Held-out loss of a classifier for permutation importance. */
export type ClassificationLoss = 'error' | 'cross-entropy';

/**
 * Held-out loss per row for permutation importance. Regression: squared error (its mean is the MSE).
 * Classification, 'error' (default): 1 − [predicted class = y_i], so the importance is the drop in
 * accuracy; 'cross-entropy': −log p_{y_i}(x_i) (nats, floored at 1e-12), graded but measured ~8×
 * slower here because it reads every class probability (README). A class never seen in training
 * counts as an error / as the floor.
 */
export function heldOutLoss(model: AttributableModel, y: Float64Array, loss: ClassificationLoss = 'error'): RowLoss {
  const classes = model.classes;
  if (!classes) return squaredErrorLoss((x, n) => model.predict(x, n), y);
  if (loss === 'error') {
    if (!model.predictClass) throw new RangeError('heldOutLoss: a classifier needs predictClass');
    return (x, n) => {
      const c = model.predictClass!(x, n);
      return Float64Array.from({ length: n }, (_, i) => (c[i] === y[i] ? 0 : 1));
    };
  }
  if (!model.predictProba) throw new RangeError('heldOutLoss: cross-entropy needs predictProba');
  const K = classes.length;
  const index = new Map<number, number>(classes.map((c, k) => [c, k]));
  return (x, n) => {
    const pr = model.predictProba!(x, n);
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const k = index.get(y[i]!);
      out[i] = -Math.log(Math.max(1e-12, k === undefined ? 0 : pr[i * K + k]!));
    }
    return out;
  };
}

/**
 * Every asked method on one repeat's held-out rows (row-major n×p, standardized): gradient methods
 * per feature, then summed over each group's members; permutation per group (members shuffled jointly).
 * Integrated gradients use the all-zero baseline (the training means in standardized space).
 */
export function attributeRepeat(
  model: AttributableModel,
  x: Float64Array,
  y: Float64Array,
  n: number,
  groups: readonly FeatureGroup[],
  s: RepeatSettings,
): RepeatAttribution {
  const p = model.p;
  const out: RepeatAttribution = { scores: {} };
  for (const m of s.methods) {
    if (m === 'saliency') out.scores.saliency = sumOverGroups(gradientSaliency(model, x, n), p, groups);
    else if (m === 'smoothgrad') {
      const r = smoothGrad(model, x, n, { seed: deriveSeed(s.seed, 'smoothgrad'), samples: s.smoothGradSamples, noiseLevel: s.smoothGradNoise });
      out.scores.smoothgrad = sumOverGroups(r, p, groups);
    } else if (m === 'integrated') {
      const r = integratedGradients(model, x, n, { steps: s.integratedSteps });
      out.scores.integrated = sumOverGroups(r, p, groups);
      out.completeness = { meanAbsGap: r.meanAbsGap, maxAbsGap: r.maxAbsGap, meanAbsDelta: r.meanAbsDelta };
    } else if (m === 'permutation') {
      const r = permutationImportance(heldOutLoss(model, y, s.classificationLoss), x, n, p, groups, { seed: deriveSeed(s.seed, 'permutation'), repeats: s.permutationRepeats });
      out.scores.permutation = r;
      out.baseLoss = r.baseLoss;
    }
  }
  return out;
}
