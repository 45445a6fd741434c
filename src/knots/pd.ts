/**
 * Planar diagram (PD) codes: validation, orientation, crossing signs, components and faces.
 *
 * A PD code lists crossings X[a, b, c, d]: the four edge labels read counter-clockwise starting
 * from the incoming under-edge, so the under-strand runs a → c. A crossing is positive
 * (right-handed) when the over-strand runs d → b, negative when it runs b → d; the writhe is the
 * sum of the signs. Over-strand directions are read off by following each component through its
 * under-crossings; a component that never passes under (it can be lifted off: the link is split)
 * is oriented along increasing labels.
 */
import { SurmiseError, type ErrorCode } from '../errors.ts';

export type Crossing = [number, number, number, number];

/** A validated PD code with its combinatorics; darts are 4·crossing + slot. */
export interface PDInfo {
  /** The crossings as given. */
  crossings: Crossing[];
  nCrossings: number;
  /** Compact edge id of each dart (4n). */
  edge: Int32Array;
  nEdges: number;
  /** The other dart of the same edge. */
  other: Int32Array;
  /** 1 when the strand leaves the crossing through this dart. */
  out: Uint8Array;
  /** +1 / −1 per crossing. */
  sign: Int8Array;
  /** Link component of each edge (0-based). */
  component: Int32Array;
  nComponents: number;
  /** Connected pieces of the diagram (as a 4-valent graph), per crossing. */
  piece: Int32Array;
  nPieces: number;
  /** Face of each corner (corner 4y + t lies between slots t and t+1). */
  face: Int32Array;
  nFaces: number;
}

function fail(code: ErrorCode, msg: string): never {
  throw new SurmiseError(code, msg);
}

/**
 * Validate a PD code and compute its combinatorics. Throws `knots.badEdge` when a label is not
 * used exactly twice (or a crossing is not four integers) and `knots.nonPlanar` when some
 * connected piece of the diagram fails Euler's formula V − E + F = 2 on the sphere.
 */
export function analysePD(crossings: readonly (readonly number[])[]): PDInfo {
  const n = crossings.length;
  const labelId = new Map<number, number>();
  const edge = new Int32Array(4 * n);
  const first = new Map<number, number>();
  const other = new Int32Array(4 * n).fill(-1);
  const count = new Map<number, number>();
  crossings.forEach((x, ci) => {
    if (x.length !== 4 || x.some((v) => !Number.isInteger(v)))
      fail('knots.badEdge', `crossing ${ci + 1} (${fmt(x)}) must have four integer edge labels`);
    for (const v of x) count.set(v, (count.get(v) ?? 0) + 1);
  });
  for (const [label, k] of count)
    if (k !== 2) {
      const where = crossings.map((x, ci) => (x.includes(label) ? ci + 1 : 0)).filter((v) => v > 0);
      fail(
        'knots.badEdge',
        `edge label ${label} is used ${k} time${k === 1 ? '' : 's'} (in crossing${where.length === 1 ? '' : 's'} ${where.join(', ')}: ${where.map((w) => fmt(crossings[w - 1]!)).join(' ')}); every edge must join exactly two crossing slots`,
      );
    }
  crossings.forEach((x, ci) => {
    for (let s = 0; s < 4; s++) {
      const d = 4 * ci + s;
      const lab = x[s]!;
      if (!labelId.has(lab)) labelId.set(lab, labelId.size);
      edge[d] = labelId.get(lab)!;
      const f = first.get(lab);
      if (f === undefined) first.set(lab, d);
      else {
        other[d] = f;
        other[f] = d;
      }
    }
  });
  const nEdges = labelId.size;

  // Orientation: follow each component from an under-incoming slot.
  const out = new Uint8Array(4 * n);
  const oriented = new Uint8Array(4 * n);
  const component = new Int32Array(nEdges).fill(-1);
  let nComponents = 0;
  const walk = (start: number): void => {
    // start is an incoming dart
    let d = start;
    for (;;) {
      const c = d >> 2;
      const s = d & 3;
      const o = 4 * c + ((s + 2) & 3);
      oriented[d] = 1;
      out[d] = 0;
      oriented[o] = 1;
      out[o] = 1;
      component[edge[o]!] = nComponents;
      component[edge[d]!] = nComponents;
      d = other[o]!;
      if (d === start) break;
      if (oriented[d]) fail('knots.badEdge', `the strands of the PD code do not close up consistently near crossing ${(d >> 2) + 1} (${fmt(crossings[d >> 2]!)})`);
    }
    nComponents++;
  };
  for (let c = 0; c < n; c++) if (!oriented[4 * c]) walk(4 * c);
  for (let c = 0; c < n; c++) {
    if (oriented[4 * c + 1]) continue;
    // over-only component: orient along increasing labels (l -> j when j = l + 1)
    const x = crossings[c]!;
    const j = x[1]!;
    const l = x[3]!;
    const forward = j === l + 1 || (l - j > 1 && j !== l - 1);
    walk(forward ? 4 * c + 3 : 4 * c + 1);
  }
  const sign = new Int8Array(n);
  for (let c = 0; c < n; c++) {
    if (out[4 * c] !== 0 || out[4 * c + 2] !== 1) fail('knots.badEdge', `crossing ${c + 1} (${fmt(crossings[c]!)}): the under-strand does not run from the first label to the third`);
    sign[c] = out[4 * c + 1] ? 1 : -1;
  }

  // Connected pieces (crossings linked by edges).
  const piece = new Int32Array(n).fill(-1);
  let nPieces = 0;
  for (let c0 = 0; c0 < n; c0++) {
    if (piece[c0] !== -1) continue;
    const stack = [c0];
    piece[c0] = nPieces;
    while (stack.length) {
      const c = stack.pop()!;
      for (let s = 0; s < 4; s++) {
        const c2 = other[4 * c + s]! >> 2;
        if (piece[c2] === -1) {
          piece[c2] = nPieces;
          stack.push(c2);
        }
      }
    }
    nPieces++;
  }

  // Faces: corner (y, t) continues to the corner at the far end of the edge in slot t + 1.
  const face = new Int32Array(4 * n).fill(-1);
  let nFaces = 0;
  const facesPerPiece = new Int32Array(nPieces);
  for (let k0 = 0; k0 < 4 * n; k0++) {
    if (face[k0] !== -1) continue;
    let k = k0;
    while (face[k] === -1) {
      face[k] = nFaces;
      const y = k >> 2;
      const t = k & 3;
      k = other[4 * y + ((t + 1) & 3)]!;
    }
    facesPerPiece[piece[k0 >> 2]!]!++;
    nFaces++;
  }
  const vPer = new Int32Array(nPieces);
  for (let c = 0; c < n; c++) vPer[piece[c]!]!++;
  for (let p = 0; p < nPieces; p++) {
    const V = vPer[p]!;
    const E = 2 * V;
    const F = facesPerPiece[p]!;
    if (V - E + F !== 2) {
      const first = Array.from(piece).indexOf(p);
      fail(
        'knots.nonPlanar',
        `the PD code is not planar: the diagram piece containing crossing ${first + 1} (${fmt(crossings[first]!)}) has V − E + F = ${V} − ${E} + ${F} = ${V - E + F}, not 2 (check the counter-clockwise order of the labels)`,
      );
    }
  }
  return {
    crossings: crossings.map((x) => [x[0]!, x[1]!, x[2]!, x[3]!]),
    nCrossings: n,
    edge,
    nEdges,
    other,
    out,
    sign,
    component,
    nComponents,
    piece,
    nPieces,
    face,
    nFaces,
  };
}

