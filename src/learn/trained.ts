/**
 * A trained network: predictions, class predictions and input gradients in batches, and a plain
 * JSON state (`toJSON` / `networkFromJSON`) from which it is rebuilt exactly, on the engine that
 * trained it when that engine is loaded, else on the loaded one (the same arithmetic to float32 rounding).
 */
import { SurmiseError } from '../errors.ts';
import { loadedEngine, type EngineName } from './engines.ts';
import { makeLayout } from './layout.ts';
import type { Activation, LossName, NetworkOptions, Task } from './options.ts';

export interface EpochRecord {
  epoch: number;
  trainLoss: number;
  valLoss: number;
}

/** Everything needed to rebuild a network; plain JSON. */
export interface NetworkState {
  format: 'surmise.network';
  version: 1;
  task: Task;
  p: number;
  /** layer widths [p, h₁, …, out] */
  sizes: number[];
  activation: Activation;
  loss: LossName;
  /** classification: the sorted distinct training values; regression: null */
  classes: number[] | null;
  /** regression: the network predicts (y − yMean)/yScale (training mean and population SD) */
  yMean: number;
  yScale: number;
  /** all weights and biases, float32 values, layer by layer: W (in×out row-major) then b */
  params: number[];
  epochs: number;
  bestEpoch: number;
  history: EpochRecord[];
  options: NetworkOptions;
  /** validation rows whose target value never occurs in training (classification; left out of valLoss) */
  unseenValidationRows: number;
  /** the engine that trained it (absent in states saved before engines existed: tfjs) */
  engine?: EngineName;
}

export interface TrainedNetwork {
  task: Task;
  p: number;
  classes: number[] | null;
  epochs: number;
  bestEpoch: number;
  history: EpochRecord[];
  /** the engine computing this network's predictions and gradients */
  engine: EngineName;
  /** regression value; classification: expected value Σ p_k·c_k */
  predict(x: Float64Array | Float32Array, n: number): Float64Array;
  /** classification: the most probable class value (regression: same as predict) */
  predictClass(x: Float64Array | Float32Array, n: number): Float64Array;
  /** ∂(predict)/∂x, n×p row-major (classification: of the expected value Σ p_k·c_k) */
  inputGradients(x: Float64Array | Float32Array, n: number): Float64Array;
  /** class probabilities, n×K row-major (classification only) */
  predictProba(x: Float64Array | Float32Array, n: number): Float64Array;
  toJSON(): NetworkState;
  dispose(): void;
}

/** What every engine's network holds from its state: the public fields and `toJSON`. */
export abstract class NetworkBase {
  readonly task: Task;
  readonly p: number;
  readonly classes: number[] | null;
  readonly epochs: number;
  readonly bestEpoch: number;
  readonly history: EpochRecord[];
  protected readonly state: NetworkState;

  constructor(state: NetworkState) {
    this.state = state;
    this.task = state.task;
    this.p = state.p;
    this.classes = state.classes;
    this.epochs = state.epochs;
    this.bestEpoch = state.bestEpoch;
    this.history = state.history;
  }

  toJSON(): NetworkState {
    return structuredClone(this.state);
  }
}

/** Check a state's fields (it may come from a file) and build the network. */
export function networkFromJSON(state: NetworkState): TrainedNetwork {
  const bad = (m: string): never => {
    throw new SurmiseError('learn.badState', `not a saved surmise network: ${m}`);
  };
  if (!state || state.format !== 'surmise.network') bad("missing format 'surmise.network'");
  if (state.version !== 1) bad(`unsupported version ${String(state.version)}`);
  if (!Array.isArray(state.sizes) || state.sizes.length < 2 || !state.sizes.every((s) => Number.isInteger(s) && s >= 1)) bad('bad layer sizes');
  if (state.sizes[0] !== state.p) bad('input width does not match p');
  const L = makeLayout(state.sizes);
  if (!Array.isArray(state.params) || state.params.length !== L.total) bad(`expected ${L.total} parameters, got ${state.params?.length}`);
  if (state.task === 'classification') {
    if (!Array.isArray(state.classes) || state.classes.length !== state.sizes[state.sizes.length - 1]) bad('classes do not match the output width');
  } else if (state.task === 'regression') {
    if (state.sizes[state.sizes.length - 1] !== 1) bad('a regression network has one output');
  } else bad(`unknown task ${String(state.task)}`);
  return loadedEngine(state.engine ?? 'tfjs').network(state);
}
