/**
 * rankFeatures: which inputs predict the target. For every repeat (seed × fold) it standardizes the
 * inputs on the training rows, trains the network with early stopping on validation rows, scores it
 * and the two baselines (constant, ridge) on the held-out rows, and runs the asked attribution
 * methods on (a seeded subsample of) those held-out rows. Each method's group scores are then
 * aggregated over the repeats (normalised to sum 1, mean, bootstrap interval, Kendall τ-b), and the
 * headline `ranking` is the consensus of the methods (each repeat's normalised scores averaged
 * over methods; see consensusRanking). Free of CLI concerns: the CLI and the run stage call it.
 */
import type { StandardizerState } from '../table/standardize.ts';
import { dependenceGrid, partialDependence } from './dependence.ts';
import type { Table } from '../table/types.ts';
import { buildDataset, type Dataset, type DropReport } from '../table/dataset.ts';
import { parseDerive } from '../table/expr/index.ts';
import { SurmiseError } from '../errors.ts';
import { badOption, checkOptions } from '../util/option-table.ts';
import { RANK_DEFAULTS, RANK_OPTIONS } from './options.ts';
import type { Activation, LossName } from '../learn/options.ts';

export { RANK_DEFAULTS } from './options.ts';
import { deriveSeed, Rng } from '../util/rng.ts';
import { trainNetwork } from '../learn/train.ts';
import { trainMany } from '../learn/many.ts';
import { networkFromJSON, type TrainedNetwork } from '../learn/trained.ts';
import { chooseTask, type Task } from '../learn/options.ts';
import type { EngineChoice, EngineName } from '../learn/engines.ts';
import { fitConstant } from '../learn/constant.ts';
import { selectRidge } from '../learn/ridge.ts';
import { evaluate, type Evaluation } from '../learn/evaluate.ts';
import type { TrainData } from '../learn/data.ts';
import { ATTRIBUTION_METHODS, type AttributionMethod, type FeatureGroup, type RepeatScores } from './types.ts';
import { attributeRepeat, type ClassificationLoss } from './repeat.ts';
import { aggregateRepeats, consensusRanking, meanPairwiseTau, type MethodRanking } from './aggregate.ts';
import { planRepeats, repeatData, type RepeatData } from './prepare.ts';
import { noiseReference, planProbes, probeColumns, probeGroups, withProbes, type ProbeSpec } from './probes.ts';
import { roundedHitRate } from './rounded.ts';

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


