/**
 * The functions `import { … } from 'surmise'` gives by name, each with its arguments checked at
 * entry (arguments.ts): one list, read by src/index.ts and by the test that keeps docs/API.md in
 * step with it. The stage namespaces (`table`, `relate`, …) export the unchecked stage functions.
 */
import { KIND as K, fieldsOf, guarded, type ArgSpec, type Kind } from './arguments.ts';
import type { ReadOptions } from '../table/read.ts';
import type { WriteOptions } from '../table/write.ts';
import type { DatasetSpec } from '../table/dataset-types.ts';
import type { RankOptions } from '../attribute/rank.ts';
import type { FitSpec } from '../relate/fit.ts';
import type { SearchSpec } from '../relate/search.ts';
import type { BoundSpec } from '../bound/find.ts';
import type { DiscoverSpec } from '../bound/discover.ts';
import type { ReportOptions } from '../report/types.ts';
import type { RunOptions } from '../run/run.ts';
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
const formatOrOptions: Kind = { expected: 'a format name or an options object', test: (v) => K.string.test(v) || K.object.test(v) };
const stepOrWord: Kind = { expected: "'auto', 'off' or a number", test: (v) => K.string.test(v) || K.number.test(v) };
const opts = (name: string, fields: Record<string, Kind>, optional = false): ArgSpec => ({ name, kind: K.object, fields, optional });

export const readTable = guarded(
  'readTable',
  [{ name: 'path', kind: K.string }, opts('options', fieldsOf<ReadOptions>({ format: K.string, kinds: K.object, complexPairs: K.complexPairs, displayName: K.string, onProgress: K.function }), true)],
  readTable0,
  true,
);
const records: Kind = { expected: 'a list of objects (one per row)', test: (v) => Array.isArray(v) && v.every((r) => K.object.test(r)) };
export const tableFromRecords = guarded(
  'tableFromRecords',
  [{ name: 'records', kind: records }, { name: 'source', kind: K.string, optional: true }, opts('options', fieldsOf<NonNullable<Parameters<typeof tableFromRecords0>[2]>>({ kinds: K.object, complexPairs: K.complexPairs }), true)],
  tableFromRecords0,
);
const writeFields = fieldsOf<WriteOptions>({ force: K.boolean });
export const writeTable = guarded(
  'writeTable',
  [table, { name: 'path', kind: K.string }, { name: 'format', kind: formatOrOptions, optional: true, fields: writeFields }, opts('options', writeFields, true)],
  writeTable0,
  true,
);
export const deriveColumn = guarded('deriveColumn', [table, { name: 'name', kind: K.string }, { name: 'expression', kind: K.string }], deriveColumn0);
export const evaluateExpression = guarded('evaluateExpression', [table, { name: 'expression', kind: K.stringOrExpression }], evaluateExpression0);
export const buildDataset = guarded(
  'buildDataset',
  [table, opts('spec', fieldsOf<DatasetSpec>({ target: K.string, features: K.strings, exclude: K.strings, key: K.strings, keepLabels: K.strings, derive: K.derivedSources, dedupe: K.string, groups: K.groups }))],
  buildDataset0,
);
export const toDataFrame = guarded('toDataFrame', [table], toDataFrame0, true);
export const fromDataFrame = guarded('fromDataFrame', [{ name: 'dataFrame', kind: K.dataFrame }, { name: 'source', kind: K.string, optional: true }, opts('options', fieldsOf<NonNullable<Parameters<typeof fromDataFrame0>[2]>>({ kinds: K.object }), true)], fromDataFrame0, true);
const n = K.number;
const strs = K.strings;
const bool = K.boolean;
export const rankFeatures = guarded(
  'rankFeatures',
  [
    table,
    opts('options', fieldsOf<RankOptions>({
      target: K.string, features: strs, exclude: strs, derive: strs, groups: K.groups, methods: strs,
      seeds: n, folds: n, split: K.string, task: K.string, hidden: K.numbers, epochs: n, activation: K.string, loss: K.string,
      patience: n, batchSize: n, learningRate: n, seed: n, engine: K.string, workers: n, dropTop: n, attributionRows: n,
      smoothGradSamples: n, smoothGradNoise: n, integratedSteps: n, permutationRepeats: n, permutationLoss: K.string,
      resamples: n, probes: n, onProgress: K.function,
    })),
  ],
  rankFeatures0,
  true,
);
export const fitRelation = guarded(
  'fitRelation',
  [table, opts('spec', fieldsOf<FitSpec>({
    target: K.string, terms: strs, intercept: bool, derive: K.derivedPairs, split: K.object, seed: n, folds: n, level: n,
    keepDuplicates: bool, noisyTerms: strs, keepResiduals: bool,
  }))],
  fitRelation0,
);
export const searchRelations = guarded(
  'searchRelations',
  [table, opts('spec', fieldsOf<SearchSpec>({
    target: K.string, from: strs, maxTerms: n, powers: K.numbers, split: K.object, top: n, seed: n, derive: K.derivedPairs,
    maxComplexity: n, beam: n, maxExhaustive: n, screenRows: n, keepDuplicates: bool, maxCells: n, timeLimit: n,
    lattice: stepOrWord, progress: K.function, now: K.function,
  }))],
  searchRelations0,
);
export const findBound = guarded(
  'findBound',
  [table, opts('spec', fieldsOf<BoundSpec>({
    lhs: K.string, rhs: K.stringOrStrings, by: K.string, bins: n, top: n, id: strs, skipInvalid: bool, lower: bool, derive: strs, form: K.string,
  }))],
  findBound0,
);
export const discoverBound = guarded(
  'discoverBound',
  [table, opts('spec', fieldsOf<DiscoverSpec>({
    lhs: K.string, from: strs, lower: bool, maxExponent: n, maxDenominator: n, proposals: n, top: n, bins: n, seed: n,
    heldOut: n, exceedances: n, id: strs, skipInvalid: bool, derive: strs,
  }))],
  discoverBound0,
);
export const renderReport = guarded(
  'renderReport',
  [{ name: 'input', kind: K.object }, opts('options', fieldsOf<ReportOptions>({ seed: n, maxPoints: n, scatterMode: K.string, png: bool, pngScale: n }), true)],
  renderReport0,
  true,
);
export const executeRun = guarded(
  'executeRun',
  [
    { name: 'config', kind: K.object },
    opts('options', fieldsOf<RunOptions>({ out: K.string, force: bool, engine: K.string, onStage: K.function, onRankProgress: K.function, onSearchProgress: K.function }), true),
  ],
  executeRun0,
  true,
);
export const loadConfig = guarded('loadConfig', [{ name: 'file', kind: K.string }, { name: 'display', kind: K.string, optional: true }], loadConfig0);
export const parseConfig = guarded('parseConfig', [{ name: 'text', kind: K.string }, { name: 'file', kind: K.string }, { name: 'baseDir', kind: K.string, optional: true }], parseConfig0);
export const compareRuns = guarded('compareRuns', [{ name: 'a', kind: K.object }, { name: 'b', kind: K.object }], compareRuns0);
export const generateDemoKnots = guarded('generateDemoKnots', [{ name: 'seed', kind: K.number }, { name: 'onRow', kind: K.function, optional: true }], generateDemoKnots0);
export const runCli = guarded('runCli', [{ name: 'args', kind: K.strings }, { name: 'io', kind: K.object }], runCli0, true);
