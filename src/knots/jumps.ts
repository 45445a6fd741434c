/**
 * The Levine–Tristram signature function x ↦ σ_ω, ω = e^{2πix}, read off between and at the roots of
 * Δ on the unit circle. With a Seifert matrix V, (1 − ω)V + (1 − ω̄)Vᵀ = (1 − ω̄)(Vᵀ − ωV), so the form
 * is degenerate exactly where Δ(ω) = 0 (ω ≠ 1) and σ_ω is constant on each open arc between
 * consecutive roots (J. Levine 1969; A. G. Tristram 1969; see also Gordon–Litherland–Murasugi,
 * Canad. J. Math. 33 (1981)). σ_ω̄ = σ_ω, so x ∈ (0, 1/2] is enough.
 *
 * - Each arc's value is computed at the arc's midpoint between the certified root brackets
 *   (unitroots.ts), where the form is as far from degenerate as the roots allow; a zero eigenvalue
 *   there is an internal error, never a silent miscount.
 * - The jump at a root x₀ < 1/2 is σ(x₀+) − σ(x₀−); at x₀ = 1/2 the two sides agree (σ_ω̄ = σ_ω).
 * - **Convention at a root**: σ_ω at a root of Δ is the signature of the (degenerate) form itself, as
 *   in the definition above (at ω = −1 this is the classical sign(V + Vᵀ), computed exactly). Away
 *   from ω = −1 it is computed in floating point at the refined root, and checked: nullity n₀ with
 *   1 ≤ n₀ ≤ multiplicity, |σ₀ − σ(x₀±)| ≤ n₀ and σ₀ + n₀ ≡ σ(x₀±) (mod 2); a failed check is an
 *   internal error. An x within 1e-11 of a root counts as the root (roots are certified to 1e-12; a
 *   decimal x cannot hit an irrational root exactly). It need not be the mean of the one-sided limits:
 *   when an eigenvalue touches zero without changing sign the form's signature differs from both.
 */
import { hermitianInertia, levineTristram } from './levine.ts';
import type { UnitRoot } from './unitroots.ts';

/** An x this close to a certified root is taken to be the root. */
export const ROOT_MATCH = 1e-11;

export interface Jump {
  x: number;
  /** σ(x+) − σ(x−) */
  jump: number;
}

/** Roots strictly inside (0, 1/2), sorted. */
const inner = (roots: readonly UnitRoot[]): UnitRoot[] => roots.filter((r) => r.x < 0.5);

/** Midpoint of each open arc of (0, 1/2) between consecutive root brackets. */
function arcPoints(roots: readonly UnitRoot[]): number[] {
  const pts: number[] = [];
  let left = 0;
  for (const r of inner(roots)) {
    pts.push((left + r.lo) / 2);
    left = r.hi;
  }
  pts.push((left + 0.5) / 2);
  return pts;
}

function arcSignature(V: readonly (readonly number[])[], x: number): number {
  const h = hermitianInertia(V, x);
  if (h.zero > 0) throw new Error(`internal: the Levine–Tristram form is degenerate at x = ${x}, between the roots of Δ`);
  return h.positive - h.negative;
}

/** σ_ω on every arc of (0, 1/2) between the roots, from x = 0 upwards. */
export function arcSignatures(V: readonly (readonly number[])[], roots: readonly UnitRoot[]): number[] {
  return arcPoints(roots).map((x) => arcSignature(V, x));
}

/** The nonzero jumps σ(x+) − σ(x−) at the roots x ∈ (0, 1/2). */
export function signatureJumps(V: readonly (readonly number[])[], roots: readonly UnitRoot[]): Jump[] {
  const sig = arcSignatures(V, roots);
  const out: Jump[] = [];
  inner(roots).forEach((r, i) => {
    const j = sig[i + 1]! - sig[i]!;
    if (j !== 0) out.push({ x: r.x, jump: j });
  });
  return out;
}

/**
 * σ_ω at x ∈ [0, 1] given the certified roots of Δ (Δ ≠ 0): the value of x's arc, or at a root the
 * signature of the degenerate form (see the module comment).
 */
export function levineTristramAt(V: readonly (readonly number[])[], roots: readonly UnitRoot[], x: number): number {
  if (!Number.isFinite(x)) throw new RangeError('levineTristramAt: x must be finite');
  const frac = x - Math.floor(x);
  if (frac === 0 || frac === 0.5 || V.length === 0) return levineTristram(V, frac);
  const y = frac <= 0.5 ? frac : 1 - frac;
  const inn = inner(roots);
  const at = roots.findIndex((r) => Math.abs(r.x - y) <= ROOT_MATCH || (y >= r.lo && y <= r.hi));
  if (at >= 0 && roots[at]!.x === 0.5) return levineTristram(V, 0.5);
  if (at < 0) {
    let arc = 0;
    while (arc < inn.length && inn[arc]!.hi < y) arc++;
    return arcSignature(V, arcPoints(roots)[arc]!);
  }
  const r = roots[at]!;
  const i = inn.indexOf(r);
  const h = hermitianInertia(V, (r.lo + r.hi) / 2);
  const s0 = h.positive - h.negative;
  const pts = arcPoints(roots);
  const before = arcSignature(V, pts[i]!);
  const after = arcSignature(V, pts[i + 1]!);
  const n0 = h.zero;
  const ok =
    n0 >= 1 && n0 <= r.multiplicity && Math.abs(s0 - before) <= n0 && Math.abs(s0 - after) <= n0 && (((s0 + n0 - before) % 2) + 2) % 2 === 0;
  if (!ok)
    throw new Error(`internal: σ_ω at the root x = ${r.x} could not be resolved (nullity ${n0}, signature ${s0}, sides ${before} and ${after})`);
  return s0;
}
