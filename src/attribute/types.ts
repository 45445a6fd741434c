/**
 * What attribution needs of a model: a scalar output per row and its gradient with respect to the
 * (standardized) inputs. Inputs are row-major n×p Float64Arrays. For a classifier the scalar is the
 * expected value Σ_k p_k c_k of the class values c_k under the network's class probabilities p_k
 * (the learn stage exposes it); a regressor's scalar is its prediction.
 */
export interface ScalarModel {
  /** Number of inputs per row. */
  p: number;
  /** f(x) for each of n rows (row-major n×p) → length n. */
  predict(x: Float64Array, n: number): Float64Array;
  /** ∂f/∂x_j for each row, row-major n×p. */
  inputGradients(x: Float64Array, n: number): Float64Array;
}

/** A named set of feature columns scored together (a complex column's `.re`/`.im`, or a user's group). */
export interface FeatureGroup {
  name: string;
  /** Column indices into the feature matrix. */
  members: number[];
}

/** One repeat's scores of one method: per feature (or group) and, optionally, per held-out row. */
export interface RepeatScores {
  /** Mean score per column (length = number of columns scored). */
  scores: Float64Array;
  /**
   * Per-row contributions, row-major n×p: `scores[j]` is the mean of column j over rows. Present
   * when the method's score is a row mean, so the aggregation can also resample rows.
   */
  perRow?: Float64Array;
  /** Rows contributing. */
  n: number;
}

/** The registered attribution methods (methods/index.ts), re-exported where the shared types live. */
export { ATTRIBUTION_METHODS, type AttributionMethod } from './methods/index.ts';
