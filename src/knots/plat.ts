/**
 * PD codes of plat closures: a braid on 2m strands whose top ends are joined in pairs (1,2),
 * (3,4), … by caps and whose bottom ends likewise by cups (Birman, "Braids, Links and Mapping Class
 * Groups", 1974, §4.4). Two-bridge knots are the plats on four strands, σ2^{a1} σ1^{−a2} σ2^{a3}…
 * with an odd number of runs (Conway notation C(a1, a2, a3, …); Rolfsen, "Knots and Links", §4.D):
 * the twist knot with n half twists is C(n, 2) = C(n, 1, 1), the plat of σ2^n σ1^{−1} σ2,
 * alternating, with determinant 2n + 1 (4₁ for n = 2, 5₂ for 3, 6₁ for 4, 7₂ for 5, …).
 * Letters as for braids: i is σ_i with the strand from position i passing over, −i the inverse.
 * The strands are traced from the first cap; edges are numbered along the way.
 */
import type { Crossing } from './pd.ts';

/** PD code of the plat closure of `word` on `strands` (even) strands. */
export function platClosurePD(strands: number, word: readonly number[]): Crossing[] {
  if (strands % 2 !== 0 || strands < 2) throw new RangeError('a plat needs an even number of strands');
  const L = word.length;
  // corner labels of crossing k: [top-left, top-right, bottom-left, bottom-right]
  const corners = word.map(() => [0, 0, 0, 0]);
  const visited = new Set<string>();
  let label = 0;
  let pos = 0;
  // the strand at `pos` meets level k: if crossing k joins positions i and i + 1, label the corner it
  // enters by (side `enter`: 0 top, 2 bottom) and the one it leaves by (the other side), and move across
  const pass = (k: number, enter: number, leave: number): number => {
    const i = Math.abs(word[k]!) - 1;
    if (pos !== i && pos !== i + 1) return pos;
    const c = corners[k]!;
    c[enter + (pos === i ? 0 : 1)] = label;
    label++;
    const to = pos === i ? i + 1 : i;
    c[leave + (to === i ? 0 : 1)] = label;
    return to;
  };
  for (let startPos = 0; startPos < strands; startPos += 2) {
    // a component not yet traced starts going down from the left end of a cap
    if (visited.has(`0:${startPos}`)) continue;
    let level = 0; // between crossing level-1 and level (0 = just under the caps)
    pos = startPos;
    let down = true;
    label++;
    const first = label;
    for (let guard = 0; guard < 4 * (L + 1) * strands; guard++) {
      visited.add(`${level}:${pos}`);
      if (down) {
        if (level === L) {
          // a cup turns the strand up at its partner position
          pos = pos ^ 1;
          down = false;
          continue;
        }
        pos = pass(level, 0, 2); // entering from the top, leaving at the bottom
        level++;
      } else {
        if (level === 0) {
          pos = pos ^ 1;
          down = true;
          if (pos === startPos) break;
          continue;
        }
        pos = pass(level - 1, 2, 0); // entering from the bottom, leaving at the top
        level--;
      }
    }
    // the last edge closes up with the first
    for (const c of corners) for (let s = 0; s < 4; s++) if (c[s] === label) c[s] = first;
  }
  return word.map((g, k) => {
    const [TL, TR, BL, BR] = corners[k]!;
    // g > 0: the strand at the left position passes over (TL–BR over, TR–BL under); counter-clockwise
    // the corners read TR, TL, BL, BR, starting from the incoming end of the under-strand
    const under: [number, number] = g > 0 ? [TR!, BL!] : [TL!, BR!];
    const ccw = [TR!, TL!, BL!, BR!];
    const incoming = entering(under, ccw);
    const s = ccw.indexOf(incoming);
    return [ccw[s]!, ccw[(s + 1) & 3]!, ccw[(s + 2) & 3]!, ccw[(s + 3) & 3]!] as Crossing;
  });
}

/** Of the two ends of the under-strand, the one it enters by: edges are numbered along the strand, so the smaller (mod wrap-around). */
function entering(under: [number, number], _ccw: number[]): number {
  const [a, b] = under;
  if (Math.abs(a - b) === 1) return Math.min(a, b);
  return Math.max(a, b); // the closing edge (wrap-around) enters the crossing
}

/** The twist knot with n ≥ 1 half twists: plat of σ2^n σ1^{−1} σ2 on four strands (see the module comment). */
export function twistKnotPD(n: number): Crossing[] {
  if (!Number.isInteger(n) || n < 1) throw new RangeError('a twist knot needs n ≥ 1 half twists');
  return platClosurePD(4, [...new Array<number>(n).fill(2), -1, 2]);
}
