/**
 * The tfjs backend for learning: the wasm backend (SIMD; threads are unavailable in Node) loaded
 * from the installed package, or the pure-JavaScript 'cpu' backend. Nothing is downloaded.
 */
import { createRequire } from 'node:module';
import path from 'node:path';
import { SurmiseError } from '../errors.ts';

export type BackendName = 'wasm' | 'cpu';

let pending: Promise<BackendName> | null = null;
let pendingName: BackendName | null = null;
let wasmPathsSet = false;
/** tfjs, imported on first use (it takes most of a second to load). */
let tf: typeof import('@tensorflow/tfjs') | null = null;


/**
 * Initialise (once) and select a backend; idempotent: calling again with the same name returns
 * at once, calling with another name switches. Defaults to 'wasm'.
 */
export async function initBackend(name: BackendName = 'wasm'): Promise<BackendName> {
  if (name !== 'wasm' && name !== 'cpu') {
    throw new SurmiseError('learn.backend', `unknown backend '${String(name)}': expected 'wasm' or 'cpu'`);
  }
  if (pending && pendingName === name && tf?.getBackend() === name) return pending;
  pendingName = name;
  pending = (async () => {
    tf ??= await import('@tensorflow/tfjs');
    if (name === 'wasm' && !wasmPathsSet) {
      const { setWasmPaths } = await import('@tensorflow/tfjs-backend-wasm');
      const require = createRequire(import.meta.url);
      const dir = path.dirname(require.resolve('@tensorflow/tfjs-backend-wasm'));
      // In Node the wasm loader reads these with the file system: plain folder path with a trailing separator.
      setWasmPaths(dir + path.sep);
      wasmPathsSet = true;
    }
    // production mode: no per-op debug checks, and no advertising banner printed on stdout/stderr
    tf.env().set('PROD', true);
    const ok = await tf.setBackend(name);
    if (!ok) throw new SurmiseError('learn.backend', `the tfjs '${name}' backend could not be initialised`, undefined, 1);
    await tf.ready();
    return name;
  })();
  return pending;
}

/** Make sure a backend chosen by initBackend is ready: the one already chosen, else 'wasm'. */
export async function ensureBackend(): Promise<BackendName> {
  if (pending) return pending;
  return initBackend('wasm');
}

/** The backend currently in use (after initBackend). */
export function currentBackend(): string {
  return tf ? tf.getBackend() : 'none';
}
