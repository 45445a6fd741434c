/**
 * Checks of a run configuration against its table, before any training: every expression, column
 * name and option, each error naming the configuration key and its place in the file.
 */
import { SurmiseError, didYouMean, wordOptionError } from '../errors.ts';
import { evaluateExpression, type Table } from '../table/index.ts';
import { formatColumnName } from '../table/expr/format.ts';
import { parseSplitSpec } from '../table/split.ts';
import { parseIntegerRange } from '../util/range.ts';
import { keyPath, type RunConfig } from './config.ts';

/** A target as rank reads it: a column of that exact name, else an expression. */
function targetExpression(table: Table, target: string): string {
  return table.columns.some((c) => c.name === target) ? formatColumnName(target) : target;
}

/** A configuration's `powers` range (`lo..hi`). */
export function parsePowers(s: string): [number, number] {
  return parseIntegerRange(s, 'config.badValue');
}

/** Run `f`; a SurmiseError it throws is re-thrown naming the configuration key and its place in the file. */
export function inConfig<T>(path: Array<string | number>, at: (p: Array<string | number>) => string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof SurmiseError && e.exitCode === 2) {
      const worded = wordOptionError(e, (k) => (k === e.details?.option ? keyPath(path) : k));
      throw new SurmiseError(e.code, `${at(path)}: ${keyPath(path)}: ${worded.message}`, { ...e.details, worded: true });
    }
    throw e;
  }
}

/**
 * Check every expression, column name and option of the configuration against the table before
 * any training starts, so a typo costs seconds, not a whole run. `searchPath(i)` is the key path of
 * search block i as the file writes it (`search` for one block written as a mapping).
 */
export function checkAgainstTable(
  config: RunConfig,
  table: Table,
  at: (p: Array<string | number>) => string,
  searchPath: (i: number) => Array<string | number> = (i) => ['search', i],
): void {
  if (config.split !== undefined) inConfig(['split'], at, () => parseSplitSpec(config.split!));
  const expr = (path: Array<string | number>, source: string) => inConfig(path, at, () => evaluateExpression(table, source));
  expr(['target'], targetExpression(table, config.target));
  config.fits.forEach((f, i) => {
    expr(['fits', i, 'target'], f.target);
    f.terms.forEach((t, j) => expr(['fits', i, 'terms', j], t));
    f.noisy.forEach((t, j) => {
      if (!f.terms.some((u) => u.replace(/\s+/g, '') === t.replace(/\s+/g, ''))) {
        throw new SurmiseError('config.badValue', `${at(['fits', i, 'noisy', j])}: fits[${i}].noisy[${j}]: '${t}' is not one of this fit's terms (${f.terms.join('; ')})`);
      }
    });
  });
  // search builds its terms from columns named as they are (any name), not from expressions
  const names = table.columns.map((c) => c.name);
  config.search.forEach((sc, i) => {
    const at0 = searchPath(i);
    expr([...at0, 'target'], sc.target);
    sc.from.forEach((c, j) => {
      if (!names.includes(c)) {
        const path = [...at0, 'from', j];
        throw new SurmiseError('config.unknownColumn', `${at(path)}: ${keyPath(path)}: no column '${c}' in the table${didYouMean(c, names)}`, { column: c });
      }
    });
    inConfig([...at0, 'powers'], at, () => parsePowers(sc.powers));
  });
  config.discover.forEach((d, i) => {
    expr(['discover', i, 'lhs'], d.lhs);
    d.from.forEach((f, j) => expr(['discover', i, 'from', j], f));
  });
  if (config.residual) {
    const r = config.residual;
    expr(['residual', 'target'], r.target);
    r.terms.forEach((t, j) => expr(['residual', 'terms', j], t));
    r.from?.forEach((c, j) => expr(['residual', 'from', j], c));
    inConfig(['residual', 'powers'], at, () => parsePowers(r.powers));
  }
  config.bounds.forEach((b, i) => {
    expr(['bounds', i, 'lhs'], b.lhs);
    b.rhs.forEach((r, j) => expr(['bounds', i, 'rhs', j], r));
    if (b.by) expr(['bounds', i, 'by'], b.by);
  });
}
