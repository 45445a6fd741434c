/**
 * All invariants of one diagram, exactly.
 *
 * Conventions (see README.md): crossing signs right-handed = +1; writhe = Σ signs; signature
 * σ = sign(V + Vᵀ) so that the right-handed trefoil has σ = −2; Alexander polynomial
 * Conway-normalised, Δ(t) = det(t^{−1/2}V − t^{1/2}Vᵀ) for our V (so that the skein relation
 * Δ(L₊) − Δ(L₋) = (t^{1/2} − t^{−1/2})Δ(L₀) holds: the positive Hopf link has t^{1/2} − t^{−1/2}),
 * hence Δ(t) = Δ(t⁻¹) and Δ(1) = 1 for knots;
 * determinant |Δ(−1)| = |det(V + Vᵀ)|.
 *
 * Braid words use the braid-form Seifert matrix V (signature exactly from V + Vᵀ) and the
 * reduced Burau representation for Δ, whose sign is fixed by Δ(1) = 1 for knots and by
 * Δ(−1) = (−i)^m det(V + Vᵀ) for links (t^{1/2} = i; exact BigInt det(V − tVᵀ) when
 * det(V + Vᵀ) = 0).
 * PD and DT codes use Gordon–Litherland (Goeritz matrix) for σ and the determinant and Fox
 * calculus for Δ. A Seifert matrix for them (needed for the sign of a link's Δ and for
 * Levine–Tristram signatures at ω ≠ −1) comes from the braid that Vogel's algorithm produces, and
 * its signature is checked against Gordon–Litherland (a mismatch is an internal error, exit 1).
 */
import { braidSeifertMatrix, burauAlexander, burauAlexanderExact, type Braid } from './braid.ts';
import type { Diagram } from './diagram.ts';
import { symmetricInertia } from './exact.ts';
import { foxAlexander } from './fox.ts';
import { gordonLitherland } from './goeritz.ts';
import { conwaySign } from './circlesign.ts';
import { levineTristramAt, signatureJumps, type Jump } from './jumps.ts';
import { levineTristram } from './levine.ts';
import { alexanderUnitRoots, type UnitRoot } from './unitroots.ts';
import { linkingMatrix, writhe, type PDInfo } from './pd.ts';
import { pdToBraid } from './vogel.ts';
import { hyperbolicInvariants, type HyperbolicInvariants } from './hyperbolic/index.ts';
import { centre, exactOut, formatLaurent, pencilDeterminant, valueAtMinusOne, valueAtOne, type LaurentPolynomial } from './poly.ts';

/** PD/DT diagrams up to this size get Δ by Fox calculus; larger connected ones through their Vogel braid. */
const FOX_MAX_CROSSINGS = 30;
/** ... when that braid has at most this many strands (the Burau determinant is (strands − 1)²-sized). */
const VOGEL_BURAU_MAX_STRANDS = 12;

/** Braid words up to this length use the float64 Burau product first (fast for short words). */
const FLOAT_BURAU_MAX_LENGTH = 100;

export const INVARIANT_NAMES = [
  'crossings',
  'writhe',
  'components',
  'signature',
  'determinant',
  'alexander',
  'seifert_circles',
  'genus_bound',
  'linking',
  'levine_tristram',
  'unit_roots',
  'jumps',
  'hyperbolic',
] as const;
export type InvariantName = (typeof INVARIANT_NAMES)[number];
export const DEFAULT_INVARIANTS: readonly InvariantName[] = ['crossings', 'writhe', 'components', 'signature', 'determinant', 'alexander'];

export interface KnotInvariants {
  crossings: number;
  writhe: number;
  components: number;
  signature?: number;
  determinant?: number | string;
  alexander?: LaurentPolynomial;
  alexanderText?: string;
  /** False for links read from PD/DT codes: Δ is then known only up to sign. */
  alexanderSignFixed?: boolean;
  seifertCircles?: number;
  /** Seifert's-algorithm bound g ≤ (c − s + 1)/2, knots only. */
  genusBound?: number;
  /** Pairwise linking numbers lk(K_i, K_j), i < j (components numbered from 1). */
  linking?: Array<{ i: number; j: number; lk: number }>;
  /** σ_ω at ω = e^{2πi·omega}; undefined when no Seifert matrix is available. */
  levineTristram?: number;
  omega?: number;
  /** Roots e^{2πix} of Δ, x ∈ (0, 1/2], each once with its multiplicity (certified to 1e-12); undefined when Δ = 0. */
  unitRoots?: Array<{ x: number; multiplicity: number }>;
  /** The roots x ∈ (0, 1/2) where σ_ω actually jumps, with σ(x+) − σ(x−); undefined without a Seifert matrix or when Δ = 0. */
  jumps?: Jump[];
  /** Status, volume, cusp shape and natural slope (`hyperbolic/`). */
  hyperbolic?: HyperbolicInvariants;
}

