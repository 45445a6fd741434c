/**
 * Independent trainings (seeds × folds) spread over worker threads, each with its own engine
 * (the tfjs wasm backend has no threads in Node, so workers are how both cores get used; the
 * native engine's sessions in n workers take cores/n threads each).
 * Data travel once, as SharedArrayBuffer copies shared by every job that uses the same array.
 * When workers cannot start, the jobs run in this thread; with the wasm backend the result is
 * the same bit for bit either way.
 */
import { Worker } from 'node:worker_threads';
import { SurmiseError, isErrorCode } from '../errors.ts';
import { availableParallelism } from 'node:os';
import { loadEngine } from './engines.ts';
import { checkData, type TrainData } from './data.ts';
import { resolveNetworkOptions, type NetworkOptions } from './options.ts';
import { trainToState } from './train.ts';
import type { NetworkState } from './trained.ts';

export interface TrainJob {
  train: TrainData;
  validation: TrainData;
  options: Partial<NetworkOptions>;
}

export interface TrainManyOptions {
  /** worker threads (default 2, one per core here); 0 runs every job in this thread */
  workers?: number;
  /** called as each job finishes (in completion order) */
  onJobDone?: (index: number, state: NetworkState) => void;
  /** the worker's entry module (default: ./worker-boot.mjs beside this file); tests point it elsewhere to exercise the fallback */
  workerModule?: URL;
}

export interface TrainManyReport {
  states: NetworkState[];
  /** where the jobs ran: 'workers' or 'in-process' (and why, when workers were wanted but failed); each state names its engine */
  ranIn: 'workers' | 'in-process';
  fallbackReason?: string;
}

export type WorkerJobMessage =
  | { type: 'job'; id: number; train: TrainData; validation: TrainData; options: NetworkOptions; threads: number }
  | { type: 'stop' };
export type WorkerReply =
  | { type: 'ready' }
  | { type: 'fatal'; message: string }
  | { type: 'done'; id: number; state: NetworkState }
  | { type: 'error'; id: number; code: string | null; message: string; exitCode: 1 | 2 };

type Resolved = { train: TrainData; validation: TrainData; options: NetworkOptions };

function shareArrays(jobs: Resolved[]): Resolved[] {
  const cache = new Map<Float32Array | Float64Array, Float32Array | Float64Array>();
  const share = <T extends Float32Array | Float64Array>(a: T): T => {
    let s = cache.get(a);
    if (!s) {
      const Ctor = a.constructor as Float32ArrayConstructor | Float64ArrayConstructor;
      s = new Ctor(new SharedArrayBuffer(a.byteLength) as unknown as ArrayBuffer);
      s.set(a);
      cache.set(a, s);
    }
    return s as T;
  };
  const d = (t: TrainData): TrainData => ({ x: share(t.x), y: share(t.y), n: t.n, p: t.p });
  return jobs.map((j) => ({ train: d(j.train), validation: d(j.validation), options: j.options }));
}

function rebuildError(r: { code: string | null; message: string; exitCode: 1 | 2 }, index: number): Error {
  return isErrorCode(r.code) ? new SurmiseError(r.code, r.message, { job: index }, r.exitCode) : new Error(`training job ${index + 1} failed in a worker: ${r.message}`);
}

/** Run the jobs in this thread, in order. */
async function inProcess(jobs: Resolved[], out: NetworkState[], todo: number[], onJobDone?: TrainManyOptions['onJobDone']): Promise<void> {
  for (const i of todo) {
    const engine = await loadEngine(jobs[i]!.options.engine);
    out[i] = trainToState(jobs[i]!.train, jobs[i]!.validation, jobs[i]!.options, undefined, engine.name);
    onJobDone?.(i, out[i]!);
  }
}

/**
 * The worker's entry: compiled (build/learn/worker.js) when this module is compiled; from the
 * sources, a small JavaScript bootstrap registers tsx in the worker first (execArgv alone did not
 * load .ts here).
 */
const WORKER_URL = import.meta.url.endsWith('.js') ? new URL('./worker.js', import.meta.url) : new URL('./worker-boot.mjs', import.meta.url);

/**
 * Train every job; returns the states in job order. Options are checked for every job before
 * anything runs. Errors in a job (bad data, divergence) reject with the job's SurmiseError.
 */
