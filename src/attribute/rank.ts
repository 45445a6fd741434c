/**
 * rankFeatures: which inputs predict the target. The learn stage's predictability test
 * (learn/predictability.ts) plans the repeats (seed × fold), standardizes the inputs on each
 * repeat's training rows, trains the network and scores it and the two baselines (constant, ridge)
 * on the held-out rows; this module runs the asked attribution methods (registered in methods/)
 * on (a seeded subsample of) those held-out rows while each network is alive. Each method's group scores are then
 * aggregated over the repeats (normalised to sum 1, mean, bootstrap interval, Kendall τ-b), and the
 * headline `ranking` is the consensus of the methods (each repeat's normalised scores averaged
 * over methods; see consensusRanking). Free of CLI concerns: the CLI and the run stage call it.
 */
import type { StandardizerState } from '../table/standardize.ts';
import { dependenceCurves } from './dependence.ts';
import type { Table } from '../table/types.ts';
import { buildDataset, type DropReport } from '../table/dataset.ts';
import { parseDerive } from '../table/expr/index.ts';
import { SurmiseError } from '../errors.ts';
import { badOption, checkOptions } from '../util/option-table.ts';
import { subsampleRows } from '../util/subsample.ts';
import { RANK_DEFAULTS, RANK_OPTIONS } from './options.ts';
import type { Activation, LossName } from '../learn/options.ts';
import { deriveSeed } from '../util/rng.ts';
import { chooseTask, type Task } from '../learn/options.ts';
import type { EngineChoice, EngineName } from '../learn/engines.ts';
import { confusionCounts } from '../learn/confusion.ts';
import { planRepeats, repeatData } from '../learn/repeats.ts';
import { SkillTallies, skillWithout, trainingUsed, trainRepeats, type RepeatFit, type TrainingSettings, type TrainingUsed } from '../learn/predictability.ts';
import type { Skill } from '../learn/skill.ts';
import { ATTRIBUTION_METHODS, attributionStrategy, type AttributionMethod } from './methods/index.ts';
import type { FeatureGroup, RepeatScores } from './types.ts';
import { attributeRepeat, type ClassificationLoss } from './repeat.ts';
import { aggregateRepeats, consensusRanking, meanPairwiseTau, type MethodRanking } from './aggregate.ts';
import { noiseReference, planProbes, probeColumns, probeGroups, withProbes, type ProbeSpec } from './probes.ts';

export { RANK_DEFAULTS } from './options.ts';
export type { Skill } from '../learn/skill.ts';
export type { TrainingUsed } from '../learn/predictability.ts';
export { batchSizeFor } from '../learn/batch-size.ts';

export interface RankOptions {
  /** Target column or expression. */
  target: string;
  features?: string[];
  exclude?: string[];
  /** `NAME=EXPR` derived columns, computed in order. */
  derive?: string[];
  /** Declared feature groups: name → member features or columns. */
  groups?: Record<string, string[]>;
  /** Methods to run; default all four. */
  methods?: AttributionMethod[];
  /** Network seeds per split. Default 3. */
  seeds?: number;
  /** 0: one random split per seed; K ≥ 2: K-fold. Default 0. */
  folds?: number;
  /** random | random:train,validation,test | kfold:K | where:EXPR (EXPR true → training side). Default random (70/15/15). */
  split?: string;
  /** 'auto' (default) chooses from the target. */
  task?: Task | 'auto';
  /** Hidden layer widths. Default RANK_DEFAULTS.hidden. */
  hidden?: number[];
  /** Most training epochs (early stopping may end sooner). Default RANK_DEFAULTS.epochs. */
  epochs?: number;
  /** Hidden-layer activation. Default 'relu'. */
  activation?: Activation;
  /** Regression loss ('huber' is less swayed by outlying rows). Default 'mse'. */
  loss?: LossName;
  /** Epochs without improvement on the validation rows before training stops. Default RANK_DEFAULTS.patience. */
  patience?: number;
  /** Mini-batch size. Default: batchSizeFor(training rows). */
  batchSize?: number;
  /** Adam learning rate. Default RANK_DEFAULTS.learningRate. */
  learningRate?: number;
  /** The one seed every other is derived from. Default 1. */
  seed?: number;
  /** Network engine: 'auto' (native when it loads, else tfjs), 'native' or 'tfjs'. Default: learn's default. */
  engine?: EngineChoice;
  /** Worker threads for training (learn's trainMany); 0 trains here with per-epoch progress. Default 0 (measured faster here; README). */
  workers?: number;
  /** Retrain without the K best groups and report the skill left. Default 0 (off). */
  dropTop?: number;
  /** Held-out rows used for attribution per repeat (seeded subsample). Default 2000. */
  attributionRows?: number;
  smoothGradSamples?: number;
  smoothGradNoise?: number;
  integratedSteps?: number;
  permutationRepeats?: number;
  /** Classification loss for permutation importance: 'error' (drop in accuracy, default) or 'cross-entropy'. */
  permutationLoss?: ClassificationLoss;
  /** Bootstrap resamples. Default 1000. */
  resamples?: number;
  /** Noise probes added to every repeat (half permuted copies of features, half Gaussian; see probes.ts). 0 = none. Default 6, at most 50. */
  probes?: number;
  onProgress?: (e: RankProgress) => void;
}

