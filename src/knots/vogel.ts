/**
 * PD code → braid word by Vogel's algorithm (P. Vogel, "Representation of links by braids: a new
 * algorithm", Comment. Math. Helv. 65 (1990); see also S. Yamada, Invent. Math. 89 (1987)).
 *
 * Seifert circles come from the oriented smoothing. A face is *defect* when two of its boundary
 * edges lie on different Seifert circles and both have the face on the same side (so those
 * circles are not nested coherently). A Vogel move pushes one of the edges over the other across
 * the face (a Reidemeister II move: two new crossings, the number of Seifert circles unchanged).
 * With no defect face left the circles are concentric and coherently oriented: the diagram is a
 * closed braid whose strands are the circles, numbered along the Seifert graph (a path), and whose
 * letters are the crossings read in the angular order from a cut that crosses each circle once.
 * Reversing the numbering or the reading direction gives a braid with the same closure up to
 * isotopy and orientation reversal of every component, which leaves σ, Δ and σ_ω unchanged.
 * Connected diagrams only.
 */
import type { Braid } from './braid.ts';
import { analysePD, type Crossing, type PDInfo } from './pd.ts';

/** Seifert circle of every edge, and their number. */
function circlesOf(info: PDInfo): { circ: Int32Array; n: number } {
  const circ = new Int32Array(info.nEdges).fill(-1);
  let n = 0;
  for (let d0 = 0; d0 < 4 * info.nCrossings; d0++) {
    if (!info.out[d0] || circ[info.edge[d0]!] !== -1) continue;
    let d = d0;
    while (circ[info.edge[d]!] === -1) {
      circ[info.edge[d]!] = n;
      d = nextOnCircle(info, d);
    }
    n++;
  }
  return { circ, n };
}

/** From an outgoing dart, the outgoing dart of the next edge along the Seifert circle. */
function nextOnCircle(info: PDInfo, d: number): number {
  const inD = info.other[d]!;
  const c = inD >> 2;
  const s = inD & 3;
  return s === 0 ? (info.out[4 * c + 1] ? 4 * c + 1 : 4 * c + 3) : 4 * c + 2;
}

function maxLabel(pd: readonly Crossing[]): number {
  let m = 0;
  for (const x of pd) for (const v of x) m = Math.max(m, v);
  return m;
}

/** One Vogel move, or undefined when the diagram has no defect face. */
function vogelMove(pd: Crossing[], info: PDInfo): Crossing[] | undefined {
  const { circ } = circlesOf(info);
  const n = info.nCrossings;
  // steps of each face: corner (y, t) is followed along the edge in slot t + 1, face on the right of the walk
  const byFace = new Map<number, Array<{ dart: number; side: 'L' | 'R' }>>();
  for (let k = 0; k < 4 * n; k++) {
    const y = k >> 2;
    const t = k & 3;
    const dart = 4 * y + ((t + 1) & 3);
    const side = info.out[dart] ? 'R' : 'L';
    const f = info.face[k]!;
    if (!byFace.has(f)) byFace.set(f, []);
    byFace.get(f)!.push({ dart, side });
  }
  for (const steps of byFace.values()) {
    for (let a = 0; a < steps.length; a++)
      for (let b = a + 1; b < steps.length; b++) {
        const sa = steps[a]!;
        const sb = steps[b]!;
        if (sa.side !== sb.side) continue;
        const ea = info.edge[sa.dart]!;
        const eb = info.edge[sb.dart]!;
        if (ea === eb || circ[ea] === circ[eb]) continue;
        return applyMove(pd, info, sa.dart, sb.dart, sa.side);
      }
  }
  return undefined;
}

/** Push the edge at dart d1 over the edge at dart d2 across their common face (side: where the face lies). */
function applyMove(pd: Crossing[], info: PDInfo, d1: number, d2: number, side: 'L' | 'R'): Crossing[] {
  const m = maxLabel(pd);
  const [e1a, e1b, e1c, e2a, e2b, e2c] = [m + 1, m + 2, m + 3, m + 4, m + 5, m + 6];
  const E1 = info.edge[d1]!;
  const E2 = info.edge[d2]!;
  const res: Crossing[] = pd.map((x, c) =>
    x.map((v, s) => {
      const d = 4 * c + s;
      const e = info.edge[d]!;
      if (e === E1) return info.out[d] ? e1a : e1c;
      if (e === E2) return info.out[d] ? e2a : e2c;
      return v;
    }) as Crossing,
  );
  if (side === 'L') {
    res.push([e2b, e1b, e2c, e1a], [e2a, e1b, e2b, e1c]);
  } else {
    res.push([e2b, e1a, e2c, e1b], [e2a, e1c, e2b, e1b]);
  }
  return res;
}

/**
 * A braid whose closure is the link of the connected PD code (up to reversing every component's
 * orientation); throws for split diagrams.
 */