/** Number of Seifert circles: cycles of the oriented smoothing (plus free loops). */
export function seifertCircles(info: PDInfo, freeLoops = 0): number {
  const n = info.nCrossings;
  // at each crossing the smoothing sends an incoming dart to the outgoing dart of the other strand
  const seen = new Uint8Array(4 * n);
  let circles = 0;
  for (let d0 = 0; d0 < 4 * n; d0++) {
    if (!info.out[d0] || seen[d0]) continue;
    let d = d0;
    while (!seen[d]) {
      seen[d] = 1;
      const inD = info.other[d]!; // incoming dart at the next crossing
      const c = inD >> 2;
      const s = inD & 3;
      // incoming under (slot 0) continues on the over strand's outgoing slot; incoming over continues on slot 2
      d = s === 0 ? (info.out[4 * c + 1] ? 4 * c + 1 : 4 * c + 3) : 4 * c + 2;
    }
    circles++;
  }
  return circles + freeLoops;
}

function bigToOut(b: bigint): number | string {
  return exactOut(b < 0n ? -b : b);
}

/** Conway normalisation of an unnormalised Δ for a knot (Δ(1) = 1). */
function normaliseKnot(p: bigint[]): LaurentPolynomial {
  const c = centre(p);
  const v = valueAtOne(c);
  if (v === 1n) return c;
  if (v === -1n) return centre(p, true);
  throw new Error(`internal: Alexander polynomial of a knot has Δ(1) = ${v}`);
}

function symmetrise(V: number[][]): number[][] {
  return V.map((r, i) => r.map((x, j) => x + V[j]![i]!));
}

/**
 * Seifert matrix of a connected PD/DT diagram through Vogel's algorithm (the braid-form surface of
 * an equivalent closed braid). Guard: its signature must equal the Gordon–Litherland signature.
 */
function vogelSeifert(d: Diagram, res: KnotInvariants, braid: Braid = pdToBraid(d.pd)): number[][] {
  const V = braidSeifertMatrix(braid);
  const sig = symmetricInertia(symmetrise(V));
  const gl = res.signature ?? gordonLitherland(d.info).signature;
  if (sig.positive - sig.negative !== gl) throw new Error(`internal: Seifert signature ${sig.positive - sig.negative} after Vogel moves differs from Gordon–Litherland ${gl}`);
  return V;
}

/**
 * Sign of a link's Alexander polynomial from a Seifert matrix V of size m: Conway's Δ(−1), with
 * t^{1/2} = i, equals (−i)^m det(V + Vᵀ), and sign det(V + Vᵀ) = (−1)^(negative eigenvalues);
 * when det(V + Vᵀ) = 0, Δ = t^{−m/2} det(V − tVᵀ) exactly (BigInt).
 */
function fixLinkSign(alex: LaurentPolynomial, V: number[][], inertia: { negative: number; zero: number }): LaurentPolynomial {
  if (alex.coefficients.length === 0) return alex;
  if (inertia.zero > 0) {
    // det(V + Vᵀ) = 0: the sign from one exact evaluation on the circle (circlesign.ts); the pencil
    // det(V − tVᵀ) only if every tried point is a root
    const s = conwaySign(alex, V);
    if (s === 1) return alex;
    if (s === -1) return { ...alex, coefficients: alex.coefficients.map((x) => -x) };
    return centre(pencilDeterminant(V, V.map((r, i) => r.map((_, j) => -V[j]![i]!))));
  }
  const m = V.length;
  const detSign = inertia.negative % 2 === 0 ? 1 : -1;
  const [re, im] = valueAtMinusOne(alex);
  const r = (((-m) % 4) + 4) % 4; // (−i)^m = i^(−m)
  const target = r === 0 ? detSign : r === 1 ? detSign : -detSign; // i^r·detSign: real part for r = 0, 2; imaginary for 1, 3
  const v = r % 2 === 0 ? re : im;
  const got = v > 0n ? 1 : v < 0n ? -1 : 0;
  return got === target ? alex : { ...alex, coefficients: alex.coefficients.map((x) => -x) };
}

export interface ComputeOptions {
  invariants?: readonly InvariantName[];
  /** x in ω = e^{2πix} for the Levine–Tristram signature (default 0.5). */
  omega?: number;
}