/** The training settings every network of a ranking was trained with (batch size per repeat). */
export interface TrainingUsed {
  hidden: number[];
  activation: Activation;
  loss: LossName;
  epochs: number;
  patience: number;
  learningRate: number;
  batchSize: number[];
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

export interface Skill {
  metric: 'r2' | 'accuracy';
  /** Mean over repeats, and per repeat. */
  score: number;
  perRepeat: number[];
  /** The second held-out figure: RMSE (regression) or balanced accuracy (classification), mean and per repeat. */
  secondary?: { metric: 'rmse' | 'balancedAccuracy'; score: number; perRepeat: number[] };
  /** Integer target fitted as a regression: fraction of held-out rows the rounded prediction gets exactly right. */
  roundedExact?: { score: number; perRepeat: number[] };
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

/** Held-out rows by actual class (rows) and predicted class (columns), classes in increasing order. */
function confusionCounts(actual: Float64Array, predicted: Float64Array, repeat: string): NonNullable<RankResult['confusion']> {
  const classes = [...new Set([...actual, ...predicted])].sort((a, b) => a - b);
  const at = new Map(classes.map((c, k) => [c, k]));
  const counts = classes.map(() => classes.map(() => 0));
  for (let i = 0; i < actual.length; i++) counts[at.get(actual[i]!)!]![at.get(predicted[i]!)!]!++;
  return { classes, counts, repeat };
}

/** Partial dependence on every feature of a repeat, at most 500 held-out rows and 25 grid values, mapped back to the feature's units. */
function dependenceCurves(predict: (x: Float64Array, n: number) => Float64Array, d: RepeatData, names: readonly string[], seed: number): NonNullable<RankResult['dependence']> {
  const p = d.kept.length;
  const rows = subsample(d.test.n, 500, seed);
  const x = new Float64Array(rows.length * p);
  rows.forEach((i, k) => x.set(d.test.x.subarray(i * p, (i + 1) * p), k * p));
  return d.kept.map((j, c) => {
    const name = names[j]!;
    const curve = partialDependence(predict, x, rows.length, p, c, dependenceGrid(x, rows.length, p, c, 25));
    const s = d.standardizer.names.indexOf(name);
    const unit = (z: number) => (s < 0 ? z : d.standardizer.mean[s]! + d.standardizer.std[s]! * z);
    return { feature: name, x: curve.grid.map(unit), mean: curve.mean };
  });
}

/** Every option checked once against RANK_OPTIONS; `folds: 1` is refused (no single fold). */
function checkRankOptions(o: RankOptions): void {
  checkOptions(RANK_OPTIONS, o as unknown as Record<string, unknown>);
  if (o.folds === 1) throw badOption('folds', '0 (one random split) or at least 2', 1);
}

function skill(metric: 'r2' | 'accuracy', perRepeat: number[], second?: number[], exact?: number[]): Skill {
  const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;
  const out: Skill = { metric, score: mean(perRepeat), perRepeat };
  if (second && second.length === perRepeat.length) {
    out.secondary = { metric: metric === 'r2' ? 'rmse' : 'balancedAccuracy', score: mean(second), perRepeat: second };
  }
  if (exact && exact.length === perRepeat.length && exact.every((v) => !Number.isNaN(v))) out.roundedExact = { score: mean(exact), perRepeat: exact };
  return out;
}

/** The second figure of an evaluation: RMSE (regression) or balanced accuracy (classification). */
function second(e: Evaluation): number {
  return (e.metric === 'r2' ? e.rmse : e.balancedAccuracy) ?? Number.NaN;
}

/**
 * Groups restricted to the columns a repeat's network sees: member indices become positions in
 * `kept`; a group with no kept member keeps an empty member list (its score is 0).
 */
function groupsOnKept(groups: readonly FeatureGroup[], kept: readonly number[]): FeatureGroup[] {
  const pos = new Map(kept.map((j, k) => [j, k]));
  return groups.map((g) => ({ name: g.name, members: g.members.filter((j) => pos.has(j)).map((j) => pos.get(j)!) }));
}

/**
 * Mini-batch size: RANK_DEFAULTS.batchSize, shrunk on small tables so an epoch has at least about
 * 8 steps (a power of two, at least 8): 90 training rows give batches of 8, 14,000 give 256.
 */
export function batchSizeFor(nTrain: number): number {
  const b = 2 ** Math.floor(Math.log2(Math.max(1, nTrain / 8)));
  return Math.max(8, Math.min(RANK_DEFAULTS.batchSize, b));
}

/** Held-out scores of the network and both baselines, collected over repeats. */
class Scores {
  readonly net: number[] = [];
  readonly constant: number[] = [];
  readonly ridge: number[] = [];
  readonly net2: number[] = [];
  readonly constant2: number[] = [];
  readonly ridge2: number[] = [];
  readonly netExact: number[] = [];
  readonly constantExact: number[] = [];
  readonly ridgeExact: number[] = [];

