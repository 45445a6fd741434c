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
}

export interface RepeatSettings {
  methods: readonly AttributionMethod[];
  seed: number;
  smoothGradSamples: number;
  smoothGradNoise: number;
  integratedSteps: number;
  permutationRepeats: number;
}

export interface RepeatAttribution {
  /** Group-level scores per method (groups in the order given). */
  scores: Partial<Record<AttributionMethod, RepeatScores>>;
  /** Integrated-gradients completeness: mean and max |gap|, mean |f(x) − f(baseline)|. */
  completeness?: { meanAbsGap: number; maxAbsGap: number; meanAbsDelta: number };
  /** Held-out loss before shuffling (permutation): MSE or mean cross-entropy (nats). */
  baseLoss?: number;
}

/**
 * Held-out loss per row for permutation importance. Regression: squared error. Classification:
 * cross-entropy −log p_{y_i}(x_i) (nats, probabilities floored at 1e-12), chosen over the drop in
 * accuracy because it moves with every change in the predicted probabilities, not only when the
 * arg-max flips, so weak features still get a graded score.
 */
export function heldOutLoss(model: AttributableModel, y: Float64Array): RowLoss {
  const classes = model.classes;
  if (!classes || !model.predictProba) return squaredErrorLoss((x, n) => model.predict(x, n), y);
  const K = classes.length;
  const index = new Map<number, number>(classes.map((c, k) => [c, k]));
  return (x, n) => {
    const pr = model.predictProba!(x, n);
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const k = index.get(y[i]!);
      // a held-out class never seen in training has probability 0 under the network: count the floor
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
      const r = permutationImportance(heldOutLoss(model, y), x, n, p, groups, { seed: deriveSeed(s.seed, 'permutation'), repeats: s.permutationRepeats });
      out.scores.permutation = r;
      out.baseLoss = r.baseLoss;
    }
  }
  return out;
}
