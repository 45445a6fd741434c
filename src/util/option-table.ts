/**
 * One options table per stage: each option's key, type, range or choices, default and meaning.
 * The library entry checks its options against the table once (`checkOptions`), the CLI builds
 * its flags from it (src/cli/options.ts) and the run configuration its keys (src/run/config.ts),
 * so a key one layer accepts and another ignores cannot arise. A table never names a CLI flag:
 * the flag is the key in kebab case (`dropTop` → `--drop-top`) unless `flag` says otherwise.
 */
import { SurmiseError } from '../errors.ts';
import type { ErrorCode } from '../error-codes.ts';
import { tooLarge } from './integer.ts';

interface OptionBase {
  /** The library's option key (camelCase); the config key too, unless `configKey` says otherwise. */
  key: string;
  /** One line a mathematician understands; the CLI help and the README quote it. */
  description: string;
  /**
   * Why changing this option does not change the outcome (e.g. it only decides where the work
   * runs). Absent: the option changes the result, and tests/run/option-parity.test.ts shows it.
   */
  inert?: string;
  /** CLI flag (without `--`) when it is not the kebab-case key; `false`: no flag, with `cliAbsent` saying why. */
  flag?: string | false;
  /** Config key when it differs from `key`; `false`: no config key, with `configAbsent` saying why. */
  configKey?: string | false;
  /** Why the CLI has no flag for it. */
  cliAbsent?: string;
  /** Why the configuration has no key for it. */
  configAbsent?: string;
  /**
   * Read by the CLI and the configuration in its written form and handed to the library converted
   * (says into what); the library does not check it against the table.
   */
  shell?: string;
}

export type OptionSpec = OptionBase &
  (
    | { type: 'integer'; min: number; max: number; default: number | null }
    /** A number in [min, max]; `openMin`/`openMax` exclude the end. */
    | { type: 'number'; min: number; max: number; openMin?: boolean; openMax?: boolean; default: number | null }
    | { type: 'choice'; choices: readonly string[]; default: string | null }
    | { type: 'boolean'; default: boolean }
    /** An expression, a split spec or another text; `pattern` is a check with its wording. */
    | { type: 'text'; default: string | null; pattern?: { re: RegExp; expected: string } }
    /** A list of texts (column names, expressions); `min` items at least; `choices` restricts them. */
    | { type: 'list'; default: readonly string[] | null; min?: number; max?: number; choices?: readonly string[]; separator?: ',' | ';'; /** what one choice is, e.g. 'an attribution method' */ noun?: string }
    /** A list of integers each in [min, max], at most `maxItems` long (e.g. hidden layer widths). */
    | { type: 'integers'; min: number; max: number; maxItems: number; default: readonly number[]; /** what one entry is, e.g. 'layer width' */ noun?: string }
  );

export type OptionTable = readonly OptionSpec[];

/** The value of an option as the library and the configuration hold it (a table declared `as const` gives the literal types). */
export type OptionValue<O extends OptionSpec> = O extends { type: 'integer' | 'number' }
  ? number
  : O extends { type: 'choice'; choices: readonly (infer C)[] }
    ? C
    : O extends { type: 'boolean' }
      ? boolean
      : O extends { type: 'text' }
        ? string
        : O extends { type: 'list'; choices: readonly (infer C)[] }
          ? C[]
          : O extends { type: 'list' }
            ? string[]
            : O extends { type: 'integers' }
              ? number[]
              : never;

/** The configuration key (path) of an option, or never when the configuration has none (see configKeyOf). */
export type ConfigKeyOf<O extends OptionSpec> = O extends { configKey: false } ? never : O extends { configKey: infer K extends string } ? K : O['key'];

/** The largest seed (seeds are 32-bit unsigned). */
export const SEED_MAX = 0xffffffff;

/** The row of a `seed` option: every seed of the project defaults to 1. */
export const seedOption = (description: string) => ({ key: 'seed', type: 'integer', min: 0, max: SEED_MAX, default: 1, description }) as const;

/** `dropTop` → `drop-top`. */
export const kebab = (key: string): string => key.replace(/[A-Z]/g, (c) => '-' + c.toLowerCase());

/** The CLI flag of an option (`--drop-top`), or null when the CLI has none. */
export function flagOf(o: OptionSpec): string | null {
  if (o.flag === false) return null;
  return '--' + (o.flag ?? kebab(o.key));
}

/** The config key of an option (relative to its block), or null when the configuration has none. */
export function configKeyOf(o: OptionSpec): string | null {
  if (o.configKey === false) return null;
  return o.configKey ?? o.key;
}

/** The option of `table` with this key (a programming error when absent). */
export function optionOf(table: OptionTable, key: string): OptionSpec {
  const o = table.find((s) => s.key === key);
  if (!o) throw new Error(`no option '${key}' in this options table`);
  return o;
}

