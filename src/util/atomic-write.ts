import { existsSync, renameSync, writeFileSync, unlinkSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { SurmiseError } from '../errors.ts';

/**
 * Write `data` to `path` via a temporary file in the same folder and a rename, so a reader never
 * sees a half-written file and an interrupted write leaves the old file (or nothing) in place.
 * Refuses to replace an existing file unless `force` (code `output.exists`).
 */
export function writeFileAtomic(path: string, data: string | Uint8Array, opts: { force?: boolean } = {}): void {
  if (!opts.force && existsSync(path)) {
    throw new SurmiseError('output.exists', `${path} already exists; pass --force to replace it`);
  }
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now()}.tmp`);
  try {
    writeFileSync(tmp, data);
    renameSync(tmp, path);
  } catch (e) {
    try {
      unlinkSync(tmp);
    } catch {
      /* nothing to clean */
    }
    const err = e as NodeJS.ErrnoException;
    if (err.code === 'ENOENT' || err.code === 'EACCES' || err.code === 'ENOTDIR' || err.code === 'EISDIR') {
      throw new SurmiseError('output.unwritable', `cannot write ${path}: ${err.message}`);
    }
    throw e;
  }
}
