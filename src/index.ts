/**
 * surmise as a library. Each pipeline stage is a namespace (table → learn → attribute →
 * relate / bound → report; run ties them together; knots produces tables), and the functions a
 * Node user reaches for first are also exported by name.
 *
 * docs/API.md describes them, with an example a test runs.
 */
export * as table from './table/index.ts';
export * as learn from './learn/index.ts';
export * as attribute from './attribute/index.ts';
export * as relate from './relate/index.ts';
export * as bound from './bound/index.ts';
export * as report from './report/index.ts';
export * as run from './run/index.ts';
export * as knots from './knots/index.ts';

export { SurmiseError, isUserError } from './errors.ts';
export type { Table, Column, ColumnKind } from './table/types.ts';
// the functions by name, each with its arguments checked at entry (api/functions.ts; docs/API.md)
export {
  readTable, tableFromRecords, writeTable, deriveColumn, evaluateExpression, buildDataset, toDataFrame, fromDataFrame,
  rankFeatures, fitRelation, searchRelations, findBound, discoverBound, renderReport,
  executeRun, loadConfig, parseConfig, compareRuns, generateDemoKnots, runCli,
} from './api/functions.ts';
