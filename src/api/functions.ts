/**
 * The functions `import { … } from 'surmise'` gives by name, each with its arguments checked at
 * entry (arguments.ts): one list, read by src/index.ts and by the test that keeps docs/API.md in
 * step with it. The stage namespaces (`table`, `relate`, …) export the unchecked stage functions.
 */
import { KIND as K, guarded, type ArgSpec, type Kind } from './arguments.ts';
import { readTable as readTable0 } from '../table/read.ts';
import { tableFromRecords as tableFromRecords0 } from '../table/columns.ts';
import { writeTable as writeTable0 } from '../table/write.ts';
import { deriveColumn as deriveColumn0 } from '../table/expr/derive.ts';
import { evaluateExpression as evaluateExpression0 } from '../table/expr/evaluate.ts';
import { buildDataset as buildDataset0 } from '../table/dataset.ts';
import { fromDataFrame as fromDataFrame0, toDataFrame as toDataFrame0 } from '../table/danfo.ts';
import { rankFeatures as rankFeatures0 } from '../attribute/rank.ts';
import { fitRelation as fitRelation0 } from '../relate/fit.ts';
import { searchRelations as searchRelations0 } from '../relate/search.ts';
import { findBound as findBound0 } from '../bound/find.ts';
import { discoverBound as discoverBound0 } from '../bound/discover.ts';
import { renderReport as renderReport0 } from '../report/render.ts';
import { executeRun as executeRun0 } from '../run/run.ts';
import { loadConfig as loadConfig0, parseConfig as parseConfig0 } from '../run/config.ts';
import { compareRuns as compareRuns0 } from '../run/compare.ts';
import { generateDemoKnots as generateDemoKnots0 } from '../demo/knots.ts';
import { runCli as runCli0 } from '../cli/main.ts';

const table: ArgSpec = { name: 'table', kind: K.table };
const each = (kind: Kind, keys: string[]): Record<string, Kind> => Object.fromEntries(keys.map((k) => [k, kind]));
const formatOrOptions: Kind = { expected: 'a format name or an options object', test: (v) => K.string.test(v) || K.object.test(v) };
const stepOrWord: Kind = { expected: "'auto', 'off' or a number", test: (v) => K.string.test(v) || K.number.test(v) };
const opts = (name: string, fields: Record<string, Kind>, optional = false): ArgSpec => ({ name, kind: K.object, fields, optional });

