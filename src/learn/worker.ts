/**
 * Worker-thread entry for trainMany: initialises its own wasm backend, then trains the jobs it is
 * sent and posts back each network's plain state. Started with `execArgv: ['--import', 'tsx']`.
 */
import { parentPort } from 'node:worker_threads';
import { SurmiseError } from '../errors.ts';
import { initBackend } from './backend.ts';
import { trainToState } from './train.ts';
import type { WorkerJobMessage, WorkerReply } from './many.ts';

const port = parentPort;
if (port) {
  const post = (m: WorkerReply) => port.postMessage(m);
  initBackend('wasm').then(
    () => post({ type: 'ready' }),
    (e: unknown) => post({ type: 'fatal', message: e instanceof Error ? e.message : String(e) }),
  );
  port.on('message', (m: WorkerJobMessage) => {
    if (m.type === 'stop') {
      port.close();
      return;
    }
    try {
      const state = trainToState(m.train, m.validation, m.options);
      post({ type: 'done', id: m.id, state });
    } catch (e) {
      const err = e instanceof SurmiseError ? { code: e.code, message: e.message, exitCode: e.exitCode } : { code: null, message: e instanceof Error ? e.message : String(e), exitCode: 1 as const };
      post({ type: 'error', id: m.id, ...err });
    }
  });
}