export async function trainMany(jobs: TrainJob[], opts: TrainManyOptions = {}): Promise<TrainManyReport> {
  const nWorkers = opts.workers ?? 2;
  if (!(Number.isInteger(nWorkers) && nWorkers >= 0)) {
    throw new SurmiseError('learn.badOption', `expected workers to be an integer ≥ 0, got ${nWorkers}`, { option: 'workers' });
  }
  const resolved: Resolved[] = jobs.map((j, k) => {
    const options = resolveNetworkOptions(j.options);
    checkData(j.train, `job ${k + 1}: training rows`);
    checkData(j.validation, `job ${k + 1}: validation rows`, j.train.p);
    return { train: j.train, validation: j.validation, options };
  });
  // 'auto' is settled here, once, so every worker runs the engine this thread would
  for (const r of resolved) r.options = { ...r.options, engine: (await loadEngine(r.options.engine)).name };
  const states: NetworkState[] = new Array(jobs.length);
  if (jobs.length === 0) return { states, ranIn: 'in-process' };
  if (nWorkers === 0 || jobs.length === 1) {
    // one job gains nothing from a worker, which costs seconds to start (tsx + tfjs + wasm)
    await inProcess(resolved, states, resolved.map((_, i) => i), opts.onJobDone);
    return { states, ranIn: 'in-process' };
  }
  const shared = shareArrays(resolved);
  const result = await runWorkers(shared, Math.min(nWorkers, jobs.length), states, opts.onJobDone, opts.workerModule ?? WORKER_URL);
  if (result.failed) {
    // workers could not start: run what is left here
    const todo = resolved.map((_, i) => i).filter((i) => states[i] === undefined);
    await inProcess(resolved, states, todo, opts.onJobDone);
    return { states, ranIn: 'in-process', fallbackReason: result.failed };
  }
  return { states, ranIn: 'workers' };
}

function runWorkers(jobs: Resolved[], n: number, states: NetworkState[], onJobDone: TrainManyOptions['onJobDone'], url: URL): Promise<{ failed?: string }> {
  return new Promise((resolve, reject) => {
    let next = 0;
    let done = 0;
    let readyAny = false;
    let settled = false;
    const pool: Worker[] = [];
    const finish = (err: Error | null, failed?: string) => {
      if (settled) return;
      settled = true;
      for (const w of pool) void w.terminate();
      if (err) reject(err);
      else resolve(failed ? { failed } : {});
    };
    const feed = (w: Worker) => {
      if (next >= jobs.length) {
        w.postMessage({ type: 'stop' } satisfies WorkerJobMessage);
        return;
      }
      const id = next++;
      const j = jobs[id]!;
      const threads = Math.max(1, Math.floor(availableParallelism() / n));
      w.postMessage({ type: 'job', id, train: j.train, validation: j.validation, options: j.options, threads } satisfies WorkerJobMessage);
    };
    for (let k = 0; k < n; k++) {
      let w: Worker;
      try {
        w = new Worker(url);
      } catch (e) {
        finish(null, `worker threads unavailable: ${e instanceof Error ? e.message : String(e)}`);
        return;
      }
      pool.push(w);
      w.on('message', (m: WorkerReply) => {
        if (m.type === 'ready') {
          readyAny = true;
          feed(w);
        } else if (m.type === 'fatal') {
          if (!readyAny) finish(null, `worker could not start its backend: ${m.message}`);
          else finish(new Error(`a training worker failed: ${m.message}`));
        } else if (m.type === 'done') {
          states[m.id] = m.state;
          done++;
          onJobDone?.(m.id, m.state);
          if (done === jobs.length) finish(null);
          else feed(w);
        } else if (m.type === 'error') {
          finish(rebuildError(m, m.id));
        }
      });
      w.on('error', (e) => {
        if (!readyAny) finish(null, `worker could not start: ${e.message}`);
        else finish(new Error(`a training worker crashed: ${e.message}`));
      });
      w.on('exit', (code) => {
        if (!settled && code !== 0 && !readyAny) finish(null, `worker exited with code ${code} before starting`);
        else if (!settled && done < jobs.length && code !== 0) finish(new Error(`a training worker exited with code ${code}`));
      });
    }
  });
}
