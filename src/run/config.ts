/**
 * The run configuration: a YAML file (parsed with `yaml`, validated with `zod`). Keys are ours and
 * documented in the README. Every refusal names the file, line and column and the key path, with a
 * "did you mean" for misspelt keys. Paths in the file are relative to the file's folder.
 */
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { isMap, isScalar, isSeq, LineCounter, parseDocument, type Node as YamlNode } from 'yaml';
import { z } from 'zod';
import { SurmiseError, didYouMean, fileErrorReason, printable } from '../errors.ts';
import type { IntegerRange } from '../util/integer.ts';
import { configKeyOf, type ConfigKeyOf, type OptionSpec, type OptionTable, type OptionValue } from '../util/option-table.ts';
import { RANK_LIMITS, RANK_OPTIONS } from '../attribute/options.ts';
import { FIT_OPTIONS, SEARCH_OPTIONS } from '../relate/options.ts';
import { BOUND_OPTIONS, DISCOVER_OPTIONS } from '../bound/options.ts';
import { RESIDUAL_OPTIONS } from './residual.ts';
import { parseComplexPairsOption } from '../table/complex-pairs.ts';

/** An integer count within the stage's documented range (its ceiling is refused as option.tooLarge). */
const count = (r: IntegerRange) => z.number().int().min(r.min).max(r.max);
const exprString = z.string().min(1);
/** A list, where a single item may be written without brackets (`rhs: b` = `rhs: [b]`). */
const listOf = <T extends z.ZodType>(item: T, min = 0) => z.preprocess((v) => (typeof v === 'string' ? [v] : v), z.array(item).min(min));

/** The zod type of one table option, with the table's default (or optional when it has none). */
function zodOf(o: OptionSpec): z.ZodType {
  let t: z.ZodType;
  switch (o.type) {
    case 'integer':
      t = count(o);
      break;
    case 'number': {
      let n = z.number();
      n = o.openMin ? n.gt(o.min) : n.min(o.min);
      n = o.openMax ? n.lt(o.max) : n.max(o.max);
      t = n;
      break;
    }
    case 'choice':
      t = z.enum(o.choices as [string, ...string[]]);
      break;
    case 'boolean':
      t = z.boolean();
      break;
    case 'text':
      t = o.pattern ? exprString.regex(o.pattern.re, `expected ${o.pattern.expected}`) : exprString;
      break;
    case 'list': {
      const item = o.choices ? z.enum(o.choices as [string, ...string[]]) : z.string().min(1);
      const list = z.array(item).min(o.min ?? 0);
      t = z.preprocess((v) => (typeof v === 'string' ? [v] : v), o.max !== undefined ? list.max(o.max) : list);
      break;
    }
    case 'integers':
      t = z.array(count(o)).max(o.maxItems);
      break;
  }
  if (o.default === null) return t.optional();
  return t.default((Array.isArray(o.default) ? [...o.default] : o.default) as never);
}

/** A config key path's key within block `B` (`network.epochs` is `epochs` in `network`; `''`: the top level). */
type InBlock<K extends string, B extends string> = B extends '' ? (K extends `${string}.${string}` ? never : K) : K extends `${B}.${infer R}` ? R : never;

/** The zod type of an option as the compiler sees it: its value, optional when it has no default. */
type ZodOfOption<O extends OptionSpec> = O extends { default: null } ? z.ZodOptional<z.ZodType<OptionValue<O>>> : z.ZodDefault<z.ZodType<OptionValue<O>>>;

/** The shape tableShape builds, as a type: RunConfig follows from the tables through it. */
type TableShape<T extends OptionTable, B extends string> = { [O in T[number] as InBlock<ConfigKeyOf<O>, B>]: ZodOfOption<O> };

/**
 * The keys of `table` that live in the configuration block `block` (`''`: the top level, or
 * `network`, `attribution` for the ranking's table whose config keys are paths).
 */
function tableShape<T extends OptionTable, B extends string = ''>(table: T, block: B = '' as B): TableShape<T, B> {
  const shape: Record<string, z.ZodType> = {};
  for (const o of table) {
    const k = configKeyOf(o);
    if (k === null) continue;
    const dot = k.lastIndexOf('.');
    if ((dot < 0 ? '' : k.slice(0, dot)) !== block) continue;
    shape[k.slice(dot + 1)] = zodOf(o);
  }
  return shape as TableShape<T, B>;
}

