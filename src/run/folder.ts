import { existsSync, mkdirSync, readFileSync, readdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { SurmiseError } from '../errors.ts';

export interface OutputFile {
  /** Path inside the run folder, with '/' separators (e.g. 'plots/ranking.svg'). */
  path: string;
  data: string | Uint8Array;
}

let pending: string | null = null;
let hooked = false;

/** Remove a half-written folder if the process is interrupted while it is being written. */
function hookInterrupts(): void {
  if (hooked) return;
  hooked = true;
  const clean = (signal: NodeJS.Signals) => {
    if (pending) rmSync(pending, { recursive: true, force: true });
    process.exit(signal === 'SIGINT' ? 130 : 143);
  };
  process.once('SIGINT', clean);
  process.once('SIGTERM', clean);
}

/** True when `dir` holds a run written by surmise (its results.json says so). */
function isRunFolder(dir: string): boolean {
  try {
    const r = JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8')) as { format?: string };
    return r.format === 'surmise-run';
  } catch {
    return false;
  }
}

/**
 * Refuse early (before any work) when the run folder exists and --force was not given. Even with
 * --force only an earlier run folder (or an empty folder) is replaced: a folder of the user's own
 * files is never deleted.
 */
export function checkRunFolder(outDir: string, force: boolean): void {
  if (!existsSync(outDir)) return;
  if (!force) {
    throw new SurmiseError('output.exists', `${outDir} already exists; pass --force to replace it, or choose another --out`);
  }
  if (!statSync(outDir).isDirectory()) {
    throw new SurmiseError('output.notRunFolder', `${outDir} is a file, not a run folder; choose another --out`);
  }
  if (readdirSync(outDir).length > 0 && !isRunFolder(outDir)) {
    throw new SurmiseError(
      'output.notRunFolder',
      `${outDir} is not a surmise run folder (no results.json written by surmise); --force replaces only earlier runs, choose another --out`,
    );
  }
}

/**
 * Write every file of a run into a sibling staging folder, then move it into place with renames:
 * a reader sees either the old folder or the complete new one, never a half-written report.
 * An existing folder is replaced only with `force` (it is removed after the new one is in place).
 */
export function writeRunFolder(outDir: string, files: OutputFile[], force: boolean): void {
  checkRunFolder(outDir, force);
  const parent = dirname(outDir);
  try {
    mkdirSync(parent, { recursive: true });
  } catch (e) {
    throw new SurmiseError('output.unwritable', `cannot create ${parent}: ${(e as Error).message}`);
  }
  const staging = join(parent, `.${basename(outDir)}.partial-${process.pid}`);
  hookInterrupts();
  pending = staging;
  try {
    rmSync(staging, { recursive: true, force: true });
    mkdirSync(staging, { recursive: true });
    for (const f of files) {
      const target = join(staging, ...f.path.split('/'));
      mkdirSync(dirname(target), { recursive: true });
      writeFileSync(target, f.data);
    }
    if (existsSync(outDir)) {
      const old = join(parent, `.${basename(outDir)}.old-${process.pid}`);
      renameSync(outDir, old);
      renameSync(staging, outDir);
      rmSync(old, { recursive: true, force: true });
    } else {
      renameSync(staging, outDir);
    }
  } catch (e) {
    rmSync(staging, { recursive: true, force: true });
    if (e instanceof SurmiseError) throw e;
    throw new SurmiseError('output.unwritable', `cannot write the run folder ${outDir}: ${(e as Error).message}`);
  } finally {
    pending = null;
  }
}