export interface RankProgress {
  phase: 'train' | 'attribute' | 'ablation';
  /** Units done and total (one unit per training epoch budget; see rankFeatures). */
  done: number;
  total: number;
  /** e.g. "seed 2/3, fold 1/5, epoch 14" */
  message: string;
}


export interface RankEntry {
  feature: string;
  /** Mean normalised score (shares summing to 1 over groups). */
  score: number;
  low: number;
  high: number;
  /** With noise probes: whether the whole interval lies above the probes' upper reference (`noiseReference`). */
  aboveNoise?: boolean;
  /** The probes' upper reference of this ranking (the largest upper interval end of any probe). */
  noiseReference?: number;
}

/** The noise level of a ranking, measured with probe columns that cannot predict the target. */
export interface NoiseLevel {
  probes: ProbeSpec[];
  /** The headline ranking's reference: the largest upper interval end of any probe. */
  reference: number;
  /** Per method run, that method's reference. */
  perMethod: Partial<Record<AttributionMethod, number>>;
  /** The probes' own headline entries (shares on the real quantities' scale), best first. */
  scores: RankEntry[];
  rule: string;
}

export interface RankResult {
  target: string;
  task: Task;
  features: string[];
  groups: Array<{ name: string; members: string[] }>;
  model: Skill & { baselines: { constant: Skill; ridge: Skill }; hidden: number[]; epochsRun: number[]; engine: EngineName; training: TrainingUsed };
  /** The consensus of the methods run (or the one method), best first. */
  ranking: RankEntry[];
  rankingMethod: 'consensus' | AttributionMethod;
  kendallTau: number | null;
  methods: Partial<Record<AttributionMethod, { ranking: RankEntry[]; kendallTau: number | null; perRepeat: number[][]; rawPerRepeat: number[][] }>>;
  /** Integrated gradients: completeness gap per repeat, relative to mean |f(x) − f(baseline)|. */
  completeness?: Array<{ meanAbsGap: number; maxAbsGap: number; meanAbsDelta: number }>;
  rows: DropReport;
  /** Seed indices 1..N, and the one seed they derive from. */
  seeds: number[];
  seed: number;
  folds: number;
  split: string;
  repeats: Array<{ seed: number; fold: number; split: string; train: number; validation: number; test: number; attributed: number; constantFeatures: string[]; standardizer: StandardizerState }>;
  interval: { level: number; resamples: number; resampledRows: boolean };
  ablation?: Ablation;
  /** Noise probes and the level they set; absent when `probes` is 0. Probes never enter `ranking`. */
  noise?: NoiseLevel;
  /** Held-out actual and predicted values of the first repeat (at most 5,000 rows, seeded sample); classification: the expected value Σ p_k·c_k. */
  predictions?: { actual: number[]; predicted: number[]; repeat: string; sampledFrom: number };
  /** Classification: counts of held-out rows of the first repeat by actual class (rows) and most probable class (columns). */
  confusion?: { classes: number[]; counts: number[][]; repeat: string };
  /** Partial dependence of the first repeat's network on each feature it saw, over at most 500 held-out rows, in the feature's own units. */
  dependence?: Array<{ feature: string; x: number[]; mean: number[] }>;
}

