import { existsSync, renameSync, writeFileSync, unlinkSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { SurmiseError } from '../errors.ts';

/**
 * Write `data` to `path` via a temporary file in the same folder and a rename, so a reader never
 * sees a half-written file and an interrupted write leaves the old file (or nothing) in place.
 * Refuses to replace an existing file unless `force` (code `output.exists`).
 */
export function writeFileAtomic(
  path: string,
  data: string | Uint8Array,
  opts: { force?: boolean; /** name in messages (default the path) */ display?: string; /** error-code prefix (default 'output') */ codePrefix?: string } = {},
): void {
  const shown = opts.display ?? path;
  const prefix = opts.codePrefix ?? 'output';
  if (!opts.force && existsSync(path)) {
    throw new SurmiseError(`${prefix}.exists`, `${shown} already exists; pass --force to replace it`);
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
    throw new SurmiseError(`${prefix}.unwritable`, `cannot write ${shown}: ${err.code ?? err.message}`);
  }
}
