import { SurmiseError, type ErrorCode } from '../errors.ts';

/** An integer range `lo..hi` as written in options and configuration (e.g. `-3..3`). */
export const INTEGER_RANGE_PATTERN = /^\s*(-?\d+)\s*\.\.\s*(-?\d+)\s*$/;

/**
 * Read an integer range `lo..hi` (lo ≤ hi, spaces allowed around the numbers), e.g. `-3..3`.
 * `code` is the calling stage's error code; `where` (e.g. `--powers -3..3`) starts the message
 * when given, so the library's own message names no flag or key; `option` goes to details.option.
 * @example parseIntegerRange('-3..3', 'relate.badPowers') // [-3, 3]
 */
export function parseIntegerRange(text: string, code: ErrorCode, where?: string, option?: string): [number, number] {
  const at = where === undefined ? '' : `${where}: `;
  const details = { value: text, ...(option !== undefined ? { option } : {}) };
  const m = INTEGER_RANGE_PATTERN.exec(text);
  if (!m) throw new SurmiseError(code, `${at}expected a range of integers lo..hi, e.g. -3..3, got '${text}'`, details);
  const lo = Number(m[1]);
  const hi = Number(m[2]);
  if (!Number.isSafeInteger(lo) || !Number.isSafeInteger(hi)) throw new SurmiseError(code, `${at}the ends of '${text}' are too large to be exact integers`, details);
  if (lo > hi) throw new SurmiseError(code, `${at}the lower end ${lo} exceeds the upper end ${hi}`, details);
  return [lo, hi];
}
