/**
 * Seeded generators of diagrams for stress tests along families: random braid words, torus-knot
 * braids, full twists on a run of adjacent strands, connected sums and mirror images (of braids
 * and of PD codes), Reidemeister I kinks and relabelled PD codes.
 */
import { SurmiseError } from '../errors.ts';
import { Rng } from '../util/rng.ts';
import type { Braid } from './braid.ts';
import type { Crossing } from './pd.ts';
import { analysePD } from './pd.ts';

/** A random braid word: each letter uniform on ±1..±(strands−1). */
export function randomBraid(rng: Rng, strands: number, length: number): Braid {
  if (!Number.isInteger(strands) || strands < 2) throw new SurmiseError('knots.option', `expected strands to be an integer ≥ 2, got ${strands}`, { option: 'strands' });
  if (!Number.isInteger(length) || length < 1) throw new SurmiseError('knots.option', `expected length to be an integer ≥ 1, got ${length}`, { option: 'length' });
  const word: number[] = [];
  for (let k = 0; k < length; k++) {
    const g = 1 + rng.int(strands - 1);
    word.push(rng.next() < 0.5 ? g : -g);
  }
  return { strands, word };
}

/** The torus-knot braid (σ1 σ2 … σ_{p−1})^q on p strands (q < 0: inverse letters). */
export function torusBraid(p: number, q: number): Braid {
  if (!Number.isInteger(p) || p < 2 || !Number.isInteger(q) || q === 0) throw new SurmiseError('knots.option', `torus braid needs integers p ≥ 2 and q ≠ 0, got ${p}, ${q}`);
  const word: number[] = [];
  for (let r = 0; r < Math.abs(q); r++) for (let i = 1; i < p; i++) word.push(q > 0 ? i : -i);
  return { strands: p, word };
}

/**
 * q full twists on strands i..j (1-based, i < j): the full twist Δ² = (σ_i … σ_{j−1})^{j−i+1};
 * q < 0 gives its inverse.
 */
export function fullTwists(i: number, j: number, q: number): number[] {
  if (!(Number.isInteger(i) && Number.isInteger(j) && i >= 1 && j > i)) throw new SurmiseError('knots.option', `expected on to be a range i..j of strands with 1 ≤ i < j, got ${i}..${j}`, { option: 'on' });
  const one: number[] = [];
  for (let r = 0; r < j - i + 1; r++) for (let g = i; g < j; g++) one.push(g);
  const out: number[] = [];
  if (q >= 0) for (let r = 0; r < q; r++) out.push(...one);
  else for (let r = 0; r < -q; r++) out.push(...one.slice().reverse().map((g) => -g));
  return out;
}

/** The braid followed by q full twists on strands i..j. */
export function twistedBraid(b: Braid, i: number, j: number, q: number): Braid {
  if (j > b.strands) throw new SurmiseError('knots.option', `\`on\` ${i}..${j} exceeds the braid's ${b.strands} strands`, { option: 'on' });
  return { strands: b.strands, word: [...b.word, ...fullTwists(i, j, q)] };
}

/** Mirror image of a braid: every letter inverted in sign. */
export function mirrorBraid(b: Braid): Braid {
  return { strands: b.strands, word: b.word.map((g) => -g) };
}

/**
 * Connected sum of two braid closures: b's last strand joined to c's first, on
 * b.strands + c.strands − 1 strands (for knots this is the connected sum of the knots).
 */
export function braidConnectedSum(b: Braid, c: Braid): Braid {
  const shift = b.strands - 1;
  return { strands: b.strands + c.strands - 1, word: [...b.word, ...c.word.map((g) => Math.sign(g) * (Math.abs(g) + shift))] };
}

/** Mirror image of a PD code: every crossing changed (same projection, over and under swapped). */
export function mirrorPD(pd: readonly Crossing[]): Crossing[] {
  const info = analysePD(pd);
  return pd.map((x, c) => (info.sign[c]! > 0 ? [x[3], x[0], x[1], x[2]] : [x[1], x[2], x[3], x[0]]) as Crossing);
}

