/**
 * Provenance of a run: the input table's SHA-256 and size, and the versions of the libraries
 * that computed it, recorded in results.json so a result can be traced and repeated.
 */
import { createHash } from 'node:crypto';
import { createReadStream, readFileSync } from 'node:fs';

/** SHA-256 of a file, streamed. */
export async function sha256File(path: string): Promise<{ sha256: string; bytes: number }> {
  const h = createHash('sha256');
  let bytes = 0;
  await new Promise<void>((resolveP, reject) => {
    createReadStream(path)
      .on('data', (c) => {
        bytes += (c as Buffer).length;
        h.update(c);
      })
      .on('error', reject)
      .on('end', () => resolveP());
  });
  return { sha256: h.digest('hex'), bytes };
}

const DEPENDENCIES = ['@tensorflow/tfjs', '@tensorflow/tfjs-backend-wasm', 'vega', 'vega-lite', '@resvg/resvg-js', 'yaml', 'zod', 'commander', 'danfojs-node'];

/** Versions of the libraries a run depends on ('unknown' when one cannot be read). */
export function dependencyVersions(): Record<string, string> {
  const out: Record<string, string> = {};
  for (const d of DEPENDENCIES) {
    try {
      const url = new URL(`../../node_modules/${d}/package.json`, import.meta.url);
      out[d] = (JSON.parse(readFileSync(url, 'utf8')) as { version: string }).version;
    } catch {
      out[d] = 'unknown';
    }
  }
  return out;
}