/** The library options of `table` read from a configuration block (key paths resolved, absent left out). */
export function optionsFromConfig(table: OptionTable, block: object): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const o of table) {
    const k = configKeyOf(o);
    if (k === null) continue;
    let v: unknown = block;
    for (const part of k.split('.')) v = v === null || typeof v !== 'object' ? undefined : (v as Record<string, unknown>)[part];
    if (v !== undefined) out[o.key] = v;
  }
  return out;
}

const NetworkSchema = z.strictObject(tableShape(RANK_OPTIONS, 'network'));
const AttributionSchema = z.strictObject(tableShape(RANK_OPTIONS, 'attribution'));

/** A block's own seed; absent: the top-level `seed`. */
const BLOCK_SEED = { seed: count(RANK_LIMITS.seed).optional() };

const FitSchema = z.strictObject({
  target: exprString,
  terms: listOf(exprString, 1),
  ...tableShape(FIT_OPTIONS),
  ...BLOCK_SEED,
});

/** Most `search` blocks in one configuration (a count ceiling, refused as option.tooLarge). */
export const MAX_SEARCHES = 20;

/** The ceiling of each list of blocks (each block is a stage's work over the whole table). */
export const MAX_BLOCKS = { search: MAX_SEARCHES, fits: 50, bounds: 50, discover: 20 } as const;

/** The name a search block gets when it has none: `search 1`, `search 2`, … in the order written. */
export const defaultSearchName = (i: number): string => `search ${i + 1}`;

const SearchSchema = z.strictObject({
  /** Our own key: the name the report, results.json and `surmise compare` know the search by. */
  name: z
    .string()
    .trim()
    .min(1)
    .max(60, 'expected a name of at most 60 characters')
    // eslint-disable-next-line no-control-regex
    .regex(/^[^\u0000-\u001f\u007f-\u009f]*$/, 'expected a name on one line, without control characters')
    .optional(),
  target: exprString,
  from: listOf(z.string().min(1), 1),
  ...tableShape(SEARCH_OPTIONS),
  ...BLOCK_SEED,
});

/**
 * `search`: one block (a mapping, as configurations were first written) or a list of blocks, read
 * as a list either way; each block named (its own `name`, else `search 1`, `search 2`, …), the
 * names all different.
 */
const SearchesSchema = z.preprocess(
  (v) => (v !== null && typeof v === 'object' && !Array.isArray(v) ? [v] : v),
  z
    .array(SearchSchema)
    .max(MAX_SEARCHES)
    .superRefine((list, ctx) => {
      const names = list.map((s, i) => s.name ?? defaultSearchName(i));
      names.forEach((n, i) => {
        const j = names.indexOf(n);
        if (j === i) return;
        ctx.addIssue(
          list[i]!.name !== undefined
            ? { code: 'custom', path: [i, 'name'], message: `expected a name no other search block has (search[${j}] is also named '${n}')` }
            : { code: 'custom', path: [i], message: `this block has no name, so it would be named '${n}', which search[${j}] is already named; give it a name` },
        );
      });
    })
    .transform((list) => list.map(({ name, ...s }, i) => ({ name: name ?? defaultSearchName(i), ...s }))),
);

/** Residual ranking: fit, then rank the remaining columns on what the fit leaves over (run/residual.ts). */
const ResidualSchema = z.strictObject({
  target: exprString,
  terms: listOf(exprString, 1),
  ...tableShape(RESIDUAL_OPTIONS),
});

const BoundSchema = z.strictObject({
  lhs: exprString,
  rhs: listOf(exprString, 1),
  ...tableShape(BOUND_OPTIONS),
});

/** Right-hand-side discovery: keys, ranges and defaults from the bound stage's DISCOVER_OPTIONS. */
const DiscoverSchema = z.strictObject({
  lhs: exprString,
  from: listOf(exprString, 1),
  ...tableShape(DISCOVER_OPTIONS),
  ...BLOCK_SEED,
});

