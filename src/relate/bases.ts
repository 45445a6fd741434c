/**
 * The real-valued base quantities the formula search builds on, one grammar for all of them:
 * a real (or integer, or derived) column x; re(z), im(z), abs(z), arg(z) of a complex column z;
 * re(a/b) and im(a/b) of every ordered pair with a complex member (a quotient
 * of two complex columns). Complexity as in tree.ts: 1 for a column, 2 for a part of a complex column,
 * 4 for a part of a quotient. Constant or non-finite quantities are skipped with the reason.
 */
import type { Table } from '../table/types.ts';
import { formatColumnName } from '../table/expr/format.ts';
import { getColumnOrThrow } from './columns.ts';

export interface BaseQuantity {
  /** Expression text, e.g. `x`, `abs(z)`, `re(zb/za)`. */
  text: string;
  cost: number;
  /** Values on every row of the table (NaN where not defined). */
  values: Float64Array;
}

export interface SkippedTerm {
  name: string;
  reason: string;
}

interface Complex { name: string; re: Float64Array; im: Float64Array; complex: boolean }

/** Smith's complex division (R. L. Smith, CACM 5, 1962), real and imaginary parts of a/b. */
function divide(ar: number, ai: number, br: number, bi: number): [number, number] {
  if (Math.abs(br) >= Math.abs(bi)) {
    const r = bi / br;
    const d = br + bi * r;
    return [(ar + ai * r) / d, (ai - ar * r) / d];
  }
  const r = br / bi;
  const d = br * r + bi;
  return [(ar * r + ai) / d, (ai * r - ar) / d];
}

/**
 * The base quantities of the columns `from`, checked on `rows` (the rows the search uses):
 * a quantity that is constant or not finite there is skipped and said why.
 * @example baseQuantities(table, ['x', 'z'], rows).bases.map(b => b.text) // ['x', 're(z)', 'im(z)', 'abs(z)', 'arg(z)', 're(x/z)', 'im(x/z)', 're(z/x)', 'im(z/x)']
 */
export function baseQuantities(table: Table, from: string[], rows: ArrayLike<number>): { bases: BaseQuantity[]; skipped: SkippedTerm[] } {
  const bases: BaseQuantity[] = [];
  const skipped: SkippedTerm[] = [];
  const add = (text: string, cost: number, values: Float64Array): void => {
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
  const all: Complex[] = [];
  for (const name of from) {
    const c = getColumnOrThrow(table, name);
    const col = formatColumnName(name);
    if (c.kind === 'complex') {
      all.push({ name: col, re: c.re, im: c.im, complex: true });
      add(`re(${col})`, 2, c.re);
      add(`im(${col})`, 2, c.im);
      add(`abs(${col})`, 2, c.re.map((x, i) => Math.hypot(x, c.im[i]!)));
      add(`arg(${col})`, 2, c.re.map((x, i) => Math.atan2(c.im[i]!, x)));
    } else if (c.kind === 'real' || c.kind === 'integer') {
      all.push({ name: col, re: c.values, im: new Float64Array(c.values.length), complex: false });
      add(col, 1, c.values);
    }
  }
  for (const A of all) {
    for (const B of all) {
      if (A === B || !(A.complex || B.complex)) continue;
      const re = new Float64Array(A.re.length);
      const im = new Float64Array(A.re.length);
      for (let i = 0; i < re.length; i++) [re[i], im[i]] = divide(A.re[i]!, A.im[i]!, B.re[i]!, B.im[i]!);
      add(`re(${A.name}/${B.name})`, 4, re);
      add(`im(${A.name}/${B.name})`, 4, im);
    }
  }
  return { bases, skipped };
}
