/**
 * Hyperbolic invariants of one diagram: status, volume, cusp shape and natural slope.
 *
 * - `not hyperbolic` only with a mathematical reason: a split diagram (several pieces, or a
 *   crossing-free component: the complement contains an essential sphere), a diagram with at most
 *   two crossings after removing kinks (unknot, Hopf link), or a braid (given, or from Vogel's
 *   algorithm) recognised as the unknot, a torus link (Seifert fibred), a split link or a composite
 *   knot by isotopies of the closed braid and exact tests (`recognise.ts`).
 * - `hyperbolic` when Newton's method finds a solution of the gluing and completeness equations
 *   with every shape in the upper half-plane (Thurston): then the volume is Σ D(z) over the
 *   tetrahedra (Bloch–Wigner; Milnor 1982) and the cusp geometry is read from the developed cusp.
 * - `unresolved` otherwise, with the reason (no geometric solution found within the budget; this
 *   includes satellites and torus knots not recognised from their diagram).
 * Cusp shape λ/μ: μ right-handed meridian, λ the longitude of linking number 0 oriented along the
 * component, reported with Im > 0; natural slope Re(λ/μ). For links, the first component's cusp.
 */
import type { Diagram } from '../diagram.ts';
import { analysePD, type Crossing } from '../pd.ts';
import { braidClosurePD, type Braid } from '../braid.ts';
import { blochWigner } from './dilog.ts';
import { removeKinks } from './kinks.ts';
import { solveShapes } from './newton.ts';
import { cuspGeometry, type CuspGeometry } from './peripheral.ts';
import { findGeometricSolution, SEARCH_DEFAULTS, type SearchOptions } from './search.ts';
import { recogniseTorusBraid } from './torus.ts';
import { braidSummands, isKnotted, simplifyBraid } from './reduce.ts';
import { pdToBraid } from '../vogel.ts';
import { recogniseClosure } from './recognise.ts';
import { recogniseDiagram } from './diagramsum.ts';
import { combinatorics } from './triangulation.ts';
import { cuspBases } from './cusp.ts';
import { gluingEquations } from './equations.ts';
import { maximalCusp, type MaximalCusp } from './maxcusp.ts';
import { meridianClasp } from './clasp.ts';

export const GEOMETRY_STATUSES = ['hyperbolic', 'not hyperbolic', 'unresolved'] as const;
export type Geometry = (typeof GEOMETRY_STATUSES)[number];

export interface HyperbolicInvariants {
  geometry: Geometry;
  /** Why not hyperbolic / why unresolved; for hyperbolic rows, notes (e.g. cusp not measured). */
  reason?: string;
  volume?: number;
  /** λ/μ of the first component, Im > 0. */
  cuspShape?: [number, number];
  naturalSlope?: number;
  /** Every component's cusp (links). */
  cusps?: CuspGeometry[];
  /** The maximal cusp (knots only): volume, meridian and longitude lengths (`maxcusp.ts`). */
  maximalCusp?: MaximalCusp;
  /** Tetrahedra of the geometric triangulation and the largest equation residual. */
  tetrahedra?: number;
  residual?: number;
}

function volumeOf(re: Float64Array, im: Float64Array): number {
  // Kahan–Babuška summation of the tetrahedra's volumes
  let s = 0;
  let comp = 0;
  for (let t = 0; t < re.length; t++) {
    const x = blochWigner(re[t]!, im[t]!);
    const u = s + x;
    comp += Math.abs(s) >= Math.abs(x) ? s - u + x : x - u + s;
    s = u;
  }
  return s + comp;
}

