import { SurmiseError, didYouMean } from '../errors.ts';
import type { Table } from '../table/types.ts';
import { deriveColumn, evaluateExpression, parseDerive } from '../table/expr/index.ts';
import { fmt } from './core.ts';

/** Reading the bound stage's inputs from a table: derived columns, real-valued expressions, label columns. */

/** A shallow copy of `table` with the derived columns appended (each may use the ones before it). */
export function withDerived(table: Table, derive: readonly string[]): Table {
  if (derive.length === 0) return table;
  let t: Table = { ...table, columns: [...table.columns] };
  for (const spec of derive) {
    const { name, source } = parseDerive(spec);
    if (t.columns.some((c) => c.name === name)) {
      throw new SurmiseError('table.duplicateColumn', `${table.source}: \`derive\` ${spec}: the table already has a column '${name}'; choose another name`, { option: 'derive' });
    }
    const col = deriveColumn(t, name, source);
    t = { ...t, columns: [...t.columns, col] };
  }
  return t;
}

export interface RealValues {
  values: Float64Array;
  missing: Uint8Array;
}

/** Evaluates an expression and insists on real values (a complex result must be reduced by re/im/abs). */
export function evalReal(table: Table, source: string, role: string): RealValues {
  const v = evaluateExpression(table, source);
  if (v.im) {
    for (let i = 0; i < table.nRows; i++) {
      if (!v.missing[i] && v.im[i] !== 0 && !Number.isNaN(v.im[i]!)) {
        throw new SurmiseError(
          'bound.complexValue',
          `${table.source}: ${role} '${source}' is complex on row ${i + 1}${lineOf(table, i)} (imaginary part ${fmt(v.im[i]!)}); take re(), im() or abs() of it`,
        );
      }
    }
  }
  return { values: v.re, missing: v.missing };
}

export function lineOf(table: Table, i: number): string {
  return table.lines ? `, line ${table.lines[i]}` : '';
}

export function idColumns(table: Table, id: string[] | null): Array<{ name: string; value: (i: number) => string | number | null }> {
  const names = table.columns.map((c) => c.name);
  const chosen = id ?? table.columns.filter((c) => c.kind === 'label').map((c) => c.name);
  return chosen.map((name) => {
    const col = table.columns.find((c) => c.name === name);
    if (!col) {
      throw new SurmiseError('bound.unknownColumn', `${table.source}: no column '${name}' to show beside the witness rows${didYouMean(name, names)}`);
    }
    const value = (i: number): string | number | null => {
      if (col.missing[i]) return null;
      if (col.kind === 'label') return col.values[i]!;
      if (col.kind === 'complex') return `${col.re[i]}${col.im[i]! < 0 ? '-' : '+'}${Math.abs(col.im[i]!)}j`;
      return col.values[i]!;
    };
    return { name, value };
  });
}

export function labelsOf(cols: ReturnType<typeof idColumns>, i: number): Record<string, string | number | null> {
  const out: Record<string, string | number | null> = {};
  for (const c of cols) out[c.name] = c.value(i);
  return out;
}

