/**
 * Reidemeister I simplification of a PD code: a crossing whose two adjacent slots carry the same
 * label (a kink, a monogon region) is removed and its other two labels joined. Kinks give edges of
 * valence 1 in the octahedral triangulation, which no geometric solution allows; the link is the
 * same. Returns the smaller code and the number of components that lost all their crossings.
 * @example removeKinks([[1, 1, 2, 3], …]) // drops the kink at the first crossing
 */
import type { Crossing } from '../pd.ts';

export function removeKinks(pd: readonly Crossing[]): { pd: Crossing[]; freeLoops: number } {
  let cur: Crossing[] = pd.map((x) => [...x] as Crossing);
  let freeLoops = 0;
  for (let guard = 0; guard <= pd.length; guard++) {
    let found = -1;
    let s0 = -1;
    for (let c = 0; c < cur.length && found < 0; c++)
      for (let s = 0; s < 4; s++)
        if (cur[c]![s] === cur[c]![(s + 1) & 3]) {
          found = c;
          s0 = s;
          break;
        }
    if (found < 0) break;
    const x = cur[found]!;
    const a = x[(s0 + 2) & 3]!;
    const b = x[(s0 + 3) & 3]!;
    cur = cur.filter((_, i) => i !== found);
    if (a === b) {
      // the kink closed a whole component (a figure-eight curve): it lies apart from the rest
      freeLoops++;
      continue;
    }
    cur = cur.map((y) => y.map((l) => (l === b ? a : l)) as Crossing);
  }
  return { pd: cur, freeLoops };
}