export interface Ablation {
  dropped: string[];
  features: string[];
  model: Skill;
  ridge: Skill;
  constant: Skill;
  /** The full model's skill on the same repeats, for comparison. */
  full: Skill;
}

/** Every option checked once against RANK_OPTIONS; `folds: 1` is refused (no single fold). */
function checkRankOptions(o: RankOptions): void {
  checkOptions(RANK_OPTIONS, o as unknown as Record<string, unknown>);
  if (o.folds === 1) throw badOption('folds', '0 (one random split) or at least 2', 1);
}

/**
 * Groups restricted to the columns a repeat's network sees: member indices become positions in
 * `kept`; a group with no kept member keeps an empty member list (its score is 0).
 */
function groupsOnKept(groups: readonly FeatureGroup[], kept: readonly number[]): FeatureGroup[] {
  const pos = new Map(kept.map((j, k) => [j, k]));
  return groups.map((g) => ({ name: g.name, members: g.members.filter((j) => pos.has(j)).map((j) => pos.get(j)!) }));
}

/** The first G groups of a ranking (the real quantities): order and Kendall τ-b recomputed on them alone. */
function realPart(r: MethodRanking, G: number): MethodRanking {
  if (r.groups.length === G) return r;
  const perRepeat = r.perRepeat.map((s) => s.slice(0, G));
  return {
    ...r,
    groups: r.groups.slice(0, G),
    mean: r.mean.slice(0, G),
    low: r.low.slice(0, G),
    high: r.high.slice(0, G),
    perRepeat,
    rawPerRepeat: r.rawPerRepeat.map((s) => s.slice(0, G)),
    kendallTau: meanPairwiseTau(perRepeat),
    order: r.order.filter((k) => k < G),
  };
}

/** The groups after the first G (the probes), best first. */
function probePart(r: MethodRanking, G: number): MethodRanking {
  return { ...r, groups: r.groups, order: r.order.filter((k) => k >= G) };
}

function entries(r: MethodRanking): RankEntry[] {
  return r.order.map((k) => ({ feature: r.groups[k]!, score: r.mean[k]!, low: r.low[k]!, high: r.high[k]! }));
}