const grouped = (x: number): string => x.toLocaleString('en-US');

/** What an option expects, in words: "an integer from 1 to 100", "one of relu, gelu". */
export function expectedOf(o: OptionSpec): string {
  switch (o.type) {
    case 'integer':
      // the ceiling has its own error (option.tooLarge, see integer.ts)
      return `an integer ≥ ${grouped(o.min)}`;
    case 'number':
      return `a number in ${o.openMin ? '(' : '['}${o.min}, ${o.max}${o.openMax ? ')' : ']'}`;
    case 'choice':
      return `one of ${o.choices.join(', ')}`;
    case 'boolean':
      return 'true or false';
    case 'text':
      return o.pattern?.expected ?? 'a non-empty text';
    case 'list':
      return o.choices ? `a list of ${o.choices.join(', ')}` : `a list of ${o.min ?? 0} or more non-empty texts`;
    case 'integers':
      return `a list of at most ${o.maxItems} integers from ${grouped(o.min)} to ${grouped(o.max)}`;
  }
}

/** The default in words, for help texts and the README ("none": chosen at run time, see the description). */
export function defaultText(o: OptionSpec): string {
  const d = o.default;
  if (d === null) return 'none';
  if (Array.isArray(d)) return d.length ? d.join(',') : 'none';
  return String(d);
}

const show = (v: unknown): string => (Array.isArray(v) ? `[${v.map(show).join(', ')}]` : String(v));

/**
 * The `option.badValue` error for option `key`, worded with the key; `details.option` lets the
 * CLI and config layers reword it as a flag or a key path (see `wordOptionError`).
 */
export function badOption(key: string, expected: string, got: unknown, code: ErrorCode = 'option.badValue'): SurmiseError {
  return new SurmiseError(code, `expected ${key} to be ${expected}, got ${show(got)}`, { option: key, expected });
}

/** Check one value against its option; returns it (lists copied). Above a ceiling: `option.tooLarge`. */
export function checkOption(o: OptionSpec, v: unknown): unknown {
  const bad = (): never => {
    throw badOption(o.key, expectedOf(o), v);
  };
  switch (o.type) {
    case 'integer':
      if (typeof v !== 'number' || !Number.isInteger(v) || v < o.min) bad();
      if ((v as number) > o.max) throw tooLarge(o.key, v as number, o);
      return v;
    case 'number': {
      if (typeof v !== 'number' || !Number.isFinite(v)) bad();
      const x = v as number;
      if (x < o.min || (o.openMin && x === o.min) || (o.openMax && x === o.max)) bad();
      if (x > o.max) bad();
      return x;
    }
    case 'choice':
      if (typeof v !== 'string' || !o.choices.includes(v)) bad();
      return v;
    case 'boolean':
      if (typeof v !== 'boolean') bad();
      return v;
    case 'text':
      if (typeof v !== 'string' || v.trim() === '' || (o.pattern && !o.pattern.re.test(v))) bad();
      return v;
    case 'list': {
      if (!Array.isArray(v) || v.length < (o.min ?? 0) || v.some((s) => typeof s !== 'string' || s.trim() === '')) bad();
      const list = v as string[];
      const wrong = o.choices ? list.find((s) => !o.choices!.includes(s)) : undefined;
      if (wrong !== undefined) {
        throw new SurmiseError('option.badValue', `'${wrong}' in \`${o.key}\` is not ${o.noun ?? 'one of the choices'}; expected ${o.choices!.join(', ')}`, { option: o.key, expected: expectedOf(o) });
      }
      if (o.max !== undefined && list.length > o.max) bad();
      return [...list];
    }
    case 'integers': {
      if (!Array.isArray(v) || v.some((h) => typeof h !== 'number' || !Number.isInteger(h) || h < o.min)) bad();
      const list = v as number[];
      if (list.length > o.maxItems) throw tooLarge(o.key, list.length, { min: 0, max: o.maxItems }, `the number of ${o.key} entries`);
      for (const h of list) if (h > o.max) throw tooLarge(o.key, h, o, `each ${o.key} entry`);
      return [...list];
    }
  }
}

/**
 * Check every option of `given` that `table` lists (absent or undefined: skipped) and return the
 * table's options with defaults filled in. Keys the table does not list are left to the caller.
 */
export function checkOptions<T extends Record<string, unknown>>(table: OptionTable, given: Record<string, unknown>): T {
  const out: Record<string, unknown> = {};
  for (const o of table) {
    if (o.shell !== undefined) continue;
    const v = given[o.key];
    out[o.key] = v === undefined ? (Array.isArray(o.default) ? [...o.default] : o.default) : checkOption(o, v);
  }
  return out as T;
}

/** The defaults of a table as one object (lists copied). */
export function defaultsOf(table: OptionTable): Record<string, unknown> {
  return checkOptions(table, {});
}
