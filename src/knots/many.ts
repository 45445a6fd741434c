/**
 * Invariants of many diagrams over worker threads (both cores here): the diagrams are parsed in
 * this thread first, in file order, so a bad line is reported exactly as without workers; then
 * chunks of rows go to the workers and come back in order. Small batches, or batches without the
 * slow invariants (hyperbolic), run in this thread. If the workers cannot start, the rows are
 * computed here (same results).
 */
import { Worker } from 'node:worker_threads';
import { SurmiseError, isErrorCode } from '../errors.ts';
import { invariantsOf } from './batch.ts';
import { parseDiagram } from './diagram.ts';
import type { ComputeOptions, KnotInvariants } from './invariants.ts';
import type { DiagramKind, DiagramSource } from './parse.ts';
import { checkOptions } from '../util/option-table.ts';
import { KNOTS_OPTIONS } from './options.ts';

export interface ManyJob {
  type: 'job';
  id: number;
  sources: DiagramSource[];
  file: string;
  kind: DiagramKind | undefined;
  opts: ComputeOptions;
}
export type ManyReply =
  | { type: 'ready' }
  | { type: 'done'; id: number; results: KnotInvariants[] }
  | { type: 'error'; id: number; code: string | null; message: string };

export interface ManyOptions {
  /** Worker threads (default 2); 0 or 1 computes in this thread. Ceiling 64. */
  workers?: number;
  /** Rows per message to a worker (default 16). */
  chunk?: number;
  /** Called with (rows done, rows) as rows finish. */
  onProgress?: (done: number, total: number) => void;
  /** Fewer rows than this run in this thread (default 64). */
  minRowsForWorkers?: number;
}

const WORKER_URL = import.meta.url.endsWith('.js') ? new URL('./worker.js', import.meta.url) : new URL('./worker-boot.mjs', import.meta.url);

/** Invariants of every source, in order. */
export async function invariantsMany(sources: DiagramSource[], file: string, kind: DiagramKind | undefined, opts: ComputeOptions, many: ManyOptions = {}): Promise<KnotInvariants[]> {
  const nWorkers = checkOptions<{ workers: number }>(KNOTS_OPTIONS, { kind, invariants: opts.invariants, omega: opts.omega, workers: many.workers }).workers;
  const slow = (opts.invariants ?? []).includes('hyperbolic');
  const local = (): KnotInvariants[] => {
    const out: KnotInvariants[] = [];
    sources.forEach((s, k) => {
      out.push(invariantsOf(s, file, kind, opts));
      many.onProgress?.(k + 1, sources.length);
    });
    many.onProgress?.(sources.length, sources.length);
    return out;
  };
  if (nWorkers <= 1 || !slow || sources.length < (many.minRowsForWorkers ?? 64)) return local();
  // parse everything here first so that errors come out in file order, as in one thread
  for (const s of sources) {
    try {
      parseDiagram(s.code, kind);
    } catch {
      invariantsOf(s, file, kind, opts); // rethrows with the file:line:column prefix
    }
  }
  const chunk = many.chunk ?? 16;
  const jobs: ManyJob[] = [];
  for (let i = 0, id = 0; i < sources.length; i += chunk, id++) jobs.push({ type: 'job', id, sources: sources.slice(i, i + chunk), file, kind, opts });
  const results: KnotInvariants[][] = new Array(jobs.length);
  const ran = await runPool(jobs, Math.min(nWorkers, jobs.length), results, (d) => many.onProgress?.(d, sources.length));
  if (ran.failed) {
    for (let j = 0; j < jobs.length; j++) if (!results[j]) results[j] = jobs[j]!.sources.map((s) => invariantsOf(s, file, kind, opts));
  }
  many.onProgress?.(sources.length, sources.length);
  return results.flat();
}

function runPool(jobs: ManyJob[], n: number, results: KnotInvariants[][], progress: (rowsDone: number) => void): Promise<{ failed?: string }> {
  return new Promise((resolve, reject) => {
    let next = 0;
    let finished = 0;
    let rows = 0;
    let settled = false;
    let anyReady = false;
    const pool: Worker[] = [];
    const end = (err: Error | null, failed?: string): void => {
      if (settled) return;
      settled = true;
      for (const w of pool) void w.terminate();
      if (err) reject(err);
      else resolve(failed ? { failed } : {});
    };
    const feed = (w: Worker): void => {
      if (next >= jobs.length) {
        w.postMessage({ type: 'stop' });
        return;
      }
      w.postMessage(jobs[next++]!);
    };
    for (let i = 0; i < n; i++) {
      let w: Worker;
      try {
        w = new Worker(WORKER_URL);
      } catch (e) {
        end(null, (e as Error).message);
        return;
      }
      pool.push(w);
      w.on('message', (m: ManyReply) => {
        if (m.type === 'ready') {
          anyReady = true;
          feed(w);
        } else if (m.type === 'done') {
          results[m.id] = m.results;
          rows += m.results.length;
          finished++;
          progress(rows);
          if (finished === jobs.length) end(null);
          else feed(w);
        } else end(isErrorCode(m.code) ? new SurmiseError(m.code, m.message) : new Error(`a knots worker failed: ${m.message}`));
      });
      w.on('error', (e) => (anyReady ? end(e) : end(null, e.message)));
    }
  });
}
