import { SurmiseError, didYouMean } from '../errors.ts';
import { tooLarge, type IntegerRange } from '../util/integer.ts';
import { ENGINE_CHOICES, type EngineChoice } from '../learn/engines.ts';

/** Parse an integer option strictly (`Number`, not `parseInt`: '12abc' is refused). */
export function parseIntOption(name: string, raw: string): number {
  const v = Number(raw);
  if (raw.trim() === '' || !Number.isInteger(v)) {
    throw new SurmiseError('option.badInteger', `expected ${name} to be an integer, got '${raw}'`);
  }
  return v;
}

/** A positive integer option, at most `max` (its documented ceiling; `option.tooLarge` above it). */
export function parsePositiveInt(name: string, raw: string, max = Infinity): number {
  const v = parseIntOption(name, raw);
  if (v < 1) throw new SurmiseError('option.badInteger', `expected ${name} to be a positive integer, got ${raw}`);
  if (v > max) throw tooLarge(name, raw, { min: 1, max });
  return v;
}

/** A non-negative integer option, at most `max` (its documented ceiling; `option.tooLarge` above it). */
export function parseNonNegativeInt(name: string, raw: string, max = Infinity): number {
  const v = parseIntOption(name, raw);
  if (v < 0) throw new SurmiseError('option.badInteger', `expected ${name} to be a non-negative integer, got ${raw}`);
  if (v > max) throw tooLarge(name, raw, { min: 0, max });
  return v;
}

/** An integer option within `range` (below: `option.badInteger`; above the ceiling: `option.tooLarge`). */
export function parseIntegerIn(name: string, raw: string, range: IntegerRange): number {
  const v = parseIntOption(name, raw);
  if (v < range.min) throw new SurmiseError('option.badInteger', `expected ${name} to be an integer ≥ ${range.min}, got ${raw}`);
  if (v > range.max) throw tooLarge(name, raw, range);
  return v;
}

/** " (1 to 100)" for an option's help text. */
export function rangeHelp(range: IntegerRange): string {
  return ` (${range.min.toLocaleString('en-US')} to ${range.max.toLocaleString('en-US')})`;
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