export function pdToBraid(pd0: readonly Crossing[]): Braid {
  let pd: Crossing[] = pd0.map((x) => [...x] as Crossing);
  let info = analysePD(pd);
  if (info.nPieces !== 1) throw new Error('pdToBraid: the diagram is split');
  const limit = 4 * info.nCrossings * info.nCrossings + 100;
  for (let it = 0; ; it++) {
    if (it > limit) throw new Error('pdToBraid: Vogel moves did not terminate');
    const next = vogelMove(pd, info);
    if (!next) break;
    pd = next;
    info = analysePD(pd);
  }
  const { circ, n: s } = circlesOf(info);
  const nC = info.nCrossings;
  // Seifert graph: each crossing joins the circle of its under-in edge and that of its under-out edge
  const ends: Array<[number, number]> = [];
  const nbr: Array<Set<number>> = Array.from({ length: s }, () => new Set());
  for (let c = 0; c < nC; c++) {
    const a = circ[info.edge[4 * c]!]!;
    const b = circ[info.edge[4 * c + 2]!]!;
    ends.push([a, b]);
    nbr[a]!.add(b);
    nbr[b]!.add(a);
  }
  if (s === 1) throw new Error('pdToBraid: a single Seifert circle with crossings');
  const start = nbr.findIndex((x) => x.size === 1);
  if (start < 0 || nbr.some((x) => x.size > 2)) throw new Error('pdToBraid: Seifert graph is not a path after Vogel moves');
  const pos = new Int32Array(s).fill(-1);
  const order: number[] = [];
  for (let cur = start, prev = -1; cur !== -1; ) {
    pos[cur] = order.length;
    order.push(cur);
    const nx = [...nbr[cur]!].find((x) => x !== prev && pos[x] === -1);
    prev = cur;
    cur = nx === undefined ? -1 : nx;
  }
  if (order.length !== s) throw new Error('pdToBraid: Seifert graph is not a connected path');
  // faces on both sides of each edge: right of the tail dart's walk, right of the head dart's walk
  const tail = new Int32Array(info.nEdges);
  const head = new Int32Array(info.nEdges);
  for (let d = 0; d < 4 * nC; d++) (info.out[d] ? tail : head)[info.edge[d]!] = d;
  const faceRight = (e: number): number => info.face[4 * (tail[e]! >> 2) + (((tail[e]! & 3) + 3) & 3)]!;
  const faceLeft = (e: number): number => info.face[4 * (head[e]! >> 2) + (((head[e]! & 3) + 3) & 3)]!;
  const circlesOnFace = new Map<number, Set<number>>();
  for (let e = 0; e < info.nEdges; e++)
    for (const f of [faceRight(e), faceLeft(e)]) {
      if (!circlesOnFace.has(f)) circlesOnFace.set(f, new Set());
      circlesOnFace.get(f)!.add(circ[e]!);
    }
  // the cut: an edge on each circle, consecutive ones sharing a face
  const cutEdge = new Int32Array(s).fill(-1);
  let F = -1;
  for (let k = 0; k < s; k++) {
    const cK = order[k]!;
    let chosen = -1;
    for (let e = 0; e < info.nEdges && chosen < 0; e++) {
      if (circ[e] !== cK) continue;
      const fr = faceRight(e);
      const fl = faceLeft(e);
      if (k === 0) {
        const next = order[1]!;
        if (circlesOnFace.get(fr)!.has(next)) { chosen = e; F = fr; }
        else if (circlesOnFace.get(fl)!.has(next)) { chosen = e; F = fl; }
      } else if (fr === F || fl === F) {
        chosen = e;
        F = fr === F ? fl : fr;
      }
    }
    if (chosen < 0) throw new Error('pdToBraid: no cut through the braided diagram');
    cutEdge[k] = chosen;
  }
  // crossings along each circle from its cut, then a merge consistent with every circle's order
  const succ: number[][] = Array.from({ length: nC }, () => []);
  const indeg = new Int32Array(nC);
  for (let k = 0; k < s; k++) {
    const e0 = cutEdge[k]!;
    let d = tail[e0]!;
    let prevC = -1;
    do {
      const c = info.other[d]! >> 2;
      if (prevC >= 0) {
        succ[prevC]!.push(c);
        indeg[c]!++;
      }
      prevC = c;
      d = nextOnCircle(info, d);
    } while (info.edge[d] !== e0);
  }
  const queue: number[] = [];
  for (let c = 0; c < nC; c++) if (indeg[c] === 0) queue.push(c);
  const word: number[] = [];
  while (queue.length) {
    queue.sort((a, b) => a - b);
    const c = queue.shift()!;
    const [a, b] = ends[c]!;
    const g = Math.min(pos[a]!, pos[b]!) + 1;
    if (Math.abs(pos[a]! - pos[b]!) !== 1) throw new Error('pdToBraid: crossing between non-adjacent strands');
    word.push(info.sign[c]! * g);
    for (const x of succ[c]!) if (--indeg[x]! === 0) queue.push(x);
  }
  if (word.length !== nC) throw new Error('pdToBraid: inconsistent angular order');
  return { strands: s, word };
}
