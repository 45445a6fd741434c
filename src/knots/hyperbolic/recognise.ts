/**
 * Non-hyperbolic closures recognised from a braid, each with a proof: the unknot (the closed braid
 * reaches one strand by the isotopies of `closedbraid.ts`, or is conjugate to (σ1…σ_{n−1})^{±1}),
 * torus links T(n, q) (the braid is conjugate to (σ1…σ_{n−1})^q, decided exactly in
 * `periodic.ts`; Seifert fibred), split links (a generator never occurs: an essential sphere) and
 * composite knots (a braid connected sum A·B, A in σ_1..σ_{i−1} and B in σ_i..σ_{n−1}, such as a middle generator occurring once,
 * `reduce.ts`; when both summands are knotted there is an essential annulus, Thurston 1982).
 * A summand recognised as the unknot is dropped (K # unknot = K) and the search goes on with the
 * other. Knottedness of a summand: Alexander polynomial other than ±t^k, or a torus knot T(p, q)
 * with |q| ≥ 2 (nontrivial: its Alexander polynomial has degree (p − 1)(q − 1)). Anything else is
 * left to the geometric search, with the simplest braid reached (same closure).
 */
import type { Braid } from '../braid.ts';
import { simplifyClosedBraid, CLOSED_BRAID_DEFAULTS, type ClosedBraidOptions } from './closedbraid.ts';
import { recognisePeriodicBraid } from './periodic.ts';
import { isKnotted } from './reduce.ts';

export type Recognition =
  | { status: 'not hyperbolic'; reason: string }
  /** Not recognised: the simplest braid reached, for the geometric search. */
  | { status: 'unknown'; braid: Braid };

const UNKNOT_MOVES = 'braid relations, conjugation, cancelling pairs, exchange moves (Birman–Menasco) and Markov destabilisation';
const delta = (p: number): string => (p === 2 ? 'σ1' : `(σ1…σ${p - 1})`);

/** What the braid's closure is, when it can be proved not hyperbolic (see the module comment). */
export function recogniseClosure(b: Braid, components: number, opts: ClosedBraidOptions = CLOSED_BRAID_DEFAULTS): Recognition {
  const kind = components === 1 ? 'knot' : 'link';
  const torus = (x: Braid, how: string): Recognition | undefined => {
    const t = recognisePeriodicBraid(x);
    if (!t) return undefined;
    const root = `β^${t.p} = Δ^${2 * t.q}, and roots are unique up to conjugacy`;
    if (Math.abs(t.q) === 1) return { status: 'not hyperbolic', reason: `unknot: the braid β${how} is conjugate to ${delta(t.p)}^${t.q} (${root})` };
    return { status: 'not hyperbolic', reason: `torus ${kind} T(${t.p},${t.q}) (Seifert fibred): the braid β${how} is conjugate to ${delta(t.p)}^${t.q} (${root})` };
  };
  const given = torus(b, '');
  if (given) return given;
  let cur = b;
  let dropped = 0;
  for (let guard = 0; guard <= b.strands; guard++) {
    const out = simplifyClosedBraid(cur, opts);
    const via = dropped ? ` after dropping ${dropped} unknotted connected summand${dropped > 1 ? 's' : ''}` : '';
    if (out.kind === 'split')
      return { status: 'not hyperbolic', reason: `split link: ${UNKNOT_MOVES} give a braid in which σ${missing(out.braid)} never occurs${via}` };
    if (out.kind === 'braid') {
      if (out.braid.strands === 1) return { status: 'not hyperbolic', reason: `unknot: ${UNKNOT_MOVES} reduce the closed braid to one strand${via}` };
      const t = out.braid.word.join() !== b.word.join() || out.braid.strands !== b.strands ? torus(out.braid, ` reached by ${UNKNOT_MOVES}${via}`) : undefined;
      return t ?? { status: 'unknown', braid: out.braid };
    }
    // a connected sum: drop an unknotted summand, or prove both knotted
    if (components !== 1) return { status: 'unknown', braid: smaller(out.braid, cur) };
    const [A, B] = out.summands;
    const ra = recogniseClosure(A, 1, opts);
    const rb = recogniseClosure(B, 1, opts);
    const unknot = (r: Recognition): boolean => r.status === 'not hyperbolic' && r.reason.startsWith('unknot');
    if (unknot(ra) || unknot(rb)) {
      cur = unknot(ra) ? B : A;
      dropped++;
      if (unknot(ra) && unknot(rb)) return { status: 'not hyperbolic', reason: `unknot: a connected sum of two unknots (${UNKNOT_MOVES})${via}` };
      continue;
    }
    const knotted = (x: Braid, r: Recognition): boolean => isKnotted(x) || (r.status === 'not hyperbolic' && (r.reason.startsWith('torus') || r.reason.startsWith('composite')));
    if (knotted(A, ra) && knotted(B, rb))
      return { status: 'not hyperbolic', reason: `composite knot (satellite): ${UNKNOT_MOVES} give a connected sum of two knotted closures (split between σ${out.at - 1} and σ${out.at})${via}` };
    return { status: 'unknown', braid: smaller(out.braid, cur) };
  }
  return { status: 'unknown', braid: cur };
}

/** The braid with fewer strands, then fewer letters (a search with slack may end on a longer word). */
function smaller(a: Braid, b: Braid): Braid {
  return a.strands < b.strands || (a.strands === b.strands && a.word.length <= b.word.length) ? a : b;
}

function missing(b: Braid): number {
  for (let i = 1; i < b.strands; i++) if (!b.word.some((g) => Math.abs(g) === i)) return i;
  return 0;
}