/** Hyperbolic invariants of a diagram (see the module comment for the statuses). */
export function hyperbolicInvariants(d: Diagram, opts: SearchOptions = SEARCH_DEFAULTS): HyperbolicInvariants {
  if (d.freeLoops > 0 || d.info.nPieces > 1)
    return { geometry: 'not hyperbolic', reason: 'split link: the diagram falls into separate pieces (an essential sphere)' };
  // braid words: free reduction and Markov destabilisation (same closure, fewer crossings);
  // PD and DT codes: the braid from Vogel's algorithm on the diagram without its kinks (a kink is
  // a Seifert circle of its own, which Vogel's moves would have to thread into the braid)
  let small: Braid | undefined;
  const unkinked = d.braid ? undefined : removeKinks(d.info.crossings);
  if (d.braid) small = simplifyBraid(d.braid);
  else if (d.info.nCrossings <= VOGEL_LIMIT) {
    try {
      if (unkinked!.freeLoops === 0 && unkinked!.pd.length > 0) small = simplifyBraid(pdToBraid(unkinked!.pd));
    } catch {
      small = undefined;
    }
  }
  if (small && small.word.length === 0)
    return { geometry: 'not hyperbolic', reason: `the braid reduces to the empty word by free reduction and Markov moves: ${small.strands === 1 ? 'an unknot' : 'an unlink'}` };
  const known = small && recogniseBraid(small, d.info.nComponents);
  if (known) return known;
  // a bounded search of isotopies of the closed braid (conjugation, braid relations, exchange
  // moves, destabilisation) for the unknot, torus links and connected sums (`recognise.ts`)
  const deeper = small && recogniseClosure(small, d.info.nComponents);
  if (deeper && deeper.status === 'not hyperbolic') return { geometry: 'not hyperbolic', reason: deeper.reason };
  if (deeper) small = deeper.braid;
  if (d.braid) return solveOn(braidClosurePD(small!).pd, d, small, opts);
  // PD and DT codes: the closed braid reached above when it has no more crossings than the
  // diagram without kinks (an isotopy: same volume and cusp), the diagram itself if that fails
  if (small && small.word.length > 0) {
    const closure = braidClosurePD(small).pd;
    if (closure.length <= unkinked!.pd.length) {
      // the effort cap is shared: half for the braid, half for the diagram if that fails
      const cap = `maxWork ${opts.maxWork.toExponential(0)} solver operations, half on the closure of the diagram's braid, half on the diagram`;
      const viaBraid = solveOn(closure, d, small, { ...opts, maxWork: opts.maxWork / 2 }, cap);
      if (viaBraid.geometry === 'not hyperbolic' || viaBraid.cuspShape !== undefined) return viaBraid;
      const direct = solveOn(d.info.crossings, d, small, { ...opts, maxWork: opts.maxWork / 2 }, cap);
      if (viaBraid.geometry === 'hyperbolic' && (direct.geometry === 'unresolved' || direct.cuspShape === undefined)) return viaBraid;
      return direct;
    }
  }
  return solveOn(d.info.crossings, d, small, opts);
}