export const readTable = guarded('readTable', [{ name: 'path', kind: K.string }, opts('options', { format: K.string, kinds: K.object, displayName: K.string, onProgress: K.function }, true)], readTable0, true);
const records: Kind = { expected: 'a list of objects (one per row)', test: (v) => Array.isArray(v) && v.every((r) => K.object.test(r)) };
export const tableFromRecords = guarded('tableFromRecords', [{ name: 'records', kind: records }, { name: 'source', kind: K.string, optional: true }, opts('options', { kinds: K.object }, true)], tableFromRecords0);
export const writeTable = guarded('writeTable', [table, { name: 'path', kind: K.string }, { name: 'format', kind: formatOrOptions, optional: true }, opts('options', {}, true)], writeTable0, true);
export const deriveColumn = guarded('deriveColumn', [table, { name: 'name', kind: K.string }, { name: 'expression', kind: K.string }], deriveColumn0);
export const evaluateExpression = guarded('evaluateExpression', [table, { name: 'expression', kind: K.stringOrExpression }], evaluateExpression0);
export const buildDataset = guarded(
  'buildDataset',
  [table, opts('spec', { target: K.string, ...each(K.strings, ['features', 'exclude', 'key', 'keepLabels']), dedupe: K.string, groups: K.groups })],
  buildDataset0,
);
export const toDataFrame = guarded('toDataFrame', [table], toDataFrame0, true);
export const fromDataFrame = guarded('fromDataFrame', [{ name: 'dataFrame', kind: K.dataFrame }, { name: 'source', kind: K.string, optional: true }, opts('options', { kinds: K.object }, true)], fromDataFrame0, true);
export const rankFeatures = guarded(
  'rankFeatures',
  [
    table,
    opts('options', {
      target: K.string,
      ...each(K.strings, ['features', 'exclude', 'derive', 'methods']),
      groups: K.groups,
      hidden: K.numbers,
      ...each(K.string, ['split', 'task', 'activation', 'loss', 'engine', 'permutationLoss']),
      ...each(K.number, ['seeds', 'folds', 'epochs', 'patience', 'batchSize', 'learningRate', 'seed', 'workers', 'dropTop', 'attributionRows', 'smoothGradSamples', 'smoothGradNoise', 'integratedSteps', 'permutationRepeats', 'resamples', 'probes']),
      onProgress: K.function,
    }),
  ],
  rankFeatures0,
  true,
);
export const fitRelation = guarded(
  'fitRelation',
  [table, opts('spec', { target: K.string, terms: K.strings, noisyTerms: K.strings, derive: K.derivedPairs, split: K.object, ...each(K.boolean, ['intercept', 'keepDuplicates', 'keepResiduals']), ...each(K.number, ['seed', 'folds', 'level']) })],
  fitRelation0,
);
export const searchRelations = guarded(
  'searchRelations',
  [
    table,
    opts('spec', {
      target: K.string,
      from: K.strings,
      powers: K.numbers,
      derive: K.derivedPairs,
      split: K.object,
      keepDuplicates: K.boolean,
      lattice: stepOrWord,
      ...each(K.number, ['maxTerms', 'top', 'seed', 'maxComplexity', 'beam', 'maxExhaustive', 'screenRows', 'maxCells', 'timeLimit']),
      ...each(K.function, ['progress', 'now']),
    }),
  ],
  searchRelations0,
);
export const findBound = guarded(
  'findBound',
  [table, opts('spec', { lhs: K.string, rhs: K.stringOrStrings, by: K.string, form: K.string, ...each(K.strings, ['id', 'derive']), ...each(K.number, ['bins', 'top']), ...each(K.boolean, ['skipInvalid', 'lower']) })],
  findBound0,
);
export const discoverBound = guarded(
  'discoverBound',
  [
    table,
    opts('spec', {
      lhs: K.string,
      ...each(K.strings, ['from', 'id', 'derive']),
      ...each(K.boolean, ['lower', 'skipInvalid']),
      ...each(K.number, ['maxExponent', 'maxDenominator', 'proposals', 'top', 'bins', 'seed', 'heldOut', 'exceedances']),
    }),
  ],
  discoverBound0,
);
export const renderReport = guarded('renderReport', [{ name: 'input', kind: K.object }, opts('options', {}, true)], renderReport0, true);
export const executeRun = guarded(
  'executeRun',
  [{ name: 'config', kind: K.object }, opts('options', { out: K.string, force: K.boolean, engine: K.string, ...each(K.function, ['onStage', 'onRankProgress', 'onSearchProgress']) }, true)],
  executeRun0,
  true,
);
export const loadConfig = guarded('loadConfig', [{ name: 'file', kind: K.string }, { name: 'display', kind: K.string, optional: true }], loadConfig0);
export const parseConfig = guarded('parseConfig', [{ name: 'text', kind: K.string }, { name: 'file', kind: K.string }, { name: 'baseDir', kind: K.string, optional: true }], parseConfig0);
export const compareRuns = guarded('compareRuns', [{ name: 'a', kind: K.object }, { name: 'b', kind: K.object }], compareRuns0);
export const generateDemoKnots = guarded('generateDemoKnots', [{ name: 'seed', kind: K.number }, { name: 'onRow', kind: K.function, optional: true }], generateDemoKnots0);
export const runCli = guarded('runCli', [{ name: 'args', kind: K.strings }, { name: 'io', kind: K.object }], runCli0, true);
