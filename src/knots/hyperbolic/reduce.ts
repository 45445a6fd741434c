/**
 * Smaller braids for the same closure, and composite closures recognised from the word.
 * - Free cyclic reduction: σ_i σ_i⁻¹ → nothing, also across the closing point (Reidemeister II;
 *   rotating the word is conjugation, which keeps the closure).
 * - Markov destabilisation (Markov 1936; Birman, "Braids, Links and Mapping Class Groups", 1974,
 *   Thm 2.3): when σ_{n−1}^{±1} occurs exactly once, the word is conjugate to w·σ_{n−1}^{±1} with w
 *   on n − 1 strands, whose closure is the same link; likewise σ_1 (renumbering the strands).
 * - Braid connected sum: when a middle generator σ_i occurs exactly once, the other letters split
 *   into commuting words A (strands 1..i) and B (strands i+1..n) and the closure is
 *   closure(A) # closure(B) (the single crossing is the band of the sum; Birman 1974, §2). For a
 *   knot whose two summands are both knotted (Alexander polynomial not a unit) the knot is
 *   composite, hence not hyperbolic (its complement contains an essential annulus; Thurston 1982).
 */
import { burauAlexanderExact, type Braid } from '../braid.ts';
import { trimPoly } from '../poly.ts';

/** Free cyclic reduction of a word: σ_i σ_i⁻¹ → nothing, also across the closing point (a stack pass, then both ends). */
export function cyclicReduce(word: readonly number[]): number[] {
  const out: number[] = [];
  for (const g of word) {
    if (out.length && out[out.length - 1] === -g) out.pop();
    else out.push(g);
  }
  let a = 0;
  let z = out.length - 1;
  while (z > a && out[a] === -out[z]!) {
    a++;
    z--;
  }
  return out.slice(a, z + 1);
}

/** Free cyclic reduction of a braid word (σ_i σ_i⁻¹ → nothing, also across the closing point). */
export function reduceBraid(b: Braid): Braid {
  return { strands: b.strands, word: cyclicReduce(b.word) };
}

/** Free reduction and Markov destabilisation until neither applies. */
export function simplifyBraid(b0: Braid): Braid {
  let b = reduceBraid(b0);
  for (let guard = 0; guard <= b0.strands + b0.word.length; guard++) {
    const n = b.strands;
    if (n < 2) break;
    const count = (i: number): number => b.word.filter((g) => Math.abs(g) === i).length;
    if (count(n - 1) === 1) b = reduceBraid({ strands: n - 1, word: b.word.filter((g) => Math.abs(g) !== n - 1) });
    else if (count(1) === 1) b = reduceBraid({ strands: n - 1, word: b.word.filter((g) => Math.abs(g) !== 1).map((g) => g - Math.sign(g)) });
    else if (n >= 2 && count(n - 1) === 0 && b.word.length > 0 && n > Math.max(...b.word.map(Math.abs)) + 1) b = { strands: Math.max(...b.word.map(Math.abs)) + 1, word: b.word };
    else break;
  }
  return b;
}

/** The two summands when some middle generator occurs exactly once (see the module comment). */
export function braidSummands(b: Braid): [Braid, Braid] | undefined {
  for (let i = 2; i < b.strands - 1; i++) {
    if (b.word.filter((g) => Math.abs(g) === i).length !== 1) continue;
    const A = b.word.filter((g) => Math.abs(g) < i);
    const B = b.word.filter((g) => Math.abs(g) > i).map((g) => g - Math.sign(g) * i);
    return [
      { strands: i, word: A },
      { strands: b.strands - i, word: B },
    ];
  }
  return undefined;
}

/** True when the closure (a knot) has an Alexander polynomial that is not ±t^k, so it is knotted. */
export function isKnotted(b: Braid): boolean {
  if (b.strands < 2 || b.word.length === 0) return false;
  // Δ(t) up to a unit ±t^k from the reduced Burau representation (Burau 1936; Birman 1974, Thm 3.11)
  const { coeffs } = trimPoly(burauAlexanderExact(b));
  return !(coeffs.length === 1 && (coeffs[0] === 1n || coeffs[0] === -1n));
}
