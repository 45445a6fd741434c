/**
 * surmise as a library. Each pipeline stage is a namespace (table → learn → attribute →
 * relate / bound → report; run ties them together; knots produces tables), and the functions a
 * Node user reaches for first are also exported by name.
 *
 * @example
 *   import { readTable, rankFeatures, fitRelation, findBound } from 'surmise';
 *   const t = await readTable('demo-data/knots.csv');
 *   const fit = fitRelation(t, { target: 'genus_bound', terms: ['crossings', 'strands'] });
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
export { readTable, writeTable, deriveColumn, evaluateExpression, buildDataset, toDataFrame, fromDataFrame } from './table/index.ts';
export { rankFeatures } from './attribute/rank.ts';
export { fitRelation } from './relate/fit.ts';
export { searchRelations } from './relate/search.ts';
export { findBound } from './bound/find.ts';
export { renderReport } from './report/index.ts';
export { executeRun, loadConfig, parseConfig, compareRuns } from './run/index.ts';
export { generateDemoKnots } from './demo/knots.ts';
export { runCli } from './cli/main.ts';
