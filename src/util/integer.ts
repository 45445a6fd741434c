import { SurmiseError, type ErrorCode } from '../errors.ts';

/** The allowed values of a count option: an integer from `min` to `max` (its ceiling). */
export interface IntegerRange {
  min: number;
  max: number;
}

/** 1000000 → "1,000,000". */
const grouped = (x: number): string => x.toLocaleString('en-US');

/**
 * Check one integer option against its range and return it. The error names the option key
 * (`seeds`, `bins`) and carries it in `details.option`; the CLI and config layers word it as a
 * flag or a key path. Below the range: `badCode`; above the ceiling: `option.tooLarge`.
 * @example checkInteger('seeds', 3, { min: 1, max: 100 }, 'rank.badOption') // 3
 */
export function checkInteger(key: string, v: unknown, range: IntegerRange, badCode: ErrorCode = 'option.badValue'): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < range.min) {
    throw new SurmiseError(badCode, `expected ${key} to be an integer ≥ ${range.min}, got ${String(v)}`, { option: key, ...range });
  }
  if (v > range.max) throw tooLarge(key, v, range);
  return v;
}

/** `option.tooLarge`: the value is above the option's documented ceiling. */
export function tooLarge(key: string, v: number | string, range: IntegerRange, label = key): SurmiseError {
  return new SurmiseError(
    'option.tooLarge',
    `expected ${label} to be at most ${grouped(range.max)} (its ceiling), got ${typeof v === 'number' ? grouped(v) : v}`,
    { option: key, ...range },
  );
}