  add(f: Fit): void {
    this.netExact.push(f.exact[0]);
    this.constantExact.push(f.exact[1]);
    this.ridgeExact.push(f.exact[2]);
    this.net.push(f.score);
    this.constant.push(f.constant);
    this.ridge.push(f.ridge);
    this.net2.push(f.score2);
    this.constant2.push(f.constant2);
    this.ridge2.push(f.ridge2);
  }
}

interface Fit {
  net: TrainedNetwork;
  score: number;
  constant: number;
  ridge: number;
  /** Second figures (RMSE or balanced accuracy) of the network and the two baselines. */
  score2: number;
  constant2: number;
  ridge2: number;
  /** Rounded-prediction hit rates of the network, constant and ridge (NaN unless an integer regression target). */
  exact: [number, number, number];
  epochsRun: number;
}

/**
 * Train one network per repeat. With `workers` ≥ 1 and several repeats, the learn stage's
 * trainMany spreads them over worker threads (both cores; progress then moves per finished
 * network); otherwise they train here one after another with per-epoch progress. The networks
 * are identical either way (the learn stage tests this). Yields each repeat's fitted network,
 * its held-out score and the two baselines' scores on the same split, in repeat order.
 */
async function* trainAll(
  datas: readonly RepeatData[],
  seeds: readonly number[],
  task: Task,
  o: Omit<TrainingUsed, 'batchSize'> & { batchSize: number | null; workers: number; integerTarget: boolean; engine?: EngineChoice },
  onUnits: (done: number, message: string) => void,
  labels: readonly string[],
): AsyncGenerator<Fit> {
  const netOptions = (d: RepeatData, seed: number) => ({
    hidden: o.hidden,
    activation: o.activation,
    loss: o.loss,
    maxEpochs: o.epochs,
    patience: o.patience,
    batchSize: o.batchSize ?? batchSizeFor(d.train.n),
    learningRate: o.learningRate,
    seed,
    task,
    ...(o.engine ? { engine: o.engine } : {}),
  });
  const score = (net: TrainedNetwork, d: RepeatData): Fit => {
    const e = evaluate(net, d.test);
    const cm = fitConstant(d.train.y, task);
    const rm = selectRidge(d.train, d.validation, task).model;
    const c = evaluate(cm, d.test);
    const rg = evaluate(rm, d.test);
    const hit = (m: { predict(x: typeof d.test.x, n: number): Float64Array }) =>
      o.integerTarget && task === 'regression' ? roundedHitRate(m.predict(d.test.x, d.test.n), d.test.y) : Number.NaN;
    const exact: [number, number, number] = [hit(net), hit(cm), hit(rm)];
    return { net, score: e.score, constant: c.score, ridge: rg.score, score2: second(e), constant2: second(c), ridge2: second(rg), exact, epochsRun: net.epochs };
  };
  if (o.workers >= 1 && datas.length > 1) {
    let finished = 0;
    const rep = await trainMany(
      datas.map((d, r) => ({ train: d.train, validation: d.validation, options: netOptions(d, seeds[r]!) })),
      {
        workers: o.workers,
        onJobDone: (i) => {
          finished++;
          onUnits(finished * o.epochs, `${labels[i]} trained (${finished}/${datas.length})`);
        },
      },
    );
    for (let r = 0; r < datas.length; r++) yield score(networkFromJSON(rep.states[r]!), datas[r]!); // on the engine trainMany loaded
    return;
  }
  for (let r = 0; r < datas.length; r++) {
    const d = datas[r]!;
    const net = await trainNetwork(d.train, d.validation, netOptions(d, seeds[r]!), (e) => onUnits(r * o.epochs + e.epoch, `${labels[r]}, epoch ${e.epoch}`));
    yield score(net, d);
  }
}

/** Seeded subsample of at most `max` of the n held-out rows (all of them when n ≤ max), in row order. */
function subsample(n: number, max: number, seed: number): Int32Array {
  if (n <= max) return Int32Array.from({ length: n }, (_, i) => i);
  return new Rng(seed).permutation(n).subarray(0, max).sort();
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
  const training = {
    hidden,
    epochs,
    activation: options.activation ?? RANK_DEFAULTS.activation,
    loss: options.loss ?? RANK_DEFAULTS.loss,
    patience: options.patience ?? RANK_DEFAULTS.patience,
    learningRate: options.learningRate ?? RANK_DEFAULTS.learningRate,
    batchSize: options.batchSize ?? null,
  };
  const methods = options.methods && options.methods.length ? [...new Set(options.methods)] : [...ATTRIBUTION_METHODS];
  const attributionRows = options.attributionRows ?? RANK_DEFAULTS.attributionRows;
  const resamples = options.resamples ?? RANK_DEFAULTS.resamples;
  const dropTop = options.dropTop ?? 0;
  const workers = options.workers ?? RANK_DEFAULTS.workers;
  const nProbes = options.probes ?? RANK_DEFAULTS.probes;

  const ds = buildDataset(table, {
    target: options.target,
    features: options.features,
    exclude: options.exclude,
    derive: (options.derive ?? []).map((d) => parseDerive(d)),
    groups: options.groups,
  });
  const n = ds.y.length;
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
  const integerTarget = ds.y.every((v) => Number.isInteger(v));
  const unitsPerRepeat = epochs;
  const total = R * unitsPerRepeat * (dropTop > 0 ? 2 : 1);
  const report = (phase: RankProgress['phase'], done: number, message: string) => options.onProgress?.({ phase, done: Math.min(done, total), total, message });

  const byMethod = new Map<AttributionMethod, RepeatScores[]>(methods.map((m) => [m, []]));
  const scores = new Scores();
  const epochsRun: number[] = [];
  let engine: EngineName | undefined;
  const completeness: RankResult['completeness'] = [];
  const repeatsInfo: RankResult['repeats'] = [];
  const metric: 'r2' | 'accuracy' = task === 'regression' ? 'r2' : 'accuracy';
  // the probes are drawn once and kept in every repeat, like a real inert column: a chance
  // in-sample link to the target then shows in the probes as it does in the real columns
  const dsProbed = probes.length ? withProbes(ds, probes, probeColumns(ds, probes, deriveSeed(seed, 'probes'))) : ds;
  const datas = plans.map((plan) => repeatData(dsProbed, plan, probes.length ? allWithProbes : all));
  let predictions: RankResult['predictions'];
  let confusion: RankResult['confusion'];
  let dependence: RankResult['dependence'];
  const fits = trainAll(datas, plans.map((q) => q.seed), task, { ...training, workers, integerTarget, engine: options.engine }, (u, m) => report('train', u, m), plans.map((q) => q.label));
  for (let r = 0; r < R; r++) {
    const plan = plans[r]!;
    const d = datas[r]!;
    const label = plan.label;
    const pk = d.kept.length;
    const fit = (await fits.next()).value as Fit;
    try {
      scores.add(fit);
      epochsRun.push(fit.epochsRun);
      engine ??= fit.net.engine;
      report('attribute', (r + 1) * unitsPerRepeat, `${label}: attributing`);
      const rows = subsample(d.test.n, attributionRows, deriveSeed(plan.seed, 'attribution-rows'));
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
        const keepRows = subsample(d.test.n, 5000, deriveSeed(plan.seed, 'prediction-plot'));
        predictions = {
          actual: Array.from(keepRows, (i) => d.test.y[i]!),
          predicted: Array.from(keepRows, (i) => all0[i]!),
          repeat: label,
          sampledFrom: d.test.n,
        };
        if (task === 'classification') confusion = confusionCounts(d.test.y, fit.net.predictClass(d.test.x, d.test.n), label);
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

  const result: RankResult = {
    target: ds.targetName,
    task,
    features: [...ds.featureNames],
    groups: groups.map((g) => ({ name: g.name, members: g.members.map((j) => ds.featureNames[j]!) })),
    model: {
      ...skill(metric, scores.net, scores.net2, scores.netExact),
      baselines: { constant: skill(metric, scores.constant, scores.constant2, scores.constantExact), ridge: skill(metric, scores.ridge, scores.ridge2, scores.ridgeExact) },
      hidden,
      epochsRun,
      engine: engine!,
      training: { ...training, hidden: [...hidden], batchSize: datas.map((d) => training.batchSize ?? batchSizeFor(d.train.n)) },
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
    const abScores = new Scores();
    const without = dropped.map((g) => g.name).join(', ');
    const abl = plans.map((plan) => repeatData(ds, plan, keep));
    for await (const fit of trainAll(abl, plans.map((q) => deriveSeed(q.seed, 'ablation')), task, { ...training, workers, integerTarget, engine: options.engine }, (u, m) => report('ablation', R * unitsPerRepeat + u, `without ${without}: ${m}`), plans.map((q) => q.label))) {
      fit.net.dispose();
      abScores.add(fit);
    }
    result.ablation = {
      dropped: dropped.map((g) => g.name),
      features: keep.map((j) => ds.featureNames[j]!),
      model: skill(metric, abScores.net, abScores.net2),
      ridge: skill(metric, abScores.ridge, abScores.ridge2),
      constant: skill(metric, abScores.constant, abScores.constant2),
      full: skill(metric, scores.net, scores.net2),
    };
  }
  report('attribute', total, 'done');
  return result;
}
