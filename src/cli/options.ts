import type { Command } from 'commander';
import { SurmiseError, didYouMean } from '../errors.ts';
import { parseInteger, tooLarge, type IntegerRange } from '../util/integer.ts';
import { ENGINE_CHOICES, type EngineChoice } from '../learn/engines.ts';
import { defaultText, expectedOf, flagOf, kebab, type OptionSpec, type OptionTable } from '../util/option-table.ts';

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
    throw new SurmiseError('option.badValue', `--engine ${raw}: expected one of ${ENGINE_CHOICES.join(', ')}${didYouMean(raw, ENGINE_CHOICES)}`, { option: 'engine' });
  }
  return raw as EngineChoice;
}

/** Key → flag of every option a command built from tables, for wording library errors (see wordOptionError). */
const FLAGS = new WeakMap<Command, Map<string, string>>();

/**
 * The flag a command shows for a library option key (`dropTop` → `--drop-top`): from the tables it
 * was built from, else the kebab-case key when the command has that flag, else undefined.
 */
export function flagFor(cmd: Command, key: string): string | undefined {
  const known = FLAGS.get(cmd)?.get(key);
  if (known) return known;
  // a list key's flag may be singular and repeatable (kinds → --kind)
  for (const flag of ['--' + kebab(key), '--' + kebab(key).replace(/s$/, '')]) {
    if (cmd.options.some((o) => o.long === flag || o.long === flag.replace(/^--/, '--no-'))) return flag;
  }
  return undefined;
}

/** Commander's attribute name of a flag (`--drop-top` → `dropTop`, `--no-intercept` → `intercept`). */
const attributeOf = (flag: string): string => flag.replace(/^--(no-)?/, '').replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());

/** Help text of a table option: its description, range and default. */
function helpOf(o: OptionSpec): string {
  const range = o.type === 'integer' ? rangeHelp(o) : o.type === 'number' ? ` (${expectedOf(o)})` : o.type === 'choice' ? `: ${o.choices.join(' | ')}` : '';
  const dflt = o.type === 'boolean' || o.default === null ? '' : ` (default: ${defaultText(o)})`;
  return `${o.description}${range}${dflt}`;
}

/**
 * Add the flags of a stage's options table to a command (all options with a flag, or only `keys`).
 * No commander defaults: an absent flag is absent, so the library's default applies.
 */
export function addTableOptions(cmd: Command, table: OptionTable, keys?: readonly string[]): Command {
  const flags = FLAGS.get(cmd) ?? new Map<string, string>();
  FLAGS.set(cmd, flags);
  for (const o of table) {
    const flag = flagOf(o);
    if (flag === null || (keys && !keys.includes(o.key))) continue;
    if (flags.has(o.key) || cmd.options.some((c) => c.long === flag || c.long === flag.replace(/^--/, '--no-'))) continue;
    flags.set(o.key, flag);
    if (o.type === 'boolean') cmd.option(o.default ? flag.replace(/^--/, '--no-') : flag, o.default ? `do not: ${o.description}` : o.description);
    else if (o.type === 'list' && o.separator !== ';') cmd.option(`${flag} <list>`, `${helpOf(o)}; comma-separated or repeated`, collect);
    else {
      const meta = { integer: 'n', number: 'x', choice: 'name', text: 'spec', list: 'list', integers: 'list' }[o.type];
      cmd.option(`${flag} <${meta}>`, helpOf(o));
    }
  }
  return cmd;
}