/** The diagram `crossings` (of the knot or link of `d`) solved: kinks and connected sums removed, then Thurston's equations. */
function solveOn(crossings: Crossing[], d: Diagram, small: Braid | undefined, opts: SearchOptions, cap = `maxWork ${opts.maxWork.toExponential(0)} solver operations`): HyperbolicInvariants {
  if (crossings.length === 0) return { geometry: 'not hyperbolic', reason: 'the braid word reduces to the empty word: an unknot or unlink' };
  const k = removeKinks(crossings);
  if (k.freeLoops > 0 && d.info.nComponents > 1) return { geometry: 'not hyperbolic', reason: 'split link: a component is an unknotted loop apart from the rest' };
  if (k.pd.length === 0) return { geometry: 'not hyperbolic', reason: 'unknot (no crossings left after removing kinks)' };
  if (k.pd.length <= 2) return { geometry: 'not hyperbolic', reason: `${k.pd.length} crossings after removing kinks: unknot or Hopf link` };
  // knots: circles meeting the diagram twice (connected sums; unknotted summands dropped)
  let pdUsed = k.pd;
  if (d.info.nComponents === 1 && k.pd.length <= VOGEL_LIMIT) {
    const ds = recogniseDiagram(k.pd, { splits: 16 }, true);
    if (ds.status === 'unknot') return { geometry: 'not hyperbolic', reason: 'unknot: the diagram is a connected sum of unknotted summands (circles meeting it twice), each recognised as the unknot' };
    if (ds.status === 'not hyperbolic') return { geometry: 'not hyperbolic', reason: ds.reason };
    if (ds.dropped > 0) pdUsed = ds.pd;
  }
  const info = analysePD(pdUsed);
  if (info.nPieces > 1) return { geometry: 'not hyperbolic', reason: 'split link: the diagram falls into separate pieces (an essential sphere)' };
  for (let comp = 0; comp < info.nComponents; comp++) {
    let over = false;
    let under = false;
    for (let c = 0; c < info.nCrossings; c++) {
      if (info.component[info.edge[4 * c + 1]!] === comp) over = true;
      if (info.component[info.edge[4 * c]!] === comp) under = true;
    }
    if (!over || !under)
      return { geometry: 'not hyperbolic', reason: `split link: component ${comp + 1} passes ${over ? 'over' : 'under'} everything it meets, so it lifts off the rest` };
  }
  const clasp = meridianClasp(info);
  if (clasp)
    return {
      geometry: 'not hyperbolic',
      reason: `component ${clasp.clasp + 1} is a meridian of component ${clasp.around + 1} (it clasps one edge, so it bounds a disk meeting the link once): a connected sum with the Hopf link`,
    };
  const sol = findGeometricSolution(info, info.nComponents, opts);
  if (!('tri' in sol) && small && small.word.length > 0) {
    // no geometric solution: a deeper closed-braid search (words may grow by a cancelling pair)
    const again = recogniseClosure(small, d.info.nComponents, DEEP_RECOGNITION);
    if (again.status === 'not hyperbolic') return { geometry: 'not hyperbolic', reason: again.reason };
  }
  if (!('tri' in sol))
    return {
      geometry: 'unresolved',
      reason:
        (sol.capped ? `no geometric solution found within the effort cap (${cap})` : 'no geometric solution found') +
        `; possibly not hyperbolic (${sol.triangulations} triangulations, ${sol.solves} solves` +
        (sol.negativeSolutions ? `, ${sol.negativeSolutions} solutions with negatively oriented tetrahedra not carried to a geometric one)` : ')'),
    };
  const volume = volumeOf(sol.re, sol.im);
  const out: HyperbolicInvariants = { geometry: 'hyperbolic', volume, tetrahedra: sol.tri.n, residual: sol.residual };
  // cusp: on the geometric triangulation if the meridians survive, else on the unsimplified one
  const src = sol.cuspSource;
  if (src && Math.abs(volumeOf(src.re, src.im) - volume) > 1e-9 * Math.max(1, volume))
    return { ...out, reason: 'cusp not measured: the solution carried to the geometric one changed its volume' };
  let cg = src ? cuspGeometry(info, src.tri, src.cb, src, src.map) : cuspGeometry(info, sol.tri, sol.cb, sol, sol.fromOctahedral);
  if (typeof cg === 'string') {
    const u = sol.unsimplified;
    const cb = combinatorics(u.tri);
    const sys = gluingEquations(u.tri, cb, cuspBases(u.tri, cb).flat());
    const r = solveShapes(sys, new Float64Array(u.tri.n).fill(0.5), new Float64Array(u.tri.n).fill(Math.sqrt(3) / 2));
    const v2 = volumeOf(r.re, r.im);
    if (r.converged && Math.abs(v2 - volume) < 1e-9 * Math.max(1, volume)) cg = cuspGeometry(info, u.tri, cb, r, u.keptIndex);
    else cg = `the unsimplified triangulation gave volume ${v2} (cusp not measured)`;
  }
  if (typeof cg === 'string') {
    out.reason = `cusp not measured: ${cg}`;
    return out;
  }
  if (cg.some((c) => !(c.mismatch < 1e-8))) {
    out.reason = 'cusp not measured: holonomies are not translations to 1e-8';
    return out;
  }
  out.cusps = cg;
  out.cuspShape = cg[0]!.shape;
  out.naturalSlope = cg[0]!.shape[0];
  if (info.nComponents === 1) {
    const mc = maximalCusp(sol.tri, sol.cb, sol, cg[0]!.shape);
    if (typeof mc === 'string') out.reason = `maximal cusp not measured: ${mc}`;
    else out.maximalCusp = mc;
  }
  return out;
}

/**
 * The closed-braid search run again when the geometric search found nothing (so it costs nothing
 * on hyperbolic rows): 100 times the default budget, and words may grow by one cancelling pair
 * σ_k^ε σ_k^{−ε} before they shrink (some unknots, trefoils and sums of random 20-letter braids
 * need it).
 */
const DEEP_RECOGNITION = { maxStates: 20_000, maxWork: 5_000_000, slack: 2 };

/** PD codes up to this many crossings are turned into braids to look for torus and composite knots. */
const VOGEL_LIMIT = 400;

/**
 * `not hyperbolic` from a braid word with a reason, or undefined: torus links (the word is
 * (σ1…σ_{p−1})^q up to rotation and mirror), composite knots (a middle generator occurs once and
 * both summands are knotted, `reduce.ts`).
 */
function recogniseBraid(b: Braid, components: number): HyperbolicInvariants | undefined {
  const tk = recogniseTorusBraid(b);
  if (tk) return { geometry: 'not hyperbolic', reason: `torus ${components === 1 ? 'knot' : 'link'} T(${tk.p},${tk.q}) (Seifert fibred): the braid reduces to ${tk.p === 2 ? 'σ1' : `(σ1…σ${tk.p - 1})`}^${Math.abs(tk.q)} by free reduction and Markov moves` };
  if (components !== 1) return undefined;
  const parts = braidSummands(b);
  if (parts && isKnotted(simplifyBraid(parts[0])) && isKnotted(simplifyBraid(parts[1])))
    return { geometry: 'not hyperbolic', reason: 'composite knot (satellite): the braid is a connected sum of two knotted closures (Alexander polynomials not units)' };
  return undefined;
}

