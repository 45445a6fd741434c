import type { IntegerRange } from '../util/integer.ts';

/** Ranges of the relate stage's count options (fitRelation, searchRelations); the README quotes them. */
export const RELATE_LIMITS = Object.freeze({
  /** Cross-validation folds of fitRelation. */
  folds: { min: 2, max: 255 },
  /** Terms besides the intercept in searchRelations. */
  maxTerms: { min: 1, max: 6 },
  /** Candidates searchRelations reports. */
  top: { min: 1, max: 1000 },
  /** Complexity of one term in searchRelations. */
  maxComplexity: { min: 1, max: 12 },
} satisfies Record<string, IntegerRange>);
