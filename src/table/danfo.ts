/**
 * Bridges to danfo.js DataFrames, for users who already hold one. danfo is imported lazily (it
 * takes about a second to load and pulls in a tfjs copy), so the CLI's start-up does not pay for it.
 * A complex column becomes two DataFrame columns `name.re` / `name.im`, which `fromDataFrame`
 * joins back (the 'auto' pair rule). Missing cells become NaN (numeric) or null (labels); reading a
 * DataFrame back, NaN and null are missing (danfo has no other missing marker for numbers).
 * Note: danfo keeps numbers as float32 in some operations; these bridges hand it plain JS
 * number arrays and read `.values` back, so no rounding happens here.
 */
import { SurmiseError } from '../errors.ts';
import { tableFromRecords, joinComplexPairs, tableFromColumns } from './columns.ts';
import type { Column, ColumnKind, Table } from './types.ts';

type DanfoModule = typeof import('danfojs-node');
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type DataFrameLike = any;

let danfo: Promise<DanfoModule> | undefined;
async function loadDanfo(): Promise<DanfoModule> {
  danfo ??= import('danfojs-node').then((m) => ((m as unknown as { default?: DanfoModule }).default ?? m) as DanfoModule);
  return danfo;
}

/** A danfo DataFrame holding the table's columns (complex as `name.re`, `name.im`). */
export async function toDataFrame(table: Table): Promise<DataFrameLike> {
  const dfd = await loadDanfo();
  const data: Record<string, Array<number | string | null>> = {};
  const columns: string[] = [];
  const put = (name: string, values: Array<number | string | null>) => {
    data[name] = values;
    columns.push(name);
  };
  for (const c of table.columns) {
    if (c.kind === 'label') put(c.name, c.values.map((v, i) => (c.missing[i] ? null : v)));
    else if (c.kind === 'complex') {
      put(`${c.name}.re`, Array.from(c.re));
      put(`${c.name}.im`, Array.from(c.im));
    } else put(c.name, Array.from(c.values));
  }
  return new dfd.DataFrame(data, { columns });
}

/** A Table from a danfo DataFrame; numeric DataFrame columns become real/integer, strings labels. */
export async function fromDataFrame(
  df: DataFrameLike,
  source = '(DataFrame)',
  opts: { kinds?: Record<string, ColumnKind> } = {},
): Promise<Table> {
  if (!df || !Array.isArray(df.columns))
    throw new SurmiseError('table.notDataFrame', `${source}: expected a danfo DataFrame`);
  const names: string[] = df.columns;
  const dtypes: string[] = df.dtypes;
  const columns: Column[] = [];
  const records: Record<string, unknown>[] = [];
  let anyText = false;
  names.forEach((name, j) => {
    const vals: unknown[] = df.column(name).values;
    const n = vals.length;
    if (dtypes[j] === 'string' || opts.kinds?.[name] === 'label') {
      anyText = true;
      vals.forEach((v, i) => ((records[i] ??= {})[name] = v));
      return;
    }
    const values = new Float64Array(n);
    const missing = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      const v = vals[i];
      if (v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v))) {
        missing[i] = 1;
        values[i] = NaN;
        (records[i] ??= {})[name] = null;
      } else {
        values[i] = Number(v);
        (records[i] ??= {})[name] = v;
      }
    }
    let integral = true;
    for (let i = 0; i < n && integral; i++) if (!missing[i] && !Number.isInteger(values[i])) integral = false;
    const kind = opts.kinds?.[name] ?? (integral ? 'integer' : 'real');
    columns.push({ name, kind: kind === 'integer' || kind === 'real' ? kind : 'real', values, missing });
  });
  if (anyText) {
    // mixed frame: reuse the record reader's cell rules for everything
    return tableFromRecords(records, source, { kinds: { ...opts.kinds, ...Object.fromEntries(names.filter((n, j) => dtypes[j] === 'string').map((n) => [n, 'label' as const])) } });
  }
  return joinComplexPairs(tableFromColumns(columns, source), 'auto');
}
