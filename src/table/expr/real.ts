import type { Table } from '../types.ts';
import { exprError } from './caret.ts';
import { evaluateExpression } from './evaluate.ts';

/** A real-valued column computed from an expression: values (NaN where missing) and the missing mask. */
export interface RealValues {
  values: Float64Array;
  missing: Uint8Array;
}

/**
 * The values of `source` on every row of `table`, which must be real: a value with a non-zero
 * imaginary part is refused (expr.notReal) naming the expression by its `role` in the caller's
 * words ('the target', 'term', 'lhs'), the first such data row and file line, and asking for
 * re(), im() or abs() of it. Every stage that needs a real column of an expression calls this.
 */
export function realColumn(table: Table, source: string, role: string): RealValues {
  const v = evaluateExpression(table, source);
  if (v.im) {
    for (let i = 0; i < v.im.length; i++) {
      const y = v.im[i]!;
      if (v.missing[i] || y === 0 || Number.isNaN(y)) continue;
      const line = table.lines ? `, line ${table.lines[i]}` : '';
      throw exprError(
        'expr.notReal',
        `${table.source}: ${role} '${source}' is complex-valued (first at data row ${i + 1}${line}: ${v.re[i]} ${y < 0 ? '-' : '+'} ${Math.abs(y)}i); ` +
          `it must be real here: write re(${source}), im(${source}) or abs(${source})`,
        source,
        0,
        source.length,
        { role },
      );
    }
  }
  return { values: v.re, missing: v.missing };
}
