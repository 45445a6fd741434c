import type { Table, Column } from '../../src/table/types.ts';

/** An in-memory table of real columns (and optional label/complex columns), for tests. */
export function makeTable(cols: Record<string, Float64Array | string[] | { re: Float64Array; im: Float64Array }>, source = 'test.csv'): Table {
  const columns: Column[] = Object.entries(cols).map(([name, v]) => {
    if (Array.isArray(v)) return { name, kind: 'label' as const, values: v, missing: new Uint8Array(v.length) };
    if (v instanceof Float64Array) return { name, kind: 'real' as const, values: v, missing: Uint8Array.from(v, (x) => (Number.isNaN(x) ? 1 : 0)) };
    return { name, kind: 'complex' as const, re: v.re, im: v.im, missing: new Uint8Array(v.re.length) };
  });
  const first = columns[0]!;
  const n = first.kind === 'complex' ? first.re.length : first.values.length;
  return { source, nRows: n, columns, lines: Int32Array.from({ length: n }, (_, i) => i + 2) };
}
