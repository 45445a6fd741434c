/**
 * Training: seeded He initialisation, seeded mini-batch shuffles (src/util/rng.ts, no tfjs random
 * ops, so a seed repeats a run exactly), Adam written out with tensor ops, early stopping on the
 * validation loss with the best weights restored.
 */
import * as tf from '@tensorflow/tfjs';
import { SurmiseError } from '../errors.ts';
import { Rng, deriveSeed } from '../util/rng.ts';
import { kahanSum } from '../util/sum.ts';
import { ensureBackend } from './backend.ts';
import { checkData, type TrainData } from './data.ts';
import { backwardParams, disposeViews, forward, makeLayout, viewsFromParams, type Layout, type Views } from './layers.ts';
import { chooseTask, resolveNetworkOptions, type NetworkOptions, type Task } from './options.ts';
import { networkFromJSON, type EpochRecord, type NetworkState, type TrainedNetwork } from './trained.ts';

export type EpochCallback = (e: EpochRecord) => void;

/** Adam constants (Kingma & Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015, Algorithm 1 defaults). */
const BETA1 = 0.9;
const BETA2 = 0.999;
const EPS = 1e-7;
const HUBER_DELTA = 1; // in standardized target units
/** Most classes an explicit task 'classification' accepts (the automatic choice stops at 50). */
const MAX_CLASSIFIER_OUTPUTS = 500;

