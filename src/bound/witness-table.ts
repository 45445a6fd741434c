import { SurmiseError } from '../errors.ts';
import type { Column, Table } from '../table/types.ts';

/** One list of witness rows to export: which bound, and its rows (1-based) with their ratios. */
export interface WitnessGroup {
  rhs: string;
  witnesses: ReadonlyArray<{ row: number; ratio: number; lhs: number; rhs: number }>;
}

/** Leading columns of an exported witness table. */
export const WITNESS_COLUMNS = ['bound_rhs', 'bound_rank', 'bound_row', 'bound_ratio', 'bound_lhs', 'bound_rhs_value'] as const;

/**
 * The witness rows of each bound as a table: the bound's rhs, the rank of the row among its
 * witnesses, the 1-based data row, ratio, lhs and rhs values, then every column of `table` for that
 * row. Refused (`bound.witnessClash`) when the table already has a column named like a leading one.
 */
export function witnessTable(table: Table, groups: readonly WitnessGroup[]): Table {
  const clash = table.columns.find((c) => (WITNESS_COLUMNS as readonly string[]).includes(c.name));
  if (clash) throw new SurmiseError('bound.witnessClash', `${table.source}: the table has a column '${clash.name}', which the witness export uses for its own; rename it`);
  const picks: Array<{ g: WitnessGroup; rank: number; w: WitnessGroup['witnesses'][number] }> = [];
  for (const g of groups) g.witnesses.forEach((w, k) => picks.push({ g, rank: k + 1, w }));
  const n = picks.length;
  const none = new Uint8Array(n);
  const real = (name: string, f: (p: (typeof picks)[number]) => number, kind: 'real' | 'integer' = 'real'): Column => ({
    name,
    kind,
    values: Float64Array.from(picks, f),
    missing: none,
  });
  const lead: Column[] = [
    { name: 'bound_rhs', kind: 'label', values: picks.map((p) => p.g.rhs), missing: none },
    real('bound_rank', (p) => p.rank, 'integer'),
    real('bound_row', (p) => p.w.row, 'integer'),
    real('bound_ratio', (p) => p.w.ratio),
    real('bound_lhs', (p) => p.w.lhs),
    real('bound_rhs_value', (p) => p.w.rhs),
  ];
  const idx = picks.map((p) => p.w.row - 1);
  const rest: Column[] = table.columns.map((c) => {
    const missing = Uint8Array.from(idx, (i) => c.missing[i]!);
    if (c.kind === 'label') return { ...c, values: idx.map((i) => c.values[i]!), missing };
    if (c.kind === 'complex') return { ...c, re: Float64Array.from(idx, (i) => c.re[i]!), im: Float64Array.from(idx, (i) => c.im[i]!), missing };
    return { ...c, values: Float64Array.from(idx, (i) => c.values[i]!), missing };
  });
  return { source: `${table.source} (witness rows)`, nRows: n, columns: [...lead, ...rest] };
}