/** The complex-pair rule as `--complex-pairs` takes it: `auto` (the default), `none`, or NAME=RE,IM items. */
const ComplexPairsSchema = listOf(z.string().min(1))
  .default([])
  .superRefine((list, ctx) => {
    try {
      parseComplexPairsOption(list);
    } catch (e) {
      if (!(e instanceof SurmiseError)) throw e;
      // the key path is named by the config layer; the message keeps the value and the rule
      ctx.addIssue({ code: 'custom', message: e.message.replaceAll('`complexPairs`', 'complexPairs').replace(/^complexPairs /, '') });
    }
  });

export const RunConfigSchema = z.strictObject({
  table: z.string().min(1),
  format: z.enum(['csv', 'tsv', 'json', 'jsonl']).optional(),
  kinds: z.record(z.string(), z.enum(['real', 'integer', 'complex', 'label'])).default({}),
  complexPairs: ComplexPairsSchema,
  derive: z.record(z.string(), exprString).default({}),
  target: exprString,
  groups: z.record(z.string(), z.array(z.string().min(1)).min(1)).default({}),
  ...tableShape(RANK_OPTIONS),
  network: NetworkSchema.prefault({}),
  attribution: AttributionSchema.prefault({}),
  fits: z.array(FitSchema).max(MAX_BLOCKS.fits).default([]),
  search: SearchesSchema.default([]),
  residual: ResidualSchema.optional(),
  bounds: z.array(BoundSchema).max(MAX_BLOCKS.bounds).default([]),
  discover: z.array(DiscoverSchema).max(MAX_BLOCKS.discover).default([]),
  output: z.string().min(1).default('surmise-run'),
});

/**
 * The validated configuration with defaults filled in: the schema's output type, which the
 * stages' options tables (declared `as const`) give through tableShape, so a key or a default
 * changed in a table changes this type too.
 */
export type RunConfig = z.output<typeof RunConfigSchema>;

/** Key path (list indices as `#`) → library option key, for every table option of the configuration. */
const OPTION_AT = new Map<string, string>(
  (
    [
      [RANK_OPTIONS, ''],
      [FIT_OPTIONS, 'fits.#.'],
      [SEARCH_OPTIONS, 'search.#.'],
      [BOUND_OPTIONS, 'bounds.#.'],
      [DISCOVER_OPTIONS, 'discover.#.'],
      [RESIDUAL_OPTIONS, 'residual.'],
    ] as const
  ).flatMap(([table, prefix]) => table.flatMap((o) => (configKeyOf(o) === null ? [] : [[prefix + configKeyOf(o)!, o.key] as [string, string]]))),
);

/** `{ option }` when `path` is (an item of) a table option's key, else `{}`. */
function optionDetails(path: ReadonlyArray<PropertyKey>): { option?: string } {
  const parts = path.map((p) => (typeof p === 'number' ? '#' : String(p)));
  while (parts.length && parts[parts.length - 1] === '#') parts.pop();
  const option = OPTION_AT.get(parts.join('.'));
  return option === undefined ? {} : { option };
}

/** Keys allowed at each level, for "did you mean" on misspellings. */
const KNOWN_KEYS: Record<string, readonly string[]> = {
  '': Object.keys(RunConfigSchema.shape),
  network: Object.keys(NetworkSchema.shape),
  attribution: Object.keys(AttributionSchema.shape),
  fits: Object.keys(FitSchema.shape),
  search: Object.keys(SearchSchema.shape),
  residual: Object.keys(ResidualSchema.shape),
  bounds: Object.keys(BoundSchema.shape),
  discover: Object.keys(DiscoverSchema.shape),
};

export interface LoadedConfig {
  /** The validated configuration with defaults filled in; `table` and `output` resolved to absolute paths. */
  config: RunConfig;
  /** The configuration file's path (as given). */
  path: string;
  /** `file:line:column` of a key path in the configuration file (or just the file when unknown). */
  locate?: (path: ReadonlyArray<string | number>) => string;
  /**
   * The key path of search block `i` as the file writes it: `search` when it holds one block
   * written as a mapping, else `search[i]` (absent: `search[i]`).
   */
  searchPath?: (i: number) => Array<string | number>;
}

/** The key path of search block `i` of `loaded` (see LoadedConfig.searchPath). */
export function searchPathOf(loaded: Pick<LoadedConfig, 'searchPath'>, i: number): Array<string | number> {
  return loaded.searchPath?.(i) ?? ['search', i];
}

