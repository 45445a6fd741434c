/** Counts of held-out rows by actual class (rows) and predicted class (columns), classes in increasing order. */
export interface Confusion {
  classes: number[];
  counts: number[][];
}

/**
 * The confusion matrix C[a][b] = #{i : y_i = c_a, ŷ_i = c_b} over the classes seen in either list
 * (common practice; the diagonal over n is the accuracy).
 * @example confusionCounts([1, 2, 2], [1, 1, 2]) // { classes: [1, 2], counts: [[1, 0], [1, 1]] }
 */
export function confusionCounts(actual: ArrayLike<number>, predicted: ArrayLike<number>): Confusion {
  const classes = [...new Set([...Array.from(actual), ...Array.from(predicted)])].sort((a, b) => a - b);
  const at = new Map(classes.map((c, k) => [c, k]));
  const counts = classes.map(() => classes.map(() => 0));
  for (let i = 0; i < actual.length; i++) counts[at.get(actual[i]!)!]![at.get(predicted[i]!)!]!++;
  return { classes, counts };
}
