import { existsSync, renameSync, writeFileSync } from 'node:fs';
import { SurmiseError } from '../errors.ts';
import { beginPartial, discardPartial, endPartial, removeStalePartials } from './partial.ts';

/**
 * Write `data` to `path` via a temporary file in the same folder and a rename, so a reader never
 * sees a half-written file and an interrupted write leaves the old file (or nothing) in place.
 * Refuses to replace an existing file unless `force` (code `output.exists`).
 */
export function writeFileAtomic(
  path: string,
  data: string | Uint8Array,
  opts: { force?: boolean; /** name in messages (default the path) */ display?: string; /** error-code prefix (default 'output') */ codePrefix?: 'output' | 'table' | 'knots' } = {},
): void {
  const shown = opts.display ?? path;
  const prefix = opts.codePrefix ?? 'output';
  if (!opts.force && existsSync(path)) {
    throw new SurmiseError(`${prefix}.exists`, `${shown} already exists; pass \`force\` to replace it`, { option: 'force' });
  }
  removeStalePartials(path);
  const tmp = beginPartial(path);
  try {
    writeFileSync(tmp, data);
    renameSync(tmp, path);
    endPartial(tmp);
  } catch (e) {
    discardPartial(tmp);
    const err = e as NodeJS.ErrnoException;
    throw new SurmiseError(`${prefix}.unwritable`, `cannot write ${shown}: ${err.code ?? err.message}`);
  }
}