/** Parse one flag's text into the option's value; errors name the flag and carry the option key. */
export function parseTableOption(o: OptionSpec, raw: string | string[] | boolean, flag = flagOf(o) ?? o.key): unknown {
  const details = { option: o.key };
  const bad = (got: string, extra = ''): never => {
    throw new SurmiseError('option.badValue', `expected ${flag} to be ${expectedOf(o)}, got '${got}'${extra}`, { ...details, expected: expectedOf(o) });
  };
  if (typeof raw === 'boolean') return raw;
  const text = Array.isArray(raw) ? raw.join(',') : raw;
  const integer = (t: string, label: string, range: IntegerRange): number => {
    const v = Number(t);
    if (t.trim() === '' || !Number.isInteger(v)) throw new SurmiseError('option.badInteger', `expected ${label} to be an integer, got '${t}'`, details);
    if (v < range.min) throw new SurmiseError('option.badValue', `expected ${label} to be an integer ≥ ${range.min}, got ${t}`, { ...details, expected: `an integer ≥ ${range.min}` });
    if (v > range.max) throw tooLarge(o.key, t, range, label);
    return v;
  };
  switch (o.type) {
    case 'integer':
      return integer(text, flag, o);
    case 'number': {
      const v = Number(text);
      if (text.trim() === '' || !Number.isFinite(v) || v < o.min || v > o.max || (o.openMin && v === o.min) || (o.openMax && v === o.max)) bad(text);
      return v;
    }
    case 'choice':
      if (!o.choices.includes(text)) {
        const list = o.choices.length > 1 ? `${o.choices.slice(0, -1).join(', ')} or ${o.choices[o.choices.length - 1]}` : o.choices.join('');
        throw new SurmiseError('option.badValue', `${flag} ${text}: expected ${list}${didYouMean(text, o.choices)}`, { ...details, expected: expectedOf(o) });
      }
      return text;
    case 'text':
      if (text.trim() === '' || (o.pattern && !o.pattern.re.test(text))) bad(text);
      return text;
    case 'boolean':
      return true;
    case 'list': {
      const sep = o.separator ?? ',';
      const parts = text.split(sep).map((s) => s.trim());
      if (sep === ';' && parts.length > 1 && parts[parts.length - 1] === '') parts.pop();
      if (parts.some((s) => s === '')) throw new SurmiseError('option.badList', `${flag} ${text}: expected ${sep === ',' ? 'comma' : 'semicolon'}-separated entries with none empty`, details);
      if (o.choices) {
        if (parts.length === 1 && parts[0] === 'all') return [...o.choices];
        if (parts.includes('all'))
          throw new SurmiseError('option.badValue', `${flag} ${text}: 'all' already means every ${o.noun?.replace(/^an? /, '') ?? 'choice'}; give it alone or list the ones wanted`, details);
        const wrong = parts.find((p) => !o.choices!.includes(p));
        if (wrong !== undefined) {
          const what = `${o.noun ?? 'one of the choices'}; expected ${o.choices.join(', ')} or all${didYouMean(wrong, [...o.choices, 'all'])}`;
          throw new SurmiseError('option.badValue', `${flag} ${text}: '${wrong}' is not ${what}`, details);
        }
        return [...new Set(parts)];
      }
      return parts;
    }
    case 'integers': {
      if (text.trim() === '' || text.trim() === 'none') return [];
      const widths = text.split(',').map((s) => integer(s.trim(), `${flag} (each ${o.noun ?? 'entry'})`, o));
      if (widths.length > o.maxItems) throw tooLarge(o.key, widths.length, { min: 0, max: o.maxItems }, `${flag} (number of entries)`);
      return widths;
    }
  }
}

/**
 * The options of `table` given on the command line, parsed and keyed by the library's keys
 * (absent flags are left out, so the library's defaults apply). `parsers` reads a flag its own way.
 */
export function readTableOptions(
  table: OptionTable,
  given: Record<string, unknown>,
  parsers: Record<string, (raw: string) => unknown> = {},
  keys?: readonly string[],
): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const o of table) {
    const flag = flagOf(o);
    if (flag === null || (keys && !keys.includes(o.key))) continue;
    const raw = given[attributeOf(flag)];
    if (raw === undefined || (o.type === 'boolean' && raw === o.default)) continue;
    if (Array.isArray(raw) && raw.length === 0) continue;
    const parse = parsers[o.key] as ((raw: string) => unknown) | undefined;
    out[o.key] = parse && typeof raw === 'string' ? parse(raw) : parseTableOption(o, raw as string | string[] | boolean, flag);
  }
  return out;
}