/** Rank the table's features as predictors of the target; see the module comment. */
export async function rankFeatures(table: Table, options: RankOptions): Promise<RankResult> {
  checkRankOptions(options);
  const seed = options.seed ?? RANK_DEFAULTS.seed;
  const nSeeds = options.seeds ?? RANK_DEFAULTS.seeds;
  const folds = options.folds ?? RANK_DEFAULTS.folds;
  const hidden = [...(options.hidden ?? RANK_DEFAULTS.hidden)];
  const epochs = options.epochs ?? RANK_DEFAULTS.epochs;
  const methods = options.methods && options.methods.length ? [...new Set(options.methods)] : [...ATTRIBUTION_METHODS];
  const attributionRows = options.attributionRows ?? RANK_DEFAULTS.attributionRows;
  const resamples = options.resamples ?? RANK_DEFAULTS.resamples;
  const dropTop = options.dropTop ?? 0;
  const nProbes = options.probes ?? RANK_DEFAULTS.probes;

  const ds = buildDataset(table, {
    target: options.target,
    features: options.features,
    exclude: options.exclude,
    derive: (options.derive ?? []).map((d) => parseDerive(d)),
    groups: options.groups,
  });
  const p = ds.featureNames.length;
  if (p === 0) throw new SurmiseError('rank.noFeatures', `no numeric feature columns are left to predict '${options.target}' from`);
  const groups: FeatureGroup[] = ds.groups.map((g) => ({ name: g.name, members: [...g.members] }));
  const task: Task = options.task === undefined || options.task === 'auto' ? chooseTask(ds.y, ds.targetKind) : options.task;
  if (dropTop >= groups.length) {
    throw new SurmiseError('option.badValue', `\`dropTop\` ${dropTop} would drop every one of the ${groups.length} feature groups; use at most ${groups.length - 1}`, { option: 'dropTop' });
  }

  const { plans, spec } = planRepeats(table, ds, { seed, seeds: nSeeds, folds, split: options.split });
  const R = plans.length;
  const all = Array.from({ length: p }, (_, j) => j);
  const probes = planProbes(ds.featureNames, nProbes, seed);
  const G = groups.length;
  const allGroups = [...groups, ...probeGroups(probes, p)];
  const allWithProbes = Array.from({ length: p + probes.length }, (_, j) => j);
  const training: TrainingSettings = {
    hidden,
    epochs,
    activation: options.activation ?? RANK_DEFAULTS.activation,
    loss: options.loss ?? RANK_DEFAULTS.loss,
    patience: options.patience ?? RANK_DEFAULTS.patience,
    learningRate: options.learningRate ?? RANK_DEFAULTS.learningRate,
    batchSize: options.batchSize ?? null,
    workers: options.workers ?? RANK_DEFAULTS.workers,
    integerTarget: ds.y.every((v) => Number.isInteger(v)),
    ...(options.engine ? { engine: options.engine } : {}),
  };
  const unitsPerRepeat = epochs;
  const total = R * unitsPerRepeat * (dropTop > 0 ? 2 : 1);
  const report = (phase: RankProgress['phase'], done: number, message: string) => options.onProgress?.({ phase, done: Math.min(done, total), total, message });

  const byMethod = new Map<AttributionMethod, RepeatScores[]>(methods.map((m) => [m, []]));
  const tallies = new SkillTallies(task);
  const epochsRun: number[] = [];
  let engine: EngineName | undefined;
  const completeness: RankResult['completeness'] = [];
  const repeatsInfo: RankResult['repeats'] = [];
  // the probes are drawn once and kept in every repeat, like a real inert column: a chance
  // in-sample link to the target then shows in the probes as it does in the real columns
  const dsProbed = probes.length ? withProbes(ds, probes, probeColumns(ds, probes, deriveSeed(seed, 'probes'))) : ds;
  const datas = plans.map((plan) => repeatData(dsProbed, plan, probes.length ? allWithProbes : all));
  let predictions: RankResult['predictions'];
  let confusion: RankResult['confusion'];
  let dependence: RankResult['dependence'];
  const labels = plans.map((q) => q.label);
  const fits = trainRepeats({ datas, seeds: plans.map((q) => q.seed), labels, task, training }, (u, m) => report('train', u, m));
  for (let r = 0; r < R; r++) {
    const plan = plans[r]!;
    const d = datas[r]!;
    const label = plan.label;
    const pk = d.kept.length;
    const fit = (await fits.next()).value as RepeatFit;
    try {
      tallies.add(fit);
      epochsRun.push(fit.epochsRun);
      engine ??= fit.net.engine;
      report('attribute', (r + 1) * unitsPerRepeat, `${label}: attributing`);
      const rows = subsampleRows(d.test.n, attributionRows, deriveSeed(plan.seed, 'attribution-rows'));
      const xa = new Float64Array(rows.length * pk);
      const ya = new Float64Array(rows.length);
      rows.forEach((i, k) => {
        xa.set(d.test.x.subarray(i * pk, (i + 1) * pk), k * pk);
        ya[k] = d.test.y[i]!;
      });
      const att = attributeRepeat(fit.net, xa, ya, rows.length, groupsOnKept(allGroups, d.kept), {
        methods,
        seed: deriveSeed(plan.seed, 'attribution'),
        smoothGradSamples: options.smoothGradSamples ?? RANK_DEFAULTS.smoothGradSamples,
        smoothGradNoise: options.smoothGradNoise ?? RANK_DEFAULTS.smoothGradNoise,
        integratedSteps: options.integratedSteps ?? RANK_DEFAULTS.integratedSteps,
        permutationRepeats: options.permutationRepeats ?? RANK_DEFAULTS.permutationRepeats,
        classificationLoss: options.permutationLoss ?? 'error',
      });
      for (const m of methods) byMethod.get(m)!.push(att.scores[m]!);
      if (r === 0) {
        const all0 = fit.net.predict(d.test.x, d.test.n);
        const keepRows = subsampleRows(d.test.n, 5000, deriveSeed(plan.seed, 'prediction-plot'));
        predictions = {
          actual: Array.from(keepRows, (i) => d.test.y[i]!),
          predicted: Array.from(keepRows, (i) => all0[i]!),
          repeat: label,
          sampledFrom: d.test.n,
        };
        if (task === 'classification') confusion = { ...confusionCounts(d.test.y, fit.net.predictClass(d.test.x, d.test.n)), repeat: label };
        dependence = dependenceCurves((x, m) => fit.net.predict(x, m), d, ds.featureNames, deriveSeed(plan.seed, 'dependence-rows'));
      }
      if (att.completeness) completeness.push(att.completeness);
      repeatsInfo.push({ seed: plan.seed, fold: plan.fold, split: plan.description, train: d.train.n, validation: d.validation.n, test: d.test.n, attributed: rows.length, constantFeatures: d.constant.filter((c) => ds.featureNames.includes(c)), standardizer: d.standardizer });
    } finally {
      fit.net.dispose();
    }
  }

  const names = allGroups.map((g) => g.name);
  const aggSeed = deriveSeed(seed, 'bootstrap');
  const agg = { seed: aggSeed, resamples, normaliseOver: G };
  const perMethodAll = methods.map((m) => aggregateRepeats(m, names, byMethod.get(m)!, agg));
  const consensusAll = methods.length > 1 ? consensusRanking(names, methods.map((m) => byMethod.get(m)!), agg) : perMethodAll[0]!;
  const perMethod = perMethodAll.map((r) => realPart(r, G));
  const consensus = realPart(consensusAll, G);
  const marked = (all: MethodRanking): RankEntry[] => {
    const e = entries(realPart(all, G));
    if (!probes.length) return e;
    const ref = noiseReference(all.high.slice(G));
    return e.map((x) => ({ ...x, aboveNoise: x.low > ref, noiseReference: ref }));
  };

  const skills = tallies.skills();
  const result: RankResult = {
    target: ds.targetName,
    task,
    features: [...ds.featureNames],
    groups: groups.map((g) => ({ name: g.name, members: g.members.map((j) => ds.featureNames[j]!) })),
    model: {
      ...skills.model,
      baselines: { constant: skills.constant, ridge: skills.ridge },
      hidden,
      epochsRun,
      engine: engine!,
      training: trainingUsed(training, datas),
    },
    ranking: marked(consensusAll),
    rankingMethod: methods.length > 1 ? 'consensus' : methods[0]!,
    kendallTau: consensus.kendallTau,
    methods: Object.fromEntries(
      perMethod.map((r, k) => [r.method, { ranking: marked(perMethodAll[k]!), kendallTau: r.kendallTau, perRepeat: r.perRepeat, rawPerRepeat: r.rawPerRepeat }]),
    ),
    rows: ds.drops,
    seeds: Array.from({ length: nSeeds }, (_, k) => k + 1),
    seed,
    folds,
    split: spec,
    repeats: repeatsInfo,
    interval: { level: consensus.level, resamples: consensus.resamples, resampledRows: consensus.resampledRows },
  };
  if (completeness.length) result.completeness = completeness;
  if (probes.length) {
    result.noise = {
      probes,
      reference: noiseReference(consensusAll.high.slice(G)),
      perMethod: Object.fromEntries(perMethodAll.map((r) => [r.method, noiseReference(r.high.slice(G))])),
      scores: entries(probePart(consensusAll, G)),
      rule: 'above the noise level when the whole interval lies above the largest upper interval end of any probe',
    };
  }
  if (predictions) result.predictions = predictions;
  if (confusion) result.confusion = confusion;
  if (dependence) result.dependence = dependence;

  if (dropTop > 0) {
    const dropped = consensus.order.slice(0, dropTop).map((k) => groups[k]!);
    const gone = new Set(dropped.flatMap((g) => g.members));
    const keep = all.filter((j) => !gone.has(j));
    const without = dropped.map((g) => g.name).join(', ');
    const abl = plans.map((plan) => repeatData(ds, plan, keep));
    const ablationSet = { datas: abl, seeds: plans.map((q) => deriveSeed(q.seed, 'ablation')), labels, task, training };
    const left = await skillWithout(ablationSet, (u, m) => report('ablation', R * unitsPerRepeat + u, `without ${without}: ${m}`));
    result.ablation = {
      dropped: dropped.map((g) => g.name),
      features: keep.map((j) => ds.featureNames[j]!),
      model: left.model,
      ridge: left.ridge,
      constant: left.constant,
      full: tallies.skills(false).model,
    };
  }
  report('attribute', total, 'done');
  return result;
}
