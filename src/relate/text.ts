/** Small text-formatting helpers shared by the fit and search commands. */

/** A number to `digits` significant figures, without trailing noise; NaN as '—'. */
export function num(x: number, digits = 6): string {
  if (!Number.isFinite(x)) return Number.isNaN(x) ? '—' : x > 0 ? '∞' : '-∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-4 && a < 1e7) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1).replace(/\.?0+e/, 'e');
}

/** Rows of cells as an aligned text table (first row is the header). */
export function alignTable(rows: string[][]): string {
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, j) => (widths[j] = Math.max(widths[j] ?? 0, [...c].length)));
  return rows.map((r) => r.map((c, j) => c + ' '.repeat(widths[j]! - [...c].length)).join('  ').trimEnd()).join('\n') + '\n';
}

