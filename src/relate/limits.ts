import { optionOf } from '../util/option-table.ts';
import type { IntegerRange } from '../util/integer.ts';
import { FIT_OPTIONS, SEARCH_OPTIONS } from './options.ts';

const range = (o: ReturnType<typeof optionOf>): IntegerRange => (o.type === 'integer' ? { min: o.min, max: o.max } : { min: 0, max: 0 });

/** Ranges of the relate stage's count options, read from FIT_OPTIONS and SEARCH_OPTIONS; the README quotes them. */
export const RELATE_LIMITS = Object.freeze({
  /** Cross-validation folds of fitRelation. */
  folds: range(optionOf(FIT_OPTIONS, 'folds')),
  /** Terms besides the intercept in searchRelations. */
  maxTerms: range(optionOf(SEARCH_OPTIONS, 'maxTerms')),
  /** Candidates searchRelations reports. */
  top: range(optionOf(SEARCH_OPTIONS, 'top')),
  /** Complexity of one term in searchRelations. */
  maxComplexity: range(optionOf(SEARCH_OPTIONS, 'maxComplexity')),
} satisfies Record<string, IntegerRange>);
