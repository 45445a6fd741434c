/**
 * The options of findBound and discoverBound: one table each (key, type, range, default, meaning)
 * that the library checks against, and the `bound` command and the configuration's `bounds` /
 * `discover` blocks are built from. Both share `--top`, `--bins`, `--lower`, `--skip-invalid` and
 * `--id` on the command line (with --rhs the first table applies, with --from the second).
 */
import { optionOf, type OptionSpec, type OptionTable } from '../util/option-table.ts';
import type { IntegerRange } from '../util/integer.ts';

export const BOUND_FORMS = ['ratio', 'affine', 'two-sided'] as const;
export type BoundForm = (typeof BOUND_FORMS)[number];

const SHARED = [
  { key: 'id', type: 'list', default: null, description: 'columns shown beside witness rows (default: every label column)' },
  { key: 'skipInvalid', type: 'boolean', default: false, description: 'drop and count rows with a missing cell, a non-finite value or a value ≤ 0 where one must be positive, instead of refusing them' },
  { key: 'lower', type: 'boolean', default: false, description: 'the lower form: largest c with lhs ≥ c·rhs on every row (min of lhs/rhs)' },
] as const satisfies readonly OptionSpec[];

export const BOUND_OPTIONS = [
  { key: 'by', type: 'text', default: null, description: 'stratify by this expression (default: each candidate by its own rhs)' },
  { key: 'bins', type: 'integer', min: 1, max: 1000, default: 10, description: 'number of equal-count strata' },
  { key: 'top', type: 'integer', min: 1, max: 1000, default: 5, description: 'witness rows shown per candidate' },
  ...SHARED,
  { key: 'form', type: 'choice', choices: BOUND_FORMS, default: 'ratio', description: 'ratio: lhs ≤ c·rhs; affine adds lhs ≤ c·rhs + d; two-sided adds both affine sides' },
] as const satisfies OptionTable;

export const DISCOVER_OPTIONS = [
  ...SHARED,
  { key: 'maxExponent', type: 'integer', min: 1, max: 12, default: 4, description: 'largest |exponent| of a quantity' },
  { key: 'maxDenominator', type: 'integer', min: 1, max: 12, default: 4, description: 'largest denominator of a snapped exponent' },
  { key: 'proposals', type: 'integer', min: 1, max: 50, default: 5, description: 'proposals returned, best first' },
  { key: 'top', type: 'integer', min: 1, max: 1000, default: 5, description: 'witness rows per proposal' },
  { key: 'bins', type: 'integer', min: 3, max: 1000, default: 10, description: 'equal-count strata per quantity for the trends' },
  { key: 'seed', type: 'integer', min: 0, max: 0xffffffff, default: 1, description: 'seed of the selection / held-out split' },
  { key: 'heldOut', type: 'number', min: 0.1, max: 0.9, default: 0.4, description: 'share of rows held out' },
  { key: 'exceedances', type: 'integer', min: 30, max: 100_000, default: null, description: 'exceedances for the tail estimate of the true constant (default: a tenth of the rows, at most 1000)' },
] as const satisfies OptionTable;

const range = (key: string): IntegerRange => {
  const o = optionOf(BOUND_OPTIONS, key);
  return o.type === 'integer' ? { min: o.min, max: o.max } : { min: 0, max: 0 };
};

/** Ranges of findBound's count options (strata and witness rows), from BOUND_OPTIONS; the ceilings keep output finite. */
export const BOUND_LIMITS = Object.freeze({ bins: range('bins'), top: range('top') } satisfies Record<string, IntegerRange>);
