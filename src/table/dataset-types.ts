/** What the learning stages receive: the row policy's input spec and its output. */

export interface DatasetSpec {
  /** A column name or an expression (e.g. `re(zb/za)`). */
  target: string;
  /** Feature columns; default every numeric column except the target, its inputs and `exclude`. */
  features?: string[];
  exclude?: string[];
  /** Columns computed first, in order (each may use the ones before it). */
  derive?: Array<{ name: string; source: string }>;
  /** Which repeated rows to drop after the first: equal in every used column, equal keys, or none. Default 'all'. */
  dedupe?: 'all' | 'key' | 'none';
  /** Key columns for dedupe 'key' (giving `key` alone implies dedupe 'key'). */
  key?: string[];
  /** Further feature groups, e.g. { pair: ['za', 'zb'] }; members are features or complex columns. */
  groups?: Record<string, string[]>;
  /** Extra columns to carry as text for witness tables (every label column is carried anyway). */
  keepLabels?: string[];
}

export interface FeatureGroup {
  name: string;
  /** Indices into featureNames. */
  members: number[];
}

export interface DropCount {
  column: string;
  reason: 'missing' | 'nan' | 'infinite';
  rows: number;
}

/**
 * Rows left out, each counted once under its first reason: a missing cell in some used column,
 * else a value that is not finite. Stages with further reasons (e.g. a bound's rhs ≤ 0) extend it.
 */
export interface RowDrops {
  /** Rows dropped in all. */
  total: number;
  /** Rows with a missing cell in some used column. */
  missing: number;
  /** Rows with no missing cell but some value NaN or ±∞. */
  nonFinite: number;
}

export interface DropReport {
  inputRows: number;
  keptRows: number;
  /** Per column and reason; a row with two bad cells is counted under both columns. */
  dropped: DropCount[];
  /** Rows dropped for a missing or non-finite value (each row once). */
  invalidRows: number;
  duplicates: number;
  duplicateRule: string;
}

export interface Dataset {
  featureNames: string[];
  groups: FeatureGroup[];
  /** One column per feature, kept rows only. */
  x: Float64Array[];
  y: Float64Array;
  targetName: string;
  targetKind: 'real' | 'integer';
  /** Original 0-based data-row index of each kept row. */
  rows: Int32Array;
  /** Text columns for the kept rows (every label column, plus keepLabels). */
  labels: Record<string, string[]>;
  drops: DropReport;
  /** Columns left out of the default features because the target is computed from them. */
  targetInputs: string[];
}
