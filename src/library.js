// The package entry for Node users: the compiled library (build/index.js) when it is up to date
// (bin/build-fresh.js), else the TypeScript sources through tsx (a regular dependency), so it
// loads without a build step too. Re-exports the library (src/index.ts).
import { freshBuild } from '../bin/build-fresh.js';

const root = new URL('../', import.meta.url);
let lib;
if (freshBuild(root)) {
  lib = await import(new URL('build/index.js', root).href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  lib = await import('./index.ts');
}

export const {
  table, learn, attribute, relate, bound, report, run, knots,
  SurmiseError, isUserError,
  readTable, tableFromRecords, writeTable, deriveColumn, evaluateExpression, buildDataset, toDataFrame, fromDataFrame,
  rankFeatures, fitRelation, searchRelations, findBound, discoverBound, renderReport,
  executeRun, loadConfig, parseConfig, compareRuns, generateDemoKnots, runCli,
} = lib;
