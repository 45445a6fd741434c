/**
 * Argument checks at the library's entry: a public function called with a value of the wrong
 * JavaScript type (a file name where a table is expected, a number where a list of column names is
 * expected) is refused with one SurmiseError, code `api.badArgument`, naming the function and the
 * argument (`rankFeatures: expected options.features to be a list of strings, got the string "a"`),
 * instead of a TypeError from deep inside a stage; an options key the function does not take is
 * refused the same way (`options has no key 'method' (did you mean 'methods'?)`). Ranges and names are the stages' own checks.
 */
import { SurmiseError, didYouMean } from '../errors.ts';

/** A JavaScript type an argument or option must have. */
export interface Kind {
  expected: string;
  test: (v: unknown) => boolean;
}

/**
 * One positional argument: its name, kind, whether it may be left out, and for an options object
 * every key it takes (a key not listed is refused with a did-you-mean: a misspelt option is never
 * silently ignored).
 */
export interface ArgSpec {
  name: string;
  kind: Kind;
  optional?: boolean;
  fields?: Record<string, Kind>;
}

/** The fields of an options object of type T: every key of T must be listed (checked by tsc). */
export function fieldsOf<T>(fields: { [K in keyof Required<T>]: Kind }): Record<string, Kind> {
  return fields;
}

const isPlain = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isDataFrame = (v: unknown): boolean => isPlain(v) && (v.constructor?.name === 'DataFrame' || ('$data' in v && 'shape' in v));

export const KIND = {
  table: {
    expected: 'a table (from readTable, fromDataFrame or table.tableFromRecords)',
    test: (v) => isPlain(v) && Array.isArray(v.columns) && typeof v.nRows === 'number' && !isDataFrame(v),
  },
  string: { expected: 'a string', test: (v) => typeof v === 'string' },
  number: { expected: 'a number', test: (v) => typeof v === 'number' },
  boolean: { expected: 'true or false', test: (v) => typeof v === 'boolean' },
  object: { expected: 'an object', test: isPlain },
  function: { expected: 'a function', test: (v) => typeof v === 'function' },
  strings: { expected: 'a list of strings', test: (v) => Array.isArray(v) && v.every((s) => typeof s === 'string') },
  stringOrStrings: { expected: 'a string or a list of strings', test: (v) => typeof v === 'string' || (Array.isArray(v) && v.every((s) => typeof s === 'string')) },
  numbers: { expected: 'a list of numbers', test: (v) => Array.isArray(v) && v.every((s) => typeof s === 'number') },
  stringOrExpression: { expected: 'an expression string', test: (v) => typeof v === 'string' || isPlain(v) },
  groups: {
    expected: 'an object from group name to a list of column names',
    test: (v) => isPlain(v) && Object.values(v).every((m) => Array.isArray(m) && m.every((s) => typeof s === 'string')),
  },
  derivedPairs: {
    expected: 'a list of { name, expression } objects',
    test: (v) => Array.isArray(v) && v.every((d) => isPlain(d) && typeof d.name === 'string' && typeof d.expression === 'string'),
  },
  dataFrame: { expected: 'a danfo.js DataFrame', test: (v) => isPlain(v) && Array.isArray(v.columns) },
  complexPairs: {
    expected: "'auto', 'none' or a list of { name, re, im }",
    test: (v) => v === 'auto' || v === 'none' || (Array.isArray(v) && v.every((p) => isPlain(p) && ['name', 're', 'im'].every((k) => typeof p[k] === 'string'))),
  },
  derivedSources: {
    expected: 'a list of { name, source } objects',
    test: (v) => Array.isArray(v) && v.every((d) => isPlain(d) && typeof d.name === 'string' && typeof d.source === 'string'),
  },
} satisfies Record<string, Kind>;

/** How a message names a value it refuses, e.g. `the string "a"`, `a number (5)`, `a danfo.js DataFrame`. */
export function describeValue(v: unknown): string {
  if (v === null) return 'null';
  if (v === undefined) return 'nothing (undefined)';
  if (typeof v === 'string') return `the string ${JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v)}`;
  if (typeof v === 'number' || typeof v === 'boolean' || typeof v === 'bigint') return `${typeof v === 'boolean' ? 'the value' : 'the number'} ${String(v)}`;
  if (typeof v === 'function') return 'a function';
  if (Array.isArray(v)) return `a list of ${v.length}`;
  if (isDataFrame(v)) return 'a danfo.js DataFrame (convert it with fromDataFrame)';
  if (typeof v === 'symbol') return 'a symbol';
  return 'an object';
}

function refuse(fn: string, what: string, kind: Kind, got: unknown): never {
  throw new SurmiseError('api.badArgument', `${fn}: expected ${what} to be ${kind.expected}, got ${describeValue(got)}`, { function: fn, argument: what });
}

/** Check `args` against `spec`; the first mismatch is refused (see the module comment). */
export function checkArguments(fn: string, spec: readonly ArgSpec[], args: readonly unknown[]): void {
  spec.forEach((s, k) => {
    const v = args[k];
    if (v === undefined && s.optional) return;
    if (!s.kind.test(v)) refuse(fn, s.name, s.kind, v);
    if (!s.fields || !isPlain(v)) return; // a slot taking a name or an options object checks keys of the object only
    const known = Object.keys(s.fields);
    for (const key of Object.keys(v as object)) {
      if (!known.includes(key)) {
        const hint = didYouMean(key, known) || (known.length ? `; it takes ${known.join(', ')}` : '; it takes none');
        throw new SurmiseError('api.badArgument', `${fn}: ${s.name} has no key '${key}'${hint}`, { function: fn, argument: `${s.name}.${key}` });
      }
    }
    for (const [key, kind] of Object.entries(s.fields)) {
      const f = (v as Record<string, unknown>)[key];
      if (f !== undefined && !kind.test(f)) refuse(fn, `${s.name}.${key}`, kind, f);
    }
  });
}

/**
 * `f` with its arguments checked first. An async function (`async: true`) refuses through its
 * promise, as its other errors do; a synchronous one throws.
 */
export function guarded<A extends unknown[], R>(fn: string, spec: readonly ArgSpec[], f: (...a: A) => R, async = false): (...a: A) => R {
  const g = async
    ? (...a: A): R => {
        try {
          checkArguments(fn, spec, a);
        } catch (e) {
          return Promise.reject(e) as R;
        }
        return f(...a);
      }
    : (...a: A): R => {
        checkArguments(fn, spec, a);
        return f(...a);
      };
  Object.defineProperty(g, 'name', { value: fn });
  return g;
}
