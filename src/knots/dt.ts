/**
 * Dowker–Thistlethwaite codes of knots → PD codes (C. H. Dowker & M. B. Thistlethwaite,
 * "Classification of knot projections", Topology Appl. 16 (1983)).
 *
 * Walk along the knot numbering the passes through crossings 1, 2, …, 2n; each crossing is passed
 * once at an odd and once at an even number, and the code lists, for the odd passes 1, 3, …,
 * 2n−1 in order, the even partner. Sign convention here: a positive entry means the strand passes
 * UNDER at its even-numbered visit (so an alternating diagram has all entries positive, with
 * the odd visits over); a negative entry means it passes over there.
 *
 * The code fixes the crossings and over/under data but not the planar embedding. Each crossing
 * admits two local rotations; we search the 2^(n−1) choices (the first crossing's choice is fixed,
 * the other one gives the mirror image) for one whose faces satisfy Euler's formula V − E + F = 2,
 * i.e. whose rotation system is planar (J. Edmonds' rotation-system principle; J. L. Gross &
 * T. W. Tucker, "Topological Graph Theory", §3.2). For a prime (reduced) diagram the planar
 * realisation is unique up to reflection, so the knot is determined up to mirror image: the sign
 * of the signature read from a DT code is that of our chosen realisation. For composite
 * diagrams several realisations exist; the first found (in the order of the search) is used.
 * Restriction: codes of at most MAX_DT_CROSSINGS crossings (the search is exhaustive).
 */
import { SurmiseError } from '../errors.ts';
import type { Crossing } from './pd.ts';

export const MAX_DT_CROSSINGS = 20;

/** Check that `code` is a DT code: even nonzero entries whose absolute values are 2, 4, …, 2n. */
export function validateDT(code: readonly number[]): void {
  const n = code.length;
  if (n === 0) throw new SurmiseError('knots.parse', 'the DT code is empty');
  const seen = new Set<number>();
  code.forEach((a, k) => {
    if (!Number.isInteger(a) || a === 0 || Math.abs(a) % 2 !== 0)
      throw new SurmiseError('knots.parse', `DT entry ${k + 1} is ${a}: entries must be nonzero even integers`);
    if (Math.abs(a) > 2 * n) throw new SurmiseError('knots.parse', `DT entry ${k + 1} is ${a}: with ${n} crossings the entries are ±2..±${2 * n}`);
    if (seen.has(Math.abs(a))) throw new SurmiseError('knots.parse', `DT entry ${k + 1} repeats ${Math.abs(a)}: each even number 2..${2 * n} must appear once`);
    seen.add(Math.abs(a));
  });
}

/** The PD code of a DT code (labels: edge p runs from visit p to visit p+1). */
export function dtToPD(code: readonly number[]): Crossing[] {
  validateDT(code);
  const n = code.length;
  if (n > MAX_DT_CROSSINGS)
    throw new SurmiseError('knots.dtTooLarge', `DT codes are realised by exhaustive search, limited to ${MAX_DT_CROSSINGS} crossings; this one has ${n} (give a PD code or braid word instead)`);
  const N = 2 * n;
  const inEdge = (p: number): number => (p === 1 ? N : p - 1);
  const outEdge = (p: number): number => p;
  const under: number[] = [];
  const over: number[] = [];
  code.forEach((a, k) => {
    const odd = 2 * k + 1;
    const even = Math.abs(a);
    if (a > 0) {
      under.push(even);
      over.push(odd);
    } else {
      under.push(odd);
      over.push(even);
    }
  });
  const make = (bits: number): Crossing[] =>
    code.map((_, k) => {
      const u = under[k]!;
      const v = over[k]!;
      return (bits >> k) & 1
        ? [inEdge(u), inEdge(v), outEdge(u), outEdge(v)]
        : [inEdge(u), outEdge(v), outEdge(u), inEdge(v)];
    });
  // dart bookkeeping for a fast face count
  const other = new Int32Array(4 * n);
  const where = new Int32Array(2 * (N + 1)).fill(-1);
  const total = 1 << (n - 1);
  for (let half = 0; half < total; half++) {
    const bits = half << 1; // crossing 1 keeps choice 0
    const pd = make(bits);
    where.fill(-1);
    for (let c = 0; c < n; c++)
      for (let s = 0; s < 4; s++) {
        const lab = pd[c]![s]!;
        const d = 4 * c + s;
        if (where[2 * lab] === -1) where[2 * lab] = d;
        else {
          const f = where[2 * lab]!;
          other[d] = f;
          other[f] = d;
        }
      }
    if (countFaces(other, n) === n + 2) return pd;
  }
  throw new SurmiseError('knots.nonPlanar', `the DT code [${code.join(' ')}] has no planar realisation (no choice of crossing rotations satisfies V − E + F = 2)`);
}

function countFaces(other: Int32Array, n: number): number {
  const seen = new Uint8Array(4 * n);
  let faces = 0;
  for (let k0 = 0; k0 < 4 * n; k0++) {
    if (seen[k0]) continue;
    let k = k0;
    while (!seen[k]) {
      seen[k] = 1;
      k = other[4 * (k >> 2) + (((k & 3) + 1) & 3)]!;
    }
    faces++;
  }
  return faces;
}
