/**
 * Integer-valued targets: the lattice L = offset + step·ℤ the target lies on, detected from the
 * data (every value an integer; step = gcd of the differences, by Euclid's algorithm; a
 * signature, always even, gets step 2), and round_L(f) = offset + step·round((f − offset)/step),
 * the lattice point nearest f (halves away from zero, as the expression language's `round`).
 */
import { gcd } from '../util/gcd.ts';

export interface Lattice {
  step: number;
  offset: number;
}

/**
 * The lattice of `values` when every value is an integer (|x| < 2^53) and at least two differ;
 * else null.
 * @example detectLattice(Float64Array.of(-4, 2, 0, 6)) // { step: 2, offset: 0 }
 */
export function detectLattice(values: ArrayLike<number>): Lattice | null {
  if (values.length < 2) return null;
  const first = values[0]!;
  if (!Number.isSafeInteger(first)) return null;
  let step = 0;
  for (let i = 1; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isSafeInteger(v)) return null;
    step = gcd(step, Math.abs(v - first));
  }
  if (step === 0) return null;
  const offset = ((first % step) + step) % step;
  return { step, offset };
}

/** The lattice point nearest x. @example roundToLattice(3.2, { step: 2, offset: 0 }) // 4 */
export function roundToLattice(x: number, L: Lattice): number {
  const k = (x - L.offset) / L.step;
  const r = k < 0 ? -Math.round(-k) : Math.round(k);
  return L.offset + L.step * r;
}

/** Fraction of the rows `idx` where round_L(pred[i]) equals y[idx[i]] exactly. */
export function exactFraction(pred: ArrayLike<number>, y: ArrayLike<number>, idx: ArrayLike<number>, L: Lattice): number {
  let hit = 0;
  for (let i = 0; i < idx.length; i++) if (roundToLattice(pred[i]!, L) === y[idx[i]!]) hit++;
  return idx.length ? hit / idx.length : NaN;
}