function maxLabel(pd: readonly Crossing[]): number {
  let m = 0;
  for (const x of pd) for (const v of x) m = Math.max(m, v);
  return m;
}

/**
 * Connected sum of two PD codes of knots along an edge of each (edge labels `ea` of a, `eb` of
 * b; default the first label of the first crossing). Planar because any face can be taken as the
 * outer one.
 */
export function pdConnectedSum(a: readonly Crossing[], b: readonly Crossing[], ea = a[0]![0], eb = b[0]![0]): Crossing[] {
  const ia = analysePD(a);
  const ib = analysePD(b);
  const off = maxLabel(a);
  const bb = b.map((x) => x.map((v) => v + off) as Crossing);
  const ebs = eb + off;
  const nA = off + maxLabel(b) + 1; // fresh labels
  const nB = nA + 1;
  // in a: the dart where ea leaves gets label nA (continues into b), the dart where ea arrives gets nB
  const out: Crossing[] = a.map((x, c) => x.map((v, s) => (v === ea ? (ia.out[4 * c + s] ? nA : nB) : v)) as Crossing);
  // in b: the dart where eb arrives gets nA, the dart where it leaves gets nB
  for (let c = 0; c < bb.length; c++) out.push(bb[c]!.map((v, s) => (v === ebs ? (ib.out[4 * c + s] ? nB : nA) : v)) as Crossing);
  return out;
}

/**
 * A Reidemeister I kink on the edge labelled `e`, of one of four types (variant 0–3: under- or
 * over-first, left or right loop). Returns a new PD code with two fresh labels.
 */
export function addKink(pd: readonly Crossing[], e: number, variant: number): Crossing[] {
  const info = analysePD(pd);
  const m = maxLabel(pd);
  const ea = m + 1; // first part, kept at the edge's tail
  const l = m + 2; // the loop
  const eb = m + 3; // second part, arriving at the edge's head
  const res: Crossing[] = pd.map((x, c) => x.map((v, s) => (v === e ? (info.out[4 * c + s] ? ea : eb) : v)) as Crossing);
  // new crossing: strand arrives on ea and leaves on eb, passing once over and once under itself
  const k: Crossing[] = [
    [ea, l, l, eb], // under first, loop slot 2 -> slot 1
    [ea, eb, l, l], // under first, loop slot 2 -> slot 3
    [l, l, eb, ea], // over first, loop slot 1 -> slot 0
    [l, ea, eb, l], // over first, loop slot 3 -> slot 0
  ];
  res.push(k[((variant % 4) + 4) % 4]!);
  return res;
}

/** Random relabelling of edges, shuffled crossing order (the 4-tuples keep their reading). */
export function relabelPD(pd: readonly Crossing[], rng: Rng): Crossing[] {
  const labels = [...new Set(pd.flat())];
  const perm = rng.permutation(labels.length);
  const map = new Map<number, number>();
  labels.forEach((v, i) => map.set(v, 100 + perm[i]! * 3));
  const order = rng.permutation(pd.length);
  return Array.from(order, (c) => pd[c]!.map((v) => map.get(v)!) as Crossing);
}

/** A random braid whose closure is a knot: retried (length parity alternating) until the permutation is one cycle. */
export function randomKnotBraid(rng: Rng, strands: number, length: number): Braid {
  for (let attempt = 0; ; attempt++) {
    // the parity of the length matters (2 strands: odd length only), so vary it between attempts
    const b = randomBraid(rng, strands, length + (attempt % 2));
    const perm = Array.from({ length: strands }, (_, i) => i);
    for (const g of b.word) {
      const i = Math.abs(g) - 1;
      [perm[i], perm[i + 1]] = [perm[i + 1]!, perm[i]!];
    }
    let cycle = 0;
    let x = 0;
    do {
      x = perm[x]!;
      cycle++;
    } while (x !== 0);
    if (cycle === strands) return b;
  }
}
