/**
 * Training, the same on every engine: seeded He initialisation, seeded mini-batch shuffles
 * (src/util/rng.ts, no engine random ops, so a seed repeats a run), Adam, early stopping on the
 * validation loss with the best weights restored. The engine (engines.ts) supplies the step.
 */
import { SurmiseError } from '../errors.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { kahanSum } from '../util/sum.ts';
import { batchSizeFor } from './batch-size.ts';
import { checkData, type TrainData } from './data.ts';
import { loadEngine, loadedTrainer, type EngineName, type Trainer } from './engines.ts';
import { makeLayout, type Layout } from './layout.ts';
import { chooseTask, resolveNetworkOptions, type NetworkOptions, type Task } from './options.ts';
import { networkFromJSON, type EpochRecord, type NetworkState, type TrainedNetwork } from './trained.ts';

export type EpochCallback = (e: EpochRecord) => void;

/** Adam constants (Kingma & Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015, Algorithm 1 defaults). */
export const BETA1 = 0.9;
export const BETA2 = 0.999;
export const EPS = 1e-7;
export const HUBER_DELTA = 1; // in standardized target units
/** Most classes an explicit task 'classification' accepts (the automatic choice stops at 50). */
const MAX_CLASSIFIER_OUTPUTS = 500;

/** He-normal initial weights (He et al., "Delving Deep into Rectifiers", ICCV 2015): N(0, 2/fan_in); output layer N(0, 1/fan_in); biases 0. */
export function initParams(L: Layout, seed: number): Float32Array {
  const P = new Float32Array(L.total);
  const rng = new Rng(deriveSeed(seed, 'init'));
  const nl = L.sizes.length - 1;
  for (let l = 0; l < nl; l++) {
    const fanIn = L.sizes[l]!;
    const sd = Math.sqrt((l === nl - 1 ? 1 : 2) / fanIn);
    const end = L.wOff[l]! + fanIn * L.sizes[l + 1]!;
    for (let k = L.wOff[l]!; k < end; k++) P[k] = sd * rng.normal();
  }
  return P;
}

/** The targets as the network sees them. */
export interface Prepared {
  task: Task;
  classes: number[] | null;
  yMean: number;
  yScale: number;
  /** per row: standardized target (regression) or class index (classification; −1 = unseen) */
  tTrain: Float32Array;
  tVal: Float32Array;
  unseen: number;
}

function prepareTargets(train: TrainData, val: TrainData, task: Task): Prepared {
  if (task === 'regression') {
    const yMean = kahanSum(train.y) / train.n;
    const dev = new Float64Array(train.n);
    for (let i = 0; i < train.n; i++) dev[i] = (train.y[i]! - yMean) ** 2;
    const sd = Math.sqrt(kahanSum(dev) / train.n);
    const yScale = sd > 0 ? sd : 1;
    const std = (y: Float64Array) => Float32Array.from(y, (v) => (v - yMean) / yScale);
    return { task, classes: null, yMean, yScale, tTrain: std(train.y), tVal: std(val.y), unseen: 0 };
  }
  const classes = [...new Set(train.y)].sort((a, b) => a - b);
  if (classes.length < 2) {
    throw new SurmiseError('learn.oneClass', `classification needs at least two distinct target values in the training rows, but every training row has the target value ${classes[0]}; a constant target leaves nothing to predict`);
  }
  if (classes.length > MAX_CLASSIFIER_OUTPUTS) {
    throw new SurmiseError(
      'learn.tooManyClasses',
      `classification over ${classes.length} distinct target values (at most ${MAX_CLASSIFIER_OUTPUTS}); learn this target as regression (task 'regression')`,
    );
  }
  const index = new Map(classes.map((c, k) => [c, k]));
  const tTrain = Float32Array.from(train.y, (v) => index.get(v)!);
  let unseen = 0;
  const tVal = Float32Array.from(val.y, (v) => {
    const k = index.get(v);
    if (k === undefined) {
      unseen++;
      return -1;
    }
    return k;
  });
  return { task, classes, yMean: 0, yScale: 1, tTrain, tVal, unseen };
}

/** Adam's step size at step t with both bias corrections folded in (Kingma & Ba 2015, Sec. 2): α√(1−β₂ᵗ)/(1−β₁ᵗ). */
export function adamRate(lr: number, t: number): number {
  return (lr * Math.sqrt(1 - BETA2 ** t)) / (1 - BETA1 ** t);
}

export function toF32(x: Float32Array | Float64Array): Float32Array {
  return x instanceof Float32Array ? x : Float32Array.from(x);
}