/** He-normal initial weights (He et al., "Delving Deep into Rectifiers", ICCV 2015): N(0, 2/fan_in); output layer N(0, 1/fan_in); biases 0. */
function initParams(L: Layout, seed: number): Float32Array {
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

interface Prepared {
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
    throw new SurmiseError('learn.oneClass', `classification needs at least two distinct target values in the training rows; found only ${classes[0]}`);
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

/** Loss (summed over the batch, as a scalar tensor) and ∂(mean loss)/∂out. */
function lossAndGrad(out: tf.Tensor2D, t: Float32Array, rows: number, K: number, prep: Prepared, o: NetworkOptions, wantGrad: boolean): { sum: tf.Scalar; dOut: tf.Tensor2D | null } {
  if (prep.task === 'regression') {
    const r = tf.sub(out, tf.tensor2d(t, [rows, 1]));
    if (o.loss === 'mse') {
      return { sum: tf.sum(tf.square(r)) as tf.Scalar, dOut: wantGrad ? (tf.mul(r, 2 / rows) as tf.Tensor2D) : null };
    }
    // Huber (Huber, Ann. Math. Statist. 35, 1964): ½r² for |r| ≤ δ, δ(|r| − ½δ) beyond
    const ar = tf.abs(r);
    const q = tf.minimum(ar, HUBER_DELTA);
    const sum = tf.sum(tf.add(tf.mul(tf.square(q), 0.5), tf.mul(tf.sub(ar, q), HUBER_DELTA))) as tf.Scalar;
    return { sum, dOut: wantGrad ? (tf.mul(tf.clipByValue(r, -HUBER_DELTA, HUBER_DELTA), 1 / rows) as tf.Tensor2D) : null };
  }
  // softmax cross-entropy; rows with an unseen class (index −1) have an all-zero one-hot and add nothing
  const oh = new Float32Array(rows * K);
  for (let i = 0; i < rows; i++) if (t[i]! >= 0) oh[i * K + t[i]!] = 1;
  const Y = tf.tensor2d(oh, [rows, K]);
  const logp = tf.logSoftmax(out);
  const sum = tf.neg(tf.sum(tf.mul(Y, logp))) as tf.Scalar;
  return { sum, dOut: wantGrad ? (tf.mul(tf.sub(tf.exp(logp), Y), 1 / rows) as tf.Tensor2D) : null };
}

/**
 * One Adam step in place (Kingma & Ba, ICLR 2015, Algorithm 1 with the bias corrections folded
 * into the step size): m ← β₁m + (1−β₁)g; v ← β₂v + (1−β₂)g²; θ ← θ − α_t m/(√v + ε),
 * α_t = α√(1−β₂ᵗ)/(1−β₁ᵗ). Plain loops over Float32Arrays: faster than tensor ops on wasm here.
 */
function adamStep(P: Float32Array, M: Float32Array, V: Float32Array, g: Float32Array, lr: number, t: number): void {
  const at = (lr * Math.sqrt(1 - BETA2 ** t)) / (1 - BETA1 ** t);
  for (let k = 0; k < P.length; k++) {
    const gk = g[k]!;
    const m = (M[k] = BETA1 * M[k]! + (1 - BETA1) * gk);
    const v = (V[k] = BETA2 * V[k]! + (1 - BETA2) * gk * gk);
    P[k] = P[k]! - (at * m) / (Math.sqrt(v) + EPS);
  }
}

function toF32(x: Float32Array | Float64Array): Float32Array {
  return x instanceof Float32Array ? x : Float32Array.from(x);
}

/** Mean validation loss (per row with a known target) under the current weights. */
function validationLoss(val: TrainData, xv: Float32Array, prep: Prepared, views: Views, o: NetworkOptions, K: number): number {
  const CH = 4096;
  let total = 0;
  for (let r0 = 0; r0 < val.n; r0 += CH) {
    const r1 = Math.min(val.n, r0 + CH);
    total += tf.tidy(() => {
      const X = tf.tensor2d(xv.subarray(r0 * val.p, r1 * val.p), [r1 - r0, val.p]);
      const { out } = forward(X, views, o.activation, false);
      return lossAndGrad(out, prep.tVal.subarray(r0, r1), r1 - r0, K, prep, o, false).sum.dataSync()[0]!;
    });
  }
  const counted = val.n - prep.unseen;
  return counted > 0 ? total / counted : NaN;
}

/**
 * Train a fully connected network on `train`, stopping early on `validation` (patience epochs
 * without improvement; the best weights are restored). Losses in `history` are per row, on the
 * standardized target for regression (MSE or Huber) and cross-entropy for classification.
 */
export async function trainNetwork(train: TrainData, validation: TrainData, opts: Partial<NetworkOptions> = {}, onEpoch?: EpochCallback): Promise<TrainedNetwork> {
  const o = resolveNetworkOptions(opts);
  return trainResolved(train, validation, o, onEpoch);
}

export async function trainResolved(train: TrainData, validation: TrainData, o: NetworkOptions, onEpoch?: EpochCallback): Promise<TrainedNetwork> {
  await ensureBackend();
  return networkFromJSON(trainToState(train, validation, o, onEpoch));
}

/** The training loop proper (synchronous; the backend must be ready). Returns the state of the best epoch. */
export function trainToState(train: TrainData, validation: TrainData, o: NetworkOptions, onEpoch?: EpochCallback): NetworkState {
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
  const xv = toF32(validation.x);

  const P = initParams(L, o.seed);
  const M = new Float32Array(L.total);
  const V = new Float32Array(L.total);
  let views = viewsFromParams(P, L);
  let best = P.slice();
  let bestLoss = Infinity;
  let bestEpoch = 0;
  let since = 0;
  const history: EpochRecord[] = [];
  const shuffle = new Rng(deriveSeed(o.seed, 'shuffle'));
  const B = Math.min(o.batchSize, train.n);
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
        const v0 = views;
        const res = tf.tidy(() => {
          const X = tf.tensor2d(rows === B ? xb : xb.slice(0, rows * p), [rows, p]);
          const fw = forward(X, v0, o.activation, true);
          const { sum, dOut } = lossAndGrad(fw.out, rows === B ? tb : tb.slice(0, rows), rows, K, prep, o, true);
          return { G: backwardParams(dOut!, fw, v0, o.activation), sum };
        });
        const g = res.G.dataSync() as Float32Array;
        lossSum += res.sum.dataSync()[0]!;
        adamStep(P, M, V, g, o.learningRate, step);
        tf.dispose([res.G, res.sum]);
        disposeViews(views);
        views = viewsFromParams(P, L);
      }
      const trainLoss = lossSum / train.n;
      const valLoss = validationLoss(validation, xv, prep, views, o, K);
      const rec = { epoch, trainLoss, valLoss };
      history.push(rec);
      if (!Number.isFinite(trainLoss)) {
        throw new SurmiseError('learn.diverged', `training diverged at epoch ${epoch} (loss ${trainLoss}); lower learningRate (now ${o.learningRate})`, { epoch });
      }
      if (valLoss < bestLoss || !Number.isFinite(bestLoss)) {
        bestLoss = valLoss;
        bestEpoch = epoch;
        since = 0;
        best = P.slice();
      } else since++;
      onEpoch?.(rec);
      if (since > 0 && since >= o.patience) break; // `patience` epochs in a row without a better validation loss
    }
    const params = Array.from(best);
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
      params,
      epochs: Math.min(epoch, o.maxEpochs),
      bestEpoch,
      history,
      options: { ...o, hidden: [...o.hidden], task },
      unseenValidationRows: prep.unseen,
    };
  } finally {
    disposeViews(views);
  }
}
