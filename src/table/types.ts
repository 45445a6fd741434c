/**
 * The in-memory table: one typed column per input column. Numeric data lives in Float64Array;
 * a complex column is two Float64Arrays and stays one feature group. `missing[i] = 1` marks a
 * cell that was empty, `NA` or `null` in the file (its value slot holds NaN); a literal `nan`
 * or `inf` is a value, not a missing cell, and is counted separately by the row policy.
 */
export type ColumnKind = 'real' | 'integer' | 'complex' | 'label';

export interface RealColumn {
  name: string;
  kind: 'real' | 'integer';
  values: Float64Array;
  missing: Uint8Array;
}

export interface ComplexColumn {
  name: string;
  kind: 'complex';
  re: Float64Array;
  im: Float64Array;
  missing: Uint8Array;
}

export interface LabelColumn {
  name: string;
  kind: 'label';
  values: string[];
  missing: Uint8Array;
}

export type Column = RealColumn | ComplexColumn | LabelColumn;

export interface Table {
  /** The file the table came from (as the user wrote it), or a name for in-memory tables. */
  source: string;
  nRows: number;
  columns: Column[];
  /** 1-based line in the source file where each data row starts (for error messages), when known. */
  lines?: Int32Array;
  /** What the reader decided and the user should know (columns read as labels, pairs joined, blank lines skipped). */
  notes?: string[];
}
