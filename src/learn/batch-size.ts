/** The largest batch batchSizeFor chooses (a smaller table gets smaller batches). */
export const MAX_AUTO_BATCH = 256;

/**
 * Mini-batch size chosen from the training rows: `max` (default MAX_AUTO_BATCH, 256), shrunk
 * on small tables so an epoch has at least about 8 steps: 2^⌊log₂(n/8)⌋, at least 8 (our rule).
 * @example batchSizeFor(90) // 8;  batchSizeFor(14_000) // 256
 */
export function batchSizeFor(nTrain: number, max: number = MAX_AUTO_BATCH): number {
  const b = 2 ** Math.floor(Math.log2(Math.max(1, nTrain / 8)));
  return Math.max(8, Math.min(max, b));
}
