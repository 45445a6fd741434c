/**
 * Recognising torus knots and links from a braid word: the closure of (σ1σ2…σ_{p−1})^q (or its
 * mirror, all exponents negated) up to cyclic rotation is the torus link T(p, q), whose complement
 * is Seifert fibred and not hyperbolic (Thurston, "Three dimensional manifolds, Kleinian groups
 * and hyperbolic geometry", Bull. AMS 6, 1982, §2; Rolfsen, "Knots and Links", §3.C). The braid
 * σ1^k on 2 strands is T(2, k). Only these exact forms are recognised; anything else is left to
 * the geometric search.
 */
import type { Braid } from '../braid.ts';

export function recogniseTorusBraid(b: Braid): { p: number; q: number } | undefined {
  const w = b.word;
  const p = b.strands;
  if (w.length === 0 || p < 2) return undefined;
  const sgn = Math.sign(w[0]!);
  if (w.some((g) => Math.sign(g) !== sgn)) return undefined;
  const a = w.map((g) => Math.abs(g));
  if (a.length % (p - 1) !== 0) return undefined;
  const q = a.length / (p - 1);
  // some rotation of the word must read 1, 2, …, p−1 repeated
  for (let r = 0; r < p - 1 && r < a.length; r++) {
    let ok = true;
    for (let i = 0; i < a.length && ok; i++) if (a[(i + r) % a.length] !== (i % (p - 1)) + 1) ok = false;
    if (ok) return { p, q: sgn * q };
  }
  return undefined;
}
