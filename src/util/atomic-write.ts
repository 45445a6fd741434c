import { existsSync, renameSync, writeFileSync, unlinkSync } from 'node:fs';
import { SurmiseError } from '../errors.ts';
import { beginPartial, endPartial, removeStalePartials } from './partial.ts';

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
  removeStalePartials(path);
  const tmp = beginPartial(path);
  try {
    writeFileSync(tmp, data);
    renameSync(tmp, path);
    endPartial(tmp);
  } catch (e) {
    try {
      unlinkSync(tmp);
    } catch {
      /* nothing to clean */
    }
    endPartial(tmp);
    const err = e as NodeJS.ErrnoException;
    throw new SurmiseError(`${prefix}.unwritable`, `cannot write ${shown}: ${err.code ?? err.message}`);
  }
}
