/** The table layer: reading, writing, kinds, complex values, profiling, danfo bridges, expressions, datasets. */
export type { Column, ColumnKind, ComplexColumn, LabelColumn, RealColumn, Table } from './types.ts';
export { readTable, formatFromPath, TABLE_FORMATS, type ReadOptions, type TableFormat } from './read.ts';
export { writeTable, quoteField, type WriteOptions } from './write.ts';
export {
  getColumn,
  tableFromColumns,
  tableFromRecords,
  joinComplexPairs,
  declaredKind,
  COLUMN_KINDS,
  type ComplexPairs,
} from './columns.ts';
export { parseComplexPairsOption } from './complex-pairs.ts';
export { parseNumberText, parseComplexText, isMissingText, formatNumber, formatComplex } from './cell.ts';
export { NUMERIC_SHARE_FOR_ERROR } from './builder.ts';
export {
  profileTable,
  numericStats,
  averageRanks,
  spearmanPairs,
  countDuplicateRows,
  CORRELATION_SAMPLE,
  type TableProfile,
  type ColumnProfile,
  type Correlation,
  type Stats,
} from './profile.ts';
export { toDataFrame, fromDataFrame } from './danfo.ts';
export * from './expr/index.ts';
export * from './dataset.ts';
export * from './standardize.ts';
export * from './split.ts';
