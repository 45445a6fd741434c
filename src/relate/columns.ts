import { SurmiseError, didYouMean } from '../errors.ts';
import type { Column, Table } from '../table/types.ts';

/** The column `name` or `relate.unknownColumn` with a did-you-mean suggestion and the column list. */
export function getColumnOrThrow(table: Table, name: string): Column {
  const c = table.columns.find((x) => x.name === name);
  if (c) return c;
  const names = table.columns.map((x) => x.name);
  throw new SurmiseError(
    'relate.unknownColumn',
    `no column '${name}' in ${table.source}${didYouMean(name, names)}; columns: ${names.join(', ')}`,
  );
}
