/**
 * The ONNX runtime on the CPU (`onnxruntime-node`, pinned exactly): loaded on first use only, and
 * driven through the package's synchronous session binding (the public `run` only wraps it in a
 * promise), because the network's interface — predict, input gradients — is synchronous.
 * Threads: one per core (`os.availableParallelism()`), unless SURMISE_THREADS says otherwise;
 * idle threads sleep rather than spin.
 */
import { createRequire } from 'node:module';
import os from 'node:os';
import { SurmiseError } from '../../errors.ts';

export interface OrtTensor {
  readonly data: Float32Array | BigInt64Array;
  readonly dims: readonly number[];
}
type TensorCtor = new (type: 'float32' | 'int64', data: Float32Array | BigInt64Array, dims: readonly number[]) => OrtTensor;
interface BindingSession {
  loadModel(buffer: ArrayBuffer, byteOffset: number, byteLength: number, options: object): void;
  run(feeds: Record<string, OrtTensor>, fetches: Record<string, OrtTensor | null>, options: object): Record<string, OrtTensor>;
  dispose(): void;
}
interface Ort {
  Tensor: TensorCtor;
  Session: new () => BindingSession;
}

let ort: Ort | null = null;
let failure: string | null = null;

/** Load the runtime once; throws `learn.engineUnavailable` (with the reason) when it cannot load here. */
export function loadOrt(): Ort {
  if (ort) return ort;
  if (failure) throw new SurmiseError('learn.engineUnavailable', `the native engine cannot load here: ${failure}`, undefined, 1);
  try {
    const require = createRequire(import.meta.url);
    const common = require('onnxruntime-common') as { Tensor: TensorCtor };
    const b = require('onnxruntime-node/dist/binding') as { binding: { InferenceSession: new () => BindingSession }; initOrt: () => void };
    b.initOrt();
    ort = { Tensor: common.Tensor, Session: b.binding.InferenceSession };
    return ort;
  } catch (e) {
    failure = (e instanceof Error ? e.message : String(e)).split('\n')[0]!;
    throw new SurmiseError('learn.engineUnavailable', `the native engine cannot load here: ${failure}`, undefined, 1);
  }
}

let threadOverride: number | null = null;

/** Threads per session from here on in this thread (trainMany's workers share the cores out). */
export function setThreadCount(n: number | null): void {
  threadOverride = n;
}

/** Threads per session: the cores this process may use (SURMISE_THREADS overrides, for benchmarks). */
export function threadCount(): number {
  if (threadOverride !== null) return threadOverride;
  const env = Number(process.env.SURMISE_THREADS);
  if (Number.isInteger(env) && env >= 1) return env;
  return Math.max(1, os.availableParallelism());
}

/** A loaded graph: run it synchronously with named inputs and (optionally pre-allocated) outputs. */
export class Session {
  private s: BindingSession;
  constructor(model: Uint8Array, threads = threadCount()) {
    const o = loadOrt();
    this.s = new o.Session();
    this.s.loadModel(model.buffer as ArrayBuffer, model.byteOffset, model.byteLength, {
      intraOpNumThreads: threads,
      interOpNumThreads: 1,
      executionMode: 'sequential',
      graphOptimizationLevel: 'all',
      enableCpuMemArena: true,
      enableMemPattern: true,
      logSeverityLevel: 3,
      // idle threads sleep instead of spinning: measured 4–10× faster training with 2 threads on this
      // shared 2-core machine (README), where spinning threads steal the cores the work needs
      extra: { session: { intra_op: { allow_spinning: '0' } } },
    });
  }
  run(feeds: Record<string, OrtTensor>, fetches: Record<string, OrtTensor | null>): Record<string, OrtTensor> {
    return this.s.run(feeds, fetches, {});
  }
  dispose(): void {
    this.s.dispose();
  }
}

export function f32(data: Float32Array, dims: readonly number[]): OrtTensor {
  return new (loadOrt().Tensor)('float32', data, dims);
}
