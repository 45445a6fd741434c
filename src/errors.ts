/**
 * Typed errors. Every error a user can cause carries a stable `code` (e.g. `table.raggedRow`),
 * exit code 2, and a message that names the file, line and column, the config key, or the
 * expression position. Our own bugs are anything else (exit code 1).
 */
import type { ErrorCode } from './error-codes.ts';

export { ERROR_CODES, isErrorCode, type ErrorCode } from './error-codes.ts';

export class SurmiseError extends Error {
  readonly code: ErrorCode;
  readonly exitCode: 1 | 2;
  readonly details: Record<string, unknown> | undefined;

  constructor(code: ErrorCode, message: string, details?: Record<string, unknown>, exitCode: 1 | 2 = 2) {
    super(message);
    this.name = 'SurmiseError';
    this.code = code;
    this.exitCode = exitCode;
    this.details = details;
  }
}

/** True for errors the user's input caused (exit code 2). */
export function isUserError(e: unknown): e is SurmiseError {
  return e instanceof SurmiseError && e.exitCode === 2;
}

/** Levenshtein distance, for "did you mean" suggestions. */
export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  let prev = new Array<number>(n + 1);
  let cur = new Array<number>(n + 1);
  for (let j = 0; j <= n; j++) prev[j] = j;
  for (let i = 1; i <= m; i++) {
    cur[0] = i;
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      cur[j] = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
    }
    [prev, cur] = [cur, prev];
  }
  return prev[n]!;
}

/** The nearest of `candidates` to `name`, or undefined when none is close (distance > max(2, |name|/2)). */
export function nearest(name: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestD = Infinity;
  for (const c of candidates) {
    const d = editDistance(name.toLowerCase(), c.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  return bestD <= Math.max(2, Math.floor(name.length / 2)) ? best : undefined;
}

/** " (did you mean 'x'?)" or "" */
export function didYouMean(name: string, candidates: readonly string[]): string {
  const n = nearest(name, candidates);
  return n === undefined ? '' : ` (did you mean '${n}'?)`;
}

/** A file system error in words ("no such file", "it is a folder, not a file", …), never a bare ENOENT. */
export function fileErrorReason(e: unknown): string {
  const code = (e as NodeJS.ErrnoException)?.code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  if (code === 'ENOTDIR') return 'a part of the path is a file, not a folder';
  return (e as Error)?.message ?? String(e);
}

/**
 * Text from the user's data made safe to show in one line of a message or note: control
 * characters escaped (`\n`, `\t`, `\u0007`), and cut to `max` characters with the full length
 * said, so a 5 MB cell is never echoed.
 */
export function printable(s: string, max = 60): string {
  const cut = s.length > max ? s.slice(0, max) : s;
  // eslint-disable-next-line no-control-regex
  const esc = cut.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, (c) =>
    c === '\n' ? '\\n' : c === '\t' ? '\\t' : c === '\r' ? '\\r' : `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
  return s.length > max ? `${esc}… (${s.length.toLocaleString('en-US')} characters)` : esc;
}

/**
 * A library error that names an option by its key (`details.option`, and `details.also` for more),
 * reworded for the layer the user wrote it in: `word(key)` is the CLI flag (`--skip-invalid`) or
 * the configuration key path (`bounds[0].skipInvalid`). Library messages mark an option they name
 * mid-sentence in backquotes (`` `skipInvalid` ``) or name it as "expected KEY to be …"; both are
 * reworded. An error without `details.option`, or whose keys `word` does not know, is returned as is.
 */
export function wordOptionError(e: SurmiseError, word: (key: string) => string | undefined): SurmiseError {
  const key = e.details?.option;
  if (typeof key !== 'string' || e.details?.worded !== undefined) return e;
  const also = Array.isArray(e.details?.also) ? (e.details.also as unknown[]).filter((k): k is string => typeof k === 'string') : [];
  let message = e.message;
  for (const k of [key, ...also]) {
    const w = word(k);
    if (w === undefined) continue;
    const q = k.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    message = message.replace(new RegExp('`' + q + '`', 'g'), w).replace(new RegExp(`\\bexpected ${q} to be\\b`, 'g'), `expected ${w} to be`);
  }
  if (message === e.message) return e;
  const out = new SurmiseError(e.code, message, { ...e.details, worded: true }, e.exitCode);
  out.stack = e.stack;
  return out;
}
