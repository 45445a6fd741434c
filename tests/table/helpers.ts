import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh temporary folder for one test file. */
export function tempDir(tag: string): string {
  return mkdtempSync(join(tmpdir(), `surmise-${tag}-`));
}

/** Write `text` to `name` inside `dir` and return the path. */
export function put(dir: string, name: string, text: string | Buffer): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}
