/**
 * Worker-thread entry for trainMany: trains the jobs it is sent, each on the engine named in its
 * options (loaded once per worker), and posts back each network's plain state.
 */
import { parentPort } from 'node:worker_threads';
import { SurmiseError } from '../errors.ts';
import { loadEngine } from './engines.ts';
import { trainToState } from './train.ts';
import type { WorkerJobMessage, WorkerReply } from './many.ts';
import { setThreadCount } from './native/runtime.ts';

const port = parentPort;
if (port) {
  const post = (m: WorkerReply) => port.postMessage(m);
  post({ type: 'ready' });
  port.on('message', async (m: WorkerJobMessage) => {
    if (m.type === 'stop') {
      port.close();
      return;
    }
    try {
      setThreadCount(m.threads);
      const engine = await loadEngine(m.options.engine);
      const state = trainToState(m.train, m.validation, m.options, undefined, engine.name);
      post({ type: 'done', id: m.id, state });
    } catch (e) {
      const err = e instanceof SurmiseError ? { code: e.code, message: e.message, exitCode: e.exitCode } : { code: null, message: e instanceof Error ? e.message : String(e), exitCode: 1 as const };
      post({ type: 'error', id: m.id, ...err });
    }
  });
}
