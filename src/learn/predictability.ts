/**
 * The predictability test: does the target follow from the inputs at all? For every training
 * repeat (seed × fold, repeats.ts) it trains the network with early stopping on the validation
 * rows and scores it and the two baselines (constant: training mean or majority class; ridge:
 * penalty chosen on the validation rows) on the held-out rows. `trainRepeats` hands each repeat's
 * live network to the caller (the attribution stage) in repeat order; `skillWithout` retrains on a
 * subset of the features (ablation) and returns the skill left. Free of attribution concerns.
 */
import { batchSizeFor } from './batch-size.ts';
import { fitConstant } from './constant.ts';
import type { EngineChoice } from './engines.ts';
import { evaluate } from './evaluate.ts';
import { trainMany } from './many.ts';
import type { Activation, LossName, Task } from './options.ts';
import type { RepeatData } from './repeats.ts';
import { selectRidge } from './ridge.ts';
import { roundedHitRate } from './rounded.ts';
import { SkillTally, secondFigure, type Figures, type Skill } from './skill.ts';
import { trainNetwork } from './train.ts';
import { networkFromJSON, type TrainedNetwork } from './trained.ts';

/** The training settings every network of a test was trained with (batch size per repeat). */
export interface TrainingUsed {
  hidden: number[];
  activation: Activation;
  loss: LossName;
  epochs: number;
  patience: number;
  learningRate: number;
  batchSize: number[];
}

/** How to train: TrainingUsed with one batch size (null: batchSizeFor the training rows), plus where. */
export interface TrainingSettings extends Omit<TrainingUsed, 'batchSize'> {
  batchSize: number | null;
  /** Worker threads (trainMany); 0 trains here with per-epoch progress. */
  workers: number;
  engine?: EngineChoice;
  /** The target is integer-valued: regression figures include the rounded-prediction hit rate. */
  integerTarget: boolean;
}

/** The repeats of one test: their data, network seeds and progress labels (one each), the task and how to train. */
export interface RepeatSet {
  datas: readonly RepeatData[];
  seeds: readonly number[];
  labels: readonly string[];
  task: Task;
  training: TrainingSettings;
}

/** Progress: units done (one per epoch budget: repeat r, epoch e is r·epochs + e) and a message. */
export type OnUnits = (done: number, message: string) => void;

/** One repeat's fitted network and the held-out figures of it and of the two baselines. */
export interface RepeatFit {
  net: TrainedNetwork;
  model: Figures;
  constant: Figures;
  ridge: Figures;
  epochsRun: number;
}

/** The network's and both baselines' skill over the repeats of one test. */
export interface SkillSet {
  model: Skill;
  constant: Skill;
  ridge: Skill;
}

/** Figures of the network and both baselines collected over repeats. */
export class SkillTallies {
  private readonly model: SkillTally;
  private readonly constant: SkillTally;
  private readonly ridge: SkillTally;

  constructor(task: Task) {
    const metric = task === 'regression' ? 'r2' : 'accuracy';
    this.model = new SkillTally(metric);
    this.constant = new SkillTally(metric);
    this.ridge = new SkillTally(metric);
  }

  add(f: RepeatFit): void {
    this.model.add(f.model);
    this.constant.add(f.constant);
    this.ridge.add(f.ridge);
  }

  /** `rounded: false` leaves out the rounded hit rates. */
  skills(rounded = true): SkillSet {
    return { model: this.model.skill(rounded), constant: this.constant.skill(rounded), ridge: this.ridge.skill(rounded) };
  }
}

/** The settings as used: one batch size per repeat. */
export function trainingUsed(s: TrainingSettings, datas: readonly RepeatData[]): TrainingUsed {
  return {
    hidden: [...s.hidden],
    activation: s.activation,
    loss: s.loss,
    epochs: s.epochs,
    patience: s.patience,
    learningRate: s.learningRate,
    batchSize: datas.map((d) => s.batchSize ?? batchSizeFor(d.train.n)),
  };
}

/** Held-out figures of the network and both baselines fitted on the same repeat. */
function scoreRepeat(net: TrainedNetwork, d: RepeatData, task: Task, integerTarget: boolean): RepeatFit {
  const cm = fitConstant(d.train.y, task);
  const rm = selectRidge(d.train, d.validation, task).model;
  const figures = (m: Parameters<typeof evaluate>[0]): Figures => {
    const e = evaluate(m, d.test);
    const exact = integerTarget && task === 'regression' ? roundedHitRate(m.predict(d.test.x, d.test.n), d.test.y) : Number.NaN;
    return { score: e.score, second: secondFigure(e), exact };
  };
  return { net, model: figures(net), constant: figures(cm), ridge: figures(rm), epochsRun: net.epochs };
}

/**
 * Train one network per repeat. With `workers` ≥ 1 and several repeats, trainMany spreads them over
 * worker threads (progress then moves per finished network); otherwise they train here one after
 * another with per-epoch progress. The networks are identical either way (many.test.ts). Yields
 * each repeat's fit in repeat order; the caller disposes of each network.
 */
export async function* trainRepeats(set: RepeatSet, onUnits: OnUnits): AsyncGenerator<RepeatFit> {
  const { datas, seeds, labels, task, training: s } = set;
  const netOptions = (d: RepeatData, seed: number) => ({
    hidden: s.hidden,
    activation: s.activation,
    loss: s.loss,
    maxEpochs: s.epochs,
    patience: s.patience,
    batchSize: s.batchSize ?? batchSizeFor(d.train.n),
    learningRate: s.learningRate,
    seed,
    task,
    ...(s.engine ? { engine: s.engine } : {}),
  });
  if (s.workers >= 1 && datas.length > 1) {
    let finished = 0;
    const rep = await trainMany(
      datas.map((d, r) => ({ train: d.train, validation: d.validation, options: netOptions(d, seeds[r]!) })),
      {
        workers: s.workers,
        onJobDone: (i) => {
          finished++;
          onUnits(finished * s.epochs, `${labels[i]} trained (${finished}/${datas.length})`);
        },
      },
    );
    for (let r = 0; r < datas.length; r++) yield scoreRepeat(networkFromJSON(rep.states[r]!), datas[r]!, task, s.integerTarget); // on the engine trainMany loaded
    return;
  }
  for (let r = 0; r < datas.length; r++) {
    const d = datas[r]!;
    const net = await trainNetwork(d.train, d.validation, netOptions(d, seeds[r]!), (e) => onUnits(r * s.epochs + e.epoch, `${labels[r]}, epoch ${e.epoch}`));
    yield scoreRepeat(net, d, task, s.integerTarget);
  }
}

/**
 * Ablation: retrain on the repeats of `set` (built on fewer features) and return the skill left,
 * without rounded hit rates. Each network is disposed of as soon as it is scored.
 */
export async function skillWithout(set: RepeatSet, onUnits: OnUnits): Promise<SkillSet> {
  const tallies = new SkillTallies(set.task);
  for await (const fit of trainRepeats(set, onUnits)) {
    fit.net.dispose();
    tallies.add(fit);
  }
  return tallies.skills(false);
}
