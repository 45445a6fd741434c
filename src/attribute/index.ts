/** The attribution stage: the registered methods (saliency, SmoothGrad, integrated gradients, permutation importance; methods/), aggregation, rankFeatures. */
export { ATTRIBUTION_METHODS, type AttributionMethod, type FeatureGroup, type RepeatScores, type ScalarModel } from './types.ts';
export { columnMeans } from './column-mean.ts';
export { gradientSaliency } from './saliency.ts';
export { smoothGrad, type SmoothGradOptions } from './smoothgrad.ts';
export { integratedGradients, type IntegratedGradientsOptions, type IntegratedGradientsResult } from './integrated.ts';
export { permutationImportance, squaredErrorLoss, type PermutationOptions, type PermutationResult, type RowLoss } from './permutation.ts';
export { defaultGroups, declareGroups, sumOverGroups } from './groups.ts';
export { kendallTauB } from './kendall.ts';
export {
  aggregateRepeats,
  bootstrapReplicates,
  consensusRanking,
  meanPairwiseTau,
  normaliseScores,
  quantileSorted,
  type AggregateOptions,
  type MethodRanking,
} from './aggregate.ts';
export { ATTRIBUTION_REGISTRY, attributionStrategy, type AttributionStrategy, type MethodInput, type MethodOutput, type MethodSettings } from './methods/index.ts';
export { attributeRepeat, heldOutLoss, type AttributableModel, type ClassificationLoss, type RepeatAttribution, type RepeatSettings } from './repeat.ts';
export {
  rankFeatures,
  RANK_DEFAULTS,
  type Ablation,
  type RankEntry,
  type RankOptions,
  type RankProgress,
  type RankResult,
  type NoiseLevel,
  type Skill,
} from './rank.ts';
export { describeProbes, noiseReference, planProbes, probeColumns, type ProbeSpec } from './probes.ts';
