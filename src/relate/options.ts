/**
 * The options of fitRelation and searchRelations: one table each (key, type, range, default,
 * meaning) that the library checks against, and the `fit` / `search` commands and the run
 * configuration's `fits` / `search` blocks are built from. `shell` options are read by the CLI and
 * the configuration in their written form (a split spec, `lo..hi`) and handed to the library
 * converted (row indices, a pair), so the library does not check them against the table.
 */
import type { OptionTable } from '../util/option-table.ts';
import { INTEGER_RANGE_PATTERN } from '../util/range.ts';

const SEED_MAX = 0xffffffff;

/** Shared by fit and search: the split written as a spec (src/relate/split-option.ts turns it into rows). */
const SPLIT = {
  key: 'split', type: 'text', default: null, shell: 'read by splitRows into the library\'s row split',
  description: 'fit on one part and measure on the other: random:TRAIN,VALIDATION,TEST (fit on train, measure on test) or where:CONDITION',
} as const;

export const FIT_OPTIONS = [
  { key: 'intercept', type: 'boolean', default: true, description: 'fit the constant term too (without it R² is uncentred)' },
  SPLIT,
  { key: 'seed', type: 'integer', min: 0, max: SEED_MAX, default: 1, description: 'seed of the split and of the cross-validation folds' },
  { key: 'folds', type: 'integer', min: 2, max: 255, default: 5, description: 'cross-validation folds' },
  { key: 'level', type: 'number', min: 0, max: 1, openMin: true, openMax: true, default: 0.95, description: 'confidence level of the intervals' },
  { key: 'keepDuplicates', type: 'boolean', default: false, description: 'keep rows that repeat an earlier row in every column used (default: drop and count them)' },
  { key: 'noisyTerms', type: 'list', default: [], flag: 'noisy', configKey: 'noisy', separator: ';', description: 'terms measured with error (errors-in-variables: their slopes are attenuated)' },
] as const satisfies OptionTable;

export const SEARCH_OPTIONS = [
  { key: 'maxTerms', type: 'integer', min: 1, max: 6, default: 2, description: 'largest number of terms besides the intercept' },
  { key: 'powers', type: 'text', default: '-3..3', pattern: { re: INTEGER_RANGE_PATTERN, expected: 'a range such as -3..3' }, shell: 'read as the library\'s [lo, hi]', description: 'integer powers in the grammar' },
  { key: 'maxComplexity', type: 'integer', min: 1, max: 12, default: 7, description: 'largest complexity of one term' },
  { key: 'timeLimit', type: 'number', min: 0, max: 86_400, openMin: true, default: 60, flag: 'time', description: 'time budget in seconds for growing terms (the CLI also takes 2m)', inert: 'a budget: it changes the outcome only when the search runs out of time, and the result then says so (cuts.time)' },
  { key: 'lattice', type: 'text', default: 'auto', pattern: { re: /^(auto|off|\d+(\.\d+)?)$/, expected: 'auto, off or a positive step such as 2' }, shell: 'read as auto, off or a number', description: 'integer target: auto (detect the lattice), off, or a step; reports how often rounding the formula to it is exact' },
  SPLIT,
  { key: 'top', type: 'integer', min: 1, max: 1000, default: 10, description: 'candidates to list' },
  { key: 'seed', type: 'integer', min: 0, max: SEED_MAX, default: 1, description: 'seed of the split and of the screening rows' },
  { key: 'keepDuplicates', type: 'boolean', default: false, description: 'keep rows that repeat an earlier row in every column used (default: drop and count them)' },
  { key: 'beam', type: 'integer', min: 1, max: 5000, default: 100, description: 'terms of each complexity kept to build the next (beam width)' },
  { key: 'maxExhaustive', type: 'integer', min: 1, max: 50_000_000, default: 1_000_000, description: 'most subsets of the exhaustive subset search (the screened terms are cut to fit)' },
  { key: 'screenRows', type: 'integer', min: 50, max: 1_000_000, default: 2000, description: 'selection rows used for screening' },
  { key: 'maxCells', type: 'integer', min: 10_000, max: 2_000_000_000, default: 25_000_000, description: 'memory bound in float64 cells for stored term values' },
] as const satisfies OptionTable;
