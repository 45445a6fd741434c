import { SurmiseError, didYouMean } from '../errors.ts';
import { parseInteger, type IntegerRange } from '../util/integer.ts';
import { ENGINE_CHOICES, type EngineChoice } from '../learn/engines.ts';

/** An integer option, read strictly by the shared `parseInteger` ('12abc' is refused). */
export function parseIntOption(name: string, raw: string): number {
  return parseInteger(name, raw);
}

/** A positive integer option, at most `max` (its documented ceiling; `option.tooLarge` above it). */
export function parsePositiveInt(name: string, raw: string, max = Infinity): number {
  return parseInteger(name, raw, { min: 1, max });
}

/** A non-negative integer option, at most `max` (its documented ceiling; `option.tooLarge` above it). */
export function parseNonNegativeInt(name: string, raw: string, max = Infinity): number {
  return parseInteger(name, raw, { min: 0, max });
}

/** An integer option within `range` (below: `option.badInteger`; above the ceiling: `option.tooLarge`). */
export function parseIntegerIn(name: string, raw: string, range: IntegerRange): number {
  return parseInteger(name, raw, range);
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
