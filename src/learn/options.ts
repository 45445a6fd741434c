/**
 * Network options: the one table (NETWORK_OPTIONS) of their ranges and defaults, checked at the
 * entry point (trainNetwork / trainMany), with messages naming the option.
 */
import { SurmiseError } from '../errors.ts';
import { checkOptions, defaultsOf, seedOption, type OptionTable } from '../util/option-table.ts';
import { ENGINE_CHOICES, defaultEngineChoice, type EngineChoice } from './engines.ts';

export { SEED_MAX } from '../util/option-table.ts';

export type Task = 'regression' | 'classification';
export type Activation = 'relu' | 'gelu';
export type LossName = 'mse' | 'huber';

export interface NetworkOptions {
  hidden: number[];
  activation: Activation;
  loss: LossName;
  learningRate: number;
  /** null: chosen from the training rows (batchSizeFor). */
  batchSize: number | null;
  maxEpochs: number;
  patience: number;
  seed: number;
  /** Absent: chosen from the target (chooseTask). */
  task?: Task;
  /** 'auto' (native when it loads, else tfjs), 'native' or 'tfjs'; default SURMISE_ENGINE or 'auto' */
  engine: EngineChoice;
}

/**
 * The options of one network's training: one table (key, range, default, meaning) that
 * trainNetwork and trainMany check against, and whose rows the ranking's table (RANK_OPTIONS,
 * src/attribute/options.ts) takes as they are, under the config keys `network.*` (`maxEpochs` is
 * the ranking's `epochs`), so each option has one default. Defaults: three hidden layers of 64,
 * measured with `bench/learn.ts --widths` (20,000 rows × 16 inputs, to early stop, load average ~7
 * on 2 cores): width 64 took 24 s (13 CPU-s, 107 epochs), width 128 took 71 s (32 CPU-s) and
 * reached no better validation loss (0.012 vs 0.023); epochs, patience and learning rate chosen to
 * finish 20,000 rows in < 60 s on 2 cores (bench/attribute.ts, Friedman #1). A seed defaults to 1
 * here as in every other table (seedOption).
 */
export const NETWORK_OPTIONS = [
  { key: 'task', type: 'choice', choices: ['auto', 'regression', 'classification'], default: 'auto', description: 'regression or classification; auto chooses from the target' },
  { key: 'hidden', type: 'integers', min: 1, max: 4096, maxItems: 16, noun: 'layer width', default: [64, 64, 64], description: 'hidden layer widths (none or an empty list: a linear model)' },
  { key: 'maxEpochs', type: 'integer', min: 1, max: 10_000, default: 60, description: 'most training epochs (early stopping on the validation rows)' },
  { key: 'activation', type: 'choice', choices: ['relu', 'gelu'], default: 'relu', description: 'hidden-layer activation' },
  { key: 'loss', type: 'choice', choices: ['mse', 'huber'], default: 'mse', description: 'regression loss (huber is less swayed by outlying rows)' },
  { key: 'patience', type: 'integer', min: 0, max: 10_000, default: 8, description: 'epochs without improvement on the validation rows before training stops' },
  { key: 'batchSize', type: 'integer', min: 1, max: 1 << 20, default: null, description: 'mini-batch size (default: chosen from the training rows)' },
  { key: 'learningRate', type: 'number', min: 0, max: 10, openMin: true, default: 2e-3, description: 'Adam learning rate' },
  {
    key: 'engine', type: 'choice', choices: ENGINE_CHOICES, default: 'auto',
    description: 'network engine: auto (native when it loads), native or tfjs',
    inert: 'both engines train the same network from the same seeds; they agree to rounding, not bit for bit (tests/learn/engines.test.ts)',
  },
  seedOption('seed of the initial weights and of the mini-batch shuffles'),
] as const satisfies OptionTable;

/** The defaults of NETWORK_OPTIONS (`batchSize: null` = chosen from the training rows; `engine`: SURMISE_ENGINE when set). */
export const DEFAULT_NETWORK_OPTIONS = Object.freeze(defaultsOf(NETWORK_OPTIONS)) as Readonly<Omit<NetworkOptions, 'task'> & { task: Task | 'auto' }>;

const KNOWN: readonly string[] = NETWORK_OPTIONS.map((o) => o.key);

/** Fill defaults and check every option once, against NETWORK_OPTIONS (option.badValue, option.tooLarge). */
export function resolveNetworkOptions(opts: Partial<NetworkOptions> = {}): NetworkOptions {
  for (const k of Object.keys(opts)) {
    if (!KNOWN.includes(k)) {
      throw new SurmiseError('learn.unknownOption', `unknown network option '${k}'; known options: ${KNOWN.join(', ')}`, { option: k });
    }
  }
  const given = { ...opts, engine: opts.engine ?? defaultEngineChoice() } as Record<string, unknown>;
  const o = checkOptions<Omit<NetworkOptions, 'task'> & { task: Task | 'auto' }>(NETWORK_OPTIONS, given);
  const { task, ...rest } = o;
  return task === 'auto' ? rest : { ...rest, task };
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
