/**
 * The run configuration: a YAML file (parsed with `yaml`, validated with `zod`). Keys are ours and
 * documented in the README. Every refusal names the file, line and column and the key path, with a
 * "did you mean" for misspelt keys. Paths in the file are relative to the file's folder.
 */
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { isMap, isScalar, isSeq, LineCounter, parseDocument, type Node as YamlNode } from 'yaml';
import { z } from 'zod';
import { SurmiseError, didYouMean, fileErrorReason } from '../errors.ts';
import type { IntegerRange } from '../util/integer.ts';
import { RANK_DEFAULTS, RANK_LIMITS } from '../attribute/options.ts';
import { ATTRIBUTION_METHODS } from '../attribute/methods/index.ts';
import { RELATE_LIMITS } from '../relate/limits.ts';
import { BOUND_LIMITS } from '../bound/find.ts';
import { DISCOVER_OPTIONS } from '../bound/discover.ts';
import { RESIDUAL_LIMITS } from './residual.ts';

/** An integer count within the stage's documented range (its ceiling is refused as option.tooLarge). */
const count = (r: IntegerRange) => z.number().int().min(r.min).max(r.max);
const exprString = z.string().min(1);
/** A list, where a single item may be written without brackets (`rhs: b` = `rhs: [b]`). */
const listOf = <T extends z.ZodType>(item: T, min = 0) => z.preprocess((v) => (typeof v === 'string' ? [v] : v), z.array(item).min(min));

const NetworkSchema = z.strictObject({
  hidden: z.array(count(RANK_LIMITS.hiddenWidth)).min(1).max(RANK_LIMITS.hiddenLayers.max).default([...RANK_DEFAULTS.hidden]),
  activation: z.enum(['relu', 'gelu']).default(RANK_DEFAULTS.activation),
  loss: z.enum(['mse', 'huber']).default(RANK_DEFAULTS.loss),
  task: z.enum(['auto', 'regression', 'classification']).default('auto'),
  epochs: count(RANK_LIMITS.epochs).default(RANK_DEFAULTS.epochs),
  patience: count(RANK_LIMITS.patience).default(RANK_DEFAULTS.patience),
  /** absent: chosen from the training rows (batchSizeFor) */
  batchSize: count(RANK_LIMITS.batchSize).optional(),
  learningRate: z.number().positive().max(10).default(RANK_DEFAULTS.learningRate),
  engine: z.enum(['auto', 'native', 'tfjs']).default('auto'),
});

const AttributionSchema = z.strictObject({
  methods: listOf(z.enum(ATTRIBUTION_METHODS), 1).default([...ATTRIBUTION_METHODS]),
  seeds: count(RANK_LIMITS.seeds).default(RANK_DEFAULTS.seeds),
  folds: count(RANK_LIMITS.folds).default(0),
  dropTop: count(RANK_LIMITS.dropTop).default(0),
  /** Noise probes per repeat (attribute/probes.ts). */
  probes: count(RANK_LIMITS.probes).default(6),
});

const FitSchema = z.strictObject({
  target: exprString,
  terms: listOf(exprString, 1),
  intercept: z.boolean().default(true),
  /** Terms measured with error (errors-in-variables): the fit says their slopes are attenuated. */
  noisy: listOf(exprString).default([]),
});

const SearchSchema = z.strictObject({
  target: exprString,
  from: listOf(z.string().min(1), 1),
  maxTerms: count(RELATE_LIMITS.maxTerms).default(2),
  powers: z.string().regex(/^-?\d+\.\.-?\d+$/, 'expected a range such as -3..3').default('-3..3'),
  top: count(RELATE_LIMITS.top).default(10),
});

/** Residual ranking: fit, then rank the remaining columns on what the fit leaves over (run/residual.ts). */
const ResidualSchema = z.strictObject({
  target: exprString,
  terms: listOf(exprString, 1),
  intercept: z.boolean().default(true),
  from: listOf(z.string().min(1), 1).optional(),
  absolute: z.boolean().default(true),
  maxTerms: count(RESIDUAL_LIMITS.maxTerms).default(1),
  powers: z.string().regex(/^-?\d+\.\.-?\d+$/, 'expected a range such as -3..3').default('-3..3'),
});

const BoundSchema = z.strictObject({
  lhs: exprString,
  rhs: listOf(exprString, 1),
  by: exprString.optional(),
  bins: count(BOUND_LIMITS.bins).default(10),
  top: count(BOUND_LIMITS.top).default(5),
  skipInvalid: z.boolean().default(false),
});

/** Right-hand-side discovery: ranges and defaults from the bound stage's one options table. */
const DiscoverSchema = z.strictObject({
  lhs: exprString,
  from: listOf(exprString, 1),
  lower: z.boolean().default(false),
  skipInvalid: z.boolean().default(false),
  ...Object.fromEntries(
    DISCOVER_OPTIONS.filter((o) => o.key !== 'seed').map((o) => {
      const n = (o.integer ? z.number().int() : z.number()).min(o.min).max(o.max);
      return [o.key, o.default === null ? n.optional() : n.default(o.default)];
    }),
  ),
});

export const RunConfigSchema = z.strictObject({
  table: z.string().min(1),
  format: z.enum(['csv', 'tsv', 'json', 'jsonl']).optional(),
  kinds: z.record(z.string(), z.enum(['real', 'integer', 'complex', 'label'])).default({}),
  derive: z.record(z.string(), exprString).default({}),
  target: exprString,
  features: listOf(z.string().min(1)).optional(),
  exclude: listOf(z.string().min(1)).default([]),
  groups: z.record(z.string(), z.array(z.string().min(1)).min(1)).default({}),
  split: z.string().min(1).default('random'),
  seed: z.number().int().default(1),
  network: NetworkSchema.prefault({}),
  attribution: AttributionSchema.prefault({}),
  fits: z.array(FitSchema).default([]),
  search: SearchSchema.optional(),
  residual: ResidualSchema.optional(),
  bounds: z.array(BoundSchema).default([]),
  discover: z.array(DiscoverSchema).default([]),
  output: z.string().min(1).default('surmise-run'),
});

export type RunConfig = z.infer<typeof RunConfigSchema>;

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
}

function describe(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (typeof v === 'string') return `'${v}'`;
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
  const parsed = RunConfigSchema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    const path = issue.path as PropertyKey[];
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
    let expected = issue.message;
    if (issue.code === 'invalid_type') expected = `expected ${issue.expected === 'array' ? 'a list' : issue.expected}`;
    else if (issue.code === 'too_small' && issue.origin === 'number') expected = `expected a number ≥ ${String(issue.minimum)}`;
    else if (issue.code === 'too_big' && issue.origin === 'number') {
      throw new SurmiseError(
        'option.tooLarge',
        `${where(node?.range?.[0])}: ${keyPath(path)}: expected at most ${Number(issue.maximum).toLocaleString('en-US')} (its ceiling), got ${describe(got)}`,
        { key: keyPath(path) },
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
    throw new SurmiseError('config.badValue', `${where(node?.range?.[0])}: ${keyPath(path)}: ${expected}, got ${describe(got)}`);
  }
  const config = parsed.data;
  const base = baseDir ?? dirname(resolve(file));
  config.table = resolve(base, config.table);
  config.output = resolve(base, config.output);
  const locate = (path: ReadonlyArray<string | number>): string => where(nodeAt(doc.contents as YamlNode, path)?.range?.[0]);
  return { config, path: file, locate };
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
