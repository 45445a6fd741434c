/** Worker thread for `invariantsMany`: computes the invariants of the diagrams it is sent. */
import { parentPort } from 'node:worker_threads';
import { SurmiseError } from '../errors.ts';
import { invariantsOf } from './batch.ts';
import type { ManyJob, ManyReply } from './many.ts';

parentPort!.on('message', (m: ManyJob | { type: 'stop' }) => {
  if (m.type === 'stop') {
    parentPort!.close();
    return;
  }
  try {
    const results = m.sources.map((s) => invariantsOf(s, m.file, m.kind, m.opts));
    parentPort!.postMessage({ type: 'done', id: m.id, results } satisfies ManyReply);
  } catch (e) {
    const err = e as Error;
    parentPort!.postMessage({
      type: 'error',
      id: m.id,
      code: e instanceof SurmiseError ? e.code : null,
      message: err?.message ?? String(e),
    } satisfies ManyReply);
  }
});
parentPort!.postMessage({ type: 'ready' } satisfies ManyReply);
