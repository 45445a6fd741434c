/**
 * Evaluating a relation's expressions on a table and choosing the rows every one of them is
 * defined on. Rows with a missing cell or a non-finite value (NaN, ±∞, e.g. log of a negative
 * number or a division by zero) are dropped and counted per expression: never silently.
 */
import type { Table } from '../table/types.ts';
import { parseExpression } from '../table/expr/parse.ts';
import { expressionColumns } from '../table/expr/ast.ts';
import { dropDuplicates, validRows, type KeyColumn } from '../table/dataset-rows.ts';
import type { RowDrops } from '../table/dataset-types.ts';

/** Rows dropped by the row policy (`RowDrops`: total, missing, nonFinite) and as repeats. */
export interface DroppedRows extends RowDrops {
  /** Rows dropped as repeats of an earlier kept row in every used column (see `duplicateRule`); first kept. */
  duplicates: number;
  /** The duplicate rule in words, naming the columns compared (absent when duplicates are kept). */
  duplicateRule?: string;
  /** Per expression: rows where it was missing or not finite. */
  byExpression: Array<{ expression: string; missing: number; nonFinite: number }>;
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
  const policy = validRows(
    nRows,
    columns.map((c, k) => ({ name: String(k), parts: [c.values], missing: c.missing })), // by position: two columns may share a text
  );
  const keep = policy.keep;
  const byExpression = columns.map((c, k) => {
    let missing = 0;
    let nonFinite = 0;
    for (const d of policy.dropped) {
      if (d.column !== String(k)) continue;
      if (d.reason === 'missing') missing += d.rows;
      else nonFinite += d.rows;
    }
    return { expression: c.expression, missing, nonFinite };
  });
  const { missing, nonFinite } = policy.rows;
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

/** A human description of a row: 1-based data row, file line, and label columns' values. */
export function describeRow(table: Table, row: number): { row: number; line?: number; labels: Record<string, string> } {
  const labels: Record<string, string> = {};
  for (const c of table.columns) if (c.kind === 'label' && !c.missing[row]) labels[c.name] = c.values[row]!;
  return { row: row + 1, ...(table.lines ? { line: table.lines[row]! } : {}), labels };
}
