import { SurmiseError, didYouMean } from '../errors.ts';
import type { Table } from '../table/types.ts';

/** Reading the bound stage's inputs from a table: file lines and label columns of rows. */

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