/** Compute the requested invariants of a diagram. */
export function computeInvariants(d: Diagram, opts: ComputeOptions = {}): KnotInvariants {
  const want = new Set<InvariantName>(opts.invariants ?? DEFAULT_INVARIANTS);
  const info = d.info;
  const components = info.nComponents + d.freeLoops;
  const isKnot = components === 1;
  const res: KnotInvariants = { crossings: info.nCrossings, writhe: writhe(info), components };
  const omega = opts.omega ?? 0.5;
  const generic = omega - Math.floor(omega) !== 0.5 && omega - Math.floor(omega) !== 0;
  // the roots of Δ on the circle: for unit_roots, jumps, and σ_ω away from ω = ±1 (read on its arc)
  const needRoots = want.has('unit_roots') || want.has('jumps') || (want.has('levine_tristram') && generic);
  const needAlex = want.has('alexander') || needRoots || (d.braid && want.has('determinant'));
  const needSig = want.has('signature') || want.has('determinant');
  let V: number[][] | undefined;
  if (d.braid) {
    V = braidSeifertMatrix(d.braid);
    const S = V.map((r, i) => r.map((x, j) => x + V![j]![i]!));
    const inertia = needSig || needAlex ? symmetricInertia(S) : undefined;
    if (inertia && want.has('signature')) res.signature = inertia.positive - inertia.negative;
    if (needAlex) {
      // float64 Burau for short words while every coefficient stays below 2^52; packed big integers
      // for long words (their polynomial determinant is where the time goes) and beyond 2^52
      const raw = (d.braid.word.length <= FLOAT_BURAU_MAX_LENGTH ? burauAlexander(d.braid) : undefined) ?? burauAlexanderExact(d.braid);
      let alex: LaurentPolynomial;
      if (isKnot) alex = normaliseKnot(raw);
      else alex = fixLinkSign(centre(raw), V, inertia!);
      res.alexander = alex;
      res.alexanderText = formatLaurent(alex);
      res.alexanderSignFixed = true;
      if (want.has('determinant')) {
        // exactly one of re, im is nonzero (or both zero): |Δ(−1)| in BigInt
        const [re, im] = valueAtMinusOne(alex);
        res.determinant = bigToOut(re !== 0n ? re : im);
      }
    }
  } else {
    if (needSig) {
      const gl = gordonLitherland(info);
      if (want.has('signature')) res.signature = gl.signature;
      if (want.has('determinant')) res.determinant = d.freeLoops > 0 ? 0 : bigToOut(gl.determinant);
    }
    if (needAlex) {
      // Fox calculus up to FOX_MAX_CROSSINGS (its c × c pencil grows like c⁵); beyond, the Burau
      // formula on the Vogel braid when that braid has few strands (connected diagrams)
      const vb = info.nCrossings > FOX_MAX_CROSSINGS && info.nPieces === 1 && d.freeLoops === 0 ? pdToBraid(d.pd) : undefined;
      const raw = vb && vb.strands <= VOGEL_BURAU_MAX_STRANDS ? burauAlexanderExact(vb) : foxAlexander(info, d.freeLoops);
      let alex: LaurentPolynomial;
      let fixed = true;
      if (isKnot) alex = normaliseKnot(raw);
      else if (info.nPieces === 1 && d.freeLoops === 0 && raw.some((x) => x !== 0n)) {
        // the sign needs a Seifert matrix: braid the diagram (Vogel) and use its braid-form surface
        const Vb = vogelSeifert(d, res, vb);
        alex = fixLinkSign(centre(raw), Vb, symmetricInertia(symmetrise(Vb)));
      } else {
        alex = centre(raw);
        fixed = alex.coefficients.length === 0;
        const top = alex.coefficients[alex.coefficients.length - 1];
        if (top !== undefined && top < 0n) alex = { ...alex, coefficients: alex.coefficients.map((x) => -x) };
      }
      res.alexander = alex;
      res.alexanderText = formatLaurent(alex);
      res.alexanderSignFixed = fixed;
    }
  }
  const roots: UnitRoot[] | undefined = needRoots && res.alexander && res.alexander.coefficients.length > 0 ? alexanderUnitRoots(res.alexander) : undefined;
  if (want.has('unit_roots') && roots) res.unitRoots = roots.map(({ x, multiplicity }) => ({ x, multiplicity }));
  if (!want.has('alexander')) {
    delete res.alexander;
    delete res.alexanderText;
    delete res.alexanderSignFixed;
  }
  // a Seifert matrix: the braid's, or for a connected PD/DT diagram that of its Vogel braid
  let seifert: number[][] | undefined = V;
  const seifertFor = (): number[][] | undefined => {
    if (!seifert && info.nPieces === 1 && d.freeLoops === 0) seifert = vogelSeifert(d, res);
    return seifert;
  };
  if (want.has('jumps') && roots) {
    const S = seifertFor();
    if (S) res.jumps = signatureJumps(S, roots);
  }
  if (want.has('seifert_circles') || want.has('genus_bound')) {
    const s = seifertCircles(info, d.freeLoops);
    if (want.has('seifert_circles')) res.seifertCircles = s;
    if (want.has('genus_bound') && isKnot) res.genusBound = (info.nCrossings - s + 1) / 2;
  }
  if (want.has('linking')) {
    const lk = linkingMatrix(info, d.freeLoops);
    res.linking = [];
    for (let i = 0; i < lk.length; i++) for (let j = i + 1; j < lk.length; j++) res.linking.push({ i: i + 1, j: j + 1, lk: lk[i]![j]! });
  }
  if (want.has('levine_tristram')) {
    res.omega = omega;
    if (!generic) res.levineTristram = V ? levineTristram(V, omega) : omega - Math.floor(omega) === 0 ? 0 : gordonLitherland(info).signature;
    else {
      const S = seifertFor();
      // away from ω = ±1: the value of ω's arc between the certified roots of Δ (at a root: the
      // degenerate form's signature, jumps.ts); Δ = 0 has no isolated roots, so the form is read at ω itself
      if (S) res.levineTristram = roots ? levineTristramAt(S, roots, omega) : levineTristram(S, omega);
    }
  }
  if (want.has('hyperbolic')) res.hyperbolic = hyperbolicInvariants(d);
  return res;
}
