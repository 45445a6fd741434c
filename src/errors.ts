/**
 * Typed errors. Every error a user can cause carries a stable `code` (e.g. `table.raggedRow`),
 * exit code 2, and a message that names the file, line and column, the config key, or the
 * expression position. Our own bugs are anything else (exit code 1).
 */
export class SurmiseError extends Error {
  readonly code: string;
  readonly exitCode: 1 | 2;
  readonly details: Record<string, unknown> | undefined;

  constructor(code: string, message: string, details?: Record<string, unknown>, exitCode: 1 | 2 = 2) {
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