/** A search block written as a mapping (`search: { … }`) rather than a list. */
export function singleSearchBlock(data: unknown): boolean {
  const s = data !== null && typeof data === 'object' ? (data as Record<string, unknown>).search : undefined;
  return s !== null && typeof s === 'object' && !Array.isArray(s);
}

function describe(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (typeof v === 'string') return `'${printable(v)}'`;
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'a mapping';
  return String(v);
}

function valueAt(data: unknown, path: ReadonlyArray<PropertyKey>): unknown {
  let cur: unknown = data;
  for (const k of path) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<PropertyKey, unknown>)[k];
  }
  return cur;
}

/** The YAML node at `path` (or its nearest existing ancestor), to place the error in the file. */
function nodeAt(root: YamlNode | null | undefined, path: ReadonlyArray<PropertyKey>, key?: string): YamlNode | undefined {
  let cur: unknown = root;
  let last: YamlNode | undefined = (root ?? undefined) as YamlNode | undefined;
  const full = key === undefined ? path : [...path, key];
  for (let depth = 0; depth < full.length; depth++) {
    const k = full[depth];
    if (isMap(cur)) {
      const pair = cur.items.find((p) => isScalar(p.key) && String(p.key.value) === String(k));
      if (!pair) return last;
      // for an unknown key, point at the key itself
      if (depth === full.length - 1 && key !== undefined) return pair.key as YamlNode;
      cur = pair.value;
    } else if (isSeq(cur)) {
      cur = cur.items[Number(k)];
    } else return last;
    if (cur) last = cur as YamlNode;
  }
  return last;
}

export function keyPath(path: ReadonlyArray<PropertyKey>): string {
  let s = '';
  for (const k of path) s += typeof k === 'number' ? `[${k}]` : s === '' ? String(k) : `.${String(k)}`;
  return s === '' ? '(top level)' : s;
}

/**
 * Parse and validate configuration text. `file` names it in messages; relative paths in it are
 * resolved against `baseDir` (default: the folder of `file`).
 */
