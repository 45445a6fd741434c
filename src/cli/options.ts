import { SurmiseError } from '../errors.ts';

/** Parse an integer option strictly (`Number`, not `parseInt`: '12abc' is refused). */
export function parseIntOption(name: string, raw: string): number {
  const v = Number(raw);
  if (raw.trim() === '' || !Number.isInteger(v)) {
    throw new SurmiseError('option.badInteger', `expected ${name} to be an integer, got '${raw}'`);
  }
  return v;
}

export function parsePositiveInt(name: string, raw: string): number {
  const v = parseIntOption(name, raw);
  if (v < 1) throw new SurmiseError('option.badInteger', `expected ${name} to be a positive integer, got ${raw}`);
  return v;
}

export function parseNonNegativeInt(name: string, raw: string): number {
  const v = parseIntOption(name, raw);
  if (v < 0) throw new SurmiseError('option.badInteger', `expected ${name} to be a non-negative integer, got ${raw}`);
  return v;
}

/** Commander collector for repeatable options (`--derive a=b --derive c=d`). */
export function collect(value: string, previous: string[] = []): string[] {
  return [...previous, value];
}
