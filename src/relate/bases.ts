/**
 * The real-valued base quantities the formula search builds on, from the families registered in
 * bases/list.ts: a real (or integer, or derived) column x; re(z), im(z), abs(z), arg(z) of a
 * complex column z; re(a/b) and im(a/b) of every ordered pair with a complex member. Complexity
 * as in tree.ts: 1 for a column, 2 for a part of a complex column, 4 for a part of a quotient.
 * Constant or non-finite quantities are skipped with the reason.
 */
import type { Table } from '../table/types.ts';
import { formatColumnName } from '../table/expr/format.ts';
import { getColumnOrThrow } from './columns.ts';
import { BASE_FAMILIES } from './bases/list.ts';
import type { BaseColumn, BaseTerm } from './bases/family.ts';

/** A base quantity: expression text (`x`, `abs(z)`, `re(zb/za)`), complexity, values on every row (NaN where not defined). */
export type BaseQuantity = BaseTerm;

export interface SkippedTerm {
  name: string;
  reason: string;
}

/**
 * The base quantities of the columns `from`, checked on `rows` (the rows the search uses):
 * a quantity that is constant or not finite there is skipped and said why.
 * @example baseQuantities(table, ['x', 'z'], rows).bases.map(b => b.text) // ['x', 're(z)', 'im(z)', 'abs(z)', 'arg(z)', 're(x/z)', 'im(x/z)', 're(z/x)', 'im(z/x)']
 */
export function baseQuantities(table: Table, from: string[], rows: ArrayLike<number>): { bases: BaseQuantity[]; skipped: SkippedTerm[] } {
  const bases: BaseQuantity[] = [];
  const skipped: SkippedTerm[] = [];
  const add = ({ text, cost, values }: BaseTerm): void => {
    let first = NaN;
    let constant = true;
    for (let k = 0; k < rows.length; k++) {
      const v = values[rows[k]!]!;
      if (!Number.isFinite(v)) {
        skipped.push({ name: text, reason: `not finite at data row ${rows[k]! + 1}` });
        return;
      }
      if (k === 0) first = v;
      else if (v !== first) constant = false;
    }
    if (constant) {
      skipped.push({ name: text, reason: 'constant on the rows used (the intercept covers it)' });
      return;
    }
    bases.push({ text, cost, values });
  };
  const cols: BaseColumn[] = [];
  for (const name of from) {
    const c = getColumnOrThrow(table, name);
    const col = formatColumnName(name);
    if (c.kind === 'complex') cols.push({ name: col, re: c.re, im: c.im, complex: true });
    else if (c.kind === 'real' || c.kind === 'integer') cols.push({ name: col, re: c.values, im: new Float64Array(c.values.length), complex: false });
    else continue;
    for (const f of BASE_FAMILIES) for (const t of f.ofColumn?.(cols[cols.length - 1]!) ?? []) add(t);
  }
  for (const A of cols) {
    for (const B of cols) {
      if (A === B) continue;
      for (const f of BASE_FAMILIES) for (const t of f.ofPair?.(A, B) ?? []) add(t);
    }
  }
  return { bases, skipped };
}
