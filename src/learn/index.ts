/** The learning stage: the network (engines: native ONNX runtime, tfjs wasm), baselines (constant, ridge), metrics and the predictability test (training repeats, skill, ablation). */
export { ENGINES, ENGINE_CHOICES, loadEngine, engineFailure, defaultEngineChoice, type Engine, type EngineChoice, type EngineName } from './engines.ts';
export { initBackend, ensureBackend, currentBackend, type BackendName } from './backend.ts';
export { type TrainData } from './data.ts';
export { DEFAULT_NETWORK_OPTIONS, NETWORK_OPTIONS, MAX_CLASSES, chooseTask, resolveNetworkOptions, type Activation, type LossName, type NetworkOptions, type Task } from './options.ts';
export { trainNetwork, type EpochCallback } from './train.ts';
export { networkFromJSON, type EpochRecord, type NetworkState, type TrainedNetwork } from './trained.ts';
export { fitConstant, type ConstantModel } from './constant.ts';
export { fitRidge, selectRidge, RIDGE_GRID, type RidgeModel, type RidgeSelection } from './ridge.ts';
export { r2, rmse, mae, accuracy, balancedAccuracy } from './metrics.ts';
export { evaluate, type Evaluation, type Predictor } from './evaluate.ts';
export { trainMany, type TrainJob, type TrainManyOptions, type TrainManyReport } from './many.ts';
export { planRepeats, rankSplitSpec, repeatData, type RepeatData, type RepeatPlan } from './repeats.ts';
export { SkillTallies, skillWithout, trainingUsed, trainRepeats, type OnUnits, type RepeatFit, type RepeatSet, type SkillSet, type TrainingSettings, type TrainingUsed } from './predictability.ts';
export { SkillTally, secondFigure, skillOf, type Figures, type Skill } from './skill.ts';
export { batchSizeFor } from './batch-size.ts';
export { roundedHitRate } from './rounded.ts';
export { confusionCounts, type Confusion } from './confusion.ts';
