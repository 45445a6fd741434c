import { SurmiseError, didYouMean } from '../errors.ts';
import { ENGINE_CHOICES, type EngineChoice } from '../learn/engines.ts';

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

/** `--engine`: the network engine (learn's registered list). */
export function parseEngine(raw: string): EngineChoice {
  if (!(ENGINE_CHOICES as readonly string[]).includes(raw)) {
    throw new SurmiseError('option.badEngine', `--engine ${raw}: expected one of ${ENGINE_CHOICES.join(', ')}${didYouMean(raw, ENGINE_CHOICES)}`);
  }
  return raw as EngineChoice;
}
