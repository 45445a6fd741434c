// The package entry for Node users: registers tsx (a regular dependency) so the TypeScript
// sources load without a build step, then re-exports the library (src/index.ts).
import { register } from 'tsx/esm/api';

register();
const lib = await import('./index.ts');

export const {
  table, learn, attribute, relate, bound, report, run, knots,
  SurmiseError, isUserError,
  readTable, writeTable, deriveColumn, evaluateExpression, buildDataset, toDataFrame, fromDataFrame,
  rankFeatures, fitRelation, searchRelations, findBound, renderReport,
  executeRun, loadConfig, parseConfig, compareRuns, generateCensus, runCli,
} = lib;
