/**
 * Connected sums seen in a knot diagram. When two faces F ≠ G of the diagram both border two edges
 * e1 ≠ e2, a circle drawn through F and G crosses the knot exactly at e1 and e2 and cuts the
 * diagram into two tangles; closing each (joining its ends at e1 and e2) gives diagrams of K1 and
 * K2 with K = K1 # K2 (Rolfsen, "Knots and Links", §2.G; Lickorish, "An Introduction to Knot
 * Theory", ch. 1 — from memory). The split is checked combinatorially: cutting the knot at e1 and
 * e2 leaves two arcs, and no crossing may involve both.
 * Each summand is recognised in turn (≤ 2 crossings after removing kinks: unknot; else its Vogel
 * braid through `recognise.ts`): an unknotted summand is dropped (K # unknot = K, and the other
 * summand's diagram is smaller), two knotted ones (Alexander polynomial ≠ ±t^k, or a recognised
 * torus or composite knot) make K composite, hence not hyperbolic (an essential annulus; Thurston 1982).
 */
import { analysePD, type Crossing } from '../pd.ts';
import { pdToBraid } from '../vogel.ts';
import { removeKinks } from './kinks.ts';
import { recogniseClosure } from './recognise.ts';
import { isKnotted, simplifyBraid } from './reduce.ts';

/** Candidate pairs of edges tried per diagram (each costs one walk along the knot). */
const MAX_CUTS = 200;

/** The two summand diagrams of the first splitting circle found, or undefined. Knots, one piece. */
export function diagramSummands(pd: readonly Crossing[]): [Crossing[], Crossing[]] | undefined {
  if (pd.length < 2) return undefined;
  const info = analysePD(pd);
  if (info.nComponents !== 1 || info.nPieces !== 1) return undefined;
  // the two faces beside each edge: for a dart 4c + s, the corners 4c + s and 4c + s − 1
  const pairs = new Map<number, number[]>();
  const dartOf = new Int32Array(info.nEdges).fill(-1);
  for (let d = 0; d < 4 * info.nCrossings; d++) {
    if (!info.out[d]) continue;
    const e = info.edge[d]!;
    dartOf[e] = d;
    const c = d >> 2;
    const f1 = info.face[d]!;
    const f2 = info.face[4 * c + ((d + 3) & 3)]!;
    if (f1 === f2) continue;
    const key = Math.min(f1, f2) * info.nFaces + Math.max(f1, f2);
    const list = pairs.get(key);
    if (list) list.push(e);
    else pairs.set(key, [e]);
  }
  let tries = 0;
  for (const edges of pairs.values()) {
    for (let a = 0; a < edges.length; a++)
      for (let b = a + 1; b < edges.length; b++) {
        if (++tries > MAX_CUTS) return undefined;
        const split = cutAt(pd, info, dartOf[edges[a]!]!, dartOf[edges[b]!]!);
        if (split) return split;
      }
  }
  return undefined;
}

/** Cut the knot at the edges leaving darts d1 and d2; the two closed-up arcs, if no crossing has a strand of each. */
function cutAt(pd: readonly Crossing[], info: ReturnType<typeof analysePD>, d1: number, d2: number): [Crossing[], Crossing[]] | undefined {
  const side = new Int8Array(info.nCrossings).fill(-1);
  // walk from d1 (outgoing) along the knot; arc 0 until the edge of d2 is left, then arc 1 back to d1
  let arc = 0;
  let d = d1;
  for (let steps = 0; steps <= 2 * info.nCrossings; steps++) {
    const inD = info.other[d]!; // arriving dart at the next crossing
    const c = inD >> 2;
    if (side[c] === -1) side[c] = arc;
    else if (side[c] !== arc) return undefined;
    d = 4 * c + ((inD + 2) & 3); // straight through the crossing
    if (d === d2) arc = 1;
    if (d === d1) break;
  }
  if (d !== d1 || arc !== 1) return undefined;
  const l1 = pd[d1 >> 2]![d1 & 3]!;
  const l2 = pd[d2 >> 2]![d2 & 3]!;
  const part = (s: number): Crossing[] => pd.filter((_, c) => side[c] === s).map((x) => x.map((v) => (v === l2 ? l1 : v)) as Crossing);
  const A = part(0);
  const B = part(1);
  return A.length && B.length ? [A, B] : undefined;
}

export type DiagramRecognition =
  | { status: 'unknot' }
  | { status: 'not hyperbolic'; reason: string; knotted: true }
  /** Not decided: the diagram to go on with (a summand dropped when it was an unknot). */
  | { status: 'unknown'; pd: Crossing[]; knotted: boolean; dropped: number };

/**
 * Recognise a knot diagram through its splitting circles (see the module comment); `budget` bounds
 * the splits tried; `braidDone` skips the braid recognition of the whole diagram (already done by
 * the caller).
 */
export function recogniseDiagram(pd0: readonly Crossing[], budget = { splits: 16 }, braidDone = false): DiagramRecognition {
  const pd = removeKinks(pd0).pd;
  if (pd.length <= 2) return { status: 'unknot' };
  let knotted = false;
  if (!braidDone) {
    const r = recogniseVogel(pd);
    if (r === 'unknot') return { status: 'unknot' };
    if (typeof r === 'string') return { status: 'not hyperbolic', reason: r, knotted: true };
    knotted = r.knotted;
  }
  if (budget.splits <= 0) return { status: 'unknown', pd, knotted, dropped: 0 };
  let parts: [Crossing[], Crossing[]] | undefined;
  try {
    parts = diagramSummands(pd);
  } catch {
    parts = undefined; // a summand code that does not validate is not used (nothing is claimed)
  }
  if (!parts) return { status: 'unknown', pd, knotted, dropped: 0 };
  budget.splits--;
  const [A, B] = parts.map((p) => recogniseDiagram(p, budget)) as [DiagramRecognition, DiagramRecognition];
  if (A.status === 'unknot' && B.status === 'unknot') return { status: 'unknot' };
  if (A.status === 'unknot' || B.status === 'unknot') {
    const other = A.status === 'unknot' ? B : A;
    return other.status === 'unknown' ? { ...other, dropped: other.dropped + 1 } : other;
  }
  const isKnot = (r: DiagramRecognition): boolean => r.status !== 'unknot' && r.knotted;
  if (isKnot(A) && isKnot(B))
    return { status: 'not hyperbolic', reason: 'composite knot (satellite): a circle meeting the diagram in two points splits it into two knotted summands (Alexander polynomials not units, or recognised torus or composite knots)', knotted: true };
  return { status: 'unknown', pd, knotted, dropped: 0 };
}

/** The diagram's Vogel braid recognised (`recognise.ts`): 'unknot', a reason (torus or composite), or whether Δ shows it knotted. */
function recogniseVogel(pd: readonly Crossing[]): 'unknot' | string | { knotted: boolean } {
  let b;
  try {
    b = simplifyBraid(pdToBraid(pd));
  } catch {
    return { knotted: false }; // no braid (Vogel's algorithm needs a connected diagram)
  }
  if (b.word.length === 0) return 'unknot';
  const r = recogniseClosure(b, 1);
  if (r.status === 'not hyperbolic') {
    if (r.reason.startsWith('unknot')) return 'unknot';
    if (r.reason.startsWith('torus') || r.reason.startsWith('composite')) return r.reason;
  }
  return { knotted: isKnotted(b) };
}