function fmt(x: readonly number[]): string {
  return `X[${x.join(',')}]`;
}

/** Writhe: the sum of crossing signs (right-handed crossings count +1). */
export function writhe(info: PDInfo): number {
  let w = 0;
  for (let c = 0; c < info.nCrossings; c++) w += info.sign[c]!;
  return w;
}

/**
 * Pairwise linking numbers lk(K_i, K_j) = ½ Σ signs of the crossings between K_i and K_j
 * (Rolfsen, "Knots and Links", §5.D). Returned as a symmetric matrix with zero diagonal.
 */
export function linkingMatrix(info: PDInfo, extraComponents = 0): number[][] {
  const m = info.nComponents + extraComponents;
  const lk = Array.from({ length: m }, () => new Array<number>(m).fill(0));
  for (let c = 0; c < info.nCrossings; c++) {
    const a = info.component[info.edge[4 * c]!]!;
    const b = info.component[info.edge[4 * c + 1]!]!;
    if (a !== b) {
      lk[a]![b]! += info.sign[c]! / 2;
      lk[b]![a]! += info.sign[c]! / 2;
    }
  }
  return lk;
}

/**
 * Relabel a PD code with edges 1..2n numbered consecutively along each oriented component, so
 * that the usual reading "positive iff b = d + 1" holds (up to wrap-around at a component's end).
 */
export function canonicalLabels(info: PDInfo): Crossing[] {
  const n = info.nCrossings;
  const newLabel = new Int32Array(info.nEdges).fill(0);
  let next = 1;
  const seen = new Uint8Array(info.nEdges);
  for (let comp = 0; comp < info.nComponents; comp++) {
    // find an outgoing dart on this component, preferring an under-strand exit
    let start = -1;
    for (let d = 0; d < 4 * n && start < 0; d++) if (info.out[d] && info.component[info.edge[d]!] === comp && (d & 3) === 2) start = d;
    for (let d = 0; d < 4 * n && start < 0; d++) if (info.out[d] && info.component[info.edge[d]!] === comp) start = d;
    let d = start;
    while (!seen[info.edge[d]!]) {
      seen[info.edge[d]!] = 1;
      newLabel[info.edge[d]!] = next++;
      const inD = info.other[d]!;
      d = 4 * (inD >> 2) + (((inD & 3) + 2) & 3);
    }
  }
  const res: Crossing[] = [];
  for (let c = 0; c < n; c++) res.push([0, 1, 2, 3].map((s) => newLabel[info.edge[4 * c + s]!]!) as Crossing);
  return res;
}
