/**
 * The network's engines, registered in one list: 'native' (ONNX graphs run by onnxruntime-node
 * on the CPU, src/learn/native/) and 'tfjs' (the portable engine: tfjs on its wasm backend).
 * Each is loaded on first use only. 'auto' takes the first that loads, in list order, and
 * remembers why an earlier one did not.
 */
import { SurmiseError } from '../errors.ts';
import type { TrainSetup } from './train.ts';
import type { NetworkState, TrainedNetwork } from './trained.ts';

export type EngineName = 'native' | 'tfjs';
export type EngineChoice = 'auto' | EngineName;
export const ENGINE_CHOICES: readonly EngineChoice[] = ['auto', 'native', 'tfjs'];

/** One training run's moving parts on an engine: parameters and Adam moments live inside it. */
export interface Trainer {
  /** One Adam step (step number t ≥ 1) on the first `rows` rows of xb (row-major) and targets tb; returns the batch's summed loss. */
  step(xb: Float32Array, tb: Float32Array, rows: number, t: number): number;
  /** Summed loss over the validation rows (rows with an unseen class add nothing) under the current parameters. */
  validationLoss(): number;
  /** The current parameters in the layout's order (a view; copy it to keep it). */
  parameters(): Float32Array;
  dispose(): void;
}

export interface Engine {
  name: EngineName;
  trainer(setup: TrainSetup): Trainer;
  network(state: NetworkState): TrainedNetwork;
}

interface Registered {
  name: EngineName;
  load: () => Promise<Engine>;
}

/** The registered engines, in the order 'auto' tries them. */
export const ENGINES: readonly Registered[] = [
  { name: 'native', load: async () => (await import('./native/engine.ts')).nativeEngine() },
  { name: 'tfjs', load: async () => (await import('./tfjs-engine.ts')).tfjsEngine() },
];

const loaded = new Map<EngineName, Engine>();
const failures = new Map<EngineName, string>();

/** The engine asked for when none is named: SURMISE_ENGINE (auto | native | tfjs), else 'auto'. */
export function defaultEngineChoice(): EngineChoice {
  const e = process.env.SURMISE_ENGINE;
  if (e === undefined || e === '') return 'auto';
  if (!(ENGINE_CHOICES as readonly string[]).includes(e)) {
    throw new SurmiseError('learn.badOption', `expected the environment variable SURMISE_ENGINE to be one of ${ENGINE_CHOICES.join(', ')}, got '${e}'`, { option: 'engine' });
  }
  return e as EngineChoice;
}

async function loadOne(r: Registered): Promise<Engine> {
  const have = loaded.get(r.name);
  if (have) return have;
  const failed = failures.get(r.name);
  if (failed) throw new SurmiseError('learn.engineUnavailable', failed, { engine: r.name }, 1);
  try {
    const e = await r.load();
    loaded.set(r.name, e);
    return e;
  } catch (err) {
    const msg = `the ${r.name} engine cannot run here: ${(err instanceof Error ? err.message : String(err)).split('\n')[0]}`;
    failures.set(r.name, msg);
    throw new SurmiseError('learn.engineUnavailable', msg, { engine: r.name }, 1);
  }
}

/** Load (once) the engine for a choice; 'auto' falls through the list. Rejects with `learn.engineUnavailable`. */
export async function loadEngine(choice: EngineChoice = defaultEngineChoice()): Promise<Engine> {
  if (choice !== 'auto') {
    const r = ENGINES.find((e) => e.name === choice);
    if (!r) throw new SurmiseError('learn.badOption', `expected engine to be one of ${ENGINE_CHOICES.join(', ')}, got ${JSON.stringify(choice)}`, { option: 'engine' });
    return loadOne(r);
  }
  let last: unknown;
  for (const r of ENGINES) {
    try {
      return await loadOne(r);
    } catch (e) {
      last = e;
    }
  }
  throw last;
}

/** Why an engine could not load in this process (undefined when it loaded or was never tried). */
export function engineFailure(name: EngineName): string | undefined {
  return failures.get(name);
}

/** A loaded engine by name (synchronous; loadEngine must have run). */
export function loadedEngine(name?: EngineName): Engine {
  const e = name ? loaded.get(name) : undefined;
  if (e) return e;
  // a state saved by an engine that is not loaded here is rebuilt by one that is (same arithmetic)
  for (const r of ENGINES) {
    const any = loaded.get(r.name);
    if (any) return any;
  }
  throw new SurmiseError('learn.noEngine', 'no network engine is loaded yet: await loadEngine() (or trainNetwork) first', undefined, 1);
}

export function loadedTrainer(name: EngineName): (s: TrainSetup) => Trainer {
  const e = loadedEngine(name);
  return (s) => e.trainer(s);
}
