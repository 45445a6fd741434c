/**
 * Half-written outputs: every file or folder surmise writes is first written under a name of its
 * own (`.NAME.surmise-partial-PID-N`) beside the target and renamed into place when complete.
 * While one is being written, SIGINT and SIGTERM remove it and exit (130, 143); the writes are
 * synchronous, so a signal that arrives during one is handled right after it, never half-way.
 * SIGKILL cannot be caught: the next write to the same target removes partial outputs left by a
 * process that no longer runs (recognised by the name, and for folders by the marker file inside).
 */
import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/** The marker file inside a partial folder (its content: the writing process id). */
export const PARTIAL_MARKER = '.surmise-partial';

const pending = new Set<string>();
let counter = 0;
let hooked = false;

function onSignal(signal: NodeJS.Signals): void {
  for (const p of pending) rmSync(p, { recursive: true, force: true });
  pending.clear();
  process.exit(signal === 'SIGINT' ? 130 : 143);
}

/** Install the SIGINT/SIGTERM handlers (once per process). */
function hook(): void {
  if (hooked) return;
  hooked = true;
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
}

const escapeRe = (s: string): string => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** A fresh partial name beside `target`, registered for removal on SIGINT/SIGTERM. */
export function beginPartial(target: string): string {
  hook();
  const p = join(dirname(target), `.${basename(target)}.surmise-partial-${process.pid}-${++counter}`);
  pending.add(p);
  return p;
}

/** The partial at `p` was renamed into place or removed: no longer ours to clean. */
export function endPartial(p: string): void {
  pending.delete(p);
}

/** A write failed: remove the partial at `p` (if it was created) and stop tracking it. */
export function discardPartial(p: string): void {
  rmSync(p, { recursive: true, force: true });
  pending.delete(p);
}

function alive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Remove partial outputs for `target` left by processes that no longer run (e.g. killed with
 * SIGKILL). A folder is removed only when it holds our marker or is empty; a file only by its name. Returns
 * the names removed.
 */
export function removeStalePartials(target: string): string[] {
  const dir = dirname(target);
  const re = new RegExp(`^\\.${escapeRe(basename(target))}\\.surmise-(?:partial|old)-(\\d+)-\\d+$`);
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const m = re.exec(name);
    if (!m || alive(Number(m[1]))) continue;
    const p = join(dir, name);
    try {
      // a folder of ours holds the marker, or is still empty (killed between mkdir and the marker)
      if (statSync(p).isDirectory() && !existsSync(join(p, PARTIAL_MARKER)) && readdirSync(p).length > 0) continue;
      rmSync(p, { recursive: true, force: true });
      removed.push(name);
    } catch {
      /* gone already, or not ours to remove */
    }
  }
  return removed;
}
