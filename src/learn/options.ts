/**
 * Network options: defaults and the one table of constraints they are checked against, at the
 * entry point (trainNetwork / trainMany), with messages naming the option.
 */
import { SurmiseError } from '../errors.ts';
import { ENGINE_CHOICES, defaultEngineChoice, type EngineChoice } from './engines.ts';

export type Task = 'regression' | 'classification';
export type Activation = 'relu' | 'gelu';
export type LossName = 'mse' | 'huber';

export interface NetworkOptions {
  hidden: number[];
  activation: Activation;
  loss: LossName;
  learningRate: number;
  batchSize: number;
  maxEpochs: number;
  patience: number;
  seed: number;
  task?: Task;
  /** 'auto' (native when it loads, else tfjs), 'native' or 'tfjs'; default SURMISE_ENGINE or 'auto' */
  engine: EngineChoice;
}

/**
 * Defaults. Three hidden layers of 64: measured with `bench/learn.ts --widths` (20,000 rows × 16
 * inputs, to early stop, load average ~7 on 2 cores): width 64 took 24 s (13 CPU-s, 107 epochs),
 * width 128 took 71 s (32 CPU-s) and reached no better validation loss (0.012 vs 0.023).
 */
export const DEFAULT_NETWORK_OPTIONS: Readonly<Omit<NetworkOptions, 'engine'>> = Object.freeze({
  hidden: [64, 64, 64],
  activation: 'relu',
  loss: 'mse',
  learningRate: 1e-3,
  batchSize: 256,
  maxEpochs: 200,
  patience: 10,
  seed: 0,
});

function bad(key: string, expected: string, got: unknown): never {
  throw new SurmiseError('learn.badOption', `expected ${key} to be ${expected}, got ${JSON.stringify(got) ?? String(got)}`, { option: key });
}

const isPosInt = (v: unknown): v is number => typeof v === 'number' && Number.isInteger(v) && v >= 1;
const KNOWN = ['hidden', 'activation', 'loss', 'learningRate', 'batchSize', 'maxEpochs', 'patience', 'seed', 'task', 'engine'];

/** Fill defaults and validate every option once. */
export function resolveNetworkOptions(opts: Partial<NetworkOptions> = {}): NetworkOptions {
  for (const k of Object.keys(opts)) {
    if (!KNOWN.includes(k)) {
      throw new SurmiseError('learn.unknownOption', `unknown network option '${k}'; known options: ${KNOWN.join(', ')}`, { option: k });
    }
  }
  const o: NetworkOptions = { ...DEFAULT_NETWORK_OPTIONS, hidden: [...DEFAULT_NETWORK_OPTIONS.hidden], engine: opts.engine ?? defaultEngineChoice() };
  for (const [k, v] of Object.entries(opts)) if (v !== undefined) (o as unknown as Record<string, unknown>)[k] = v;
  if (!Array.isArray(o.hidden) || !o.hidden.every(isPosInt)) bad('hidden', 'a list of positive integer layer widths (possibly empty)', o.hidden);
  o.hidden = [...o.hidden];
  if (o.activation !== 'relu' && o.activation !== 'gelu') bad('activation', "'relu' or 'gelu'", o.activation);
  if (o.loss !== 'mse' && o.loss !== 'huber') bad('loss', "'mse' or 'huber'", o.loss);
  if (!(typeof o.learningRate === 'number' && Number.isFinite(o.learningRate) && o.learningRate > 0)) bad('learningRate', 'a positive number', o.learningRate);
  if (!isPosInt(o.batchSize)) bad('batchSize', 'a positive integer', o.batchSize);
  if (!isPosInt(o.maxEpochs)) bad('maxEpochs', 'a positive integer', o.maxEpochs);
  if (!(typeof o.patience === 'number' && Number.isInteger(o.patience) && o.patience >= 0)) bad('patience', 'an integer ≥ 0', o.patience);
  if (!(typeof o.seed === 'number' && Number.isInteger(o.seed) && o.seed >= 0 && o.seed <= 0xffffffff)) bad('seed', 'an integer in [0, 4294967295]', o.seed);
  if (!ENGINE_CHOICES.includes(o.engine)) bad('engine', ENGINE_CHOICES.map((e) => `'${e}'`).join(', '), o.engine);
  if (o.task !== undefined && o.task !== 'regression' && o.task !== 'classification') bad('task', "'regression' or 'classification'", o.task);
  return o;
}

/** Most classes for which an integer target is learned as classification. */
export const MAX_CLASSES = 50;

/**
 * The task for a target: 'classification' when every value is an integer and there are at most
 * 50 distinct values (a column of kind 'integer', or of unknown kind whose values are all
 * integers); otherwise 'regression'. A column of kind 'real' is always regression.
 */
export function chooseTask(y: ArrayLike<number>, kind?: 'real' | 'integer'): Task {
  if (kind === 'real') return 'regression';
  const seen = new Set<number>();
  for (let i = 0; i < y.length; i++) {
    const v = y[i]!;
    if (!Number.isInteger(v)) return 'regression';
    seen.add(v);
    if (seen.size > MAX_CLASSES) return 'regression';
  }
  return 'classification';
}
