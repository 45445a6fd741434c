import type { AttributionMethod, FeatureGroup, RepeatScores } from './types.ts';
import type { AttributableModel } from './held-out-loss.ts';
import { attributionStrategy, type MethodOutput, type MethodSettings } from './methods/index.ts';

export { heldOutLoss, type AttributableModel, type ClassificationLoss } from './held-out-loss.ts';

export interface RepeatSettings extends MethodSettings {
  methods: readonly AttributionMethod[];
}

/** Group-level scores per method (groups in the order given), and what the methods measured besides. */
export interface RepeatAttribution extends Omit<MethodOutput, 'scores'> {
  scores: Partial<Record<AttributionMethod, RepeatScores>>;
}

/**
 * Every asked method on one repeat's held-out rows (row-major n×p, standardized), each by its
 * registered strategy (methods/): gradient methods per feature, then summed over each group's
 * members; permutation per group (members shuffled jointly). Integrated gradients use the
 * all-zero baseline (the training means in standardized space).
 */
export function attributeRepeat(
  model: AttributableModel,
  x: Float64Array,
  y: Float64Array,
  n: number,
  groups: readonly FeatureGroup[],
  s: RepeatSettings,
): RepeatAttribution {
  const out: RepeatAttribution = { scores: {} };
  for (const m of s.methods) {
    const r = attributionStrategy(m).compute({ model, x, y, n, groups, settings: s });
    out.scores[m] = r.scores;
    if (r.completeness) out.completeness = r.completeness;
    if (r.baseLoss !== undefined) out.baseLoss = r.baseLoss;
  }
  return out;
}
