/**
 * The formula searches a report holds (`searches`, or the single `search` of older inputs) and the
 * choice of the best formula among them. Held-out errors of searches for different targets are put
 * on one scale by the spread of each target on its held-out rows: heldOutRmse / heldOutSd =
 * √(1 − R²) on those rows (R² as in Draper & Smith, Applied Regression Analysis, 3rd ed., 1.4),
 * 0 for an exact law and 1 for a formula no better than the held-out mean.
 */
import type { ReportCandidate, ReportInput, ReportSearch } from './types.ts';

/** Every search of the input, in order (`searches`, else the one `search`, else none). */
export function searchesOf(input: Pick<ReportInput, 'search' | 'searches'>): ReportSearch[] {
  return input.searches ?? (input.search ? [input.search] : []);
}

/** The search front's formula with the smallest held-out error (the simpler one on a tie); null without one. */
export function bestOfSearch(search: ReportSearch | undefined): ReportCandidate | null {
  if (!search || search.front.length === 0) return null;
  return [...search.front].sort((a, b) => a.heldOutRmse - b.heldOutRmse || a.complexity - b.complexity)[0]!;
}

/** A candidate's held-out RMSE over its target's held-out spread, or null when the spread is unknown or 0. */
export function relativeError(search: ReportSearch, c: ReportCandidate): number | null {
  const sd = search.heldOutSd;
  return sd !== undefined && sd > 0 && Number.isFinite(sd) ? c.heldOutRmse / sd : null;
}

/**
 * The best formula across the searches: each search's best, compared by held-out RMSE relative to
 * the target's held-out spread (by the RMSE itself when every search has the same target and a
 * spread is missing), then by complexity, then in the order written. Null when no search has a
 * formula, or when the searches cannot be put on one scale (different targets, a spread missing):
 * then `comparable` is false and each search's best stands alone.
 */
export function bestAcrossSearches(searches: readonly ReportSearch[]): { search: ReportSearch; best: ReportCandidate; index: number; comparable: boolean } | null {
  const bests = searches.flatMap((search, index) => {
    const best = bestOfSearch(search);
    return best ? [{ search, best, index }] : [];
  });
  if (bests.length === 0) return null;
  if (bests.length === 1) return { ...bests[0]!, comparable: true };
  const rel = bests.map((b) => relativeError(b.search, b.best));
  const sameTarget = bests.every((b) => b.search.target !== undefined && b.search.target === bests[0]!.search.target);
  const score = rel.every((r) => r !== null) ? (k: number) => rel[k]! : sameTarget ? (k: number) => bests[k]!.best.heldOutRmse : null;
  if (score === null) return { ...bests[0]!, comparable: false };
  const order = bests.map((_, k) => k).sort((p, q) => score(p) - score(q) || bests[p]!.best.complexity - bests[q]!.best.complexity || p - q);
  return { ...bests[order[0]!]!, comparable: true };
}