/** What an engine's trainer is built from. */
export interface TrainSetup {
  layout: Layout;
  options: NetworkOptions;
  prep: Prepared;
  /** output width: 1 (regression) or the number of classes */
  K: number;
  /** largest batch */
  B: number;
  /** validation inputs, row-major float32 */
  xv: Float32Array;
  nVal: number;
  /** initial parameters (the trainer owns them from here on) */
  P: Float32Array;
}

/**
 * Train a fully connected network on `train`, stopping early on `validation` (patience epochs
 * without improvement; the best weights are restored). Losses in `history` are per row, on the
 * standardized target for regression (MSE or Huber) and cross-entropy for classification.
 * `options.engine` chooses the engine ('auto': native when it loads, else tfjs).
 */
export async function trainNetwork(train: TrainData, validation: TrainData, opts: Partial<NetworkOptions> = {}, onEpoch?: EpochCallback): Promise<TrainedNetwork> {
  const o = resolveNetworkOptions(opts);
  return trainResolved(train, validation, o, onEpoch);
}

export async function trainResolved(train: TrainData, validation: TrainData, o: NetworkOptions, onEpoch?: EpochCallback): Promise<TrainedNetwork> {
  const engine = await loadEngine(o.engine);
  return networkFromJSON(trainToState(train, validation, o, onEpoch, engine.name));
}

/** The training loop proper (synchronous; the engine must be loaded). Returns the state of the best epoch. */
export function trainToState(train: TrainData, validation: TrainData, o: NetworkOptions, onEpoch: EpochCallback | undefined, engineName: EngineName): NetworkState {
  checkData(train, 'training rows');
  checkData(validation, 'validation rows', train.p);
  if (train.n < 1) throw new SurmiseError('learn.noRows', 'no training rows');
  if (validation.n < 1) throw new SurmiseError('learn.noRows', 'no validation rows: early stopping needs a validation split');
  const task = o.task ?? chooseTask(train.y);
  const prep = prepareTargets(train, validation, task);
  const K = task === 'classification' ? prep.classes!.length : 1;
  const p = train.p;
  const L = makeLayout([p, ...o.hidden, K]);
  const xt = toF32(train.x);
  const batchSize = o.batchSize ?? batchSizeFor(train.n);
  const B = Math.min(batchSize, train.n);
  const trainer: Trainer = loadedTrainer(engineName)({ layout: L, options: o, prep, K, B, xv: toF32(validation.x), nVal: validation.n, P: initParams(L, o.seed) });
  let best = trainer.parameters().slice();
  let bestLoss = Infinity;
  let bestEpoch = 0;
  let since = 0;
  const history: EpochRecord[] = [];
  const shuffle = new Rng(deriveSeed(o.seed, 'shuffle'));
  const xb = new Float32Array(B * p);
  const tb = new Float32Array(B);
  let step = 0;
  let epoch = 0;
  try {
    for (epoch = 1; epoch <= o.maxEpochs; epoch++) {
      const perm = shuffle.permutation(train.n);
      let lossSum = 0;
      for (let s = 0; s < train.n; s += B) {
        const rows = Math.min(B, train.n - s);
        for (let i = 0; i < rows; i++) {
          const r = perm[s + i]!;
          xb.set(xt.subarray(r * p, r * p + p), i * p);
          tb[i] = prep.tTrain[r]!;
        }
        step++;
        lossSum += trainer.step(xb, tb, rows, step);
      }
      const trainLoss = lossSum / train.n;
      const counted = validation.n - prep.unseen;
      const valLoss = counted > 0 ? trainer.validationLoss() / counted : NaN;
      const rec = { epoch, trainLoss, valLoss };
      history.push(rec);
      if (!Number.isFinite(trainLoss)) {
        throw new SurmiseError('learn.diverged', `training diverged at epoch ${epoch} (loss ${trainLoss}); lower learningRate (now ${o.learningRate})`, { epoch });
      }
      if (valLoss < bestLoss || !Number.isFinite(bestLoss)) {
        bestLoss = valLoss;
        bestEpoch = epoch;
        since = 0;
        best = trainer.parameters().slice();
      } else since++;
      onEpoch?.(rec);
      if (since > 0 && since >= o.patience) break; // `patience` epochs in a row without a better validation loss
    }
    return {
      format: 'surmise.network',
      version: 1,
      task,
      p,
      sizes: L.sizes,
      activation: o.activation,
      loss: o.loss,
      classes: prep.classes,
      yMean: prep.yMean,
      yScale: prep.yScale,
      params: Array.from(best),
      epochs: Math.min(epoch, o.maxEpochs),
      bestEpoch,
      history,
      options: { ...o, hidden: [...o.hidden], batchSize, task }, // as used
      unseenValidationRows: prep.unseen,
      engine: engineName,
    };
  } finally {
    trainer.dispose();
  }
}
