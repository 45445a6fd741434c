/**
 * Evaluating a relation's expressions on a table and choosing the rows every one of them is
 * defined on. Rows with a missing cell or a non-finite value (NaN, ±∞, e.g. log of a negative
 * number or a division by zero) are dropped and counted per expression: never silently.
 */
import { SurmiseError } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { evaluateExpression } from '../table/expr/evaluate.ts';
import { exprError } from '../table/expr/caret.ts';
import { deriveColumn } from '../table/expr/derive.ts';
import { parseExpression } from '../table/expr/parse.ts';
import { expressionColumns } from '../table/expr/ast.ts';
import { dropDuplicates, type KeyColumn } from '../table/dataset-rows.ts';

export interface DroppedRows {
  /** Rows dropped in all. */
  total: number;
  /** Rows dropped as repeats of an earlier kept row in every used column (see `duplicateRule`); first kept. */
  duplicates: number;
  /** The duplicate rule in words, naming the columns compared (absent when duplicates are kept). */
  duplicateRule?: string;
  /** Rows with a missing input cell in some expression. */
  missing: number;
  /** Rows whose value was not finite (though no cell was missing). */
  nonFinite: number;
  /** Per expression: rows where it was missing or not finite. */
  byExpression: Array<{ expression: string; missing: number; nonFinite: number }>;
}

/** A real-valued expression column; complex values are an error asking for re()/im()/abs(). */
export function realExpression(table: Table, source: string, role: string): { values: Float64Array; missing: Uint8Array } {
  const v = evaluateExpression(table, source);
  if (v.im) {
    for (let i = 0; i < v.im.length; i++) {
      if (v.im[i] !== 0 && !Number.isNaN(v.im[i]!)) {
        const line = table.lines ? `, line ${table.lines[i]}` : '';
        throw exprError(
          'relate.complexTerm',
          `${role} '${source}' is complex-valued (first at data row ${i + 1}${line}: ${v.re[i]} ${v.im[i]! < 0 ? '-' : '+'} ${Math.abs(v.im[i]!)}i); ` +
            `a least-squares term must be real: write re(${source}), im(${source}) or abs(${source})`,
          source,
          0,
          source.length,
        );
      }
    }
  }
  return { values: v.re, missing: v.missing };
}

/**
 * The key columns for the duplicate rule "all used columns equal": the columns of `table` that the
 * expressions read (through `expressionColumns`; `X.re`/`X.im` compare that part only, a whole
 * complex column both parts). A name not in `table` (a derived column, added after it) stands
 * for a function of the table's columns; the values of each expression that reads one are
 * compared instead, as the table layer's dataset does for an expression target.
 */
export function usedKeyColumns(
  columns: Array<{ expression: string; values: Float64Array; missing: Uint8Array }>,
  table: Table,
): { keys: KeyColumn[]; names: string[] } {
  const keys: KeyColumn[] = [];
  const names: string[] = [];
  const seen = new Set<string>();
  for (const c of columns) {
    let derived = false;
    // a column given by name (as `search` does) need not parse as an expression
    const read = table.columns.some((k) => k.name === c.expression) ? [c.expression] : expressionColumns(parseExpression(c.expression));
    for (const name of read) {
      const exact = table.columns.find((k) => k.name === name);
      const m = exact ? null : /^(.*)\.(re|im)$/.exec(name);
      const base = m ? table.columns.find((k) => k.name === m[1] && k.kind === 'complex') : undefined;
      if (!exact && !base) {
        derived = true;
        continue;
      }
      // a part of a complex column already covered by the whole column adds nothing
      if (seen.has(name) || (base && seen.has(base.name))) continue;
      seen.add(name);
      names.push(name);
      if (exact) {
        if (exact.kind === 'label') keys.push({ strings: exact.values, missing: exact.missing });
        else if (exact.kind === 'complex') keys.push({ numbers: exact.re, missing: exact.missing }, { numbers: exact.im, missing: exact.missing });
        else keys.push({ numbers: exact.values, missing: exact.missing });
      } else if (base && base.kind === 'complex') {
        keys.push({ numbers: m![2] === 're' ? base.re : base.im, missing: base.missing });
      }
    }
    if (derived && !seen.has(`\u0000${c.expression}`)) {
      seen.add(`\u0000${c.expression}`);
      names.push(c.expression);
      keys.push({ numbers: c.values, missing: c.missing });
    }
  }
  return { keys, names };
}

/**
 * Indices of the rows where every column is present and finite, with the count of the rest.
 * With `dedupeOn`, a row that repeats an earlier kept row in every column of that table the
 * expressions use (`usedKeyColumns`: labels and unused columns are not compared) is dropped too
 * and counted as a duplicate (the first is kept).
 */
export function completeRows(
  columns: Array<{ expression: string; values: Float64Array; missing: Uint8Array }>,
  nRows: number,
  dedupeOn?: Table,
): { rows: Int32Array; dropped: DroppedRows } {
  const keep = new Uint8Array(nRows).fill(1);
  const anyMissing = new Uint8Array(nRows);
  const byExpression = columns.map((c) => {
    let missing = 0;
    let nonFinite = 0;
    for (let i = 0; i < nRows; i++) {
      if (c.missing[i]) {
        missing++;
        anyMissing[i] = 1;
        keep[i] = 0;
      } else if (!Number.isFinite(c.values[i]!)) {
        nonFinite++;
        keep[i] = 0;
      }
    }
    return { expression: c.expression, missing, nonFinite };
  });
  let missing = 0;
  let nonFinite = 0;
  for (let i = 0; i < nRows; i++) {
    if (keep[i]) continue;
    if (anyMissing[i]) missing++;
    else nonFinite++;
  }
  let duplicates = 0;
  let duplicateRule: string | undefined;
  if (dedupeOn) {
    const { keys, names } = usedKeyColumns(columns, dedupeOn);
    duplicates = keys.length > 0 ? dropDuplicates(keep, keys) : 0;
    duplicateRule = `equal in every used column (${names.join(', ')}); other columns and labels not compared`;
  }
  let count = 0;
  for (let i = 0; i < nRows; i++) count += keep[i]!;
  const rows = new Int32Array(count);
  for (let i = 0, k = 0; i < nRows; i++) if (keep[i]) rows[k++] = i;
  return {
    rows,
    dropped: { total: nRows - count, duplicates, ...(duplicateRule ? { duplicateRule } : {}), missing, nonFinite, byExpression },
  };
}

/** A shallow copy of `table` with derived columns appended (each may use the ones before it). */
export function withDerived(table: Table, derive: Array<{ name: string; expression: string }>): Table {
  let t = table;
  for (const d of derive) {
    if (t.columns.some((c) => c.name === d.name)) {
      throw new SurmiseError('table.duplicateColumn', `\`derive\` ${d.name}=...: the table already has a column '${d.name}'; choose another name`, { option: 'derive' });
    }
    t = { ...t, columns: [...t.columns, deriveColumn(t, d.name, d.expression)] };
  }
  return t;
}

/** A human description of a row: 1-based data row, file line, and label columns' values. */
export function describeRow(table: Table, row: number): { row: number; line?: number; labels: Record<string, string> } {
  const labels: Record<string, string> = {};
  for (const c of table.columns) if (c.kind === 'label' && !c.missing[row]) labels[c.name] = c.values[row]!;
  return { row: row + 1, ...(table.lines ? { line: table.lines[row]! } : {}), labels };
}