export function parseConfig(text: string, file: string, baseDir?: string): LoadedConfig {
  const lc = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lc, prettyErrors: false });
  const where = (offset: number | undefined): string => {
    if (offset === undefined) return file;
    const { line, col } = lc.linePos(offset);
    return `${file}:${line}:${col}`;
  };
  if (doc.errors.length > 0) {
    const e = doc.errors[0]!;
    throw new SurmiseError('config.yaml', `${where(e.pos[0])}: not valid YAML: ${e.message.split('\n')[0]}`);
  }
  let data: unknown;
  try {
    // the YAML library refuses documents whose aliases expand past its limit (an "alias bomb")
    data = doc.toJS({ maxAliasCount: 100 });
  } catch (e) {
    const why = /alias/i.test((e as Error).message)
      ? 'its aliases (*name) expand to too much data; write the values out instead'
      : (e as Error).message;
    throw new SurmiseError('config.yaml', `${file}: not a usable configuration: ${why}`);
  }
  if (data === null || typeof data !== 'object' || Array.isArray(data)) {
    throw new SurmiseError('config.notMapping', `${file}: expected a mapping of keys (table, target, ...) at the top level`);
  }
  const single = singleSearchBlock(data);
  const parsed = RunConfigSchema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    // the table option behind the path (a list index as `#`), before the path is written as the file has it
    const option = optionDetails(issue.path as PropertyKey[]);
    // one search block written as a mapping is read as a list of one: name its keys as written (`search.top`)
    const path = single && issue.path[0] === 'search' && issue.path[1] === 0 ? ['search', ...issue.path.slice(2)] : (issue.path as PropertyKey[]);
    if (issue.code === 'unrecognized_keys') {
      const key = issue.keys[0]!;
      const level = path.filter((p) => typeof p === 'string').join('.');
      const known = KNOWN_KEYS[level] ?? [];
      const node = nodeAt(doc.contents as YamlNode, path, key);
      const full = keyPath([...path, key]);
      throw new SurmiseError(
        'config.unknownKey',
        `${where(node?.range?.[0])}: unknown key '${full}'${didYouMean(key, known)}`,
      );
    }
    const node = nodeAt(doc.contents as YamlNode, path);
    const got = valueAt(data, path);
    if (issue.code === 'custom') throw new SurmiseError('config.badValue', `${where(node?.range?.[0])}: ${keyPath(path)}: ${issue.message}`, { key: keyPath(path) });
    let expected = issue.message;
    if (issue.code === 'invalid_type' && path.length === 1 && path[0] === 'search') expected = 'expected a search block (a mapping) or a list of them';
    else if (issue.code === 'invalid_type') expected = `expected ${issue.expected === 'array' ? 'a list' : issue.expected}`;
    else if (issue.code === 'too_small' && issue.origin === 'number') expected = `expected a number ≥ ${String(issue.minimum)}`;
    else if (issue.code === 'too_big' && issue.origin === 'number') {
      throw new SurmiseError(
        'option.tooLarge',
        `${where(node?.range?.[0])}: ${keyPath(path)}: expected at most ${Number(issue.maximum).toLocaleString('en-US')} (its ceiling), got ${describe(got)}`,
        { key: keyPath(path), ...option },
      );
    } else if (issue.code === 'too_big' && issue.origin === 'array' && path.length === 1 && String(path[0]) in MAX_BLOCKS) {
      const key = String(path[0]) as keyof typeof MAX_BLOCKS;
      throw new SurmiseError(
        'option.tooLarge',
        `${where(node?.range?.[0])}: ${key}: expected at most ${MAX_BLOCKS[key]} ${key === 'search' ? 'search' : key === 'discover' ? 'discover' : key.replace(/s$/, '')} blocks (its ceiling), got ${(got as unknown[]).length}`,
        { key },
      );
    } else if (issue.code === 'too_big' && issue.origin === 'array') expected = `expected a list of at most ${String(issue.maximum)} item(s)`;
    else if (issue.code === 'too_small' && issue.origin === 'array') expected = `expected a list of at least ${String(issue.minimum)} item(s)`;
    else if (issue.code === 'too_small' && issue.origin === 'string') expected = 'expected a non-empty text';
    else if (issue.code === 'invalid_value') expected = `expected one of ${issue.values.map((v) => `'${String(v)}'`).join(', ')}`;
    if (got === undefined) {
      // a misspelt required key: name the nearest unknown key written at the same level
      const key = path[path.length - 1];
      const parent = valueAt(data, path.slice(0, -1));
      if (typeof key === 'string' && parent !== null && typeof parent === 'object' && !Array.isArray(parent)) {
        const level = path.slice(0, -1).filter((p) => typeof p === 'string').join('.');
        const known = KNOWN_KEYS[level] ?? [];
        const typo = Object.keys(parent).filter((k) => !known.includes(k)).find((k) => didYouMean(k, [key]) !== '');
        if (typo !== undefined) {
          const at = nodeAt(doc.contents as YamlNode, path.slice(0, -1), typo);
          throw new SurmiseError(
            'config.missingKey',
            `${where(at?.range?.[0])}: missing required key '${keyPath(path)}'; found '${keyPath([...path.slice(0, -1), typo])}' (did you mean '${key}'?)`,
            { key: keyPath(path) },
          );
        }
      }
      throw new SurmiseError('config.missingKey', `${where(node?.range?.[0])}: missing required key '${keyPath(path)}'`);
    }
    // a bad value of a table option is option.badValue, as in the library and on the command line
    throw new SurmiseError(option.option ? 'option.badValue' : 'config.badValue', `${where(node?.range?.[0])}: ${keyPath(path)}: ${expected}, got ${describe(got)}`, { key: keyPath(path), ...option });
  }
  const config: RunConfig = parsed.data;
  const base = baseDir ?? dirname(resolve(file));
  config.table = resolve(base, config.table);
  config.output = resolve(base, config.output);
  const locate = (path: ReadonlyArray<string | number>): string => where(nodeAt(doc.contents as YamlNode, path)?.range?.[0]);
  return { config, path: file, locate, searchPath: (i) => (single ? ['search'] : ['search', i]) };
}

/** Read and validate a configuration file; `display` names it in messages (default: `file`). */
export function loadConfig(file: string, display = file): LoadedConfig {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    throw new SurmiseError('config.unreadable', `cannot read configuration ${display}: ${fileErrorReason(e)}`);
  }
  return parseConfig(text, display, dirname(resolve(file)));
}
